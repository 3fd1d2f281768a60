import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PlanExam } from '@shared/api/plan';
import { siteClock } from '../../shared/ui/site-time';
import { examFlags } from './exam-flags';

/** Below this width a block shows icons only; the words stay in its label and tooltip. */
const COMPACT_PX = 150;

/**
 * One exam slot on a lane, placed by its start and length. Presentational: the timeline
 * listens for pointer and key events on the lanes and finds the block by `data-exam-id`.
 */
@Component({
  selector: 'tw-exam-block',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'tw-exam-block',
    role: 'button',
    'aria-roledescription': 'exam slot',
    '[attr.tabindex]': '0',
    '[attr.data-exam-id]': 'exam().id',
    '[attr.aria-label]': 'label()',
    '[attr.aria-describedby]': 'movable() ? "tw-move-hint" : null',
    '[attr.title]': 'label()',
    '[class.compact]': 'compact()',
    '[class.movable]': 'movable()',
    '[class.moving]': 'moving()',
    '[class.dimmed]': 'dimmed()',
    '[class.outside]': 'exam().outsideHours',
    '[style.left.px]': 'left()',
    '[style.width.px]': 'width()',
  },
  template: `
    <div class="line">
      <span class="accession">{{ exam().accession }}</span>
      <span class="time">{{ time() }}</span>
    </div>
    <div class="procedure">{{ exam().procedure }}</div>
    <ul class="flags" aria-hidden="true">
      @for (flag of flags(); track flag.kind) {
        <li [class]="flag.kind"><mat-icon [svgIcon]="flag.icon" />@if (!compact()) {<span>{{ flag.text }}</span>}</li>
      }
    </ul>
  `,
  styleUrl: './exam-block.scss',
})
export class ExamBlock {
  readonly exam = input.required<PlanExam>();
  readonly roomName = input.required<string>();
  readonly left = input.required<number>();
  readonly width = input.required<number>();
  readonly movable = input(false);
  readonly moving = input(false);
  readonly dimmed = input(false);

  protected readonly compact = computed(() => this.width() < COMPACT_PX);
  protected readonly time = computed(() => `${siteClock(this.exam().start)}–${siteClock(this.exam().end)}`);
  protected readonly flags = computed(() => examFlags(this.exam()));
  /** "MR 2, 09:30–10:15, ACC-123, MR brain with contrast, contact precautions" */
  protected readonly label = computed(() => {
    const exam = this.exam();
    const parts = [this.roomName(), this.time(), exam.accession, exam.procedure, ...this.flags().map((flag) => flag.text)];
    if (exam.outsideHours) parts.push('outside opening hours');
    return parts.join(', ');
  });
}
