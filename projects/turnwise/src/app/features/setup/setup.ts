import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { Router } from '@angular/router';

import { AuditTab } from './audit-tab';
import { EquipmentTab } from './equipment-tab';
import { ProductsTab } from './products-tab';
import { ProtocolsTab } from './protocols-tab';
import { RoomsTab } from './rooms-tab';
import { SetupChecklist } from './setup-checklist';
import { ShiftTasksTab } from './shift-tasks-tab';
import { SiteTab } from './site-tab';
import { UsersTab } from './users-tab';

/** The tabs in order; `?tab=` names one so a link (or a reload) opens it. */
export const SETUP_TABS = ['rooms', 'products', 'protocols', 'equipment', 'shift-tasks', 'users', 'site', 'audit'] as const;
export type SetupTabName = (typeof SETUP_TABS)[number];

/**
 * Setup (admin): the department's rooms, equipment, people, site, disinfectant products and
 * turnover protocols, the audit of every change, and (until done) what is still missing.
 */
@Component({
  selector: 'tw-setup',
  imports: [MatTabsModule, RoomsTab, EquipmentTab, UsersTab, SiteTab, AuditTab, ProductsTab, ProtocolsTab, SetupChecklist, ShiftTasksTab],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Setup</h1>
    <tw-setup-checklist [refresh]="index()" />
    <mat-tab-group [selectedIndex]="index()" (selectedIndexChange)="open($event)" mat-stretch-tabs="false" animationDuration="0ms">
      <mat-tab label="Rooms"><ng-template matTabContent><tw-rooms-tab /></ng-template></mat-tab>
      <mat-tab label="Products"><ng-template matTabContent><tw-products-tab /></ng-template></mat-tab>
      <mat-tab label="Protocols"><ng-template matTabContent><tw-protocols-tab /></ng-template></mat-tab>
      <mat-tab label="Equipment"><ng-template matTabContent><tw-equipment-tab /></ng-template></mat-tab>
      <mat-tab label="Shift tasks"><ng-template matTabContent><tw-shift-tasks-tab /></ng-template></mat-tab>
      <mat-tab label="Users"><ng-template matTabContent><tw-users-tab /></ng-template></mat-tab>
      <mat-tab label="Site"><ng-template matTabContent><tw-site-tab /></ng-template></mat-tab>
      <mat-tab label="Audit"><ng-template matTabContent><tw-audit-tab /></ng-template></mat-tab>
    </mat-tab-group>
  `,
  styles: `
    :host { display: block; }
    h1 { margin: 0 0 8px; }
    /* All eight tabs in view on a tablet (768 px): no paging arrows to hide one behind. */
    @media (max-width: 1000px) {
      :host ::ng-deep .mat-mdc-tab-header .mat-mdc-tab { min-width: 0; padding-inline: 10px; }
    }
  `,
})
export class Setup {
  private readonly router = inject(Router);
  /** From the query string (`?tab=users`). */
  readonly tab = input<string>();
  protected readonly index = computed(() => Math.max(0, SETUP_TABS.indexOf((this.tab() ?? 'rooms') as SetupTabName)));

  protected open(index: number): void {
    void this.router.navigate([], { queryParams: { tab: SETUP_TABS[index] }, replaceUrl: true });
  }
}
