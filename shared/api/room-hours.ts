import { z } from 'zod';

/** A local wall-clock time, `HH:MM` (24-hour). */
export const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'use HH:MM (24-hour)');

/** ISO 8601 weekdays, 1 Monday … 7 Sunday (luxon's `weekday`). */
export const WEEKDAYS = [
  { weekday: 1, name: 'Monday', short: 'Mon' },
  { weekday: 2, name: 'Tuesday', short: 'Tue' },
  { weekday: 3, name: 'Wednesday', short: 'Wed' },
  { weekday: 4, name: 'Thursday', short: 'Thu' },
  { weekday: 5, name: 'Friday', short: 'Fri' },
  { weekday: 6, name: 'Saturday', short: 'Sat' },
  { weekday: 7, name: 'Sunday', short: 'Sun' },
] as const;

/**
 * One weekday's hours. A closing before the opening is after midnight (the engine reads it so);
 * the same time twice would be a day of no hours or of 24, so it is refused: mark the day closed.
 */
export const roomDaySchema = z
  .object({
    weekday: z.number().int().min(1, 'a weekday is 1 (Monday) to 7 (Sunday)').max(7, 'a weekday is 1 (Monday) to 7 (Sunday)'),
    closed: z.boolean().default(false),
    opensAt: hhmm,
    closesAt: hhmm,
  })
  .refine((day) => day.closed || day.opensAt !== day.closesAt, {
    path: ['closesAt'],
    message: 'must differ from the opening time (a closing before it is after midnight; mark a day without hours closed)',
  });
export type RoomDay = z.output<typeof roomDaySchema>;

/** The whole week, Monday to Sunday, each weekday once. */
export const roomWeekSchema = z
  .array(roomDaySchema)
  .length(7, 'give all seven days, Monday to Sunday')
  .superRefine((days, ctx) => {
    days.forEach((day, i) => {
      if (day.weekday !== i + 1) ctx.addIssue({ code: 'custom', path: [i, 'weekday'], message: `day ${i + 1} of the week must be ${WEEKDAYS[i]!.name}` });
    });
  });

/** A room's hours on one date: its weekday's row, else its usual hours. */
export interface RoomHoursOnDay {
  opensAt: string;
  closesAt: string;
  closed: boolean;
}
