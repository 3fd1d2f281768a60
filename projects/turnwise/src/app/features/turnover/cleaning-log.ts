import { ChangeDetectionStrategy, Component, computed, effect, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';

import type { LogEntry } from '@shared/api/board';
import { NOTE_MAX_CHARS } from '@shared/api/limits';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { DayPicker } from '../../shared/ui/day-picker';
import { SiteTime } from '../../shared/ui/site-time';
import { LogFilters, LogService, logCsvUrl } from './log-service';
import { TurnoverService } from './turnover-service';
import { TurnoverTabs } from './turnover-tabs';

/**
 * Seven columns, each stacking what belongs together, so a tablet (768 px) shows the whole
 * entry, including who, the early reason and the corrections, without scrolling sideways.
 */
const COLUMNS = ['at', 'room', 'step', 'product', 'who', 'earlyReason', 'links'];

/** The cleaning log an auditor asks for: who cleaned what, with which product, and when. Append-only. */
@Component({
  selector: 'tw-cleaning-log',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatTableModule, DayPicker, SiteTime, TurnoverTabs],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './cleaning-log.html',
  styleUrl: './cleaning-log.scss',
})
export class CleaningLog {
  protected readonly noteMax = NOTE_MAX_CHARS;
  private readonly log = inject(LogService);
  private readonly turnovers = inject(TurnoverService);

  protected readonly columns = COLUMNS;
  protected readonly rooms = serverState(() => this.turnovers.rooms(), 'The rooms could not be shown.');
  protected readonly today = inject(SiteSettingsService).today;
  protected readonly date = linkedSignal(() => this.today() ?? '');
  protected readonly roomId = signal<number | null>(null);
  protected readonly user = signal('');
  private readonly filters = computed<LogFilters>(() => ({ date: this.date(), roomId: this.roomId(), user: this.user() }));
  protected readonly entries = serverState((filters: LogFilters) => this.log.entries(filters), 'The log could not be shown.');
  /** The entry a correction is being written for. */
  protected readonly correcting = signal<LogEntry | null>(null);
  protected readonly note = signal('');
  private readonly correct = action((entry: LogEntry, note: string) => this.log.correct(entry.id, note), 'The correction could not be added.');
  protected readonly saving = this.correct.pending;
  /** A refused correction until the next one; else a failed fetch. */
  protected readonly error = computed(() => this.correct.error() ?? this.entries.error());

  protected readonly csvUrl = computed(() => logCsvUrl(this.filters()));
  /** Entry id → the ids of the corrections added to it, for links both ways. */
  protected readonly correctedBy = computed(() => {
    const links = new Map<number, number[]>();
    for (const entry of this.entries.value() ?? []) {
      if (entry.correctsId !== null) links.set(entry.correctsId, [...(links.get(entry.correctsId) ?? []), entry.id]);
    }
    return links;
  });

  constructor() {
    this.rooms.show('all');
    effect(() => {
      const filters = this.filters();
      if (filters.date !== '') this.entries.show(filters);
    });
  }

  protected pickRoom(event: Event): void {
    const value = (event.target as HTMLSelectElement).value;
    this.roomId.set(value ? Number(value) : null);
  }

  protected typeUser(event: Event): void {
    this.user.set((event.target as HTMLInputElement).value);
  }

  protected typeNote(event: Event): void {
    this.note.set((event.target as HTMLTextAreaElement).value);
  }

  protected startCorrection(entry: LogEntry): void {
    this.correcting.set(entry);
    this.note.set('');
  }

  protected async saveCorrection(): Promise<void> {
    const entry = this.correcting();
    const note = this.note().trim();
    if (!entry || !note) return;
    const result = await this.correct.run(entry, note);
    if (result.status === 'done') {
      this.entries.set([result.value, ...(this.entries.value() ?? [])]);
      this.correcting.set(null);
    }
  }
}
