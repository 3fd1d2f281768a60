import type { SolverStep, TurnoverSchedule } from '../model';

/**
 * Every way a schedule can break the turnover model, as readable messages (empty when valid):
 * each step once, times consistent, needs met, no person doing two things at once, and
 * requiredMinutes equal to the latest end or dry-at.
 *
 * @example
 * expect(scheduleProblems(steps, 2, solveTurnover({ steps, staff: 2 }))).toEqual([]);
 */
export function scheduleProblems(steps: readonly SolverStep[], staff: number, schedule: TurnoverSchedule): string[] {
  const problems: string[] = [];
  const byKey = new Map(schedule.steps.map((s) => [s.key, s]));
  if (byKey.size !== steps.length || schedule.steps.length !== steps.length) problems.push('steps missing or repeated');
  let latest = 0;
  for (const step of steps) {
    const s = byKey.get(step.key);
    if (!s) continue;
    if (s.start < 0) problems.push(`${step.key} starts before 0`);
    if (s.end !== s.start + step.handsOnMinutes) problems.push(`${step.key} end ≠ start + hands-on`);
    if (s.dryAt !== s.end + step.waitMinutes) problems.push(`${step.key} dryAt ≠ end + wait`);
    if (!Number.isInteger(s.person) || s.person < 0 || s.person >= staff) problems.push(`${step.key} person ${s.person}`);
    for (const need of step.needs) {
      const before = byKey.get(need.key);
      if (before && s.start < (need.dry ? before.dryAt : before.end)) problems.push(`${step.key} starts before ${need.key}`);
    }
    latest = Math.max(latest, s.end, s.dryAt);
  }
  for (const a of schedule.steps) {
    for (const b of schedule.steps) {
      if (a !== b && a.person === b.person && a.start < b.end && b.start < a.end) {
        problems.push(`person ${a.person} does ${a.key} and ${b.key} at once`);
      }
    }
  }
  if (schedule.requiredMinutes !== latest) problems.push(`requiredMinutes ${schedule.requiredMinutes} ≠ ${latest}`);
  for (let k = 1; k < schedule.steps.length; k++) {
    if (schedule.steps[k].start < schedule.steps[k - 1].start) problems.push('steps not in start order');
  }
  return problems;
}
