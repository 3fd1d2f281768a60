import { clusterJobs } from './clusters';
import { arrivalAt, crewStart, eligiblePeople, MINUTE, personFit, type CrewJob, type CrewProblem, type PersonState } from './crew-problem';
import { compareKeys, jobOutcome, keyOf, unstaffedOutcome, type DayKey, type JobOutcome } from './day-key';

/** A job's crew (person indices; empty: nobody could do it) and when it starts (NaN when nobody). */
export interface CrewChoice {
  crew: number[];
  startMs: number;
  outcome: JobOutcome;
}

export interface CrewAssignment {
  /** Per job, in job order. */
  choices: CrewChoice[];
  key: DayKey;
  /** False when a cluster's search ran out of budget: its best schedule found so far stands. */
  provenOptimal: boolean;
  /** Search nodes visited (for tests and the bench). */
  nodes: number;
}

export interface AssignCrewsOptions {
  /**
   * Work one cluster's search may do (crews tried and lower bounds taken, each a unit) before it
   * stops. Default 40,000.
   */
  clusterWorkBudget?: number;
  /** Work the whole day's searches may do; clusters after that keep their greedy schedule. Default 120,000. */
  dayWorkBudget?: number;
}

/**
 * The crews for every turnover of the day, optimal by the order of {@link compareKeys} under the
 * schedule semantics of `crew-problem.ts`.
 *
 * Exact: the jobs are split into clusters that compete for the same people
 * ({@link clusterJobs}); each cluster starts from its greedy schedule (each job in order takes
 * the crew best for itself — the documented heuristic) and a depth-first branch and bound over
 * every crew of 1 … wanted people who cover the room improves it. Its lower bound counts each job
 * still open as started the moment its room is free or, if later, the first moment anyone covering
 * it can be there (from where people stand now: more work only makes them later), with its largest
 * possible crew. Interchangeable people (same shift, breaks and rooms, standing in the same place,
 * free at the same time) are tried once. The search's work is bounded (a unit per crew tried and per
 * job bounded): when a cluster reaches its budget (or the day's), the best schedule found so far
 * stands and `provenOptimal` is false, so a tangled, understaffed day costs tens of milliseconds,
 * never seconds.
 *
 * @example
 * const { choices, key, provenOptimal } = assignCrews({ jobs, people, walkMs: 3 * 60_000 });
 * choices[0].crew; // [1]: person 1 turns the first room over
 */
export function assignCrews(problem: CrewProblem, options: AssignCrewsOptions = {}): CrewAssignment {
  const clusterBudget = options.clusterWorkBudget ?? 40_000;
  let dayBudget = options.dayWorkBudget ?? 120_000;
  const choices: CrewChoice[] = new Array(problem.jobs.length);
  const kinds = personKinds(problem);
  let provenOptimal = true;
  let nodes = 0;
  for (const cluster of clusterJobs(problem)) {
    const search = new ClusterSearch(problem, cluster, kinds, Math.min(clusterBudget, dayBudget));
    const found = search.run();
    nodes += search.nodes;
    dayBudget = Math.max(0, dayBudget - search.work);
    if (!found.proven) provenOptimal = false;
    cluster.forEach((j, i) => (choices[j] = found.choices[i]!));
  }
  return { choices, key: keyOf(choices.map((c) => c.outcome)), provenOptimal, nodes };
}

/** People with the same shift, breaks and rooms get the same kind: swapping two of them changes nothing. */
function personKinds(problem: CrewProblem): number[] {
  const seen = new Map<string, number>();
  return problem.people.map((person, p) => {
    const sig = JSON.stringify([person.startMs, person.endMs, person.breaks, [...person.roomIds].sort((a, b) => a - b)]);
    if (!seen.has(sig)) seen.set(sig, p);
    return seen.get(sig)!;
  });
}

interface Sums {
  unstaffed: number;
  problems: number;
  shortBy: number;
  requiredSum: number;
}

class ClusterSearch {
  nodes = 0;
  /** Crews tried and jobs bounded, in this search. */
  work = 0;
  private best: { key: DayKey; choices: CrewChoice[] } | null = null;
  private aborted = false;
  private readonly jobs: CrewJob[];
  private readonly eligible: number[][];
  /** Each open job's bound on its required minutes, filled by `promising`. */
  private readonly boundRequired: number[];
  private readonly bound: JobOutcome = { unstaffed: 0, problem: 0, shortBy: 0, required: 0 };

  constructor(
    private readonly problem: CrewProblem,
    private readonly cluster: readonly number[],
    private readonly kinds: readonly number[],
    private readonly budget: number,
  ) {
    this.jobs = cluster.map((j) => problem.jobs[j]!);
    this.eligible = this.jobs.map((job) => eligiblePeople(problem, job));
    this.boundRequired = new Array<number>(this.jobs.length).fill(0);
  }

  run(): { choices: CrewChoice[]; proven: boolean } {
    const states = this.problem.people.map((): PersonState => ({ freeMs: -Infinity, roomId: null }));
    this.greedy(states);
    if (this.promising(0, states, [], ZERO)) this.dfs(0, states, [], ZERO);
    return { choices: this.best!.choices, proven: !this.aborted };
  }

  /** The greedy schedule: each job in order takes the crew best for itself. */
  private greedy(initial: PersonState[]): void {
    const states = initial.map((s) => ({ ...s }));
    const choices: CrewChoice[] = [];
    this.jobs.forEach((job, i) => {
      const option = this.options(i, states)[0]!;
      choices.push(option);
      for (const p of option.crew) states[p] = { freeMs: option.startMs + job.busyMinutes[option.crew.length]! * MINUTE, roomId: job.roomId };
    });
    this.best = { key: keyOf(choices.map((c) => c.outcome)), choices };
  }

  private dfs(i: number, states: PersonState[], chosen: CrewChoice[], sums: Sums): void {
    if (i === this.jobs.length) {
      const key = keyOf(chosen.map((c) => c.outcome));
      if (compareKeys(key, this.best!.key) < 0) this.best = { key, choices: [...chosen] };
      return;
    }
    this.nodes++;
    const job = this.jobs[i]!;
    for (const option of this.options(i, states)) {
      const o = option.outcome;
      const next: Sums = { unstaffed: sums.unstaffed + o.unstaffed, problems: sums.problems + o.problem, shortBy: sums.shortBy + o.shortBy, requiredSum: sums.requiredSum + o.required };
      chosen.push(option);
      const saved = option.crew.map((p) => states[p]!);
      for (const p of option.crew) states[p] = { freeMs: option.startMs + job.busyMinutes[option.crew.length]! * MINUTE, roomId: job.roomId };
      if (this.promising(i + 1, states, chosen, next)) this.dfs(i + 1, states, chosen, next);
      option.crew.forEach((p, q) => (states[p] = saved[q]!));
      chosen.pop();
      if (this.aborted) return;
    }
  }

  /**
   * Whether the jobs from i on, bounded from where people stand, could still beat the best
   * schedule; false too once the budget is spent (the search then stops).
   */
  private promising(i: number, states: readonly PersonState[], chosen: readonly CrewChoice[], sums: Sums): boolean {
    if (this.aborted) return false;
    // Plain numbers and one reused array: this runs at every node, and garbage is what costs here.
    let unstaffed = sums.unstaffed;
    let problems = sums.problems;
    let shortBy = sums.shortBy;
    let requiredSum = sums.requiredSum;
    for (let q = i; q < this.jobs.length; q++) {
      const o = this.lowerBound(q, states);
      this.boundRequired[q] = o.required;
      unstaffed += o.unstaffed;
      problems += o.problem;
      shortBy += o.shortBy;
      requiredSum += o.required;
    }
    if (this.work > this.budget) {
      this.aborted = true;
      return false;
    }
    const best = this.best!.key;
    const order = unstaffed - best.unstaffed || problems - best.problems || shortBy - best.shortBy || requiredSum - best.requiredSum;
    if (order !== 0) return order < 0;
    // A tie so far: ready-at gap by gap decides, the chosen jobs' then the bounds'.
    for (let q = 0; q < this.jobs.length; q++) {
      const mine = q < i ? chosen[q]!.outcome.required : this.boundRequired[q]!;
      if (mine !== best.required[q]) return mine < best.required[q]!;
    }
    return false;
  }

  /** Every crew for job i from where people stand, best for the job first; one per interchangeable crew. */
  private options(i: number, states: readonly PersonState[]): CrewChoice[] {
    const job = this.jobs[i]!;
    const eligible = this.eligible[i]!;
    const out: (CrewChoice & { order: number })[] = [];
    const seen = new Set<string>();
    const crew: number[] = [];
    const maxK = Math.min(job.wanted, eligible.length);
    const visit = (from: number): void => {
      if (crew.length > 0) {
        const sig = crew.map((p) => `${this.kinds[p]}@${states[p]!.freeMs}@${states[p]!.roomId}`).sort().join('|');
        if (!seen.has(sig)) {
          seen.add(sig);
          this.work++;
          const startMs = crewStart(this.problem, job, crew, states, crew.length);
          if (startMs !== Infinity) out.push({ crew: [...crew], startMs, outcome: jobOutcome(job, startMs, crew.length), order: out.length });
        }
      }
      if (crew.length === maxK) return;
      for (let q = from; q < eligible.length; q++) {
        crew.push(eligible[q]!);
        visit(q + 1);
        crew.pop();
      }
    };
    visit(0);
    if (out.length === 0) return [{ crew: [], startMs: NaN, outcome: unstaffedOutcome(job) }];
    // Best for this job first; a smaller crew on a tie (it leaves people for other rooms).
    out.sort(
      (a, b) =>
        a.outcome.problem - b.outcome.problem ||
        a.outcome.shortBy - b.outcome.shortBy ||
        a.outcome.required - b.outcome.required ||
        a.crew.length - b.crew.length ||
        a.order - b.order,
    );
    return out.map(({ order: _order, ...choice }) => choice);
  }

  /**
   * Job i's best case from where people stand: its largest crew, starting when the room is free
   * or, if later, when the first person covering it can arrive and work the shortest crew's time
   * (more work before it only makes everyone later). Certain to be unstaffed when nobody covering
   * it can work at all from there.
   */
  private lowerBound(i: number, states: readonly PersonState[]): JobOutcome {
    const job = this.jobs[i]!;
    const eligible = this.eligible[i]!;
    this.work++;
    const maxK = Math.min(job.wanted, eligible.length);
    if (maxK === 0) return unstaffedOutcome(job);
    let shortest = Infinity;
    let fewest = Infinity;
    for (let k = 1; k <= maxK; k++) {
      shortest = Math.min(shortest, job.busyMinutes[k]! * MINUTE);
      fewest = Math.min(fewest, job.requiredMinutes[k]!);
    }
    let start = Infinity;
    for (const p of eligible) {
      const from = Math.max(job.fromMs, arrivalAt(states[p]!, job.roomId, this.problem.walkMs));
      start = Math.min(start, personFit(this.problem.people[p]!, from, shortest));
    }
    if (start === Infinity) return unstaffedOutcome(job);
    const required = Math.ceil((start - job.fromMs) / MINUTE - 1e-9) + fewest;
    const o = this.bound;
    o.unstaffed = 0;
    o.problem = required > job.availableMinutes ? 1 : 0;
    o.shortBy = Math.max(0, required - job.availableMinutes);
    o.required = required;
    return o;
  }
}

const ZERO: Sums = { unstaffed: 0, problems: 0, shortBy: 0, requiredSum: 0 };
