import type { DayPlanExam } from '../turnover/day-plan-input';
import { tail, type ClusterItem, type ClusterModel, type ClusterSolution } from './cluster-model';
import type { FitDay, FitRoom } from './instance';
import { LpWriter, type Term } from './lp-writer';
import { placeItems, roomOf } from './placement';

/** A person on the roster, in whole minutes after the site's midnight. */
export interface ModelPerson {
  id: string;
  label: string;
  start: number;
  end: number;
  breaks: readonly { start: number; end: number }[];
  roomIds: readonly number[];
}

export interface RosterModelOptions {
  grid: number;
  walkingMinutes: number;
  /** Each room's place in the day plan (the roster takes turnovers free at the same minute in that order). */
  roomOrder: ReadonlyMap<number, number>;
  /** Rooms in the day plan (for the order key). */
  roomCount: number;
  /** May a turnover get one person more than its room's staff (a helper, as a staffing change)? */
  helpers: boolean;
  /**
   * Items whose own turnover lies outside the model (the exam just before a window of the day):
   * they only end where the next exam's turnover starts. Their people's work is in `breaks`.
   */
  noJob?: ReadonlySet<number>;
  /**
   * Every crew starts by this minute (a window of the day: its people's breaks and other work
   * after it cannot matter). None by default: any time the people are on shift.
   */
  crewBy?: number;
}

/**
 * The MIP of a small day (or a part of it that shares no person with the rest) planned with the
 * roster's people, exact under the roster's rules (`shared/roster/crew-problem.ts`):
 *
 * - placement as in the cluster model: each free exam's room and start (`placeItems`);
 * - each room's exams form one chain in start order: `a{i}_{k}_{r}` = i comes just before k in
 *   room r, `f{k}_{r}` = k comes first (after the opening); the chain's order rows are never
 *   relaxed, so the chain is the plan's order;
 * - the turnover into k is a job: free from `F` (the end of the exam before it, or the
 *   opening), worked by a crew `x{k}_{p}` of 1 … its room's staff people (one more with a
 *   helper) who cover the room it is in, starting together at `c` ≥ F, each on shift and off
 *   break for the crew's hands-on minutes `B`, and ready at c + `R`; B and R are the engine's own
 *   minutes for that pair of exams in that room with that many people;
 * - a person takes jobs in the roster's order (free time, then the plan's room order, then the
 *   exam), one after another, walking between two rooms;
 * - the gap into k is cleared when its exam starts at c + R or later; `u{k}` (gap left) relaxes
 *   only that, so the crews of a gap left still work and still hold their people.
 *
 * So a point with no gap left is a placement whose best crews (what the roster's search finds)
 * leave no gap short, and every such placement is a point: the lexicographic optimum (gaps left,
 * exams moved, minutes, the day's end, helpers) is the optimum over placements judged with the
 * roster. Big-M rows; for a handful of exams (the size brute force checks), not a whole day.
 *
 * @example
 * const model = rosterModel(day, rooms, items, people, { grid: 1, walkingMinutes: 3, roomOrder, roomCount: 2, helpers: false });
 * solveLevels(model, solve, tally, deadline, Date.now);
 */
export function rosterModel(day: FitDay, rooms: readonly FitRoom[], items: readonly ClusterItem[], people: readonly ModelPerson[], options: RosterModelOptions): ClusterModel {
  const lp = new LpWriter();
  const n = items.length;
  const W = options.walkingMinutes;
  const roomIndex = new Map(rooms.map((r, i) => [r.room.id, i]));
  // Crew sizes a room allows for an exam: its staff (or the day's override), one more with a helper.
  const base = (r: FitRoom, k: number) => day.baseStaff(r.room, items[k]!.fe.exam);
  const most = (r: FitRoom, k: number) => (options.helpers ? day.helperStaff(r.room, items[k]!.fe.exam) ?? base(r, k) : base(r, k));
  const covers = (p: ModelPerson, r: FitRoom) => p.roomIds.includes(r.room.id);
  // A room nobody on the roster covers has its own staff, as the day plan gives it: no crew, no wait.
  const covered = (r: FitRoom) => people.some((p) => covers(p, r));
  const crewSizes = items.map((it, k) => Math.max(0, ...it.rooms.filter(covered).map((r) => Math.min(most(r, k), people.filter((p) => covers(p, r)).length))));

  const minutes = new Map<string, { req: number; busy: number }>();
  const turnover = (r: FitRoom, leaving: DayPlanExam | null, arriving: DayPlanExam, size: number) => {
    const key = `${r.room.id}|${leaving?.id ?? ''}|${arriving.id}|${size}`;
    let v = minutes.get(key);
    if (!v) minutes.set(key, (v = { req: day.required(r.room, leaving, arriving, size), busy: day.busy(r.room, leaving, arriving, size) }));
    return v;
  };
  // Which exam may come just before which in a room: by start, then id (the plan's order).
  const tie = (i: number, k: number) => (items[i]!.fe.exam.id > items[k]!.fe.exam.id ? 1 : 0);
  const mayPrecede = (i: number, k: number) => i !== k && items[i]!.lo + tie(i, k) <= items[k]!.hi;
  const inRooms = rooms.map((r) => items.flatMap((it, k) => (it.rooms.includes(r) ? [k] : [])));

  let maxReq = 0;
  let maxBusy = 0;
  items.forEach((it, k) => {
    if (options.noJob?.has(k)) return;
    for (const r of it.rooms) {
      for (const i of [null, ...inRooms[roomIndex.get(r.room.id)!]!.filter((i) => mayPrecede(i, k))]) {
        const sizes = covered(r) ? Array.from({ length: crewSizes[k]! }, (_, q) => q + 1) : [base(r, k)];
        for (const size of sizes) {
          const t = turnover(r, i === null ? null : items[i]!.fe.exam, it.fe.exam, size);
          maxReq = Math.max(maxReq, t.req);
          maxBusy = Math.max(maxBusy, t.busy);
        }
      }
    }
  });
  const lo = Math.min(...rooms.map((r) => r.open), ...items.map((it) => it.lo), ...people.map((p) => p.start));
  const hi = Math.max(...rooms.map((r) => r.close), ...items.map((it) => it.hi + it.fe.duration));
  const H = Math.max(hi, ...people.map((p) => p.end));
  const M = H - lo + maxReq + maxBusy + W + 1;

  const at = placeItems(lp, items, rooms, options.grid, M);
  const { s, u, inRoom } = at;
  const F = (k: number) => `F${k}`;
  const c = (k: number) => `c${k}`;
  const R = (k: number) => `R${k}`;
  const B = (k: number) => `B${k}`;
  const z = (k: number, size: number) => `z${k}_${size}`;
  const x = (k: number, p: number) => `x${k}_${p}`;
  const a = (i: number, k: number, r: number) => `a${i}_${k}_${r}`;
  const f = (k: number, r: number) => `f${k}_${r}`;
  const helperTerms: Term[] = [];
  const crewOf: number[][] = items.map(() => []);

  // The chains: each exam in a room has one exam just before it or comes first; one first a room.
  rooms.forEach((r, ri) => {
    const ks = inRooms[ri]!;
    const firsts: Term[] = [];
    for (const k of ks) {
      const Y = inRoom(k, r);
      const into: Term[] = [[1, lp.variable(f(k, ri), 'binary')]];
      firsts.push([1, f(k, ri)]);
      for (const i of ks) if (mayPrecede(i, k)) into.push([1, lp.variable(a(i, k, ri), 'binary')]);
      lp.row([...into, ...Y.terms.map(([q, v]) => [-q, v] as const)], '=', Y.constant);
    }
    for (const i of ks) {
      const Y = inRoom(i, r);
      const out: Term[] = ks.filter((k) => lp.has(a(i, k, ri))).map((k) => [1, a(i, k, ri)] as const);
      if (out.length > 0) lp.row([...out, ...Y.terms.map(([q, v]) => [-q, v] as const)], '<=', Y.constant);
      for (const k of ks) {
        if (!lp.has(a(i, k, ri))) continue;
        // Just before: k starts after i in the plan's order, and k's room is free from i's end.
        const Mo = items[i]!.hi - items[k]!.lo + tie(i, k);
        if (Mo > 0) lp.row([[1, s(k)], [-1, s(i)], [-Mo, a(i, k, ri)]], '>=', tie(i, k) - Mo);
        const d = items[i]!.fe.duration;
        const Mf = hi - lo + d;
        lp.row([[1, F(k)], [-1, s(i)], [Mf, a(i, k, ri)]], '<=', d + Mf);
        lp.row([[1, F(k)], [-1, s(i)], [-Mf, a(i, k, ri)]], '>=', d - Mf);
      }
    }
    if (firsts.length > 1) lp.row(firsts, '<=', 1);
  });

  items.forEach((it, k) => {
    lp.variable(F(k), 'continuous', lo, hi);
    lp.variable(c(k), 'continuous', lo, Math.min(H, options.crewBy ?? H));
    lp.variable(R(k), 'continuous', 0, maxReq);
    lp.variable(B(k), 'continuous', 0, maxBusy);
    if (options.noJob?.has(k)) {
      lp.row([[1, u(k)]], '=', 0);
      return;
    }
    const Mf = hi - lo;
    for (const r of it.rooms) {
      const ri = roomIndex.get(r.room.id)!;
      lp.row([[1, F(k)], [Mf, f(k, ri)]], '<=', r.open + Mf);
      lp.row([[1, F(k)], [-Mf, f(k, ri)]], '>=', r.open - Mf);
    }
    lp.row([[1, c(k)], [-1, F(k)]], '>=', 0);
    // The crew: one size, as many people who cover its room; none in a room nobody covers. Never
    // nobody while someone covers it: the roster staffs every turnover it can before it counts
    // gaps, so a crew left out to free its people for another room is not a schedule it makes.
    const sizes: Term[] = [];
    for (let size = 1; size <= crewSizes[k]!; size++) sizes.push([1, lp.variable(z(k, size), 'binary')]);
    const own = it.rooms.filter((r) => !covered(r)).map((r) => inRoom(k, r));
    lp.row([...sizes, ...own.flatMap((Y) => Y.terms)], '=', 1 - own.reduce((sum, Y) => sum + Y.constant, 0));
    const crew: Term[] = [];
    people.forEach((p, pi) => {
      const theirs = it.rooms.filter((r) => covers(p, r));
      if (theirs.length === 0) return;
      crewOf[k]!.push(pi);
      crew.push([1, lp.variable(x(k, pi), 'binary')]);
      if (theirs.length < it.rooms.length) {
        const Ys = theirs.map((r) => inRoom(k, r));
        lp.row([[1, x(k, pi)], ...Ys.flatMap((Y) => Y.terms.map(([q, v]) => [-q, v] as const))], '<=', Ys.reduce((sum, Y) => sum + Y.constant, 0));
      }
    });
    lp.row([...crew, ...sizes.map(([, v], q) => [-(q + 1), v] as const)], '=', 0); // sizes[q] is a crew of q + 1
    for (const r of it.rooms) {
      const ri = roomIndex.get(r.room.id)!;
      const Y = inRoom(k, r);
      const before = [null, ...inRooms[ri]!.filter((i) => lp.has(a(i, k, ri)))];
      if (!covered(r)) {
        // Its own staff, from the room's free time.
        for (const i of before) {
          const t = turnover(r, i === null ? null : items[i]!.fe.exam, it.fe.exam, base(r, k));
          if (t.req > 0) lp.row([[1, R(k)], [-t.req, i === null ? f(k, ri) : a(i, k, ri)]], '>=', 0);
        }
        continue;
      }
      for (let size = 1; size <= crewSizes[k]!; size++) {
        // A size the room does not allow, in that room; one more than its staff is a helper.
        if (size > most(r, k)) lp.row([[1, z(k, size)], ...Y.terms], '<=', 1 - Y.constant);
        else if (size > base(r, k)) {
          const h = lp.has(`h${k}`) ? `h${k}` : lp.variable(`h${k}`, 'continuous', 0, 1);
          if (!helperTerms.some(([, v]) => v === h)) helperTerms.push([1, h]);
          lp.row([[1, h], [-1, z(k, size)], ...Y.terms.map(([q, v]) => [-q, v] as const)], '>=', Y.constant - 1);
        }
        // Its ready time and hands-on minutes for the exam just before it (or the opening) and this size.
        for (const i of before) {
          const t = turnover(r, i === null ? null : items[i]!.fe.exam, it.fe.exam, size);
          const pred = i === null ? f(k, ri) : a(i, k, ri);
          if (t.req > 0) lp.row([[1, R(k)], [-t.req, pred], [-t.req, z(k, size)]], '>=', -t.req);
          if (t.busy > 0) lp.row([[1, B(k)], [-t.busy, pred], [-t.busy, z(k, size)]], '>=', -t.busy);
        }
      }
    }
    // Cleared: the exam starts once its crew has the room ready (relaxed only by the gap left).
    const Mu = H + maxReq - it.lo;
    lp.row([[1, s(k)], [-1, c(k)], [-1, R(k)], [Mu, u(k)]], '>=', 0);
    // Each member on shift and off break for the crew's hands-on minutes.
    for (const pi of crewOf[k]!) {
      const p = people[pi]!;
      const xp = x(k, pi);
      lp.row([[1, c(k)], [-p.start, xp]], '>=', 0);
      const Me = H + maxBusy - p.end;
      if (Me > 0) lp.row([[1, c(k)], [1, B(k)], [Me, xp]], '<=', p.end + Me);
      p.breaks.forEach((b, bi) => {
        const beta = lp.variable(`b${k}_${pi}_${bi}`, 'binary');
        // beta = 0: done before the break; 1: starts after it.
        lp.row([[1, c(k)], [1, B(k)], [M, xp], [-M, beta]], '<=', b.start + M);
        lp.row([[1, c(k)], [-M, xp], [-M, beta]], '>=', b.end - 2 * M);
      });
    }
  });

  // The roster's order of jobs: by free time, then the plan's room order, then the exam.
  const rank = new Map([...items.keys()].sort((i, k) => items[i]!.fe.exam.id - items[k]!.fe.exam.id).map((k, i) => [k, i]));
  const NR = Math.max(options.roomCount, 1);
  const key = (k: number): Term[] => {
    const terms: Term[] = [[NR * n, F(k)]];
    for (const r of items[k]!.rooms) {
      const Y = inRoom(k, r);
      const order = options.roomOrder.get(r.room.id)!;
      for (const [q, v] of Y.terms) terms.push([q * order * n, v]);
    }
    return terms;
  };
  const keyConstant = (k: number) => rank.get(k)! + items[k]!.rooms.reduce((sum, r) => sum + inRoom(k, r).constant * options.roomOrder.get(r.room.id)! * n, 0);
  const Mw = (hi - lo + 1) * NR * n + 1;
  for (let j = 0; j < n; j++) {
    for (let k = j + 1; k < n; k++) {
      const shared = crewOf[j]!.filter((p) => crewOf[k]!.includes(p));
      if (shared.length === 0) continue;
      const w = lp.variable(`w${j}_${k}`, 'binary');
      const diff: Term[] = [...key(k), ...key(j).map(([q, v]) => [-q, v] as const)];
      const dc = keyConstant(k) - keyConstant(j);
      // w = 1: j's job comes first (key(k) ≥ key(j) + 1); w = 0: k's does.
      lp.row([...diff, [-Mw, w]], '>=', 1 - dc - Mw);
      lp.row([...diff.map(([q, v]) => [-q, v] as const), [Mw, w]], '>=', 1 + dc);
      // Walking: between two different rooms.
      const walk: Term[] = [];
      let walkConstant = 0;
      if (W > 0) {
        const [one, other] = [items[j]!, items[k]!];
        if (one.rooms.length === 1 && other.rooms.length === 1) walkConstant = one.rooms[0] === other.rooms[0] ? 0 : W;
        else {
          const d = lp.variable(`d${j}_${k}`, 'continuous', 0, 1);
          for (const r of new Set([...one.rooms, ...other.rooms])) {
            const [Yj, Yk] = [inRoom(j, r), inRoom(k, r)];
            lp.row([[1, d], ...Yj.terms.map(([q, v]) => [-q, v] as const), ...Yk.terms], '>=', Yj.constant - Yk.constant);
            lp.row([[1, d], ...Yk.terms.map(([q, v]) => [-q, v] as const), ...Yj.terms], '>=', Yk.constant - Yj.constant);
          }
          walk.push([W, d]);
        }
      }
      for (const pi of shared) {
        const [xj, xk] = [x(j, pi), x(k, pi)];
        // w = 1: k's crew starts once j's is done here and has walked; w = 0 the other way.
        lp.row([[1, c(k)], [-1, c(j)], [-1, B(j)], ...walk.map(([q, v]) => [-q, v] as const), [-M, w], [-M, xj], [-M, xk]], '>=', walkConstant - 3 * M);
        lp.row([[1, c(j)], [-1, c(k)], [-1, B(k)], ...walk.map(([q, v]) => [-q, v] as const), [M, w], [-M, xj], [-M, xk]], '>=', walkConstant - 2 * M);
      }
    }
  }

  return {
    lp,
    levels: [at.gapsLeft, at.moved, tail(at.minutes, helperTerms, hi - lo)],
    decode(values) {
      const places: ClusterSolution['places'] = new Map();
      const helpers: ClusterSolution['helpers'] = new Map();
      items.forEach((it, k) => {
        const room = roomOf(values, it, k, rooms);
        if (it.free) places.set(it.fe.exam.id, { roomId: room.room.id, start: Math.round(values.get(s(k)) ?? it.fe.start) });
        if ((values.get(`h${k}`) ?? 0) < 0.5) return;
        // The helper named is the crew's last member (any of them may be, by the roster's rules).
        const crew = crewOf[k]!.filter((pi) => (values.get(x(k, pi)) ?? 0) > 0.5);
        const p = people[crew[crew.length - 1]!]!;
        const from = Math.round(values.get(c(k)) ?? 0);
        const to = from + Math.round(values.get(B(k)) ?? 0);
        helpers.set(it.fe.exam.id, { slot: { helper: { id: p.id, label: p.label, free: [], roomIds: p.roomIds }, from, to }, busyFrom: from, busyTo: to });
      });
      return { places, helpers };
    },
  };
}
