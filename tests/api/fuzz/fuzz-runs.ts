import fc from 'fast-check';

/**
 * How many cases each fuzz property runs. CI runs a fixed seed and a few thousand cases in all
 * (under a minute on two busy cores); `FUZZ_RUNS=20000` asks for about that many in all, each
 * property scaled by its share, and `FUZZ_SEED` explores other cases than CI's.
 */
export const FUZZ_SEED = Number(process.env['FUZZ_SEED'] ?? 20270310);

/**
 * About the sum of the `ciRuns` passed to {@link fuzzRuns} over the suite (kept by hand; the
 * route fuzz grows with the role matrix): 25 a route × ~50 routes, 200 framings, 610 files, 200 multiparts.
 */
const CI_TOTAL_RUNS = 2300;
const requested = Number(process.env['FUZZ_RUNS'] ?? 0);
const scale = Number.isFinite(requested) && requested > CI_TOTAL_RUNS ? requested / CI_TOTAL_RUNS : 1;

/** Cases for a property that runs `ciRuns` in CI. */
export function fuzzRuns(ciRuns: number): number {
  return Math.round(ciRuns * scale);
}

/** A jest timeout for a property of `ciRuns` cases: generous, since a busy machine must not fail it. */
export function fuzzTimeout(ciRuns: number): number {
  return Math.max(60_000, ciRuns * 200 * scale);
}

/** fast-check's options for one property: the fixed seed, its runs, and a readable counterexample. */
export function fuzzOptions(ciRuns: number): fc.Parameters<unknown> {
  return { seed: FUZZ_SEED, numRuns: fuzzRuns(ciRuns), verbose: 1 };
}
