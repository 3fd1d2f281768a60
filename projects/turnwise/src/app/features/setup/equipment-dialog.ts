import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import {
  EQUIPMENT_KINDS,
  EQUIPMENT_KIND_LABELS,
  MR_MARKINGS,
  MR_MARKING_LABELS,
  type EquipmentItem,
  type EquipmentKind,
  type MrMarking,
} from '@shared/api/equipment';
import { action } from '../../core/state/action';
import { fieldMessage, submitForm } from './form-problems';
import { SetupApi } from './setup-api';

/** Add or edit an item with its ASTM F2503 marking; MR Conditional asks for the label's conditions. */
@Component({
  selector: 'tw-equipment-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ item ? 'Edit ' + item.name : 'Add equipment' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required maxlength="80" />
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Kind</mat-label>
          <mat-select formControlName="kind" required>
            @for (kind of kinds; track kind) {
              <mat-option [value]="kind">{{ kindLabels[kind] }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ message('kind') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>MR marking (ASTM F2503)</mat-label>
          <mat-select formControlName="marking" required>
            @for (marking of markings; track marking) {
              <mat-option [value]="marking">{{ markingLabels[marking] }}</mat-option>
            }
          </mat-select>
          <mat-hint>As printed on the item or its label; unmarked items stay out of MR rooms</mat-hint>
          <mat-error>{{ message('marking') }}</mat-error>
        </mat-form-field>
        @if (marking() === 'mr-conditional') {
          <mat-form-field>
            <mat-label>Conditions</mat-label>
            <textarea matInput formControlName="conditions" rows="2" maxlength="500" required></textarea>
            <mat-hint>From the label: field strength, spatial gradient, anything else it states</mat-hint>
            <mat-error>{{ message('conditions') }}</mat-error>
          </mat-form-field>
        }
        <mat-form-field>
          <mat-label>Notes</mat-label>
          <textarea matInput formControlName="notes" rows="2" maxlength="500"></textarea>
          <mat-error>{{ message('notes') }}</mat-error>
        </mat-form-field>
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ item ? 'Save item' : 'Add item' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
})
export class EquipmentDialog {
  private readonly api = inject(SetupApi);
  private readonly ref = inject(MatDialogRef<EquipmentDialog, EquipmentItem>);
  protected readonly item = inject<EquipmentItem | null>(MAT_DIALOG_DATA, { optional: true });
  protected readonly kinds = EQUIPMENT_KINDS;
  protected readonly kindLabels = EQUIPMENT_KIND_LABELS;
  protected readonly markings = MR_MARKINGS;
  protected readonly markingLabels = MR_MARKING_LABELS;
  protected readonly formError = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.item?.name ?? '', [Validators.required, Validators.maxLength(80)]],
    kind: [this.item?.kind ?? ('cart' as EquipmentKind), Validators.required],
    marking: [this.item?.marking ?? ('not-marked' as MrMarking), Validators.required],
    conditions: [this.item?.conditions ?? '', Validators.maxLength(500)],
    notes: [this.item?.notes ?? '', Validators.maxLength(500)],
  });
  protected readonly marking = toSignal(this.form.controls.marking.valueChanges, { initialValue: this.form.controls.marking.value });

  protected readonly saving = action(() => {
    const value = this.form.getRawValue();
    const body = { ...value, conditions: value.marking === 'mr-conditional' ? value.conditions : '' };
    return this.item ? this.api.updateEquipment(this.item.id, body) : this.api.createEquipment(body);
  });

  protected message(field: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    const { conditions } = this.form.controls;
    if (this.marking() === 'mr-conditional' && conditions.value.trim() === '') {
      // the same rule as the API's: an MR Conditional item is only safe within its conditions
      conditions.setErrors({ server: 'an MR Conditional item needs its conditions from the label' });
      conditions.markAsTouched();
    }
    const saved = await submitForm(this.form, this.saving, this.formError);
    if (saved) this.ref.close(saved.value);
  }
}
