import { eligiblePeople, MINUTE, personFit, type CrewProblem } from './crew-problem';

/**
 * The jobs split into clusters that compete for the same people: no choice in one cluster can
 * change what is possible in another, so each is solved on its own and the day's optimum is the
 * clusters' optima together (the stated order is lexicographic over sums, which adds up part by
 * part). Jobs are taken in the problem's order.
 *
 * A job joins the cluster of a person's previous job when it may start before that person could
 * be free of it and have walked over, in the worst case any choice could give: each job's latest
 * possible end is bounded by letting every person who covers it start as late as their earlier
 * jobs could keep them (the crew start is monotone in each member's arrival, and a smaller crew
 * never starts later than all of them together), and by the end of the latest of their shifts.
 *
 * @returns clusters of job indices, each ascending, ordered by their first job
 * @example
 * clusterJobs(problem); // [[0, 1, 3], [2], [4, 5]]
 */
export function clusterJobs(problem: CrewProblem): number[][] {
  const { jobs, people, walkMs } = problem;
  const parent = jobs.map((_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i]!)));
  const horizon = people.map(() => -Infinity);
  const lastJob = people.map(() => -1);
  jobs.forEach((job, j) => {
    const eligible = eligiblePeople(problem, job);
    if (eligible.length === 0) return;
    const busy = Math.max(...job.busyMinutes.slice(1)) * MINUTE;
    let t = job.fromMs;
    for (const p of eligible) t = Math.max(t, horizon[p]!);
    // The fixpoint of "everyone who covers the room can work from t": later than any real crew's start.
    for (;;) {
      let next = t;
      for (const p of eligible) next = Math.max(next, personFit(people[p]!, t, busy));
      if (next === t || next === Infinity) {
        t = next;
        break;
      }
      t = next;
    }
    const latestEnd = t === Infinity ? Math.max(...eligible.map((p) => people[p]!.endMs)) : t + busy;
    for (const p of eligible) {
      if (lastJob[p]! >= 0 && job.fromMs < horizon[p]!) parent[find(j)] = find(lastJob[p]!);
      horizon[p] = Math.max(horizon[p]!, latestEnd + walkMs);
      lastJob[p] = j;
    }
  });
  const byRoot = new Map<number, number[]>();
  jobs.forEach((_, j) => {
    const root = find(j);
    const list = byRoot.get(root);
    if (list) list.push(j);
    else byRoot.set(root, [j]);
  });
  return [...byRoot.values()].sort((a, b) => a[0]! - b[0]!);
}
