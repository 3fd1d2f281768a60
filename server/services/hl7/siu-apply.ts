import type { Knex } from 'knex';
import type { ExamFormInput } from '../../../shared/api/changes';
import { AFTER_MANUAL_CHANGE } from '../../../shared/api/hl7';
import { Refusal } from '../../errors';
import { addExam, cancelExam, editExam } from '../exam-edits';
import type { ExamRow } from '../exams';
import type { Room } from '../../../shared/api/rooms';
import { listRooms } from '../rooms';
import { readSettings } from '../settings';
import { resolveStart } from '../../../shared/exam-list';
import { hl7Start } from './hl7-time';
import type { Hl7ErrorCode, SiuBooking } from './siu-read';

/** A message that is valid HL7 but cannot be applied: answered AE with `reason` as MSA-3. */
export class SiuRefusal extends Error {
  constructor(
    readonly error: Hl7ErrorCode,
    reason: string,
  ) {
    super(reason);
  }
}

export interface SiuApplied {
  day: string;
  changeId: number;
  summary: string;
  afterManualChange: boolean;
}

export { AFTER_MANUAL_CHANGE };

/** The user the feed's changes are recorded under: cannot sign in (inactive, no password). */
export const FEED_USER = { username: 'hl7-feed', displayName: 'Booking system (HL7)' };

/**
 * Applies one booking message through the same services as a hand edit (`exam-edits.ts`: the
 * import's cell rules, the exam's version, one history entry with reason `hl7`), inside the
 * caller's transaction. Refusals throw {@link SiuRefusal} or the services' own typed errors.
 */
export async function applySiu(trx: Knex.Transaction, booking: SiuBooking, removing: boolean, now: Date): Promise<SiuApplied> {
  const [{ timezone }, rooms] = await Promise.all([readSettings(trx), listRooms(trx)]);
  const req = { userId: await feedUserId(trx, now), now, reason: 'hl7' as const };
  const start = booking.startTs ? readStart(booking.startTs, timezone) : null;
  const room = booking.location ? await roomFor(trx, rooms, booking.location) : undefined;
  if (booking.location && !room) throw new SiuRefusal(204, `Unknown room "${booking.location}" (AIL-3): no room has that HL7 location code or name.`);
  const exam = await findExam(trx, booking.accession, start?.day ?? null);

  if (removing || booking.action === 'cancel' || booking.action === 'delete' || booking.action === 'no-show') {
    if (!exam) throw new SiuRefusal(204, `Appointment ${booking.accession} is not on any day's plan, so there is nothing to take off.`);
    const why = booking.action === 'no-show' ? ' (no-show)' : booking.action === 'delete' ? ' (deleted)' : '';
    const day = await cancelExam(trx, exam.id, exam.version, { ...req, note: why });
    return applied(trx, day, false);
  }

  if (booking.action === 'book') {
    if (!start) throw new SiuRefusal(101, 'No start: AIS-4 and SCH-11.4 are both empty.');
    if (!room) throw new SiuRefusal(101, 'No room: AIL-3 is empty.');
    if (booking.durationMinutes === null) throw new SiuRefusal(101, 'No duration: AIS-7/AIS-8, SCH-11.3 and SCH-9/SCH-10 give none in minutes.');
    if (exam && exam.day === start.day) throw new SiuRefusal(205, `Appointment ${booking.accession} is already on the plan for ${exam.day}: send S13 or S14 to change it.`);
    const day = await addExam(trx, start.day, cells(booking, { room: room.name, start: start.cell, durationMinutes: booking.durationMinutes }), req);
    return applied(trx, day, false);
  }

  // S13 reschedule, S14 modification: what the message leaves out stays as it is
  if (!exam) throw new SiuRefusal(204, `Appointment ${booking.accession} is not on the plan: a change (S13/S14) needs its booking (S12) first.`);
  if (start && start.day !== exam.day) throw new SiuRefusal(204, `Appointment ${booking.accession} is on ${exam.day}; a change to ${start.day} is outside its day (cancel it and book it again).`);
  const current = rooms.find((r) => r.id === exam.room_id);
  if (room && current && room.modality !== current.modality) {
    throw new Refusal('other_modality', `${exam.accession} is a ${current.modality} exam; ${room.name} is a ${room.modality} room.`, { examModality: current.modality, roomModality: room.modality });
  }
  const startCell = start ? start.cell : exam.start_at;
  const moves = (room && room.id !== exam.room_id) || (start !== null && Date.parse(startCell) !== Date.parse(exam.start_at));
  const afterManualChange = moves && (await movedByHandSinceFeed(trx, exam));
  const input = cells(booking, {
    room: (room ?? current)?.name ?? '',
    start: startCell,
    durationMinutes: booking.durationMinutes ?? exam.duration_minutes,
    procedure: booking.procedure || exam.procedure,
    kept: exam,
  });
  const day = await editExam(trx, exam.id, { ...input, version: exam.version }, { ...req, note: afterManualChange ? ` (${AFTER_MANUAL_CHANGE})` : '' });
  return applied(trx, day, afterManualChange);
}

/** AIL-3 matched to an active room's HL7 location code first, then to its name (case aside). */
async function roomFor(trx: Knex, rooms: Room[], location: string): Promise<Room | undefined> {
  const wanted = location.trim().toLowerCase();
  const coded = await trx('rooms').where({ active: true }).whereRaw('lower(hl7_code) = ?', [wanted]).first('id');
  return rooms.find((r) => r.id === coded?.id) ?? rooms.find((r) => r.name.trim().toLowerCase() === wanted);
}

/** The start as an instant with the site's offset and its day; a local time a DST change skips is refused. */
function readStart(ts: string, timezone: string): { cell: string; day: string } {
  const read = hl7Start(ts, timezone);
  if (!read.ok) throw new SiuRefusal(102, `Start: ${read.message}`);
  const resolved = resolveStart(read.cell, { date: read.day, timezone });
  if (!resolved.ok) throw new SiuRefusal(102, `Start: ${resolved.message}`);
  return { cell: resolved.start, day: read.day };
}

function cells(b: SiuBooking, at: { room: string; start: string; durationMinutes: number; procedure?: string; kept?: ExamRow }): ExamFormInput {
  const kept = at.kept;
  return {
    accession: b.accession,
    room: at.room,
    start: at.start,
    duration_min: at.durationMinutes,
    procedure: at.procedure ?? b.procedure,
    // not given: what the exam has, or for a new booking the import's own defaults
    coil: b.coil ?? kept?.coil ?? '',
    precaution: b.precaution ?? kept?.precaution ?? '',
    mobility: b.mobility ?? kept?.mobility ?? '',
    contrast: b.contrast ?? (kept ? Boolean(kept.contrast) : ''),
    notes: kept?.notes ?? '',
  };
}

/** The exam with this accession: on the message's day if it has one there, else the only one. */
async function findExam(trx: Knex, accession: string, day: string | null): Promise<ExamRow | undefined> {
  const rows: ExamRow[] = await trx('exams').where({ accession }).orderBy('day', 'desc').limit(20);
  return rows.find((r) => r.day === day) ?? (rows.length === 1 ? rows[0] : undefined);
}

/** Someone moved or edited the exam by hand after the feed last changed it. */
async function movedByHandSinceFeed(trx: Knex, exam: ExamRow): Promise<boolean> {
  const touching = trx('plan_changes').where({ day: exam.day }).andWhereRaw('changes like ?', [`%"examId":${exam.id},%`]);
  const lastFeed = await touching.clone().where({ reason: 'hl7' }).max({ id: 'id' }).first();
  if (!lastFeed?.id) return false;
  const byHand = await touching.clone().where('id', '>', lastFeed.id).whereNotIn('reason', ['hl7', 'staffing']).first('id');
  return Boolean(byHand);
}

async function applied(trx: Knex, day: string, afterManualChange: boolean): Promise<SiuApplied> {
  const row = await trx('plan_changes').orderBy('id', 'desc').first('id', 'summary');
  return { day, changeId: row.id, summary: row.summary, afterManualChange };
}

async function feedUserId(trx: Knex, now: Date): Promise<number> {
  const found = await trx('users').where({ username: FEED_USER.username }).first('id');
  if (found) return found.id;
  const [{ id }] = await trx('users').insert({ username: FEED_USER.username, display_name: FEED_USER.displayName, password_hash: '!', role: 'scheduler', active: false, created_at: now.toISOString() }).returning('id');
  return id as number;
}
