import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { PlanExam, PlanGap, PlanRoom } from '@shared/api/plan';
import { siteClock } from '../../shared/ui/site-time';
import { ExamBlock } from './exam-block';
import { GapMarker } from './gap-marker';
import { TimelineScale, xOf } from './timeline-scale';
import { BandSegment, turnoverBand } from './turnover-band';

interface LaneSlot {
  exam: PlanExam;
  left: number;
  width: number;
  dimmed: boolean;
  gap: { gap: PlanGap; left: number; segments: BandSegment[]; dimmed: boolean } | null;
}

/** Fewest and most people a turnover may have (the server's limits). */
export const STAFF_RANGE = { min: 1, max: 3 } as const;

/**
 * One room's lane: its header (name, modality, people on turnover, first and last slot) and,
 * along the time axis, every gap before the exam it leads to, then the exam: that is also the
 * tab order, by time. With `onlyProblems`, fitting gaps and the exams around them are dimmed.
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
  readonly gapOpened = output<number>();
  readonly staffChanged = output<number>();

  protected readonly staffRange = STAFF_RANGE;
  protected readonly span = computed(() => {
    const exams = this.room().exams;
    return exams.length ? `${siteClock(exams[0].start)}–${siteClock(exams[exams.length - 1].end)}` : 'no exams';
  });
  protected readonly problems = computed(() => this.room().gaps.filter((gap) => gap.verdict !== 'fits').length);
  /** Closed hours before opening and after closing, drawn quieter than open time. */
  protected readonly open = computed(() => {
    const { widthPx } = this.scale();
    const left = Math.min(widthPx, Math.max(0, xOf(this.scale(), this.room().opensAt)));
    return { left, right: Math.max(left, Math.min(widthPx, xOf(this.scale(), this.room().closesAt))) };
  });

  protected readonly slots = computed((): LaneSlot[] => {
    const room = this.room();
    const scale = this.scale();
    const gapBefore = new Map(room.gaps.map((gap) => [gap.toExamId, gap]));
    const byId = new Map(room.exams.map((exam) => [exam.id, exam]));
    const problemNeighbours = new Set<number>();
    for (const gap of room.gaps) {
      if (gap.verdict === 'fits') continue;
      problemNeighbours.add(gap.toExamId);
      if (gap.fromExamId !== null) problemNeighbours.add(gap.fromExamId);
    }
    const dim = this.onlyProblems();
    return room.exams.map((exam) => {
      const gap = gapBefore.get(exam.id);
      const from = gap ? (gap.fromExamId === null ? room.opensAt : byId.get(gap.fromExamId)?.end) : undefined;
      return {
        exam,
        left: xOf(scale, exam.start),
        width: Math.max(4, exam.durationMinutes * scale.pxPerMinute),
        dimmed: dim && !problemNeighbours.has(exam.id),
        gap: gap && from ? { gap, left: xOf(scale, from), segments: turnoverBand(gap, from), dimmed: dim && gap.verdict === 'fits' } : null,
      };
    });
  });

  protected staffWord(staff: number): string {
    return staff === 1 ? 'person' : 'people';
  }
}
