import type { DayFitAnswer } from '@shared/api/day-fit';

import { fitPreview } from './fit-preview';
import { rosterPlan } from './testing/example-roster';

// Invented roster day (testing/example-roster.ts): MR 1's turnover before ACC-2 waits for Aide 1,
// who is in MR 2 until 10:12, and is short by 6 min. A proposal that starts MR 2's 09:00 exam
// 12 min earlier touches only MR 2, yet frees the aide in time for MR 1.
const FROM = '2027-03-15T09:00:00-05:00';
const TO = '2027-03-15T08:48:00-05:00';
const PROPOSAL: DayFitAnswer = {
  date: '2027-03-15',
  changes: [{ type: 'move', examId: 20, accession: 'ACC-20', from: { roomId: 2, start: FROM }, to: { roomId: 2, start: TO } }],
  moves: [{ examId: 20, accession: 'ACC-20', kind: 'shift', from: { roomId: 2, start: FROM }, to: { roomId: 2, start: TO }, minutesMoved: 12 }],
  calls: [{ examId: 20, accession: 'ACC-20', fromStart: FROM, toStart: TO, fromRoomId: 2, toRoomId: 2 }],
  helpers: [],
  remaining: [],
  objective: { gapsLeft: 0, examsMoved: 1, minutesMoved: 12, dayEndsAt: null, helpersAdded: 0 },
  before: { fits: 0, snug: 0, short: 1, overlap: 0, minutesShort: 6 },
  after: { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 },
  solver: { status: 'optimal', mipGap: 0, scope: 'whole', solves: 2, clusters: 1, milliseconds: 40, rosterRounds: 1 },
  dayVersion: 3,
  fixed: [],
};

describe('fitPreview', () => {
  it('on a roster day recomputes a room the proposal does not touch: MR 1 no longer waits for the aide', () => {
    const day = rosterPlan();
    const before = day.rooms.find((room) => room.id === 1)!.gaps.find((gap) => gap.toExamId === 2)!;
    expect(before).toMatchObject({ verdict: 'short', shortByMinutes: 6 });
    const preview = fitPreview(day, PROPOSAL)!;
    const after = preview.rooms.get(1)!.gaps.find((gap) => gap.toExamId === 2)!;
    expect(after.verdict).not.toBe('short');
    expect(preview.ghosts.get(2)).toEqual([expect.objectContaining({ examId: 20, start: FROM })]);
    expect([...preview.proposed]).toEqual([20]);
  });

  it('without a roster recomputes only the rooms the proposal touches', () => {
    const { roster: _roster, ...input } = rosterPlan().input;
    const preview = fitPreview(rosterPlan(input), PROPOSAL)!;
    expect([...preview.rooms.keys()]).toEqual([2]);
  });
});
