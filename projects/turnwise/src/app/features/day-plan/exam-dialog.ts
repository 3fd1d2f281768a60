import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { hasErrorCode } from '@shared/api/errors';
import type { PlanExam, PlannedDay } from '@shared/api/plan';
import { EXAM_LIST_LIMITS, MOBILITIES, PRECAUTIONS } from '@shared/exam-list';
import { action } from '../../core/state/action';
import { fieldMessage, showProblems } from '../setup/form-problems';
import { DayPlanService } from './day-plan-service';
import { PinToggle } from './pin-toggle';

/** What the dialog opens on: the day, its rooms, and the exam to edit (none to add one). */
export interface ExamDialogData {
  date: string;
  rooms: readonly { id: number; name: string }[];
  exam?: PlanExam | null;
  /** For a role that may not move slots: the exam's fields shown, nothing to save or cancel. */
  readOnly?: boolean;
  /** The pin toggle ("make the day fit" never moves a pinned exam). */
  mayPin?: boolean;
}

/**
 * Add one exam to the day, or edit or cancel one, without importing the whole list. The fields
 * are the import's columns and the server checks them by the import's rules, so its 422 problems
 * (keyed by column) appear under the fields with the words an import would use. Closes with the
 * day's new plan.
 */
@Component({
  selector: 'tw-exam-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, PinToggle],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // The import's messages run longer than a field is wide ("Accession "X" is already on the list
  // for …"): let them wrap under the field instead of being cut at one line.
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  template: `
    <h2 mat-dialog-title>{{ readOnly ? exam?.accession : exam ? 'Edit ' + exam.accession : 'Add an exam to ' + data.date }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        @if (readOnly) {
          <p class="read-only">Shown read-only: schedulers and charge technologists change the day list.</p>
        }
        <mat-form-field>
          <mat-label>Accession</mat-label>
          <input matInput formControlName="accession" required [maxlength]="limits.accessionMaxChars" [attr.cdkFocusInitial]="readOnly ? null : ''" />
          <mat-error>{{ message('accession') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Room</mat-label>
          <mat-select formControlName="room" required>
            @for (room of data.rooms; track room.id) {
              <mat-option [value]="room.name">{{ room.name }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ message('room') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Start</mat-label>
          <input matInput type="time" formControlName="start" required />
          <mat-hint>Site time on {{ data.date }}</mat-hint>
          <mat-error>{{ message('start') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Duration (min)</mat-label>
          <input matInput type="number" formControlName="duration_min" required step="1" />
          <mat-error>{{ message('duration_min') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Procedure</mat-label>
          <input matInput formControlName="procedure" required />
          <mat-error>{{ message('procedure') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Coil</mat-label>
          <input matInput formControlName="coil" />
          <mat-error>{{ message('coil') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Precaution</mat-label>
          <mat-select formControlName="precaution">
            @for (p of precautions; track p) {
              <mat-option [value]="p">{{ p }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ message('precaution') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Mobility</mat-label>
          <mat-select formControlName="mobility">
            @for (m of mobilities; track m) {
              <mat-option [value]="m">{{ m }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ message('mobility') }}</mat-error>
        </mat-form-field>
        <mat-checkbox formControlName="contrast">Contrast</mat-checkbox>
        <mat-form-field>
          <mat-label>Notes</mat-label>
          <textarea matInput formControlName="notes" rows="2"></textarea>
          <mat-error>{{ message('notes') }}</mat-error>
        </mat-form-field>
        @if (exam && !readOnly && data.mayPin) {
          <tw-pin-toggle [exam]="exam" />
        }
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        @if (readOnly) {
          <button mat-flat-button type="button" mat-dialog-close cdkFocusInitial>Close</button>
        } @else {
        @if (exam) {
          <button mat-button type="button" class="cancel-exam" [disabled]="busy()" (click)="cancelExam()">Cancel exam {{ exam.accession }}</button>
        }
        <button mat-button type="button" mat-dialog-close>Close</button>
        <button mat-flat-button type="submit" class="save" [disabled]="busy()">{{ exam ? 'Save exam' : 'Add exam' }}</button>
        }
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: grid; grid-template-columns: repeat(auto-fill, minmax(12rem, 1fr)); gap: 0 1rem; align-items: start; }
    .form-error { grid-column: 1 / -1; color: var(--mat-sys-error); }
    .read-only { grid-column: 1 / -1; margin: 0 0 12px; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class ExamDialog {
  private readonly api = inject(DayPlanService);
  private readonly ref = inject(MatDialogRef<ExamDialog, PlannedDay>);
  protected readonly data = inject<ExamDialogData>(MAT_DIALOG_DATA);
  protected readonly exam = this.data.exam ?? null;
  protected readonly readOnly = !!this.data.readOnly && !!this.exam;
  protected readonly limits = EXAM_LIST_LIMITS;
  protected readonly precautions = PRECAUTIONS;
  protected readonly mobilities = MOBILITIES;
  protected readonly formError = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    accession: [this.exam?.accession ?? '', Validators.required],
    room: [this.data.rooms.find((r) => r.id === this.exam?.roomId)?.name ?? this.data.rooms[0]?.name ?? '', Validators.required],
    // The plan's starts carry the site's offset, so their clock time is the site's.
    start: [this.exam?.start.slice(11, 16) ?? '', Validators.required],
    duration_min: [this.exam?.durationMinutes ?? 30, Validators.required],
    procedure: [this.exam?.procedure ?? '', Validators.required],
    coil: [this.exam?.coil ?? ''],
    precaution: [this.exam?.precaution ?? 'none'],
    mobility: [this.exam?.mobility ?? 'ambulatory'],
    contrast: [this.exam?.contrast ?? false],
    notes: [this.exam?.notes ?? ''],
  });

  constructor() {
    if (this.readOnly) this.form.disable();
  }

  protected readonly saving = action(() => {
    const value = this.form.getRawValue();
    const body = { ...value, duration_min: String(value.duration_min) };
    return this.exam ? this.api.editExam(this.exam.id, { ...body, version: this.exam.version }) : this.api.addExam(this.data.date, body);
  });
  protected readonly cancelling = action(() => this.api.cancelExam(this.exam!.id, this.exam!.version));
  protected readonly busy = () => this.saving.pending() || this.cancelling.pending();

  protected message(field: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Check the marked fields.');
      return;
    }
    const result = await this.saving.run();
    if (result.status === 'done') this.ref.close(result.value);
    else this.formError.set(this.refusal(result.error));
  }

  protected async cancelExam(): Promise<void> {
    this.formError.set(null);
    const result = await this.cancelling.run();
    if (result.status === 'done') this.ref.close(result.value);
    else this.formError.set(this.refusal(result.error));
  }

  private refusal(error: Parameters<typeof showProblems>[1]): string | null {
    // Someone changed the exam first: say so; the day reloads behind the dialog.
    if (hasErrorCode(error, 'stale_version')) return `${error.message} Close this form and open the exam again.`;
    return showProblems(this.form, error) ?? 'Check the marked fields.';
  }
}
