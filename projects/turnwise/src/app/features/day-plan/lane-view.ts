import type { PlanExam, PlanRoom } from '@shared/api/plan';

import { ExamFlag, examFlags } from './exam-flags';
import { layOutBadges } from './badge-layout';
import { GapView, gapView } from './gap-view';
import { TimelineScale, xOf } from './timeline-scale';

export type { GapView } from './gap-view';

/** One exam block, everything it shows worked out once per lane rather than per binding. */
export interface BlockView {
  exam: PlanExam;
  left: number;
  width: number;
  /** The accession, or its end ("…1201-026") when the block is too narrow for all of it. */
  accession: string;
  /** "08:00–08:30", only "08:00" when the block is too narrow for both, '' when too narrow for one. */
  time: string;
  /** The whole description, for the accessible name and the tooltip. */
  label: string;
  flags: ExamFlag[];
  /** Icons only, no words beside them. */
  compact: boolean;
  dimmed: boolean;
}

/** An exam and the gap before it: that is the tab order along a lane. */
export interface LaneSlot {
  block: BlockView;
  gap: GapView | null;
}

/** Below this width a block shows icons only; the words stay in its label and tooltip. */
const COMPACT_PX = 150;
/** Room for "08:00–08:30" and for "08:00" in the block's small tabular figures, padding and border included. */
const FULL_TIME_PX = 92;
const START_TIME_PX = 48;
/** A bold character of the block's 12 px text, and the block's padding and borders, in pixels. */
const ACCESSION_CHAR_PX = 8;
const BLOCK_INSET_PX = 16;

/**
 * The wall-clock `HH:mm` of an API time. The API writes every time with the site's offset, so
 * the site's clock is the text itself: read it, rather than parse a thousand times per frame.
 */
export function clockOf(iso: string): string {
  return /^\d{4}-\d\d-\d\dT(\d\d:\d\d)/.exec(iso)?.[1] ?? '';
}

/** What the block's time line fits at `width` pixels. */
export function blockTime(start: string, end: string, width: number): string {
  if (width >= FULL_TIME_PX) return `${clockOf(start)}–${clockOf(end)}`;
  return width >= START_TIME_PX ? clockOf(start) : '';
}

/**
 * The accession as a narrow block can show it: whole when it fits, else its end after an
 * ellipsis, since the end is what tells one accession of the day from the next. The end is cut
 * where a new part begins ("…-026", not "…201-026") when one fits, so what is shown is made of
 * whole parts of the accession that the block's label names (and a voice command can say).
 */
export function blockAccession(accession: string, width: number): string {
  const chars = Math.floor((width - BLOCK_INSET_PX) / ACCESSION_CHAR_PX);
  if (accession.length <= chars || chars < 4) return accession;
  const tail = accession.slice(accession.length - (chars - 1));
  const boundary = tail.search(/(?<=[^A-Za-z0-9])|(?<=[A-Za-z])(?=[0-9])|(?<=[0-9])(?=[A-Za-z])/);
  return `…${boundary > 0 ? tail.slice(boundary) : tail}`;
}

/**
 * Every block and gap of a lane placed on the scale, with their words: computed once per lane
 * when its room, the scale or the filter change. With `onlyProblems`, fitting gaps and the exams
 * that touch no problem gap are dimmed; exams in `movedByBooking` carry the booking feed's mark.
 */
export function laneView(room: PlanRoom, scale: TimelineScale, onlyProblems: boolean, movedByBooking: ReadonlySet<number> = NONE): LaneSlot[] {
  const gapBefore = new Map(room.gaps.map((gap) => [gap.toExamId, gap]));
  const byId = new Map(room.exams.map((exam) => [exam.id, exam]));
  const problemNeighbours = new Set<number>();
  for (const gap of room.gaps) {
    if (gap.verdict === 'fits') continue;
    problemNeighbours.add(gap.toExamId);
    if (gap.fromExamId !== null) problemNeighbours.add(gap.fromExamId);
  }
  const slots = room.exams.map((exam) => {
    const gap = gapBefore.get(exam.id);
    const from = gap ? (gap.fromExamId === null ? room.opensAt : byId.get(gap.fromExamId)?.end) : undefined;
    return {
      block: blockView(room.name, exam, scale, onlyProblems && !problemNeighbours.has(exam.id), movedByBooking.has(exam.id)),
      gap: gap && from ? gapView(gap, exam.accession, from, scale, onlyProblems && gap.verdict === 'fits') : null,
    };
  });
  // Badges share one row per lane: laid out together so they never cover each other.
  const withGaps = slots.filter((slot): slot is LaneSlot & { gap: GapView } => slot.gap !== null);
  const laidOut = layOutBadges(withGaps.map((slot) => slot.gap));
  withGaps.forEach((slot, i) => (slot.gap = laidOut[i]!));
  return slots;
}

const NONE: ReadonlySet<number> = new Set();

function blockView(roomName: string, exam: PlanExam, scale: TimelineScale, dimmed: boolean, movedByBooking: boolean): BlockView {
  const width = Math.max(4, exam.durationMinutes * scale.pxPerMinute);
  const flags = examFlags(exam, movedByBooking);
  // "MR 2, ACC-123, MR brain with contrast, 09:30–10:15, contact precautions": after the room, the
  // words the block shows, whole and in its markup's order, so that any cut of them a narrow block
  // shows is a run of the label's words, and a voice command naming what is seen finds the block.
  const parts = [roomName, exam.accession, exam.procedure, `${clockOf(exam.start)}–${clockOf(exam.end)}`, ...flags.map((flag) => flag.text)];
  if (exam.outsideHours) parts.push('outside opening hours');
  return {
    exam,
    left: xOf(scale, exam.start),
    width,
    accession: blockAccession(exam.accession, width),
    time: blockTime(exam.start, exam.end, width),
    label: parts.join(', '),
    flags,
    compact: width < COMPACT_PX,
    dimmed,
  };
}
