import type { GapPeopleReason } from '@shared/api/plan';

import { gapPeopleWords } from './people-reason';
import { rosterPlan } from './testing/example-roster';

// Invented roster day (testing/example-roster.ts); the reasons after the first two are invented
// variations of its MR 1 gap, to say each kind in words.
const plan = rosterPlan();
const mr1 = plan.rooms.find((room) => room.name === 'MR 1')!;
const mr2 = plan.rooms.find((room) => room.name === 'MR 2')!;
const ct1 = plan.rooms.find((room) => room.name === 'CT 1')!;
const short = mr1.gaps.find((gap) => gap.toExamId === 2)!;
const reason = (extra: Partial<GapPeopleReason>): GapPeopleReason => ({
  kind: 'busy', personId: 'r1-1', roomId: 2, until: '2027-03-15T10:12:00-05:00', wanted: 1, got: 1, waitedMinutes: 15, ...extra,
});

describe('gapPeopleWords', () => {
  it('says the engine’s reason for the short gap: the aide is in MR 2 until 10:12', () => {
    expect(gapPeopleWords(plan, mr1, short)).toEqual({ reason: 'Short by 6 min: Aide 1 is in MR 2 until 10:12', crew: ['Aide 1'] });
  });

  it('says a gap that still fits started late for a break', () => {
    const gap = mr2.gaps.find((candidate) => candidate.toExamId === 23)!;
    expect(gap.verdict).toBe('snug');
    expect(gapPeopleWords(plan, mr2, gap)!.reason).toBe('Starts 10 min late: Aide 1 is on a break until 12:10');
  });

  it('says nothing about people for a room nobody covers (planned with its own staff)', () => {
    expect(gapPeopleWords(plan, ct1, ct1.gaps[0]!)).toBeNull();
  });

  it('says no reason when the crew was whole and on time, but still lists it', () => {
    const gap = mr2.gaps.find((candidate) => candidate.toExamId === 21)!;
    expect(gapPeopleWords(plan, mr2, gap)).toEqual({ reason: null, crew: ['Aide 1'] });
  });

  it.each([
    [reason({ kind: 'break', roomId: null, until: '2027-03-15T11:00:00-05:00' }), 'Short by 6 min: Aide 1 is on a break until 11:00'],
    [reason({ kind: 'off-shift', roomId: null, until: '2027-03-15T10:30:00-05:00' }), 'Short by 6 min: Aide 1 starts at 10:30'],
    [reason({ kind: 'off-shift', roomId: null, until: null }), "Short by 6 min: Aide 1's shift is over"],
    [reason({ kind: 'nobody', personId: null, roomId: null, until: null, got: 0 }), 'Short by 6 min: nobody on the roster covers MR 1 then'],
    [reason({ wanted: 2, got: 1 }), 'Short by 6 min: runs with 1 of 2 people; Aide 1 is in MR 2 until 10:12'],
    [reason({ roomId: 1 }), 'Short by 6 min: Aide 1 is busy until 10:12'],
  ])('says %j in words', (why, words) => {
    expect(gapPeopleWords(plan, mr1, { ...short, people: why })!.reason).toBe(words);
  });

  it('leads with the crew size when the turnover fits but runs short-handed', () => {
    const gap = { ...short, verdict: 'fits' as const, shortByMinutes: 0, people: reason({ wanted: 2, got: 1, waitedMinutes: 0, kind: 'nobody', personId: null, roomId: null, until: null }) };
    expect(gapPeopleWords(plan, mr1, gap)!.reason).toBe('Runs with 1 of 2 people: nobody else on the roster covers MR 1');
  });

  it('says "nobody" for the crew when nobody could do the turnover', () => {
    expect(gapPeopleWords(plan, mr1, { ...short, crew: [] })!.crew).toEqual([]);
  });
});
