import { computed, signal, type Provider } from '@angular/core';

import { Clock, startOfMinute } from '../clock';

/** A Clock the test moves by hand, so countdowns are checked without waiting or timers. */
export function fakeClock(startIso: string): { set: (iso: string) => void; provider: Provider } {
  const now = signal(Date.parse(startIso));
  const clock: Clock = { now: now.asReadonly(), minute: computed(() => startOfMinute(now())) };
  return {
    set: (iso: string) => now.set(Date.parse(iso)),
    provider: { provide: Clock, useValue: clock },
  };
}
