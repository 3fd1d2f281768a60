import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { map } from 'rxjs';

import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, type UserAccount } from '@shared/api/users';
import { AuthService } from '../../core/auth/auth-service';
import { homeFor, roleLabel } from '../../core/auth/roles';
import { showsOwnErrors } from '../../core/http/shows-own-errors';
import { action } from '../../core/state/action';
import { fieldMessage, showProblems } from '../setup/form-problems';
import { CalendarFeeds } from './calendar-feeds';
import { NoticeSettings } from './notice-settings';

/** Both new-password fields must agree (client-side only: the API gets one). */
function sameAsNew(control: AbstractControl): ValidationErrors | null {
  const form = control.parent;
  return form && control.value !== form.get('newPassword')?.value ? { mismatch: true } : null;
}

/**
 * Every user's own account: who they are, changing their password (required after a reset; until
 * then nothing else shows), their e-mail notices and their calendar feeds.
 */
@Component({
  selector: 'tw-profile',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, NoticeSettings, CalendarFeeds],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Your profile</h1>
    @if (auth.user(); as user) {
      <p>
        Signed in as <strong>{{ user.username }}</strong> ({{ roleLabel(user.role) }}){{ user.displayName ? ', ' + user.displayName : '' }}.
      </p>
      @if (user.mustChangePassword) {
        <p class="must" role="alert">Your password was set by an admin. Choose your own password to continue.</p>
      }
    }
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-labelledby="password-heading">
      <h2 id="password-heading">Change your password</h2>
      <p class="policy">Use at least {{ minLength }} characters. A longer phrase is easier to remember and harder to guess than a short word with symbols.</p>
      <input type="text" name="username" autocomplete="username" [value]="auth.user()?.username ?? ''" hidden />
      <mat-form-field>
        <mat-label>Current password</mat-label>
        <input matInput type="password" formControlName="currentPassword" required autocomplete="current-password" />
        <mat-error>{{ message('currentPassword') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>New password</mat-label>
        <input matInput type="password" formControlName="newPassword" required autocomplete="new-password" />
        <mat-hint>At least {{ minLength }} characters</mat-hint>
        <mat-error>{{ message('newPassword') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>New password again</mat-label>
        <input matInput type="password" formControlName="repeat" required autocomplete="new-password" />
        <mat-error>{{ form.controls.repeat.errors?.['mismatch'] ? 'does not match the new password' : message('repeat') }}</mat-error>
      </mat-form-field>
      @if (formError(); as text) {
        <p class="form-error" role="alert">{{ text }}</p>
      }
      @if (done()) {
        <p role="status">Your password is changed. Your other sessions were signed out.</p>
      }
      <div><button mat-flat-button type="submit" [disabled]="saving.pending()">Change password</button></div>
    </form>
    @if (!auth.user()?.mustChangePassword) {
      <tw-notice-settings />
      <tw-calendar-feeds />
    }
  `,
  styles: `
    :host { display: block; max-width: 520px; }
    form { display: flex; flex-direction: column; gap: 8px; }
    h2 { margin: 16px 0 0; font-size: 1.25rem; }
    .policy { margin: 0; color: var(--mat-sys-on-surface-variant); }
    .must { padding: 8px 12px; border-radius: var(--tw-radius-s); border: 1px solid var(--mat-sys-outline); }
    .form-error { color: var(--mat-sys-error); }
  `,
})
export class Profile {
  protected readonly auth = inject(AuthService);
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  protected readonly roleLabel = roleLabel;
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly formError = signal<string | null>(null);
  protected readonly done = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(PASSWORD_MAX_LENGTH)]],
    repeat: ['', [Validators.required, sameAsNew]],
  });
  protected readonly saving = action(() => {
    const { currentPassword, newPassword } = this.form.getRawValue();
    return this.http
      .put<{ user: UserAccount }>('/api/profile/password', { currentPassword, newPassword }, { context: showsOwnErrors() })
      .pipe(map((r) => r.user));
  });

  protected message(field: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    this.formError.set(null);
    this.done.set(false);
    this.form.controls.repeat.updateValueAndValidity();
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Check the marked fields.');
      return;
    }
    const wasRequired = this.auth.user()?.mustChangePassword ?? false;
    const result = await this.saving.run();
    if (result.status === 'failed') {
      this.formError.set(showProblems(this.form, result.error) ?? 'Check the marked fields.');
      return;
    }
    this.auth.passwordChanged();
    this.form.reset();
    this.done.set(true);
    // a required change was in the way of the user's day: take them to it
    if (wasRequired) await this.router.navigateByUrl(homeFor(result.value.role));
  }
}
