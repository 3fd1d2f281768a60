import type { Knex } from 'knex';
import type { NoticeKind, NoticeStatus, OutboxMessage, OutboxNotice } from '../../../shared/api/notices';
import { NotFoundError } from '../../errors';

interface Row {
  id: number;
  kind: NoticeKind;
  recipients: string;
  subject: string;
  status: NoticeStatus;
  attempts: number;
  last_error: string | null;
  created_at: string;
  sent_at: string | null;
  next_attempt_at: string;
  text?: string;
  html?: string;
}

const LIST_COLUMNS = ['id', 'kind', 'recipients', 'subject', 'status', 'attempts', 'last_error', 'created_at', 'sent_at', 'next_attempt_at'];

function toNotice(row: Row): OutboxNotice {
  return {
    id: row.id,
    kind: row.kind,
    to: JSON.parse(row.recipients) as string[],
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    lastError: row.last_error,
    createdAt: row.created_at,
    sentAt: row.sent_at,
    nextAttemptAt: row.next_attempt_at,
  };
}

/** The queue, newest first. */
export async function listOutbox(db: Knex, query: { status?: NoticeStatus; limit: number }): Promise<OutboxNotice[]> {
  const q = db('notices').orderBy('id', 'desc').limit(query.limit).select(LIST_COLUMNS);
  if (query.status) q.where({ status: query.status });
  return ((await q) as Row[]).map(toNotice);
}

export async function outboxMessage(db: Knex, id: number): Promise<OutboxMessage> {
  const row: Row | undefined = await db('notices').where({ id }).first([...LIST_COLUMNS, 'text', 'html']);
  if (!row) throw new NotFoundError(`No message ${id} in the outbox.`);
  return { ...toNotice(row), text: row.text ?? '', html: row.html ?? '' };
}
