import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, type UserAccount } from '@shared/api/users';
import { ROLES, roleLabel, type Role } from '../../core/auth/roles';
import { action } from '../../core/state/action';
import { fieldMessage, submitForm } from './form-problems';
import { SetupApi } from './setup-api';

/** A new account (with a first password the user changes at first sign-in), or an account's name, e-mail and role. */
@Component({
  selector: 'tw-user-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ user ? 'Edit ' + user.username : 'Add a user' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        @if (!user) {
          <mat-form-field>
            <mat-label>Username</mat-label>
            <input matInput formControlName="username" required autocomplete="off" maxlength="64" />
            <mat-hint>For signing in: letters, digits, dots, dashes or underscores</mat-hint>
            <mat-error>{{ message('username') }}</mat-error>
          </mat-form-field>
        }
        <mat-form-field>
          <mat-label>Display name</mat-label>
          <input matInput formControlName="displayName" required maxlength="120" />
          <mat-hint>Shown on ticked steps and in the cleaning log</mat-hint>
          <mat-error>{{ message('displayName') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>E-mail</mat-label>
          <input matInput type="email" formControlName="email" required maxlength="254" autocomplete="off" />
          <mat-error>{{ message('email') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Role</mat-label>
          <mat-select formControlName="role" required>
            @for (role of roles; track role) {
              <mat-option [value]="role">{{ roleLabel(role) }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ message('role') }}</mat-error>
        </mat-form-field>
        @if (!user) {
          <mat-form-field>
            <mat-label>First password</mat-label>
            <input matInput type="password" formControlName="password" required autocomplete="new-password" />
            <mat-hint>At least {{ minLength }} characters. Hand it over in person; they choose their own at first sign-in.</mat-hint>
            <mat-error>{{ message('password') }}</mat-error>
          </mat-form-field>
        }
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ user ? 'Save user' : 'Add user' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
})
export class UserDialog {
  private readonly api = inject(SetupApi);
  private readonly ref = inject(MatDialogRef<UserDialog, UserAccount>);
  protected readonly user = inject<UserAccount | null>(MAT_DIALOG_DATA, { optional: true });
  protected readonly roles = ROLES;
  protected readonly roleLabel = roleLabel;
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly formError = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    username: [this.user?.username ?? '', this.user ? [] : [Validators.required, Validators.pattern(/^[A-Za-z0-9._-]{2,64}$/)]],
    displayName: [this.user?.displayName ?? '', [Validators.required, Validators.maxLength(120)]],
    email: [this.user?.email ?? '', [Validators.required, Validators.email]],
    role: [this.user?.role ?? ('tech' as Role), Validators.required],
    password: ['', this.user ? [] : [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(PASSWORD_MAX_LENGTH)]],
  });

  protected readonly saving = action(() => {
    const { username, displayName, email, role, password } = this.form.getRawValue();
    return this.user
      ? this.api.changeUser(this.user.id, { displayName, email, role })
      : this.api.createUser({ username: username.trim(), displayName, email: email.trim(), role, password });
  });

  protected message(field: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[field]);
  }

  protected async save(): Promise<void> {
    const saved = await submitForm(this.form, this.saving, this.formError);
    if (saved) this.ref.close(saved.value);
  }
}
