/**
 * Rooms now (front-desk board) and the technologist's turnover checklist: the public contract.
 * Times are ISO 8601 with the site's offset.
 */

/** A room's state on the board (our names). */
export const ROOM_STATES = ['in exam', 'turning over', 'drying', 'air hold', 'ready', 'closed'] as const;
export type RoomState = (typeof ROOM_STATES)[number];

export interface BoardSlot {
  examId: number;
  accession: string;
  procedure: string;
  start: string;
  end: string;
  precaution: string;
  /** Marked arrived by the front desk (waiting). */
  arrivedAt: string | null;
}

export interface BoardShiftTask {
  taskId: number;
  key: string;
  label: string;
  /** The occurrence's local start, ISO with offset. */
  due: string;
  durationMinutes: number;
  doneAt: string | null;
  doneBy: string | null;
  /** Not done and its time has passed. */
  overdue: boolean;
}

/** `GET /api/days/:date/board` → `{date, timezone, now, rooms: BoardRoom[]}`. */
export interface BoardRoom {
  roomId: number;
  name: string;
  modality: string;
  state: RoomState;
  /**
   * When the room is (or is planned to be) ready for the next patient; null when closed with
   * nothing next. During a turnover this is the plan, so the card can say it is overdue.
   */
  readyAt: string | null;
  /**
   * The best estimate now, rounded up to the minute: during a turnover from the steps still to do
   * (later than `readyAt` when the work runs behind the plan), else `readyAt`. The front desk
   * plans the next patient by this one.
   */
  expectedReadyAt: string | null;
  /** The exam in the room now (state `in exam`), or the one that just left (turnover). */
  current: BoardSlot | null;
  next: BoardSlot | null;
  /** expectedReadyAt − next.start in whole minutes when positive. */
  runningLateMinutes: number;
  /** The open turnover, if any (for a link to the checklist). */
  turnoverId: number | null;
  tasks: BoardShiftTask[];
}

/** A patient expected soon, for the front desk's arrivals list across rooms. */
export interface BoardArrival extends BoardSlot {
  roomId: number;
  roomName: string;
}

export interface Board {
  date: string;
  timezone: string;
  now: string;
  rooms: BoardRoom[];
  /**
   * Today only: exams not yet begun whose slot starts within the coming hour (or has already
   * passed without the exam beginning), every room, by start. Empty on other days.
   */
  arrivals: BoardArrival[];
}

/** One step of a live turnover checklist, in the engine's computed order. */
export interface ChecklistStep {
  key: string;
  label: string;
  handsOnMinutes: number;
  /** Label contact time + dry time after this step (0 for steps with no wet surface). */
  waitMinutes: number;
  /** Contact time required by the product's label (0 for steps that disinfect nothing). */
  contactMinutes: number;
  /** Keys of steps whose surface must be dry before this one. */
  needsDry: string[];
  /** Default product key for disinfecting steps, null otherwise. */
  productKey: string | null;
  /**
   * Applications of the product: more than 1 when one application dries before the label's
   * contact time (re-wet rule: ⌈contact ÷ stays-wet⌉; the hands-on time counts each).
   */
  applications?: number;
  planned: { start: string; end: string; dryAt: string; person: number };
  done: { at: string; by: string; productKey: string | null; earlyReason: string | null } | null;
  /** Until when the surface stays wet (tick time + wait), once done. */
  wetUntil: string | null;
}

/** `GET /api/rooms/:id/turnover?date=` → the room's current or next turnover. */
export interface Checklist {
  roomId: number;
  roomName: string;
  modality: string;
  date: string;
  now: string;
  /** null: nothing to turn over (no exam yet finished and no next exam). */
  turnoverId: number | null;
  leaving: BoardSlot | null;
  arriving: BoardSlot | null;
  /** The leaving exam's actual end ("exam finished"), null until recorded. */
  examEndedAt: string | null;
  cleanType: 'routine' | 'isolation' | 'terminal';
  precaution: string;
  staff: number;
  airHoldMinutes: number;
  /**
   * When the air hold ends, counted from the recorded end ("Exam finished") only: null while
   * the leaving patient is still in the room, so no countdown runs for a scan not yet done.
   */
  airHoldUntil: string | null;
  /** When the air hold would end if the leaving exam ends as planned (or as recorded); null without a hold. */
  airHoldPlannedUntil: string | null;
  /** Minutes the air hold (recorded or planned) runs past the arriving exam's start; 0 when it does not. */
  airHoldPastNextStartMinutes: number;
  steps: ChecklistStep[];
  /** Recomputed from what actually happened. */
  readyAt: string | null;
  completedAt: string | null;
  products: { key: string; name: string; contactMinutes: number }[];
  tasks: BoardShiftTask[];
  /** The protocol version the turnover follows (the one recorded at "exam finished", else the day's). */
  protocol?: { id: number; modality: string; version: number; effectiveFrom: string } | null;
}

/** One entry of the append-only cleaning log. */
export interface LogEntry {
  id: number;
  at: string;
  day: string;
  roomId: number;
  roomName: string;
  examAccession: string | null;
  cleanType: 'routine' | 'isolation' | 'terminal' | 'shift task';
  kind: 'exam finished' | 'step' | 'turnover complete' | 'shift task' | 'correction';
  stepKey: string | null;
  stepLabel: string | null;
  productName: string | null;
  contactRequiredMinutes: number | null;
  /** Filled on the turnover's completion entry's steps; null while the surface is in use. */
  contactAchievedMinutes: number | null;
  earlyReason: string | null;
  note: string | null;
  correctsId: number | null;
  username: string;
  displayName: string;
  /** The protocol version the entry's turnover was planned with (null: none recorded, e.g. a shift task). */
  protocol?: { modality: string; version: number; effectiveFrom: string } | null;
}
