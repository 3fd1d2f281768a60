import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { TimelineScale, axisTicks } from './timeline-scale';

/**
 * The time axis above a timeline's lanes (rooms or people): hour marks with their site time,
 * quarter-hour marks when there is room, the now flag, and the corner over the lane headers.
 * Sticky at the top of its scroller, its corner sticky at the left, like the lane headers.
 */
@Component({
  selector: 'tw-time-axis',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-time-axis', 'aria-hidden': 'true' },
  template: `
    <div class="corner">{{ corner() }}</div>
    <div class="ticks" [style.width.px]="scale().widthPx">
      @for (tick of ticks(); track tick.x) {
        <span class="tick" [class.hour]="tick.label !== null" [style.left.px]="tick.x">
          @if (tick.label) {
            <span class="label">{{ tick.label }}</span>
          }
        </span>
      }
      @if (nowX() !== null) {
        <span class="now-flag" [style.left.px]="nowX()">now</span>
      }
    </div>
  `,
  styleUrl: './time-axis.scss',
})
export class TimeAxis {
  readonly scale = input.required<TimelineScale>();
  /** IANA zone of the site: the hour labels are its wall clock. */
  readonly timezone = input.required<string>();
  /** What the corner over the lane headers says ("Room", "Person"). */
  readonly corner = input.required<string>();
  /** Where now is, in pixels from the axis start; null when now is not on the drawn day. */
  readonly nowX = input<number | null>(null);

  protected readonly ticks = computed(() => axisTicks(this.scale(), this.timezone()));
}
