import type { Clock } from '../clock';
import type { DayEvents } from '../services/day-events';
import type { UserRecord } from '../services/users';

/** Tells every open screen of the day that the board and/or the cleaning log changed. */
export function announcer(deps: { clock: Clock; events: DayEvents }) {
  return (date: string, kinds: ('board' | 'log')[], reason: string, user: UserRecord) => {
    const at = deps.clock.now().toISOString();
    for (const kind of kinds) deps.events.publish({ date, kind, reason, by: user.displayName || user.username, at });
  };
}
