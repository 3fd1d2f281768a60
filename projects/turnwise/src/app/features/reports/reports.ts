import { ChangeDetectionStrategy, Component, computed, effect, inject, linkedSignal, signal } from '@angular/core';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { DateTime } from 'luxon';

import { REPORT_MAX_DAYS } from '@shared/api/limits';
import { daysInRange } from '@shared/api/reports';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { serverState } from '../../core/state/server-state';
import { CautionNote } from '../../shared/ui/caution-note';
import { shortDay } from '../../shared/ui/site-time';
import { TurnoverService } from '../turnover/turnover-service';
import { ReportPanel } from './report-panel';
import { ReportService, type ReportFilters } from './report-service';
import * as tables from './report-tables';

/** A `YYYY-MM-DD` as the date picker's Date (local midnight) and back. */
const toDate = (day: string): Date | null => (day ? DateTime.fromISO(day).toJSDate() : null);
const toDay = (date: Date | null): string => (date ? DateTime.fromJSDate(date).toISODate()! : '');

/**
 * Reports: a range's turnover minutes, gaps, moves, early closes, contact times, air holds,
 * shift tasks and room use, as charts with their tables and CSV exports. The numbers are the
 * server's (one serverState keyed by the filters); the charts only draw them.
 */
@Component({
  selector: 'tw-reports',
  imports: [MatDatepickerModule, MatFormFieldModule, MatIconModule, MatInputModule, CautionNote, ReportPanel],
  providers: [provideNativeDateAdapter()],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './reports.html',
  styleUrl: './reports.scss',
})
export class Reports {
  protected readonly maxDays = REPORT_MAX_DAYS;
  protected readonly day = shortDay;
  private readonly service = inject(ReportService);
  protected readonly today = inject(SiteSettingsService).today;
  private readonly turnovers = inject(TurnoverService);
  protected readonly rooms = serverState(() => this.turnovers.rooms(), 'The rooms could not be shown.');
  /** The last seven days up to today at the site, until the user picks a range. */
  protected readonly to = linkedSignal(() => this.today() ?? '');
  protected readonly from = linkedSignal(() => (this.to() ? DateTime.fromISO(this.to()).minus({ days: 6 }).toISODate()! : ''));
  protected readonly roomId = signal<number | null>(null);
  protected readonly fromDate = computed(() => toDate(this.from()));
  protected readonly toDate = computed(() => toDate(this.to()));
  private readonly filters = computed<ReportFilters>(() => ({ from: this.from(), to: this.to(), roomId: this.roomId() }));
  /** Said before asking the server, which would refuse the same (422). */
  protected readonly rangeProblem = computed(() => {
    const { from, to } = this.filters();
    if (!from || !to) return 'Pick the first and the last day.';
    const days = daysInRange(from, to);
    return days > REPORT_MAX_DAYS ? `A report covers at most ${REPORT_MAX_DAYS} days; this range has ${days}.` : null;
  });
  protected readonly report = serverState((filters: ReportFilters) => this.service.report(filters), 'The report could not be made.');

  private readonly palette = signal<tables.PaletteColour>(tables.paletteFromDocument());
  protected readonly panels = computed(() => {
    const r = this.report.value();
    if (!r) return null;
    const colour = this.palette();
    return {
      byRoom: { table: tables.turnoverMinutesTable(r.turnoverMinutes.byRoom, 'Room'), chart: tables.turnoverMinutesChart(r.turnoverMinutes.byRoom, colour) },
      byPrecaution: { table: tables.turnoverMinutesTable(r.turnoverMinutes.byPrecaution, 'Precaution'), chart: tables.turnoverMinutesChart(r.turnoverMinutes.byPrecaution, colour) },
      gaps: { table: tables.gapsTable(r), chart: tables.gapsChart(r, colour) },
      moves: { table: tables.movesTable(r), chart: tables.movesChart(r, colour) },
      shiftTasks: { table: tables.shiftTasksTable(r), chart: tables.shiftTasksChart(r, colour) },
      roomUse: { table: tables.roomUseTable(r), chart: tables.roomUseChart(r, colour) },
      earlyCloses: { table: tables.earlyClosesTable(r) },
      contact: { table: tables.contactTable(r) },
      airHolds: { table: tables.airHoldsTable(r) },
    };
  });

  constructor() {
    this.rooms.show('all');
    effect(() => {
      const filters = this.filters();
      if (this.rangeProblem() === null) this.report.show(filters);
    });
  }

  protected pickFrom(date: Date | null): void {
    this.from.set(toDay(date));
  }

  /** The range's end; the picker sends null while the user is between the two clicks. */
  protected pickTo(date: Date | null): void {
    if (date) this.to.set(toDay(date));
  }

  protected pickRoom(event: Event): void {
    const value = (event.target as HTMLSelectElement).value;
    this.roomId.set(value ? Number(value) : null);
  }
}
