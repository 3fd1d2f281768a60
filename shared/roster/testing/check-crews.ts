/**
 * What must hold of any assignment, checked from the outside: nobody in two places at once
 * (walking between rooms included), nobody working outside their hours, in a break or in a room
 * they do not cover, no crew larger than wanted, and each job started no earlier than its room
 * is free. Returns every problem found, in words; none for a valid assignment.
 */
import type { CrewAssignment } from '../assign-crews';
import type { CrewProblem } from '../crew-problem';

const MIN = 60_000;

/**
 * @example
 * expect(crewProblems(problem, assignCrews(problem))).toEqual([]);
 */
export function crewProblems(problem: CrewProblem, assignment: CrewAssignment): string[] {
  const problems: string[] = [];
  const work: { p: number; start: number; end: number; room: number; job: number }[] = [];
  assignment.choices.forEach((choice, j) => {
    const job = problem.jobs[j]!;
    if (choice.crew.length > job.wanted) problems.push(`job ${j}: ${choice.crew.length} people, wanted ${job.wanted}`);
    if (choice.crew.length === 0) return;
    if (new Set(choice.crew).size !== choice.crew.length) problems.push(`job ${j}: a person twice in the crew`);
    if (choice.startMs < job.fromMs) problems.push(`job ${j}: starts before the room is free`);
    const end = choice.startMs + job.busyMinutes[choice.crew.length]! * MIN;
    for (const p of choice.crew) {
      const person = problem.people[p]!;
      if (!person.roomIds.includes(job.roomId)) problems.push(`job ${j}: person ${p} does not cover room ${job.roomId}`);
      if (choice.startMs < person.startMs || end > person.endMs) problems.push(`job ${j}: person ${p} works outside their shift`);
      for (const b of person.breaks) if (choice.startMs < b.endMs && end > b.startMs) problems.push(`job ${j}: person ${p} works in a break`);
      work.push({ p, start: choice.startMs, end, room: job.roomId, job: j });
    }
  });
  work.sort((a, b) => a.p - b.p || a.start - b.start);
  for (let i = 1; i < work.length; i++) {
    const a = work[i - 1]!;
    const b = work[i]!;
    if (a.p !== b.p) continue;
    const gap = a.room === b.room ? 0 : problem.walkMs;
    if (b.start < a.end + gap) problems.push(`person ${a.p}: job ${b.job} starts before job ${a.job} ends and they walk over`);
  }
  return problems;
}
