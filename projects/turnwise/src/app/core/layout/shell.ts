import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';

import { AuthService } from '../auth/auth-service';
import { SetupChecklist } from '../../features/setup/setup-checklist';
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
  imports: [MatToolbarModule, MatSidenavModule, MatButtonModule, MatIconModule, MatMenuModule, RouterLink, RouterOutlet, Logo, Nav, SetupChecklist],
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

  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => this.router.url),
    ),
    { initialValue: this.router.url },
  );
  /**
   * An admin sees what setup still lacks wherever they land (a new department's first sign-in),
   * except on Setup, which shows it itself, and on the profile (a reset password is changed
   * first; nothing else answers until then). Loaded lazily: other roles never fetch it.
   */
  protected readonly setupChecklist = computed(
    () => this.user()?.role === 'admin' && !/^\/(setup|profile)\b/.test(this.url()) && !this.chromeHidden(),
  );

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
