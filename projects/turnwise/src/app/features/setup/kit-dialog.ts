import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';

import { EQUIPMENT_KIND_LABELS, MR_MARKING_LABELS, ZONE_IV_MARKINGS, type EquipmentItem } from '@shared/api/equipment';
import type { SetupRoom } from '@shared/api/rooms';
import { action } from '../../core/state/action';
import { CautionNote } from '../../shared/ui/caution-note';
import { SetupApi } from './setup-api';

export interface KitDialogData {
  room: SetupRoom;
  equipment: EquipmentItem[];
}

/**
 * A room's cleaning kit. For an MR room the items that may not enter Zone IV are shown but
 * cannot be ticked; the API refuses them too (422 `kit_not_mr_safe`), and its answer is shown.
 */
@Component({
  selector: 'tw-kit-dialog',
  imports: [MatDialogModule, MatButtonModule, MatCheckboxModule, CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Cleaning kit of {{ data.room.name }}</h2>
    <mat-dialog-content>
      @if (mr) {
        <tw-caution-note kind="mr" />
      }
      @if (items().length === 0) {
        <p>No equipment is set up yet. Add items on the Equipment tab first.</p>
      }
      <ul class="kit" aria-label="Equipment">
        @for (item of items(); track item.id) {
          <li>
            <mat-checkbox [checked]="chosen().has(item.id)" [disabled]="mr && !zoneIv(item)" (change)="toggle(item.id, $event.checked)">
              {{ item.name }} <span class="meta">· {{ kindLabels[item.kind] }} · {{ markingLabels[item.marking] }}</span>
            </mat-checkbox>
            @if (mr && !zoneIv(item)) {
              <span class="why">Not allowed in Zone IV (ASTM F2503 marking: {{ markingLabels[item.marking] }})</span>
            } @else if (item.marking === 'mr-conditional') {
              <span class="why">Conditions: {{ item.conditions }}</span>
            }
          </li>
        }
      </ul>
      @if (refusal(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" (click)="save()" [disabled]="saving.pending()">Save kit</button>
    </mat-dialog-actions>
  `,
  styles: `
    .kit { list-style: none; margin: 8px 0; padding: 0; display: flex; flex-direction: column; gap: 2px; }
    .meta, .why { color: var(--mat-sys-on-surface-variant); }
    .why { display: block; margin: -6px 0 4px 40px; font-size: 0.875rem; }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class KitDialog {
  private readonly api = inject(SetupApi);
  private readonly ref = inject(MatDialogRef<KitDialog, EquipmentItem[]>);
  protected readonly data = inject<KitDialogData>(MAT_DIALOG_DATA);
  protected readonly mr = this.data.room.modality === 'MR';
  protected readonly kindLabels = EQUIPMENT_KIND_LABELS;
  protected readonly markingLabels = MR_MARKING_LABELS;
  protected readonly items = computed(() => this.data.equipment.filter((i) => !i.retired));
  protected readonly chosen = signal(new Set(this.data.equipment.filter((i) => i.roomIds.includes(this.data.room.id)).map((i) => i.id)));
  protected readonly refusal = signal<string | null>(null);
  protected readonly saving = action(() => this.api.setKit(this.data.room.id, [...this.chosen()]));

  protected zoneIv(item: EquipmentItem): boolean {
    return ZONE_IV_MARKINGS.includes(item.marking);
  }

  protected toggle(id: number, on: boolean): void {
    const next = new Set(this.chosen());
    if (on) next.add(id);
    else next.delete(id);
    this.chosen.set(next);
  }

  protected async save(): Promise<void> {
    this.refusal.set(null);
    const result = await this.saving.run();
    if (result.status === 'done') this.ref.close(result.value);
    // kit_not_mr_safe names the items, ASTM F2503 and Zone IV: its message says it all
    else this.refusal.set(result.error.message);
  }
}
