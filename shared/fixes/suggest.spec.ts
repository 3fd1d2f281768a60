import type { DayPlan, PlanGap } from '../api/plan';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { withChanges } from './apply-changes';
import { MAX_FIX_CHANGES_PER_CALL, MAX_FIX_GAPS_PER_CALL, type Fix } from './model';
import { suggestFixes, suggestGapFixes, type FixBounds } from './suggest';
import { randomDay } from './testing/random-day';

const isProblem = (gap: PlanGap | undefined) => gap?.verdict === 'short' || gap?.verdict === 'overlap';
const problemGapIds = (plan: DayPlan) => plan.rooms.flatMap((r) => r.gaps.filter(isProblem).map((g) => g.toExamId));

/** Every page from the first, following `next`, within `bounds`. */
function allPages(input: DayPlanInput, limit: number, bounds: FixBounds = {}) {
  const pages = [];
  let after: number | undefined;
  do {
    const page = suggestFixes(input, { ...bounds, after, limit })!;
    pages.push(page);
    after = page.next ?? undefined;
  } while (after !== undefined);
  return pages;
}

/**
 * The oracle: the whole day recomputed by the engine with the fix's changes applied, as the
 * fixes were weighed before they were weighed on the touched rooms only.
 */
function wholeDayEffect(input: DayPlanInput, before: DayPlan, fix: Fix) {
  const after = computeDayPlan(withChanges(input, fix.changes));
  const beforeGaps = new Map(before.rooms.flatMap((r) => r.gaps).map((g) => [g.toExamId, g]));
  const afterGaps = after.rooms.flatMap((r) => r.gaps);
  const focus = afterGaps.find((g) => g.toExamId === fix.toExamId)!;
  const touched = new Set(fix.changes.flatMap((c) => (c.type === 'move' ? [c.from.roomId, c.to.roomId] : [])));
  const ends = (plan: DayPlan) => {
    const rooms = plan.rooms.filter((r) => touched.has(r.id) || r.gaps.some((g) => g.toExamId === fix.toExamId));
    return Math.max(...rooms.flatMap((r) => [Date.parse(r.opensAt), ...r.exams.map((e) => Date.parse(e.end))]));
  };
  return {
    verdictAfter: focus.verdict,
    shortByAfter: focus.shortByMinutes,
    newProblems: afterGaps.filter((g) => g.toExamId !== fix.toExamId && isProblem(g) && !isProblem(beforeGaps.get(g.toExamId))).length,
    dayEndsBefore: ends(before),
    dayEndsAfter: ends(after),
    summaryAfter: after.summary,
  };
}

describe('suggestFixes', () => {
  it('pages through every problem gap once, in plan order, each page at most `limit` gaps', () => {
    for (let seed = 1; seed <= 15; seed++) {
      const input = randomDay(seed);
      const expected = problemGapIds(computeDayPlan(input));
      for (const limit of [1, 4, MAX_FIX_GAPS_PER_CALL]) {
        const pages = allPages(input, limit);
        expect([seed, limit, pages.flatMap((p) => p.gaps)]).toEqual([seed, limit, expected]);
        for (const page of pages) {
          expect(page.gaps.length).toBeLessThanOrEqual(limit);
          expect(page.problemGaps).toBe(expected.length);
          expect(page.fixes.every((fix) => page.gaps.includes(fix.toExamId))).toBe(true);
        }
        expect(pages.at(-1)!.next).toBeNull();
        expect(pages.slice(0, -1).map((p) => p.next)).toEqual(pages.slice(0, -1).map((p) => p.gaps.at(-1)));
      }
    }
  });

  it('weighs each fix as recomputing the whole day would', () => {
    let checked = 0;
    const kinds = new Set<string>();
    for (let seed = 1; seed <= 40; seed++) {
      const input = randomDay(seed, seed % 5 === 0 ? '2027-03-14' : '2027-03-15');
      const before = computeDayPlan(input);
      for (const fix of allPages(input, MAX_FIX_GAPS_PER_CALL).flatMap((p) => p.fixes)) {
        const { dayEndsBefore, dayEndsAfter, ...effect } = fix.effect;
        const whole = wholeDayEffect(input, before, fix);
        expect([fix.id, { ...effect, dayEndsBefore: Date.parse(dayEndsBefore), dayEndsAfter: Date.parse(dayEndsAfter) }]).toEqual([fix.id, whole]);
        kinds.add(fix.kind);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(100);
    expect([...kinds].sort()).toEqual(['add-helper', 'isolation-last', 'other-room', 'push-later']);
  });

  it('ends a page early once its fixes reach the changes a call may carry, and goes on from there', () => {
    // an invented crowded room: 400 ten-minute exams two minutes apart, so each push cascades to the end
    const input: DayPlanInput = {
      date: '2027-03-15',
      timezone: 'America/Chicago',
      ...DEMO_SETUP,
      rooms: [{ id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6, opensAt: '00:00' }],
      exams: Array.from({ length: 400 }, (_, i) => ({
        id: i + 1, accession: `CRW-${i + 1}`, roomId: 1, start: new Date(Date.UTC(2027, 2, 15, 6, 2 * i)).toISOString().replace('.000Z', 'Z'),
        durationMinutes: 10, procedure: 'MR invented procedure', precaution: 'none' as const, mobility: 'ambulatory' as const, contrast: false, version: 1,
      })),
    };
    const first = suggestFixes(input)!;
    const changesOf = (fixes: Fix[]) => fixes.reduce((n, f) => n + f.changes.length, 0);
    expect(first.gaps.length).toBeLessThan(MAX_FIX_GAPS_PER_CALL);
    expect(changesOf(first.fixes)).toBeGreaterThanOrEqual(MAX_FIX_CHANGES_PER_CALL);
    expect(changesOf(first.fixes.filter((f) => f.toExamId !== first.next))).toBeLessThan(MAX_FIX_CHANGES_PER_CALL);
    expect(suggestFixes(input, { after: first.next! })!.gaps[0]).toBe(first.gaps.at(-1)! + 1);
  });

  it('starts after the gap named by `after`, even when that gap is no longer a problem', () => {
    const input = randomDay(11);
    const plan = computeDayPlan(input);
    const problems = problemGapIds(plan);
    const fitting = plan.rooms.flatMap((r) => r.gaps).find((g) => !isProblem(g))!;
    const order = plan.rooms.flatMap((r) => r.gaps.map((g) => g.toExamId));
    const expected = problems.filter((id) => order.indexOf(id) > order.indexOf(fitting.toExamId)).slice(0, 2);
    expect(suggestFixes(input, { after: fitting.toExamId, limit: 2 })!.gaps).toEqual(expected);
  });

  it('answers null for an `after` that is not an exam of the day, and refuses a bad limit', () => {
    const input = randomDay(2);
    expect(suggestFixes(input, { after: 99_999 })).toBeNull();
    for (const limit of [0, MAX_FIX_GAPS_PER_CALL + 1, 1.5, Number.NaN]) {
      expect(() => suggestFixes(input, { limit })).toThrow(RangeError);
    }
  });

  it('answers an empty last page for a day with no problem gap', () => {
    const input = { ...randomDay(4), exams: [] };
    expect(suggestFixes(input)).toEqual({ fixes: [], gaps: [], problemGaps: 0, next: null });
  });
});

/**
 * The example day (invented): MR 1 with ACC-1 08:00–08:30, ACC-2 08:40 (10 min where one person
 * needs 20: short by 10), ACC-3 09:15 (5 min after ACC-2); each 30 min, site time 2027-03-15.
 */
function exampleDay(extraExams: DayPlanInput['exams'] = []): DayPlanInput {
  return {
    date: '2027-03-15',
    timezone: 'America/Chicago',
    ...DEMO_SETUP,
    rooms: [{ id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6 }],
    exams: [exampleExam(1, '08:00'), exampleExam(2, '08:40'), exampleExam(3, '09:15'), ...extraExams],
  };
}

function exampleExam(id: number, start: string, extra: Partial<DayPlanInput['exams'][number]> = {}): DayPlanInput['exams'][number] {
  return {
    id, accession: `ACC-${id}`, roomId: 1, start: `2027-03-15T${start}:00-05:00`, durationMinutes: 30,
    procedure: 'MR knee without contrast', coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, version: 1, ...extra,
  };
}

describe('suggestGapFixes', () => {
  it("gives a gap's fixes exactly as the day's pages give them", () => {
    for (let seed = 1; seed <= 10; seed++) {
      const input = randomDay(seed);
      const fixes = allPages(input, MAX_FIX_GAPS_PER_CALL).flatMap((p) => p.fixes);
      for (const toExamId of problemGapIds(computeDayPlan(input))) {
        expect(suggestGapFixes(input, toExamId)).toEqual(fixes.filter((f) => f.toExamId === toExamId));
      }
    }
  });

  it('gives none for a gap that fits, and null for an exam not on the day', () => {
    const input = randomDay(6);
    const fitting = computeDayPlan(input).rooms.flatMap((r) => r.gaps).find((g) => !isProblem(g))!;
    expect(suggestGapFixes(input, fitting.toExamId)).toEqual([]);
    expect(suggestGapFixes(input, 99_999)).toBeNull();
  });

  it('pushes the short gap of the example day later with its cascade, and adds a helper', () => {
    const input = exampleDay();
    const fixes = suggestGapFixes(input, 2)!;
    expect(fixes.map((f) => [f.id, f.title])).toEqual([
      // 08:30 + 20 min turnover + 3 min margin = 08:53
      ['push-later:2', 'Start ACC-2 13 min later, at 08:53'],
      ['add-helper:2', 'Add a helper before ACC-2 (2 people)'],
    ]);
    // ACC-3's gap was short already: it keeps its 5 minutes (no worse), so it moves to 09:28 — not made to fit
    expect(fixes[0]!.changes.map((c) => c.type === 'move' && c.to.start)).toEqual(['2027-03-15T08:53:00-05:00', '2027-03-15T09:28:00-05:00']);
    expect(fixes[0]!.detail).toBe("ACC-2 moves and 1 later exam in MR 1 moves too; MR 1's last exam then ends at 09:58 (was 09:45).");
    expect(fixes[0]!.effect).toMatchObject({ verdictAfter: 'fits', newProblems: 0, dayEndsBefore: '2027-03-15T09:45:00-05:00', dayEndsAfter: '2027-03-15T09:58:00-05:00' });
    // two people: 14 min (the product brief's check value), still short by 4
    expect(fixes[1]!.effect).toMatchObject({ verdictAfter: 'short', shortByAfter: 4 });
  });

  it("says a push leaves the room's last end where it was when the cascade stops before it (invented)", () => {
    const fixes = suggestGapFixes(exampleDay([exampleExam(4, '11:00')]), 2)!;
    expect(fixes[0]!.detail).toBe("ACC-2 moves and 1 later exam in MR 1 moves too; MR 1's last exam still ends at 11:30.");
  });

  it('moves no exam that stays and none already due, and leaves a gap whose patient is due alone (worked examples, invented)', () => {
    const at = (hhmm: string) => Date.parse(`2027-03-15T${hhmm}:00-05:00`);
    const kinds = (fixes: Fix[] | null) => fixes!.map((f) => f.kind);
    expect(kinds(suggestGapFixes(exampleDay(), 2))).toEqual(['push-later', 'add-helper']);
    // ACC-3 pinned (or arrived): the push would have to move it to 09:28, so only the helper is offered.
    expect(kinds(suggestGapFixes(exampleDay(), 2, { stays: [3] }))).toEqual(['add-helper']);
    // ACC-2 itself stays: no push, no other room; a helper still shortens its turnover.
    expect(kinds(suggestGapFixes(exampleDay(), 2, { stays: [2] }))).toEqual(['add-helper']);
    // At 08:40 ACC-2 may still move; at 08:41 its start has passed and the turnover before it is over: nothing to fix.
    expect(kinds(suggestGapFixes(exampleDay(), 2, { notBefore: at('08:40') }))).toEqual(['push-later', 'add-helper']);
    expect(suggestGapFixes(exampleDay(), 2, { notBefore: at('08:41') })).toEqual([]);
    // An isolation case is moved to the end of the list only while it may move.
    const isolated = exampleDay().exams.map((e) => (e.id === 1 ? { ...e, precaution: 'contact' as const } : e));
    const withIsolation = { ...exampleDay(), exams: isolated };
    expect(kinds(suggestGapFixes(withIsolation, 2))).toContain('isolation-last');
    expect(kinds(suggestGapFixes(withIsolation, 2, { stays: [1] }))).not.toContain('isolation-last');
    // A second MR room: ACC-2 may go there while it may move, not once it stays.
    const twoRooms = { ...exampleDay(), rooms: [...exampleDay().rooms, { id: 2, name: 'MR 2', modality: 'MR', staff: 1, airChangesPerHour: 6 }] };
    expect(kinds(suggestGapFixes(twoRooms, 2))).toContain('other-room');
    expect(kinds(suggestGapFixes(twoRooms, 2, { stays: [2] }))).not.toContain('other-room');
  });

  it('on random days, never moves an exam that stays or is due, and gives the other gaps the fixes they had', () => {
    let kept = 0;
    let dropped = 0;
    for (let seed = 1; seed <= 25; seed++) {
      const input = randomDay(seed);
      const starts = input.exams.map((e) => Date.parse(e.start)).sort((a, b) => a - b);
      const notBefore = starts[Math.floor(starts.length / 3)]!;
      const stays = input.exams.filter((e) => e.id % 4 === 0).map((e) => e.id);
      const free = (id: number) => !stays.includes(id) && Date.parse(input.exams.find((e) => e.id === id)!.start) >= notBefore;
      const bounded = allPages(input, MAX_FIX_GAPS_PER_CALL, { stays, notBefore }).flatMap((p) => p.fixes);
      for (const fix of bounded) {
        expect([seed, fix.id, fix.changes.filter((c) => c.type === 'move' && !free(c.examId))]).toEqual([seed, fix.id, []]);
        expect([seed, fix.id, free(fix.toExamId) || Date.parse(input.exams.find((e) => e.id === fix.toExamId)!.start) >= notBefore]).toEqual([seed, fix.id, true]);
      }
      // Bounds only take fixes away: a fix that moves only free exams, on a gap still to come, stays as it was.
      const unbounded = allPages(input, MAX_FIX_GAPS_PER_CALL).flatMap((p) => p.fixes);
      const due = (id: number) => Date.parse(input.exams.find((e) => e.id === id)!.start) < notBefore;
      const expected = unbounded.filter((fix) => !due(fix.toExamId) && fix.changes.every((c) => c.type !== 'move' || free(c.examId)));
      expect([seed, bounded]).toEqual([seed, expected]);
      kept += bounded.length;
      dropped += unbounded.length - bounded.length;
    }
    // Both sides occur: the bounds take some fixes away and leave others.
    expect(kept).toBeGreaterThan(50);
    expect(dropped).toBeGreaterThan(50);
  });
});

