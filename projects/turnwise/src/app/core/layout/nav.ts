import { ChangeDetectionStrategy, Component, computed, inject, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { RouterLink, RouterLinkActive } from '@angular/router';

import { AuthService } from '../auth/auth-service';
import { screensFor } from '../auth/roles';

/** The list of screens the signed-in role may use; nothing else is offered. */
@Component({
  selector: 'tw-nav',
  imports: [MatListModule, MatIconModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-nav-list>
      @for (screen of screens(); track screen.path) {
        <a
          mat-list-item
          [routerLink]="'/' + screen.path"
          routerLinkActive
          #link="routerLinkActive"
          [activated]="link.isActive"
          ariaCurrentWhenActive="page"
          (click)="navigated.emit()"
        >
          <mat-icon matListItemIcon [svgIcon]="screen.icon" />
          <span matListItemTitle>{{ screen.label }}</span>
        </a>
      }
    </mat-nav-list>
  `,
})
export class Nav {
  private readonly auth = inject(AuthService);

  /** Fires when a screen is picked, so an overlay sidenav can close. */
  readonly navigated = output<void>();

  protected readonly screens = computed(() => {
    const user = this.auth.user();
    return user ? screensFor(user.role) : [];
  });
}
