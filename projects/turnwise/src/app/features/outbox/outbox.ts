import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatTableModule } from '@angular/material/table';
import { DateTime } from 'luxon';

import type { MailDelivery, OutboxNotice } from '@shared/api/notices';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { serverState } from '../../core/state/server-state';
import { OutboxApi } from './outbox-api';

const DELIVERY: Record<MailDelivery, string> = {
  'demo-server': 'Demo mode: messages go to the local demo mail server, not to anyone’s mailbox.',
  smtp: 'Messages go out through the SMTP server set for this site.',
  off: 'E-mail is off: no SMTP server is set, so nothing is sent.',
};

/**
 * Outbox (admin): every notice queued or sent, with its recipient, status, attempts and last
 * error, and one message's text or HTML. The HTML is shown in a sandboxed frame (no scripts, no
 * same origin), so a message can never act in the app.
 */
@Component({
  selector: 'tw-outbox',
  imports: [MatButtonModule, MatButtonToggleModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Outbox</h1>
    @if (list.value(); as page) {
      <p class="delivery">{{ delivery(page.delivery) }}</p>
    }
    @if (list.status() === 'failed') {
      <p class="load-error" role="alert">{{ list.error()?.message }}</p>
    }
    <div class="actions"><button mat-stroked-button type="button" (click)="list.reload()">Refresh</button></div>
    <div class="table-wrap">
      <table mat-table [dataSource]="list.value()?.notices ?? []" aria-label="Notices, newest first">
        <ng-container matColumnDef="to">
          <th mat-header-cell *matHeaderCellDef>To</th>
          <td mat-cell *matCellDef="let n">{{ n.to.join(', ') }}</td>
        </ng-container>
        <ng-container matColumnDef="subject">
          <th mat-header-cell *matHeaderCellDef>Subject</th>
          <td mat-cell *matCellDef="let n">
            <button mat-button type="button" class="subject" (click)="open(n)" [attr.aria-pressed]="openId() === n.id">{{ n.subject }}</button>
          </td>
        </ng-container>
        <ng-container matColumnDef="time">
          <th mat-header-cell *matHeaderCellDef>Time</th>
          <td mat-cell *matCellDef="let n">{{ when(n.sentAt ?? n.createdAt) }}</td>
        </ng-container>
        <ng-container matColumnDef="status">
          <th mat-header-cell *matHeaderCellDef>Status</th>
          <td mat-cell *matCellDef="let n"><span class="status" [attr.data-status]="n.status">{{ n.status }}</span></td>
        </ng-container>
        <ng-container matColumnDef="attempts">
          <th mat-header-cell *matHeaderCellDef>Attempts</th>
          <td mat-cell *matCellDef="let n">{{ n.attempts }}</td>
        </ng-container>
        <ng-container matColumnDef="error">
          <th mat-header-cell *matHeaderCellDef>Last error</th>
          <td mat-cell *matCellDef="let n">{{ n.lastError ?? '' }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ list.status() === 'loading' ? 'Loading…' : 'No notices yet.' }}</td>
        </tr>
      </table>
    </div>
    @if (openId() !== null) {
      <section class="message" aria-labelledby="message-heading">
        <h2 id="message-heading">{{ message.value()?.subject ?? 'Message' }}</h2>
        @if (message.status() === 'failed') {
          <p class="load-error" role="alert">{{ message.error()?.message }}</p>
        }
        <mat-button-toggle-group [value]="view()" (change)="view.set($event.value)" aria-label="Show the message as">
          <mat-button-toggle value="text">Text</mat-button-toggle>
          <mat-button-toggle value="html">HTML</mat-button-toggle>
        </mat-button-toggle-group>
        @if (message.value(); as m) {
          @if (view() === 'text') {
            <pre class="text">{{ m.text }}</pre>
          } @else {
            <iframe class="html" sandbox="" [attr.srcdoc]="m.html" title="The message as HTML"></iframe>
          }
        }
      </section>
    }
  `,
  styles: `
    :host { display: block; }
    .delivery { color: var(--mat-sys-on-surface-variant); }
    .actions { margin: 8px 0; }
    .table-wrap { overflow-x: auto; }
    .subject { text-align: left; }
    .status[data-status='failed'] { color: var(--mat-sys-error); font-weight: 600; }
    .message { margin-top: 24px; }
    .text { white-space: pre-wrap; padding: 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--tw-radius-s); }
    .html { width: 100%; min-height: 360px; border: 1px solid var(--mat-sys-outline-variant); background: #fff; }
    .load-error { color: var(--mat-sys-error); }
  `,
})
export class Outbox {
  private readonly api = inject(OutboxApi);
  private readonly site = inject(SiteSettingsService).settings;
  protected readonly columns = ['to', 'subject', 'time', 'status', 'attempts', 'error'];
  protected readonly list = serverState((_: 'all') => this.api.list(), 'The outbox could not be shown.');
  protected readonly message = serverState((id: number) => this.api.message(id), 'The message could not be shown.');
  protected readonly openId = signal<number | null>(null);
  protected readonly view = signal<'text' | 'html'>('text');
  protected readonly zone = computed(() => this.site()?.timezone ?? 'UTC');

  constructor() {
    this.list.show('all');
  }

  protected open(notice: OutboxNotice): void {
    this.openId.set(notice.id);
    this.message.show(notice.id);
  }

  protected delivery(d: MailDelivery): string {
    return DELIVERY[d];
  }

  /** In the site's time zone, as every other time on screen. */
  protected when(iso: string): string {
    const at = DateTime.fromISO(iso).setZone(this.zone());
    return at.isValid ? at.toFormat('yyyy-MM-dd HH:mm') : iso;
  }
}
