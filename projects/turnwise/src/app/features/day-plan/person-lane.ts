import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PersonLaneView } from './person-lane-view';
import type { TimelineScale } from './timeline-scale';

/**
 * One person's lane in the people view: a header (name, hours, turnovers, rooms covered) and along
 * the time axis their shift (time off shift shaded), breaks, walks between rooms, free time, each
 * piece of turnover work as a button that opens its gap, and clashes marked with a hatched band,
 * an icon and the word. Pieces that overlap are drawn one above the other, so none hides another.
 */
@Component({
  selector: 'tw-person-lane',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'tw-person-lane',
    role: 'listitem',
    '[attr.aria-label]': 'view().label',
    '[attr.data-person-id]': 'view().person.id',
    '[class.clashing]': 'view().clashes.length > 0',
  },
  templateUrl: './person-lane.html',
  styleUrl: './person-lane.scss',
})
export class PersonLane {
  readonly view = input.required<PersonLaneView>();
  readonly scale = input.required<TimelineScale>();
  readonly selectedGap = input<number | null>(null);
  /** A piece of work was chosen: open the gap it turns over (by the exam it leads to). */
  readonly workOpened = output<number>();
}
