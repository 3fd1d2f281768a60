import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import searchOff from '@material-design-icons/svg/outlined/search_off.svg';

import { Logo } from './logo';
import { registerIcons } from './register-icons';

/** Shown for any address Turnwise does not know; works signed in or out. */
@Component({
  selector: 'tw-not-found',
  imports: [MatButtonModule, MatIconModule, RouterLink, Logo],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-standalone-page' },
  template: `
    <main>
      <tw-logo />
      <h1><mat-icon svgIcon="search_off" aria-hidden="true" /> Page not found</h1>
      <p>There is no screen at this address. It may have been mistyped, or the link is out of date.</p>
      <a mat-flat-button routerLink="/">Go to my start screen</a>
    </main>
  `,
})
export class NotFound {
  constructor() {
    // Shown outside the shell, possibly signed out, so it cannot rely on the shell's icons.
    registerIcons({ search_off: searchOff });
  }
}
