import { proposeDayFit } from '../../shared/day-fit';
import { spareHelpers } from '../../shared/day-fit/roster-helpers';
import { computeDayPlan } from '../../shared/turnover/day-plan';
import { bestByEnumerationWithRoster } from '../../shared/day-fit/testing/enumerate';
import { fitWorkDay } from '../../shared/day-fit/testing/fit-days';
import { smallRosterDay } from '../../shared/day-fit/testing/small-days';
import { highsSolver } from '../../server/services/day-fit/highs-solve';
import { createDayFitPool, DAY_FIT_SOLVE_MS, ROSTER_MS_PER_GAP } from '../../server/workers/day-fit-pool';

/**
 * "Make the day fit" on invented working days (shared/day-fit/testing/fit-days.ts): 4 rooms and
 * 80 exams (target < 1 s), 40 rooms and 1,200 exams (target < 10 s), each with the time limit the
 * server gives a proposal (what a charge technologist waits for), with the solver's status,
 * optimality gap, scope and what stays unsolved; both again with an invented roster (planned with
 * its crews, the spare people as helpers and the budget per problem gap, as the server does); then the small day once more through the
 * worker pool (HiGHS loading in a fresh thread included). Printed, never asserted.
 *
 * @example
 * for (const line of await benchDayFit()) console.log(line);
 */
/** Aides on the invented roster for each block of four rooms (which want seven people at once). */
const PEOPLE_PER_BLOCK = 5;

export async function benchDayFit(): Promise<string[]> {
  const solve = await highsSolver();
  const lines: string[] = [];
  for (const [name, size, target, budget] of [
    ['4 rooms / 80 exams', { rooms: 4, examsPerRoom: 20 }, 1_000, DAY_FIT_SOLVE_MS],
    ['40 rooms / 1,200 exams', { rooms: 40, examsPerRoom: 30 }, 10_000, DAY_FIT_SOLVE_MS],
  ] as const) {
    const { input, fixed } = fitWorkDay(1, size);
    const t0 = performance.now();
    const p = proposeDayFit(input, solve, { fixed, timeLimitMs: budget });
    const ms = performance.now() - t0;
    lines.push(
      `day fit, ${name} (${input.exams.length} exams, ${p.before.short + p.before.overlap} problem gaps): ${ms.toFixed(0)} ms (target < ${target} ms) — ` +
        `${p.solver.status}, optimality gap ${p.solver.mipGap >= 1 ? 'unknown' : `${(p.solver.mipGap * 100).toFixed(1)} %`}, ${p.solver.scope}, ${p.solver.clusters} clusters, ${p.solver.solves} solves; ` +
        `${p.objective.examsMoved} moved, ${p.objective.minutesMoved} min, ${p.remaining.length} gaps left`,
    );
  }
  // The same days with an invented roster, as the server asks: five aides for each block of four
  // rooms (three MR rooms of two people, a CT room of one; every other aide with a half-hour break
  // at noon or half past), the people it leaves idle offered as helpers, 3 min walking.
  for (const [name, size, target] of [
    ['4 rooms / 80 exams with a roster', { rooms: 4, examsPerRoom: 20 }, 1_000],
    ['40 rooms / 1,200 exams with a roster', { rooms: 40, examsPerRoom: 30 }, 10_000],
  ] as const) {
    const { input, fixed } = rosterWorkDay(1, size);
    const t0 = performance.now();
    const plan = computeDayPlan(input);
    const p = proposeDayFit(input, solve, { fixed, helpers: spareHelpers(plan.people!), walkingMinutes: 3, timeLimitMs: DAY_FIT_SOLVE_MS, rosterMsPerGap: ROSTER_MS_PER_GAP });
    const ms = performance.now() - t0;
    lines.push(
      `day fit, ${name} (${input.roster.people.length} people, ${p.before.short + p.before.overlap} problem gaps with the roster): ${ms.toFixed(0)} ms (target < ${target} ms) — ` +
        `${p.solver.status}, ${p.solver.rosterRounds} rounds, ${p.solver.rosterPushes ?? 0} pushes along rooms, ${p.solver.rosterWindows ?? 0} windows, ${p.solver.rosterReturned ?? 0} moves taken back, ${p.solver.solves} solves; ` +
        `${p.objective.examsMoved} moved, ${p.objective.minutesMoved} min, ${p.remaining.length} gaps left (planned in rounds: not proven optimal)`,
    );
  }
  // What the budget per problem gap gives away: the 80-exam roster day, seeds 1–3, with it and with the whole limit.
  const ways = [ROSTER_MS_PER_GAP, undefined] as const;
  const figures = ways.map(() => ({ left: [] as number[], ms: [] as number[] }));
  for (let seed = 1; seed <= 3; seed++) {
    const { input, fixed } = rosterWorkDay(seed, { rooms: 4, examsPerRoom: 20 });
    const helpers = spareHelpers(computeDayPlan(input).people!);
    ways.forEach((rosterMsPerGap, k) => {
      const t0 = performance.now();
      const p = proposeDayFit(input, solve, { fixed, helpers, walkingMinutes: 3, timeLimitMs: DAY_FIT_SOLVE_MS, rosterMsPerGap });
      figures[k]!.ms.push(performance.now() - t0);
      figures[k]!.left.push(p.remaining.length);
    });
  }
  lines.push(
    `day fit with a roster, 4 rooms / 80 exams, invented days 1–3: ${ROSTER_MS_PER_GAP} ms per problem gap leaves ${figures[0]!.left.join('/')} gaps in ${figures[0]!.ms.map((ms) => ms.toFixed(0)).join('/')} ms; ` +
      `the whole ${DAY_FIT_SOLVE_MS} ms leaves ${figures[1]!.left.join('/')} in ${figures[1]!.ms.map((ms) => ms.toFixed(0)).join('/')} ms`,
  );
  // Small invented roster days against brute force with the roster's crews (a quality figure,
  // not a time): the exact model (its people in the MIP) and, for comparison, the rounds (with
  // their pushes and windows) that plan a larger day. No helpers, as the brute force tries none.
  const days = 60;
  for (const [way, rosterExactLimit] of [['exact', undefined], ['in rounds', 0]] as const) {
    let equal = 0;
    let moreGaps = 0;
    let slowest = 0;
    for (let seed = 21; seed < 21 + days; seed++) {
      const { input, fixed } = smallRosterDay(seed, 30);
      const best = bestByEnumerationWithRoster(input, { grid: 30, fixed });
      const t0 = performance.now();
      const p = proposeDayFit(input, solve, { fixed, gridMinutes: 30, timeLimitMs: DAY_FIT_SOLVE_MS, rosterExactLimit, helpersFromRoster: false });
      slowest = Math.max(slowest, performance.now() - t0);
      const end = p.objective.dayEndsAt ? Math.round((Date.parse(p.objective.dayEndsAt) - Date.parse(`${input.date}T00:00:00-05:00`)) / 60_000) : 0;
      const score = [p.remaining.length, p.objective.examsMoved, p.objective.minutesMoved, end];
      if (score.every((v, k) => v === best.score[k])) equal++;
      if (score[0]! > best.score[0]) moreGaps++;
    }
    lines.push(`day fit with a roster (${way}) against brute force on ${days} small invented roster days (2 rooms, up to 3 exams each, 1–3 aides): equal to the best on ${equal}, more gaps left on ${moreGaps}; slowest ${slowest.toFixed(0)} ms`);
  }
  // The exact model at its size limit on whole minutes (what the server solves): 2 rooms, up to 4 exams each.
  const times: number[] = [];
  let limited = 0;
  for (let seed = 1; seed <= 12; seed++) {
    const { input, fixed } = smallRosterDay(seed, 5, { mostPerRoom: 4, breaks: seed % 2 === 0 });
    const t0 = performance.now();
    const p = proposeDayFit(input, solve, { fixed, timeLimitMs: DAY_FIT_SOLVE_MS });
    times.push(performance.now() - t0);
    if (p.solver.status === 'time-limit') limited++;
  }
  times.sort((a, b) => a - b);
  lines.push(`day fit with a roster, exact, 12 small invented days of up to 8 exams on whole minutes: median ${times[6]!.toFixed(0)} ms, slowest ${times[11]!.toFixed(0)} ms, ${limited} stopped at the ${DAY_FIT_SOLVE_MS} ms limit`);
  const pool = createDayFitPool();
  try {
    const { input, fixed } = fitWorkDay(1, { rooms: 4, examsPerRoom: 20 });
    const t0 = performance.now();
    await pool.propose('bench', { input, options: { fixed } });
    lines.push(`day fit through the worker, 4 rooms / 80 exams, first call (thread and HiGHS start included): ${(performance.now() - t0).toFixed(0)} ms`);
  } finally {
    await pool.close();
  }
  return lines;
}

/**
 * An invented working day with an invented roster, as the server asks: five aides for each block
 * of four rooms (three MR rooms of two people, a CT room of one; every other aide with a
 * half-hour break at noon or half past), 3 min walking.
 */
function rosterWorkDay(seed: number, size: { rooms: number; examsPerRoom: number }) {
  const { input: plain, fixed } = fitWorkDay(seed, size);
  const people = Array.from({ length: Math.ceil(size.rooms / 4) }, (_, block) => {
    const roomIds = plain.rooms.slice(block * 4, block * 4 + 4).map((r) => r.id);
    return Array.from({ length: PEOPLE_PER_BLOCK }, (_, k) => ({
      id: `p${block}-${k}`, name: null, label: `Aide ${block * PEOPLE_PER_BLOCK + k + 1}`, role: 'aide' as const, start: '07:00', end: '19:00',
      breaks: k % 2 === 0 ? [{ start: k % 4 === 0 ? '12:00' : '12:30', end: k % 4 === 0 ? '12:30' : '13:00' }] : [], roomIds,
    }));
  }).flat();
  const input = { ...plain, roster: { source: 'day' as const, walkingMinutes: 3, people } };
  return { input, fixed };
}
