import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { PlanChange } from '../../../shared/api/changes';
import { readSettings } from '../settings';
import { queueNotices, type NewNotice } from './queue';
import { recipients } from './preferences';
import { renderNotice, type NoticeContext } from './render';

/** Moves made within this many minutes of the first one go out as one message per room. */
export const MOVE_BATCH_MINUTES = 2;
const CURSOR = 'plan-changes';
/** On the very first run, changes older than this are taken as already told. */
const FIRST_RUN_LOOKBACK_MINUTES = 60;

interface ChangeRow {
  id: number;
  day: string;
  user_id: number;
  changes: string;
  created_at: string;
}

/** One exam's time or room before the batch and after it (null: added or cancelled). */
interface ExamShift {
  accession: string;
  from: { roomId: number; start: string } | null;
  to: { roomId: number; start: string } | null;
  by: Set<number>;
}

/**
 * Reads the day changes (`plan_changes`: moves, undo, redo, fixes, hand edits) made since the last
 * run, in batches of {@link MOVE_BATCH_MINUTES} from each batch's first change, and queues for each
 * affected room one message to each follower of the day: the accessions whose time or room
 * changed, old → new. A batch is read only once its window has closed; the cursor moves in the
 * same transaction as the queuing, and the keys name the batch, so nothing is queued twice.
 */
export async function queueMoveNotices(db: Knex, ctx: NoticeContext, now: Date, windowMinutes = MOVE_BATCH_MINUTES): Promise<number> {
  let queued = 0;
  for (;;) {
    const cursor = await readCursor(db, now);
    const rows: ChangeRow[] = await db('plan_changes').where('id', '>', cursor).orderBy('id').limit(1000).select('id', 'day', 'user_id', 'changes', 'created_at');
    if (rows.length === 0) return queued;
    const closesAt = new Date(Date.parse(rows[0].created_at) + windowMinutes * 60_000);
    if (now < closesAt) return queued;
    const batch = rows.filter((r) => Date.parse(r.created_at) < closesAt.getTime());
    const last = batch[batch.length - 1].id;
    const notices = await batchNotices(db, ctx, batch, `${batch[0].id}-${last}`);
    await db.transaction(async (trx) => {
      queued += await queueNotices(trx, notices, now);
      await trx('notice_cursors').insert({ name: CURSOR, value: last }).onConflict('name').merge();
    });
  }
}

async function readCursor(db: Knex, now: Date): Promise<number> {
  const row = await db('notice_cursors').where({ name: CURSOR }).first('value');
  if (row) return row.value;
  const before = new Date(now.getTime() - FIRST_RUN_LOOKBACK_MINUTES * 60_000).toISOString();
  const old = await db('plan_changes').where('created_at', '<', before).max({ id: 'id' }).first();
  const value = Number(old?.id ?? 0);
  await db('notice_cursors').insert({ name: CURSOR, value }).onConflict('name').ignore();
  return value;
}

async function batchNotices(db: Knex, ctx: NoticeContext, batch: ChangeRow[], batchId: string): Promise<NewNotice[]> {
  const { timezone } = await readSettings(db);
  const rooms = new Map<number, string>((await db('rooms').select('id', 'name')).map((r: { id: number; name: string }) => [r.id, r.name]));
  const hhmm = (iso: string) => DateTime.fromISO(iso, { zone: timezone }).toFormat('HH:mm');
  const place = (p: { roomId: number; start: string }, other: { roomId: number } | null) =>
    other && other.roomId === p.roomId ? hhmm(p.start) : `${hhmm(p.start)} in ${rooms.get(p.roomId) ?? `room ${p.roomId}`}`;

  const byDay = new Map<string, Map<number, ExamShift>>();
  for (const row of batch) {
    const shifts = byDay.get(row.day) ?? new Map<number, ExamShift>();
    byDay.set(row.day, shifts);
    for (const change of JSON.parse(row.changes) as PlanChange[]) {
      let from: ExamShift['from'];
      let to: ExamShift['to'];
      if (change.type === 'move') ({ from, to } = change);
      else if (change.type === 'exam') {
        from = change.from && { roomId: change.from.roomId, start: change.from.start };
        to = change.to && { roomId: change.to.roomId, start: change.to.start };
      } else continue;
      const seen = shifts.get(change.examId);
      if (seen) {
        seen.to = to;
        seen.accession = change.accession;
        seen.by.add(row.user_id);
      } else shifts.set(change.examId, { accession: change.accession, from, to, by: new Set([row.user_id]) });
    }
  }

  const notices: NewNotice[] = [];
  for (const [day, shifts] of byDay) {
    const perRoom = new Map<number, { lines: string[]; by: Set<number> }>();
    for (const s of shifts.values()) {
      if (s.from && s.to && s.from.roomId === s.to.roomId && Date.parse(s.from.start) === Date.parse(s.to.start)) continue;
      const line = `${s.accession}: ${s.from ? place(s.from, s.to) : 'new'} → ${s.to ? place(s.to, s.from) : 'cancelled'}`;
      for (const roomId of new Set([s.from?.roomId, s.to?.roomId].filter((id): id is number => id !== undefined))) {
        const entry = perRoom.get(roomId) ?? { lines: [], by: new Set<number>() };
        entry.lines.push(line);
        s.by.forEach((id) => entry.by.add(id));
        perRoom.set(roomId, entry);
      }
    }
    if (perRoom.size === 0) continue;
    const followers = await recipients(db, 'slot-moves', { roles: ['charge'], ids: await schedulersOfDay(db, day) });
    for (const [roomId, { lines, by }] of perRoom) {
      const room = rooms.get(roomId) ?? `Room ${roomId}`;
      for (const p of followers) {
        // whoever made every one of these changes already knows them
        if (by.size === 1 && by.has(p.id)) continue;
        const rendered = renderNotice(ctx, 'slot-moves', p.id, {
          subject: `Turnwise: ${lines.length} slot${lines.length === 1 ? '' : 's'} moved in ${room} on ${day}`,
          intro: `Exams in ${room} on ${day} changed time (site time, old → new).`,
          sections: [{ heading: room, lines: lines.slice().sort() }],
          link: { label: `Day plan for ${day}`, url: `${ctx.publicUrl}/day/${day}` },
        });
        notices.push({ key: `slot-moves:${batchId}:${day}:${roomId}:${p.id}`, kind: 'slot-moves', userId: p.id, to: p.email, ...rendered });
      }
    }
  }
  return notices;
}

/** Schedulers who follow a day: those who imported its list or changed it. */
async function schedulersOfDay(db: Knex, day: string): Promise<number[]> {
  const ids = await db('users')
    .where('role', 'scheduler')
    .andWhere((q) => q.whereIn('id', db('imports').where({ day }).select('user_id')).orWhereIn('id', db('plan_changes').where({ day }).select('user_id')))
    .pluck('id');
  return ids as number[];
}
