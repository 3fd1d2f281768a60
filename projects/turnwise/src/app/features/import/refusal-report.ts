import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { ImportRefusal } from '@shared/api/import';
import { issueLine } from './issue-text';
import { markRefusedTable } from './refusal-table';

/** A refused file: every problem by row and column, and the file itself with the bad cells marked. */
@Component({
  selector: 'tw-refusal-report',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './refusal-report.html',
  styleUrl: './refusal-report.scss',
})
export class RefusalReport {
  readonly refusal = input.required<ImportRefusal>();

  protected readonly lineOf = issueLine;
  protected readonly count = computed(() => this.refusal().errors.length);
  protected readonly table = computed(() => {
    const refusal = this.refusal();
    return refusal.table && refusal.table.length > 0 ? markRefusedTable(refusal.table, refusal.errors) : null;
  });
}
