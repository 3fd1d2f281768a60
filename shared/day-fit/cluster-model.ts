import type { DayPlanExam } from '../turnover/day-plan-input';
import type { FitDay, FitExam, FitRoom } from './instance';
import { LpWriter, type Term } from './lp-writer';
import type { FitHelper } from './model';
import { placeItems, roomOf } from './placement';

/** An exam in one cluster's model: free to move within [lo, hi] in one of `rooms`, or a constant. */
export interface ClusterItem {
  fe: FitExam;
  free: boolean;
  /** Earliest and latest start (equal to its start when not free). */
  lo: number;
  hi: number;
  rooms: FitRoom[];
}

/** A helper's free interval, in minutes after midnight. */
export interface HelperSlot {
  helper: FitHelper;
  from: number;
  to: number;
}

export interface ClusterModel {
  lp: LpWriter;
  /**
   * Objectives solved in turn: gaps left, exams moved, then one weighted objective for minutes
   * moved, the day's end and helpers added (see `tail`).
   */
  levels: Term[][];
  decode(values: ReadonlyMap<string, number>): ClusterSolution;
}

export interface ClusterSolution {
  places: Map<number, { roomId: number; start: number }>;
  /**
   * Helper slot taken on the gap before an exam, and the minutes the person is booked (start −
   * longest turnover, start); `staffTo` the people on the turnover with it, when not the room's
   * staff (or override) plus one.
   */
  helpers: Map<number, { slot: HelperSlot; busyFrom: number; busyTo: number; staffTo?: number }>;
}


/**
 * The MIP of one cluster. Decision space: each free exam's room (same modality, open) and start
 * on whole minutes (or the grid), within the room's hours; a helper from a free person on any
 * gap. Sequencing is big-M over pairs: for two exams in the same room, one goes first and the
 * second starts no earlier than the first's end plus the turnover the engine requires for that
 * pair (in that room, with or without a helper). Requiring it of every earlier exam, not only
 * the one just before, is what makes pairs enough; it equals the consecutive-gap rule whenever
 * required(i,j) ≤ required(i,k) + duration(k) + required(k,j), which the protocols satisfy
 * (tested). Opening steps likewise bound every exam of a room. A crew that can start only from
 * a clock time (a roster's person busy elsewhere) bounds every turnover into the exam in that
 * room: from that time instead of the earlier exam's end. `u` (gap left) relaxes the rows
 * into an exam, so the model is always feasible and level 0 counts the gaps nothing can clear.
 *
 * @example
 * const model = clusterModel(day, rooms, items, [], { grid: 1, walkingMinutes: 0 });
 * solve(model.lp.text(model.levels[0]), 5);
 */
export function clusterModel(
  day: FitDay,
  rooms: readonly FitRoom[],
  items: readonly ClusterItem[],
  slots: readonly HelperSlot[],
  options: { grid: number; walkingMinutes: number; crewFrom?: ReadonlyMap<number, ReadonlyMap<number, number>>; helpersFor?: ReadonlySet<number> },
): ClusterModel {
  const lp = new LpWriter();
  const n = items.length;
  let maxReq = 0;
  const reqs = new Map<string, { r0: number; r1: number | null }>();
  const req = (r: FitRoom, leaving: DayPlanExam | null, arriving: DayPlanExam) => {
    const key = `${r.room.id}|${leaving?.id ?? ''}|${arriving.id}`;
    let v = reqs.get(key);
    if (!v) {
      const helper = day.helperStaff(r.room, arriving);
      v = {
        r0: day.required(r.room, leaving, arriving, day.baseStaff(r.room, arriving)),
        r1: helper === null ? null : day.required(r.room, leaving, arriving, helper),
      };
      if (v.r0 > maxReq) maxReq = v.r0;
      reqs.set(key, v);
    }
    return v;
  };
  // Required minutes first, so big-M is known before any row is written.
  for (const it of items) for (const r of it.rooms) req(r, null, it.fe.exam);
  const shares = (a: ClusterItem, b: ClusterItem) => a.rooms.filter((r) => b.rooms.includes(r));
  const pairs: [number, number, FitRoom[]][] = [];
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      const i = items[a]!;
      const j = items[b]!;
      // Two exams that both stay: their gap is what it is (the remaining gaps report it), unless a helper may shorten it.
      if (!i.free && !j.free && (slots.length === 0 || i.fe.roomId !== j.fe.roomId)) continue;
      const common = shares(i, j);
      if (common.length === 0) continue;
      for (const r of common) {
        req(r, i.fe.exam, j.fe.exam);
        req(r, j.fe.exam, i.fe.exam);
      }
      pairs.push([a, b, common]);
    }
  }
  const lo = Math.min(...rooms.map((r) => r.open), ...items.map((it) => it.lo));
  const hi = Math.max(...rooms.map((r) => r.close), ...items.map((it) => it.hi + it.fe.duration));
  const M = hi - lo + maxReq + options.walkingMinutes + 1;

  const { s, u, inRoom, moved, minutes, gapsLeft } = placeItems(lp, items, rooms, options.grid, M);
  const helperTerms: Term[] = [];

  // Helpers: h{k}_{slot} takes a free person onto the gap before exam k.
  const helperOf = new Map<number, Term[]>();
  const busy = new Map<number, number>();
  if (slots.length > 0) {
    for (let k = 0; k < n; k++) {
      const it = items[k]!;
      if (options.helpersFor && !options.helpersFor.has(it.fe.exam.id)) continue;
      const withHelper = it.rooms.filter((r) => day.helperStaff(r.room, it.fe.exam) !== null);
      if (withHelper.length === 0) continue;
      // The person is booked for the longest turnover that could precede the exam, ending at its start.
      let longest = 0;
      for (const r of withHelper) {
        for (const other of [null, ...items.map((x) => x.fe.exam)]) {
          if (other === it.fe.exam) continue;
          if (other && !items.some((x) => x.fe.exam === other && x.rooms.includes(r))) continue;
          longest = Math.max(longest, req(r, other, it.fe.exam).r1 ?? 0);
        }
      }
      busy.set(k, longest);
      const terms: Term[] = [];
      slots.forEach((slot, p) => {
        const covered = withHelper.filter((r) => slot.helper.roomIds === null || slot.helper.roomIds.includes(r.room.id));
        if (covered.length === 0 || it.hi < slot.from + longest || it.lo > slot.to) return;
        const h = lp.variable(`h${k}_${p}`, 'binary');
        terms.push([1, h]);
        helperTerms.push([1, h]);
        lp.row([[1, s(k)], [-M, h]], '>=', slot.from + longest - M);
        lp.row([[1, s(k)], [M, h]], '<=', slot.to + M);
        if (covered.length < it.rooms.length) {
          const ys = covered.map((r) => inRoom(k, r));
          const constant = ys.reduce((c, Y) => c + Y.constant, 0);
          if (constant < 1) lp.row([[1, h], ...ys.flatMap((Y) => Y.terms.map(([c, x]) => [-c, x] as const))], '<=', constant);
        }
      });
      if (terms.length > 0) {
        helperOf.set(k, terms);
        lp.row(terms, '<=', 1);
      }
    }
    // One person, one turnover at a time (plus walking between them).
    const W = options.walkingMinutes;
    for (let p = 0; p < slots.length; p++) {
      const users = [...helperOf.keys()].filter((k) => lp.has(`h${k}_${p}`));
      for (let a = 0; a < users.length; a++) {
        for (let b = a + 1; b < users.length; b++) {
          const [i, j] = [users[a]!, users[b]!];
          const [bi, bj] = [busy.get(i)!, busy.get(j)!];
          if (items[i]!.hi + W <= items[j]!.lo - bj || items[j]!.hi + W <= items[i]!.lo - bi) continue;
          const q = lp.variable(`q${i}_${j}_${p}`, 'binary');
          const hi_ = `h${i}_${p}`;
          const hj = `h${j}_${p}`;
          // q = 1: i's turnover ends (plus walking) before j's begins.
          lp.row([[1, s(j)], [-1, s(i)], [-M, q], [-M, hi_], [-M, hj]], '>=', bj + W - 3 * M);
          lp.row([[1, s(i)], [-1, s(j)], [M, q], [-M, hi_], [-M, hj]], '>=', bi + W - 2 * M);
        }
      }
    }
  }

  // Opening steps bound every exam of the room.
  for (let k = 0; k < n; k++) {
    const it = items[k]!;
    for (const r of it.rooms) {
      const { r0, r1 } = req(r, null, it.fe.exam);
      const Y = inRoom(k, r);
      const Mk = r.open + r0 - it.lo;
      if (Mk <= 0) continue; // never binding
      const terms: Term[] = [[1, s(k)], [Mk, u(k)], ...Y.terms.map(([c, x]) => [-Mk * c, x] as const)];
      if (r1 !== null) for (const [, h] of helperOf.get(k) ?? []) terms.push([r0 - r1, h]);
      lp.row(terms, '>=', r.open + r0 - Mk + Mk * Y.constant);
    }
    // Its crew from a clock time in a room: the opening steps there wait for them too.
    for (const r of it.rooms) {
      const from = options.crewFrom?.get(it.fe.exam.id)?.get(r.room.id);
      if (from === undefined) continue;
      const { r0, r1 } = req(r, null, it.fe.exam);
      const Y = inRoom(k, r);
      const Mc = from + r0 - it.lo;
      if (Mc <= 0) continue;
      const terms: Term[] = [[1, s(k)], [Mc, u(k)], ...Y.terms.map(([c, x]) => [-Mc * c, x] as const)];
      if (r1 !== null) for (const [, h] of helperOf.get(k) ?? []) terms.push([r0 - r1, h]);
      lp.row(terms, '>=', from + r0 - Mc + Mc * Y.constant);
    }
  }

  // Pairs: for each room they may share, the later starts after the earlier's end plus the turnover.
  for (const [a, b, common] of pairs) {
    const i = items[a]!;
    const j = items[b]!;
    const ordered = !i.free && !j.free;
    const iFirst = ordered ? i.fe.start < j.fe.start || (i.fe.start === j.fe.start && i.fe.exam.id < j.fe.exam.id) : null;
    const canBefore = (x: ClusterItem, w: ClusterItem, r: FitRoom) => x.lo + x.fe.duration + Math.min(req(r, x.fe.exam, w.fe.exam).r0, req(r, x.fe.exam, w.fe.exam).r1 ?? Infinity) <= w.hi;
    let o: string | null = null;
    for (const r of common) {
      const ij = ordered ? iFirst! : canBefore(i, j, r) || !canBefore(j, i, r);
      const ji = ordered ? !iFirst : canBefore(j, i, r) || !canBefore(i, j, r);
      if (ij && ji && !o) o = lp.variable(`o${a}_${b}`, 'binary');
      const Yi = inRoom(a, r);
      const Yj = inRoom(b, r);
      const write = (first: number, second: number, sign: 1 | -1 | 0) => {
        const F = items[first]!;
        const S = items[second]!;
        const { r0, r1 } = req(r, F.fe.exam, S.fe.exam);
        // The most the row can be violated by: its big-M (never binding when not positive).
        const Mp = F.hi + F.fe.duration + r0 - S.lo;
        if (Mp > 0) {
          const both: Term[] = [...Yi.terms, ...Yj.terms].map(([c, x]) => [-Mp * c, x] as const);
          const terms: Term[] = [[1, s(second)], [-1, s(first)], [Mp, u(second)], ...both];
          if (r1 !== null) for (const [, h] of helperOf.get(second) ?? []) terms.push([r0 - r1, h]);
          let rhs = F.fe.duration + r0 + Mp * (Yi.constant + Yj.constant) - 2 * Mp;
          if (sign === 1) { terms.push([-Mp, o!]); rhs -= Mp; } // first = i when o = 1
          if (sign === -1) terms.push([Mp, o!]); // first = j when o = 0
          lp.row(terms, '>=', rhs);
        }
        // The second's crew from a clock time in this room: the turnover starts then at the earliest.
        const from = options.crewFrom?.get(S.fe.exam.id)?.get(r.room.id);
        if (from === undefined) return;
        const Mc = from + r0 - S.lo;
        if (Mc <= 0) return;
        const late: Term[] = [[1, s(second)], [Mc, u(second)], ...[...Yi.terms, ...Yj.terms].map(([c, x]) => [-Mc * c, x] as const)];
        if (r1 !== null) for (const [, h] of helperOf.get(second) ?? []) late.push([r0 - r1, h]);
        let lateRhs = from + r0 + Mc * (Yi.constant + Yj.constant) - 2 * Mc;
        if (sign === 1) { late.push([-Mc, o!]); lateRhs -= Mc; }
        if (sign === -1) late.push([Mc, o!]);
        lp.row(late, '>=', lateRhs);
      };
      // The order the rows assume is the order the plan sees: by start, then id. Never relaxed
      // by a gap left, so an exam whose gap is left stays where the order puts it and the gaps
      // the engine counts are the gaps the model counts.
      const order = (first: number, second: number, sign: 1 | -1 | 0) => {
        const F = items[first]!;
        const S = items[second]!;
        const tie = F.fe.exam.id > S.fe.exam.id ? 1 : 0;
        const Mo = F.hi - S.lo + tie;
        if (Mo <= 0) return;
        const terms: Term[] = [[1, s(second)], [-1, s(first)], ...[...Yi.terms, ...Yj.terms].map(([c, x]) => [-Mo * c, x] as const)];
        let rhs = tie + Mo * (Yi.constant + Yj.constant) - 2 * Mo;
        if (sign === 1) { terms.push([-Mo, o!]); rhs -= Mo; }
        if (sign === -1) terms.push([Mo, o!]);
        lp.row(terms, '>=', rhs);
      };
      if (ij && ji) {
        write(a, b, 1);
        write(b, a, -1);
        order(a, b, 1);
        order(b, a, -1);
      } else if (ij) {
        write(a, b, 0);
        order(a, b, 0);
      } else {
        write(b, a, 0);
        order(b, a, 0);
      }
    }
  }

  return {
    lp,
    levels: [gapsLeft, moved, tail(minutes, helperTerms, hi - lo)],
    decode(values) {
      const places = new Map<number, { roomId: number; start: number }>();
      const helpers: ClusterSolution['helpers'] = new Map();
      items.forEach((it, k) => {
        if (!it.free) return;
        const start = Math.round(values.get(s(k)) ?? it.fe.start);
        const room = roomOf(values, it, k, rooms);
        places.set(it.fe.exam.id, { roomId: room.room.id, start });
      });
      for (const [k, terms] of helperOf) {
        for (const [, h] of terms) {
          if ((values.get(h) ?? 0) > 0.5) {
            const start = Math.round(values.get(s(k)) ?? items[k]!.fe.start);
            helpers.set(items[k]!.fe.exam.id, { slot: slots[Number(h.split('_')[1])]!, busyFrom: start - busy.get(k)!, busyTo: start });
          }
        }
      }
      return { places, helpers };
    },
  };
}

/**
 * Minutes moved, then the day's end, then helpers, as one objective with weights that keep the
 * order exact. Each is a whole number (starts are whole minutes; z settles on the latest end,
 * a whole minute): helpers h ∈ [0, H], the end z − lo ∈ [0, T], minutes ≥ 0. With weights
 * (T+1)(H+1) for minutes and H+1 for the end, one minute more outweighs the largest possible
 * difference of the rest, T(H+1) + H = (T+1)(H+1) − 1, and one minute of end outweighs H
 * helpers; so the weighted minimum is the lexicographic one. The products stay far below 2^53
 * and, with a zero relative and a 0.5 absolute MIP gap, "optimal" is exact.
 */
export function tail(minutes: Term[], helpers: Term[], T: number): Term[] {
  const H = helpers.length;
  return [
    ...minutes.map(([c, v]) => [c * (T + 1) * (H + 1), v] as const),
    [H + 1, 'z'],
    ...helpers,
  ];
}
