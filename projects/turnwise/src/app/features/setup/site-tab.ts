import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { SNUG_MARGIN_MINUTES } from '@shared/api/limits';
import { WALKING_MINUTES } from '@shared/api/roster';
import { DEFAULT_SETTINGS, settingsInputSchema, type SiteSettings } from '@shared/api/settings';
import { action } from '../../core/state/action';
import { fieldMessage, schemaValidator, submitForm } from './form-problems';
import { Hl7MappingForm } from './hl7-mapping-form';
import { SetupApi } from './setup-api';

/** Setup → Site: the department's name, its IANA time zone, the snug margin, the walking time between rooms, the notices sender, the day-before notice's time and the booking feed's mapping. */
@Component({
  selector: 'tw-site-tab',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, Hl7MappingForm],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-label="Site">
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Site name</mat-label>
        <input matInput formControlName="siteName" required maxlength="80" />
        <mat-error>{{ message('siteName') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Time zone</mat-label>
        <input matInput formControlName="timezone" required list="tw-zones" autocomplete="off" />
        <datalist id="tw-zones">
          @for (zone of zones; track zone) {
            <option [value]="zone"></option>
          }
        </datalist>
        <mat-hint>IANA name, e.g. America/Chicago: every day, time and day-list import follows it</mat-hint>
        <mat-error>{{ message('timezone') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Snug margin (minutes)</mat-label>
        <input matInput type="number" formControlName="snugMarginMinutes" [min]="snugMargin.min" [max]="snugMargin.max" step="1" required />
        <mat-hint>A gap that fits with less than this to spare is marked snug</mat-hint>
        <mat-error>{{ message('snugMarginMinutes') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Walking time between rooms (minutes)</mat-label>
        <input matInput type="number" formControlName="walkingMinutes" [min]="walking.min" [max]="walking.max" step="1" required />
        <mat-hint>Roster: room to room; 3 is common practice (no source)</mat-hint>
        <mat-error>{{ message('walkingMinutes') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Notices e-mail sender</mat-label>
        <input matInput type="email" formControlName="noticesSender" maxlength="254" />
        <mat-hint>The From address of notices Turnwise e-mails; leave empty until your mail team gives one</mat-hint>
        <mat-error>{{ message('noticesSender') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Day-before notice at</mat-label>
        <input matInput type="time" formControlName="dayBeforeNoticeAt" required />
        <mat-hint>Site time the charge technologists get tomorrow's problem gaps and isolation cases</mat-hint>
        <mat-error>{{ message('dayBeforeNoticeAt') }}</mat-error>
      </mat-form-field>
      @if (formError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
      @if (saved()) {
        <p role="status">Saved. Open day plans recompute with these settings.</p>
      }
      <div><button mat-flat-button type="submit" [disabled]="saving.pending() || loading()">Save site</button></div>
    </form>
    <tw-hl7-mapping-form />
  `,
  styles: `
    :host { display: block; padding-top: 16px; }
    form { display: flex; flex-direction: column; gap: 12px; max-width: 520px; }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class SiteTab {
  private readonly api = inject(SetupApi);
  protected readonly zones = supportedZones();
  protected readonly snugMargin = SNUG_MARGIN_MINUTES;
  protected readonly walking = WALKING_MINUTES;
  protected readonly formError = signal<string | null>(null);
  protected readonly saved = signal(false);
  protected readonly loading = signal(true);
  protected readonly form = inject(NonNullableFormBuilder).group({
    siteName: ['', [Validators.required, Validators.maxLength(80)]],
    timezone: ['', Validators.required],
    snugMarginMinutes: [3, [Validators.required, Validators.min(SNUG_MARGIN_MINUTES.min), Validators.max(SNUG_MARGIN_MINUTES.max)]],
    walkingMinutes: [WALKING_MINUTES.default as number, [Validators.required, Validators.min(WALKING_MINUTES.min), Validators.max(WALKING_MINUTES.max)]],
    noticesSender: ['', [Validators.email, Validators.maxLength(254)]],
    dayBeforeNoticeAt: [DEFAULT_SETTINGS.dayBeforeNoticeAt, [Validators.required, schemaValidator(settingsInputSchema(() => true).shape.dayBeforeNoticeAt)]],
  });
  protected readonly saving = action(() => {
    const value = this.form.getRawValue();
    return this.api.saveSettings({ ...value, noticesSender: value.noticesSender.trim(), snugMarginMinutes: Number(value.snugMarginMinutes), walkingMinutes: Number(value.walkingMinutes) });
  });

  constructor() {
    this.api.settings().subscribe({
      next: (settings: SiteSettings) => {
        this.form.setValue({
          siteName: settings.siteName,
          timezone: settings.timezone,
          snugMarginMinutes: settings.snugMarginMinutes,
          walkingMinutes: settings.walkingMinutes ?? WALKING_MINUTES.default,
          noticesSender: settings.noticesSender ?? '',
          dayBeforeNoticeAt: settings.dayBeforeNoticeAt ?? DEFAULT_SETTINGS.dayBeforeNoticeAt,
        });
        this.loading.set(false);
      },
      error: (error: { message: string }) => this.formError.set(error.message),
    });
  }

  protected message(field: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    this.saved.set(false);
    if (await submitForm(this.form, this.saving, this.formError)) this.saved.set(true);
  }
}

/** The browser's list of IANA zones, for suggestions only (the server checks the name). */
function supportedZones(): string[] {
  const intl = Intl as unknown as { supportedValuesOf?: (key: string) => string[] };
  return intl.supportedValuesOf?.('timeZone') ?? [];
}
