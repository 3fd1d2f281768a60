import type { ClusterModel, ClusterSolution } from './cluster-model';
import { lpRow, type Term } from './lp-writer';
import type { MipResult, MipSolve } from './model';
import type { SolveTally } from './solver-report';

/**
 * Solves the levels in order; each level's best value bounds the next. Returns the last level's
 * point (or the best earlier one when a later solve found none) and the gaps left.
 */
export function solveLevels(
  m: Pick<ClusterModel, 'lp' | 'levels' | 'decode'>,
  mip: MipSolve,
  tally: SolveTally,
  deadline: number,
  now: () => number,
  capSeconds = Infinity,
): { solution: ClusterSolution; gapsLeft: number } | null {
  const bounds: ReturnType<typeof lpRow>[] = [];
  let best: ReadonlyMap<string, number> | null = null;
  let gapsLeft = 0;
  const levels = m.levels.map((terms, index) => ({ terms, index }));
  const run = (terms: readonly Term[], extra: ReturnType<typeof lpRow>[], share: number): MipResult => {
    // One hard cluster may not eat the day's budget: a solve stops at its cap with its best point.
    const seconds = Math.min(capSeconds, Math.max(0.05, ((deadline - now()) / 1000) * share));
    const answer = mip(m.lp.text(terms, extra), seconds);
    tally.solves++;
    if (answer.status === 'time-limit' || (answer.values && answer.status !== 'optimal')) tally.timeLimited = true;
    if (answer.values) tally.mipGap = Math.max(tally.mipGap, answer.mipGap);
    return answer;
  };
  // First with every gap cleared (no gap left): the usual case, and a much tighter model.
  let k = 1;
  const cleared = lpRow(levels[0]!.terms, '<=', 0);
  const first = run(levels[1]!.terms, [cleared], 1 / (levels.length - 1));
  if (first.values) {
    best = first.values;
    bounds.push(cleared, lpRow(levels[1]!.terms, '<=', Math.round(valueOf(levels[1]!.terms, best)) + 1e-6));
    k = 2;
  } else {
    k = 0;
  }
  for (; k < levels.length; k++) {
    const { terms, index } = levels[k]!;
    const answer = run(terms, bounds, 1 / (levels.length - k));
    if (!answer.values) break;
    best = answer.values;
    const value = valueOf(terms, best);
    if (index === 0) gapsLeft = Math.round(value);
    // Integral levels: a tiny allowance absorbs the solver's feasibility tolerance.
    bounds.push(lpRow(terms, '<=', Math.round(value) + 1e-6));
  }
  return best ? { solution: m.decode(best), gapsLeft } : null;
}

function valueOf(terms: readonly Term[], values: ReadonlyMap<string, number>): number {
  return terms.reduce((sum, [c, v]) => sum + c * (values.get(v) ?? 0), 0);
}

