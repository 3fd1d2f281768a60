import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan } from '../turnover/day-plan-types';
import { peopleReasonWords } from '../turnover/people-words';
import type { FitRemainingGap } from './model';
import { neitherMayMove } from './remaining';

/** The exams after a `short` or `overlap` gap in a plan. */
export function problemsOf(plan: DayPlan): number[] {
  return plan.rooms.flatMap((room) => room.gaps.filter((gap) => gap.verdict === 'short' || gap.verdict === 'overlap').map((gap) => gap.toExamId));
}

/**
 * The gaps the roster's judgement leaves short or overlapping, each with why: the people's side
 * in the gap panel's words and the solver's (or that neither exam may move), else `otherwise`.
 */
export function remainingWithPeople(input: DayPlanInput, plan: DayPlan, solverLeft: readonly FitRemainingGap[], stays: ReadonlyMap<number, string>, otherwise: string): FitRemainingGap[] {
  const solverReason = new Map(solverLeft.map((gap) => [gap.toExamId, gap.reason]));
  const examById = new Map(input.exams.map((exam) => [exam.id, exam]));
  const people = new Map((plan.people?.people ?? []).map((person) => [person.id, person.label]));
  const names = { roomName: (id: number) => plan.rooms.find((r) => r.id === id)?.name, personLabel: (id: string) => people.get(id) };
  const out: FitRemainingGap[] = [];
  for (const room of plan.rooms) {
    for (const gap of room.gaps) {
      if (gap.verdict !== 'short' && gap.verdict !== 'overlap') continue;
      // The people's side and the solver's both, when both have something to say.
      const fixedWords = neitherMayMove(gap.fromExamId === null ? null : examById.get(gap.fromExamId)!, examById.get(gap.toExamId)!, stays);
      const said = [gap.people ? peopleReasonWords(gap, gap.people, room.id, names) : null, solverReason.get(gap.toExamId) ?? fixedWords].filter((w): w is string => w !== null);
      const reason = said.length > 0 ? said.join(' — ') : otherwise;
      out.push({ fromExamId: gap.fromExamId, toExamId: gap.toExamId, accession: room.exams.find((e) => e.id === gap.toExamId)?.accession ?? String(gap.toExamId), roomId: room.id, verdict: gap.verdict, shortByMinutes: gap.shortByMinutes, reason });
    }
  }
  return out;
}

/** The day's last exam end, in ms (0 for an empty day). */
export function dayEnd(plan: DayPlan): number {
  return Math.max(0, ...plan.rooms.flatMap((room) => room.exams.map((exam) => Date.parse(exam.end))));
}

/** Whether score `a` comes before `b`, level by level (the first level that differs decides). */
export function lexicallyLess(a: readonly number[], b: readonly number[]): boolean {
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return a[k]! < b[k]!;
  return false;
}
