import type { PlanChange } from '../../api/changes';
import { withChanges } from '../../fixes/apply-changes';
import { computeDayPlan } from '../../turnover/day-plan';
import type { DayPlanInput } from '../../turnover/day-plan-input';
import type { HelperSlot } from '../cluster-model';
import { fitDay, type FitDay, type FitExam, type FitGroup, type FitRoom } from '../instance';
import type { FitHelper, FixedReason } from '../model';

/** The lexicographic objective: gaps left, exams moved, minutes moved, day's end (minutes after midnight), helpers added. */
export type FitScore = [number, number, number, number, number];

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
export function bestByEnumeration(
  input: DayPlanInput,
  options: { grid: number; fixed?: Record<number, FixedReason>; helpers?: readonly FitHelper[]; walkingMinutes?: number },
): { score: FitScore; combos: number } {
  const day = fitDay(input, { fixed: options.fixed });
  const slots = helperSlots(day, options.helpers ?? []);
  const walking = options.walkingMinutes ?? 0;
  const { free, places: options_ } = placesOf(day, options.grid);
  let best: FitScore = [Infinity, Infinity, Infinity, Infinity, Infinity];
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
    // Gaps short with the room's staff, and whether one more person (a helper) would clear each.
    const problems: { start: number; roomId: number; busy: number; cleared: boolean }[] = [];
    for (const group of day.groups) {
      for (const r of group.rooms) {
        const inRoom = placed.filter((p) => p.roomId === r.room.id).sort((a, b) => a.start - b.start || a.fe.exam.id - b.fe.exam.id);
        let previous: (typeof inRoom)[number] | null = null;
        for (const p of inRoom) {
          const from = previous ? previous.start + previous.fe.duration : r.open;
          const required = day.required(r.room, previous?.fe.exam ?? null, p.fe.exam, day.baseStaff(r.room, p.fe.exam));
          if (p.start - from < required) {
            gaps++;
            const helper = day.helperStaff(r.room, p.fe.exam);
            const cleared = helper !== null && p.start - from >= day.required(r.room, previous?.fe.exam ?? null, p.fe.exam, helper);
            if (cleared && slots.length > 0) problems.push({ start: p.start, roomId: r.room.id, busy: busyOf(p.fe, group), cleared });
          }
          end = Math.max(end, p.start + p.fe.duration);
          previous = p;
        }
      }
    }
    const [cleared, helpers] = bestHelpers(problems, slots, walking);
    const score: FitScore = [gaps - cleared, moved, minutes, end, helpers];
    if (less(score, best)) best = score;
  };
  // The model books a helper for the longest turnover (with the helper) that could come before
  // the exam in that room, from any exam of its group that could be there or the opening.
  const busyCache = new Map<number, number>();
  const busyOf = (fe: FitExam, group: FitGroup): number => {
    let busy = busyCache.get(fe.exam.id);
    if (busy !== undefined) return busy;
    busy = 0;
    const canBeIn = (other: FitExam, r: FitRoom) => (other.stays === null ? r.open <= r.close - other.duration && fitsHours(other, r) : other.roomId === r.room.id);
    for (const r of group.rooms) {
      const helper = day.helperStaff(r.room, fe.exam);
      if (helper === null || !canBeIn(fe, r)) continue;
      for (const other of [null, ...group.exams.filter((x) => x !== fe && canBeIn(x, r))]) busy = Math.max(busy, day.required(r.room, other?.exam ?? null, fe.exam, helper));
    }
    busyCache.set(fe.exam.id, busy);
    return busy;
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

/** Each free exam and its places: staying first, then every room of its group and every start on the grid within that room's hours. */
function placesOf(day: FitDay, grid: number): { free: { fe: FitExam; rooms: FitRoom[] }[]; places: { roomId: number; start: number }[][] } {
  const free = day.groups.flatMap((g) => g.exams.filter((fe) => fe.stays === null).map((fe) => ({ fe, rooms: g.rooms })));
  const places = free.map(({ fe, rooms }) => {
    const list: { roomId: number; start: number }[] = [{ roomId: fe.roomId, start: fe.start }];
    for (const r of rooms) {
      for (let s = Math.ceil(r.open / grid) * grid; s + fe.duration <= r.close; s += grid) {
        if (r.room.id !== fe.roomId || s !== fe.start) list.push({ roomId: r.room.id, start: s });
      }
    }
    return list;
  });
  return { free, places };
}

/** A free exam may be placed in a room when it fits the room's hours (as the model's rooms for it). */
function fitsHours(fe: FitExam, r: FitRoom): boolean {
  return r.open + fe.duration <= r.close;
}

function helperSlots(day: FitDay, helpers: readonly FitHelper[]): HelperSlot[] {
  const minute = (hhmm: string) => day.minuteOf(`${day.input.date}T${hhmm}:00${day.toIso(0).slice(19)}`);
  return helpers.flatMap((helper) => helper.free.map((f) => ({ helper, from: minute(f.start), to: minute(f.end) })));
}

/**
 * The most gaps helpers can clear, then the fewest helpers, by trying every slot (or none) on
 * every gap one more person would clear: a helper is booked for `busy` minutes ending at the
 * exam's start, within its free slot and its rooms, one turnover at a time plus walking.
 */
function bestHelpers(problems: readonly { start: number; roomId: number; busy: number }[], slots: readonly HelperSlot[], walking: number): [number, number] {
  let best: [number, number] = [0, 0];
  const taken: { slot: number; from: number; to: number }[] = [];
  const walk = (k: number) => {
    if (k === problems.length) {
      if (taken.length > best[0]) best = [taken.length, taken.length];
      return;
    }
    if (taken.length + (problems.length - k) <= best[0]) return;
    walk(k + 1);
    const p = problems[k]!;
    slots.forEach((slot, index) => {
      if (slot.helper.roomIds !== null && !slot.helper.roomIds.includes(p.roomId)) return;
      const from = p.start - p.busy;
      if (from < slot.from || p.start > slot.to) return;
      if (taken.some((t) => t.slot === index && !(p.start + walking <= t.from || t.to + walking <= from))) return;
      taken.push({ slot: index, from, to: p.start });
      walk(k + 1);
      taken.pop();
    });
  };
  walk(0);
  return best;
}

export function less(a: FitScore, b: FitScore): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}

/**
 * The best proposal by brute force on a day with a roster: every free exam's place as in
 * `bestByEnumeration`, and with `helpers` every set of turnovers that get one person more than
 * their room's staff (a staffing change, as a proposal makes one); each combination judged by the
 * day-plan engine with the roster's crews (people in one place at a time, walking, breaks,
 * shifts). Slow (an engine pass per combination): for a handful of exams only.
 *
 * @example
 * bestByEnumerationWithRoster(rosterDay, { grid: 30 }).score; // [0, 1, 30, 535, 0]
 */
export function bestByEnumerationWithRoster(input: DayPlanInput, options: { grid: number; fixed?: Record<number, FixedReason>; helpers?: boolean }): { score: FitScore; combos: number } {
  const day = fitDay(input, { fixed: options.fixed });
  const { free, places } = placesOf(day, options.grid);
  const roomById = new Map(input.rooms.map((r) => [r.id, r]));
  let best: FitScore = [Infinity, Infinity, Infinity, Infinity, Infinity];
  let combos = 0;
  const chosen: { roomId: number; start: number }[] = [];
  const judge = (moves: PlanChange[], moved: number, minutes: number) => {
    // Each exam's gap with or without a helper, in the room the placement puts it in.
    const where = new Map(input.exams.map((e) => [e.id, e.roomId]));
    for (const move of moves) if (move.type === 'move') where.set(move.examId, move.to.roomId);
    const helpable = options.helpers
      ? input.exams.flatMap((e) => {
          const staff = day.helperStaff(roomById.get(where.get(e.id)!)!, e);
          return staff === null ? [] : [{ e, staff }];
        })
      : [];
    for (let mask = 0; mask < 1 << helpable.length; mask++) {
      const staffing: PlanChange[] = helpable
        .filter((_, k) => mask & (1 << k))
        .map(({ e, staff }) => ({ type: 'staffing', toExamId: e.id, accession: e.accession, from: input.staffOverrides?.[e.id] ?? null, to: staff }));
      combos++;
      const plan = computeDayPlan(withChanges(input, [...moves, ...staffing]));
      const end = Math.max(0, ...plan.rooms.flatMap((room) => room.exams.map((exam) => day.minuteOf(exam.end))));
      const score: FitScore = [plan.summary.short + plan.summary.overlap, moved, minutes, end, staffing.length];
      if (less(score, best)) best = score;
    }
  };
  const walk = (k: number, moved: number, minutes: number) => {
    if (best[0] === 0 && (moved > best[1] || (moved === best[1] && minutes > best[2]))) return;
    if (k < free.length) {
      for (const place of places[k]!) {
        const fe = free[k]!.fe;
        chosen[k] = place;
        walk(k + 1, moved + (place.roomId !== fe.roomId || place.start !== fe.start ? 1 : 0), minutes + Math.abs(place.start - fe.start));
      }
      return;
    }
    const changes: PlanChange[] = [];
    free.forEach(({ fe }, i) => {
      const to = chosen[i]!;
      if (to.roomId !== fe.roomId || to.start !== fe.start) {
        changes.push({ type: 'move', examId: fe.exam.id, accession: fe.exam.accession, from: { roomId: fe.roomId, start: fe.exam.start }, to: { roomId: to.roomId, start: day.toIso(to.start) } });
      }
    });
    judge(changes, moved, minutes);
  };
  walk(0, 0, 0);
  return { score: best, combos };
}
