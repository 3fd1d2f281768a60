/**
 * The day plan the engine computes (`computeDayPlan`) and the API answers. They live with the
 * engine, which makes them; `shared/api/plan.ts` re-exports them for the API's callers, so the
 * imports run one way (api → turnover), never back. Every time is ISO 8601 with the site's
 * offset, e.g. `2027-03-15T07:00:00-05:00`.
 */
import type { Mobility, Precaution, Verdict } from './model';

/** A turnover step placed in time. */
export interface PlanStep {
  key: string;
  label: string;
  start: string;
  end: string;
  /** When the surface may be used again (equals `end` for a step with no wait). */
  dryAt: string;
  /** 0-based person on the turnover. */
  person: number;
}

/** The turnover between two exams of a room (or the room's opening and its first exam). */
export interface PlanGap {
  /** null for the opening gap of the day. */
  fromExamId: number | null;
  toExamId: number;
  /** Real elapsed whole minutes from A's end (or opening) to B's start; negative on overlap. */
  availableMinutes: number;
  requiredMinutes: number;
  verdict: Verdict;
  shortByMinutes: number;
  /** A's end (or opening) + required. */
  readyAt: string;
  /** 0 unless A was under airborne precautions. */
  airHoldMinutes: number;
  staff: number;
  steps: PlanStep[];
  /**
   * With a roster only (absent without one): who works this turnover, by roster person id; `person`
   * in `steps` indexes this list. Empty when nobody on the roster can do it (`people.kind` 'nobody').
   */
  crew?: string[];
  /** With a roster only: why the crew started late or is smaller than the room's staff; null when neither. */
  people?: GapPeopleReason | null;
}

/**
 * Why a turnover waited for people or ran with fewer than its room's staff. "Short by 6 min: the
 * aide is in MR 2 until 10:12" is `{ kind: 'busy', personId, roomId: <MR 2>, until: '…10:12…' }`.
 */
export interface GapPeopleReason {
  /** busy in another room; on a break; shift not started (or over); nobody on the roster can do it. */
  kind: 'busy' | 'break' | 'off-shift' | 'nobody';
  personId: string | null;
  /** Where the person is busy (kind 'busy'). */
  roomId: number | null;
  /** When the person is free to start here (walking included); null for 'nobody'. */
  until: string | null;
  /** People the turnover wanted (the room's staff, or its override) and people it got. */
  wanted: number;
  got: number;
  /** Minutes the crew started after the room was free (0: on time). */
  waitedMinutes: number;
}

/** A piece of a person's day: hands-on work on one turnover. */
export interface PlanPersonWork {
  roomId: number;
  /** The turnover's arriving exam (the gap's `toExamId`). */
  toExamId: number;
  start: string;
  end: string;
}

/** A person on the roster with the turnover work the plan gave them (the people view's lane). */
export interface PlanPerson {
  id: string;
  label: string;
  name: string | null;
  role: 'technologist' | 'aide';
  /** Shift start and end as instants with the site's offset. */
  start: string;
  end: string;
  breaks: { start: string; end: string }[];
  roomIds: number[];
  work: PlanPersonWork[];
}

/** The roster side of a plan: present only when the day has a roster (source 'day' or 'weekly'). */
export interface PlanPeople {
  source: 'day' | 'weekly';
  walkingMinutes: number;
  people: PlanPerson[];
  /** Rooms nobody on the roster covers: planned as without a roster, with the room's own staff. */
  uncoveredRoomIds: number[];
  /**
   * True when every cluster of competing turnovers was searched to the end; false when a search
   * ran out of its node budget and the documented heuristic placed the rest (see shared/roster).
   */
  provenOptimal: boolean;
}

export interface PlanExam {
  id: number;
  accession: string;
  roomId: number;
  start: string;
  end: string;
  durationMinutes: number;
  procedure: string;
  coil: string | null;
  precaution: Precaution;
  mobility: Mobility;
  contrast: boolean;
  notes: string | null;
  version: number;
  /** Starts before the room opens or ends after it closes (flagged, never refused). */
  outsideHours: boolean;
  /** Pinned by a user: "make the day fit" never moves it (absent when not pinned). */
  pinned?: boolean;
}

/** The protocol a room's turnovers were planned with (version and id null for an unstored one). */
export interface PlanProtocol {
  id: number | null;
  modality: string;
  version: number | null;
  effectiveFrom: string | null;
}

export interface PlanRoom {
  id: number;
  name: string;
  modality: string;
  staff: number;
  /** null: the modality has no protocol (nor a `*` fallback): no gaps, no verdicts, see `message`. */
  protocol: PlanProtocol | null;
  /** Why the room has no numbers (e.g. "No protocol for CT: set one up in Setup"); null otherwise. */
  message: string | null;
  /** Closed all day on this date (its weekday's hours): `opensAt` equals `closesAt`. */
  closed: boolean;
  /** The room's opening and closing on this date. */
  opensAt: string;
  closesAt: string;
  exams: PlanExam[];
  /** Empty for a room without a protocol. */
  gaps: PlanGap[];
}

export interface PlanSummary {
  fits: number;
  snug: number;
  short: number;
  overlap: number;
  /** Sum of every gap's shortBy. */
  minutesShort: number;
}

export interface DayPlan {
  /** `YYYY-MM-DD`, the site's local date. */
  date: string;
  /** IANA zone of the site. */
  timezone: string;
  rooms: PlanRoom[];
  summary: PlanSummary;
  /** The day's people and their work; absent when the day has no roster. */
  people?: PlanPeople;
}
