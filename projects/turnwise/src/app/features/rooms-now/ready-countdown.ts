const MINUTE = 60_000;

/**
 * Time to ready-at in words, never a second clock time beside it: "in 17 min" while ahead
 * (minutes rounded up, so "in 1 min" until it is due), "due now" at it, "overdue by 4 min" once
 * past (rounded up: a minute late is late).
 *
 * @example
 * readyCountdown('2027-03-15T18:16:00-05:00', Date.parse('2027-03-15T17:59:01-05:00')); // 'in 17 min'
 * readyCountdown('2027-03-15T18:16:00-05:00', Date.parse('2027-03-15T18:19:30-05:00')); // 'overdue by 4 min'
 */
export function readyCountdown(readyAt: string, nowMs: number): { text: string; overdue: boolean } {
  const leftMs = Date.parse(readyAt) - nowMs;
  if (leftMs > 0) return { text: `in ${Math.ceil(leftMs / MINUTE)} min`, overdue: false };
  const late = Math.ceil(-leftMs / MINUTE);
  return late === 0 ? { text: 'due now', overdue: false } : { text: `overdue by ${late} min`, overdue: true };
}
