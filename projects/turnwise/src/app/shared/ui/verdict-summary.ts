import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { PlanSummary, Verdict } from '@shared/api/plan';
import { VerdictChip } from './verdict-chip';

/** Worst first: what needs fixing leads. */
const ORDER: readonly Verdict[] = ['overlap', 'short', 'snug', 'fits'];

/** Gap counts per verdict and the minutes short, for the Day plan bar and the Import preview. */
@Component({
  selector: 'tw-verdict-summary',
  imports: [VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-verdict-summary' },
  template: `
    <ul aria-label="Gaps by verdict">
      @for (verdict of order; track verdict) {
        <li>
          <strong class="count">{{ summary()[verdict] }}</strong>
          <tw-verdict-chip [verdict]="verdict" />
        </li>
      }
      <li class="minutes">
        <strong class="count">{{ summary().minutesShort }}</strong> min short in all
      </li>
    </ul>
  `,
  styles: `
    ul { display: flex; flex-wrap: wrap; gap: 8px 20px; margin: 0; padding: 0; list-style: none; }
    li { display: inline-flex; align-items: center; gap: 6px; }
    .count { font: var(--mat-sys-title-medium); min-width: 1.5ch; text-align: right; }
  `,
})
export class VerdictSummary {
  readonly summary = input.required<PlanSummary>();
  protected readonly order = ORDER;
}
