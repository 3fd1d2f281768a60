import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { BoardShiftTask } from '@shared/api/board';
import { SiteTime } from '../../shared/ui/site-time';

/** The room's start- and end-of-shift tasks for the day, each ticked off on its own. */
@Component({
  selector: 'tw-shift-task-list',
  imports: [MatButtonModule, MatIconModule, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ul aria-label="Shift tasks">
      @for (task of tasks(); track task.taskId + task.due) {
        <li [class.overdue]="task.overdue" [class.done]="!!task.doneAt">
          <span class="due">{{ task.due | siteTime }}</span>
          <span class="label">{{ task.label }} ({{ task.durationMinutes }} min)</span>
          @if (task.doneAt) {
            <span class="state"><mat-icon svgIcon="check_circle" aria-hidden="true" />Done {{ task.doneAt | siteTime }} by {{ task.doneBy }}</span>
          } @else {
            @if (task.overdue) {
              <span class="state"><mat-icon svgIcon="warning" aria-hidden="true" />Overdue</span>
            }
            <button mat-stroked-button type="button" class="task-done" [disabled]="!enabled()" (click)="done.emit(task)">
              <mat-icon svgIcon="task_alt" />Done
            </button>
          }
        </li>
      } @empty {
        <li>No shift tasks for this room today.</li>
      }
    </ul>
  `,
  styles: `
    ul { margin: 0; padding: 0; list-style: none; display: grid; gap: 8px; }
    li { display: flex; flex-wrap: wrap; align-items: center; gap: 8px 16px; min-height: 56px; padding: 4px 12px;
      border-radius: var(--tw-radius-s); background: var(--mat-sys-surface-container-low); }
    .due { font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    .label { flex: 1; }
    .state { display: inline-flex; align-items: center; gap: 4px; font-weight: 600; }
    .overdue .state { color: var(--tw-verdict-snug-ink); }
    .task-done { min-height: 48px; }
  `,
})
export class ShiftTaskList {
  readonly tasks = input.required<readonly BoardShiftTask[]>();
  readonly enabled = input(true);
  readonly done = output<BoardShiftTask>();
}
