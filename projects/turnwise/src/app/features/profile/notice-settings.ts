import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';

import { NOTICE_KIND_LABELS, NOTICE_KINDS, noticePreferencesSchema, type NoticeKind, type NoticePreferences } from '@shared/api/notices';
import { showsOwnErrors } from '../../core/http/shows-own-errors';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { fieldMessage, schemaValidator, submitForm } from '../setup/form-problems';

/**
 * One's own e-mail address and which notices to receive (`GET/PUT /api/profile/notices`). The
 * address is checked by the API's own schema; the API's 422 problems land on their fields.
 */
@Component({
  selector: 'tw-notice-settings',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSlideToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-labelledby="notices-heading">
      <h2 id="notices-heading">E-mail notices</h2>
      @if (prefs.status() === 'loading') {
        <p role="status">Loading your notice settings…</p>
      } @else if (prefs.status() === 'failed') {
        <p class="form-error" role="alert">{{ prefs.error()?.message }}</p>
      }
      <mat-form-field>
        <mat-label>E-mail address</mat-label>
        <input matInput type="email" formControlName="email" autocomplete="email" />
        <mat-hint>Leave empty to receive no e-mail at all</mat-hint>
        <mat-error>{{ message(form.controls.email) }}</mat-error>
      </mat-form-field>
      <fieldset formGroupName="kinds">
        <legend>Send me</legend>
        @for (kind of kinds; track kind) {
          <mat-slide-toggle [formControlName]="kind" [attr.data-kind]="kind">{{ labels[kind] }}</mat-slide-toggle>
        }
      </fieldset>
      @if (formError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
      @if (saved()) {
        <p role="status">Your notice settings are saved.</p>
      }
      <div><button mat-flat-button type="submit" [disabled]="saving.pending() || prefs.status() !== 'loaded'">Save notice settings</button></div>
    </form>
  `,
  styles: `
    form { display: flex; flex-direction: column; gap: 8px; }
    h2 { margin: 24px 0 0; font-size: 1.25rem; }
    fieldset { border: 0; padding: 0; margin: 0; display: flex; flex-direction: column; gap: 12px; }
    legend { padding: 0 0 8px; color: var(--mat-sys-on-surface-variant); }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class NoticeSettings {
  private readonly http = inject(HttpClient);
  protected readonly kinds = NOTICE_KINDS;
  protected readonly labels = NOTICE_KIND_LABELS;
  protected readonly formError = signal<string | null>(null);
  protected readonly saved = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', schemaValidator(noticePreferencesSchema.shape.email)],
    kinds: inject(NonNullableFormBuilder).group(
      Object.fromEntries(NOTICE_KINDS.map((k) => [k, new FormControl(true, { nonNullable: true })])) as Record<NoticeKind, FormControl<boolean>>,
    ),
  });
  protected readonly prefs = serverState(() => this.http.get<NoticePreferences>('/api/profile/notices', { context: showsOwnErrors() }), 'Your notice settings could not be shown.');
  protected readonly saving = action(() => {
    const { email, kinds } = this.form.getRawValue();
    return this.http.put<NoticePreferences>('/api/profile/notices', { email: email.trim(), kinds }, { context: showsOwnErrors() });
  });

  constructor() {
    this.prefs.show('mine');
    effect(() => {
      const value = this.prefs.value();
      if (value) this.form.reset({ email: value.email ?? '', kinds: value.kinds });
    });
  }

  protected message(control: FormControl): string {
    return fieldMessage(control);
  }

  protected async save(): Promise<void> {
    this.saved.set(false);
    const done = await submitForm(this.form, this.saving, this.formError);
    if (!done) return;
    this.prefs.set(done.value);
    this.saved.set(true);
  }
}
