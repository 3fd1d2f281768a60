import type { ClusterItem } from './cluster-model';
import type { FitDay, FitExam, FitGroup, FitRoom } from './instance';

/** How far a neighbourhood reaches: exams on either side of a problem gap, and minutes a start may shift. */
export interface Reach {
  neighbours: number;
  shiftMinutes: number;
  /** Rooms an exam may move among (its own block of this many, in id order). */
  roomsPerBlock: number;
  /** Free exams in one cluster at most. */
  maxFree: number;
}

/** Every free exam of the group may go anywhere in the group's hours: one cluster, the exact model. */
export function wholeGroup(group: FitGroup): ClusterItem[][] {
  const items = group.exams.map((fe) => {
    const it = fe.stays === null ? freeItem(fe, group.rooms, -Infinity, Infinity) : null;
    return it && it.rooms.length > 0 ? it : fixedItem(fe, group.rooms);
  });
  return [items];
}

/**
 * Clusters around problem gaps, for a group too large to solve whole: the exams at each gap
 * and `reach.neighbours` on either side in their room are free to move up to
 * `reach.shiftMinutes` (to any open room of the group); the exams their windows can touch are
 * constants. Clusters whose windows (plus the longest turnover) do not meet are independent.
 *
 * @example
 * neighbourhoods(day, group, new Set([12, 40]), { neighbours: 1, shiftMinutes: 60 }).length; // 2
 */
export function neighbourhoods(day: FitDay, group: FitGroup, seeds: ReadonlySet<number>, reach: Reach): ClusterItem[][] {
  const byRoom = new Map<number, FitExam[]>(group.rooms.map((r) => [r.room.id, []]));
  for (const fe of group.exams) byRoom.get(fe.roomId)!.push(fe);
  const freeIds = new Set<number>();
  for (const list of byRoom.values()) {
    list.sort((a, b) => a.start - b.start || a.exam.id - b.exam.id);
    list.forEach((fe, idx) => {
      if (!seeds.has(fe.exam.id)) return;
      for (let t = Math.max(0, idx - 1 - reach.neighbours); t <= Math.min(list.length - 1, idx + reach.neighbours); t++) {
        if (list[t]!.stays === null) freeIds.add(list[t]!.exam.id);
      }
    });
  }
  // Moves to another room stay within a block of rooms (ids in order), so clusters stay small.
  const blockOf = new Map(group.rooms.map((r, k) => [r.room.id, Math.floor(k / reach.roomsPerBlock)]));
  const free = group.exams
    .filter((fe) => freeIds.has(fe.exam.id))
    .map((fe) => freeItem(fe, group.rooms.filter((r) => blockOf.get(r.room.id) === blockOf.get(fe.roomId)), fe.start - reach.shiftMinutes, fe.start + reach.shiftMinutes))
    .filter((it) => it.rooms.length > 0)
    .sort((a, b) => blockOf.get(a.fe.roomId)! - blockOf.get(b.fe.roomId)! || a.lo - b.lo);
  const pad = longestTurnover(day, group) + 1;
  // Sweep, block by block: free exams whose reach (plus a turnover) meets fall in one cluster, up
  // to `maxFree`; a longer run is cut, and the later part is solved after the earlier, with the
  // earlier one's exams as constants at their new places (solveGroup refreshes them).
  const clusters: ClusterItem[][] = [];
  let end = -Infinity;
  let block = -1;
  for (const it of free) {
    const current = clusters[clusters.length - 1];
    const b = blockOf.get(it.fe.roomId)!;
    if (!current || b !== block || it.lo - pad > end || current.length >= reach.maxFree) {
      clusters.push([]);
      end = -Infinity;
    }
    block = b;
    clusters[clusters.length - 1]!.push(it);
    end = Math.max(end, it.hi + it.fe.duration + pad);
  }
  return clusters.map((items) => {
    const from = Math.min(...items.map((it) => it.lo)) - pad - reach.shiftMinutes;
    const to = Math.max(...items.map((it) => it.hi + it.fe.duration)) + pad + reach.shiftMinutes;
    const ids = new Set(items.map((it) => it.fe.exam.id));
    const rooms = new Set(items.flatMap((it) => it.rooms.map((r) => r.room.id)));
    const context = group.exams
      .filter((fe) => !ids.has(fe.exam.id) && rooms.has(fe.roomId) && fe.start + fe.duration >= from && fe.start <= to)
      .map((fe) => fixedItem(fe, group.rooms));
    return [...items, ...context];
  });
}

export function freeItem(fe: FitExam, rooms: readonly FitRoom[], from: number, to: number): ClusterItem {
  const earliest = Math.max(from, fe.earliest);
  const fits = rooms.filter((r) => Math.max(r.open, earliest) <= Math.min(r.close - fe.duration, to));
  const lo = Math.max(earliest, Math.min(...fits.map((r) => r.open)));
  const hi = Math.min(to, Math.max(...fits.map((r) => r.close - fe.duration)));
  return { fe, free: true, lo, hi, rooms: fits };
}

export function fixedItem(fe: FitExam, rooms: readonly FitRoom[]): ClusterItem {
  return { fe, free: false, lo: fe.start, hi: fe.start, rooms: rooms.filter((r) => r.room.id === fe.roomId) };
}

function longestTurnover(day: FitDay, group: FitGroup): number {
  let longest = 0;
  const seen = new Set<string>();
  for (const fe of group.exams) {
    const kind = `${fe.exam.precaution}|${fe.exam.mobility}`;
    if (seen.has(kind)) continue;
    seen.add(kind);
    for (const r of group.rooms) longest = Math.max(longest, day.required(r.room, fe.exam, fe.exam, day.baseStaff(r.room, fe.exam)));
  }
  return longest + 10;
}
