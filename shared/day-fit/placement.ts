import type { ClusterItem } from './cluster-model';
import type { FitRoom } from './instance';
import type { LpWriter, Term } from './lp-writer';

/** Where each item of a model may go, as variables: shared by the cluster model and the roster model. */
export interface Placement {
  /** The item's start, in minutes after the site's midnight. */
  s(k: number): string;
  /** 1: the gap into the item is left (its turnover rows are relaxed). */
  u(k: number): string;
  /** The item is in room r, as terms plus a constant (an item with one room is a constant 1). */
  inRoom(k: number, r: FitRoom): { terms: Term[]; constant: number };
  /** One term per free item: 1 when it moves. */
  moved: Term[];
  /** One term per free item: the minutes it moves. */
  minutes: Term[];
  /** One term per item: its gap left. */
  gapsLeft: Term[];
}

/**
 * The placement part of a day-fit MIP: each item's start `s` (within its window, on the grid
 * when it moves), its room `y` (one of its rooms), whether it moved `m` and by how many minutes
 * `v`, its gap left `u`, and `z` ≥ every end (the day's end). Hours are hard: a free item stays
 * inside the hours of the room it is in.
 *
 * @param M a big-M at least the model's span (for the grid rows)
 * @example
 * const at = placeItems(lp, items, rooms, 1, 600);
 * lp.row([[1, at.s(1)], [-1, at.s(0)]], '>=', 30);
 */
export function placeItems(lp: LpWriter, items: readonly ClusterItem[], rooms: readonly FitRoom[], grid: number, M: number): Placement {
  const roomIndex = new Map(rooms.map((r, k) => [r.room.id, k]));
  const s = (k: number) => `s${k}`;
  const u = (k: number) => `u${k}`;
  const y = (k: number, r: FitRoom) => `y${k}_${roomIndex.get(r.room.id)}`;
  const inRoom = (k: number, r: FitRoom): { terms: Term[]; constant: number } => {
    const it = items[k]!;
    if (!it.rooms.includes(r)) return { terms: [], constant: 0 };
    return it.rooms.length === 1 ? { terms: [], constant: 1 } : { terms: [[1, y(k, r)]], constant: 0 };
  };
  const moved: Term[] = [];
  const minutes: Term[] = [];
  const gapsLeft: Term[] = [];
  lp.variable('z', 'continuous', 0);
  items.forEach((it, k) => {
    const { start, duration } = it.fe;
    lp.variable(s(k), 'integer', it.lo, it.hi);
    lp.variable(u(k), 'binary');
    gapsLeft.push([1, u(k)]);
    lp.row([[1, 'z'], [-1, s(k)]], '>=', duration);
    if (!it.free) return;
    if (it.rooms.length > 1) {
      for (const r of it.rooms) lp.variable(y(k, r), 'binary');
      lp.row(it.rooms.map((r) => [1, y(k, r)] as const), '=', 1);
    }
    const m = lp.variable(`m${k}`, 'binary');
    const v = lp.variable(`v${k}`, 'continuous', 0);
    moved.push([1, m]);
    minutes.push([1, v]);
    // Big-M as small as the window allows: a tight relaxation is what makes the solves fast.
    lp.row([[1, s(k)], [-Math.max(0, it.hi - start), m]], '<=', start);
    lp.row([[1, s(k)], [Math.max(0, start - it.lo), m]], '>=', start);
    lp.row([[1, v], [-1, s(k)]], '>=', -start);
    lp.row([[1, v], [1, s(k)]], '>=', start);
    const own = it.rooms.find((r) => r.room.id === it.fe.roomId);
    if (!own) lp.row([[1, m]], '=', 1);
    else if (it.rooms.length > 1) lp.row([[1, y(k, own)], [1, m]], '>=', 1);
    if (grid > 1) {
      // Moved: on the grid (s = grid·g); not moved: its own start, on the grid or not.
      const g = lp.variable(`g${k}`, 'integer', Math.ceil(it.lo / grid), Math.floor(it.hi / grid));
      lp.row([[1, s(k)], [-grid, g], [M, m]], '<=', M);
      lp.row([[1, s(k)], [-grid, g], [-M, m]], '>=', -M);
    }
    // Hours of the room it is in (hard: a proposal never leaves a room's hours).
    for (const r of it.rooms) {
      const Y = inRoom(k, r);
      if (Y.constant === 1) continue; // its only room: the bounds lo..hi already keep it within the hours
      const below = r.open - it.lo;
      const above = it.hi - (r.close - duration);
      if (below > 0) lp.row([[1, s(k)], ...Y.terms.map(([c, x]) => [-below * c, x] as const)], '>=', r.open - below);
      if (above > 0) lp.row([[1, s(k)], ...Y.terms.map(([c, x]) => [above * c, x] as const)], '<=', r.close - duration + above);
    }
  });
  return { s, u, inRoom, moved, minutes, gapsLeft };
}

/** The room an item is in, from a solution's values. */
export function roomOf(values: ReadonlyMap<string, number>, it: ClusterItem, k: number, rooms: readonly FitRoom[]): FitRoom {
  if (it.rooms.length === 1) return it.rooms[0]!;
  const index = (r: FitRoom) => rooms.indexOf(r);
  return it.rooms.find((r) => (values.get(`y${k}_${index(r)}`) ?? 0) > 0.5) ?? it.rooms[0]!;
}
