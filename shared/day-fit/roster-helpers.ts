import type { PlanPeople } from '../turnover/day-plan-types';
import type { FitHelper } from './model';

/** Shorter idle stretches are not offered: a helper needs time to walk there and work. */
const SHORTEST_MINUTES = 10;

const minuteOf = (iso: string) => Number(iso.slice(11, 13)) * 60 + Number(iso.slice(14, 16));
const hhmm = (minute: number) => `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;

/**
 * The roster's spare people as helpers: each person's shift less breaks and less the turnover
 * work the plan already gives them (widened by the walking time on both sides), in stretches of
 * at least 10 minutes, with the rooms they cover. Times are the plan's site clock times (no
 * shift crosses midnight).
 *
 * @example
 * spareHelpers(plan.people); // [{ id: 'r1-1', label: 'Aide 1', free: [{ start: '07:00', end: '09:40' }, …], roomIds: [1, 2] }]
 */
export function spareHelpers(people: PlanPeople): FitHelper[] {
  const walk = people.walkingMinutes;
  return people.people.map((person) => {
    let free: [number, number][] = [[minuteOf(person.start), minuteOf(person.end)]];
    const busy: [number, number][] = [
      ...person.breaks.map((b): [number, number] => [minuteOf(b.start), minuteOf(b.end)]),
      ...person.work.map((w): [number, number] => [minuteOf(w.start) - walk, minuteOf(w.end) + walk]),
    ];
    for (const [from, to] of busy) {
      free = free.flatMap(([a, b]): [number, number][] => (to <= a || from >= b ? [[a, b]] : [[a, Math.min(b, from)], [Math.max(a, to), b]].filter(([x, y]) => y > x) as [number, number][]));
    }
    return {
      id: person.id,
      label: person.label,
      free: free.filter(([a, b]) => b - a >= SHORTEST_MINUTES).map(([a, b]) => ({ start: hhmm(a), end: hhmm(b) })),
      roomIds: [...person.roomIds],
    };
  });
}
