import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { AuthService } from '../auth/auth-service';
import { homeFor, roleLabel } from '../auth/roles';

/** Shown inside the shell when a signed-in role opens a screen it may not use. */
@Component({
  selector: 'tw-not-available',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1><mat-icon svgIcon="lock" aria-hidden="true" /> Not available for your role</h1>
    <p>
      This screen is not part of the {{ role() }} role. If you need it for your work, ask your
      Turnwise admin to change your role.
    </p>
    <a mat-flat-button [routerLink]="home()">Go to my start screen</a>
  `,
})
export class NotAvailable {
  private readonly user = inject(AuthService).user;

  protected readonly role = computed(() => {
    const user = this.user();
    return user ? roleLabel(user.role) : 'current';
  });
  protected readonly home = computed(() => {
    const user = this.user();
    return user ? homeFor(user.role) : '/';
  });
}
