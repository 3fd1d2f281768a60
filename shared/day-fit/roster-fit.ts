import type { PlanChange } from '../api/changes';
import { withChanges } from '../fixes/apply-changes';
import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan } from '../turnover/day-plan-types';
import type { DayFitOptions, DayFitProposal, MipSolve } from './model';
import { fitProposal } from './fit-proposal';
import { fitDay } from './instance';
import { proposeExactWithRoster } from './roster-exact';
import { dayEnd, lexicallyLess, problemsOf, remainingWithPeople } from './roster-judge';
import { pushAlongRooms } from './roster-push';
import { settleBack } from './roster-settle';
import { arrangementOf, helperUses, improveInWindows } from './roster-windows';
import { solverReport, type SolveTally } from './solver-report';

/** Rounds of planning with the roster's crews at most (each a whole proposal, then the roster's judgement). */
const ROSTER_ROUNDS = 3;

/** The first round's share of the time: it does most of the work; later rounds only follow crews. */
const FIRST_ROUND_SHARE = 0.6;

/** The rounds' share of the whole budget at most: the rest is kept for the pushes and windows after them. */
const ROUNDS_SHARE = 0.5;

/**
 * Time for taking back the moves not needed (`settleBack`) after the pushes and windows, as a
 * share of their budget, on top of it (within the limit): clearing gaps comes first, and never
 * gives time up to it.
 */
const SETTLE_SHARE = 0.25;

/** Neighbourhood reaches a later round tries (the own room, then a block of rooms, 30 min). */
const LATER_ROUND_REACHES = 2;

type Propose = (input: DayPlanInput, solve: MipSolve, options: DayFitOptions) => DayFitProposal;

/**
 * "Make the day fit" on a day with a roster. A small day (each part of it that shares people at
 * most `rosterExactLimit` exams) is solved exactly with the roster's people in the MIP
 * (`proposeExactWithRoster`). A larger one is planned in rounds around the MIP that plans each
 * turnover with a number of people (`proposeWithStaff`) while the roster decides who actually
 * comes and when: each turnover the roster staffs with fewer people than its room's is planned with the
 * crew it gets (a staff cap, only lowered), and one whose crew starts late (a person busy in
 * another room, on a break, not yet on shift) gets that crew only from then (a clock time in
 * that room, only raised: every turnover into the exam there starts no earlier); the gaps the
 * roster finds short are the problems to clear; the proposal is judged with the roster's crews
 * and the caps and crew times follow that judgement, until they stop changing (at most 3
 * rounds, in half the budget). The round with the fewest gaps left by the roster's judgement
 * (then fewest exams moved, minutes, the earliest end) is taken; what it leaves is pushed along
 * its room (`pushAlongRooms`), tried window by window with the exact roster model
 * (`improveInWindows`) and pushed again, each step kept only when the roster finds fewer problem
 * gaps; then, in a quarter of the budget more (within the time limit), the moves that turn out
 * not to be needed are taken back (`settleBack`: fewer patients to call, never more gaps). That is
 * the proposal; its before, after and gaps left are the roster's, and a gap left for people says why in the gap panel's words ("Short by 6 min:
 * Aide 1 is in MR 2 until 10:12"), beside the solver's reason when it has one. The rounds are a
 * heuristic around the exact MIP: there the crews are not variables of the model, so such a
 * proposal is not proven optimal.
 *
 * @example
 * const proposal = proposeWithRoster(input, highsSolve, {}, proposeWithStaff);
 * proposal.remaining[0]?.reason; // 'Short by 4 min: Aide 1 is in MR 2 until 10:12'
 */
export function proposeWithRoster(input: DayPlanInput, solve: MipSolve, options: DayFitOptions, proposeWithStaff: Propose): DayFitProposal {
  const now = options.now ?? Date.now;
  const started = now();
  const limit = options.timeLimitMs ?? 8_000;
  const { roster: _roster, ...ownStaff } = input;
  const beforePlan = computeDayPlan(input);
  const exact = proposeExactWithRoster(input, solve, options, beforePlan, started + limit);
  if (exact) return exact;
  const deadline = started + rosterBudgetMs(beforePlan.summary.short + beforePlan.summary.overlap, limit, options.rosterMsPerGap);
  const caps = new Map<number, number>();
  const crewFrom = new Map<number, Map<number, number>>();
  followCrews(caps, crewFrom, beforePlan);
  let best: { proposal: DayFitProposal; plan: DayPlan; score: number[] } | null = null;
  // The gaps the roster finds short, before and after each round: the seeds the MIP must clear.
  const problems = new Set(problemsOf(beforePlan));
  const tally: SolveTally = { solves: 0, clusters: 0, mipGap: 0, timeLimited: false, neighbourhood: false };
  let rounds = 0;
  const roundsDeadline = started + (deadline - started) * ROUNDS_SHARE;
  for (let round = 0; round < ROSTER_ROUNDS; round++) {
    const left = roundsDeadline - now();
    if (round > 0 && left <= 100) break;
    const share = round === 0 ? FIRST_ROUND_SHARE : 1 / (ROSTER_ROUNDS - round);
    const capped = { ...ownStaff, staffOverrides: { ...input.staffOverrides, ...Object.fromEntries(caps) } };
    const proposal = proposeWithStaff(capped, solve, {
      ...options,
      crewFrom: Object.fromEntries([...crewFrom].map(([id, rooms]) => [id, Object.fromEntries(rooms)])),
      problems: [...problems],
      timeLimitMs: Math.max(100, left * share),
      // Later rounds follow the crews with the two nearer reaches; the wide ones are tried once.
      reaches: round === 0 ? options.reaches : Math.min(options.reaches ?? LATER_ROUND_REACHES, LATER_ROUND_REACHES),
    });
    rounds++;
    tally.solves += proposal.solver.solves;
    tally.clusters += proposal.solver.clusters;
    tally.mipGap = Math.max(tally.mipGap, proposal.solver.mipGap);
    tally.timeLimited ||= proposal.solver.status === 'time-limit';
    tally.neighbourhood ||= proposal.solver.scope === 'neighbourhood';
    // A helper's staffing change starts from the day's own override, not from a cap.
    const changes = proposal.changes.map((change): PlanChange => (change.type === 'staffing' ? { ...change, from: input.staffOverrides?.[change.toExamId] ?? null } : change));
    const plan = computeDayPlan(withChanges(input, changes));
    for (const id of problemsOf(plan)) problems.add(id);
    const score = [plan.summary.short + plan.summary.overlap, proposal.objective.examsMoved, proposal.objective.minutesMoved, dayEnd(plan)];
    if (!best || lexicallyLess(score, best.score)) best = { proposal: { ...proposal, changes }, plan, score };
    if (score[0] === 0 || !followCrews(caps, crewFrom, plan)) break;
  }
  // What the rounds leave: pushed along its room, then window by window with the exact roster
  // model, then pushed again; each step kept only when the roster finds the whole day better.
  let windows = 0;
  let pushes = 0;
  let returned = 0;
  const day = fitDay(input, options);
  let arrangement = arrangementOf(day, best!.proposal.changes);
  let plan = best!.plan;
  if (best!.score[0]! > 0 && deadline - now() > 200) {
    const push = () => {
      const pushed = pushAlongRooms(day, arrangement, plan, options, deadline);
      ({ arrangement, plan } = pushed);
      pushes += pushed.kept;
    };
    push();
    if (problemsOf(plan).length > 0 && (options.rosterWindows ?? true) && deadline - now() > 200) {
      const improved = improveInWindows(day, arrangement, plan, solve, options, deadline, tally);
      ({ arrangement, plan } = improved);
      windows = improved.kept;
      if (windows > 0 && problemsOf(plan).length > 0) push();
    }
  }
  // Then the moves that turn out not to be needed are taken back, in a quarter of the budget more (within the limit).
  const settleUntil = Math.min(started + limit, deadline + (deadline - started) * SETTLE_SHARE);
  if (settleUntil - now() > 100) {
    const settled = settleBack(day, arrangement, plan, options, settleUntil);
    ({ arrangement, plan } = settled);
    returned = settled.returned;
  }
  if (windows + pushes + returned > 0) {
    const proposal = fitProposal(day, arrangement.places, helperUses(day, arrangement, plan), beforePlan.summary, tally, 0, false);
    best = { proposal, plan, score: [] };
  }
  const { proposal, plan: finalPlan } = best!;
  const stays = new Map(Object.entries(options.fixed ?? {}).map(([id, why]) => [Number(id), why]));
  const after = [windows > 0 ? 'windows around it with the roster’s people' : '', pushes > 0 ? 'pushes along its room' : ''].filter(Boolean).join(' and ');
  const tried = `short with the roster’s crews; ${rounds} round${rounds === 1 ? '' : 's'} of planning with them${after ? `, then ${after},` : ''} did not clear it`;
  // After windows or pushes the own-staff reasons of the rebuilt proposal say nothing of the roster: only the people's side and the fixed exams.
  const remaining = remainingWithPeople(input, finalPlan, windows + pushes + returned > 0 ? [] : proposal.remaining, stays, tried);
  const nothingToDo = beforePlan.summary.short + beforePlan.summary.overlap === 0;
  return {
    ...proposal,
    remaining,
    objective: { ...proposal.objective, gapsLeft: remaining.length },
    before: beforePlan.summary,
    after: finalPlan.summary,
    solver: {
      ...solverReport(tally, nothingToDo, now() - started),
      roster: 'rounds',
      rosterRounds: rounds,
      ...(windows > 0 ? { rosterWindows: windows } : {}),
      ...(pushes > 0 ? { rosterPushes: pushes } : {}),
      ...(returned > 0 ? { rosterReturned: returned } : {}),
    },
  };
}

/** The least budget a roster day planned in rounds gets with `rosterMsPerGap`: a round, the pushes and a window or two. */
export const ROSTER_LEAST_MS = 2_000;

/**
 * The time a roster day planned in rounds may take: `limit`, or with `msPerGap` that much per
 * problem gap the roster finds before (at least {@link ROSTER_LEAST_MS}, at most `limit`).
 *
 * @example
 * rosterBudgetMs(13, 8_000, 300); // 3900
 */
export function rosterBudgetMs(problemGaps: number, limit: number, msPerGap: number | undefined): number {
  if (msPerGap === undefined) return limit;
  return Math.min(limit, Math.max(ROSTER_LEAST_MS, msPerGap * problemGaps));
}

/**
 * What the roster's crews do to each turnover, carried into the next round: one staffed with
 * fewer people than it wanted (at least one) is capped at the people it got, and one whose crew
 * started late has its crew, in that room, from that clock time (the room's free time plus the
 * wait): moving the exam before it earlier does not bring the person sooner. Caps only go down
 * and crew times only later, so the rounds end; answers whether anything changed.
 */
function followCrews(caps: Map<number, number>, crewFrom: Map<number, Map<number, number>>, plan: DayPlan): boolean {
  let changed = false;
  for (const room of plan.rooms) {
    for (const gap of room.gaps) {
      const why = gap.people;
      if (!why) continue;
      if (why.got >= 1 && why.got < why.wanted && why.got < (caps.get(gap.toExamId) ?? Infinity)) {
        caps.set(gap.toExamId, why.got);
        changed = true;
      }
      if (why.waitedMinutes <= 0) continue;
      const from = Date.parse(gap.readyAt) - (gap.requiredMinutes - why.waitedMinutes) * 60_000;
      let rooms = crewFrom.get(gap.toExamId);
      if (!rooms) crewFrom.set(gap.toExamId, (rooms = new Map()));
      if (from > (rooms.get(room.id) ?? -Infinity)) {
        rooms.set(room.id, from);
        changed = true;
      }
    }
  }
  return changed;
}
