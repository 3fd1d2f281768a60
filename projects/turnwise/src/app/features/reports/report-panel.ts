import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toCsv, type CsvCell } from '@shared/csv/csv';

/** A panel's numbers as a table: the chart's data for screen readers, the CSV's rows. */
export interface ReportTable {
  columns: string[];
  rows: CsvCell[][];
}

/**
 * One report panel: a heading, an optional chart (a picture for sighted users, hidden from
 * screen readers), the same numbers as a table below it, and a CSV export of that table
 * (formula-like cells escaped by shared/csv).
 */
@Component({
  selector: 'tw-report-panel',
  imports: [BaseChartDirective, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-report-panel' },
  template: `
    <div class="head">
      <h2 [id]="id() + '-title'">{{ heading() }}</h2>
      <a mat-stroked-button class="csv" [href]="csvHref()" [attr.download]="id() + '.csv'" [attr.aria-label]="'Export ' + heading() + ' as CSV'">
        <mat-icon svgIcon="download" aria-hidden="true" />CSV
      </a>
    </div>
    <ng-content />
    @if (chart(); as config) {
      @if (table().rows.length > 0) {
        <div class="chart" aria-hidden="true">
          <canvas baseChart [type]="config.type" [data]="config.data" [options]="config.options"></canvas>
        </div>
      }
    }
    @if (table().rows.length === 0) {
      <p class="empty">{{ empty() }}</p>
    } @else {
      <div class="table-wrap" role="region" [attr.aria-labelledby]="id() + '-title'" tabindex="0">
        <table>
          <caption class="visually-hidden">{{ heading() }}</caption>
          <thead>
            <tr>
              @for (column of table().columns; track $index) {
                <th scope="col">{{ column }}</th>
              }
            </tr>
          </thead>
          <tbody>
            @for (row of table().rows; track $index) {
              <tr>
                @for (cell of row; track $index; let first = $first) {
                  @if (first) {
                    <th scope="row">{{ cell ?? '—' }}</th>
                  } @else {
                    <td>{{ cell ?? '—' }}</td>
                  }
                }
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styleUrl: './report-panel.scss',
})
export class ReportPanel {
  readonly id = input.required<string>();
  readonly heading = input.required<string>();
  readonly table = input.required<ReportTable>();
  readonly chart = input<ChartConfiguration | null>(null);
  readonly empty = input('Nothing recorded in this range.');

  /** The table as a CSV file, downloaded from a data address (no server round trip). */
  protected readonly csvHref = computed(() => {
    const { columns, rows } = this.table();
    return `data:text/csv;charset=utf-8,${encodeURIComponent(toCsv([columns, ...rows]))}`;
  });
}
