import { HttpClient } from '@angular/common/http';
import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { DateTime } from 'luxon';
import { firstValueFrom } from 'rxjs';

import type { SiteSettings } from '@shared/api/settings';

/**
 * The site's settings (`GET /api/settings`), fetched once. Screens need the site's zone to know
 * which day "today" is: a scheduler abroad still plans the site's day, not their own.
 */
@Injectable({ providedIn: 'root' })
export class SiteSettingsService {
  private readonly http = inject(HttpClient);
  private readonly current = signal<SiteSettings | null>(null);
  private loading: Promise<SiteSettings | null> | null = null;
  // Re-read each minute so a screen left open (a wall display) moves on to the next day at midnight.
  private readonly minute = signal(Date.now());

  /** The settings, or null until loaded. */
  readonly settings = this.current.asReadonly();

  /** Today (`YYYY-MM-DD`) in the site's zone, or null until the settings are loaded. */
  readonly today = computed(() => {
    this.minute();
    const settings = this.current();
    return settings ? todayIn(settings.timezone) : null;
  });

  constructor() {
    void this.load();
    const timer = setInterval(() => this.minute.set(Date.now()), 60_000);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  /** Fetches the settings once. If they cannot be read, today falls back to the browser's zone. */
  load(): Promise<SiteSettings | null> {
    this.loading ??= firstValueFrom(this.http.get<{ settings: SiteSettings }>('/api/settings')).then(
      ({ settings }) => this.settle(settings),
      // The error interceptor has told the user; the screens still work on the browser's day.
      () => this.settle({ siteName: '', timezone: DateTime.local().zoneName ?? 'UTC', snugMarginMinutes: 3 }),
    );
    return this.loading;
  }

  private settle(settings: SiteSettings): SiteSettings {
    this.current.set(settings);
    return settings;
  }
}

/** `YYYY-MM-DD` of now in an IANA zone. */
export function todayIn(timezone: string): string {
  return DateTime.now().setZone(timezone).toISODate() ?? DateTime.now().toISODate()!;
}
