import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { DayFitAnswer, DayFitApplyInput } from '../../shared/api/day-fit';
import type { FixedReason } from '../../shared/day-fit';
import { spareHelpers } from '../../shared/day-fit/roster-helpers';
import type { Problem } from '../../shared/api/errors';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { ROSTER_MS_PER_GAP, type DayFitPool } from '../workers/day-fit-pool';
import { loadDayPlan, loadDayPlanInput } from './day-plan';
import { dayVersion, planVersions } from './day-version';
import { applyChanges, recordChange } from './plan-changes';
import { roomsOnDay } from './room-hours';
import { readSettings } from './settings';

/**
 * Exams of the day that may not move: arrived (front desk), started (their end recorded, so a
 * turnover opened after them), pinned by a user, or past their start time at `now` (a patient
 * already due is not called to another time; on a day gone by, every exam).
 *
 * @example
 * await fixedExams(db, '2027-03-16', new Date()); // Map { 12 => 'arrived', 14 => 'pinned', 3 => 'passed' }
 */
export async function fixedExams(db: Knex, day: string, now: Date): Promise<Map<number, FixedReason>> {
  const [held, starts] = await Promise.all([heldExams(db, day), db('exams').where({ day }).select('id', 'start_at') as Promise<{ id: number; start_at: string }[]>]);
  return withPassed(held, starts.map((e) => ({ id: Number(e.id), start: e.start_at })), now);
}

/** The exams of the day held where they are by what happened or a user: pinned, arrived, started. */
export async function heldExams(db: Knex, day: string): Promise<Map<number, FixedReason>> {
  const [pinned, arrived, started] = await Promise.all([
    db('exams').where({ day, pinned: true }).pluck('id'),
    db('arrivals').join('exams', 'exams.id', 'arrivals.exam_id').where('exams.day', day).pluck('arrivals.exam_id'),
    db('turnovers').where({ day }).pluck('from_exam_id'),
  ]);
  const held = new Map<number, FixedReason>();
  for (const id of pinned as number[]) held.set(Number(id), 'pinned');
  for (const id of arrived as number[]) held.set(Number(id), 'arrived');
  for (const id of started as number[]) held.set(Number(id), 'started');
  return held;
}

/**
 * The held exams and those whose start is before `now` (`passed`), from exams already loaded
 * (a day's plan input), so the day's starts are not read twice; a held reason wins.
 */
export function withPassed(held: ReadonlyMap<number, FixedReason>, exams: readonly { id: number; start: string }[], now: Date): Map<number, FixedReason> {
  const fixed = new Map<number, FixedReason>();
  for (const exam of exams) if (Date.parse(exam.start) < now.getTime()) fixed.set(exam.id, 'passed');
  for (const [id, why] of held) fixed.set(id, why);
  return fixed;
}

/**
 * The whole-day proposal, solved in the day-fit worker on the day as stored now. With a roster,
 * the day is planned with the roster's crews (`proposeWithRoster`: each turnover the roster
 * staffs short is planned with the crew it gets, and the proposal is judged by the roster), and
 * the people it leaves idle in the current plan are offered as helpers (`spareHelpers`), with
 * the site's walking time between two of their turnovers; such a day's budget follows its
 * problem gaps (`ROSTER_MS_PER_GAP`).
 */
export async function proposeFit(db: Knex, pool: DayFitPool, day: string, now: Date): Promise<DayFitAnswer> {
  const versions = await planVersions(db, day);
  const version = versions.day;
  const [input, held, plan] = await Promise.all([loadDayPlanInput(db, day), heldExams(db, day), loadDayPlan(db, day)]);
  const fixed = withPassed(held, input.exams, now);
  const options = {
    fixed: Object.fromEntries(fixed),
    notBefore: now.getTime(),
    helpers: plan.people ? spareHelpers(plan.people) : [],
    walkingMinutes: plan.people?.walkingMinutes ?? 0,
    rosterMsPerGap: ROSTER_MS_PER_GAP,
  };
  // The minute is part of the key: a proposal asked for a minute later may start no earlier.
  const minute = Math.floor(now.getTime() / 60_000);
  const proposal = await pool.propose(`${day}@${versions.day}/${versions.setup}@${minute}`, { input, options });
  const accession = new Map(input.exams.map((e) => [e.id, e.accession]));
  return {
    ...proposal,
    dayVersion: version,
    fixed: [...fixed].filter(([id]) => accession.has(id)).map(([examId, reason]) => ({ examId, accession: accession.get(examId)!, reason })),
  };
}

/**
 * Applies a proposal's changes in one transaction as one history entry (undone like any change),
 * provided the day is still at the version it was computed on (else 409 `fit_stale`). Every
 * move is checked again: an exam of the day that may move, to an open room of the same modality,
 * within that room's hours; a 422 lists every problem.
 */
export async function applyFit(db: Knex, day: string, body: DayFitApplyInput, userId: number, now: Date): Promise<number> {
  const { timezone } = await readSettings(db);
  const rooms = new Map((await roomsOnDay(db, day)).map((r) => [r.id, r]));
  return db.transaction(async (trx) => {
    const current = await dayVersion(trx, day);
    if (current !== body.dayVersion) {
      throw new Refusal('fit_stale', 'The day has changed since this proposal was made; nothing was applied. Make the day fit again.', { proposedVersion: body.dayVersion, currentVersion: current });
    }
    const fixed = await fixedExams(trx, day, now);
    const ids = body.changes.map((c) => (c.type === 'move' ? c.examId : c.toExamId));
    const exams = new Map((await trx('exams').whereIn('id', ids).select('id', 'day', 'room_id')).map((e: { id: number; day: string; room_id: number }) => [e.id, e]));
    const problems: Problem[] = [];
    body.changes.forEach((change, index) => {
      const field = `changes.${index}`;
      const id = change.type === 'move' ? change.examId : change.toExamId;
      const exam = exams.get(id);
      if (!exam || exam.day !== day) {
        problems.push({ field, message: `exam ${id} is not on the day list of ${day}` });
        return;
      }
      if (change.type !== 'move') return;
      if (fixed.has(id)) problems.push({ field, message: `${change.accession} may not move (${fixed.get(id)})` });
      const from = rooms.get(exam.room_id);
      const to = rooms.get(change.to.roomId);
      if (!to || to.closed) {
        problems.push({ field: `${field}.to.roomId`, message: `room ${change.to.roomId} is not open on ${day}` });
        return;
      }
      if (from && from.modality.toUpperCase() !== to.modality.toUpperCase()) problems.push({ field: `${field}.to.roomId`, message: `${change.accession} is a ${from.modality} exam; ${to.name} is a ${to.modality} room` });
      const start = DateTime.fromISO(change.to.start, { setZone: true }).setZone(timezone);
      if (start.toISODate() !== day) problems.push({ field: `${field}.to.start`, message: `the start is not on ${day} (site time)` });
      else if (start.toMillis() < now.getTime()) problems.push({ field: `${field}.to.start`, message: `${change.accession} would start at ${start.toFormat('HH:mm')}, which has passed` });
    });
    if (problems.length > 0) throw new ValidationError('This proposal cannot be applied as sent.', { problems });
    await applyChanges(trx, body.changes, userId, now);
    const moves = body.changes.filter((c) => c.type === 'move').length;
    const helpers = body.changes.length - moves;
    const summary = `Made the day fit: ${moves} exam${moves === 1 ? '' : 's'} moved${helpers ? `, ${helpers} helper${helpers === 1 ? '' : 's'} added` : ''}`;
    return recordChange(trx, { day, userId, reason: 'day fit', summary, changes: body.changes }, now);
  });
}

/**
 * Pins (or unpins) an exam: a pinned exam never moves when the day is made to fit. Answers the
 * exam's day.
 *
 * @throws NotFoundError when there is no such exam
 */
export async function pinExam(db: Knex, examId: number, pinned: boolean): Promise<string> {
  const exam = await db('exams').where({ id: examId }).first('id', 'day', 'pinned');
  if (!exam) throw new NotFoundError(`No exam ${examId}.`);
  if (Boolean(exam.pinned) !== pinned) await db('exams').where({ id: examId }).update({ pinned });
  return exam.day;
}
