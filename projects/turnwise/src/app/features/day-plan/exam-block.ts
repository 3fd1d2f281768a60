import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { BlockView } from './lane-view';

/**
 * One exam slot on a lane, placed by its start and length: accession, then the time on a line of
 * its own (never cut mid-number: the lane drops the end, then the time, when the block is narrow),
 * procedure and flags. Presentational: the timeline listens for pointer and key events on the
 * lanes and finds the block by `data-exam-id` (a click or Enter opens the exam, a drag or the
 * arrow keys move it).
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
    '[attr.data-exam-id]': 'view().exam.id',
    '[attr.aria-label]': 'view().label',
    '[attr.aria-describedby]': 'movable() ? "tw-move-hint" : "tw-open-hint"',
    '[attr.title]': 'view().label',
    '[class.compact]': 'view().compact',
    '[class.movable]': 'movable()',
    '[class.moving]': 'moving()',
    '[class.dimmed]': 'view().dimmed',
    '[class.outside]': 'view().exam.outsideHours',
    '[style.left.px]': 'view().left',
    '[style.width.px]': 'view().width',
  },
  template: `
    @let v = view();
    <!-- In the label's order (time after procedure, since a narrow block cuts the time), so what is
         seen is always a run of the label's words; the stylesheet still shows the time second. The
         spaces (&ngsp;) keep the lines apart as words when the text is read as one string. -->
    <div class="accession">{{ v.accession }}</div>&ngsp;
    <div class="procedure">{{ v.exam.procedure }}</div>&ngsp;
    @if (v.time) {
      <div class="time">{{ v.time }}</div>&ngsp;
    }
    @if (v.flags.length) {
      <ul class="flags" aria-hidden="true">
        @for (flag of v.flags; track flag.kind) {
          <li [class]="flag.kind"><mat-icon [svgIcon]="flag.icon" />@if (!v.compact) {<span>{{ flag.text }}</span>}</li>&ngsp;
        }
      </ul>
    }
  `,
  styleUrl: './exam-block.scss',
})
export class ExamBlock {
  readonly view = input.required<BlockView>();
  readonly movable = input(false);
  readonly moving = input(false);
}
