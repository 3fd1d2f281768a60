import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { PatientToCall, callLine, callsCsv } from './patients-to-call';

/**
 * The patients to call after moves and fixes made on this screen: each accession with its old →
 * new time (and room), to copy into a message or download as CSV for the front desk.
 */
@Component({
  selector: 'tw-patients-to-call',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-patients-to-call', role: 'region', 'aria-labelledby': 'tw-calls-title' },
  template: `
    <h2 id="tw-calls-title">Patients to call <span class="count">{{ calls().length }}</span></h2>
    <ul>
      @for (call of calls(); track call.examId) {
        <li>{{ line(call) }}</li>
      }
    </ul>
    <div class="actions">
      <button mat-stroked-button type="button" class="copy" (click)="copy()"><mat-icon svgIcon="content_copy" />{{ copied() ? 'Copied' : 'Copy' }}</button>
      <a mat-stroked-button class="csv" [href]="csvHref()" [attr.download]="'patients-to-call-' + date() + '.csv'"><mat-icon svgIcon="download" />CSV</a>
      <button mat-button type="button" class="clear" (click)="cleared.emit()">Clear the list</button>
    </div>
  `,
  styles: `
    :host { display: grid; gap: 6px; padding: 10px 16px; border-radius: var(--tw-radius-l); border: 1px solid var(--mat-sys-outline-variant); background: var(--mat-sys-surface-container-low); }
    h2 { margin: 0; font: var(--mat-sys-title-small); display: flex; gap: 8px; align-items: baseline; }
    .count { font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); }
    ul { margin: 0; padding: 0; list-style: none; display: flex; flex-wrap: wrap; gap: 4px 20px; font: var(--mat-sys-body-medium); font-variant-numeric: tabular-nums; }
    .actions { display: flex; flex-wrap: wrap; gap: 8px; }
  `,
})
export class PatientsToCallPanel {
  readonly date = input.required<string>();
  readonly calls = input.required<readonly PatientToCall[]>();
  readonly cleared = output<void>();

  protected readonly copied = signal(false);
  protected readonly line = callLine;
  /** A data URL rather than a blob URL: nothing to revoke, and the list is short. */
  protected readonly csvHref = computed(() => `data:text/csv;charset=utf-8,${encodeURIComponent(callsCsv(this.date(), this.calls()))}`);

  protected async copy(): Promise<void> {
    const text = `Patients to call, ${this.date()}\n${this.calls().map(callLine).join('\n')}\n`;
    try {
      await navigator.clipboard.writeText(text);
      this.copied.set(true);
    } catch {
      // No clipboard (an insecure origin, a denied permission): the list stays on screen to select by hand.
      this.copied.set(false);
    }
  }
}
