import type { Mobility, Precaution, Product, Protocol, TurnoverRules } from './model';

/** A room as the day plan needs it. */
export interface DayPlanRoom {
  id: number;
  name: string;
  modality: string;
  staff: number;
  airChangesPerHour: number;
  /** Local `HH:MM`; default `07:00`. */
  opensAt?: string;
  /** Local `HH:MM`; default `19:00`. A closing at or before the opening is on the next day. */
  closesAt?: string;
  /** Closed all day (its weekday's hours say so): no open hours, so every exam booked is outside them. */
  closed?: boolean;
}

/** An exam slot as stored. */
export interface DayPlanExam {
  id: number;
  accession: string;
  roomId: number;
  /** ISO 8601; with offset (as stored), or local to the site when it has none. */
  start: string;
  durationMinutes: number;
  procedure: string;
  coil?: string | null;
  precaution: Precaution;
  mobility: Mobility;
  contrast: boolean;
  notes?: string | null;
  version: number;
  /** Pinned by a user: "make the day fit" never moves it. */
  pinned?: boolean;
}

export interface DayPlanInput {
  /** `YYYY-MM-DD`, local to the site. */
  date: string;
  /** IANA zone of the site. */
  timezone: string;
  /** Default 3. */
  snugMarginMinutes?: number;
  /** The site's products (disinfectants). */
  products: readonly Product[];
  /**
   * The site's protocols in force on `date`, by DICOM modality code, `*` as fallback. A room
   * whose modality has neither gets no numbers (its plan says so).
   */
  protocols: Readonly<Record<string, Protocol>>;
  /** Rules for protocols that carry none of their own (a site's protocols carry theirs). */
  rules?: TurnoverRules;
  rooms: readonly DayPlanRoom[];
  exams: readonly DayPlanExam[];
  /** People on the turnover before the exam with this id (a helper added), instead of the room's staff. */
  staffOverrides?: Readonly<Record<number, number>>;
  /**
   * The day's roster: who is on shift and which rooms each covers. Absent: every turnover has its
   * room's own staff, as ever. Present: the turnovers of the rooms it covers are staffed from its
   * people (shared/roster), each wanting its room's staff (or override) and waiting or running
   * with fewer when they are busy elsewhere.
   */
  roster?: DayPlanRoster;
}

/** A person on shift as the engine needs them (`RosterPerson` of shared/api/roster.ts has this shape). */
export interface DayPlanPerson {
  id: string;
  name: string | null;
  label: string;
  role: 'technologist' | 'aide';
  /** Local `HH:MM` on the plan's date; the end after the start. */
  start: string;
  end: string;
  breaks: readonly { start: string; end: string }[];
  roomIds: readonly number[];
}

export interface DayPlanRoster {
  /** Saved for the date, or the weekday's default. */
  source: 'day' | 'weekly';
  people: readonly DayPlanPerson[];
  /** Minutes to walk from one room to another. */
  walkingMinutes: number;
}

export const DEFAULT_OPENS_AT = '07:00';
export const DEFAULT_CLOSES_AT = '19:00';
