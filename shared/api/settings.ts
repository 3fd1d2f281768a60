import { z } from 'zod';
import { SNUG_MARGIN_MINUTES } from './limits';
import { WALKING_MINUTES } from './roster';

export interface SiteSettings {
  siteName: string;
  timezone: string;
  snugMarginMinutes: number;
  /** The From address of notices Turnwise e-mails (empty: none set up yet). */
  noticesSender: string;
  /** Site time (HH:MM) the day-before notice goes to charge technologists: tomorrow's problem gaps and isolation cases. */
  dayBeforeNoticeAt: string;
  /** Minutes to walk between two rooms, for the roster's people (default 3: common practice, no source). */
  walkingMinutes: number;
}

export const DEFAULT_SETTINGS: SiteSettings = {
  siteName: 'Imaging department',
  timezone: 'UTC',
  snugMarginMinutes: 3,
  noticesSender: '',
  dayBeforeNoticeAt: '16:00',
  walkingMinutes: WALKING_MINUTES.default,
};

/** `HH:MM`, 00:00–23:59. */
export const CLOCK_TIME = /^([01]\d|2[0-3]):[0-5]\d$/;

/** The zone check is passed in so this stays free of luxon for callers that do not need it. */
export function settingsInputSchema(isValidZone: (zone: string) => boolean) {
  return z.object({
    siteName: z.string().trim().min(1).max(80).optional(),
    timezone: z.string().refine(isValidZone, 'not an IANA time zone (e.g. America/Chicago)'),
    snugMarginMinutes: z.number().int().min(SNUG_MARGIN_MINUTES.min).max(SNUG_MARGIN_MINUTES.max),
    noticesSender: z.union([z.literal(''), z.string().trim().max(254, 'use at most 254 characters').pipe(z.email('not an e-mail address'))]).optional(),
    dayBeforeNoticeAt: z.string().regex(CLOCK_TIME, 'use HH:MM, 00:00 to 23:59').optional(),
    walkingMinutes: z
      .number()
      .int('whole minutes')
      .min(WALKING_MINUTES.min, `at least ${WALKING_MINUTES.min} minutes`)
      .max(WALKING_MINUTES.max, `at most ${WALKING_MINUTES.max} minutes`)
      .optional(),
  });
}
