import { DateTime } from 'luxon';
import type { ExamMove, PlanChange } from '../api/changes';
import type { DayPlan, PlanExam, PlanGap, PlanRoom } from '../api/plan';
import { computeDayPlan, type DayPlanInput } from '../turnover';
import { withChanges } from './apply-changes';
import type { Fix, FixKind } from './model';

const MINUTE = 60_000;
const MAX_STAFF = 3;
const isProblem = (gap: PlanGap | undefined) => gap !== undefined && (gap.verdict === 'short' || gap.verdict === 'overlap');

/**
 * Proposes fixes for every `short` or `overlap` gap of the day, each with its effect computed
 * by the engine: push the arriving exam (and only as much of the cascade as needed) later; move
 * it to another room of the same modality where it fits; add a helper to the turnover; move the
 * leaving isolation case to the end of its room's list (common practice, no source: isolation
 * cases last). A fix never counts the gap it fixes as new; `effect.newProblems` counts the rest.
 *
 * @example
 * const fixes = suggestFixes(input); // [{ id: 'push-later:12', kind: 'push-later', title: 'Start ACC-12 at 10:45', … }]
 */
export function suggestFixes(input: DayPlanInput, plan: DayPlan = computeDayPlan(input)): Fix[] {
  const ctx = { input, plan, zone: input.timezone, margin: input.snugMarginMinutes ?? 3 };
  const fixes: Fix[] = [];
  for (const room of plan.rooms) {
    for (const gap of room.gaps) {
      if (!isProblem(gap)) continue;
      for (const build of [pushLater, otherRoom, addHelper, isolationLast]) {
        const fix = build(ctx, room, gap);
        if (fix) fixes.push(fix);
      }
    }
  }
  return fixes;
}

interface Ctx {
  input: DayPlanInput;
  plan: DayPlan;
  zone: string;
  margin: number;
}

const ms = (iso: string) => Date.parse(iso);
function iso(ctx: Ctx, t: number): string {
  return DateTime.fromMillis(t, { zone: ctx.zone }).toISO({ suppressMilliseconds: true })!;
}
function hhmm(ctx: Ctx, t: number): string {
  return DateTime.fromMillis(t, { zone: ctx.zone }).toFormat('HH:mm');
}
function move(exam: PlanExam, roomId: number, start: string): ExamMove {
  return { type: 'move', examId: exam.id, accession: exam.accession, from: { roomId: exam.roomId, start: exam.start }, to: { roomId, start } };
}
const dayEnd = (room: PlanRoom) => Math.max(...room.exams.map((e) => ms(e.end)), ms(room.opensAt));

/** Evaluates changes with the engine and packages them as a fix. */
function evaluate(ctx: Ctx, kind: FixKind, gap: PlanGap, changes: PlanChange[], title: string, describe: (after: DayPlan, focus: PlanGap | undefined) => string, focusExamId = gap.toExamId): Fix | null {
  const after = computeDayPlan(withChanges(ctx.input, changes));
  const beforeGaps = new Map(ctx.plan.rooms.flatMap((r) => r.gaps).map((g) => [g.toExamId, g]));
  const afterGaps = after.rooms.flatMap((r) => r.gaps);
  const focus = afterGaps.find((g) => g.toExamId === focusExamId);
  if (!focus) return null;
  const newProblems = afterGaps.filter((g) => g.toExamId !== focusExamId && isProblem(g) && !isProblem(beforeGaps.get(g.toExamId))).length;
  const touched = new Set(changes.flatMap((c) => (c.type === 'move' ? [c.from.roomId, c.to.roomId] : [])));
  const roomOf = (p: DayPlan) => p.rooms.filter((r) => touched.has(r.id) || r.gaps.some((g) => g.toExamId === gap.toExamId));
  const endBefore = Math.max(...roomOf(ctx.plan).map(dayEnd));
  const endAfter = Math.max(...roomOf(after).map(dayEnd));
  return {
    id: `${kind}:${gap.toExamId}`,
    kind,
    toExamId: gap.toExamId,
    title,
    detail: describe(after, focus),
    changes,
    effect: {
      verdictAfter: focus.verdict,
      shortByAfter: focus.shortByMinutes,
      newProblems,
      dayEndsBefore: iso(ctx, endBefore),
      dayEndsAfter: iso(ctx, endAfter),
      summaryAfter: after.summary,
    },
  };
}

function pushLater(ctx: Ctx, room: PlanRoom, gap: PlanGap): Fix | null {
  const index = room.exams.findIndex((e) => e.id === gap.toExamId);
  const changes: ExamMove[] = [];
  let previousEnd = ms(room.exams[index]!.start) - gap.availableMinutes * MINUTE; // the leaving exam's end (or the opening)
  for (let i = index; i < room.exams.length; i++) {
    const exam = room.exams[i]!;
    const g = room.gaps.find((x) => x.toExamId === exam.id)!;
    // only as far as needed: a fitting gap keeps fitting, a snug one stays at least snug, a problem gap gets no worse
    const wanted = i === index ? g.requiredMinutes + ctx.margin : g.verdict === 'fits' ? g.requiredMinutes + ctx.margin : g.verdict === 'snug' ? g.requiredMinutes : g.availableMinutes;
    const start = Math.max(ms(exam.start), previousEnd + wanted * MINUTE);
    if (start === ms(exam.start)) break;
    changes.push(move(exam, room.id, iso(ctx, start)));
    previousEnd = start + exam.durationMinutes * MINUTE;
  }
  if (changes.length === 0) return null;
  const first = changes[0]!;
  const lastEnd = DateTime.fromISO(ctx.plan.date, { zone: ctx.zone }).plus({ days: 1 }).toMillis();
  if (changes.some((c) => ms(c.to.start) + room.exams.find((e) => e.id === c.examId)!.durationMinutes * MINUTE > lastEnd)) return null;
  const later = Math.round((ms(first.to.start) - ms(first.from.start)) / MINUTE);
  return evaluate(ctx, 'push-later', gap, changes, `Start ${first.accession} ${later} min later, at ${hhmm(ctx, ms(first.to.start))}`, (after) => {
    const cascade = changes.length > 1 ? ` and ${changes.length - 1} later exam${changes.length > 2 ? 's' : ''} in ${room.name} move too` : '';
    const end = Math.max(...after.rooms.filter((r) => r.id === room.id).map(dayEnd));
    return `${first.accession} moves${cascade}; ${room.name}'s last exam then ends at ${hhmm(ctx, end)} (was ${hhmm(ctx, dayEnd(room))}).`;
  });
}

function otherRoom(ctx: Ctx, room: PlanRoom, gap: PlanGap): Fix | null {
  const exam = room.exams.find((e) => e.id === gap.toExamId)!;
  for (const candidate of ctx.plan.rooms) {
    if (candidate.id === room.id || candidate.modality !== room.modality) continue;
    const fix = evaluate(ctx, 'other-room', gap, [move(exam, candidate.id, exam.start)], `Move ${exam.accession} to ${candidate.name} at the same time`, (_after, focus) =>
      `${exam.accession} keeps its ${hhmm(ctx, ms(exam.start))} start in ${candidate.name}; its turnover there ${focus!.verdict === 'fits' ? 'fits' : `is ${focus!.verdict}`}.`,
    );
    if (fix && fix.effect.newProblems === 0 && !isProblem({ verdict: fix.effect.verdictAfter } as PlanGap)) return fix;
  }
  return null;
}

function addHelper(ctx: Ctx, room: PlanRoom, gap: PlanGap): Fix | null {
  if (gap.staff >= MAX_STAFF) return null;
  const accession = room.exams.find((e) => e.id === gap.toExamId)!.accession;
  const current = ctx.input.staffOverrides?.[gap.toExamId] ?? null;
  const fix = evaluate(ctx, 'add-helper', gap, [{ type: 'staffing', toExamId: gap.toExamId, accession, from: current, to: gap.staff + 1 }], `Add a helper before ${accession} (${gap.staff + 1} people)`, (_after, focus) =>
    focus!.requiredMinutes < gap.requiredMinutes
      ? `The turnover takes ${focus!.requiredMinutes} min instead of ${gap.requiredMinutes}${isProblem(focus) ? `; still short by ${focus!.shortByMinutes} min` : ''}.`
      : 'A second person does not shorten this turnover (it is waiting on drying or the air hold).',
  );
  return fix && fix.effect.shortByAfter < gap.shortByMinutes ? fix : null;
}

function isolationLast(ctx: Ctx, room: PlanRoom, gap: PlanGap): Fix | null {
  const leaving = room.exams.find((e) => e.id === gap.fromExamId);
  const last = room.exams.at(-1)!;
  if (!leaving || leaving.precaution === 'none' || leaving.id === last.id) return null;
  // first place it right after the last exam to learn the turnover it needs, then leave that gap
  const probe = computeDayPlan(withChanges(ctx.input, [move(leaving, room.id, last.end)]));
  const needed = probe.rooms.find((r) => r.id === room.id)!.gaps.find((g) => g.toExamId === leaving.id)!.requiredMinutes;
  const start = ms(last.end) + (needed + ctx.margin) * MINUTE;
  if (start + leaving.durationMinutes * MINUTE > DateTime.fromISO(ctx.plan.date, { zone: ctx.zone }).plus({ days: 1 }).toMillis()) return null;
  const changes = [move(leaving, room.id, iso(ctx, start))];
  return evaluate(ctx, 'isolation-last', gap, changes, `Move the ${leaving.precaution}-precaution case ${leaving.accession} to the end of ${room.name}'s list`, (after) => {
    const end = Math.max(...after.rooms.filter((r) => r.id === room.id).map(dayEnd));
    return `${leaving.accession} then starts at ${hhmm(ctx, start)} after ${last.accession}; ${room.name}'s day ends at ${hhmm(ctx, end)}. Isolation cases last is common practice, leaving time for the terminal clean.`;
  });
}
