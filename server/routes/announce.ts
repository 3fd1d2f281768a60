import type { DayEvent } from '../../shared/api/changes';
import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';

/**
 * The one way a route tells open screens that a day changed: one event per kind ('plan',
 * 'board', 'log'), stamped with the server's clock and who did it. `date` '*' means every day
 * (a room's setup shapes every plan).
 *
 * @example
 * publishDayEvent(deps, day, ['board', 'log'], 'step done', user);
 */
export function publishDayEvent(
  deps: { clock: Clock; events: DayEvents },
  date: string,
  kinds: DayEvent['kind'] | DayEvent['kind'][],
  reason: string,
  user: { displayName: string; username: string },
): void {
  const at = deps.clock.now().toISOString();
  const by = user.displayName || user.username;
  for (const kind of Array.isArray(kinds) ? kinds : [kinds]) deps.events.publish({ date, kind, reason, by, at });
}
