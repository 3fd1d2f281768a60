import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import error from '@material-design-icons/svg/outlined/error.svg';
import login from '@material-design-icons/svg/outlined/login.svg';

import { DemoAccounts } from '@shared/api/auth';
import { isApiError } from '@shared/api/errors';
import { AuthService } from '../../core/auth/auth-service';
import { SessionUser, homeFor, roleLabel } from '../../core/auth/roles';
import { Logo } from '../../core/layout/logo';
import { registerIcons } from '../../core/layout/register-icons';
import { DemoAccountsService } from './demo-accounts';

/** Sign in with username and password; in demo mode, lists the demo accounts to pick from. */
@Component({
  selector: 'tw-sign-in',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, Logo],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
})
export class SignIn {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);

  /** Where the user was going when they were asked to sign in (bound from the query string). */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    username: ['', Validators.required],
    password: ['', Validators.required],
  });
  protected readonly error = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly demo = signal<DemoAccounts | null>(null);
  protected readonly roleLabel = roleLabel;

  constructor() {
    // The page is drawn before the shell (which registers the rest) has ever loaded.
    registerIcons({ error, login });
    void inject(DemoAccountsService).fetch().then((demo) => this.demo.set(demo));
  }

  protected async submit(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    const { username, password } = this.form.getRawValue();
    try {
      const user = await this.auth.login(username, password);
      await this.router.navigateByUrl(this.destination(user));
    } catch (failure) {
      this.error.set(messageFor(failure));
    } finally {
      this.busy.set(false);
    }
  }

  /** Fills the form from a demo account; the user still presses Sign in. */
  protected useDemo(account: DemoAccounts['accounts'][number]): void {
    const demo = this.demo();
    if (!demo) return;
    this.form.setValue({ username: account.username, password: demo.password });
    this.error.set(null);
  }

  private destination(user: SessionUser): string {
    // a reset password is changed before anything else (the server refuses the rest)
    if (user.mustChangePassword) return '/profile';
    const wanted = this.returnUrl();
    // Only same-site paths: a crafted link must not send a freshly signed-in user elsewhere.
    const safe = wanted && wanted.startsWith('/') && !wanted.startsWith('//') && !wanted.startsWith('/sign-in');
    return safe ? wanted : homeFor(user.role);
  }
}

function messageFor(failure: unknown): string {
  if (!isApiError(failure)) return 'Signing in failed. Try again in a moment.';
  if (failure.status === 401) return 'Wrong username or password.';
  // 429 carries the server's throttle message ("try again in N minutes"), which is the useful part.
  return failure.message;
}
