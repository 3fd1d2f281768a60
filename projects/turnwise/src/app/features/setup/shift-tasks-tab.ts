import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import type { ShiftTaskView } from '@shared/api/shift-tasks';
import { readRule, ruleText } from '@shared/shift-tasks/rule-builder';
import { serverState } from '../../core/state/server-state';
import { ConfirmDialog, type ConfirmData } from './confirm-dialog';
import { SetupApi } from './setup-api';
import { ShiftTaskDialog, type ShiftTaskDialogData } from './shift-task-dialog';
import { ShiftTasksApi } from './shift-tasks-api';
import { tableView } from './table-view';

/** A rule in words when the builder can read it, else its RFC 5545 text. */
export function ruleInWords(rrule: string): string {
  const fields = readRule(rrule);
  return fields ? ruleText(fields) : rrule.replace(/\r?\n/g, ' ');
}

/** Setup → Shift tasks: every room's recurring tasks (RFC 5545 rules), with add, edit and retire. */
@Component({
  selector: 'tw-shift-tasks-tab',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatPaginatorModule, MatSortModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="intro">
      Recurring tasks per room (workstation wipe-downs, scanner QA, deep cleans) show on Rooms now and the
      Turnover screen when they fall due. A rule's next occurrences show while you edit it.
    </p>
    <div class="bar">
      <mat-form-field class="filter" subscriptSizing="dynamic">
        <mat-label>Filter tasks</mat-label>
        <input matInput (input)="view.setFilter($any($event.target).value)" />
      </mat-form-field>
      <button mat-flat-button type="button" (click)="edit(null)" [disabled]="activeRooms().length === 0">Add shift task</button>
    </div>
    @if (message(); as text) {
      <p class="load-error" role="alert">{{ text }}</p>
    }
    @if (tasks.status() === 'failed') {
      <p class="load-error" role="alert">{{ tasks.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Shift tasks">
        <ng-container matColumnDef="room">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Room</th>
          <td mat-cell *matCellDef="let task">{{ task.roomName }}</td>
        </ng-container>
        <ng-container matColumnDef="label">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Task</th>
          <td mat-cell *matCellDef="let task" [class.retired]="task.retired">{{ task.label }}{{ task.retired ? ' (retired)' : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="rule">
          <th mat-header-cell *matHeaderCellDef>When</th>
          <td mat-cell *matCellDef="let task">{{ words(task) }}</td>
        </ng-container>
        <ng-container matColumnDef="durationMinutes">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Minutes</th>
          <td mat-cell *matCellDef="let task">{{ task.durationMinutes }}</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let task" class="actions">
            @if (!task.retired) {
              <button mat-button type="button" (click)="edit(task)" [attr.aria-label]="'Edit ' + task.label + ', ' + task.roomName">Edit</button>
              <button mat-button type="button" (click)="retire(task)" [attr.aria-label]="'Retire ' + task.label + ', ' + task.roomName">Retire</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ tasks.status() === 'loading' ? 'Loading shift tasks…' : 'No shift tasks yet, or none matches.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="view.matching().length" [pageIndex]="view.pageIndex()" [pageSize]="view.pageSize()" [pageSizeOptions]="[10, 25, 50]" (page)="view.setPage($event)" aria-label="Shift task pages" />
  `,
  styleUrl: './setup-table.scss',
  styles: `
    .intro { margin: 0 0 12px; max-width: 70ch; }
  `,
})
export class ShiftTasksTab {
  private readonly api = inject(ShiftTasksApi);
  private readonly setup = inject(SetupApi);
  private readonly dialog = inject(MatDialog);
  protected readonly columns = ['room', 'label', 'rule', 'durationMinutes', 'actions'];
  protected readonly tasks = serverState(() => this.api.list(), 'The shift tasks could not be shown.');
  private readonly rooms = serverState(() => this.setup.rooms(), 'The rooms could not be shown.');
  protected readonly activeRooms = computed(() => (this.rooms.value() ?? []).filter((r) => !r.retired).map((r) => ({ id: r.id, name: r.name })));
  protected readonly message = signal<string | null>(null);
  protected readonly view = tableView(
    computed(() => this.tasks.value() ?? []),
    (task) => `${task.roomName} ${task.label} ${ruleInWords(task.rrule)}`,
    (task, column) => (column === 'room' ? task.roomName : column === 'durationMinutes' ? task.durationMinutes : task.label),
    25,
  );

  constructor() {
    this.tasks.show('all');
    this.rooms.show('all');
  }

  protected words(task: ShiftTaskView): string {
    return ruleInWords(task.rrule);
  }

  protected async edit(task: ShiftTaskView | null): Promise<void> {
    const data: ShiftTaskDialogData = { task, rooms: this.activeRooms() };
    const saved = await firstValueFrom(this.dialog.open(ShiftTaskDialog, { data, autoFocus: 'first-tabbable', maxWidth: '96vw' }).afterClosed());
    if (saved) this.tasks.reload();
  }

  protected async retire(task: ShiftTaskView): Promise<void> {
    const data: ConfirmData = {
      title: `Retire “${task.label}” in ${task.roomName}?`,
      text: 'It leaves Rooms now and the Turnover screen from now on. The cleaning log keeps every time it was done.',
      confirm: 'Retire task',
    };
    if (!(await firstValueFrom(this.dialog.open(ConfirmDialog, { data }).afterClosed()))) return;
    this.message.set(null);
    try {
      await firstValueFrom(this.api.retire(task.id));
      this.tasks.reload();
    } catch (error) {
      this.message.set((error as { message?: string }).message ?? 'That could not be done.');
    }
  }
}
