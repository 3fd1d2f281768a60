import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, map, of, switchMap } from 'rxjs';

import type { ChangeReason, PlanChangeRecord } from '@shared/api/changes';
import { SiteTime } from '../../shared/ui/site-time';
import { DayPlanService } from './day-plan-service';

type HistoryState = { status: 'loading' } | { status: 'loaded'; changes: PlanChangeRecord[] } | { status: 'failed'; message: string };

const REASONS: Readonly<Record<ChangeReason, string>> = {
  drag: 'dragged',
  keyboard: 'moved by keyboard',
  api: 'through the API',
  suggestion: 'suggested fix',
  undo: 'undo',
  redo: 'redo',
  staffing: 'staffing',
};

/** The day's changes, newest first: when, who, what and how. Refetched with every new plan. */
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
    @let state = history();
    @switch (state.status) {
      @case ('loading') { <mat-progress-bar mode="indeterminate" aria-label="Loading the changes" /> }
      @case ('failed') { <p class="quiet" role="alert">{{ state.message }}</p> }
      @case ('loaded') {
        <ol>
          @for (change of state.changes; track change.id) {
            <li [class.undone]="change.undone">
              <span class="when">{{ change.at | siteTime }}</span>
              <span class="who">{{ change.displayName || change.username }}</span>
              <span class="what">{{ change.summary }}</span>
              <span class="how">{{ reason(change.reason) }}{{ change.undone ? ' · undone' : '' }}</span>
            </li>
          } @empty {
            <li class="quiet">No changes yet.</li>
          }
        </ol>
      }
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
    .undone .what { text-decoration: line-through; }
  `,
})
export class HistoryPanel {
  private readonly api = inject(DayPlanService);

  readonly date = input.required<string>();
  readonly revision = input(0);
  readonly closed = output<void>();

  private readonly request = computed(() => ({ date: this.date(), revision: this.revision() }));
  protected readonly history = toSignal(
    toObservable(this.request).pipe(
      switchMap(({ date }) =>
        this.api.history(date).pipe(
          map((changes): HistoryState => ({ status: 'loaded', changes })),
          // No "loading" in between: a refetch after each change keeps the list on screen until it is replaced.
          catchError((error: { message?: string }) => of<HistoryState>({ status: 'failed', message: error.message ?? 'The changes could not be loaded.' })),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as HistoryState },
  );

  protected reason(reason: ChangeReason): string {
    return REASONS[reason] ?? reason;
  }
}
