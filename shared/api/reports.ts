/**
 * `GET /api/reports?from=&to=&room=`: a date range's numbers, computed on the server in one place
 * (server/services/reports.ts). Every minute is a whole number unless it says otherwise.
 */
import { DateTime } from 'luxon';
import { z } from 'zod';
import { REPORT_MAX_DAYS, type ChangeReason } from './limits';

const dayText = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'use YYYY-MM-DD', abort: true }).refine((v) => DateTime.fromISO(v).isValid, 'not a calendar day');

/** The report's filters; every problem is listed (a reversed or too long range too). */
export const reportQuerySchema = z
  .object({
    from: dayText,
    to: dayText,
    room: z.coerce.number().int().positive('a room id').optional(),
  })
  .superRefine((q, ctx) => {
    const from = DateTime.fromISO(q.from);
    const to = DateTime.fromISO(q.to);
    if (!from.isValid || !to.isValid) return;
    const days = daysInRange(q.from, q.to);
    if (days < 1) ctx.addIssue({ code: 'custom', path: ['to'], message: 'the range ends before it starts' });
    else if (days > REPORT_MAX_DAYS) ctx.addIssue({ code: 'custom', path: ['to'], message: `at most ${REPORT_MAX_DAYS} days in one report (this range has ${days})` });
  });

export type ReportQuery = z.infer<typeof reportQuerySchema>;

/** Days from `from` to `to`, both included (0 or less when reversed). */
export function daysInRange(from: string, to: string): number {
  return Math.round(DateTime.fromISO(to, { zone: 'UTC' }).diff(DateTime.fromISO(from, { zone: 'UTC' }), 'days').days) + 1;
}

/** Recorded turnovers against their plan, for one room or one precaution. */
export interface TurnoverMinutes {
  /** The room's name or the precaution. */
  label: string;
  roomId: number | null;
  /** Completed turnovers whose gap is on the plan (the day's last exam has none). */
  turnovers: number;
  /** Sum of the plan's required minutes for those gaps. */
  plannedMinutes: number;
  /** Sum of exam finished → turnover complete, from the cleaning log, to 0.1 minute. */
  actualMinutes: number;
}

export interface VerdictCounts {
  fits: number;
  snug: number;
  short: number;
  overlap: number;
  /** Sum of every gap's short-by. */
  minutesShort: number;
}

export interface ReportGaps {
  /** The plans as they stand now, every day of the range. */
  now: VerdictCounts;
  /** Days whose last import recorded its verdicts (imports from before that was recorded have none). */
  importedDays: number;
  /** The plans as each of those days was last imported. */
  asImported: VerdictCounts;
  /** The plans now, on those same days only: the like-for-like comparison with `asImported`. */
  nowOnImportedDays: VerdictCounts;
}

export interface ReportMoves {
  reason: ChangeReason;
  /** Changes (one per user action) that moved at least one exam. */
  changes: number;
  /** Exams moved by them. */
  exams: number;
}

export interface ReportEarlyCloses {
  /** Turnovers completed (a "turnover complete" log entry). */
  closed: number;
  /** Of those, completed with an override reason (during the air hold or while a surface was wet). */
  early: number;
  /** The reasons given, most frequent first (same words, ignoring case and spaces, count once). */
  reasons: { reason: string; count: number }[];
}

export interface ContactTally {
  label: string;
  /** Disinfection steps whose turnover completed (so their contact time is known). */
  steps: number;
  /** Achieved at least the product's required contact time. */
  met: number;
  below: number;
  requiredMinutes: number;
  achievedMinutes: number;
}

export interface ReportContact {
  total: ContactTally;
  byProduct: ContactTally[];
}

export interface ReportAirHolds {
  /** Completed turnovers after an airborne-precaution exam. */
  count: number;
  /** Their air holds, from each room's air changes (CDC 2003, Appendix B). */
  minutes: number;
  /** Of those, made ready before the hold was over (with an override reason). */
  endedEarly: number;
}

export interface ReportShiftTasks {
  /** Occurrences due in the range. */
  due: number;
  /** Ticked off before the end of their slot (due + duration). */
  onTime: number;
  late: number;
  /** Never ticked off and their slot is over. */
  missed: number;
  /** Not ticked off yet, slot not over. */
  open: number;
}

export interface RoomUse {
  roomId: number;
  label: string;
  /** Days of the range with a day list at the site. */
  days: number;
  examMinutes: number;
  openMinutes: number;
  /** examMinutes ÷ openMinutes, 0–1 (to 0.001); null with no open minutes. */
  use: number | null;
}

export interface Report {
  from: string;
  to: string;
  roomId: number | null;
  timezone: string;
  days: number;
  /** Days with at least one exam at the site. */
  listDays: number;
  turnoverMinutes: { byRoom: TurnoverMinutes[]; byPrecaution: TurnoverMinutes[] };
  gaps: ReportGaps;
  moves: ReportMoves[];
  earlyCloses: ReportEarlyCloses;
  contact: ReportContact;
  airHolds: ReportAirHolds;
  shiftTasks: ReportShiftTasks;
  roomUse: RoomUse[];
}
