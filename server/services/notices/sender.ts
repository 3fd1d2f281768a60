import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { NoticeTransport } from '../mail/mailer';
import { readSettings } from '../settings';

export interface SendOptions {
  /** Attempts before a notice is `failed` for good. */
  maxAttempts: number;
  /** First retry after this many minutes; each further one waits twice as long. */
  backoffMinutes: number;
  /** A `sending` row claimed longer ago than this was cut off (a crash) and is tried again. */
  staleSendingMinutes: number;
  /** Notices per run. */
  batchSize: number;
  /** From address when Setup has none (the demo mail server only). */
  fallbackSender?: string;
}

export const SEND_DEFAULTS: SendOptions = { maxAttempts: 5, backoffMinutes: 1, staleSendingMinutes: 10, batchSize: 20 };

export interface SendReport {
  sent: number;
  retrying: number;
  failed: number;
}

interface NoticeRow {
  id: number;
  idempotency_key: string;
  recipients: string;
  subject: string;
  text: string;
  html: string;
  unsubscribe_url: string | null;
  attempts: number;
}

/** Minutes to wait after the n-th failed attempt (1-based): backoff, 2×, 4×, … */
export function retryDelayMinutes(attempt: number, backoffMinutes: number): number {
  return backoffMinutes * 2 ** Math.max(0, attempt - 1);
}

/**
 * Sends what is due: claims rows in a transaction (`queued` and due, or `sending` and stale),
 * counting the attempt as it claims, then sends each and records the outcome. A second sender
 * running at once claims other rows or none. Each message's Message-ID comes from its
 * idempotency key, so a notice retried after a crash between the SMTP answer and the `sent`
 * mark reaches mail clients as the same message.
 */
export async function sendDue(db: Knex, transport: NoticeTransport, now: Date, options: Partial<SendOptions> = {}): Promise<SendReport> {
  const o = { ...SEND_DEFAULTS, ...options };
  const nowIso = now.toISOString();
  const staleBefore = new Date(now.getTime() - o.staleSendingMinutes * 60_000).toISOString();
  const claimed: NoticeRow[] = await db.transaction(async (trx) => {
    const rows: NoticeRow[] = await trx('notices')
      .where((q) => q.where('status', 'queued').andWhere('next_attempt_at', '<=', nowIso))
      .orWhere((q) => q.where('status', 'sending').andWhere('claimed_at', '<=', staleBefore))
      .orderBy('next_attempt_at')
      .orderBy('id')
      .limit(o.batchSize)
      .select('id', 'idempotency_key', 'recipients', 'subject', 'text', 'html', 'unsubscribe_url', 'attempts');
    for (const row of rows) {
      await trx('notices').where({ id: row.id }).update({ status: 'sending', claimed_at: nowIso, attempts: row.attempts + 1 });
      row.attempts += 1;
    }
    return rows;
  });
  const report: SendReport = { sent: 0, retrying: 0, failed: 0 };
  if (claimed.length === 0) return report;
  const from = (await readSettings(db)).noticesSender || o.fallbackSender || '';
  for (const row of claimed) {
    try {
      if (!from) throw new Error('No sender address: set "Notices are sent from" in Setup → Site.');
      await transport.sendMail({
        from,
        to: JSON.parse(row.recipients) as string[],
        subject: row.subject,
        text: row.text,
        html: row.html,
        messageId: `<${createHash('sha256').update(row.idempotency_key).digest('hex').slice(0, 32)}@turnwise.notices>`,
        headers: row.unsubscribe_url ? { 'List-Unsubscribe': `<${row.unsubscribe_url}>` } : undefined,
      });
      await db('notices').where({ id: row.id, status: 'sending' }).update({ status: 'sent', sent_at: now.toISOString(), last_error: null });
      report.sent++;
    } catch (err) {
      const error = errorText(err);
      if (row.attempts >= o.maxAttempts) {
        await db('notices').where({ id: row.id }).update({ status: 'failed', last_error: error });
        report.failed++;
      } else {
        const next = new Date(now.getTime() + retryDelayMinutes(row.attempts, o.backoffMinutes) * 60_000);
        await db('notices').where({ id: row.id }).update({ status: 'queued', next_attempt_at: next.toISOString(), last_error: error });
        report.retrying++;
      }
    }
  }
  return report;
}

/** What the Outbox shows: the SMTP answer or the reason, never a stack. */
function errorText(err: unknown): string {
  const e = err as { response?: string; message?: string; code?: string };
  const text = e.response || e.message || String(err);
  return (e.code && !text.includes(e.code) ? `${e.code}: ${text}` : text).slice(0, 1000);
}
