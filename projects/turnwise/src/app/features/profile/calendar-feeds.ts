import { Clipboard } from '@angular/cdk/clipboard';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';

import type { CalendarFeedAddresses, CalendarFeedLink, CalendarFeedStatus } from '@shared/api/calendar';
import { CALENDAR_FEED_WINDOW } from '@shared/api/calendar';
import { showsOwnErrors } from '../../core/http/shows-own-errors';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';

/**
 * One's private calendar addresses: the server keeps only a hash of the token, so the addresses
 * show once, right after they are made; making new ones (or turning feeds off) ends the old.
 */
@Component({
  selector: 'tw-calendar-feeds',
  imports: [MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="calendar-heading">
      <h2 id="calendar-heading">Calendar feeds</h2>
      <p class="hint">
        Subscribe to your shift tasks or a room's exams and turnovers in your calendar app ({{ window.daysBack }} days back to {{ window.daysAhead }} ahead).
        Anyone with an address can read that calendar: keep it to yourself.
      </p>
      @if (status.status() === 'loading') {
        <p role="status">Loading…</p>
      } @else if (status.status() === 'failed') {
        <p class="form-error" role="alert">{{ status.error()?.message }}</p>
      } @else if (status.value(); as s) {
        @if (feeds(); as list) {
          <p role="status">Your new addresses. Copy them now: Turnwise shows them only this once.</p>
          <ul class="feeds">
            @for (feed of list; track feed.url) {
              <li>
                <span class="label">{{ feed.label }}</span>
                <code>{{ feed.url }}</code>
                <button mat-stroked-button type="button" (click)="copy(feed)" [attr.aria-label]="'Copy the address of ' + feed.label">
                  {{ copied() === feed.url ? 'Copied' : 'Copy' }}
                </button>
              </li>
            }
          </ul>
        } @else if (s.active) {
          <p>Your feeds are on since {{ s.createdAt?.slice(0, 10) }}{{ s.lastUsedAt ? ', last read ' + s.lastUsedAt.slice(0, 10) : '' }}. To see the addresses again, make new ones.</p>
        } @else {
          <p>Your feeds are off.</p>
        }
        @if (error(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
        <div class="actions">
          <button mat-flat-button type="button" (click)="rotate()" [disabled]="rotating.pending()">
            {{ s.active ? 'Make new addresses (the old stop working)' : 'Turn feeds on' }}
          </button>
          @if (s.active) {
            <button mat-stroked-button type="button" (click)="revoke()" [disabled]="revoking.pending()">Turn feeds off</button>
          }
        </div>
      }
    </section>
  `,
  styles: `
    h2 { margin: 24px 0 0; font-size: 1.25rem; }
    .hint { color: var(--mat-sys-on-surface-variant); }
    .feeds { list-style: none; padding: 0; display: flex; flex-direction: column; gap: 8px; }
    .feeds li { display: grid; grid-template-columns: 1fr auto; gap: 4px 8px; align-items: center; }
    .feeds .label { grid-column: 1 / -1; font-weight: 500; }
    code { overflow-wrap: anywhere; font-size: 0.85rem; }
    .actions { display: flex; flex-wrap: wrap; gap: 8px; }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class CalendarFeeds {
  private readonly http = inject(HttpClient);
  private readonly clipboard = inject(Clipboard);
  protected readonly window = CALENDAR_FEED_WINDOW;
  protected readonly feeds = signal<CalendarFeedLink[] | null>(null);
  protected readonly copied = signal<string | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly status = serverState(() => this.http.get<CalendarFeedStatus>('/api/profile/calendar', { context: showsOwnErrors() }), 'Your calendar feeds could not be shown.');
  protected readonly rotating = action(() => this.http.post<CalendarFeedAddresses>('/api/profile/calendar/rotate', {}, { context: showsOwnErrors() }));
  protected readonly revoking = action(() => this.http.delete<void>('/api/profile/calendar', { context: showsOwnErrors() }));

  constructor() {
    this.status.show('mine');
  }

  protected async rotate(): Promise<void> {
    this.error.set(null);
    const result = await this.rotating.run();
    if (result.status === 'failed') return this.error.set(result.error.message);
    const { feeds, ...status } = result.value;
    this.status.set(status);
    this.feeds.set(feeds);
    this.copied.set(null);
  }

  protected async revoke(): Promise<void> {
    this.error.set(null);
    const result = await this.revoking.run();
    if (result.status === 'failed') return this.error.set(result.error.message);
    this.feeds.set(null);
    this.status.set({ active: false, createdAt: null, lastUsedAt: null });
  }

  protected copy(feed: CalendarFeedLink): void {
    if (this.clipboard.copy(feed.url)) this.copied.set(feed.url);
  }
}
