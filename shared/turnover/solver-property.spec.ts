import fc from 'fast-check';
import type { SolverStep } from './model';
import { solveTurnover } from './solver';
import { scheduleProblems } from './testing/check-schedule';
import { exhaustiveMakespan } from './testing/exhaustive-solver';

/** Random small turnovers: 4–7 steps, each needing some earlier ones (so no cycles), 1–3 people. */
const turnover = fc
  .integer({ min: 4, max: 7 })
  .chain((n) =>
    fc.record({
      staff: fc.integer({ min: 1, max: 3 }),
      steps: fc.tuple(
        ...Array.from({ length: n }, (_, i) =>
          fc.record({
            handsOnMinutes: fc.integer({ min: 0, max: 5 }),
            waitMinutes: fc.integer({ min: 0, max: 8 }),
            needs: fc.subarray(Array.from({ length: i }, (_, k) => k)).chain((earlier) =>
              fc.tuple(...earlier.map((k) => fc.record({ key: fc.constant(`s${k}`), dry: fc.boolean() }))),
            ),
          }),
        ),
      ),
    }),
  )
  .map(({ staff, steps }) => ({
    staff,
    // Reversed, so the input order is not always a topological one.
    steps: steps.map((s, i): SolverStep => ({ key: `s${i}`, label: `step ${i}`, ...s })).reverse(),
  }));

describe('solveTurnover (property: equals an exhaustive search on random turnovers)', () => {
  it('returns a valid schedule with the exhaustive minimum', () => {
    fc.assert(
      fc.property(turnover, ({ steps, staff }) => {
        const schedule = solveTurnover({ steps, staff });
        expect(scheduleProblems(steps, staff, schedule)).toEqual([]);
        expect(schedule.requiredMinutes).toBe(exhaustiveMakespan(steps, staff));
      }),
      { numRuns: 400, seed: 20270314 },
    );
  });
});
