import type { Knex } from 'knex';
import { suggestFixes, type Fix } from '../../shared/fixes';
import { ConflictError, ValidationError } from '../errors';
import { loadDayPlanInput } from './day-plan';
import { applyChanges, recordChange } from './plan-changes';

export async function dayFixes(db: Knex, day: string): Promise<Fix[]> {
  return suggestFixes(await loadDayPlanInput(db, day));
}

/**
 * Applies one suggested fix in a single transaction with one audit entry. The fix is recomputed
 * from the stored plan, so a stale one (the plan changed meanwhile) is a 409; a fix that would
 * make another gap short needs `acceptNewProblems`.
 */
export async function applyFix(db: Knex, day: string, fixId: string, acceptNewProblems: boolean, userId: number, now: Date): Promise<Fix> {
  const fix = (await dayFixes(db, day)).find((f) => f.id === fixId);
  if (!fix) throw new ConflictError('That suggestion no longer applies: the day has changed. Suggestions have been refreshed.');
  if (fix.effect.newProblems > 0 && !acceptNewProblems) {
    throw new ValidationError(
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
