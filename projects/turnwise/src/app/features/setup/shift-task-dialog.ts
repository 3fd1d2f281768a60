import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { SHIFT_TASK_LABEL_MAX, SHIFT_TASK_MINUTES, shiftTaskUpdateSchema, type ShiftTaskView } from '@shared/api/shift-tasks';
import { buildRule, readRule } from '@shared/shift-tasks/rule-builder';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { action } from '../../core/state/action';
import { Clock } from '../../core/time/clock';
import { fieldMessage, schemaValidator, submitForm } from './form-problems';
import { fieldsOf, RuleBuilder, ruleForm, tomorrowIn } from './rule-builder';
import { ShiftTasksApi } from './shift-tasks-api';

export interface ShiftTaskDialogData {
  task: ShiftTaskView | null;
  rooms: { id: number; name: string }[];
}

/**
 * Add or edit a room's recurring task. The rule is built from fields, or (a rule the builder
 * cannot show, e.g. monthly on the first Friday) edited as RFC 5545 text; the API's 422 problems
 * appear under their fields, a rule's under the rule.
 */
@Component({
  selector: 'tw-shift-task-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, RuleBuilder],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ task ? 'Edit ' + task.label : 'Add a shift task' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        @if (!task) {
          <mat-form-field>
            <mat-label>Room</mat-label>
            <mat-select formControlName="roomId" required>
              @for (room of data.rooms; track room.id) {
                <mat-option [value]="room.id">{{ room.name }}</mat-option>
              }
            </mat-select>
            <mat-error>{{ message('roomId') }}</mat-error>
          </mat-form-field>
        } @else {
          <p class="room">Room: {{ task.roomName }}</p>
        }
        <mat-form-field>
          <mat-label>Task</mat-label>
          <input matInput formControlName="label" required [maxlength]="labelMax" cdkFocusInitial />
          <mat-hint>e.g. Workstation wipe-down, start of shift</mat-hint>
          <mat-error>{{ message('label') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Minutes it takes</mat-label>
          <input matInput type="number" formControlName="durationMinutes" [min]="minutes.min" [max]="minutes.max" step="1" required />
          <mat-error>{{ message('durationMinutes') }}</mat-error>
        </mat-form-field>
        @if (asText) {
          <mat-form-field>
            <mat-label>Rule (RFC 5545)</mat-label>
            <textarea matInput formControlName="ruleText" rows="3"></textarea>
            <mat-hint>This rule uses more than the builder shows: edit its DTSTART and RRULE lines</mat-hint>
            <mat-error>{{ message('ruleText') }}</mat-error>
          </mat-form-field>
        } @else {
          <tw-rule-builder [form]="rule" />
        }
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ task ? 'Save task' : 'Add task' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
  styles: `
    .room { margin: 0 0 8px; }
  `,
})
export class ShiftTaskDialog {
  private readonly api = inject(ShiftTasksApi);
  private readonly ref = inject(MatDialogRef<ShiftTaskDialog, ShiftTaskView>);
  protected readonly data = inject<ShiftTaskDialogData>(MAT_DIALOG_DATA);
  protected readonly task = this.data.task;
  protected readonly labelMax = SHIFT_TASK_LABEL_MAX;
  protected readonly minutes = SHIFT_TASK_MINUTES;
  protected readonly formError = signal<string | null>(null);
  private readonly builder = viewChild(RuleBuilder);

  private readonly readable = this.task ? readRule(this.task.rrule) : null;
  /** A stored rule the builder cannot show is edited as text. */
  protected readonly asText = !!this.task && this.readable === null;
  protected readonly rule = ruleForm(this.readable, tomorrowIn(inject(SiteSettingsService).settings()?.timezone ?? 'UTC', inject(Clock).now()));

  protected readonly form = new FormGroup({
    roomId: new FormControl<number | null>(this.data.rooms.length === 1 ? this.data.rooms[0]!.id : null, this.task ? [] : [Validators.required]),
    label: new FormControl(this.task?.label ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(SHIFT_TASK_LABEL_MAX)] }),
    durationMinutes: new FormControl(this.task?.durationMinutes ?? 5, {
      nonNullable: true,
      validators: [Validators.required, Validators.min(SHIFT_TASK_MINUTES.min), Validators.max(SHIFT_TASK_MINUTES.max)],
    }),
    // not named rrule: the API's problems with a rule are shown whole, under the form, in either mode
    ruleText: new FormControl(this.task?.rrule ?? '', { nonNullable: true, validators: this.asText ? [schemaValidator(shiftTaskUpdateSchema.shape.rrule)] : [] }),
    // the builder's fields, so an invalid one stops the save like any other
    builder: this.rule,
  });

  protected readonly saving = action(() => {
    const value = this.form.getRawValue();
    const body = {
      label: value.label.trim(),
      durationMinutes: Number(value.durationMinutes),
      rrule: this.asText ? value.ruleText.trim() : (this.builder()?.rule() ?? buildRule(fieldsOf(this.rule))),
    };
    return this.task ? this.api.update(this.task.id, body) : this.api.create({ ...body, roomId: value.roomId ?? 0 });
  });

  protected message(field: 'roomId' | 'label' | 'durationMinutes' | 'ruleText'): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    const saved = await submitForm(this.form, this.saving, this.formError);
    if (saved) this.ref.close(saved.value);
  }
}
