import { clusterJobs } from './clusters';
import { crewStart, eligiblePeople, MINUTE, personFit, type CrewJob, type CrewProblem, type PersonState } from './crew-problem';
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
  /** Nodes one cluster may visit before its search stops. Default 20,000. */
  clusterNodeBudget?: number;
  /** Nodes the whole day may visit; clusters after that keep their greedy schedule. Default 200,000. */
  dayNodeBudget?: number;
}

/**
 * The crews for every turnover of the day, optimal by the order of {@link compareKeys} under the
 * schedule semantics of `crew-problem.ts`.
 *
 * Exact: the jobs are split into clusters that compete for the same people
 * ({@link clusterJobs}); each cluster starts from its greedy schedule (each job in order takes
 * the crew best for itself — the documented heuristic) and a depth-first branch and bound over
 * every crew of 1 … wanted people who cover the room improves it, pruned by a lower bound that
 * counts each job still open as started the moment its room is free with its largest possible
 * crew. Interchangeable people (same shift, breaks and rooms, standing in the same place, free at
 * the same time) are tried once. When a cluster's search reaches its node budget (or the day's),
 * the best schedule found so far stands and `provenOptimal` is false.
 *
 * @example
 * const { choices, key, provenOptimal } = assignCrews({ jobs, people, walkMs: 3 * 60_000 });
 * choices[0].crew; // [1]: person 1 turns the first room over
 */
export function assignCrews(problem: CrewProblem, options: AssignCrewsOptions = {}): CrewAssignment {
  const clusterBudget = options.clusterNodeBudget ?? 20_000;
  let dayBudget = options.dayNodeBudget ?? 200_000;
  const choices: CrewChoice[] = new Array(problem.jobs.length);
  const kinds = personKinds(problem);
  let provenOptimal = true;
  let nodes = 0;
  for (const cluster of clusterJobs(problem)) {
    const search = new ClusterSearch(problem, cluster, kinds, Math.min(clusterBudget, dayBudget));
    const found = search.run();
    nodes += search.nodes;
    dayBudget = Math.max(0, dayBudget - search.nodes);
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

class ClusterSearch {
  nodes = 0;
  private best: { key: DayKey; choices: CrewChoice[] } | null = null;
  private aborted = false;
  private readonly jobs: CrewJob[];
  private readonly eligible: number[][];
  /** Lower bounds of the jobs from position i on (sums), and of each job alone. */
  private readonly lbSuffix: { unstaffed: number; problems: number; shortBy: number; requiredSum: number }[];
  private readonly lbJob: JobOutcome[];

  constructor(
    private readonly problem: CrewProblem,
    private readonly cluster: readonly number[],
    private readonly kinds: readonly number[],
    private readonly budget: number,
  ) {
    this.jobs = cluster.map((j) => problem.jobs[j]!);
    this.eligible = this.jobs.map((job) => eligiblePeople(problem, job));
    this.lbJob = this.jobs.map((job, i) => this.lowerBound(job, this.eligible[i]!));
    this.lbSuffix = new Array(this.jobs.length + 1);
    this.lbSuffix[this.jobs.length] = { unstaffed: 0, problems: 0, shortBy: 0, requiredSum: 0 };
    for (let i = this.jobs.length - 1; i >= 0; i--) {
      const next = this.lbSuffix[i + 1]!;
      const o = this.lbJob[i]!;
      this.lbSuffix[i] = {
        unstaffed: next.unstaffed + o.unstaffed,
        problems: next.problems + o.problem,
        shortBy: next.shortBy + o.shortBy,
        requiredSum: next.requiredSum + o.required,
      };
    }
  }

  run(): { choices: CrewChoice[]; proven: boolean } {
    const states = this.problem.people.map((): PersonState => ({ freeMs: -Infinity, roomId: null }));
    this.greedy(states);
    if (compareKeys(this.bound([], 0, this.zero()), this.best!.key) < 0) {
      this.dfs(0, states, [], this.zero());
    }
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

  private dfs(i: number, states: PersonState[], chosen: CrewChoice[], sums: ReturnType<ClusterSearch['zero']>): void {
    if (this.aborted) return;
    if (i === this.jobs.length) {
      const key = keyOf(chosen.map((c) => c.outcome));
      if (compareKeys(key, this.best!.key) < 0) this.best = { key, choices: [...chosen] };
      return;
    }
    if (++this.nodes > this.budget) {
      this.aborted = true;
      return;
    }
    const job = this.jobs[i]!;
    for (const option of this.options(i, states)) {
      const o = option.outcome;
      const next = { unstaffed: sums.unstaffed + o.unstaffed, problems: sums.problems + o.problem, shortBy: sums.shortBy + o.shortBy, requiredSum: sums.requiredSum + o.required };
      chosen.push(option);
      if (compareKeys(this.bound(chosen, i + 1, next), this.best!.key) < 0) {
        const saved = option.crew.map((p) => states[p]!);
        for (const p of option.crew) states[p] = { freeMs: option.startMs + job.busyMinutes[option.crew.length]! * MINUTE, roomId: job.roomId };
        this.dfs(i + 1, states, chosen, next);
        option.crew.forEach((p, q) => (states[p] = saved[q]!));
      }
      chosen.pop();
      if (this.aborted) return;
    }
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
   * A job's best case on its own: its largest crew, starting when the room is free or, if later,
   * when the first person covering it can start the shortest crew's work. Certain to be unstaffed
   * when nobody covering it can work at all from the room's free time.
   */
  private lowerBound(job: CrewJob, eligible: readonly number[]): JobOutcome {
    const maxK = Math.min(job.wanted, eligible.length);
    if (maxK === 0) return unstaffedOutcome(job);
    const shortest = Math.min(...job.busyMinutes.slice(1, maxK + 1)) * MINUTE;
    let start = Infinity;
    for (const p of eligible) start = Math.min(start, personFit(this.problem.people[p]!, job.fromMs, shortest));
    if (start === Infinity) return unstaffedOutcome(job);
    let fewest = Infinity;
    for (let k = 1; k <= maxK; k++) fewest = Math.min(fewest, job.requiredMinutes[k]!);
    const required = Math.ceil((start - job.fromMs) / MINUTE - 1e-9) + fewest;
    return { unstaffed: 0, problem: required > job.availableMinutes ? 1 : 0, shortBy: Math.max(0, required - job.availableMinutes), required };
  }

  private bound(chosen: readonly CrewChoice[], i: number, sums: ReturnType<ClusterSearch['zero']>): DayKey {
    const rest = this.lbSuffix[i]!;
    const required = chosen.map((c) => c.outcome.required);
    for (let q = i; q < this.jobs.length; q++) required.push(this.lbJob[q]!.required);
    return {
      unstaffed: sums.unstaffed + rest.unstaffed,
      problems: sums.problems + rest.problems,
      shortBy: sums.shortBy + rest.shortBy,
      requiredSum: sums.requiredSum + rest.requiredSum,
      required,
    };
  }

  private zero() {
    return { unstaffed: 0, problems: 0, shortBy: 0, requiredSum: 0 };
  }
}
