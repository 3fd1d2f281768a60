import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { DateTime } from 'luxon';
import { startWith, switchMap } from 'rxjs';

import { nextOccurrences } from '@shared/shift-tasks/recurrence';
import { BUILDER_FREQS, buildRule, RULE_DAY_NAMES, RULE_DAYS, ruleText, type BuilderFreq, type RuleDay, type RuleFields } from '@shared/shift-tasks/rule-builder';
import { ruleProblems } from '@shared/shift-tasks/rule-check';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { Clock } from '../../core/time/clock';
import { fieldMessage } from './form-problems';

export type RuleEnd = 'never' | 'count' | 'until';

export type RuleForm = FormGroup<{
  freq: FormControl<BuilderFreq>;
  interval: FormControl<number>;
  byDay: FormGroup<Record<RuleDay, FormControl<boolean>>>;
  time: FormControl<string>;
  starts: FormControl<string>;
  end: FormControl<RuleEnd>;
  count: FormControl<number>;
  until: FormControl<string>;
}>;

/** The builder's form, from a stored rule's fields or, for a new task, every day at 07:00 from `starts`. */
export function ruleForm(fields: RuleFields | null, starts: string): RuleForm {
  const f = fields ?? { freq: 'DAILY', interval: 1, byDay: [], time: '07:00', starts, count: null, until: null };
  const day = (d: RuleDay) => new FormControl(f.byDay.includes(d), { nonNullable: true });
  return new FormGroup({
    freq: new FormControl(f.freq, { nonNullable: true }),
    interval: new FormControl(f.interval, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(99)] }),
    byDay: new FormGroup({ MO: day('MO'), TU: day('TU'), WE: day('WE'), TH: day('TH'), FR: day('FR'), SA: day('SA'), SU: day('SU') }),
    time: new FormControl(f.time, { nonNullable: true, validators: Validators.required }),
    starts: new FormControl(f.starts, { nonNullable: true, validators: Validators.required }),
    end: new FormControl<RuleEnd>(f.count !== null ? 'count' : f.until !== null ? 'until' : 'never', { nonNullable: true }),
    count: new FormControl(f.count ?? 10, { nonNullable: true, validators: [Validators.min(1), Validators.max(9999)] }),
    until: new FormControl(f.until ?? '', { nonNullable: true }),
  });
}

/** The builder's fields as the form holds them (an end not chosen is left out). */
export function fieldsOf(form: RuleForm): RuleFields {
  const v = form.getRawValue();
  return {
    freq: v.freq,
    interval: Number(v.interval) || 1,
    byDay: RULE_DAYS.filter((d) => v.byDay[d]),
    time: v.time,
    starts: v.starts,
    count: v.end === 'count' ? Number(v.count) || 1 : null,
    until: v.end === 'until' && v.until ? v.until : null,
  };
}

const UNITS: Record<BuilderFreq, string> = { DAILY: 'days', WEEKLY: 'weeks', MONTHLY: 'months' };
const FREQ_LABELS: Record<BuilderFreq, string> = { DAILY: 'Daily', WEEKLY: 'Weekly', MONTHLY: 'Monthly' };

/**
 * A recurrence rule built from a few fields (how often, every how many, which weekdays, what time,
 * from when, until when), with the next five occurrences computed as the server will: the same
 * shared rrule code, at the site's zone, from now.
 */
@Component({
  selector: 'tw-rule-builder',
  imports: [ReactiveFormsModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatRadioModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <fieldset class="rule" [formGroup]="form()">
      <legend>When it repeats</legend>
      <div class="row">
        <mat-form-field>
          <mat-label>Repeats</mat-label>
          <mat-select formControlName="freq">
            @for (freq of freqs; track freq) {
              <mat-option [value]="freq">{{ freqLabels[freq] }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Every</mat-label>
          <input matInput type="number" formControlName="interval" min="1" max="99" step="1" />
          <span matTextSuffix>&nbsp;{{ units[value().freq] }}</span>
          <mat-error>{{ message('interval') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Time of day</mat-label>
          <input matInput type="time" formControlName="time" />
          <mat-error>{{ message('time') }}</mat-error>
        </mat-form-field>
      </div>
      @if (value().freq === 'WEEKLY') {
        <div class="days" formGroupName="byDay" role="group" aria-label="On these weekdays">
          @for (day of days; track day) {
            <mat-checkbox [formControlName]="day">{{ dayNames[day] }}</mat-checkbox>
          }
        </div>
      }
      <div class="row">
        <mat-form-field>
          <mat-label>Starts</mat-label>
          <input matInput type="date" formControlName="starts" />
          @if (value().freq === 'MONTHLY') {
            <mat-hint>Repeats on this day of the month</mat-hint>
          }
          <mat-error>{{ message('starts') }}</mat-error>
        </mat-form-field>
      </div>
      <mat-radio-group formControlName="end" class="ends" aria-label="Ends">
        <mat-radio-button value="never">Never ends</mat-radio-button>
        <mat-radio-button value="count">Ends after a number of times</mat-radio-button>
        <mat-radio-button value="until">Ends on a date</mat-radio-button>
      </mat-radio-group>
      @if (value().end === 'count') {
        <mat-form-field>
          <mat-label>Times</mat-label>
          <input matInput type="number" formControlName="count" min="1" step="1" />
          <mat-error>{{ message('count') }}</mat-error>
        </mat-form-field>
      } @else if (value().end === 'until') {
        <mat-form-field>
          <mat-label>Last day</mat-label>
          <input matInput type="date" formControlName="until" />
        </mat-form-field>
      }
    </fieldset>
    <section class="preview" aria-live="polite" aria-labelledby="rule-preview-title">
      <h3 id="rule-preview-title">{{ words() }}</h3>
      @if (problems().length > 0) {
        <ul class="problems">
          @for (problem of problems(); track problem) {
            <li>{{ problem }}</li>
          }
        </ul>
      } @else if (next().length === 0) {
        <p class="none">No occurrence from now on: this rule has ended.</p>
      } @else {
        <p class="lead">Next {{ next().length === 1 ? 'occurrence' : next().length + ' occurrences' }} ({{ zone() }}):</p>
        <ol class="next">
          @for (when of next(); track $index) {
            <li>{{ when }}</li>
          }
        </ol>
      }
      <p class="text">Rule (RFC 5545): <code>{{ rule() }}</code></p>
    </section>
  `,
  styles: `
    .rule { border: 0; margin: 0; padding: 0; }
    legend { font: var(--mat-sys-title-small); margin-bottom: 4px; }
    .row { display: flex; flex-wrap: wrap; gap: 0 12px; }
    .row mat-form-field { flex: 1 1 140px; }
    .days { display: flex; flex-wrap: wrap; gap: 0 8px; margin-bottom: 8px; }
    .ends { display: flex; flex-wrap: wrap; gap: 0 12px; margin-bottom: 8px; }
    .preview {
      padding: 8px 12px;
      border-left: 4px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container);
      h3 { margin: 0 0 4px; font: var(--mat-sys-title-small); }
      ol, ul { margin: 0; padding-left: 1.5em; }
      p { margin: 4px 0; }
      .problems { color: var(--mat-sys-error); }
      code { white-space: pre-wrap; word-break: break-all; }
    }
  `,
})
export class RuleBuilder {
  private readonly clock = inject(Clock);
  private readonly site = inject(SiteSettingsService);
  readonly form = input.required<RuleForm>();

  protected readonly freqs = BUILDER_FREQS;
  protected readonly freqLabels = FREQ_LABELS;
  protected readonly units = UNITS;
  protected readonly days = RULE_DAYS;
  protected readonly dayNames = RULE_DAY_NAMES;

  /** Each change of the form (which arrives as an input) as a signal. */
  private readonly changes = toSignal(toObservable(this.form).pipe(switchMap((form) => form.valueChanges.pipe(startWith(null)))));
  protected readonly value = computed(() => {
    this.changes();
    return this.form().getRawValue();
  });
  private readonly fields = computed(() => {
    this.value();
    return fieldsOf(this.form());
  });
  readonly rule = computed(() => buildRule(this.fields()));
  protected readonly words = computed(() => ruleText(this.fields()));
  protected readonly zone = computed(() => this.site.settings()?.timezone ?? 'UTC');
  protected readonly problems = computed(() => ruleProblems(this.rule()));
  protected readonly next = computed(() => {
    if (this.problems().length > 0) return [];
    const zone = this.zone();
    return nextOccurrences(this.rule(), { zone, from: new Date(this.clock.minute()), n: 5 }).map((t) => t.setLocale('en-GB').toFormat('ccc d LLL yyyy, HH:mm'));
  });

  protected message(field: 'interval' | 'time' | 'starts' | 'count'): string {
    return fieldMessage(this.form().controls[field]);
  }
}

/** Tomorrow at the site: a new task's first day, so nothing falls due before it exists. */
export function tomorrowIn(zone: string, nowMs: number): string {
  return DateTime.fromMillis(nowMs, { zone }).plus({ days: 1 }).toISODate()!;
}
