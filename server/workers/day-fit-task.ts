/**
 * "Make the day fit" as a worker-thread task (`day-fit-worker.cjs` loads this file): HiGHS
 * solves synchronously, for up to the time limit, so it never runs on the event loop. Plain
 * data in and out.
 */
import { proposeDayFit, type DayFitOptions, type DayFitProposal } from '../../shared/day-fit';
import type { DayPlanInput } from '../../shared/turnover';
import { highsSolver } from '../services/day-fit/highs-solve';

export interface DayFitTask {
  input: DayPlanInput;
  options: Omit<DayFitOptions, 'now'>;
}

/**
 * The proposal for one day.
 *
 * @example
 * await dayFitTask({ input, options: { fixed: { 12: 'arrived' }, timeLimitMs: 8000 } }); // { changes: […], … }
 */
export async function dayFitTask({ input, options }: DayFitTask): Promise<DayFitProposal> {
  return proposeDayFit(input, await highsSolver(), options);
}
