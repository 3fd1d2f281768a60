import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import type { ChangeReason, DayHistory, PlanChangeRecord } from '@shared/api/changes';
import { AFTER_MANUAL_CHANGE } from '@shared/api/hl7';
import type { ApiError } from '@shared/api/errors';
import type { LoadStatus } from '../../core/state/server-state';
import { SiteTime } from '../../shared/ui/site-time';

const REASONS: Readonly<Record<ChangeReason, string>> = {
  drag: 'dragged',
  keyboard: 'moved by keyboard',
  api: 'through the API',
  suggestion: 'suggested fix',
  undo: 'undo',
  redo: 'redo',
  staffing: 'staffing',
  'exam added': 'exam added',
  'exam edited': 'exam edited',
  'exam cancelled': 'exam cancelled',
  hl7: 'booking system (HL7)',
  roster: 'roster',
  'day fit': 'make the day fit',
};

/**
 * The day's changes, newest first: when (site time), who, what and how. The store fetches them
 * (after every change and live event, since they also say whether Undo and Redo have anything to do).
 */
@Component({
  selector: 'tw-history-panel',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-history-panel', role: 'region', 'aria-label': 'Changes to this day' },
  template: `
    <header>
      <h2>Changes to this day</h2>
      <button mat-icon-button type="button" aria-label="Close the changes" (click)="closed.emit()"><mat-icon svgIcon="close" /></button>
    </header>
    @if (history(); as shown) {
      <ol>
        @for (change of shown.changes; track change.id) {
          <li [class.undone]="change.undone">
            <span class="when">{{ change.at | siteTime }}</span>
            <span class="who">{{ change.displayName || change.username }}</span>
            <span class="what">{{ summary(change) }}</span>
            @if (change.afterManualChange) {
              <span class="after-manual"><mat-icon svgIcon="sync_problem" aria-hidden="true" />{{ afterManual }}</span>
            }
            <span class="how">{{ reason(change.reason) }}{{ change.undone ? ' · undone' : '' }}</span>
          </li>
        } @empty {
          <li class="quiet">No changes yet.</li>
        }
      </ol>
    } @else if (status() === 'failed') {
      <p class="quiet" role="alert">{{ error()?.message ?? 'The changes could not be loaded.' }}</p>
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the changes" />
    }
  `,
  styles: `
    :host { display: grid; align-content: start; gap: 8px; padding: 12px 16px; border-radius: var(--tw-radius-l); background: var(--mat-sys-surface-container-low); border: 1px solid var(--mat-sys-outline-variant); }
    header { display: flex; align-items: center; justify-content: space-between; }
    h2 { margin: 0; font: var(--mat-sys-title-medium); }
    ol { margin: 0; padding: 0; list-style: none; display: grid; gap: 6px; max-height: 50dvh; overflow: auto; }
    li { display: grid; grid-template-columns: 6ch 1fr; gap: 0 8px; font: var(--mat-sys-body-small); }
    .when { font-variant-numeric: tabular-nums; grid-row: span 3; }
    .who { font-weight: 600; }
    .how, .quiet { color: var(--mat-sys-on-surface-variant); }
    li.quiet { display: block; }
    .undone .what { text-decoration: line-through; }
    .after-manual { grid-column: 2; display: flex; align-items: center; gap: 4px; font-weight: 600; }
    .after-manual mat-icon { width: 16px; height: 16px; flex: none; }
  `,
})
export class HistoryPanel {
  protected readonly afterManual = AFTER_MANUAL_CHANGE;
  /** Kept on screen while a refetch runs, so the list is replaced, never blanked. */
  readonly history = input.required<DayHistory | null>();
  readonly status = input<LoadStatus>('loading');
  readonly error = input<ApiError | null>(null);
  readonly closed = output<void>();

  /** The stored summary carries the mark as a note; shown once, beside its icon, instead. */
  protected summary(change: PlanChangeRecord): string {
    return change.afterManualChange ? change.summary.replace(` (${AFTER_MANUAL_CHANGE})`, '') : change.summary;
  }

  protected reason(reason: ChangeReason): string {
    return REASONS[reason] ?? reason;
  }
}
