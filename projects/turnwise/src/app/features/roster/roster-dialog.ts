import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import type { ApiError, Problem } from '@shared/api/errors';
import type { DayRoster, RosterRow } from '@shared/api/roster';
import { action } from '../../core/state/action';
import { longDay } from '../../shared/ui/site-time';
import { showProblems } from '../setup/form-problems';
import { RosterApi } from './roster-api';
import { rosterForm, rowsOf, type RosterForm } from './roster-form';
import { RosterRows } from './roster-rows';

export interface RosterDialogData {
  date: string;
  /** The day's rooms, for the rooms each person covers. */
  rooms: readonly { id: number; name: string }[];
  /** A role that may not change the roster sees it read-only. */
  readOnly: boolean;
}

const SOURCE_WORDS: Readonly<Record<DayRoster['source'], string>> = {
  day: 'Saved for this day.',
  weekly: "From the weekday's default roster (Setup → Rooms → Weekly roster). Saving here keeps a roster of this day's own.",
  none: "No roster for this day: each room's turnovers are planned with the room's own staff.",
};

/**
 * Who is on shift on a day (Day plan toolbar): rows of people or counts, their hours, breaks and
 * rooms. Saving replans the day (every open screen refetches) and goes into the day's history,
 * undoable; "Use the weekly default" drops the day's own roster. Closes with the saved roster.
 */
@Component({
  selector: 'tw-roster-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatProgressBarModule, RosterRows],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Roster for {{ dayName }}</h2>
    <mat-dialog-content>
      @if (roster(); as shown) {
        <p class="source" [attr.data-source]="shown.source">{{ sourceWords[shown.source] }}</p>
        <p class="walking">Walking between rooms: {{ shown.walkingMinutes }} min (Setup → Site).</p>
        @if (!data.readOnly) {
          <p class="file">
            <input #file type="file" accept=".csv,.xlsx,text/csv" hidden (change)="loadFile(file)" />
            <button mat-stroked-button type="button" class="load-file" [disabled]="busy()" (click)="file.click()">Load a roster file…</button>
            <span class="hint">CSV or .xlsx with columns name, role, count, start, end, breaks, rooms: the rows replace those below; nothing is saved until you save.</span>
          </p>
        }
        @if (fileErrors().length > 0) {
          <div class="file-errors" role="alert">
            <p>The file was not loaded: {{ fileErrors().length }} {{ fileErrors().length === 1 ? 'problem' : 'problems' }}.</p>
            <ul>
              @for (e of fileErrors(); track $index) {
                <li>{{ e.field }}: {{ e.message }}</li>
              }
            </ul>
          </div>
        }
        <form [formGroup]="form()" (ngSubmit)="save()" novalidate id="tw-roster-form">
          <tw-roster-rows [form]="form()" [rooms]="data.rooms" [readOnly]="data.readOnly" />
        </form>
      } @else if (loadError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the roster" />
      }
      @if (formError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      @if (!data.readOnly && roster()?.source === 'day') {
        <button mat-button type="button" class="use-weekly" [disabled]="busy()" (click)="useWeekly()">Use the weekly default</button>
      }
      <button mat-button type="button" mat-dialog-close>Close</button>
      @if (!data.readOnly) {
        <button mat-flat-button type="submit" form="tw-roster-form" class="save" [disabled]="busy() || !roster()">Save roster</button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    mat-dialog-content { min-width: min(60rem, 90vw); }
    .source, .walking { margin: 0 0 8px; color: var(--mat-sys-on-surface-variant); }
    .form-error, .file-errors { color: var(--mat-sys-error); }
    .file { display: flex; flex-wrap: wrap; align-items: center; gap: 8px 12px; margin: 0 0 12px; }
    .hint { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); flex: 1 1 20rem; }
  `,
})
export class RosterDialog {
  private readonly api = inject(RosterApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly ref = inject(MatDialogRef<RosterDialog, DayRoster>);
  protected readonly data = inject<RosterDialogData>(MAT_DIALOG_DATA);
  protected readonly dayName = longDay(this.data.date);
  protected readonly sourceWords = SOURCE_WORDS;
  protected readonly roster = signal<DayRoster | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly formError = signal<string | null>(null);
  /** A refused file's problems, "row 3, rooms: …" (the API names each by row and column). */
  protected readonly fileErrors = signal<Problem[]>([]);
  /** Rows loaded from a file, shown for review in place of the roster's until saved. */
  private readonly loaded = signal<RosterRow[] | null>(null);
  protected readonly form = computed<RosterForm>(() => {
    const form = rosterForm(this.fb, this.loaded() ?? this.roster()?.rows ?? []);
    if (this.data.readOnly) form.disable();
    return form;
  });

  protected readonly saving = action(() => this.api.saveDay(this.data.date, rowsOf(this.form())));
  protected readonly clearing = action(() => this.api.clearDay(this.data.date));
  private readonly previewing = signal(false);
  protected readonly busy = () => this.saving.pending() || this.clearing.pending() || this.previewing();

  constructor() {
    this.api.day(this.data.date).subscribe({
      next: (roster) => this.roster.set(roster),
      error: (error: { message: string }) => this.loadError.set(error.message),
    });
  }

  protected async save(): Promise<void> {
    const form = this.form();
    this.formError.set(null);
    if (form.invalid) {
      form.markAllAsTouched();
      this.formError.set('Check the marked fields.');
      return;
    }
    const result = await this.saving.run();
    if (result.status === 'done') this.ref.close(result.value);
    else this.formError.set(showProblems(form, result.error) ?? 'Check the marked fields.');
  }

  protected async loadFile(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.formError.set(null);
    this.fileErrors.set([]);
    this.previewing.set(true);
    this.api.previewFile(this.data.date, file).subscribe({
      next: (rows) => {
        this.previewing.set(false);
        this.loaded.set(rows);
      },
      error: (error: ApiError) => {
        this.previewing.set(false);
        const problems = (error.details as { problems?: Problem[] } | undefined)?.problems;
        if (error.code === 'validation_failed' && problems && problems.length > 0) this.fileErrors.set(problems);
        else this.formError.set(error.message);
      },
    });
  }

  protected async useWeekly(): Promise<void> {
    this.formError.set(null);
    const result = await this.clearing.run();
    if (result.status === 'done') this.ref.close(result.value);
    else this.formError.set(result.error.message);
  }
}
