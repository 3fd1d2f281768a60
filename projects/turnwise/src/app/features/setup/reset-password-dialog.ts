import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, type UserAccount } from '@shared/api/users';
import { action } from '../../core/state/action';
import { fieldMessage, submitForm } from './form-problems';
import { SetupApi } from './setup-api';

/** A new first password for someone who forgot theirs: their sessions end and they choose their own at next sign-in. */
@Component({
  selector: 'tw-reset-password-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Reset the password of {{ user.displayName || user.username }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <p class="policy">They are signed out everywhere now and must choose their own password at next sign-in.</p>
        <mat-form-field>
          <mat-label>New first password</mat-label>
          <input matInput type="password" formControlName="password" required autocomplete="new-password" />
          <mat-hint>At least {{ minLength }} characters</mat-hint>
          <mat-error>{{ message() }}</mat-error>
        </mat-form-field>
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving.pending()">Reset password</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
})
export class ResetPasswordDialog {
  private readonly api = inject(SetupApi);
  private readonly ref = inject(MatDialogRef<ResetPasswordDialog, UserAccount>);
  protected readonly user = inject<UserAccount>(MAT_DIALOG_DATA);
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly formError = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(PASSWORD_MAX_LENGTH)]],
  });
  protected readonly saving = action(() => this.api.resetPassword(this.user.id, this.form.getRawValue().password));

  protected message(): string {
    return fieldMessage(this.form.controls.password);
  }

  protected async save(): Promise<void> {
    const saved = await submitForm(this.form, this.saving, this.formError, 'Check the marked field.');
    if (saved) this.ref.close(saved.value);
  }
}
