/**
 * The shift roster: who is on shift on a day, their hours and breaks, and the rooms each covers.
 * A row is one named person, or a count of anonymous people ("3 aides, 07:00–15:00, MR 1 + MR 2")
 * that `expandRoster` (shared/roster) turns into that many people ("Aide 1", "Aide 2", …).
 * Times are local `HH:MM` on the roster's date; a shift ends after it starts (no shift crosses
 * midnight). Rooms are named by id, so a renamed room keeps its people and a retired one simply
 * drops out of the plan.
 */
import { z } from 'zod';
import { hhmm } from './room-hours';

export const ROSTER_ROLES = ['technologist', 'aide'] as const;
export type RosterRole = (typeof ROSTER_ROLES)[number];

/** How the day plan names a role ("the aide is in MR 2 until 10:12"). */
export const ROSTER_ROLE_LABEL: Readonly<Record<RosterRole, string>> = { technologist: 'Technologist', aide: 'Aide' };

/** Rows in one roster, people a counted row stands for, breaks in one shift, characters in a name. */
export const ROSTER_LIMITS = { rows: 60, count: 20, people: 200, breaks: 4, nameChars: 60 } as const;

/**
 * Minutes to walk from one room to another, per site. Default 3: common practice, no source
 * (rooms of one department are a corridor apart); each site sets its own.
 */
export const WALKING_MINUTES = { min: 0, max: 30, default: 3 } as const;

/** Where a day's roster came from: saved for that date, the weekly default for its weekday, or none at all. */
export const ROSTER_SOURCES = ['day', 'weekly', 'none'] as const;
export type RosterSource = (typeof ROSTER_SOURCES)[number];

export interface RosterBreak {
  /** Local `HH:MM`. */
  start: string;
  end: string;
}

/** A row as entered: one named person (count 1), or `count` anonymous people of one role. */
export interface RosterRow {
  /** null: anonymous people, labelled by role and number ("Aide 2"). */
  name: string | null;
  role: RosterRole;
  /** 1 for a named person. */
  count: number;
  /** Shift start and end, local `HH:MM`; the end is after the start. */
  start: string;
  end: string;
  breaks: RosterBreak[];
  /** Rooms this person (or each of these people) covers. */
  roomIds: number[];
}

/** One person on shift: a named row, or one of a counted row's people. */
export interface RosterPerson {
  /** Stable within the day: `r<row>` for a named row, `r<row>-<n>` for the n-th of a count (1-based). */
  id: string;
  /** null for a counted person. */
  name: string | null;
  /** What screens show: the name, or role and number ("Aide 2"). */
  label: string;
  role: RosterRole;
  start: string;
  end: string;
  breaks: RosterBreak[];
  roomIds: number[];
}

/** `GET /api/days/:date/roster`. */
export interface DayRoster {
  date: string;
  source: RosterSource;
  rows: RosterRow[];
  /** The rows expanded, in row order. */
  people: RosterPerson[];
  /** The site's walking time between rooms, minutes. */
  walkingMinutes: number;
}

/** `GET /api/roster/weekly`: the default roster of each ISO weekday (1 Monday … 7 Sunday); a weekday without one has no rows. */
export interface WeeklyRoster {
  weekdays: { weekday: number; rows: RosterRow[] }[];
}

const minutesOf = (time: string): number => Number(time.slice(0, 2)) * 60 + Number(time.slice(3, 5));

export const rosterBreakSchema = z.object({ start: hhmm, end: hhmm });

/**
 * A row with every check that needs only the row: a name or a count (not a named count), the end
 * after the start, each break inside the shift and after its own start, no two breaks overlapping.
 * Unknown rooms and duplicate names need the whole roster and the site: `rosterProblems`.
 */
export const rosterRowSchema = z
  .object({
    name: z
      .string()
      .trim()
      .max(ROSTER_LIMITS.nameChars, `use at most ${ROSTER_LIMITS.nameChars} characters`)
      .nullable()
      .transform((name) => (name === '' ? null : name)),
    role: z.enum(ROSTER_ROLES, { message: `a role is ${ROSTER_ROLES.join(' or ')}` }),
    count: z
      .number()
      .int('a whole number of people')
      .min(1, 'at least 1 person')
      .max(ROSTER_LIMITS.count, `at most ${ROSTER_LIMITS.count} people in one row`)
      .default(1),
    start: hhmm,
    end: hhmm,
    breaks: z.array(rosterBreakSchema).max(ROSTER_LIMITS.breaks, `at most ${ROSTER_LIMITS.breaks} breaks`).default([]),
    roomIds: z.array(z.number().int().positive()).min(1, 'choose at least one room').max(100),
  })
  .superRefine((row, ctx) => {
    if (row.name !== null && row.count !== 1) {
      ctx.addIssue({ code: 'custom', path: ['count'], message: 'a named row is one person (leave the name empty for a count)' });
    }
    const start = minutesOf(row.start);
    const end = minutesOf(row.end);
    if (end <= start) ctx.addIssue({ code: 'custom', path: ['end'], message: 'the shift must end after it starts' });
    const sorted = row.breaks.map((b, i) => ({ i, start: minutesOf(b.start), end: minutesOf(b.end) }));
    for (const b of sorted) {
      if (b.end <= b.start) ctx.addIssue({ code: 'custom', path: ['breaks', b.i, 'end'], message: 'a break must end after it starts' });
      else if (end > start && (b.start < start || b.end > end)) {
        ctx.addIssue({ code: 'custom', path: ['breaks', b.i, 'start'], message: `the break is outside the shift (${row.start}–${row.end})` });
      }
    }
    sorted.sort((a, b) => a.start - b.start || a.i - b.i);
    for (let k = 1; k < sorted.length; k++) {
      if (sorted[k]!.start < sorted[k - 1]!.end) {
        ctx.addIssue({ code: 'custom', path: ['breaks', sorted[k]!.i, 'start'], message: 'the break overlaps another break' });
      }
    }
  });
export type RosterRowInput = z.input<typeof rosterRowSchema>;

/** Names repeat within a roster: a problem per repeat (case-blind), on the later row's name. */
function duplicateNames(rows: readonly { name: string | null }[], ctx: z.RefinementCtx, path: (i: number) => (string | number)[]): void {
  const seen = new Map<string, number>();
  rows.forEach((row, i) => {
    if (row.name === null) return;
    const key = row.name.toLowerCase();
    const first = seen.get(key);
    if (first === undefined) seen.set(key, i);
    else ctx.addIssue({ code: 'custom', path: path(i), message: `"${row.name}" is already on the roster (row ${first + 1})` });
  });
}

const rowsSchema = z
  .array(rosterRowSchema)
  .max(ROSTER_LIMITS.rows, `at most ${ROSTER_LIMITS.rows} rows`)
  .superRefine((rows, ctx) => {
    duplicateNames(rows, ctx, (i) => [i, 'name']);
    const people = rows.reduce((sum, row) => sum + row.count, 0);
    if (people > ROSTER_LIMITS.people) ctx.addIssue({ code: 'custom', message: `at most ${ROSTER_LIMITS.people} people on one day` });
  });

/** `PUT /api/days/:date/roster`: the day's whole roster. An empty list saves "nobody" for the day; `DELETE` returns it to the weekly default. */
export const dayRosterInputSchema = z.object({ rows: rowsSchema });
export type DayRosterInput = z.input<typeof dayRosterInputSchema>;

/** `PUT /api/roster/weekly/:weekday`: one weekday's default roster. */
export const weeklyRosterInputSchema = z.object({ rows: rowsSchema });
export type WeeklyRosterInput = z.input<typeof weeklyRosterInputSchema>;
