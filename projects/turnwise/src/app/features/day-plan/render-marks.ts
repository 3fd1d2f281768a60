/**
 * Performance marks a benchmark reads with `performance.getEntriesByType('measure')`:
 * `tw-plan-render` (a plan's arrival to its lanes on screen) and `tw-drag-frame` (one drag
 * preview frame). Silent where the User Timing API is missing (jsdom) or a mark was dropped.
 */
export function markStart(name: 'tw-plan-render' | 'tw-drag-frame'): void {
  if (typeof performance?.mark === 'function') performance.mark(`${name}-start`);
}

export function measureSinceStart(name: 'tw-plan-render' | 'tw-drag-frame'): void {
  if (typeof performance?.measure !== 'function') return;
  try {
    performance.measure(name, `${name}-start`);
  } catch {
    // The start mark was cleared by the page (e.g. a benchmark resetting between runs).
  }
}
