import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { ChangeReason } from '../../shared/api/limits';
import type { PlanChange } from '../../shared/api/changes';
import type {
  ContactTally,
  Report,
  ReportQuery,
  ReportShiftTasks,
  RoomUse,
  TurnoverMinutes,
  VerdictCounts,
} from '../../shared/api/reports';
import { airHoldMinutes, computeDayPlan } from '../../shared/turnover';
import { NotFoundError } from '../errors';
import { dayFiguresOf } from './report-plan-figures';
import { readSettings } from './settings';
import { ruleOccurrences } from './shift-task-rules';

/*
 * Every number of the Reports screen, computed here from the database and nowhere else.
 *
 * Where each comes from:
 * - plans (gap verdicts now, planned turnover minutes, exam and open minutes): the engine on each
 *   day's stored list, kept per day version (`report-plan-figures.ts`), so a report re-read costs queries;
 * - recorded turnovers: the append-only cleaning log ("exam finished" → "turnover complete" of one
 *   turnover), with the precaution from the turnover row while the exam is still on the list;
 * - as imported: `import_verdicts`, written when an import is committed (none for older imports);
 * - moves: `plan_changes`; shift tasks: their rules and `shift_task_done`.
 *
 * Bounded: a range is at most REPORT_MAX_DAYS (shared/api/limits.ts). The engine runs once per
 * day not yet kept, between awaits, so the event loop is held one day's plan at a time.
 */

const MINUTE = 60_000;

export async function buildReport(db: Knex, query: ReportQuery, now: Date): Promise<Report> {
  const { from, to } = query;
  const roomId = query.room ?? null;
  const { timezone } = await readSettings(db);
  const rooms: { id: number; name: string; air_changes_per_hour: number }[] = await db('rooms').select('id', 'name', 'air_changes_per_hour').orderBy(['sort_order', 'id']);
  if (roomId !== null && !rooms.some((r) => r.id === roomId)) throw new NotFoundError(`No room ${roomId}.`);
  const inRoom = (id: number) => roomId === null || id === roomId;
  const days = daysOf(from, to);
  const figures = await dayFiguresOf(db, days);

  const [turnovers, importRows, moves, earlyCloses, contact, shiftTasks] = await Promise.all([
    recordedTurnovers(db, from, to, roomId),
    importVerdicts(db, from, to, roomId),
    movesByReason(db, from, to, roomId),
    earlyClosesOf(db, from, to, roomId),
    contactOf(db, from, to, roomId),
    shiftTasksOf(db, from, to, roomId, timezone, now),
  ]);

  // Planned vs actual, per room and per precaution; air holds from the same turnovers.
  const byRoom = new Map<number, TurnoverMinutes>();
  const byPrecaution = new Map<string, TurnoverMinutes>();
  const airHolds = { count: 0, minutes: 0, endedEarly: 0 };
  const ach = new Map(rooms.map((r) => [r.id, r.air_changes_per_hour]));
  for (const t of turnovers) {
    const actualMs = t.completedMs - t.endedMs;
    if (t.precaution === 'airborne') {
      const hold = airHoldMinutes(ach.get(t.roomId) ?? 1);
      airHolds.count += 1;
      airHolds.minutes += hold;
      if (actualMs < hold * MINUTE) airHolds.endedEarly += 1;
    }
    const planned = figures.get(t.day)?.gapAfter.get(`${t.roomId}|${t.accession}`);
    if (planned === undefined) continue;
    const add = (map: Map<string | number, TurnoverMinutes>, key: string | number, label: string, id: number | null) => {
      const row = map.get(key) ?? { label, roomId: id, turnovers: 0, plannedMinutes: 0, actualMinutes: 0 };
      row.turnovers += 1;
      row.plannedMinutes += planned;
      row.actualMinutes += actualMs / MINUTE;
      map.set(key, row);
    };
    add(byRoom as Map<string | number, TurnoverMinutes>, t.roomId, t.roomName, t.roomId);
    add(byPrecaution as Map<string | number, TurnoverMinutes>, t.precaution ?? 'not known', t.precaution ?? 'not known', null);
  }
  const tenth = (n: number) => Math.round(n * 10) / 10;
  const roomOrder = new Map(rooms.map((r, i) => [r.id, i]));
  const minutesRows = (rows: TurnoverMinutes[]) => rows.map((r) => ({ ...r, actualMinutes: tenth(r.actualMinutes) }));

  // Gaps now (every day) and as imported (days with a recorded import), rooms filtered.
  const now_ = zero();
  const nowOnImported = zero();
  const asImported = zero();
  for (const day of days) {
    const f = figures.get(day)!;
    for (const [id, room] of f.rooms) {
      if (!inRoom(id)) continue;
      addCounts(now_, room.verdicts);
      if (importRows.days.has(day)) addCounts(nowOnImported, room.verdicts);
    }
  }
  for (const row of importRows.rows) addCounts(asImported, row);

  // Room use over the days with a day list at the site.
  const listDays = days.filter((d) => figures.get(d)!.hasExams);
  const use = new Map<number, RoomUse>();
  for (const day of listDays) {
    for (const [id, room] of figures.get(day)!.rooms) {
      if (!inRoom(id)) continue;
      const row = use.get(id) ?? { roomId: id, label: room.name, days: 0, examMinutes: 0, openMinutes: 0, use: null };
      row.days += 1;
      row.examMinutes += room.examMinutes;
      row.openMinutes += room.openMinutes;
      use.set(id, row);
    }
  }

  return {
    from,
    to,
    roomId,
    timezone,
    days: days.length,
    listDays: listDays.length,
    turnoverMinutes: {
      byRoom: minutesRows([...byRoom.values()].sort((a, b) => (roomOrder.get(a.roomId!) ?? 0) - (roomOrder.get(b.roomId!) ?? 0))),
      byPrecaution: minutesRows([...byPrecaution.values()].sort((a, b) => a.label.localeCompare(b.label))),
    },
    gaps: { now: now_, importedDays: importRows.days.size, asImported, nowOnImportedDays: nowOnImported },
    moves,
    earlyCloses,
    contact,
    airHolds,
    shiftTasks,
    roomUse: [...use.values()]
      .sort((a, b) => (roomOrder.get(a.roomId) ?? 0) - (roomOrder.get(b.roomId) ?? 0))
      .map((r) => ({ ...r, use: r.openMinutes > 0 ? Math.round((r.examMinutes / r.openMinutes) * 1000) / 1000 : null })),
  };
}

function zero(): VerdictCounts {
  return { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
}

function addCounts(into: VerdictCounts, add: VerdictCounts): void {
  into.fits += add.fits;
  into.snug += add.snug;
  into.short += add.short;
  into.overlap += add.overlap;
  into.minutesShort += add.minutesShort;
}

function daysOf(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = DateTime.fromISO(from, { zone: 'UTC' }); d.toISODate()! <= to; d = d.plus({ days: 1 })) out.push(d.toISODate()!);
  return out;
}

interface RecordedTurnover {
  day: string;
  roomId: number;
  roomName: string;
  accession: string;
  precaution: string | null;
  endedMs: number;
  completedMs: number;
}

/** Completed turnovers as the cleaning log records them (its first completion, should there be two). */
async function recordedTurnovers(db: Knex, from: string, to: string, roomId: number | null): Promise<RecordedTurnover[]> {
  const query = db('cleaning_log as f')
    .join('cleaning_log as c', function () {
      this.on('c.turnover_id', 'f.turnover_id').andOnVal('c.kind', 'turnover complete');
    })
    .leftJoin('turnovers as t', 't.id', 'f.turnover_id')
    .where('f.kind', 'exam finished')
    .whereBetween('f.day', [from, to])
    // t.id too: PostgreSQL, unlike SQLite, selects only columns the grouping determines
    .groupBy('f.id', 't.id')
    .select('f.day', 'f.room_id', 'f.room_name', 'f.exam_accession', 'f.at_ms', 't.precaution')
    .min('c.at_ms as completed_ms')
    .orderBy('f.at_ms');
  if (roomId !== null) query.where('f.room_id', roomId);
  const rows = (await query) as { day: string; room_id: number; room_name: string; exam_accession: string; at_ms: number; precaution: string | null; completed_ms: number }[];
  return rows.map((r) => ({
    day: r.day,
    roomId: r.room_id,
    roomName: r.room_name,
    accession: r.exam_accession,
    precaution: r.precaution,
    endedMs: Number(r.at_ms),
    completedMs: Number(r.completed_ms),
  }));
}

/** The verdicts each day's latest import left (only days whose latest import recorded them). */
async function importVerdicts(db: Knex, from: string, to: string, roomId: number | null): Promise<{ days: Set<string>; rows: VerdictCounts[] }> {
  const latest = db('imports').whereBetween('day', [from, to]).groupBy('day').max('id as id');
  const query = db('import_verdicts as v').join('imports as i', 'i.id', 'v.import_id').whereIn('v.import_id', latest).select('i.day', 'v.*');
  const rows: { day: string; room_id: number; fits: number; snug: number; short: number; overlap: number; minutes_short: number }[] = await query;
  // a day counts as recorded even when the filtered room had no row (it had no exams then)
  const days = new Set(rows.map((r) => r.day));
  return {
    days,
    rows: rows.filter((r) => roomId === null || r.room_id === roomId).map((r) => ({ fits: r.fits, snug: r.snug, short: r.short, overlap: r.overlap, minutesShort: r.minutes_short })),
  };
}

/** Changes that moved exams, by reason; with a room, the moves into or out of it. */
async function movesByReason(db: Knex, from: string, to: string, roomId: number | null): Promise<Report['moves']> {
  const rows: { reason: ChangeReason; changes: string }[] = await db('plan_changes').whereBetween('day', [from, to]).orderBy('id').select('reason', 'changes');
  const by = new Map<ChangeReason, { reason: ChangeReason; changes: number; exams: number }>();
  for (const row of rows) {
    const moved = (JSON.parse(row.changes) as PlanChange[]).filter(
      (c) => c.type === 'move' && (roomId === null || c.from.roomId === roomId || c.to.roomId === roomId),
    );
    if (moved.length === 0) continue;
    const entry = by.get(row.reason) ?? { reason: row.reason, changes: 0, exams: 0 };
    entry.changes += 1;
    entry.exams += moved.length;
    by.set(row.reason, entry);
  }
  return [...by.values()].sort((a, b) => b.exams - a.exams || a.reason.localeCompare(b.reason));
}

async function earlyClosesOf(db: Knex, from: string, to: string, roomId: number | null): Promise<Report['earlyCloses']> {
  const query = db('cleaning_log').where('kind', 'turnover complete').whereBetween('day', [from, to]).orderBy('id').select('early_reason');
  if (roomId !== null) query.where('room_id', roomId);
  const rows: { early_reason: string | null }[] = await query;
  const reasons = new Map<string, { reason: string; count: number }>();
  let early = 0;
  for (const { early_reason: reason } of rows) {
    if (!reason?.trim()) continue;
    early += 1;
    const key = reason.trim().replace(/\s+/g, ' ').toLowerCase();
    const entry = reasons.get(key) ?? { reason: reason.trim().replace(/\s+/g, ' '), count: 0 };
    entry.count += 1;
    reasons.set(key, entry);
  }
  return { closed: rows.length, early, reasons: [...reasons.values()].sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason)) };
}

/** Contact time of every disinfection step whose turnover completed, in total and by product. */
async function contactOf(db: Knex, from: string, to: string, roomId: number | null): Promise<Report['contact']> {
  const query = db('cleaning_log as l')
    .join('cleaning_log_contact as c', 'c.entry_id', 'l.id')
    .where('l.kind', 'step')
    .whereNotNull('l.contact_required_minutes')
    .whereBetween('l.day', [from, to])
    .select('l.product_name', 'l.product_key', 'l.contact_required_minutes', 'c.achieved_minutes');
  if (roomId !== null) query.where('l.room_id', roomId);
  const rows: { product_name: string | null; product_key: string | null; contact_required_minutes: number; achieved_minutes: number }[] = await query;
  const tally = (label: string): ContactTally => ({ label, steps: 0, met: 0, below: 0, requiredMinutes: 0, achievedMinutes: 0 });
  const total = tally('All products');
  const byProduct = new Map<string, ContactTally>();
  for (const row of rows) {
    const label = row.product_name ?? row.product_key ?? 'not named';
    const product = byProduct.get(label) ?? tally(label);
    byProduct.set(label, product);
    for (const t of [total, product]) {
      t.steps += 1;
      if (row.achieved_minutes >= row.contact_required_minutes) t.met += 1;
      else t.below += 1;
      t.requiredMinutes += row.contact_required_minutes;
      t.achievedMinutes += row.achieved_minutes;
    }
  }
  return { total, byProduct: [...byProduct.values()].sort((a, b) => a.label.localeCompare(b.label)) };
}

/**
 * Occurrences of the active shift tasks due in the range: on time when ticked off by the end of
 * their slot (due + duration), late after it, missed when never ticked and the slot is over.
 */
async function shiftTasksOf(db: Knex, from: string, to: string, roomId: number | null, zone: string, now: Date): Promise<ReportShiftTasks> {
  const query = db('shift_tasks as t').join('rooms as r', 'r.id', 't.room_id').where('t.active', true).where('r.active', true).select('t.id', 't.rrule', 't.duration_minutes');
  if (roomId !== null) query.where('t.room_id', roomId);
  const tasks: { id: number; rrule: string; duration_minutes: number }[] = await query;
  const out: ReportShiftTasks = { due: 0, onTime: 0, late: 0, missed: 0, open: 0 };
  if (tasks.length === 0) return out;
  const done: { task_id: number; due_ms: number; done_at: string }[] = await db('shift_task_done').whereIn('task_id', tasks.map((t) => t.id)).select('task_id', 'due_ms', 'done_at');
  const doneAt = new Map(done.map((d) => [`${d.task_id}|${Number(d.due_ms)}`, Date.parse(d.done_at)]));
  const end = DateTime.fromISO(to, { zone: 'UTC' }).plus({ days: 1 }).toISODate()!;
  for (const task of tasks) {
    for (const due of ruleOccurrences(task.rrule, { zone, from, to: end })) {
      const slotEnd = due.toMillis() + task.duration_minutes * MINUTE;
      const at = doneAt.get(`${task.id}|${due.toMillis()}`);
      out.due += 1;
      if (at === undefined) out[slotEnd <= now.getTime() ? 'missed' : 'open'] += 1;
      else out[at <= slotEnd ? 'onTime' : 'late'] += 1;
    }
  }
  return out;
}
