import { z } from 'zod';

export interface SiteSettings {
  siteName: string;
  timezone: string;
  snugMarginMinutes: number;
}

export const DEFAULT_SETTINGS: SiteSettings = {
  siteName: 'Imaging department',
  timezone: 'UTC',
  snugMarginMinutes: 3,
};

/** The zone check is passed in so this stays free of luxon for callers that do not need it. */
export function settingsInputSchema(isValidZone: (zone: string) => boolean) {
  return z.object({
    siteName: z.string().trim().min(1).max(80).optional(),
    timezone: z.string().refine(isValidZone, 'not an IANA time zone (e.g. America/Chicago)'),
    snugMarginMinutes: z.number().int().min(0).max(60),
  });
}
