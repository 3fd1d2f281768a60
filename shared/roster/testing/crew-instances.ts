/**
 * Small random crew problems on whole minutes (2 rooms × up to 4 exams each, 1–3 people) for the
 * brute-force and property specs. Invented numbers: required minutes fall with more people and
 * hands-on time never exceeds them, as the turnover solver's answers do.
 */
import type { CrewJob, CrewPerson, CrewProblem } from '../crew-problem';

const MIN = 60_000;

export interface InstanceOptions {
  maxExamsPerRoom?: number;
  maxPeople?: number;
  maxWanted?: number;
}

/** `rand` in [0, 1); an instance of the crew problem with its jobs in the day's order. */
export function randomCrewProblem(rand: () => number, options: InstanceOptions = {}): CrewProblem {
  const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));
  const rooms = [1, 2];
  const peopleCount = int(1, options.maxPeople ?? 3);
  const jobs: CrewJob[] = [];
  for (const roomId of rooms) {
    const exams = int(1, options.maxExamsPerRoom ?? 4);
    let from = int(0, 10);
    for (let e = 0; e < exams; e++) {
      const wanted = int(1, Math.min(options.maxWanted ?? 2, peopleCount));
      const req1 = int(6, 24);
      const requiredMinutes = [0, req1];
      const busyMinutes = [0, int(Math.max(1, req1 - 8), req1)];
      for (let k = 2; k <= wanted; k++) {
        requiredMinutes.push(Math.max(1, requiredMinutes[k - 1]! - int(0, 6)));
        busyMinutes.push(Math.min(requiredMinutes[k]!, Math.max(1, busyMinutes[k - 1]! - int(0, 5))));
      }
      const available = int(-4, 30);
      const examStart = from + available;
      jobs.push({ fromMs: from * MIN, toMs: examStart * MIN, roomId, availableMinutes: available, wanted, requiredMinutes, busyMinutes });
      from = examStart + int(10, 40); // the exam's end
    }
  }
  jobs.sort((a, b) => a.fromMs - b.fromMs || a.roomId - b.roomId);
  const people: CrewPerson[] = [];
  for (let p = 0; p < peopleCount; p++) {
    const startMin = int(-10, 40);
    const endMin = int(120, 400);
    const breaks: CrewPerson['breaks'][number][] = [];
    if (rand() < 0.5) {
      const bs = int(startMin + 10, Math.max(startMin + 10, endMin - 40));
      breaks.push({ startMs: bs * MIN, endMs: (bs + int(5, 30)) * MIN });
    }
    const pick = int(0, 2);
    const roomIds = pick === 0 ? [1] : pick === 1 ? [2] : [1, 2];
    people.push({ startMs: startMin * MIN, endMs: endMin * MIN, breaks, roomIds });
  }
  return { jobs, people, walkMs: int(0, 5) * MIN };
}
