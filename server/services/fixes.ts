import type { Knex } from 'knex';
import { FIX_KINDS, type Fix, type FixKind } from '../../shared/fixes';
import { NotFoundError, Refusal } from '../errors';
import type { FixesPool } from '../workers/fixes-pool';
import type { FixesPageTask } from '../workers/fixes-task';
import { loadDayPlanInput } from './day-plan';
import { heldExams, withPassed } from './day-fit';
import { applyChanges, recordChange } from './plan-changes';

/**
 * The day as fixes are weighed on it at `now`: its plan input, and the exams no fix may move
 * (arrived, started, pinned, or already due; those due also keep their gaps from any fix).
 */
async function dayAt(db: Knex, day: string, now: Date): Promise<Pick<FixesPageTask, 'input' | 'bounds'>> {
  const [input, held] = await Promise.all([loadDayPlanInput(db, day), heldExams(db, day)]);
  return { input, bounds: { stays: [...withPassed(held, input.exams, now).keys()], notBefore: now.getTime() } };
}

/**
 * One page of the day's fixes (`FixesPage` as JSON, ready to send) at `now`, weighed in a worker thread.
 *
 * @throws NotFoundError when `after` is not an exam of the day
 */
export async function dayFixesPage(db: Knex, pool: FixesPool, day: string, page: { after?: number; limit?: number }, now: Date): Promise<string> {
  const json = await pool.page({ ...(await dayAt(db, day, now)), ...page });
  if (json === null) throw new NotFoundError(`Exam ${page.after} is not on the day list of ${day}; start again from the first page.`);
  return json;
}

/**
 * The fixes of the gap before exam `toExamId` at `now` (none when that gap is not short or
 * overlapping, or its exam is already due), weighed in a worker thread.
 *
 * @throws NotFoundError when the exam is not on that day's list
 */
export async function gapFixes(db: Knex, pool: FixesPool, day: string, toExamId: number, now: Date): Promise<Fix[]> {
  const fixes = await pool.gap({ ...(await dayAt(db, day, now)), toExamId });
  if (fixes === null) throw new NotFoundError(`Exam ${toExamId} is not on the day list of ${day}.`);
  return fixes;
}

/**
 * Applies one suggested fix in a single transaction with one audit entry. The fix is recomputed
 * from the stored plan at `now` (only its gap's fixes: the id names the gap), so a stale one
 * (the plan changed meanwhile, or an exam it moves has since arrived or come due) is a 409; a
 * fix that would make another gap short needs `acceptNewProblems`.
 */
export async function applyFix(db: Knex, pool: FixesPool, day: string, fixId: string, acceptNewProblems: boolean, userId: number, now: Date): Promise<Fix> {
  const toExamId = gapOfFixId(fixId);
  const fixes = toExamId === null ? null : await pool.gap({ ...(await dayAt(db, day, now)), toExamId });
  const fix = fixes?.find((f) => f.id === fixId);
  if (!fix) throw new Refusal('fix_stale', 'That suggestion no longer applies: the day has changed, or a patient it would move has arrived or is already due. Suggestions have been refreshed.', undefined);
  if (fix.effect.newProblems > 0 && !acceptNewProblems) {
    throw new Refusal(
      'fix_has_new_problems',
      `This fix would leave ${fix.effect.newProblems} other gap${fix.effect.newProblems === 1 ? '' : 's'} short or overlapping. Confirm to apply it anyway.`,
      { newProblems: fix.effect.newProblems },
    );
  }
  await db.transaction(async (trx) => {
    await applyChanges(trx, fix.changes, userId, now);
    await recordChange(trx, { day, userId, reason: 'suggestion', summary: fix.title, changes: fix.changes }, now);
  });
  return fix;
}

/** The gap a fix id (`${kind}:${toExamId}`) is for, or null when it is not one. */
function gapOfFixId(fixId: string): number | null {
  const match = /^([a-z-]+):(\d{1,15})$/.exec(fixId);
  return match && FIX_KINDS.includes(match[1] as FixKind) ? Number(match[2]) : null;
}
