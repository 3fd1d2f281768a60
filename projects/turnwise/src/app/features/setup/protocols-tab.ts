import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import { FALLBACK_MODALITY, type ModalityProtocols, type ProtocolVersionAnswer } from '@shared/api/protocols';
import { serverState } from '../../core/state/server-state';
import { CautionNote } from '../../shared/ui/caution-note';
import { ProtocolEditor, type ProtocolEditorData } from './protocol-editor';
import { ProtocolView, type ProtocolViewData } from './protocol-view';
import { ProtocolsApi } from './protocols-api';
import { tableView } from './table-view';

/** The editor is wide on a desktop and the whole width of a 768 px tablet. */
const EDITOR_SIZE = { width: '1100px', maxWidth: '96vw', maxHeight: '94vh' };

/**
 * Setup → Protocols: per DICOM modality (and `*`, the fallback), the version in force today,
 * those scheduled and the older ones; a new version from the current one, or a new modality's
 * protocol from scratch or from a copy of another's.
 */
@Component({
  selector: 'tw-protocols-tab',
  imports: [MatButtonModule, MatSortModule, MatTableModule, CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <tw-caution-note [kind]="['general', 'airborne']" />
    <div class="bar">
      <button mat-flat-button type="button" (click)="add()" [disabled]="!loaded()">Add a protocol</button>
    </div>
    @if (missing().length > 0) {
      <p class="load-error" role="alert">
        No protocol for {{ missing().join(', ') }}: those rooms get no turnover times until you add one (or a fallback for every modality, *).
      </p>
    }
    @for (warning of warnings(); track $index) {
      <p class="notice" role="status">{{ warning }}</p>
    }
    @if (list.status() === 'failed' || products.status() === 'failed') {
      <p class="load-error" role="alert">{{ (list.error() ?? products.error())?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Protocols">
        <ng-container matColumnDef="modality">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Modality</th>
          <td mat-cell *matCellDef="let row">{{ row.modality === fallback ? '* (any other)' : row.modality }}</td>
        </ng-container>
        <ng-container matColumnDef="current">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>In force today</th>
          <td mat-cell *matCellDef="let row">
            @if (row.current; as current) {
              Version {{ current.version }}, from {{ current.effectiveFrom }}
              <div class="muted">saved {{ current.createdAt.slice(0, 10) }} by {{ current.createdBy?.displayName || current.createdBy?.username || 'the system' }}</div>
            } @else {
              <span class="badge">none yet</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="future">
          <th mat-header-cell *matHeaderCellDef>Scheduled</th>
          <td mat-cell *matCellDef="let row">
            @for (version of row.future; track version.id) {
              <div>Version {{ version.version }} from {{ version.effectiveFrom }}</div>
            } @empty {
              —
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="rooms">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Rooms</th>
          <td mat-cell *matCellDef="let row">{{ row.roomIds.length }}</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let row" class="actions">
            @if (latest(row); as version) {
              <button mat-button type="button" (click)="show(row, version)" [attr.aria-label]="'Versions of the ' + name(row) + ' protocol'">
                Versions ({{ count(row) }})
              </button>
            }
            <button mat-button type="button" (click)="edit(row)" [attr.aria-label]="'New version of the ' + name(row) + ' protocol'">New version</button>
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ list.status() === 'loading' ? 'Loading protocols…' : 'No protocols yet: add one for each modality of your rooms.' }}</td>
        </tr>
      </table>
    </div>
    <p class="muted">A saved change is a new version from the day you choose; earlier days keep the version they used.</p>
  `,
  styleUrl: './setup-table.scss',
})
export class ProtocolsTab {
  private readonly api = inject(ProtocolsApi);
  private readonly dialog = inject(MatDialog);
  protected readonly fallback = FALLBACK_MODALITY;
  protected readonly columns = ['modality', 'current', 'future', 'rooms', 'actions'];
  protected readonly list = serverState(() => this.api.protocols(), 'The protocols could not be shown.');
  protected readonly products = serverState(() => this.api.products(), 'The products could not be shown.');
  protected readonly warnings = signal<string[]>([]);
  protected readonly loaded = computed(() => this.list.value() !== null && this.products.value() !== null);
  protected readonly missing = computed(() => this.list.value()?.missing ?? []);
  protected readonly view = tableView(
    computed(() => this.list.value()?.protocols ?? []),
    (row) => row.modality,
    (row, column) => (column === 'current' ? (row.current?.effectiveFrom ?? '') : column === 'rooms' ? row.roomIds.length : row.modality),
    50,
  );

  constructor() {
    this.list.show('all');
    this.products.show('all');
  }

  protected name(row: ModalityProtocols): string {
    return row.modality === FALLBACK_MODALITY ? 'fallback (*)' : row.modality;
  }

  protected count(row: ModalityProtocols): number {
    return row.future.length + row.history.length + (row.current ? 1 : 0);
  }

  /** The version the viewer opens on: today's, else the next scheduled. */
  protected latest(row: ModalityProtocols): number | null {
    return row.current?.version ?? row.future[0]?.version ?? row.history[0]?.version ?? null;
  }

  protected show(row: ModalityProtocols, version: number): void {
    const list = this.list.value()!;
    const data: ProtocolViewData = { protocols: row, version, products: this.products.value() ?? [], today: list.today };
    this.dialog.open(ProtocolView, { data, maxWidth: '96vw', maxHeight: '94vh' });
  }

  protected edit(row: ModalityProtocols): Promise<void> {
    // the newest version (a scheduled one, if any) is what the next one changes
    const base = row.future[row.future.length - 1] ?? row.current ?? row.history[0] ?? null;
    return this.open(row.modality, base?.body ?? null);
  }

  protected add(): Promise<void> {
    return this.open(null, null);
  }

  private async open(modality: string | null, base: ProtocolEditorData['base']): Promise<void> {
    const list = this.list.value();
    if (!list) return;
    const data: ProtocolEditorData = { modality, base, today: list.today, products: this.products.value() ?? [], protocols: list.protocols };
    const saved: ProtocolVersionAnswer | undefined = await firstValueFrom(this.dialog.open(ProtocolEditor, { data, ...EDITOR_SIZE, autoFocus: 'first-tabbable' }).afterClosed());
    if (!saved) return;
    const { protocol } = saved;
    this.warnings.set([
      `Saved version ${protocol.version} of the ${protocol.modality} protocol, effective from ${protocol.effectiveFrom}.`,
      ...saved.warnings.map((w) => w.message),
    ]);
    this.list.reload();
    this.products.reload();
  }
}
