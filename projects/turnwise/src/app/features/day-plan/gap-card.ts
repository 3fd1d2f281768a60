import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { PlanGap } from '@shared/api/plan';
import { SiteTime } from '../../shared/ui/site-time';
import { VerdictChip } from '../../shared/ui/verdict-chip';

let nextId = 0;

/** The turnover in one gap: verdict, time needed against time available, and its steps on demand. */
@Component({
  selector: 'tw-gap-card',
  imports: [MatButtonModule, MatIconModule, SiteTime, VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-gap-card', '[attr.data-verdict]': 'gap().verdict' },
  templateUrl: './gap-card.html',
  styleUrl: './gap-card.scss',
})
export class GapCard {
  readonly gap = input.required<PlanGap>();

  protected readonly stepsId = `tw-gap-steps-${nextId++}`;
  protected readonly open = signal(false);
  protected readonly opening = computed(() => this.gap().fromExamId === null);
  protected readonly late = computed(() => this.gap().verdict === 'short' || this.gap().verdict === 'overlap');
  /** Only worth saying who does a step when more than one person turns the room over. */
  protected readonly showPerson = computed(() => this.gap().staff > 1);
}
