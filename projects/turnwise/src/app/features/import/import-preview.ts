import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import type { ImportResult } from '@shared/api/import';
import { SiteTime, siteClock } from '../../shared/ui/site-time';
import { VerdictSummary } from '../../shared/ui/verdict-summary';
import { issueLine } from './issue-text';

/** What an import would do (or did): the differences with the current list, warnings, verdicts, rows. */
@Component({
  selector: 'tw-import-preview',
  imports: [MatIconModule, MatTableModule, SiteTime, VerdictSummary],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './import-preview.html',
  styleUrl: './import-preview.scss',
})
export class ImportPreview {
  readonly result = input.required<ImportResult>();

  protected readonly lineOf = issueLine;
  protected readonly columns = [
    'row', 'accession', 'room', 'start', 'duration', 'procedure', 'coil', 'precaution', 'mobility', 'contrast',
  ];
  /** A changed field's value as the preview shows it: a start as its site time, nothing as a dash. */
  protected shown(column: string, value: string): string {
    if (value === '') return '—';
    return column === 'start' ? siteClock(value) || value : value;
  }
  /** Exams the day has now: every one is either kept as is, changed or removed by the file. */
  protected readonly existing = computed(() => {
    const result = this.result();
    return result.unchanged + result.changed.length + result.removed.length;
  });
}
