import { MOBILITIES, PRECAUTIONS } from './model';
import { CT_PROTOCOL, DEFAULT_PRODUCTS, GENERIC_PROTOCOL, MR_PROTOCOL } from './demo-protocols';
import { solveTurnover } from './solver';
import { buildStepSet } from './step-set';
import { scheduleProblems } from './testing/check-schedule';
import { feasibleWithin } from './testing/exhaustive-solver';
import { exam, MR_ROOM } from './testing/fixtures';

/*
 * Proof of optimality on every turnover the default protocols can produce: for each combination
 * of the leaving exam's precaution (5) and mobility (3), a coil change or not (2), the arriving
 * exam's contrast (2), and 1–3 people, the solver's schedule is checked valid and an independent
 * exhaustive search (testing/exhaustive-solver.ts: every order × every person, no shared code
 * with the solver) confirms that no schedule finishes one minute sooner. With whole-minute data
 * an optimum is a whole number, so "feasible at N, infeasible at N − 1" proves N is the minimum.
 */
const cases = PRECAUTIONS.flatMap((precaution) =>
  MOBILITIES.flatMap((mobility) =>
    [false, true].flatMap((coilChange) =>
      [false, true].flatMap((contrast) => [1, 2, 3].map((staff) => ({ precaution, mobility, coilChange, contrast, staff }))),
    ),
  ),
);

describe('solveTurnover (exhaustive proof of optimality)', () => {
  it('covers all 180 combinations', () => {
    expect(cases).toHaveLength(5 * 3 * 2 * 2 * 3);
  });

  describe.each([
    ['MR', MR_PROTOCOL],
    ['CT', CT_PROTOCOL],
    ['generic', GENERIC_PROTOCOL],
  ] as const)('%s protocol', (_name, protocol) => {
    it.each(cases)(
      'returns the minimum for $precaution, $mobility, coil change $coilChange, contrast $contrast, staff $staff',
      ({ precaution, mobility, coilChange, contrast, staff }) => {
        const { steps } = buildStepSet({
          leaving: exam({ precaution, mobility, coil: 'head' }),
          arriving: exam({ contrast, coil: coilChange ? 'knee' : 'head' }),
          room: MR_ROOM,
          protocol,
          products: DEFAULT_PRODUCTS,
          staff,
        });
        const schedule = solveTurnover({ steps, staff });
        expect(scheduleProblems(steps, staff, schedule)).toEqual([]);
        expect(feasibleWithin(steps, staff, schedule.requiredMinutes)).toBe(true);
        expect(feasibleWithin(steps, staff, schedule.requiredMinutes - 1)).toBe(false);
      },
    );
  });
});
