import type { Knex } from 'knex';
import type { NoticeKind } from '../../../shared/api/notices';

/** A message to queue: rendered already, to one recipient (so its unsubscribe link is theirs). */
export interface NewNotice {
  /** Unique per message: queuing the same key again does nothing. */
  key: string;
  kind: NoticeKind;
  userId: number;
  to: string;
  subject: string;
  text: string;
  html: string;
  unsubscribeUrl: string | null;
  /** Not before (a batch waiting for its window); defaults to `now`. */
  notBefore?: Date;
}

/**
 * Adds notices to the queue, skipping any whose idempotency key is already there. Returns how
 * many were added. One statement per notice inside one transaction.
 */
export async function queueNotices(db: Knex, notices: NewNotice[], now: Date): Promise<number> {
  if (notices.length === 0) return 0;
  return db.transaction(async (trx) => {
    let added = 0;
    for (const n of notices) {
      const inserted = await trx('notices')
        .insert({
          idempotency_key: n.key.slice(0, 200),
          kind: n.kind,
          user_id: n.userId,
          recipients: JSON.stringify([n.to]),
          subject: n.subject.slice(0, 300),
          text: n.text,
          html: n.html,
          unsubscribe_url: n.unsubscribeUrl,
          status: 'queued',
          attempts: 0,
          next_attempt_at: (n.notBefore ?? now).toISOString(),
          created_at: now.toISOString(),
        })
        .onConflict('idempotency_key')
        .ignore()
        // an ignored row returns nothing, on SQLite and PostgreSQL alike
        .returning('id');
      added += inserted.length;
    }
    return added;
  });
}
