import type { ChartConfiguration } from 'chart.js';

import type { Report, TurnoverMinutes } from '@shared/api/reports';
import type { ReportTable } from './report-panel';

/*
 * The Report answer turned into the panels' tables and charts. The numbers are the server's;
 * here they are only averaged for reading (per turnover) and laid out.
 */

/** A colour from Turnwise's palette (styles: _palette.scss), read at run time so a revision of it shows here. */
export type PaletteColour = (variable: string) => string;

export function paletteFromDocument(): PaletteColour {
  const style = getComputedStyle(document.documentElement);
  return (variable) => style.getPropertyValue(variable).trim() || '#3b4a5a';
}

const perTurnover = (minutes: number, count: number) => (count > 0 ? Math.round((minutes / count) * 10) / 10 : null);

export function turnoverMinutesTable(rows: TurnoverMinutes[], first: string): ReportTable {
  return {
    columns: [first, 'Turnovers', 'Planned min', 'Actual min', 'Planned avg', 'Actual avg'],
    rows: rows.map((r) => [r.label, r.turnovers, r.plannedMinutes, r.actualMinutes, perTurnover(r.plannedMinutes, r.turnovers), perTurnover(r.actualMinutes, r.turnovers)]),
  };
}

export function turnoverMinutesChart(rows: TurnoverMinutes[], colour: PaletteColour): ChartConfiguration {
  return bars(
    rows.map((r) => r.label),
    [
      { label: 'Planned per turnover (min)', data: rows.map((r) => perTurnover(r.plannedMinutes, r.turnovers) ?? 0), backgroundColor: colour('--tw-band-hands-on') },
      { label: 'Actual per turnover (min)', data: rows.map((r) => perTurnover(r.actualMinutes, r.turnovers) ?? 0), backgroundColor: colour('--tw-state-turning-over-ink') },
    ],
  );
}

const VERDICT_ROWS = [
  ['short', 'Short'],
  ['snug', 'Snug'],
  ['overlap', 'Overlap'],
  ['minutesShort', 'Minutes short'],
] as const;

export function gapsTable(report: Report): ReportTable {
  const { asImported, nowOnImportedDays, now } = report.gaps;
  return {
    columns: ['Gaps', `As imported (${report.gaps.importedDays} days)`, 'Now, same days', `Now, all ${report.days} days`],
    rows: VERDICT_ROWS.map(([key, label]) => [label, asImported[key], nowOnImportedDays[key], now[key]]),
  };
}

export function gapsChart(report: Report, colour: PaletteColour): ChartConfiguration {
  const verdicts = VERDICT_ROWS.slice(0, 3);
  return bars(
    verdicts.map(([, label]) => label),
    [
      { label: 'As imported', data: verdicts.map(([key]) => report.gaps.asImported[key]), backgroundColor: colour('--tw-verdict-short-tint'), borderColor: colour('--tw-verdict-short-ink'), borderWidth: 2 },
      { label: 'Now (same days)', data: verdicts.map(([key]) => report.gaps.nowOnImportedDays[key]), backgroundColor: colour('--tw-verdict-fits-ink') },
    ],
  );
}

export function movesTable(report: Report): ReportTable {
  return { columns: ['Reason', 'Changes', 'Exams moved'], rows: report.moves.map((m) => [m.reason, m.changes, m.exams]) };
}

export function movesChart(report: Report, colour: PaletteColour): ChartConfiguration {
  return bars(report.moves.map((m) => m.reason), [{ label: 'Exams moved', data: report.moves.map((m) => m.exams), backgroundColor: colour('--tw-state-in-exam-ink') }]);
}

export function shiftTasksTable(report: Report): ReportTable {
  const t = report.shiftTasks;
  if (t.due === 0) return { columns: ['Shift tasks', 'Occurrences'], rows: [] };
  return { columns: ['Shift tasks', 'Occurrences'], rows: [['On time', t.onTime], ['Late', t.late], ['Missed', t.missed], ['Not yet due', t.open], ['Due in range', t.due]] };
}

export function shiftTasksChart(report: Report, colour: PaletteColour): ChartConfiguration {
  const t = report.shiftTasks;
  return bars(['On time', 'Late', 'Missed', 'Not yet due'], [
    {
      label: 'Occurrences',
      data: [t.onTime, t.late, t.missed, t.open],
      backgroundColor: [colour('--tw-state-ready-ink'), colour('--tw-verdict-snug-ink'), colour('--tw-verdict-short-ink'), colour('--tw-state-closed-ink')],
    },
  ]);
}

export function roomUseTable(report: Report): ReportTable {
  return {
    columns: ['Room', 'List days', 'Exam min', 'Open min', 'Use'],
    rows: report.roomUse.map((r) => [r.label, r.days, r.examMinutes, r.openMinutes, r.use === null ? null : `${(r.use * 100).toFixed(1)} %`]),
  };
}

export function roomUseChart(report: Report, colour: PaletteColour): ChartConfiguration {
  const config = bars(report.roomUse.map((r) => r.label), [
    { label: 'Room use (%)', data: report.roomUse.map((r) => Math.round((r.use ?? 0) * 1000) / 10), backgroundColor: colour('--tw-state-drying-ink') },
  ]);
  return { ...config, options: { ...config.options, indexAxis: 'y', scales: { x: { beginAtZero: true, max: 100 } } } };
}

export function earlyClosesTable(report: Report): ReportTable {
  const e = report.earlyCloses;
  if (e.closed === 0) return { columns: ['Reason given', 'Turnovers'], rows: [] };
  return { columns: ['Reason given', 'Turnovers'], rows: [...e.reasons.map((r): [string, number] => [r.reason, r.count]), ['Closed early, all reasons', e.early], ['Turnovers completed', e.closed]] };
}

export function contactTable(report: Report): ReportTable {
  const rows = [...report.contact.byProduct, report.contact.total].filter((t) => t.steps > 0);
  return {
    columns: ['Product', 'Steps', 'Met label time', 'Below', 'Required min', 'Achieved min'],
    rows: rows.map((t) => [t.label, t.steps, t.met, t.below, t.requiredMinutes, t.achievedMinutes]),
  };
}

export function airHoldsTable(report: Report): ReportTable {
  const a = report.airHolds;
  if (a.count === 0) return { columns: ['Air holds', 'Value'], rows: [] };
  return { columns: ['Air holds', 'Value'], rows: [['Turnovers after airborne cases', a.count], ['Air-hold minutes', a.minutes], ['Made ready before the hold ended', a.endedEarly]] };
}

function bars(labels: string[], datasets: ChartConfiguration<'bar'>['data']['datasets']): ChartConfiguration {
  return {
    type: 'bar',
    data: { labels, datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      plugins: { legend: { display: datasets.length > 1, position: 'bottom' } },
      // counts and minutes: whole-number ticks only
      scales: { y: { beginAtZero: true, ticks: { precision: 0 } } },
    },
  } as ChartConfiguration;
}
