import type { FitSolverReport } from './model';

/** What the solves of one proposal add up to. */
export interface SolveTally {
  solves: number;
  clusters: number;
  mipGap: number;
  timeLimited: boolean;
  neighbourhood: boolean;
}

/**
 * The proposal's solver report from its tally.
 *
 * @example
 * solverReport({ solves: 2, clusters: 1, mipGap: 0, timeLimited: false, neighbourhood: false }, false, 40).status; // 'optimal'
 */
export function solverReport(tally: SolveTally, nothingToDo: boolean, milliseconds: number): FitSolverReport {
  return {
    status: nothingToDo ? 'nothing-to-do' : tally.timeLimited ? 'time-limit' : 'optimal',
    mipGap: tally.mipGap,
    scope: tally.neighbourhood ? 'neighbourhood' : 'whole',
    solves: tally.solves,
    clusters: tally.clusters,
    milliseconds,
  };
}
