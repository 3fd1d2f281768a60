import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { map } from 'rxjs';

import { AIR_CHANGES_PER_HOUR, ROOM_NAME_MAX, TURNOVER_STAFF } from '@shared/api/limits';
import type { RoomDay } from '@shared/api/room-hours';
import { HL7_CODE_MAX, MODALITIES, type SetupRoom } from '@shared/api/rooms';
import { action } from '../../core/state/action';
import { CautionNote } from '../../shared/ui/caution-note';
import { fieldMessage, submitForm } from './form-problems';
import { mrZonesForm, RoomMrZones } from './room-mr-zones';
import { RoomWeek, weekForm } from './room-week';
import { SetupApi } from './setup-api';

/** Add or edit a room; the API's 422 problems appear under their fields. */
@Component({
  selector: 'tw-room-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, CautionNote, RoomMrZones, RoomWeek],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ room ? 'Edit ' + room.name : 'Add a room' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required [maxlength]="nameMax" cdkFocusInitial />
          <mat-hint>As the exam list names it, e.g. MR 2</mat-hint>
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Modality</mat-label>
          <mat-select formControlName="modality" required>
            @for (code of modalities; track code) {
              <mat-option [value]="code">{{ code }}</mat-option>
            }
          </mat-select>
          <mat-hint>DICOM modality code</mat-hint>
          <mat-error>{{ message('modality') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Air changes per hour</mat-label>
          <input matInput type="number" formControlName="airChangesPerHour" [min]="airChanges.min" [max]="airChanges.max" step="0.5" required />
          <mat-hint>As measured for the room; sets the air hold after airborne precautions</mat-hint>
          <mat-error>{{ message('airChangesPerHour') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Usual turnover staff</mat-label>
          <input matInput type="number" formControlName="staff" [min]="staff.min" [max]="staff.max" step="1" required />
          <mat-hint>People on a turnover, {{ staff.min }}–{{ staff.max }}</mat-hint>
          <mat-error>{{ message('staff') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>HL7 location code</mat-label>
          <input matInput formControlName="hl7Code" [maxlength]="hl7CodeMax" autocomplete="off" />
          <mat-hint>What the booking system sends for this room (AIL-3); matched before the room's name. Optional</mat-hint>
          <mat-error>{{ message('hl7Code') }}</mat-error>
        </mat-form-field>
        <tw-room-week [week]="form.controls.week" />
        @if (form.controls.week.errors?.['server']; as problem) {
          <p class="form-error" role="alert">Opening hours: {{ problem }}</p>
        }
        @if (isMr()) {
          <tw-room-mr-zones [zones]="form.controls.mrZones" />
          <tw-caution-note kind="mr" />
        }
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ room ? 'Save room' : 'Add room' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
})
export class RoomDialog {
  private readonly api = inject(SetupApi);
  private readonly ref = inject(MatDialogRef<RoomDialog, SetupRoom>);
  protected readonly room = inject<SetupRoom | null>(MAT_DIALOG_DATA, { optional: true });
  protected readonly modalities = MODALITIES;
  protected readonly staff = TURNOVER_STAFF;
  protected readonly airChanges = AIR_CHANGES_PER_HOUR;
  protected readonly nameMax = ROOM_NAME_MAX;
  protected readonly hl7CodeMax = HL7_CODE_MAX;
  protected readonly formError = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.room?.name ?? '', [Validators.required, Validators.maxLength(ROOM_NAME_MAX)]],
    modality: [this.room?.modality ?? 'MR', Validators.required],
    airChangesPerHour: [this.room?.airChangesPerHour ?? 12, [Validators.required, Validators.min(AIR_CHANGES_PER_HOUR.min), Validators.max(AIR_CHANGES_PER_HOUR.max)]],
    staff: [this.room?.staff ?? 1, [Validators.required, Validators.min(TURNOVER_STAFF.min), Validators.max(TURNOVER_STAFF.max)]],
    hl7Code: [this.room?.hl7Code ?? '', [Validators.maxLength(HL7_CODE_MAX)]],
    week: weekForm(this.room?.week),
    mrZones: mrZonesForm(this.room?.mrZones),
  });
  protected readonly isMr = toSignal(this.form.controls.modality.valueChanges.pipe(map((m) => m === 'MR')), { initialValue: this.form.controls.modality.value === 'MR' });

  protected readonly saving = action(() => {
    const { mrZones, ...value } = this.form.getRawValue();
    const body = {
      ...value,
      // the zone layout belongs to MR rooms only (the API refuses it for others)
      ...(value.modality === 'MR' ? { mrZones } : {}),
      ...this.usualHours(value.week),
      name: value.name.trim(),
      airChangesPerHour: Number(value.airChangesPerHour),
      staff: Number(value.staff),
    };
    return this.room ? this.api.updateRoom(this.room.id, body) : this.api.createRoom(body);
  });

  /**
   * The room's usual hours, for weekdays without their own (none, once a week is saved) and for
   * a new room's default shift tasks: kept on an edit; a new room takes its first open weekday
   * that closes the same day.
   */
  private usualHours(week: RoomDay[]): { opensAt: string; closesAt: string } {
    if (this.room) return { opensAt: this.room.opensAt, closesAt: this.room.closesAt };
    const day = week.find((d) => !d.closed && d.closesAt > d.opensAt);
    return day ? { opensAt: day.opensAt, closesAt: day.closesAt } : { opensAt: '07:00', closesAt: '19:00' };
  }

  protected message(field: 'name' | 'modality' | 'airChangesPerHour' | 'staff' | 'hl7Code'): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    const saved = await submitForm(this.form, this.saving, this.formError);
    if (saved) this.ref.close(saved.value);
  }
}
