import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import type { SetupRoom } from '@shared/api/rooms';
import { serverState } from '../../core/state/server-state';
import { ConfirmDialog, type ConfirmData } from './confirm-dialog';
import { KitDialog, type KitDialogData } from './kit-dialog';
import { RoomDialog } from './room-dialog';
import { weekSummary } from './room-week';
import { SetupApi } from './setup-api';
import { tableView } from './table-view';
import { WeeklyRosterDialog } from '../roster/weekly-roster-dialog';

/** Setup → Rooms: every room, retired ones too, with edit, kit and retire; and the weekly roster of who covers them. */
@Component({
  selector: 'tw-rooms-tab',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSortModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="bar">
      <mat-form-field class="filter" subscriptSizing="dynamic">
        <mat-label>Filter rooms</mat-label>
        <input matInput (input)="view.setFilter($any($event.target).value)" />
      </mat-form-field>
      <button mat-stroked-button type="button" class="weekly-roster" (click)="weeklyRoster()">Weekly roster</button>
      <button mat-flat-button type="button" (click)="edit(null)">Add a room</button>
    </div>
    @if (message(); as text) {
      <p class="load-error" role="alert">{{ text }}</p>
    }
    @if (rooms.status() === 'failed') {
      <p class="load-error" role="alert">{{ rooms.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Rooms">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Room</th>
          <td mat-cell *matCellDef="let room" [class.retired]="room.retired">{{ room.name }}</td>
        </ng-container>
        <ng-container matColumnDef="modality">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Modality</th>
          <td mat-cell *matCellDef="let room">{{ room.modality }}</td>
        </ng-container>
        <ng-container matColumnDef="airChangesPerHour">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Air changes / h</th>
          <td mat-cell *matCellDef="let room">{{ room.airChangesPerHour }}</td>
        </ng-container>
        <ng-container matColumnDef="staff">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Staff</th>
          <td mat-cell *matCellDef="let room">{{ room.staff }}</td>
        </ng-container>
        <ng-container matColumnDef="hours">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Open</th>
          <td mat-cell *matCellDef="let room">{{ hours(room) }}</td>
        </ng-container>
        <ng-container matColumnDef="status">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Status</th>
          <td mat-cell *matCellDef="let room">
            <span class="badge">{{ room.retired ? 'retired' : 'in use' }}</span>
          </td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let room" class="actions">
            @if (room.retired) {
              <button mat-button type="button" (click)="restore(room)" [attr.aria-label]="'Restore ' + room.name">Restore</button>
            } @else {
              <button mat-button type="button" (click)="edit(room)" [attr.aria-label]="'Edit ' + room.name">Edit</button>
              <button mat-button type="button" (click)="kit(room)" [attr.aria-label]="'Cleaning kit of ' + room.name">Kit</button>
              <button mat-button type="button" (click)="retire(room)" [attr.aria-label]="'Retire ' + room.name">Retire</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ rooms.status() === 'loading' ? 'Loading rooms…' : 'No rooms match.' }}</td>
        </tr>
      </table>
    </div>
    <p class="muted">A retired room leaves Rooms now and the day plan; its turnovers stay in the cleaning log.</p>
  `,
  styleUrl: './setup-table.scss',
})
export class RoomsTab {
  private readonly api = inject(SetupApi);
  private readonly dialog = inject(MatDialog);
  protected readonly columns = ['name', 'modality', 'airChangesPerHour', 'staff', 'hours', 'status', 'actions'];
  protected readonly rooms = serverState(() => this.api.rooms(), 'The rooms could not be shown.');
  protected readonly message = signal<string | null>(null);
  protected readonly view = tableView(
    computed(() => this.rooms.value() ?? []),
    (room) => `${room.name} ${room.modality}`,
    (room, column) => (column === 'hours' ? room.opensAt : column === 'status' ? String(room.retired) : (room[column as keyof SetupRoom] as string | number)),
    50,
  );
  protected readonly hours = (room: SetupRoom) => (room.week ? weekSummary(room.week) : `${room.opensAt}–${room.closesAt}`);

  constructor() {
    this.rooms.show('all');
  }

  protected async edit(room: SetupRoom | null): Promise<void> {
    const saved = await firstValueFrom(this.dialog.open(RoomDialog, { data: room, autoFocus: 'first-tabbable' }).afterClosed());
    if (saved) this.rooms.reload();
  }

  /** Who is usually on shift each weekday, and which rooms they cover. */
  protected weeklyRoster(): void {
    this.dialog.open(WeeklyRosterDialog, { width: '64rem', maxWidth: '96vw', autoFocus: 'dialog' });
  }

  protected async kit(room: SetupRoom): Promise<void> {
    this.message.set(null);
    try {
      const equipment = await firstValueFrom(this.api.equipment());
      this.dialog.open(KitDialog, { data: { room, equipment } satisfies KitDialogData });
    } catch (error) {
      this.message.set((error as { message?: string }).message ?? 'The equipment could not be loaded.');
    }
  }

  protected async retire(room: SetupRoom): Promise<void> {
    const data: ConfirmData = {
      title: `Retire ${room.name}?`,
      text: 'It leaves Rooms now and the day plan from now on. Its past turnovers stay in the cleaning log, and you can restore it later.',
      confirm: 'Retire room',
    };
    if (!(await firstValueFrom(this.dialog.open(ConfirmDialog, { data }).afterClosed()))) return;
    await this.change(this.api.retireRoom(room.id));
  }

  protected restore(room: SetupRoom): Promise<void> {
    return this.change(this.api.restoreRoom(room.id));
  }

  private async change(request: ReturnType<SetupApi['retireRoom']>): Promise<void> {
    this.message.set(null);
    try {
      await firstValueFrom(request);
      this.rooms.reload();
    } catch (error) {
      // e.g. 409 room_has_exams: the server's message names how many and from which day
      this.message.set((error as { message?: string }).message ?? 'That could not be done.');
    }
  }
}
