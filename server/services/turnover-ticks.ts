import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { appendLog } from './cleaning-log';
import { assertOpen, loadTurnover, localIso, turnoverLogFields, type TurnoverRef } from './turnovers';
import { activeProducts, planRoomTurnover, productOf } from './turnover-plan';
import type { UserRecord } from './users';

const MINUTE = 60_000;

export interface StepTickInput {
  productKey?: string;
  earlyReason?: string;
}

/**
 * Ticks a step of an open turnover at `now`, with the product used (default the protocol's)
 * and logs it. The steps it needs must be ticked first; a step it needs dry that is still wet
 * (tick + that step's wait after now) is only passed over with a reason, which is logged.
 */
export async function tickStep(db: Knex, turnoverId: number, key: string, input: StepTickInput, user: UserRecord, now: Date): Promise<TurnoverRef> {
  const { roomDay, record, leavingIndex, accession } = await loadTurnover(db, turnoverId);
  const { zone } = roomDay;
  assertOpen(record, zone);
  const planned = planRoomTurnover(roomDay, leavingIndex, record.examEndedMs);
  const step = planned.steps.find((s) => s.key === key);
  if (!step) throw new NotFoundError(`This turnover has no step "${key}".`);
  const labelOf = (k: string) => planned.steps.find((s) => s.key === k)?.label ?? k;
  const done = record.ticks.get(key);
  if (done) throw new Refusal('already_done', `"${step.label}" was already ticked at ${DateTime.fromISO(done.doneAt, { zone }).toFormat('HH:mm')} by ${done.by}.`, { at: done.doneAt, by: done.by });

  const notYet = step.needs.filter((n) => !record.ticks.has(n.key));
  if (notYet.length > 0) {
    throw new Refusal('steps_missing', `Tick ${notYet.map((n) => `"${labelOf(n.key)}"`).join(', ')} first.`, {
      missing: notYet.map((n) => n.key),
      problems: notYet.map((n) => ({ field: n.key, message: 'not done yet' })),
    });
  }
  const nowMs = now.getTime();
  const wet = step.needs
    .filter((n) => n.dry)
    .map((n) => {
      const tick = record.ticks.get(n.key)!;
      return { key: n.key, untilMs: tick.doneMs + tick.waitMinutes * MINUTE };
    })
    .filter((w) => w.untilMs > nowMs);
  const earlyReason = input.earlyReason?.trim() || null;
  if (wet.length > 0 && !earlyReason) {
    const untilMs = Math.max(...wet.map((w) => w.untilMs));
    const until = DateTime.fromMillis(untilMs, { zone });
    throw new Refusal(
      'surface_wet',
      `${wet.map((w) => `"${labelOf(w.key)}"`).join(', ')} stays wet until ${until.toFormat('HH:mm:ss')}; give a reason to tick "${step.label}" early.`,
      { wet: wet.map((w) => w.key), wetUntil: until.toISO({ suppressMilliseconds: true })!, problems: [{ field: 'earlyReason', message: 'needed while a surface is wet' }] },
    );
  }

  let productKey = step.productKey;
  if (input.productKey !== undefined) {
    if (step.productKey === null) throw new ValidationError(`"${step.label}" uses no product.`, { problems: [{ field: 'productKey', message: 'this step disinfects nothing' }] });
    const choices = activeProducts(roomDay.setup);
    if (!choices.some((p) => p.key === input.productKey)) {
      throw new ValidationError(`Unknown product "${input.productKey}"; use one of ${choices.map((p) => `${p.key} (${p.name})`).join(', ')}.`, { problems: [{ field: 'productKey', message: 'unknown product' }] });
    }
    productKey = input.productKey;
  }
  const product = productOf(roomDay.setup, productKey);
  // a reason is only part of the record when something was in fact still wet
  const reason = wet.length > 0 ? earlyReason : null;
  const at = localIso(now, zone);
  await db.transaction(async (trx) => {
    try {
      await trx('turnover_steps').insert({
        turnover_id: turnoverId,
        step_key: key,
        done_at: at,
        done_ms: nowMs,
        user_id: user.id,
        product_key: productKey,
        wait_minutes: (product?.contactMinutes ?? 0) + step.dryMinutes,
        early_reason: reason,
      });
    } catch (err) {
      if (/UNIQUE/i.test(String(err))) throw new Refusal('already_done', `"${step.label}" was just ticked by someone else.`, { at });
      throw err;
    }
    await appendLog(
      trx,
      {
        ...turnoverLogFields(roomDay, record, accession, at, nowMs),
        kind: 'step',
        stepKey: key,
        stepLabel: step.label,
        productKey,
        productName: product?.name ?? null,
        contactRequiredMinutes: product?.contactMinutes ?? null,
        earlyReason: reason,
      },
      user,
    );
  });
  return { turnoverId, roomId: roomDay.room.id, day: roomDay.day };
}
