import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { WEEKDAYS, type RoomDay } from '@shared/api/room-hours';
import { fieldMessage } from './form-problems';

export type DayForm = FormGroup<{
  weekday: FormControl<number>;
  closed: FormControl<boolean>;
  opensAt: FormControl<string>;
  closesAt: FormControl<string>;
}>;
export type WeekForm = FormArray<DayForm>;

/** The API's rule (`roomDaySchema`): the same time twice is no hours at all; before the opening is after midnight. */
const differsFromOpening: ValidatorFn = (control) => {
  const opensAt = control.parent?.get('opensAt')?.value;
  return opensAt && control.value === opensAt ? { schema: 'must differ from the opening time (mark a day without hours closed)' } : null;
};

function dayForm(day: RoomDay): DayForm {
  const form: DayForm = new FormGroup({
    weekday: new FormControl(day.weekday, { nonNullable: true }),
    closed: new FormControl(day.closed, { nonNullable: true }),
    opensAt: new FormControl(day.opensAt, { nonNullable: true, validators: Validators.required }),
    closesAt: new FormControl(day.closesAt, { nonNullable: true, validators: [Validators.required, differsFromOpening] }),
  });
  const { closed, opensAt, closesAt } = form.controls;
  opensAt.valueChanges.subscribe(() => closesAt.updateValueAndValidity());
  // a closed day's times are kept (for reopening it) but neither checked nor edited
  const follow = (isClosed: boolean) => {
    for (const time of [opensAt, closesAt]) {
      if (isClosed) time.disable({ emitEvent: false });
      else time.enable({ emitEvent: false });
    }
  };
  follow(day.closed);
  closed.valueChanges.subscribe(follow);
  return form;
}

/** Monday to Sunday as a form, from a room's week (or the usual 07:00–19:00 for a new room). */
export function weekForm(week: readonly RoomDay[] | undefined): WeekForm {
  const days = week?.length === 7 ? week : WEEKDAYS.map(({ weekday }) => ({ weekday, closed: false, opensAt: '07:00', closesAt: '19:00' }));
  return new FormArray(days.map(dayForm));
}

/** Opening hours per weekday: a row a day with a "closed" box, and Monday's hours copied to the other weekdays in one go. */
@Component({
  selector: 'tw-room-week',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <fieldset class="week">
      <legend>Opening hours</legend>
      <p class="hint">A closing time before the opening is after midnight.</p>
      @for (day of week().controls; track day; let i = $index) {
        <div class="day" [formGroup]="day">
          <span class="name" [id]="'weekday-' + i">{{ names[i].name }}</span>
          <mat-checkbox formControlName="closed" [attr.aria-describedby]="'weekday-' + i">Closed</mat-checkbox>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Opens</mat-label>
            <input matInput type="time" formControlName="opensAt" [attr.aria-label]="names[i].name + ' opens at'" />
            <mat-error>{{ message(day, 'opensAt') }}</mat-error>
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Closes</mat-label>
            <input matInput type="time" formControlName="closesAt" [attr.aria-label]="names[i].name + ' closes at'" />
            <mat-error>{{ message(day, 'closesAt') }}</mat-error>
          </mat-form-field>
        </div>
        @if (i === 0) {
          <button mat-button type="button" class="copy" (click)="copyMonday()">Copy Monday to Tuesday–Friday</button>
        }
      }
    </fieldset>
  `,
  styles: `
    .week {
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
    .day {
      display: grid;
      grid-template-columns: 6.5rem 6.5rem 1fr 1fr;
      gap: 8px;
      align-items: start;
      margin-bottom: 8px;
    }
    .name,
    mat-checkbox {
      padding-top: 16px;
    }
    .copy {
      margin: 0 0 8px;
    }
  `,
})
export class RoomWeek {
  readonly week = input.required<WeekForm>();
  protected readonly names = WEEKDAYS;

  protected message(day: DayForm, field: 'opensAt' | 'closesAt'): string {
    return fieldMessage(day.controls[field]);
  }

  protected copyMonday(): void {
    const monday = this.week().at(0).getRawValue();
    for (let i = 1; i <= 4; i++) this.week().at(i).patchValue({ closed: monday.closed, opensAt: monday.opensAt, closesAt: monday.closesAt });
  }
}

/** The week in a line, runs of equal days joined: "Mon–Fri 07:00–19:00 · Sat 08:00–12:30 · Sun closed". */
export function weekSummary(week: readonly RoomDay[]): string {
  const hours = (d: RoomDay) => (d.closed ? 'closed' : `${d.opensAt}–${d.closesAt}`);
  const runs: { from: number; to: number; hours: string }[] = [];
  for (const day of week) {
    const last = runs[runs.length - 1];
    if (last && last.hours === hours(day) && last.to === day.weekday - 1) last.to = day.weekday;
    else runs.push({ from: day.weekday, to: day.weekday, hours: hours(day) });
  }
  const short = (weekday: number) => WEEKDAYS[weekday - 1]!.short;
  return runs.map((r) => `${short(r.from)}${r.to > r.from ? `–${short(r.to)}` : ''} ${r.hours}`).join(' · ');
}
