import type { Knex } from 'knex';
import type { LogEntry } from '../../shared/api/board';
import { NotFoundError } from '../errors';
import type { UserRecord } from './users';

/** What a caller states in a new log entry; the user's names and the time are added here. */
export interface NewLogEntry {
  at: string;
  atMs: number;
  day: string;
  roomId: number;
  roomName: string;
  turnoverId?: number | null;
  examAccession: string | null;
  cleanType: LogEntry['cleanType'];
  kind: LogEntry['kind'];
  stepKey?: string | null;
  stepLabel?: string | null;
  productKey?: string | null;
  productName?: string | null;
  contactRequiredMinutes?: number | null;
  earlyReason?: string | null;
  note?: string | null;
  correctsId?: number | null;
}

/** Appends one entry (inside the caller's transaction when given one) and returns its id. */
export async function appendLog(db: Knex, entry: NewLogEntry, user: UserRecord): Promise<number> {
  const [{ id }] = await db('cleaning_log').insert({
    at: entry.at,
    at_ms: entry.atMs,
    day: entry.day,
    room_id: entry.roomId,
    room_name: entry.roomName,
    turnover_id: entry.turnoverId ?? null,
    exam_accession: entry.examAccession,
    clean_type: entry.cleanType,
    kind: entry.kind,
    step_key: entry.stepKey ?? null,
    step_label: entry.stepLabel ?? null,
    product_key: entry.productKey ?? null,
    product_name: entry.productName ?? null,
    contact_required_minutes: entry.contactRequiredMinutes ?? null,
    early_reason: entry.earlyReason ?? null,
    note: entry.note ?? null,
    corrects_id: entry.correctsId ?? null,
    user_id: user.id,
    username: user.username,
    display_name: user.displayName || user.username,
  }).returning('id');
  return id as number;
}

/**
 * Records the contact time each step achieved, once its turnover completes: the step's entry
 * stays as written and the log read joins these minutes onto it.
 */
export async function appendContactAchieved(db: Knex, achieved: { entryId: number; minutes: number }[], at: string): Promise<void> {
  if (achieved.length === 0) return;
  await db('cleaning_log_contact').insert(achieved.map((a) => ({ entry_id: a.entryId, achieved_minutes: a.minutes, recorded_at: at })));
}

export interface LogFilter {
  day?: string;
  roomId?: number;
  username?: string;
  turnoverId?: number;
  id?: number;
}

/** A log entry as the API answers it: the contract's fields plus the turnover it belongs to. */
export type LoggedEntry = LogEntry & { turnoverId: number | null };

/** Entries newest first, with contact achieved joined on. */
export async function listLog(db: Knex, filter: LogFilter = {}, limit = 5000): Promise<LoggedEntry[]> {
  const query = db('cleaning_log as l')
    .leftJoin('cleaning_log_contact as c', 'c.entry_id', 'l.id')
    // which protocol version the entry's turnover was planned with
    .leftJoin('turnovers as t', 't.id', 'l.turnover_id')
    .leftJoin('protocol_versions as pv', 'pv.id', 't.protocol_version_id')
    .select('l.*', 'c.achieved_minutes', 'pv.modality as protocol_modality', 'pv.version as protocol_version', 'pv.effective_from as protocol_effective_from')
    .orderBy([{ column: 'l.at_ms', order: 'desc' }, { column: 'l.id', order: 'desc' }])
    .limit(limit);
  if (filter.id !== undefined) query.where('l.id', filter.id);
  if (filter.day) query.where('l.day', filter.day);
  if (filter.roomId !== undefined) query.where('l.room_id', filter.roomId);
  if (filter.username) query.whereRaw('lower(l.username) = lower(?)', [filter.username]);
  if (filter.turnoverId !== undefined) query.where('l.turnover_id', filter.turnoverId);
  return (await query).map(toLogEntry);
}

/** A correction: a new entry that points at the one it corrects and copies what it is about. */
export async function correctLog(db: Knex, id: number, note: string, user: UserRecord, now: { at: string; atMs: number }): Promise<LoggedEntry> {
  const [old] = await listLog(db, { id });
  if (!old) throw new NotFoundError(`No log entry ${id}.`);
  const newId = await appendLog(
    db,
    {
      ...now,
      day: old.day,
      roomId: old.roomId,
      roomName: old.roomName,
      turnoverId: old.turnoverId,
      examAccession: old.examAccession,
      cleanType: old.cleanType,
      kind: 'correction',
      stepKey: old.stepKey,
      stepLabel: old.stepLabel,
      note,
      correctsId: old.id,
    },
    user,
  );
  return (await listLog(db, { id: newId }))[0]!;
}

interface LogRow {
  id: number;
  at: string;
  day: string;
  room_id: number;
  room_name: string;
  exam_accession: string | null;
  clean_type: LogEntry['cleanType'];
  kind: LogEntry['kind'];
  step_key: string | null;
  step_label: string | null;
  product_name: string | null;
  contact_required_minutes: number | null;
  achieved_minutes: number | null;
  early_reason: string | null;
  note: string | null;
  corrects_id: number | null;
  username: string;
  display_name: string;
  turnover_id: number | null;
  protocol_modality: string | null;
  protocol_version: number | null;
  protocol_effective_from: string | null;
}

function toLogEntry(row: LogRow): LoggedEntry {
  return {
    id: row.id,
    at: row.at,
    day: row.day,
    roomId: row.room_id,
    roomName: row.room_name,
    examAccession: row.exam_accession,
    cleanType: row.clean_type,
    kind: row.kind,
    stepKey: row.step_key,
    stepLabel: row.step_label,
    productName: row.product_name,
    contactRequiredMinutes: row.contact_required_minutes,
    contactAchievedMinutes: row.achieved_minutes ?? null,
    earlyReason: row.early_reason,
    note: row.note,
    correctsId: row.corrects_id,
    username: row.username,
    displayName: row.display_name,
    turnoverId: row.turnover_id,
    protocol:
      row.protocol_version === null || row.protocol_version === undefined
        ? null
        : { modality: row.protocol_modality!, version: Number(row.protocol_version), effectiveFrom: row.protocol_effective_from! },
  };
}
