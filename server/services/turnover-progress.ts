import type { RoomState } from '../../shared/api/board';
import type { TurnoverRecord } from './room-day';
import type { PlannedTurnover, PlannedStep } from './turnover-plan';

const MINUTE = 60_000;

export interface TurnoverProgress {
  state: Extract<RoomState, 'turning over' | 'drying' | 'air hold' | 'ready'>;
  /** Exact once every step is ticked; an estimate before, moving later while work is behind. */
  readyAtMs: number;
  /**
   * Ready-at as planned from the recorded end, moved only by what happened (a tick's wait, the
   * air hold), never by the clock: once now is past it the turnover is overdue.
   */
  plannedReadyAtMs: number;
  airHoldUntilMs: number | null;
  /** Until when each ticked step's surface stays wet, by step key. */
  wetUntilMs: Map<string, number>;
  missing: PlannedStep[];
}

/**
 * Where a recorded turnover stands at `nowMs`, from what actually happened: the actual end
 * (air hold), each tick's time and the wait of the product used.
 *
 * - complete → `ready` (ready-at = completion);
 * - steps left → `turning over`; ready-at estimated by shifting the planned remaining steps
 *   to start now (never earlier than a surface already wet or the air hold);
 * - all ticked → exact ready-at = the latest dry-at and the air hold's end; `air hold` while
 *   the hold lasts, else `drying` while a surface is wet, else still `turning over` until a
 *   technologist confirms "turnover complete" (the front desk should not send a patient in
 *   on the strength of a timer alone).
 */
export function turnoverProgress(planned: PlannedTurnover, record: TurnoverRecord, nowMs: number): TurnoverProgress {
  const airHoldUntilMs = planned.airHoldMinutes > 0 ? record.examEndedMs + planned.airHoldMinutes * MINUTE : null;
  const wetUntilMs = new Map<string, number>();
  for (const tick of record.ticks.values()) wetUntilMs.set(tick.key, tick.doneMs + tick.waitMinutes * MINUTE);
  const missing = planned.steps.filter((s) => !record.ticks.has(s.key));
  const known = Math.max(airHoldUntilMs ?? -Infinity, ...wetUntilMs.values(), ...[...record.ticks.values()].map((t) => t.doneMs), record.examEndedMs);

  if (record.completedMs !== null) return { state: 'ready', readyAtMs: record.completedMs, plannedReadyAtMs: record.completedMs, airHoldUntilMs, wetUntilMs, missing };
  if (missing.length > 0) {
    const shift = nowMs - Math.min(...missing.map((s) => s.startMs));
    const remaining = Math.max(...missing.map((s) => Math.max(s.endMs, s.dryAtMs) + shift));
    const planned = Math.max(known, ...missing.map((s) => Math.max(s.endMs, s.dryAtMs)));
    return { state: 'turning over', readyAtMs: Math.max(known, remaining, nowMs), plannedReadyAtMs: planned, airHoldUntilMs, wetUntilMs, missing };
  }
  const state = airHoldUntilMs !== null && airHoldUntilMs > nowMs ? 'air hold' : known > nowMs ? 'drying' : 'turning over';
  return { state, readyAtMs: known, plannedReadyAtMs: known, airHoldUntilMs, wetUntilMs, missing };
}

/**
 * The plan as the checklist shows it at `nowMs`: steps not yet ticked that were planned in the
 * past (a late start, a slow step) move on together so the first of them starts now, in whole
 * minutes, keeping their order and the waits between them. Ticked steps keep their plan.
 * A completed turnover is history and is not moved.
 */
export function replanFromNow(planned: PlannedTurnover, record: TurnoverRecord | null, nowMs: number): { steps: PlannedStep[]; shiftMs: number } {
  if (record?.completedMs != null) return { steps: planned.steps, shiftMs: 0 };
  const missing = planned.steps.filter((s) => !record?.ticks.has(s.key));
  if (missing.length === 0) return { steps: planned.steps, shiftMs: 0 };
  const shiftMs = Math.ceil(Math.max(0, nowMs - Math.min(...missing.map((s) => s.startMs))) / MINUTE) * MINUTE;
  if (shiftMs === 0) return { steps: planned.steps, shiftMs };
  const moved = (s: PlannedStep): PlannedStep => ({ ...s, startMs: s.startMs + shiftMs, endMs: s.endMs + shiftMs, dryAtMs: s.dryAtMs + shiftMs });
  return { steps: planned.steps.map((s) => (record?.ticks.has(s.key) ? s : moved(s))), shiftMs };
}
