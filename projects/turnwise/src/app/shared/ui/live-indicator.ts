import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { DayStreamStatus } from '../../core/live/day-events';

const DISPLAY: Readonly<Record<DayStreamStatus, { icon: string; text: string }>> = {
  connecting: { icon: 'sync', text: 'Connecting…' },
  live: { icon: 'sync', text: 'Live' },
  reconnecting: { icon: 'sync_problem', text: 'Reconnecting — the screen may be out of date' },
};

/** Whether the screen is receiving the day's changes as they happen, in words. */
@Component({
  selector: 'tw-live-indicator',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-live-indicator', role: 'status', '[attr.data-status]': 'status()' },
  template: `<mat-icon [svgIcon]="display().icon" aria-hidden="true" /><span>{{ display().text }}</span>`,
  styles: `
    :host { display: inline-flex; align-items: center; gap: 4px; font: var(--mat-sys-label-large); }
    mat-icon { width: 18px; height: 18px; }
    :host([data-status='live']) mat-icon { color: var(--tw-state-ready-ink); }
    :host([data-status='reconnecting']) { color: var(--tw-verdict-short-ink); }
  `,
})
export class LiveIndicator {
  readonly status = input.required<DayStreamStatus>();
  protected readonly display = computed(() => DISPLAY[this.status()]);
}
