import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { serverState } from '../../core/state/server-state';
import { ACK_WORDS } from './ack-words';
import { InterfaceLogApi } from './interface-log-api';

export interface RawMessageData {
  id: number;
  messageType: string;
  controlId: string | null;
}

/**
 * One message of the interface log as it was received, patient segments (PID and the like)
 * already dropped by the server before storing. HL7 ends segments with a carriage return, which
 * a page would run together: each segment is put on its own line.
 */
@Component({
  selector: 'tw-raw-message-dialog',
  imports: [MatButtonModule, MatDialogModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ data.messageType || 'Message' }} {{ data.controlId ?? '' }}</h2>
    <mat-dialog-content>
      @if (message.value(); as m) {
        <p class="ack">ACK {{ m.ackCode }} ({{ words[m.ackCode] }}){{ m.outcome ? ': ' + m.outcome : '' }}</p>
        <p class="quiet">As received, without patient segments (never stored).</p>
        <pre class="raw" tabindex="0" aria-label="The message, one segment a line">{{ segments() }}</pre>
      } @else if (message.status() === 'failed') {
        <p class="load-error" role="alert">{{ message.error()?.message }}</p>
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the message" />
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    .raw { white-space: pre; overflow-x: auto; padding: 12px; font-size: 13px; border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--tw-radius-s); max-width: 100%; }
    .quiet { color: var(--mat-sys-on-surface-variant); }
    .load-error { color: var(--mat-sys-error); }
  `,
})
export class RawMessageDialog {
  protected readonly data = inject<RawMessageData>(MAT_DIALOG_DATA);
  private readonly api = inject(InterfaceLogApi);
  protected readonly words = ACK_WORDS;
  protected readonly message = serverState((id: number) => this.api.message(id), 'The message could not be shown.');
  protected readonly segments = computed(() => (this.message.value()?.raw ?? '').split(/\r\n|\r|\n/).filter(Boolean).join('\n'));

  constructor() {
    this.message.show(this.data.id);
  }
}
