import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { GapView } from './gap-view';

/**
 * One gap on a lane: a marker in the free time between the exams (verdict icon and word, "short
 * by N min" when there is room), a badge above a short or overlapping gap so the missing minutes
 * read at any zoom, and below, the computed turnover as a band of hands-on, wet/dry and air-hold
 * parts that runs on under the next exam when the gap is too short. Everything is worked out by
 * the lane ({@link GapView}); this only draws it.
 */
@Component({
  selector: 'tw-gap-marker',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'tw-gap-marker',
    '[attr.data-verdict]': 'view().gap.verdict',
    '[class.dimmed]': 'view().dimmed',
    '[class.opening]': 'view().opening',
    '[class.quiet]': 'view().quiet',
    '[class.raised]': 'view().raised',
  },
  template: `
    @let v = view();
    <button
      type="button"
      class="marker"
      [class.selected]="selected()"
      [attr.data-gap-to]="v.gap.toExamId"
      [attr.aria-label]="v.label"
      [attr.aria-pressed]="selected()"
      [title]="v.label"
      [style.left.px]="v.marker.left"
      [style.width.px]="v.marker.width"
      (click)="opened.emit()"
    >
      @if (!v.quiet) {
        <mat-icon [svgIcon]="v.icon" aria-hidden="true" />
      }
      @if (v.word) {
        <span class="word">{{ v.word }}</span>
      }
      @if (v.shortBy) {
        <span class="short-by">{{ v.shortBy }}</span>
      }
    </button>
    @if (v.badge) {
      <span class="badge" aria-hidden="true" [title]="badgeTitle()" [style.left.px]="v.badgeLeft" (click)="opened.emit()">{{ v.badge }}@if (v.badgeMore) {<span class="more"> +{{ v.badgeMore }}</span>}</span>
    }
    <div class="band" aria-hidden="true" [style.left.px]="v.band.left" [style.width.px]="v.band.width" (click)="opened.emit()">
      @for (piece of v.band.pieces; track piece.part) {
        <span class="segment tw-band-fill" [attr.data-part]="piece.part" [title]="piece.title" [style.left.px]="piece.left" [style.width.px]="piece.width"></span>
      }
    </div>
  `,
  styleUrl: './gap-marker.scss',
})
export class GapMarker {
  readonly view = input.required<GapView>();
  readonly selected = input(false);
  readonly opened = output<void>();

  protected readonly badgeTitle = computed(() => {
    const { label, badgeMore } = this.view();
    return badgeMore ? `${label}; and ${badgeMore} more problem ${badgeMore === 1 ? 'gap' : 'gaps'} just after (on their markers)` : label;
  });
}
