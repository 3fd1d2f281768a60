import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { Refusal } from '../errors';
import { appendContactAchieved, appendLog } from './cleaning-log';
import type { TurnoverRecord } from './room-day';
import { assertOpen, loadTurnover, localIso, turnoverLogFields, type TurnoverRef } from './turnovers';
import { planRoomTurnover, type PlannedStep } from './turnover-plan';
import type { UserRecord } from './users';

const MINUTE = 60_000;

/**
 * Minutes each disinfected surface was left before it was next used: from the step's tick to
 * the first later tick of a step that needs it dry, or else the turnover's completion (the
 * next patient may use it from then on). Rounded down, so the log never claims more.
 */
export function contactAchieved(steps: readonly PlannedStep[], record: TurnoverRecord, completedMs: number): Map<string, number> {
  const achieved = new Map<string, number>();
  for (const step of steps) {
    const tick = record.ticks.get(step.key);
    if (!tick || step.productKey === null || tick.productKey === null) continue;
    const uses = steps
      .filter((s) => s.needs.some((n) => n.key === step.key && n.dry))
      .map((s) => record.ticks.get(s.key)?.doneMs)
      .filter((ms): ms is number => ms !== undefined && ms >= tick.doneMs);
    const usedMs = Math.min(completedMs, ...uses);
    achieved.set(step.key, Math.floor((usedMs - tick.doneMs) / MINUTE));
  }
  return achieved;
}

/**
 * "Turnover complete": every step ticked and, after an airborne case, the air hold over (or
 * an explicit override reason). The room shows `ready`; the log gets the completion entry
 * and the contact time each surface achieved.
 */
export async function completeTurnover(db: Knex, turnoverId: number, overrideReason: string | undefined, user: UserRecord, now: Date): Promise<TurnoverRef> {
  const { roomDay, record, leavingIndex, accession } = await loadTurnover(db, turnoverId);
  const { zone } = roomDay;
  assertOpen(record, zone);
  const planned = planRoomTurnover(roomDay, leavingIndex, record.examEndedMs);
  const missing = planned.steps.filter((s) => !record.ticks.has(s.key));
  if (missing.length > 0) {
    throw new Refusal('steps_missing', `Not every step is done: ${missing.map((s) => `"${s.label}"`).join(', ')}.`, {
      missing: missing.map((s) => s.key),
      problems: missing.map((s) => ({ field: s.key, message: 'not done yet' })),
    });
  }
  const nowMs = now.getTime();
  const reason = overrideReason?.trim() || null;
  const holdUntilMs = record.examEndedMs + planned.airHoldMinutes * MINUTE;
  const holding = planned.airHoldMinutes > 0 && holdUntilMs > nowMs;
  // Ready means the next patient may touch every surface: one still wet has not had its contact time.
  const wet = [...record.ticks.values()].filter((tick) => tick.doneMs + tick.waitMinutes * MINUTE > nowMs);
  const early = holding || wet.length > 0;
  if (early && !reason) {
    const hhmm = (ms: number) => DateTime.fromMillis(ms, { zone }).toFormat('HH:mm');
    const labels = new Map(planned.steps.map((s) => [s.key, s.label]));
    const why = [
      ...(holding ? [`the air hold lasts until ${hhmm(holdUntilMs)}`] : []),
      ...wet.map((tick) => `"${labels.get(tick.key) ?? tick.key}" stays wet until ${hhmm(tick.doneMs + tick.waitMinutes * MINUTE)}`),
    ];
    const message = `Not ready yet: ${why.join('; ')}. Give an override reason to make the room ready before then.`;
    const problems = [{ field: 'overrideReason', message: 'needed during the air hold or while a surface is wet' }];
    const wetKeys = wet.map((tick) => tick.key);
    if (holding) {
      const until = DateTime.fromMillis(holdUntilMs, { zone }).toISO({ suppressMilliseconds: true })!;
      throw new Refusal('air_hold', message, { until, airHoldUntil: until, wet: wetKeys, problems });
    }
    const wetUntil = DateTime.fromMillis(Math.max(...wet.map((tick) => tick.doneMs + tick.waitMinutes * MINUTE)), { zone }).toISO({ suppressMilliseconds: true })!;
    throw new Refusal('surface_wet', message, { wet: wetKeys, wetUntil, problems });
  }
  const at = localIso(now, zone);
  const achieved = contactAchieved(planned.steps, record, nowMs);
  await db.transaction(async (trx) => {
    const updated = await trx('turnovers')
      .where({ id: turnoverId })
      .whereNull('completed_at')
      // the clean type is final once closed: it is what the room had by then (see liveCleanTypes)
      .update({ completed_at: at, completed_ms: nowMs, completed_by: user.id, override_reason: early ? reason : null, clean_type: record.cleanType });
    if (updated === 0) assertOpen({ ...record, completedAt: at }, zone);
    const entries: { id: number; step_key: string }[] = await trx('cleaning_log').where({ turnover_id: turnoverId, kind: 'step' }).select('id', 'step_key');
    await appendContactAchieved(
      trx,
      entries.filter((e) => achieved.has(e.step_key)).map((e) => ({ entryId: e.id, minutes: achieved.get(e.step_key)! })),
      at,
    );
    await appendLog(
      trx,
      {
        ...turnoverLogFields(roomDay, record, accession, at, nowMs),
        kind: 'turnover complete',
        earlyReason: early ? reason : null,
      },
      user,
    );
  });
  return { turnoverId, roomId: roomDay.room.id, day: roomDay.day };
}
