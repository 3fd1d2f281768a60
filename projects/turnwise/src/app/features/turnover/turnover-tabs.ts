import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive } from '@angular/router';

/** Switches between the checklist and the cleaning log, the two halves of the Turnover screen. */
@Component({
  selector: 'tw-turnover-tabs',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Turnover">
      <a mat-tab-link routerLink="/turnover" [routerLinkActiveOptions]="{ exact: true }" routerLinkActive #checklist="routerLinkActive" [active]="checklist.isActive">
        <mat-icon svgIcon="checklist" aria-hidden="true" />Checklist
      </a>
      <a mat-tab-link routerLink="/turnover/log" routerLinkActive #log="routerLinkActive" [active]="log.isActive">
        <mat-icon svgIcon="receipt_long" aria-hidden="true" />Cleaning log
      </a>
    </nav>
    <mat-tab-nav-panel #panel />
  `,
  styles: `
    :host { display: block; }
    a { min-height: 48px; gap: 6px; }
    mat-icon { margin-right: 6px; }
  `,
})
export class TurnoverTabs {}
