import type { ExamMove, PlanChange } from '../api/changes';
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlanSlot } from '../turnover/day-plan-output';
import { turnoverFor } from '../turnover/day-plan-cache';
import { protocolFor } from '../turnover/protocols';
import { fixDay, summaryWith, type FixDay } from './fix-day';
import { MAX_FIX_CHANGES_PER_CALL, MAX_FIX_GAPS_PER_CALL, type Fix, type FixesPage, type FixKind } from './model';
import { isProblemVerdict, type JudgedGap, type JudgedRoom } from './room-gaps';

const MINUTE = 60_000;
const MAX_STAFF = 3;

/**
 * The fixes for one problem gap (the gap before exam `toExamId`), each with its effect computed
 * by the engine on the rooms it touches: push the arriving exam (and only as much of the
 * cascade as needed) later; move it to another room of the same modality where it fits; add a
 * helper to the turnover; move the leaving isolation case to the end of its room's list (common
 * practice, no source: isolation cases last). A fix never counts the gap it fixes as new;
 * `effect.newProblems` counts the rest. Work grows with the rooms touched, not the day. A fix
 * never moves an exam that stays (`bounds`: arrived, started, pinned) or whose start has passed
 * at `bounds.notBefore`, and gives a gap whose arriving exam is already due no fix at all.
 *
 * @returns `[]` when that gap is not `short` or `overlap`; null when no such exam is in the day
 * @throws what `computeDaySummary` throws on a bad day
 * @example
 * suggestGapFixes(input, 12); // [{ id: 'push-later:12', kind: 'push-later', title: 'Start ACC-12 30 min later, at 10:45', … }]
 */
export function suggestGapFixes(input: DayPlanInput, toExamId: number, bounds: FixBounds = {}): Fix[] | null {
  const day = fixDay(input);
  const roomId = day.roomOfExam.get(toExamId);
  if (roomId === undefined) return null;
  const room = day.judged(roomId);
  return fixesOfGap(day, room, room.gaps.findIndex((g) => g.toExamId === toExamId), boundsOf(bounds));
}

/** What a fix may not touch; by default nothing stays and no time has passed. */
export interface FixBounds {
  /** Exams that may not move: arrived, started or pinned (ids). */
  stays?: readonly number[];
  /** Now (ms since the epoch): an exam whose start is before it may not move, and nothing moves to before it. */
  notBefore?: number;
}

interface Bounds {
  /** Whether the exam of this slot may not move (it stays, or its start has passed). */
  stays(slot: DayPlanSlot): boolean;
  notBefore: number;
}

function boundsOf({ stays = [], notBefore = -Infinity }: FixBounds): Bounds {
  const fixed = new Set(stays);
  return { stays: (slot) => fixed.has(slot.exam.id) || slot.startMs < notBefore, notBefore };
}

export interface SuggestFixesOptions extends FixBounds {
  /** Start after the gap before this exam (a page's `next`); default the day's first gap. */
  after?: number;
  /** Problem gaps to cover, 1 to {@link MAX_FIX_GAPS_PER_CALL} (the default). */
  limit?: number;
}

/**
 * One page of the day's fixes: those of the next `limit` problem gaps in plan order (rooms as
 * listed, then by start), from the gap after exam `after`; fewer when their fixes reach
 * {@link MAX_FIX_CHANGES_PER_CALL} changes (never none). The work per call is bounded by the
 * page, whatever the size of the day.
 *
 * @returns null when `after` is not an exam of the day
 * @throws RangeError when `limit` is not a whole number from 1 to {@link MAX_FIX_GAPS_PER_CALL};
 *   what `computeDaySummary` throws on a bad day
 * @example
 * const first = suggestFixes(input, { limit: 20 }); // { fixes: [...], gaps: [4, 9, …], problemGaps: 57, next: 311 }
 * const second = suggestFixes(input, { after: first.next!, limit: 20 });
 */
export function suggestFixes(input: DayPlanInput, options: SuggestFixesOptions = {}): FixesPage | null {
  const limit = options.limit ?? MAX_FIX_GAPS_PER_CALL;
  if (!Number.isInteger(limit) || limit < 1 || limit > MAX_FIX_GAPS_PER_CALL) {
    throw new RangeError(`limit must be a whole number from 1 to ${MAX_FIX_GAPS_PER_CALL}, got ${limit}`);
  }
  const day = fixDay(input);
  const bounds = boundsOf(options);
  let roomIndex = 0;
  let gapIndex = 0;
  if (options.after !== undefined) {
    const roomId = day.roomOfExam.get(options.after);
    if (roomId === undefined) return null;
    roomIndex = day.rooms.findIndex((r) => r.id === roomId);
    gapIndex = day.judged(roomId).gaps.findIndex((g) => g.toExamId === options.after) + 1;
  }
  const page: FixesPage = { fixes: [], gaps: [], problemGaps: day.summary.short + day.summary.overlap, next: null };
  let changes = 0;
  for (; roomIndex < day.rooms.length; roomIndex++, gapIndex = 0) {
    const room = day.judged(day.rooms[roomIndex]!.id);
    for (; gapIndex < room.gaps.length; gapIndex++) {
      const gap = room.gaps[gapIndex]!;
      if (!isProblemVerdict(gap.verdict)) continue;
      if (page.gaps.length === limit || changes >= MAX_FIX_CHANGES_PER_CALL) {
        // one more problem gap exists: the page ends at the last one covered
        page.next = page.gaps.at(-1)!;
        return page;
      }
      page.gaps.push(gap.toExamId);
      for (const fix of fixesOfGap(day, room, gapIndex, bounds)) {
        page.fixes.push(fix);
        changes += fix.changes.length;
      }
    }
  }
  return page;
}

function fixesOfGap(day: FixDay, room: JudgedRoom, index: number, bounds: Bounds): Fix[] {
  if (!isProblemVerdict(room.gaps[index]?.verdict)) return [];
  // The arriving patient is already due: that turnover is history, nothing left to fix.
  if (room.slots[index]!.startMs < bounds.notBefore) return [];
  const fixes: Fix[] = [];
  for (const build of [pushLater, otherRoom, addHelper, isolationLast]) {
    const fix = build(day, room, index, bounds);
    if (fix) fixes.push(fix);
  }
  return fixes;
}

const hhmm = (day: FixDay, t: number) => day.format(t).slice(11, 16);

function move(day: FixDay, slot: DayPlanSlot, roomId: number, start: string): ExamMove {
  const { exam } = slot;
  return { type: 'move', examId: exam.id, accession: exam.accession, from: { roomId: exam.roomId, start: day.format(slot.startMs) }, to: { roomId, start } };
}

interface Weighed {
  focus: JudgedGap;
  /** The touched rooms afterwards. */
  after: Map<number, JudgedRoom>;
}

/**
 * Weighs changes on the rooms they touch (the gap's room, and the rooms exams move from and to:
 * no other gap can change) and packages them as a fix.
 */
function evaluate(day: FixDay, kind: FixKind, room: JudgedRoom, gap: JudgedGap, changes: PlanChange[], title: string, describe: (weighed: Weighed) => string): Fix | null {
  const touched = new Set<number>([room.room.id]);
  for (const change of changes) if (change.type === 'move') touched.add(change.from.roomId).add(change.to.roomId);
  const after = day.judgeWith(touched, changes);
  let focus: JudgedGap | undefined;
  let newProblems = 0;
  for (const judged of after.values()) {
    for (const g of judged.gaps) {
      if (g.toExamId === gap.toExamId) focus = g;
      else if (isProblemVerdict(g.verdict) && !isProblemVerdict(day.gapBefore(g.toExamId)?.verdict)) newProblems++;
    }
  }
  if (!focus) return null;
  let endBefore = -Infinity;
  let endAfter = -Infinity;
  for (const [roomId, judged] of after) {
    endBefore = Math.max(endBefore, day.judged(roomId).endsMs);
    endAfter = Math.max(endAfter, judged.endsMs);
  }
  return {
    id: `${kind}:${gap.toExamId}`,
    kind,
    toExamId: gap.toExamId,
    title,
    detail: describe({ focus, after }),
    changes,
    effect: {
      verdictAfter: focus.verdict,
      shortByAfter: focus.shortByMinutes,
      newProblems,
      dayEndsBefore: day.format(endBefore),
      dayEndsAfter: day.format(endAfter),
      summaryAfter: summaryWith(day, after),
    },
  };
}

function pushLater(day: FixDay, room: JudgedRoom, index: number, bounds: Bounds): Fix | null {
  const gap = room.gaps[index]!;
  const changes: ExamMove[] = [];
  let previousEnd = room.slots[index]!.startMs - gap.availableMinutes * MINUTE; // the leaving exam's end (or the opening)
  for (let i = index; i < room.slots.length; i++) {
    const slot = room.slots[i]!;
    const g = room.gaps[i]!;
    // only as far as needed: a fitting gap keeps fitting, a snug one stays at least snug, a problem gap gets no worse
    const wanted = i === index ? g.requiredMinutes + day.margin : g.verdict === 'fits' ? g.requiredMinutes + day.margin : g.verdict === 'snug' ? g.requiredMinutes : g.availableMinutes;
    const start = Math.max(slot.startMs, previousEnd + wanted * MINUTE);
    if (start === slot.startMs) break;
    if (bounds.stays(slot)) return null; // the cascade would move an exam that stays
    previousEnd = start + slot.exam.durationMinutes * MINUTE;
    if (previousEnd > day.lastEndMs) return null; // nothing is pushed into the next day
    changes.push(move(day, slot, room.room.id, day.format(start)));
  }
  if (changes.length === 0) return null;
  const first = changes[0]!;
  const later = Math.round((Date.parse(first.to.start) - Date.parse(first.from.start)) / MINUTE);
  const name = room.room.name;
  return evaluate(day, 'push-later', room, gap, changes, `Start ${first.accession} ${later} min later, at ${first.to.start.slice(11, 16)}`, ({ after }) => {
    const cascade = changes.length > 1 ? ` and ${changes.length - 1} later exam${changes.length > 2 ? 's' : ''} in ${name} ${changes.length > 2 ? 'move' : 'moves'} too` : '';
    const endsMs = after.get(room.room.id)!.endsMs;
    const end = endsMs === room.endsMs ? `still ends at ${hhmm(day, endsMs)}` : `then ends at ${hhmm(day, endsMs)} (was ${hhmm(day, room.endsMs)})`;
    return `${first.accession} moves${cascade}; ${name}'s last exam ${end}.`;
  });
}

function otherRoom(day: FixDay, room: JudgedRoom, index: number, bounds: Bounds): Fix | null {
  const gap = room.gaps[index]!;
  const slot = room.slots[index]!;
  if (bounds.stays(slot)) return null;
  const { exam } = slot;
  for (const candidate of day.rooms) {
    if (candidate.id === room.room.id || candidate.modality !== room.room.modality) continue;
    const start = day.format(slot.startMs);
    const fix = evaluate(day, 'other-room', room, gap, [move(day, slot, candidate.id, start)], `Move ${exam.accession} to ${candidate.name} at the same time`, ({ focus }) =>
      `${exam.accession} keeps its ${hhmm(day, slot.startMs)} start in ${candidate.name}; its turnover there ${focus.verdict === 'fits' ? 'fits' : `is ${focus.verdict}`}.`,
    );
    if (fix && fix.effect.newProblems === 0 && !isProblemVerdict(fix.effect.verdictAfter)) return fix;
  }
  return null;
}

function addHelper(day: FixDay, room: JudgedRoom, index: number): Fix | null {
  const gap = room.gaps[index]!;
  if (gap.staff >= MAX_STAFF) return null;
  const accession = room.slots[index]!.exam.accession;
  const current = day.input.staffOverrides?.[gap.toExamId] ?? null;
  const changes: PlanChange[] = [{ type: 'staffing', toExamId: gap.toExamId, accession, from: current, to: gap.staff + 1 }];
  const fix = evaluate(day, 'add-helper', room, gap, changes, `Add a helper before ${accession} (${gap.staff + 1} people)`, ({ focus }) =>
    focus.requiredMinutes < gap.requiredMinutes
      ? `The turnover takes ${focus.requiredMinutes} min instead of ${gap.requiredMinutes}${isProblemVerdict(focus.verdict) ? `; still short by ${focus.shortByMinutes} min` : ''}.`
      : 'A second person does not shorten this turnover (it is waiting on drying or the air hold).',
  );
  return fix && fix.effect.shortByAfter < gap.shortByMinutes ? fix : null;
}

function isolationLast(day: FixDay, room: JudgedRoom, index: number, bounds: Bounds): Fix | null {
  const gap = room.gaps[index]!;
  const leaving = index > 0 ? room.slots[index - 1]! : undefined;
  const last = room.slots.at(-1)!;
  if (!leaving || leaving.exam.precaution === 'none' || leaving === last || bounds.stays(leaving)) return null;
  // the turnover it needs when placed right after the last exam; then that gap is left before it
  const needed = turnoverAfterLast(day, room, leaving, last);
  const startMs = last.endMs + (needed + day.margin) * MINUTE;
  if (startMs + leaving.exam.durationMinutes * MINUTE > day.lastEndMs) return null;
  const name = room.room.name;
  const changes = [move(day, leaving, room.room.id, day.format(startMs))];
  const { accession, precaution } = leaving.exam;
  return evaluate(day, 'isolation-last', room, gap, changes, `Move the ${precaution}-precaution case ${accession} to the end of ${name}'s list`, ({ after }) =>
    `${accession} then starts at ${hhmm(day, startMs)} after ${last.exam.accession}; ${name}'s day ends at ${hhmm(day, after.get(room.room.id)!.endsMs)}. Isolation cases last is common practice, leaving time for the terminal clean.`,
  );
}

/** Required minutes of the turnover before `leaving` once it starts at the end of the last exam. */
function turnoverAfterLast(day: FixDay, room: JudgedRoom, leaving: DayPlanSlot, last: DayPlanSlot): number {
  const { input } = day;
  if (last.endMs > last.startMs) {
    // it then starts after every other exam, so the last exam is the one it follows
    const protocol = protocolFor(room.room.modality, input.protocols);
    // only a room with a protocol has problem gaps to fix
    if (!protocol) throw new Error(`room ${room.room.id} has no protocol`);
    const staff = input.staffOverrides?.[leaving.exam.id] ?? room.room.staff;
    return turnoverFor(day.turnovers(protocol), { input, room: room.room, protocol, leaving: last.exam, arriving: leaving.exam, staff }).requiredMinutes;
  }
  // a zero-length last exam ties on start time, and the id decides the order: judge the room
  const probe = day.judgeWith(new Set([room.room.id]), [move(day, leaving, room.room.id, day.format(last.endMs))]).get(room.room.id)!;
  return probe.gaps.find((g) => g.toExamId === leaving.exam.id)!.requiredMinutes;
}
