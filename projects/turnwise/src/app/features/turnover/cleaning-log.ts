import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { EMPTY, catchError, filter, switchMap, tap } from 'rxjs';

import type { LogEntry } from '@shared/api/board';
import type { ApiError } from '@shared/api/errors';
import type { Room } from '@shared/api/rooms';
import { SiteSettingsService } from '../../core/site/site-settings-service';
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
  private readonly log = inject(LogService);

  protected readonly columns = COLUMNS;
  protected readonly rooms = signal<Room[]>([]);
  protected readonly today = inject(SiteSettingsService).today;
  protected readonly date = linkedSignal(() => this.today() ?? '');
  protected readonly roomId = signal<number | null>(null);
  protected readonly user = signal('');
  protected readonly entries = signal<LogEntry[] | null>(null);
  protected readonly error = signal<ApiError | null>(null);
  /** The entry a correction is being written for. */
  protected readonly correcting = signal<LogEntry | null>(null);
  protected readonly note = signal('');
  protected readonly saving = signal(false);

  private readonly filters = computed<LogFilters>(() => ({ date: this.date(), roomId: this.roomId(), user: this.user() }));
  protected readonly csvUrl = computed(() => logCsvUrl(this.filters()));
  /** Entry id → the ids of the corrections added to it, for links both ways. */
  protected readonly correctedBy = computed(() => {
    const links = new Map<number, number[]>();
    for (const entry of this.entries() ?? []) {
      if (entry.correctsId !== null) links.set(entry.correctsId, [...(links.get(entry.correctsId) ?? []), entry.id]);
    }
    return links;
  });

  constructor() {
    inject(TurnoverService).rooms().pipe(takeUntilDestroyed()).subscribe({ next: (rooms) => this.rooms.set(rooms), error: () => undefined });
    toObservable(this.filters)
      .pipe(
        filter((filters) => filters.date !== ''),
        tap(() => this.error.set(null)),
        switchMap((filters) =>
          this.log.entries(filters).pipe(
            catchError((error: ApiError) => {
              this.error.set(error);
              return EMPTY;
            }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((entries) => this.entries.set(entries));
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

  protected saveCorrection(): void {
    const entry = this.correcting();
    const note = this.note().trim();
    if (!entry || !note) return;
    this.saving.set(true);
    this.log.correct(entry.id, note).subscribe({
      next: (added) => {
        this.entries.update((entries) => [added, ...(entries ?? [])]);
        this.correcting.set(null);
        this.saving.set(false);
      },
      error: (error: ApiError) => {
        this.error.set(error);
        this.saving.set(false);
      },
    });
  }
}
