import type { Knex } from 'knex';
import { HL7_LOG_KEEP_DAYS, type Hl7AckCode, type Hl7LogEntry, type Hl7LogMessage, type Hl7LogQuery } from '../../../shared/api/hl7';
import { NotFoundError } from '../../errors';

/**
 * Segments that name or identify a patient, dropped before a message is stored: PID (name,
 * birth date, identifiers) and its company PD1, NK1 (next of kin), MRG, GT1 and IN1–IN3
 * (guarantor, insurance). Turnwise plans rooms by accession and never needs them.
 */
const PATIENT_SEGMENTS = new Set(['PID', 'PD1', 'NK1', 'MRG', 'GT1', 'IN1', 'IN2', 'IN3']);
/** A stored message is cut here (a booking message is a few hundred bytes; frames may be 1 MB). */
const RAW_MAX_CHARS = 64 * 1024;

export function withoutPatient(text: string): string {
  const kept = text.split('\r').filter((segment) => !PATIENT_SEGMENTS.has(segment.slice(0, 3).toUpperCase()));
  const raw = kept.join('\r');
  return raw.length > RAW_MAX_CHARS ? `${raw.slice(0, RAW_MAX_CHARS)}\r[cut at ${RAW_MAX_CHARS} characters]` : raw;
}

export interface LogRow {
  id: number;
  received_at: string;
  last_received_at: string;
  times_received: number;
  sender: string;
  control_id: string | null;
  message_type: string;
  sent_at: string | null;
  ack_code: Hl7AckCode;
  outcome: string;
  accession: string | null;
  day: string | null;
  change_id: number | null;
  after_manual_change: number | boolean;
  raw?: string;
}

const LIST_COLUMNS = ['id', 'received_at', 'last_received_at', 'times_received', 'sender', 'control_id', 'message_type', 'sent_at', 'ack_code', 'outcome', 'accession', 'day', 'change_id', 'after_manual_change'];

function toEntry(row: LogRow): Hl7LogEntry {
  return {
    id: row.id,
    receivedAt: row.received_at,
    lastReceivedAt: row.last_received_at,
    timesReceived: row.times_received,
    sender: row.sender,
    controlId: row.control_id,
    messageType: row.message_type,
    ackCode: row.ack_code,
    outcome: row.outcome,
    accession: row.accession,
    day: row.day,
    changeId: row.change_id,
    afterManualChange: Boolean(row.after_manual_change),
  };
}

/** The log, newest first, a page at a time; `before` is the next page's cursor. */
export async function listHl7Messages(db: Knex, query: Hl7LogQuery): Promise<{ messages: Hl7LogEntry[]; before: number | null }> {
  const q = db('hl7_messages').orderBy('id', 'desc').limit(query.limit + 1).select(LIST_COLUMNS);
  if (query.before) q.where('id', '<', query.before);
  if (query.ack) q.where({ ack_code: query.ack });
  const rows: LogRow[] = await q;
  const page = rows.slice(0, query.limit);
  return { messages: page.map(toEntry), before: rows.length > query.limit ? page[page.length - 1]!.id : null };
}

export async function readHl7Message(db: Knex, id: number): Promise<Hl7LogMessage> {
  const row = (await db<LogRow>('hl7_messages').where({ id }).first()) as LogRow | undefined;
  if (!row) throw new NotFoundError(`No HL7 message ${id}.`);
  return { ...toEntry(row), raw: row.raw ?? '' };
}

/** At most this many rows go per message received, so pruning a long-idle log is spread out, never one long delete. */
export const HL7_PRUNE_BATCH = 100;

/**
 * Drops messages first received more than {@link HL7_LOG_KEEP_DAYS} days before `now`, oldest
 * first and at most {@link HL7_PRUNE_BATCH} at a time. Ids rise with arrival, so the oldest rows
 * are found on the primary key alone. Answers how many went.
 */
export async function pruneHl7Log(db: Knex, now: Date): Promise<number> {
  const cutoff = new Date(now.getTime() - HL7_LOG_KEEP_DAYS * 24 * 60 * 60 * 1000).toISOString();
  const oldest: { id: number; received_at: string }[] = await db('hl7_messages').orderBy('id').limit(HL7_PRUNE_BATCH).select('id', 'received_at');
  const ids = oldest.filter((row) => row.received_at < cutoff).map((row) => row.id);
  if (ids.length > 0) await db('hl7_messages').whereIn('id', ids).delete();
  return ids.length;
}
