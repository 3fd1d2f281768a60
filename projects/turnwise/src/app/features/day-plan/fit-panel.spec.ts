import { TestBed } from '@angular/core/testing';

import type { DayFitAnswer } from '@shared/api/day-fit';
import { provideIcons } from '../../core/layout/icons';
import { FitPanel } from './fit-panel';

/** An invented proposal: FX-2 pushed 10 min, FX-5 to MR 2 at the same time, one gap left in MR 3. */
const PROPOSAL: DayFitAnswer = {
  date: '2027-03-16',
  changes: [
    { type: 'move', examId: 2, accession: 'FX-2', from: { roomId: 1, start: '2027-03-16T08:40:00-05:00' }, to: { roomId: 1, start: '2027-03-16T08:50:00-05:00' } },
    { type: 'move', examId: 5, accession: 'FX-5', from: { roomId: 1, start: '2027-03-16T10:00:00-05:00' }, to: { roomId: 2, start: '2027-03-16T10:00:00-05:00' } },
  ],
  moves: [
    { examId: 2, accession: 'FX-2', kind: 'shift', from: { roomId: 1, start: '2027-03-16T08:40:00-05:00' }, to: { roomId: 1, start: '2027-03-16T08:50:00-05:00' }, minutesMoved: 10 },
    { examId: 5, accession: 'FX-5', kind: 'other-room', from: { roomId: 1, start: '2027-03-16T10:00:00-05:00' }, to: { roomId: 2, start: '2027-03-16T10:00:00-05:00' }, minutesMoved: 0 },
  ],
  calls: [{ examId: 2, accession: 'FX-2', fromStart: '2027-03-16T08:40:00-05:00', toStart: '2027-03-16T08:50:00-05:00', fromRoomId: 1, toRoomId: 1 }],
  helpers: [],
  remaining: [{ fromExamId: 8, toExamId: 9, accession: 'FX-9', roomId: 3, verdict: 'short', shortByMinutes: 4, reason: 'neither exam may move: FX-8 has arrived, FX-9 is pinned' }],
  objective: { gapsLeft: 1, examsMoved: 2, minutesMoved: 10, dayEndsAt: '2027-03-16T18:40:00-05:00', helpersAdded: 0 },
  before: { fits: 10, snug: 1, short: 3, overlap: 0, minutesShort: 20 },
  after: { fits: 12, snug: 1, short: 1, overlap: 0, minutesShort: 4 },
  solver: { status: 'optimal', mipGap: 0, scope: 'whole', solves: 2, clusters: 1, milliseconds: 420 },
  dayVersion: 7,
  fixed: [{ examId: 8, accession: 'FX-8', reason: 'arrived' }, { examId: 9, accession: 'FX-9', reason: 'pinned' }],
};

async function render(proposal = PROPOSAL, roster = false) {
  TestBed.configureTestingModule({ imports: [FitPanel], providers: [provideIcons()] });
  const fixture = TestBed.createComponent(FitPanel);
  fixture.componentRef.setInput('proposal', proposal);
  fixture.componentRef.setInput('rooms', [{ id: 1, name: 'MR 1' }, { id: 2, name: 'MR 2' }, { id: 3, name: 'MR 3' }]);
  fixture.componentRef.setInput('roster', roster);
  await fixture.whenStable();
  const host = fixture.nativeElement as HTMLElement;
  return { fixture, host, text: () => host.textContent!.replace(/\s+/g, ' ') };
}

describe('FitPanel', () => {
  it('lists the patients to call, the other-room moves and what stays unsolved with its reason', async () => {
    const { text } = await render();
    expect(text()).toContain('Leaves 1 gap short or overlapping: 2 exams moved, 10 min in all, the day ends at 18:40.');
    expect(text()).toContain('FX-2 08:40 → 08:50');
    expect(text()).toContain('FX-5 MR 1 → MR 2');
    expect(text()).toContain('FX-9 in MR 3: short by 4 min — neither exam may move: FX-8 has arrived, FX-9 is pinned');
    expect(text()).toContain('May not move: FX-8 arrived; FX-9 pinned.');
    expect(text()).toContain('Best possible (whole day)');
  });

  it('folds the gaps whose exam has started or is due apart from those still ahead, and says so in the summary', async () => {
    const earlier = [
      { fromExamId: 30, toExamId: 31, accession: 'FX-31', roomId: 1, verdict: 'short' as const, shortByMinutes: 6, reason: 'neither exam may move: FX-30 has started, FX-31 has started' },
      { fromExamId: 32, toExamId: 33, accession: 'FX-33', roomId: 2, verdict: 'overlap' as const, shortByMinutes: 9, reason: 'neither exam may move: FX-32 has started, FX-33 is past its start time' },
    ];
    const fixed = [...PROPOSAL.fixed, { examId: 30, accession: 'FX-30', reason: 'started' as const }, { examId: 31, accession: 'FX-31', reason: 'started' as const }, { examId: 32, accession: 'FX-32', reason: 'started' as const }, { examId: 33, accession: 'FX-33', reason: 'passed' as const }];
    const { host, text } = await render({ ...PROPOSAL, remaining: [...PROPOSAL.remaining, ...earlier], fixed });
    expect(text()).toContain('Leaves 1 gap still ahead short or overlapping: 2 exams moved, 10 min in all, the day ends at 18:40. 2 gaps earlier today are past changing (their exams have started or are due).');
    expect(host.querySelector('h3.unsolved')!.textContent!.replace(/\s+/g, ' ')).toContain('Still short or overlapping 1');
    const folded = host.querySelector('details.over')!;
    expect(folded.hasAttribute('open')).toBe(false);
    expect(folded.querySelector('summary')!.textContent!.replace(/\s+/g, ' ')).toContain('Earlier today, past changing 2');
    expect(folded.textContent).toContain('FX-31 in MR 1');
    expect(folded.textContent).toContain('FX-33 in MR 2');
    expect(folded.textContent).not.toContain('FX-9');
  });

  it('with only gaps past changing left, clears every gap still ahead (one of them: "its exam")', async () => {
    const remaining = [{ fromExamId: 30, toExamId: 31, accession: 'FX-31', roomId: 1, verdict: 'short' as const, shortByMinutes: 6, reason: 'neither exam may move' }];
    const fixed = [{ examId: 31, accession: 'FX-31', reason: 'started' as const }];
    const { host, text } = await render({ ...PROPOSAL, remaining, fixed });
    expect(text()).toContain('Clears every short and overlapping gap still ahead: 2 exams moved, 10 min in all, the day ends at 18:40. 1 gap earlier today is past changing (its exam has started or is due).');
    expect(host.querySelector('h3.unsolved')).toBeNull();
  });

  it('with nothing to change and a gap past changing, says every gap still ahead fits', async () => {
    const remaining = [{ fromExamId: 30, toExamId: 31, accession: 'FX-31', roomId: 1, verdict: 'short' as const, shortByMinutes: 6, reason: 'neither exam may move' }];
    const { text } = await render({ ...PROPOSAL, changes: [], remaining, fixed: [{ examId: 31, accession: 'FX-31', reason: 'started' }] });
    expect(text()).toContain('Every gap still ahead fits: nothing to change. 1 gap earlier today is past changing');
  });

  it('says "short by" once when the reason left for people already opens with it', async () => {
    const remaining = [{ fromExamId: 8, toExamId: 9, accession: 'FX-9', roomId: 3, verdict: 'short' as const, shortByMinutes: 8, reason: 'Short by 8 min: Aide 1 is in MR 2 until 09:11' }];
    const { text } = await render({ ...PROPOSAL, remaining });
    expect(text()).toContain('FX-9 in MR 3: Short by 8 min: Aide 1 is in MR 2 until 09:11');
    expect(text()).not.toContain('short by 8 min — Short by 8 min');
  });

  it('counts the exams past their start time first among those that may not move', async () => {
    const passed = [1, 2, 3].map((n) => ({ examId: 20 + n, accession: `FX-2${n}`, reason: 'passed' as const }));
    const { text } = await render({ ...PROPOSAL, fixed: [...PROPOSAL.fixed, ...passed] });
    expect(text()).toContain('May not move: 3 past their start time; FX-8 arrived; FX-9 pinned.');
  });

  it('emits applied and discarded from its buttons', async () => {
    const { fixture, host } = await render();
    const applied = jest.fn();
    const discarded = jest.fn();
    fixture.componentInstance.applied.subscribe(applied);
    fixture.componentInstance.discarded.subscribe(discarded);
    host.querySelector<HTMLButtonElement>('button.apply')!.click();
    host.querySelector<HTMLButtonElement>('button.discard')!.click();
    expect([applied.mock.calls.length, discarded.mock.calls.length]).toEqual([1, 1]);
  });

  it('says the day already fits and offers no Apply when there is nothing to change', async () => {
    const { host, text } = await render({ ...PROPOSAL, changes: [], moves: [], calls: [], remaining: [], fixed: [], solver: { ...PROPOSAL.solver, status: 'nothing-to-do' } });
    expect(text()).toContain('Every gap already fits: nothing to change.');
    expect(host.querySelector<HTMLButtonElement>('button.apply')!.disabled).toBe(true);
  });

  it('says when the time limit cut the search short, with the optimality gap', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, status: 'time-limit', mipGap: 0.12, scope: 'neighbourhood' } });
    expect(text()).toContain('Best found within the time limit (around each problem gap); optimality gap 12 %.');
  });

  it('does not call a neighbourhood answer the best for the whole day', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, scope: 'neighbourhood' } });
    expect(text()).toContain('Best within reach of each problem gap (a day this size is not searched whole)');
    expect(text()).not.toContain('Best possible');
  });

  it('on a day with a roster, says the proposal is planned with its crews, not proven the best, and points to the People view', async () => {
    expect((await render()).text()).not.toContain('People view');
    TestBed.resetTestingModule();
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, rosterRounds: 2 } }, true);
    expect(text()).toContain("Planned with the roster's people");
    expect(text()).toContain('check the People view');
    expect(text()).toContain("Best found in 2 rounds with the roster's crews (not proven the best possible)");
    expect(text()).not.toContain('Best possible (whole day)');
  });

  it('counts the windows tried after the rounds when some were kept', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, roster: 'rounds', rosterRounds: 3, rosterWindows: 2 } }, true);
    expect(text()).toContain("Best found in 3 rounds and 2 windows with the roster's crews (not proven the best possible)");
  });

  it('says a roster day planned in rounds was cut by the time limit, without a window’s optimality gap', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, status: 'time-limit', mipGap: 0.99, roster: 'rounds', rosterRounds: 2, rosterPushes: 1 } }, true);
    expect(text()).toContain("Best found in 2 rounds and 1 push along a room within the time limit with the roster's crews (not proven the best possible)");
    expect(text()).not.toContain('99 %');
  });

  it('counts the pushes and windows kept after the rounds', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, roster: 'rounds', rosterRounds: 2, rosterPushes: 6, rosterWindows: 1 } }, true);
    expect(text()).toContain("Best found in 2 rounds, 6 pushes along rooms and 1 window with the roster's crews (not proven the best possible)");
  });

  it('counts the moves taken back at the end, when the day did not need them', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, roster: 'rounds', rosterRounds: 2, rosterPushes: 3, rosterReturned: 1 } }, true);
    expect(text()).toContain("Best found in 2 rounds, 3 pushes along rooms and 1 move taken back with the roster's crews (not proven the best possible)");
  });

  it('on a small roster day solved with its people in the model, says it is the best possible and who works what was planned', async () => {
    const { text } = await render({ ...PROPOSAL, solver: { ...PROPOSAL.solver, roster: 'exact' } }, true);
    expect(text()).toContain("Best possible with the roster's people");
    expect(text()).toContain('who works each turnover was planned with the moves');
    expect(text()).toContain('the People view');
    expect(text()).not.toContain('not proven');
  });
});
