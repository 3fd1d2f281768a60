import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { TURNOVER_STAFF } from '@shared/api/limits';
import type { PlanRoom } from '@shared/api/plan';
import { ExamBlock } from './exam-block';
import { GapMarker } from './gap-marker';
import { LaneSlot, clockOf, laneView } from './lane-view';
import type { FitGhost } from './fit-preview';
import { TimelineScale, xOf } from './timeline-scale';

/**
 * One room's lane: its header (name, modality, people on turnover, first and last slot) and,
 * along the time axis, every gap before the exam it leads to, then the exam: that is also the
 * tab order, by time. With `onlyProblems`, fitting gaps and the exams around them are dimmed.
 * A lane not `drawn` (scrolled far out of view) shows its header and an empty track: a long day
 * of many rooms then draws only what is on screen, and each lane once it comes near.
 */
@Component({
  selector: 'tw-room-lane',
  imports: [MatButtonModule, MatIconModule, ExamBlock, GapMarker],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-room-lane', role: 'group', '[attr.aria-label]': 'room().name + " lane"', '[attr.data-room-id]': 'room().id' },
  templateUrl: './room-lane.html',
  styleUrl: './room-lane.scss',
})
export class RoomLane {
  readonly room = input.required<PlanRoom>();
  readonly scale = input.required<TimelineScale>();
  readonly onlyProblems = input(false);
  readonly mayMove = input(false);
  readonly mayStaff = input(false);
  readonly movingExamId = input<number | null>(null);
  readonly selectedGap = input<number | null>(null);
  readonly drawn = input(true);
  /** Exams the booking feed moved after a hand change (the day's history). */
  readonly movedByBooking = input<ReadonlySet<number>>(new Set());
  /** "Make the day fit" preview: exams' old places in this lane, and the exams (or gaps) it changes. */
  readonly ghosts = input<readonly FitGhost[]>([]);
  readonly proposed = input<ReadonlySet<number>>(new Set());
  readonly gapOpened = output<number>();
  readonly staffChanged = output<number>();
  /** "N to check" was chosen: show the room's first problem gap. */
  readonly problemsOpened = output<void>();

  protected readonly ghostViews = computed(() =>
    this.ghosts().map((g) => ({ ...g, left: xOf(this.scale(), g.startMs), width: Math.max(2, xOf(this.scale(), g.endMs) - xOf(this.scale(), g.startMs)), label: `${g.accession} was here (${clockOf(g.start)})` })),
  );
  /** Fewest and most people a turnover may have (the server's limits). */
  protected readonly staffRange = TURNOVER_STAFF;
  protected readonly span = computed(() => {
    const exams = this.room().exams;
    return exams.length ? `${clockOf(exams[0].start)}–${clockOf(exams[exams.length - 1].end)}` : 'no exams';
  });
  /** The span is the day's exams, not the room's hours (Setup has those): said on hover. */
  protected readonly spanHint = computed(() => {
    const exams = this.room().exams;
    return exams.length ? `First exam starts ${clockOf(exams[0].start)}, last one ends ${clockOf(exams[exams.length - 1].end)} (the room's opening hours are in Setup)` : 'No exams in this room this day';
  });
  protected readonly problems = computed(() => this.room().gaps.filter((gap) => gap.verdict !== 'fits').length);
  protected readonly problemsHint = computed(() => {
    const n = this.problems();
    // Starts with the visible words, so speech input can name the button as it reads (WCAG 2.5.3).
    return `${n} to check: ${n === 1 ? 'a gap' : `${n} gaps`} in ${this.room().name} snug, short or overlapping; show the first`;
  });
  /** Closed hours before opening and after closing, drawn quieter than open time. */
  protected readonly open = computed(() => {
    const { widthPx } = this.scale();
    const left = Math.min(widthPx, Math.max(0, xOf(this.scale(), this.room().opensAt)));
    return { left, right: Math.max(left, Math.min(widthPx, xOf(this.scale(), this.room().closesAt))) };
  });

  protected readonly slots = computed((): LaneSlot[] => (this.drawn() ? laneView(this.room(), this.scale(), this.onlyProblems(), this.movedByBooking()) : []));

  protected staffWord(staff: number): string {
    return staff === 1 ? 'person' : 'people';
  }
}
