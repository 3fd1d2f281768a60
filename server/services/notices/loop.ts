import type { Knex } from 'knex';
import type { Clock } from '../../clock';
import { NOTICE_PASS_LOCK, onceAcrossProcesses } from '../../db';
import type { Mailer } from '../mail/mailer';
import type { NoticeContext } from './render';
import { sendDue, type SendOptions } from './sender';
import { queueMoveNotices } from './slot-moves';
import { queueDayBeforeNotices } from './day-before';
import { queueWeeklySummaries } from './weekly-summary';

export const NOTICE_LOOP_MS = 30_000;

/**
 * One pass of the sender loop: queue the closed batches of slot moves, the day-before notice once
 * its time has come and the weekly summary on Mondays (each keyed by its day or week, so a pass
 * queues nothing twice), then send what is due.
 * Tests call it (or `sendDue`) directly with their own clock instead of waiting on the timer.
 */
export async function runNotices(db: Knex, mailer: Mailer, ctx: NoticeContext, now: Date, options: Partial<SendOptions> = {}): Promise<void> {
  const transport = await mailer.transport();
  if (!transport) return;
  await queueMoveNotices(db, ctx, now);
  await queueDayBeforeNotices(db, ctx, now);
  await queueWeeklySummaries(db, ctx, now);
  await sendDue(db, transport, now, { fallbackSender: mailer.delivery === 'demo-server' ? 'notices@turnwise.invalid' : undefined, ...options });
}

/**
 * The timer started by the server's main: a pass every {@link NOTICE_LOOP_MS}, never two at
 * once (in this process, nor across processes on PostgreSQL), off the request path. Its errors are logged, never thrown. Returns its stop.
 */
export function startNoticeLoop(db: Knex, mailer: Mailer, ctx: NoticeContext, clock: Clock, logError: (err: unknown) => void): () => Promise<void> {
  let running: Promise<void> | null = null;
  const pass = () => {
    if (running) return;
    // with several server processes on PostgreSQL, one of them makes each pass
    running = onceAcrossProcesses(db, NOTICE_PASS_LOCK, () => runNotices(db, mailer, ctx, clock.now()))
      .then(() => undefined)
      .catch(logError)
      .finally(() => {
        running = null;
      });
  };
  const timer = setInterval(pass, NOTICE_LOOP_MS);
  timer.unref();
  setImmediate(pass);
  return async () => {
    clearInterval(timer);
    await running;
  };
}
