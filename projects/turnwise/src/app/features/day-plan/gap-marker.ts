import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PlanGap } from '@shared/api/plan';
import { VERDICT_DISPLAY } from '../../shared/ui/verdict-chip';
import { BAND_PART_LABELS, BandSegment } from './turnover-band';

/** Room the marker needs for its word, and for "short by N min" after it. */
const WORD_PX = 64;
const SHORT_BY_PX = 150;
/** A gap narrower than this still gets a marker wide enough to see and click. */
const MIN_MARKER_PX = 18;

/**
 * One gap on a lane: a marker in the free time between the exams (verdict icon and word, "short
 * by N min" when there is room) and, below, the computed turnover as a band of hands-on, wet/dry
 * and air-hold parts that runs on under the next exam when the gap is too short.
 */
@Component({
  selector: 'tw-gap-marker',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-gap-marker', '[attr.data-verdict]': 'gap().verdict', '[class.dimmed]': 'dimmed()' },
  template: `
    <button
      type="button"
      class="marker"
      [class.selected]="selected()"
      [attr.data-gap-to]="gap().toExamId"
      [attr.aria-label]="label()"
      [attr.aria-pressed]="selected()"
      [title]="label()"
      [style.left.px]="marker().left"
      [style.width.px]="marker().width"
      (click)="opened.emit()"
    >
      <mat-icon [svgIcon]="icon()" aria-hidden="true" />
      @if (marker().width >= wordPx) {
        <span class="word">{{ gap().verdict }}</span>
      }
      @if (late() && marker().width >= shortByPx) {
        <span class="short-by">short by {{ gap().shortByMinutes }} min</span>
      }
    </button>
    <div class="band" aria-hidden="true" [style.left.px]="left()" [style.width.px]="gap().requiredMinutes * pxPerMinute()" (click)="opened.emit()">
      @for (segment of segments(); track segment.part) {
        <span
          class="segment"
          [attr.data-part]="segment.part"
          [title]="partLabel(segment)"
          [style.left.px]="segment.offsetMinutes * pxPerMinute()"
          [style.width.px]="segment.minutes * pxPerMinute()"
        ></span>
      }
    </div>
  `,
  styleUrl: './gap-marker.scss',
})
export class GapMarker {
  readonly gap = input.required<PlanGap>();
  /** Accession of the exam the gap leads to. */
  readonly toAccession = input.required<string>();
  /** x of the gap's start (the leaving exam's end, or the opening). */
  readonly left = input.required<number>();
  readonly pxPerMinute = input.required<number>();
  readonly segments = input.required<BandSegment[]>();
  readonly selected = input(false);
  readonly dimmed = input(false);
  readonly opened = output<void>();

  protected readonly wordPx = WORD_PX;
  protected readonly shortByPx = SHORT_BY_PX;
  protected readonly icon = computed(() => VERDICT_DISPLAY[this.gap().verdict].icon);
  protected readonly late = computed(() => this.gap().verdict === 'short' || this.gap().verdict === 'overlap');
  /** The free time between the exams; on an overlap, a small marker where the next exam starts. */
  protected readonly marker = computed(() => {
    const freePx = this.gap().availableMinutes * this.pxPerMinute();
    const left = freePx < 0 ? this.left() + freePx : this.left();
    return { left, width: Math.max(MIN_MARKER_PX, freePx) };
  });
  /** "Turnover before ACC-123: short by 4 min, needs 24, has 20" */
  protected readonly label = computed(() => {
    const gap = this.gap();
    const kind = gap.fromExamId === null ? 'Opening' : 'Turnover';
    const verdict = this.late() ? `${gap.verdict === 'overlap' ? 'overlap, ' : ''}short by ${gap.shortByMinutes} min` : gap.verdict;
    const has = gap.availableMinutes < 0 ? `overlaps by ${-gap.availableMinutes}` : `has ${gap.availableMinutes}`;
    const air = gap.airHoldMinutes > 0 ? `, air hold ${gap.airHoldMinutes} min` : '';
    return `${kind} before ${this.toAccession()}: ${verdict}, needs ${gap.requiredMinutes}, ${has}${air}`;
  });

  protected partLabel(segment: BandSegment): string {
    return `${BAND_PART_LABELS[segment.part]} ${Math.round(segment.minutes)} min`;
  }
}
