import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { DateTime } from 'luxon';

import { AFTER_MANUAL_CHANGE, HL7_ACK_CODES, type Hl7AckCode, type Hl7LogEntry } from '@shared/api/hl7';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { serverState } from '../../core/state/server-state';
import { ACK_ICONS, ACK_WORDS } from './ack-words';
import { InterfaceLogApi, type LogPageKey } from './interface-log-api';
import { RawMessageDialog, type RawMessageData } from './raw-message-dialog';

/**
 * Interface log (admin): every message the booking feed received, newest first, with its type,
 * control id, the ACK it got (code, icon and word) and the change it made or why it was refused;
 * filtered by ACK code, a page at a time; a message's stored text opens in a dialog.
 */
@Component({
  selector: 'tw-interface-log',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './interface-log.html',
  styleUrl: './interface-log.scss',
})
export class InterfaceLog {
  private readonly api = inject(InterfaceLogApi);
  private readonly dialog = inject(MatDialog);
  private readonly site = inject(SiteSettingsService).settings;
  protected readonly codes = HL7_ACK_CODES;
  protected readonly words = ACK_WORDS;
  protected readonly afterManual = AFTER_MANUAL_CHANGE;
  protected readonly columns = ['time', 'type', 'control', 'ack', 'outcome'];
  protected readonly page = serverState((key: LogPageKey) => this.api.page(key), 'The interface log could not be shown.');
  protected readonly ack = signal<Hl7AckCode | null>(null);
  /** The cursors of the pages before this one, to go back to newer messages. */
  private readonly newer = signal<(number | null)[]>([]);
  protected readonly hasNewer = computed(() => this.newer().length > 0);
  protected readonly zone = computed(() => this.site()?.timezone ?? 'UTC');

  constructor() {
    this.page.show({ ack: null, before: null });
  }

  protected filter(code: Hl7AckCode | '' | null): void {
    this.ack.set(code || null);
    this.newer.set([]);
    this.page.show({ ack: this.ack(), before: null });
  }

  protected older(): void {
    const before = this.page.value()?.before;
    if (!before) return;
    this.newer.update((stack) => [...stack, this.page.key()?.before ?? null]);
    this.page.show({ ack: this.ack(), before });
  }

  protected newerPage(): void {
    const stack = this.newer();
    if (stack.length === 0) return;
    this.newer.set(stack.slice(0, -1));
    this.page.show({ ack: this.ack(), before: stack[stack.length - 1]! });
  }

  protected refresh(): void {
    this.newer.set([]);
    this.page.show({ ack: this.ack(), before: null });
    this.page.reload();
  }

  protected open(entry: Hl7LogEntry): void {
    const data: RawMessageData = { id: entry.id, messageType: entry.messageType, controlId: entry.controlId };
    this.dialog.open(RawMessageDialog, { data, width: '880px', maxWidth: '96vw', autoFocus: 'dialog' });
  }

  // a table row is untyped in the template: read its code here
  protected ackIcon(entry: Hl7LogEntry): string {
    return ACK_ICONS[entry.ackCode];
  }

  protected ackWord(entry: Hl7LogEntry): string {
    return ACK_WORDS[entry.ackCode];
  }

  /** In the site's time zone, as every other time on screen. */
  protected when(iso: string): string {
    const at = DateTime.fromISO(iso).setZone(this.zone());
    return at.isValid ? at.toFormat('yyyy-MM-dd HH:mm:ss') : iso;
  }
}
