import type { DayPlanInput } from '../../turnover/day-plan-input';
import { fitDay } from '../instance';
import type { FixedReason } from '../model';

/** The lexicographic objective: gaps left, exams moved, minutes moved, day's end (minutes after midnight). */
export type FitScore = [number, number, number, number];

/**
 * The best proposal by brute force, for small days: every free exam tries staying, then every
 * room of its group and every start on the grid within that room's hours; every combination is
 * judged by the day-plan engine (consecutive gaps, as the plan shows them). Prunes only what
 * cannot beat the best found: once a combination clears every gap, a branch that has already
 * moved more exams (or as many, for more minutes) is dropped.
 *
 * @example
 * bestByEnumeration(input, { grid: 15 }).score; // [0, 1, 15, 600]
 */
export function bestByEnumeration(input: DayPlanInput, options: { grid: number; fixed?: Record<number, FixedReason> }): { score: FitScore; combos: number } {
  const day = fitDay(input, { fixed: options.fixed });
  const free = day.groups.flatMap((g) => g.exams.filter((fe) => fe.stays === null).map((fe) => ({ fe, rooms: g.rooms })));
  const options_ = free.map(({ fe, rooms }) => {
    const list: { roomId: number; start: number }[] = [{ roomId: fe.roomId, start: fe.start }];
    for (const r of rooms) {
      for (let s = Math.ceil(r.open / options.grid) * options.grid; s + fe.duration <= r.close; s += options.grid) {
        if (r.room.id !== fe.roomId || s !== fe.start) list.push({ roomId: r.room.id, start: s });
      }
    }
    return list;
  });
  let best: FitScore = [Infinity, Infinity, Infinity, Infinity];
  let combos = 0;
  const chosen: { roomId: number; start: number }[] = [];
  // The plan's rule, gap by gap: exams in start order, each gap from the previous end (or the opening).
  const fixedExams = day.groups.flatMap((g) => g.exams.filter((fe) => fe.stays !== null));
  const evaluate = () => {
    combos++;
    let moved = 0;
    let minutes = 0;
    let gaps = 0;
    let end = 0;
    const placed = [
      ...fixedExams.map((fe) => ({ fe, roomId: fe.roomId, start: fe.start })),
      ...free.map(({ fe }, k) => ({ fe, ...chosen[k]! })),
    ];
    for (const { fe, roomId, start } of placed.slice(fixedExams.length)) {
      if (roomId !== fe.roomId || start !== fe.start) moved++;
      minutes += Math.abs(start - fe.start);
    }
    for (const group of day.groups) {
      for (const r of group.rooms) {
        const inRoom = placed.filter((p) => p.roomId === r.room.id).sort((a, b) => a.start - b.start || a.fe.exam.id - b.fe.exam.id);
        let previous: (typeof inRoom)[number] | null = null;
        for (const p of inRoom) {
          const from = previous ? previous.start + previous.fe.duration : r.open;
          const required = day.required(r.room, previous?.fe.exam ?? null, p.fe.exam, day.baseStaff(r.room, p.fe.exam));
          if (p.start - from < required) gaps++;
          end = Math.max(end, p.start + p.fe.duration);
          previous = p;
        }
      }
    }
    const score: FitScore = [gaps, moved, minutes, end];
    if (less(score, best)) best = score;
  };
  const walk = (k: number, moved: number, minutes: number) => {
    if (best[0] === 0 && (moved > best[1] || (moved === best[1] && minutes > best[2]))) return;
    if (k === free.length) return evaluate();
    for (const place of options_[k]!) {
      const fe = free[k]!.fe;
      const isMove = place.roomId !== fe.roomId || place.start !== fe.start;
      chosen[k] = place;
      walk(k + 1, moved + (isMove ? 1 : 0), minutes + Math.abs(place.start - fe.start));
    }
  };
  walk(0, 0, 0);
  return { score: best, combos };
}

export function less(a: FitScore, b: FitScore): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}
