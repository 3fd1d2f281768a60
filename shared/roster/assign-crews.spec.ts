import fc from 'fast-check';
import { seededRandom } from '../turnover/testing/seeded-random';
import { assignCrews } from './assign-crews';
import { clusterJobs } from './clusters';
import { compareKeys } from './day-key';
import type { CrewProblem } from './crew-problem';
import { bruteForceCrews } from './testing/brute-force';
import { crewProblems } from './testing/check-crews';
import { randomCrewProblem } from './testing/crew-instances';
import { gapVerdict } from '../turnover/verdict';

const MIN = 60_000;
const at = (hh: number, mm = 0) => (hh * 60 + mm) * MIN;

/**
 * Invented example. MR 1 and MR 2 both free at 10:00; the next patients at 10:20 and 10:30.
 * One aide covers both; 20 minutes of work alone (all hands-on); walking 3 minutes (common practice, no source).
 */
function oneAideTwoRooms(): CrewProblem {
  return {
    walkMs: 3 * MIN,
    people: [{ startMs: at(7), endMs: at(15), breaks: [], roomIds: [1, 2] }],
    jobs: [
      { fromMs: at(10), toMs: at(10, 20), roomId: 1, availableMinutes: 20, wanted: 1, requiredMinutes: [0, 20], busyMinutes: [0, 20] },
      { fromMs: at(10), toMs: at(10, 30), roomId: 2, availableMinutes: 30, wanted: 1, requiredMinutes: [0, 20], busyMinutes: [0, 20] },
    ],
  };
}

function keyVector(problem: CrewProblem): number[] {
  const { key } = assignCrews(problem);
  return [key.unstaffed, key.problems, key.shortBy, key.requiredSum, ...key.required];
}

describe('assignCrews', () => {
  describe('invented example: one aide for two MR rooms whose patients leave at the same minute', () => {
    const problem = oneAideTwoRooms();

    it('turns MR 1 over first and sends the aide on to MR 2, which is then short by 13 min', () => {
      const { choices, key, provenOptimal } = assignCrews(problem);
      expect(choices.map((c) => c.crew)).toEqual([[0], [0]]);
      expect(choices[0]!.startMs).toBe(at(10));
      // 10:20 done in MR 1, 3 minutes' walk: MR 2 starts 10:23, ready 10:43 against 10:30.
      expect(choices[1]!.startMs).toBe(at(10, 23));
      expect(choices[1]!.outcome).toEqual({ unstaffed: 0, problem: 1, shortBy: 13, required: 43 });
      expect(key.problems).toBe(1);
      expect(provenOptimal).toBe(true);
    });

    it('gives the gap the verdict of its crew: short by 13', () => {
      const { choices } = assignCrews(problem);
      expect(gapVerdict({ availableMinutes: 30, requiredMinutes: choices[1]!.outcome.required })).toEqual({ verdict: 'short', shortByMinutes: 13 });
    });

    it('runs the turnover with fewer people rather than wait for a break to end', () => {
      // Invented example. MR 1 wants two; of its two people one is on a break 10:00–10:30.
      const twoWanted: CrewProblem = {
        walkMs: 0,
        people: [
          { startMs: at(7), endMs: at(15), breaks: [], roomIds: [1] },
          { startMs: at(7), endMs: at(15), breaks: [{ startMs: at(10), endMs: at(10, 30) }], roomIds: [1] },
        ],
        jobs: [{ fromMs: at(10), toMs: at(10, 25), roomId: 1, availableMinutes: 25, wanted: 2, requiredMinutes: [0, 20, 14], busyMinutes: [0, 20, 14] }],
      };
      const { choices } = assignCrews(twoWanted);
      expect(choices[0]!.crew).toEqual([0]);
      expect(choices[0]!.outcome.required).toBe(20);
    });
  });

  describe('edge cases', () => {
    it('marks a turnover nobody covers as unstaffed: short by its whole required time', () => {
      const { choices, key } = assignCrews({
        walkMs: 0,
        people: [{ startMs: at(7), endMs: at(15), breaks: [], roomIds: [2] }],
        jobs: [{ fromMs: at(10), toMs: at(10, 30), roomId: 1, availableMinutes: 30, wanted: 1, requiredMinutes: [0, 20], busyMinutes: [0, 20] }],
      });
      expect(choices[0]!.crew).toEqual([]);
      expect(choices[0]!.outcome).toEqual({ unstaffed: 1, problem: 1, shortBy: 20, required: 50 });
      expect(key.unstaffed).toBe(1);
    });

    it('does not start work the shift cannot finish', () => {
      const { choices } = assignCrews({
        walkMs: 0,
        people: [{ startMs: at(7), endMs: at(10, 10), breaks: [], roomIds: [1] }],
        jobs: [{ fromMs: at(10), toMs: at(10, 30), roomId: 1, availableMinutes: 30, wanted: 1, requiredMinutes: [0, 20], busyMinutes: [0, 20] }],
      });
      expect(choices[0]!.crew).toEqual([]);
    });

    it('stops at its node budget, keeps a valid schedule and says it is not proven optimal', () => {
      const rand = seededRandom(7);
      let unproven = 0;
      for (let i = 0; i < 40; i++) {
        const problem = randomCrewProblem(rand, { maxPeople: 3, maxWanted: 2 });
        const result = assignCrews(problem, { clusterWorkBudget: 1 });
        expect(crewProblems(problem, result)).toEqual([]);
        if (!result.provenOptimal) unproven++;
      }
      expect(unproven).toBeGreaterThan(0);
    });
  });

  describe('against brute force (every schedule of 2 rooms × up to 4 exams each, 1–3 people)', () => {
    const rand = seededRandom(20270315);
    const instances = Array.from({ length: 300 }, () => randomCrewProblem(rand, { maxExamsPerRoom: 4, maxPeople: 3, maxWanted: 2 }));

    it('finds the brute-force optimum by the stated order, with the same ready-at times and verdicts', () => {
      let split = 0;
      for (const problem of instances) {
        const { best } = bruteForceCrews(problem);
        expect(keyVector(problem)).toEqual(best.key);
        const { choices } = assignCrews(problem);
        const verdicts = (required: (j: number) => number) =>
          problem.jobs.map((job, j) => gapVerdict({ availableMinutes: job.availableMinutes, requiredMinutes: required(j) }));
        expect(verdicts((j) => choices[j]!.outcome.required)).toEqual(verdicts((j) => best.required[j]!));
        if (clusterJobs(problem).length > 1) split++;
      }
      // The instances exercise the split into clusters, not only one search over the day.
      expect(split).toBeGreaterThan(30);
    });

    it('proves every one of them optimal within the default budget', () => {
      expect(instances.every((problem) => assignCrews(problem).provenOptimal)).toBe(true);
    });

    it('meets wanted crews of three on instances with three people', () => {
      const r = seededRandom(11);
      for (let i = 0; i < 60; i++) {
        const problem = randomCrewProblem(r, { maxExamsPerRoom: 3, maxPeople: 3, maxWanted: 3 });
        expect(keyVector(problem)).toEqual(bruteForceCrews(problem).best.key);
      }
    });
  });

  describe('properties (fast-check, fixed seed)', () => {
    const problems = fc.integer({ min: 1, max: 2 ** 31 - 1 }).map((seed) => randomCrewProblem(seededRandom(seed), { maxPeople: 3, maxWanted: 3 }));

    it('never double-books a person, keeps everyone in their hours, off their breaks, in their rooms, and walks between rooms', () => {
      fc.assert(
        fc.property(problems, (problem) => {
          expect(crewProblems(problem, assignCrews(problem))).toEqual([]);
        }),
        { seed: 42, numRuns: 300 },
      );
    });

    it('never does worse than the greedy schedule (each turnover in order taking the crew best for itself)', () => {
      fc.assert(
        fc.property(problems, (problem) => {
          const exact = assignCrews(problem);
          const greedy = assignCrews(problem, { clusterWorkBudget: 0 });
          expect(compareKeys(exact.key, greedy.key)).toBeLessThanOrEqual(0);
        }),
        { seed: 42, numRuns: 200 },
      );
    });
  });

  describe('checker (the properties above would notice)', () => {
    it('reports a person in two rooms at once', () => {
      const problem = oneAideTwoRooms();
      const result = assignCrews(problem);
      result.choices[1]!.startMs = at(10, 21);
      expect(crewProblems(problem, result)).toEqual(['person 0: job 1 starts before job 0 ends and they walk over']);
    });
  });
});
