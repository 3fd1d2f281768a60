import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Subscription } from 'rxjs';

import { isApiError } from '@shared/api/errors';
import type { ImportResult } from '@shared/api/import';
import { DayPicker } from '../../shared/ui/day-picker';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { longDay } from '../../shared/ui/site-time';
import { serverState } from '../../core/state/server-state';
import { csvHref, dayListCsv, templateCsv } from './day-list-file';
import { DropZone } from './drop-zone';
import { ExamListHelp } from './exam-list-help';
import { ImportPreview } from './import-preview';
import { importProblems } from './import-problems';
import { importRefusalOf } from './import-refused';
import { ImportService } from './import-service';
import { ImportState } from './import-state';
import { ProblemGapList } from './problem-gap-list';
import { RefusalReport } from './refusal-report';
import { AuthService } from '../../core/auth/auth-service';
import { may } from '../../core/auth/roles';
import { RosterFileImport } from '../roster/roster-file-import';

/** Import a day list: choose the day and a file, check the preview, then replace the day's list. */
@Component({
  selector: 'tw-import',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
    DayPicker,
    DropZone,
    ExamListHelp,
    ImportPreview,
    ProblemGapList,
    RefusalReport,
    RosterFileImport,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './import.html',
  styleUrl: './import.scss',
})
export class Import {
  private readonly imports = inject(ImportService);
  private upload: Subscription | null = null;
  protected readonly today = inject(SiteSettingsService).today;
  private readonly user = inject(AuthService).user;
  /** The optional roster file: for a role that may change the roster (a scheduler imports the list only). */
  protected readonly mayRoster = computed(() => may(this.user()?.role ?? null, 'editRoster'));

  /** `YYYY-MM-DD` from `/import?date=…` (the Day plan links here); else today at the site. */
  readonly date = input<string>();

  protected readonly day = linkedSignal(() => this.date() || this.today());
  protected readonly file = signal<File | null>(null);
  protected readonly state = signal<ImportState>({ step: 'choose' });
  protected readonly busy = computed(() => this.state().step === 'uploading');
  protected readonly longDay = longDay;
  /** The day's rooms, zone and snug margin, to show where the file's problem gaps are. */
  protected readonly dayInput = serverState((date: string) => this.imports.dayInput(date), 'The day could not be read.');
  protected readonly problems = computed(() => {
    const current = this.state();
    const input = this.dayInput.value();
    if ((current.step !== 'preview' && current.step !== 'imported') || !input || input.date !== current.result.date) return null;
    return importProblems(input, current.result.rows);
  });

  protected readonly templateHref = csvHref(templateCsv());
  /** The chosen day's current list in the import format, when it has exams. */
  protected readonly dayListHref = computed(() => {
    const input = this.dayInput.value();
    return input && input.date === this.day() && input.exams.length > 0 ? csvHref(dayListCsv(input)) : null;
  });

  constructor() {
    effect(() => {
      const day = this.day();
      if (day) this.dayInput.show(day);
    });
    inject(DestroyRef).onDestroy(() => this.upload?.unsubscribe());
  }

  protected choose(file: File): void {
    this.file.set(file);
    this.send(true);
  }

  protected pickDay(day: string): void {
    this.day.set(day);
    // A preview answers for one day; on another day the same file may add, change or remove others.
    if (this.file() && this.state().step !== 'imported') this.send(true);
  }

  /** True when the day already has exams, which the import will replace rather than add to. */
  protected replaces(result: ImportResult): boolean {
    return result.unchanged + result.changed.length + result.removed.length > 0;
  }

  protected commit(): void {
    const current = this.state();
    this.send(false, current.step === 'preview' ? current.result.dayVersion : undefined);
  }

  protected startOver(): void {
    this.upload?.unsubscribe();
    this.file.set(null);
    this.state.set({ step: 'choose' });
  }

  private send(dryRun: boolean, dayVersion?: number, redone = false): void {
    const day = this.day();
    const file = this.file();
    if (!day || !file) return;
    const purpose = dryRun ? 'preview' : 'import';
    this.upload?.unsubscribe();
    this.state.set({ step: 'uploading', purpose, percent: 0 });
    this.upload = this.imports.send(day, file, { dryRun, dayVersion }).subscribe({
      next: (progress) => {
        this.state.set(
          progress.kind === 'uploading'
            ? { step: 'uploading', purpose, percent: progress.percent }
            : dryRun
              ? { step: 'preview', result: progress.result, redone }
              : { step: 'imported', result: progress.result },
        );
        // The list changed: its download (and the rooms, if set up meanwhile) are read again.
        if (progress.kind === 'done' && !dryRun) this.dayInput.reload();
      },
      error: (error: unknown) => {
        if (!isApiError(error)) return this.state.set({ step: 'failed', purpose, message: 'The file could not be sent. Try again.' });
        const refusal = importRefusalOf(error);
        // Someone changed the day since the preview: show what the file would change now.
        if (error.code === 'day_changed') this.send(true, undefined, true);
        else if (refusal) this.state.set({ step: 'refused', refusal });
        else this.state.set({ step: 'failed', purpose, message: error.message });
      },
    });
  }
}
