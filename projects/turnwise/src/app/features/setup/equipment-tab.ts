import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import { EQUIPMENT_KIND_LABELS, MR_MARKING_LABELS, type EquipmentItem } from '@shared/api/equipment';
import { serverState } from '../../core/state/server-state';
import { CautionNote } from '../../shared/ui/caution-note';
import { ConfirmDialog, type ConfirmData } from './confirm-dialog';
import { EquipmentDialog } from './equipment-dialog';
import { SetupApi } from './setup-api';
import { tableView } from './table-view';

/** Setup → Equipment: coils, cushions and cleaning equipment with their ASTM F2503 marking and rooms. */
@Component({
  selector: 'tw-equipment-tab',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatPaginatorModule, MatSortModule, MatTableModule, CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <tw-caution-note kind="mr" />
    <div class="bar">
      <mat-form-field class="filter" subscriptSizing="dynamic">
        <mat-label>Filter equipment</mat-label>
        <input matInput (input)="view.setFilter($any($event.target).value)" />
      </mat-form-field>
      <button mat-flat-button type="button" (click)="edit(null)">Add equipment</button>
    </div>
    @if (message(); as text) {
      <p class="load-error" role="alert">{{ text }}</p>
    }
    @if (items.status() === 'failed') {
      <p class="load-error" role="alert">{{ items.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Equipment">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Item</th>
          <td mat-cell *matCellDef="let item" [class.retired]="item.retired">{{ item.name }}{{ item.retired ? ' (retired)' : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="kind">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Kind</th>
          <td mat-cell *matCellDef="let item">{{ kindLabel(item) }}</td>
        </ng-container>
        <ng-container matColumnDef="marking">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>MR marking</th>
          <td mat-cell *matCellDef="let item">
            <span class="badge">{{ markingLabel(item) }}</span>
            @if (item.marking === 'mr-conditional') {
              <div class="muted">{{ item.conditions }}</div>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="rooms">
          <th mat-header-cell *matHeaderCellDef>In the kit of</th>
          <td mat-cell *matCellDef="let item">{{ roomNames(item) || '—' }}</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let item" class="actions">
            @if (!item.retired) {
              <button mat-button type="button" (click)="edit(item)" [attr.aria-label]="'Edit ' + item.name">Edit</button>
              <button mat-button type="button" (click)="retire(item)" [attr.aria-label]="'Retire ' + item.name">Retire</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ items.status() === 'loading' ? 'Loading equipment…' : 'No equipment yet, or none matches.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="view.matching().length" [pageIndex]="view.pageIndex()" [pageSize]="view.pageSize()" [pageSizeOptions]="[10, 25, 50]" (page)="view.setPage($event)" aria-label="Equipment pages" />
  `,
  styleUrl: './setup-table.scss',
})
export class EquipmentTab {
  private readonly api = inject(SetupApi);
  private readonly dialog = inject(MatDialog);
  protected readonly columns = ['name', 'kind', 'marking', 'rooms', 'actions'];
  protected readonly items = serverState(() => this.api.equipment(), 'The equipment could not be shown.');
  private readonly rooms = serverState(() => this.api.rooms(), 'The rooms could not be shown.');
  protected readonly message = signal<string | null>(null);
  protected readonly view = tableView(
    computed(() => this.items.value() ?? []),
    (item) => `${item.name} ${EQUIPMENT_KIND_LABELS[item.kind]} ${MR_MARKING_LABELS[item.marking]}`,
    (item, column) => (column === 'kind' ? EQUIPMENT_KIND_LABELS[item.kind] : column === 'marking' ? MR_MARKING_LABELS[item.marking] : item.name),
  );
  private readonly roomName = computed(() => new Map((this.rooms.value() ?? []).map((r) => [r.id, r.name])));

  constructor() {
    this.items.show('all');
    this.rooms.show('all');
  }

  protected kindLabel(item: EquipmentItem): string {
    return EQUIPMENT_KIND_LABELS[item.kind];
  }

  protected markingLabel(item: EquipmentItem): string {
    return MR_MARKING_LABELS[item.marking];
  }

  protected roomNames(item: EquipmentItem): string {
    return item.roomIds.map((id) => this.roomName().get(id) ?? `room ${id}`).join(', ');
  }

  protected async edit(item: EquipmentItem | null): Promise<void> {
    const saved = await firstValueFrom(this.dialog.open(EquipmentDialog, { data: item }).afterClosed());
    if (saved) this.items.reload();
  }

  protected async retire(item: EquipmentItem): Promise<void> {
    const data: ConfirmData = {
      title: `Retire ${item.name}?`,
      text: 'It leaves every room’s cleaning kit and can no longer be added to one. The audit keeps what it was.',
      confirm: 'Retire item',
    };
    if (!(await firstValueFrom(this.dialog.open(ConfirmDialog, { data }).afterClosed()))) return;
    this.message.set(null);
    try {
      await firstValueFrom(this.api.retireEquipment(item.id));
      this.items.reload();
    } catch (error) {
      this.message.set((error as { message?: string }).message ?? 'That could not be done.');
    }
  }
}
