import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DateTime } from 'luxon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';

import type { AuditEntry } from '@shared/api/audit';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { serverState } from '../../core/state/server-state';
import { SetupApi } from './setup-api';

interface Page {
  limit: number;
  offset: number;
}

/** Setup → Audit: every setup change, newest first, paged on the server (the list only grows). */
@Component({
  selector: 'tw-audit-tab',
  imports: [MatPaginatorModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (audit.status() === 'failed') {
      <p class="load-error" role="alert">{{ audit.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="audit.value()?.entries ?? []" aria-label="Setup changes, newest first">
        <ng-container matColumnDef="at">
          <th mat-header-cell *matHeaderCellDef>When</th>
          <td mat-cell *matCellDef="let entry">{{ when(entry) }}</td>
        </ng-container>
        <ng-container matColumnDef="by">
          <th mat-header-cell *matHeaderCellDef>Who</th>
          <td mat-cell *matCellDef="let entry">{{ entry.by.displayName || entry.by.username }}</td>
        </ng-container>
        <ng-container matColumnDef="what">
          <th mat-header-cell *matHeaderCellDef>What</th>
          <td mat-cell *matCellDef="let entry">{{ entry.area }} {{ entry.subject }}: {{ entry.action }}</td>
        </ng-container>
        <ng-container matColumnDef="change">
          <th mat-header-cell *matHeaderCellDef>Before → after</th>
          <td mat-cell *matCellDef="let entry">
            @for (line of lines(entry); track line) {
              <div>{{ line }}</div>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ audit.status() === 'loading' ? 'Loading…' : 'No setup changes yet.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="audit.value()?.total ?? 0" [pageIndex]="pageIndex()" [pageSize]="pageSize()" [pageSizeOptions]="[25, 50, 100]" (page)="turn($event)" aria-label="Audit pages" />
  `,
  styleUrl: './setup-table.scss',
})
export class AuditTab {
  private readonly api = inject(SetupApi);
  private readonly site = inject(SiteSettingsService).settings;
  protected readonly columns = ['at', 'by', 'what', 'change'];
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly audit = serverState((page: Page) => this.api.audit(page), 'The audit could not be shown.');

  constructor() {
    this.audit.show({ limit: 25, offset: 0 });
  }

  protected turn(page: PageEvent): void {
    this.pageIndex.set(page.pageIndex);
    this.pageSize.set(page.pageSize);
    this.audit.show({ limit: page.pageSize, offset: page.pageIndex * page.pageSize });
  }

  /** In the site's time zone, as every other time on screen. */
  protected when(entry: AuditEntry): string {
    const at = DateTime.fromISO(entry.at).setZone(this.site()?.timezone ?? 'UTC');
    return at.isValid ? at.toFormat('yyyy-MM-dd HH:mm') : entry.at;
  }

  /** One line per field: `field: before → after` (a created or removed thing has one side). */
  protected lines(entry: AuditEntry): string[] {
    const keys = [...new Set([...Object.keys(entry.before ?? {}), ...Object.keys(entry.after ?? {})])];
    const show = (value: unknown) => (value === undefined || value === null || value === '' ? '—' : Array.isArray(value) ? value.join(', ') || '—' : String(value));
    return keys.map((key) => (entry.before === null ? `${key}: ${show(entry.after?.[key])}` : `${key}: ${show(entry.before[key])} → ${show(entry.after?.[key])}`));
  }
}
