import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { DateTime } from 'luxon';
import { firstValueFrom } from 'rxjs';

import { DEFAULT_SETTINGS, type SiteSettings } from '@shared/api/settings';
import { Clock } from '../time/clock';

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
  private readonly minute = inject(Clock).minute;

  /** The settings, or null until loaded. */
  readonly settings = this.current.asReadonly();

  /** Today (`YYYY-MM-DD`) in the site's zone, or null until the settings are loaded. */
  readonly today = computed(() => {
    const settings = this.current();
    return settings ? todayIn(settings.timezone, this.minute()) : null;
  });

  constructor() {
    void this.load();
  }

  /** Fetches the settings once. If they cannot be read, today falls back to the browser's zone. */
  load(): Promise<SiteSettings | null> {
    this.loading ??= firstValueFrom(this.http.get<{ settings: SiteSettings }>('/api/settings')).then(
      ({ settings }) => this.settle(settings),
      // The error interceptor has told the user; the screens still work on the browser's day.
      () => this.settle({ ...DEFAULT_SETTINGS, siteName: '', timezone: DateTime.local().zoneName ?? 'UTC' }),
    );
    return this.loading;
  }

  private settle(settings: SiteSettings): SiteSettings {
    this.current.set(settings);
    return settings;
  }
}

/** `YYYY-MM-DD` of a moment (default now) in an IANA zone. */
export function todayIn(timezone: string, atMs = Date.now()): string {
  const at = DateTime.fromMillis(atMs);
  return at.setZone(timezone).toISODate() ?? at.toISODate()!;
}
