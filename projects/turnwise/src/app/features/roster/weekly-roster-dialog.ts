import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { WEEKDAYS } from '@shared/api/room-hours';
import type { Room } from '@shared/api/rooms';
import type { WeeklyRoster } from '@shared/api/roster';
import { action } from '../../core/state/action';
import { showProblems } from '../setup/form-problems';
import { RosterApi } from './roster-api';
import { rosterForm, rowsOf, type RosterForm } from './roster-form';
import { RosterRows } from './roster-rows';

/**
 * Setup's weekly default roster: one roster per weekday, used on every day of that weekday that
 * has no roster of its own. Saved one weekday at a time (each save is one audit row).
 */
@Component({
  selector: 'tw-weekly-roster-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatButtonToggleModule, MatProgressBarModule, RosterRows],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Weekly roster</h2>
    <mat-dialog-content>
      <p class="intro">Who is usually on shift each weekday. A day with a roster of its own (Day plan → Roster) uses that instead.</p>
      <mat-button-toggle-group class="weekdays" aria-label="Weekday" [value]="weekday()" (change)="pick($event.value)" hideSingleSelectionIndicator>
        @for (day of weekdays; track day.weekday) {
          <mat-button-toggle [value]="day.weekday" [aria-label]="day.name">{{ day.short }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
      @if (weekly() && rooms(); as roomList) {
        <form [formGroup]="form()" (ngSubmit)="save()" novalidate id="tw-weekly-roster-form">
          <tw-roster-rows [form]="form()" [rooms]="roomList" />
        </form>
      } @else if (loadError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the weekly roster" />
      }
      @if (formError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
      @if (saved(); as name) {
        <p role="status">Saved the {{ name }} roster. Open day plans recompute with it.</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Close</button>
      <button mat-flat-button type="submit" form="tw-weekly-roster-form" class="save" [disabled]="saving.pending() || !weekly()">Save {{ weekdayName() }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    mat-dialog-content { min-width: min(60rem, 90vw); }
    .intro { margin: 0 0 12px; color: var(--mat-sys-on-surface-variant); }
    .weekdays { margin-bottom: 12px; flex-wrap: wrap; }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class WeeklyRosterDialog {
  private readonly api = inject(RosterApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly weekdays = WEEKDAYS;
  protected readonly weekday = signal(1);
  protected readonly weekdayName = computed(() => WEEKDAYS[this.weekday() - 1]!.name);
  protected readonly weekly = signal<WeeklyRoster | null>(null);
  protected readonly rooms = signal<Room[] | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly formError = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);
  protected readonly form = computed<RosterForm>(() => rosterForm(this.fb, this.weekly()?.weekdays.find((d) => d.weekday === this.weekday())?.rows ?? []));

  protected readonly saving = action(() => this.api.saveWeekday(this.weekday(), rowsOf(this.form())));

  constructor() {
    const failed = (error: { message: string }) => this.loadError.set(error.message);
    this.api.weekly().subscribe({ next: (weekly) => this.weekly.set(weekly), error: failed });
    this.api.rooms().subscribe({ next: (rooms) => this.rooms.set(rooms), error: failed });
  }

  protected pick(weekday: number): void {
    this.formError.set(null);
    this.saved.set(null);
    this.weekday.set(weekday);
  }

  protected async save(): Promise<void> {
    const form = this.form();
    this.formError.set(null);
    this.saved.set(null);
    if (form.invalid) {
      form.markAllAsTouched();
      this.formError.set('Check the marked fields.');
      return;
    }
    const name = this.weekdayName();
    const result = await this.saving.run();
    if (result.status === 'done') {
      this.weekly.set(result.value);
      this.saved.set(name);
    } else this.formError.set(showProblems(form, result.error) ?? 'Check the marked fields.');
  }
}
