/**
 * Private calendar feeds (iCalendar, RFC 5545): one secret address per user, shown once when it
 * is made or rotated (the server keeps only its hash), revocable from the profile page.
 */

/** Days before and after today (site time) that a feed carries exams and turnovers for. */
export const CALENDAR_FEED_WINDOW = { daysBack: 7, daysAhead: 28 } as const;

/** `GET /api/profile/calendar`: whether one's feeds are on, never the address itself. */
export interface CalendarFeedStatus {
  active: boolean;
  createdAt: string | null;
  lastUsedAt: string | null;
}

/** One feed address. */
export interface CalendarFeedLink {
  label: string;
  url: string;
}

/** `POST /api/profile/calendar/rotate`: the new addresses, shown this once; every older one answers 404 from now on. */
export interface CalendarFeedAddresses extends CalendarFeedStatus {
  /** One's own feed first (shift tasks and followed rooms), then one per active room. */
  feeds: CalendarFeedLink[];
}
