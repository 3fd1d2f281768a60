import { proposeDayFit, type DayFitProposal, type MipSolve } from '../../../shared/day-fit';
import { bestByEnumeration, type FitScore } from '../../../shared/day-fit/testing/enumerate';
import { smallDay } from '../../../shared/day-fit/testing/small-days';
import { fitDay } from '../../../shared/day-fit/instance';
import { highsSolver } from './highs-solve';

let solve: MipSolve;
beforeAll(async () => {
  solve = await highsSolver();
}, 30_000);

function scoreOf(input: Parameters<typeof fitDay>[0], proposal: DayFitProposal): FitScore {
  const day = fitDay(input, {});
  const end = proposal.objective.dayEndsAt ? day.minuteOf(proposal.objective.dayEndsAt) : 0;
  return [proposal.remaining.length, proposal.objective.examsMoved, proposal.objective.minutesMoved, end];
}

describe('proposeDayFit against exhaustive enumeration', () => {
  // Invented small days: two MR rooms, up to 6 exams, starts on a 15-minute grid (the MIP on the same grid).
  for (let seed = 1; seed <= 40; seed++) {
    it(`finds the enumeration's best proposal (invented day ${seed})`, () => {
      const { input, fixed } = smallDay(seed, 15);
      const best = bestByEnumeration(input, { grid: 15, fixed });
      const proposal = proposeDayFit(input, solve, { fixed, gridMinutes: 15, timeLimitMs: 60_000 });
      expect(proposal.solver.status === 'optimal' || proposal.solver.status === 'nothing-to-do').toBe(true);
      if (proposal.solver.status === 'nothing-to-do') expect(best.score[1]).toBe(0);
      else if (best.score[0] === 0) expect(scoreOf(input, proposal)).toEqual(best.score);
      // No combination clears every gap: the proposal says so and leaves no fewer than the best.
      else expect(proposal.remaining.length).toBeGreaterThanOrEqual(best.score[0]);
    }, 120_000);
  }
});
