import type { DayPlan, PlanPerson, PlanRoom, Verdict } from '@shared/api/plan';
import { ROSTER_ROLE_LABEL } from '@shared/api/roster';
import { DateTime } from 'luxon';

import { verdictWords } from './gap-view';
import { blockAccession, clockOf } from './lane-view';
import { TimelineScale, xOf } from './timeline-scale';

const MINUTE = 60_000;

/** One piece of turnover work on a person's lane, placed on the scale, with its words. */
export interface WorkBlockView {
  /** The turnover's arriving exam: what the gap panel opens. */
  toExamId: number;
  roomId: number;
  room: string;
  /** The next exam's accession as the block can show it (its end when narrow), '' when too narrow. */
  accession: string;
  /** Shows the room name (too narrow: only in its label and tooltip). */
  showRoom: boolean;
  left: number;
  width: number;
  /** 0 unless pieces overlap: the row the block is drawn in, of `rows`. */
  row: number;
  /** 1, or the rows its run of overlapping pieces needs: only clashing work gives up height. */
  rows: number;
  verdict: Verdict | null;
  /** The work overlaps another piece of this person's, or leaves no time to walk to the next room. */
  clash: boolean;
  dimmed: boolean;
  /** "MR 2, ACC-21, turnover 09:52–10:12, short by 6 min; clashes with MR 1, ACC-3 (10:05–10:20)" */
  label: string;
}

/** A stretch of the lane that is not work: walking between rooms, a break, time off shift, free time on shift. */
export interface SpanView {
  left: number;
  width: number;
  minutes: number;
  /** Words drawn in the span when wide enough ("walk 3 min", "break", "free 45 min"), '' otherwise. */
  text: string;
  /** Its whole description, for the tooltip ("walk MR 2 → MR 1, 10:12–10:15"). */
  title: string;
}

/** Where two pieces of work collide: drawn over both as a hatched band with its own mark and word. */
export interface ClashView {
  left: number;
  width: number;
  /** "clash 10:05–10:12" or "no time to walk" */
  text: string;
}

/** Everything a person's lane shows, worked out once per lane when the plan or the scale change. */
export interface PersonLaneView {
  person: PlanPerson;
  /** "Aide 2, 07:00–15:00, break 11:00–11:30, 4 turnovers, 1 clash": the lane's accessible name. */
  label: string;
  /** "07:00–15:00" */
  hours: string;
  /** "4 turnovers · busy 1 h 04" */
  summary: string;
  /** The rooms the person covers, by name, in the roster's order. */
  rooms: string;
  /** Before the shift and after it. */
  offShift: SpanView[];
  breaks: SpanView[];
  walks: SpanView[];
  free: SpanView[];
  work: WorkBlockView[];
  clashes: ClashView[];
  /** 1, or the most rows a run of overlapping pieces needs. */
  rows: number;
}

/** Narrowest a work block is drawn: a pointer target of WCAG 2.2's 24 px (2.5.8). */
export const MIN_WORK_PX = 24;
/** Room for the room name ("MR 2") in the block's bold 12 px text, and for a free span's words. */
const ROOM_PX = 40;
const FREE_TEXT_PX = 90;
const WALK_TEXT_PX = 64;
const BREAK_TEXT_PX = 44;
/** Free time shorter than this is the ordinary slack between turnovers: not worth a word. */
const FREE_WORTH_SAYING_MINUTES = 30;

/** "45 min", "1 h", "1 h 05". */
export function durationWords(minutes: number): string {
  if (minutes < 60) return `${minutes} min`;
  const rest = minutes % 60;
  return rest === 0 ? `${Math.floor(minutes / 60)} h` : `${Math.floor(minutes / 60)} h ${String(rest).padStart(2, '0')}`;
}

const minutesBetween = (fromMs: number, toMs: number) => Math.round((toMs - fromMs) / MINUTE);

/**
 * A person's day on the scale: shift (off-shift time shaded), breaks, each piece of turnover work
 * with the room and the next exam's accession, the walk between rooms, free time, and clashes —
 * two pieces at once, or too little time to walk between rooms — which the engine never plans
 * but a roster or a plan edited by hand may hold.
 */
export function personLaneView(person: PlanPerson, plan: DayPlan, scale: TimelineScale, onlyProblems = false): PersonLaneView {
  const rooms = new Map(plan.rooms.map((room) => [room.id, room]));
  const walkMs = (plan.people?.walkingMinutes ?? 0) * MINUTE;
  const clock = (ms: number) => DateTime.fromMillis(ms, { zone: plan.timezone }).toFormat('HH:mm');
  const span = (fromMs: number, toMs: number, text: string, textPx: number, title: string): SpanView => {
    const left = Math.max(0, xOf(scale, fromMs));
    const width = Math.max(0, Math.min(scale.widthPx, xOf(scale, toMs)) - left);
    return { left, width, minutes: minutesBetween(fromMs, toMs), text: width >= textPx ? text : '', title };
  };

  const shiftStart = Date.parse(person.start);
  const shiftEnd = Date.parse(person.end);
  const offShift = [span(scale.startMs, shiftStart, '', Infinity, 'off shift'), span(shiftEnd, scale.endMs, '', Infinity, 'off shift')].filter((s) => s.width > 0);
  const breaks = person.breaks.map((b) => span(Date.parse(b.start), Date.parse(b.end), 'break', BREAK_TEXT_PX, `break ${clockOf(b.start)}–${clockOf(b.end)}`));

  const pieces = [...person.work]
    .map((work) => ({ work, startMs: Date.parse(work.start), endMs: Date.parse(work.end) }))
    .sort((a, b) => a.startMs - b.startMs || a.endMs - b.endMs);
  const roomName = (id: number) => rooms.get(id)?.name ?? `room ${id}`;
  const accessionOf = (roomId: number, examId: number) => rooms.get(roomId)?.exams.find((exam) => exam.id === examId)?.accession ?? `exam ${examId}`;
  const gapOf = (roomId: number, examId: number) => rooms.get(roomId)?.gaps.find((gap) => gap.toExamId === examId) ?? null;
  const describe = (p: (typeof pieces)[number]) => `${roomName(p.work.roomId)}, ${accessionOf(p.work.roomId, p.work.toExamId)} (${clockOf(p.work.start)}–${clockOf(p.work.end)})`;

  // Rows: within each run of overlapping pieces, each piece in the first row free at its start
  // (interval partitioning), so they sit one above the other instead of hiding each other.
  const rowOf: number[] = [];
  const rowsOf: number[] = [];
  for (let first = 0; first < pieces.length; ) {
    let last = first;
    let runEnd = pieces[first]!.endMs;
    while (last + 1 < pieces.length && pieces[last + 1]!.startMs < runEnd) runEnd = Math.max(runEnd, pieces[++last]!.endMs);
    const rowEnds: number[] = [];
    for (let i = first; i <= last; i++) {
      let row = rowEnds.findIndex((end) => end <= pieces[i]!.startMs);
      if (row < 0) row = rowEnds.push(0) - 1;
      rowEnds[row] = pieces[i]!.endMs;
      rowOf[i] = row;
    }
    for (let i = first; i <= last; i++) rowsOf[i] = rowEnds.length;
    first = last + 1;
  }

  // Clashes: every pair that overlaps, and every move to another room that leaves less than the walk.
  const clashesWith = pieces.map(() => [] as string[]);
  const clashes: ClashView[] = [];
  const walks: SpanView[] = [];
  for (let i = 0; i < pieces.length; i++) {
    for (let j = i + 1; j < pieces.length && pieces[j]!.startMs < pieces[i]!.endMs; j++) {
      const from = pieces[j]!.startMs;
      const to = Math.min(pieces[i]!.endMs, pieces[j]!.endMs);
      clashesWith[i]!.push(`clashes with ${describe(pieces[j]!)}`);
      clashesWith[j]!.push(`clashes with ${describe(pieces[i]!)}`);
      const band = span(from, to, '', Infinity, '');
      clashes.push({ left: band.left, width: Math.max(band.width, 2), text: `clash ${clock(from)}–${clock(to)}` });
    }
  }
  // Walks: from the end of one piece to the start of the next that is in another room (the engine
  // sets off as soon as the work is done), as far as the walking time goes.
  for (let i = 0; i + 1 < pieces.length; i++) {
    const here = pieces[i]!;
    const next = pieces.slice(i + 1).find((p) => p.startMs >= here.endMs);
    if (!next || next !== pieces[i + 1] || next.work.roomId === here.work.roomId || walkMs === 0) continue;
    const arrives = here.endMs + walkMs;
    const title = `walk ${roomName(here.work.roomId)} → ${roomName(next.work.roomId)}, ${durationWords(walkMs / MINUTE)}`;
    walks.push(span(here.endMs, Math.min(arrives, next.startMs), `walk ${walkMs / MINUTE} min`, WALK_TEXT_PX, title));
    if (arrives > next.startMs) {
      const short = minutesBetween(next.startMs, arrives);
      const words = `no time to walk to ${roomName(next.work.roomId)} (${short} min short)`;
      clashesWith[i]!.push(words);
      clashesWith[i + 1]!.push(`no time to walk from ${roomName(here.work.roomId)} (${short} min short)`);
      const band = span(here.endMs, Math.max(next.startMs, here.endMs + MINUTE), '', Infinity, '');
      clashes.push({ left: band.left, width: Math.max(band.width, 2), text: 'no time to walk' });
    }
  }

  const work = pieces.map((p, i): WorkBlockView => {
    const gap = gapOf(p.work.roomId, p.work.toExamId);
    const left = xOf(scale, p.startMs);
    // At least the 24 px pointer target, but never over the next piece in its row (two targets in one place).
    const real = ((p.endMs - p.startMs) / MINUTE) * scale.pxPerMinute;
    const next = pieces.find((q, j) => j > i && rowOf[j] === rowOf[i] && q.startMs >= p.endMs);
    const space = next ? xOf(scale, next.startMs) - left - 2 : Infinity;
    const width = Math.max(real, Math.min(MIN_WORK_PX, space));
    const room = roomName(p.work.roomId);
    const accession = accessionOf(p.work.roomId, p.work.toExamId);
    const showRoom = width >= ROOM_PX;
    // A block stacked in a clash has one line: the room takes its part of the width first.
    const shown = workAccession(accession, rowsOf[i]! > 1 && showRoom ? width - ROOM_PX : width);
    // The words in view come first and in order (WCAG 2.5.3: a voice command names what it sees);
    // a cut accession is followed by the whole one.
    const parts = [room, shown && shown !== accession ? `${shown} (${accession})` : accession, `turnover ${clockOf(p.work.start)}–${clockOf(p.work.end)}`];
    if (gap) parts.push(verdictWords(gap));
    const label = parts.join(', ') + (clashesWith[i]!.length ? `; ${clashesWith[i]!.join('; ')}` : '');
    return {
      toExamId: p.work.toExamId,
      roomId: p.work.roomId,
      room,
      accession: shown,
      showRoom,
      left,
      width,
      row: rowOf[i]!,
      rows: rowsOf[i]!,
      verdict: gap?.verdict ?? null,
      clash: clashesWith[i]!.length > 0,
      dimmed: onlyProblems && (gap?.verdict ?? 'fits') === 'fits',
      label,
    };
  });

  // Free time: on shift, outside breaks, work and walks.
  const taken = [
    ...person.breaks.map((b) => [Date.parse(b.start), Date.parse(b.end)] as const),
    ...pieces.map((p) => [p.startMs, p.endMs] as const),
    ...walksMs(pieces, walkMs),
  ].sort((a, b) => a[0] - b[0]);
  const free: SpanView[] = [];
  let cursor = shiftStart;
  for (const [from, to] of [...taken, [shiftEnd, shiftEnd] as const]) {
    const end = Math.min(from, shiftEnd);
    if (end - cursor >= FREE_WORTH_SAYING_MINUTES * MINUTE) {
      const minutes = minutesBetween(cursor, end);
      free.push(span(cursor, end, `free ${durationWords(minutes)}`, FREE_TEXT_PX, `free ${clock(cursor)}–${clock(end)}, ${durationWords(minutes)}`));
    }
    cursor = Math.max(cursor, to);
  }

  const hours = `${clockOf(person.start)}–${clockOf(person.end)}`;
  const busyMinutes = pieces.reduce((sum, p) => sum + minutesBetween(p.startMs, p.endMs), 0);
  const clashCount = clashes.length;
  const turnovers = `${pieces.length} ${pieces.length === 1 ? 'turnover' : 'turnovers'}`;
  const named = person.name !== null ? [ROSTER_ROLE_LABEL[person.role].toLowerCase()] : [];
  const breakWords = person.breaks.map((b) => `break ${clockOf(b.start)}–${clockOf(b.end)}`);
  const label = [person.label, ...named, hours, ...breakWords, turnovers, ...(clashCount ? [`${clashCount} ${clashCount === 1 ? 'clash' : 'clashes'}`] : [])].join(', ');
  return {
    person,
    label,
    hours,
    summary: pieces.length ? `${turnovers} · busy ${durationWords(busyMinutes)}` : 'no turnovers',
    rooms: person.roomIds.map(roomName).join(', '),
    offShift,
    breaks,
    walks,
    free,
    work,
    clashes,
    rows: Math.max(1, ...rowsOf),
  };
}

/** The walks as [from, to] instants (to the next piece in another room, as far as the walking time goes). */
function walksMs(pieces: readonly { work: { roomId: number }; startMs: number; endMs: number }[], walkMs: number): (readonly [number, number])[] {
  const out: (readonly [number, number])[] = [];
  for (let i = 0; i + 1 < pieces.length; i++) {
    const here = pieces[i]!;
    const next = pieces[i + 1]!;
    if (next.work.roomId !== here.work.roomId && next.startMs >= here.endMs) out.push([here.endMs, Math.min(here.endMs + walkMs, next.startMs)]);
  }
  return out;
}

/** A 12 px character of the block's label text, and its padding and edges, in pixels. */
const WORK_CHAR_PX = 7;
const WORK_INSET_PX = 12;

/**
 * The accession as a work block can show it: whole when it fits, else its end after an ellipsis
 * cut where a part begins, as on the room timeline; '' below four characters.
 */
export function workAccession(accession: string, width: number): string {
  const chars = Math.floor((width - WORK_INSET_PX) / WORK_CHAR_PX);
  if (accession.length <= chars) return accession;
  // The room timeline's cut (whole parts of the accession), for as many characters as fit here.
  return chars >= 4 ? blockAccession(accession, chars * 8 + 16) : '';
}

/** Rooms nobody on the roster covers, by name. */
export function uncoveredRooms(plan: DayPlan): PlanRoom[] {
  const ids = new Set(plan.people?.uncoveredRoomIds ?? []);
  return plan.rooms.filter((room) => ids.has(room.id));
}
