import highsLoader, { type Highs } from 'highs';
import type { MipResult, MipSolve } from '../../../shared/day-fit';

/*
 * HiGHS (WebAssembly) loads once per thread: instantiating the module takes a few hundred
 * milliseconds, a solve then runs synchronously on the calling thread, which is why the server
 * calls it only from a worker (workers/day-fit-task.ts).
 */
let loading: Promise<Highs> | null = null;

/**
 * A `MipSolve` backed by HiGHS: reads the LP text, minimises within the time limit with a zero
 * relative and an absolute gap below one (every level's objective is integral, so "optimal"
 * means exactly optimal), and answers the values by column name and the final MIP gap.
 *
 * @example
 * const solve = await highsSolver();
 * solve('Minimize\n obj: + 1 x\nSubject To\n c0: + 1 x >= 2\nGeneral\n x\nEnd\n', 5).values?.get('x'); // 2
 */
export async function highsSolver(): Promise<MipSolve> {
  if (!loading) loading = highsLoader();
  let highs: Highs;
  try {
    highs = await loading;
  } catch (error) {
    loading = null;
    throw error;
  }
  return (lp, timeLimitSeconds) => solveWith(highs, lp, timeLimitSeconds);
}

function solveWith(highs: Highs, lp: string, timeLimitSeconds: number): MipResult {
  const model = highs.createModel();
  try {
    model.options.set({
      output_flag: false,
      time_limit: Math.max(0.01, timeLimitSeconds),
      mip_rel_gap: 0,
      mip_abs_gap: 0.5,
      // Symmetry detection costs tens of milliseconds on every solve, even a tiny one; our
      // clusters are small and many, and their symmetric rooms rarely pay that back.
      mip_detect_symmetry: false,
    });
    model.readModel({ format: 'lp', data: lp });
    model.run();
    const { modelStatus } = highs.constants;
    const status = model.getModelStatus();
    const primal = Number(model.info.get('primal_solution_status'));
    if (primal !== 2) return { status: status === modelStatus.infeasible ? 'infeasible' : status === modelStatus.timeLimit ? 'time-limit' : 'error', values: null, mipGap: 1 };
    const { colValue } = model.getSolution();
    const values = new Map<string, number>();
    for (let i = 0; i < colValue.length; i++) values.set(model.getColName(i), colValue[i]!);
    const gap = Number(model.info.get('mip_gap'));
    return { status: status === modelStatus.optimal ? 'optimal' : 'time-limit', values, mipGap: status === modelStatus.optimal ? 0 : Number.isFinite(gap) ? gap : 1 };
  } finally {
    model.dispose();
  }
}
