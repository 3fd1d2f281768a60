/**
 * Suggested fixes, as worker-thread tasks (`fixes-worker.cjs` loads this file): a day's fixes
 * grow with its rooms, so they are weighed off the event loop. Plain data in and out.
 */
import { suggestFixes, suggestGapFixes, type Fix, type FixBounds } from '../../shared/fixes';
import type { DayPlanInput } from '../../shared/turnover';

export interface FixesPageTask {
  input: DayPlanInput;
  bounds: FixBounds;
  after?: number;
  limit?: number;
}

export interface GapFixesTask {
  input: DayPlanInput;
  bounds: FixBounds;
  toExamId: number;
}

/**
 * One page of the day's fixes as the JSON the route sends: a page can carry long push cascades
 * (megabytes on a crowded day), and serialising it here keeps that off the event loop too.
 *
 * @returns null when `after` is not an exam of the day
 * @example
 * fixesPageTask({ input, limit: 20 }); // '{"fixes":[…],"gaps":[4,9],"problemGaps":2,"next":null}'
 */
export function fixesPageTask({ input, bounds, after, limit }: FixesPageTask): string | null {
  const page = suggestFixes(input, { ...bounds, after, limit });
  return page && JSON.stringify(page);
}

/**
 * The fixes of one gap.
 *
 * @returns null when `toExamId` is not an exam of the day
 * @example
 * gapFixesTask({ input, toExamId: 12 }); // [{ id: 'push-later:12', … }]
 */
export function gapFixesTask({ input, bounds, toExamId }: GapFixesTask): Fix[] | null {
  return suggestGapFixes(input, toExamId, bounds);
}
