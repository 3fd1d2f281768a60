import type { PlanExam, PlanGap, PlanStep } from './day-plan-types';
import type { DayPlanExam } from './day-plan-input';
import type { TurnoverPlan } from './model';
import type { GapVerdict } from './verdict';
import type { ZonedFormatter } from './zoned-time';

const MINUTE = 60_000;

/** An exam placed in real time: its start and end instants. */
export interface DayPlanSlot {
  exam: DayPlanExam;
  startMs: number;
  endMs: number;
}

/**
 * A judged gap as the plan shows it: each step's start, end and dry-at as site clock times.
 * Positional rather than an options object: it runs for each of a big day's 10,000 gaps, and
 * every object it does not allocate is one the garbage collector does not copy.
 *
 * @example
 * toPlanGap(previous, slot, fromMs, turnover, 25, { verdict: 'fits', shortByMinutes: 0 }, format).readyAt;
 * // '2027-03-15T08:20:00-05:00'
 */
export function toPlanGap(
  previous: DayPlanSlot | null,
  slot: DayPlanSlot,
  fromMs: number,
  turnover: TurnoverPlan,
  availableMinutes: number,
  judged: GapVerdict,
  format: ZonedFormatter,
): PlanGap {
  // Plain loop, no closures: this runs ~130,000 times for a 10,000-exam day.
  const steps: PlanStep[] = new Array<PlanStep>(turnover.steps.length);
  for (let i = 0; i < steps.length; i++) {
    const s = turnover.steps[i];
    steps[i] = {
      key: s.key,
      label: s.label,
      start: format(fromMs + s.start * MINUTE),
      end: format(fromMs + s.end * MINUTE),
      dryAt: format(fromMs + s.dryAt * MINUTE),
      person: s.person,
    };
  }
  return {
    fromExamId: previous ? previous.exam.id : null,
    toExamId: slot.exam.id,
    availableMinutes,
    requiredMinutes: turnover.requiredMinutes,
    verdict: judged.verdict,
    shortByMinutes: judged.shortByMinutes,
    readyAt: format(fromMs + turnover.requiredMinutes * MINUTE),
    airHoldMinutes: turnover.airHoldMinutes,
    staff: turnover.staff,
    steps,
  };
}

/**
 * An exam as the plan shows it, with its start and end as site clock times.
 *
 * @example
 * toPlanExam({ exam, startMs, endMs }, format, false).end; // '2027-03-15T08:30:00-05:00'
 */
export function toPlanExam({ exam, startMs, endMs }: DayPlanSlot, format: ZonedFormatter, outsideHours: boolean): PlanExam {
  return {
    id: exam.id,
    accession: exam.accession,
    roomId: exam.roomId,
    start: format(startMs),
    end: format(endMs),
    durationMinutes: exam.durationMinutes,
    procedure: exam.procedure,
    coil: exam.coil ?? null,
    precaution: exam.precaution,
    mobility: exam.mobility,
    contrast: exam.contrast,
    notes: exam.notes ?? null,
    version: exam.version,
    outsideHours,
    ...(exam.pinned ? { pinned: true } : {}),
  };
}
