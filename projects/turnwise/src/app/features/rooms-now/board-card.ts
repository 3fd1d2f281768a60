import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { BoardRoom, RoomState } from '@shared/api/board';
import { ROOM_STATE_DISPLAY, RoomStateChip } from '../../shared/ui/room-state-chip';
import { SiteTime } from '../../shared/ui/site-time';
import { readyCountdown } from './ready-countdown';

/** States that end by themselves at ready-at, so the card counts down to it. */
const COUNTING_DOWN: readonly RoomState[] = ['turning over', 'drying', 'air hold'];

/** One room on Rooms now: its state, when it is ready, the next patient and what is overdue. */
@Component({
  selector: 'tw-board-card',
  imports: [MatButtonModule, MatIconModule, RouterLink, RoomStateChip, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-board-card', '[attr.data-state]': 'room().state', '[class.wall]': 'wall()', role: 'listitem' },
  templateUrl: './board-card.html',
  styleUrl: './board-card.scss',
})
export class BoardCard {
  readonly room = input.required<BoardRoom>();
  /** Now on the server's clock, in ms, ticking. */
  readonly now = input.required<number>();
  /** The wall display: bigger, and no controls at all. */
  readonly wall = input(false);
  readonly canMarkArrived = input(false);
  readonly canWorkTurnover = input(false);
  /** An arrival call for this room is on its way. */
  readonly busy = input(false);

  readonly arrived = output<number>();
  readonly undoArrived = output<number>();

  /**
   * A turnover running behind its plan: the steps still to do end after the planned ready-at.
   * The card then leads with the estimate (what the next patient waits for; "Running late"
   * follows it too) and keeps the plan beside it.
   */
  protected readonly behind = computed(() => {
    const { state, readyAt, expectedReadyAt } = this.room();
    return COUNTING_DOWN.includes(state) && readyAt !== null && expectedReadyAt !== null && Date.parse(expectedReadyAt) - Date.parse(readyAt) >= 60_000;
  });
  protected readonly shownReadyAt = computed(() => (this.behind() ? this.room().expectedReadyAt : this.room().readyAt));
  /** "in 17 min" or "overdue by 4 min", for the states that end by themselves at ready-at. */
  protected readonly countdown = computed(() => {
    const state = this.room().state;
    const readyAt = this.shownReadyAt();
    return COUNTING_DOWN.includes(state) && readyAt ? readyCountdown(readyAt, this.now()) : null;
  });
  /** The wall display's state band: the icon and word told apart by shape and pattern as well as colour. */
  protected readonly stateIcon = computed(() => (ROOM_STATE_DISPLAY[this.room().state] ?? ROOM_STATE_DISPLAY.closed).icon);

  protected readonly overdueTasks = computed(() => this.room().tasks.filter((task) => task.overdue));
  protected readonly showControls = computed(() => !this.wall() && this.canMarkArrived());
  protected readonly showLink = computed(() => !this.wall() && this.canWorkTurnover());
}
