import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { AuthService } from '../auth/auth-service';
import { ErrorNotice } from '../http/error-notice';
import { roleLabel } from '../auth/roles';
import { ICONS } from './icons';
import { Logo } from './logo';
import { Nav } from './nav';
import { registerIcons } from './register-icons';
import { ShellChrome } from './shell-chrome';

/** Below this width (a tablet in portrait) the navigation becomes an overlay opened from the toolbar. */
const NARROW = '(max-width: 999.98px)';

/** The signed-in frame: toolbar, screen navigation and the current screen. */
@Component({
  selector: 'tw-shell',
  imports: [MatToolbarModule, MatSidenavModule, MatButtonModule, MatIconModule, MatMenuModule, RouterLink, RouterOutlet, Logo, Nav],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
})
export class Shell {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);

  protected readonly narrow = toSignal(
    inject(BreakpointObserver).observe(NARROW).pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** A wall display hides the toolbar and navigation (see ShellChrome). */
  protected readonly chromeHidden = inject(ShellChrome).hidden.asReadonly();
  protected readonly user = this.auth.user;
  protected readonly role = computed(() => {
    const user = this.user();
    return user ? roleLabel(user.role) : '';
  });

  constructor() {
    // Every screen renders inside the shell, so its icons are in place before any screen draws.
    registerIcons(ICONS);
    // Signed in, errors become possible: fetch the snack bar now, while the server surely answers.
    inject(ErrorNotice).preload();
  }

  protected async signOut(): Promise<void> {
    try {
      await this.auth.logout();
    } catch {
      // The error interceptor has already told the user; signing out locally still counts.
    }
    await this.router.navigateByUrl('/sign-in');
  }
}
