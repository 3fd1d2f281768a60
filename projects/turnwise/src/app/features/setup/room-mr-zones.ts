import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { ACR_ZONES, KIT_ZONE_LABELS, KIT_ZONES, MR_ZONE_TEXT_MAX, mrZonesSchema, type KitZone, type MrZones } from '@shared/api/mr-zones';
import { fieldMessage, schemaValidator } from './form-problems';

export type MrZonesForm = FormGroup<{
  kitKeptIn: FormControl<KitZone | null>;
  zoneIvAreas: FormControl<string>;
  notes: FormControl<string>;
}>;

export function mrZonesForm(zones: MrZones | null | undefined): MrZonesForm {
  return new FormGroup({
    kitKeptIn: new FormControl<KitZone | null>(zones?.kitKeptIn ?? null),
    zoneIvAreas: new FormControl(zones?.zoneIvAreas ?? '', { nonNullable: true, validators: schemaValidator(mrZonesSchema.shape.zoneIvAreas) }),
    notes: new FormControl(zones?.notes ?? '', { nonNullable: true, validators: schemaValidator(mrZonesSchema.shape.notes) }),
  });
}

/** An MR room's layout after the ACR's four zones: where its cleaning kit is kept and what is Zone IV. */
@Component({
  selector: 'tw-room-mr-zones',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <fieldset class="zones" [formGroup]="zones()">
      <legend>MR zones</legend>
      <p class="hint">
        The ACR's four zones (ACR Manual on MR Safety):
        @for (z of acrZones; track z.zone; let last = $last) {
          Zone {{ z.zone }} {{ z.text }}{{ last ? '.' : ';' }}
        }
        The Turnover screen of this room shows what you note here.
      </p>
      <mat-form-field>
        <mat-label>Cleaning kit kept in</mat-label>
        <mat-select formControlName="kitKeptIn">
          <mat-option [value]="null">Not said</mat-option>
          @for (zone of kitZones; track zone) {
            <mat-option [value]="zone">{{ kitZoneLabels[zone] }}</mat-option>
          }
        </mat-select>
        <mat-error>{{ message('kitKeptIn') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Zone IV doors and areas</mat-label>
        <textarea matInput formControlName="zoneIvAreas" rows="2" [maxlength]="max"></textarea>
        <mat-hint>e.g. the magnet room and the door from the control room</mat-hint>
        <mat-error>{{ message('zoneIvAreas') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Notes</mat-label>
        <textarea matInput formControlName="notes" rows="2" [maxlength]="max"></textarea>
        <mat-error>{{ message('notes') }}</mat-error>
      </mat-form-field>
    </fieldset>
  `,
  styles: `
    .zones {
      border: 0;
      margin: 16px 0 8px;
      padding: 0;
    }
    legend {
      font: var(--mat-sys-title-small);
      margin-bottom: 4px;
    }
    .hint {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    mat-form-field {
      width: 100%;
    }
  `,
})
export class RoomMrZones {
  readonly zones = input.required<MrZonesForm>();
  protected readonly acrZones = ACR_ZONES;
  protected readonly kitZones = KIT_ZONES;
  protected readonly kitZoneLabels = KIT_ZONE_LABELS;
  protected readonly max = MR_ZONE_TEXT_MAX;

  protected message(field: 'kitKeptIn' | 'zoneIvAreas' | 'notes'): string {
    return fieldMessage(this.zones().controls[field]);
  }
}
