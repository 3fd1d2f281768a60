import type { Product, Protocol, TurnoverExam, TurnoverPlan, TurnoverRoom, TurnoverRules } from './model';
import { solveTurnover, type TurnoverSolver } from './solver';
import { buildOpeningStepSet, buildStepSet } from './step-set';

export interface PlanTurnoverOptions {
  /** The leaving exam A, or null for the room's opening (the day's first gap). */
  leaving: TurnoverExam | null;
  arriving: TurnoverExam;
  room: TurnoverRoom;
  protocol: Protocol;
  products: readonly Product[];
  rules?: TurnoverRules;
  /** People on this turnover; default the room's staff. */
  staff?: number;
  /** A solver with its own cache; default the shared one. */
  solver?: TurnoverSolver;
}

/**
 * One gap's turnover, ready to show: the optimal steps and required = max(schedule, air hold).
 * The client calls this for live previews while a slot is dragged; the day plan calls it per gap.
 *
 * @throws what {@link buildStepSet} and {@link solveTurnover} throw on invalid input
 * @example
 * planTurnover({ leaving: a, arriving: b, room: { staff: 1, airChangesPerHour: 6, modality: 'MR' },
 *   protocol: MR_PROTOCOL, products }).requiredMinutes; // 20 when neither exam is special
 */
export function planTurnover(options: PlanTurnoverOptions): TurnoverPlan {
  const set = options.leaving
    ? buildStepSet({ ...options, leaving: options.leaving })
    : buildOpeningStepSet(options);
  const input = { steps: set.steps, staff: set.staff };
  const schedule = options.solver ? options.solver.solve(input) : solveTurnover(input);
  return {
    requiredMinutes: Math.max(schedule.requiredMinutes, set.airHoldMinutes),
    scheduleMinutes: schedule.requiredMinutes,
    airHoldMinutes: set.airHoldMinutes,
    staff: set.staff,
    steps: schedule.steps,
  };
}
