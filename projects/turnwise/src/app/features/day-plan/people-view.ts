import {
  ChangeDetectionStrategy, Component, DestroyRef, ElementRef, Injector, afterNextRender, computed, effect, inject, input, output, signal,
  viewChild,
} from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { DateTime } from 'luxon';

import type { DayPlan } from '@shared/api/plan';
import { Clock } from '../../core/time/clock';
import { centreAlongAxis, nowLineClear, scrollToDayStart } from './lane-scroll';
import { LANE_HEADER_PX } from './lane-size';
import { PersonLane } from './person-lane';
import { clockOf } from './lane-view';
import { personLaneView, uncoveredRooms } from './person-lane-view';
import { TimeAxis } from './time-axis';
import { Zoom, dayRange, readablePxPerMinute, scaleFor, xOf } from './timeline-scale';

/**
 * The people view of the Day plan: a lane per person on the day's roster, on the room timeline's
 * time scale (same zoom, same px per minute), with each person's turnover work, walks, breaks,
 * free time and clashes. Choosing a piece of work opens its gap, as a gap marker does on the rooms.
 */
@Component({
  selector: 'tw-people-view',
  imports: [MatIconModule, PersonLane, TimeAxis],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './people-view.html',
  styleUrl: './people-view.scss',
})
export class PeopleView {
  private readonly injector = inject(Injector);
  private readonly nowMs = inject(Clock).minute;

  readonly plan = input.required<DayPlan>();
  readonly zoom = input<Zoom>('4h');
  readonly onlyProblems = input(false);
  readonly selectedGap = input<number | null>(null);
  /** Today at the site; the now line shows only on that day. */
  readonly today = input<string | null>(null);
  readonly gapOpened = output<number>();

  private readonly scroller = viewChild.required<ElementRef<HTMLElement>>('scroller');
  private readonly viewportPx = signal(1000);

  /** The rooms' day (as on the room timeline), widened to whole hours when a shift starts earlier or ends later. */
  protected readonly range = computed(() => {
    const plan = this.plan();
    const rooms = dayRange(plan);
    let { startMs, endMs } = rooms;
    for (const person of plan.people?.people ?? []) {
      startMs = Math.min(startMs, DateTime.fromISO(person.start, { zone: plan.timezone }).startOf('hour').toMillis());
      const end = DateTime.fromISO(person.end, { zone: plan.timezone });
      endMs = Math.max(endMs, (end.startOf('hour').equals(end) ? end : end.startOf('hour').plus({ hours: 1 })).toMillis());
    }
    return { startMs, endMs };
  });
  /** The room timeline's own rule for px per minute (its shortest exam stays readable there), so both views share a scale. */
  private readonly shortestExam = computed(() => {
    const minutes = this.plan().rooms.flatMap((room) => room.exams.map((exam) => exam.durationMinutes));
    return minutes.length ? Math.min(...minutes) : null;
  });
  protected readonly scale = computed(() => scaleFor(this.range(), this.zoom(), this.viewportPx() - LANE_HEADER_PX, readablePxPerMinute(this.shortestExam())));
  protected readonly headerPx = LANE_HEADER_PX;
  protected readonly nowX = computed(() => {
    const now = this.nowMs();
    const { startMs, endMs } = this.scale();
    return this.plan().date === this.today() && now >= startMs && now <= endMs ? xOf(this.scale(), now) : null;
  });
  /** The now line is drawn only clear of the sticky room names (see nowLineClear). */
  protected readonly nowClear = nowLineClear(() => this.scroller().nativeElement, this.nowX);
  protected readonly lanes = computed(() => (this.plan().people?.people ?? []).map((person) => personLaneView(person, this.plan(), this.scale(), this.onlyProblems())));
  protected readonly clashes = computed(() => this.lanes().reduce((sum, lane) => sum + lane.clashes.length, 0));
  protected readonly uncovered = computed(() => uncoveredRooms(this.plan()).map((room) => room.name));
  /** Turnovers of covered rooms that nobody on the roster can do: no lane shows them, so they are listed. */
  protected readonly unstaffed = computed(() =>
    this.plan().rooms.flatMap((room) =>
      room.gaps
        .filter((gap) => gap.crew?.length === 0)
        .map((gap) => {
          const to = room.exams.find((exam) => exam.id === gap.toExamId);
          return { toExamId: gap.toExamId, words: `${room.name}, ${to?.accession ?? 'exam ' + gap.toExamId} at ${to ? clockOf(to.start) : ''}` };
        }),
    ),
  );
  protected readonly provenOptimal = computed(() => this.plan().people?.provenOptimal ?? true);
  protected readonly walkingMinutes = computed(() => this.plan().people?.walkingMinutes ?? 0);

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const element = this.scroller().nativeElement;
      if (element.clientWidth > 0) this.viewportPx.set(Math.max(480, element.clientWidth));
      if (typeof ResizeObserver === 'undefined') return;
      const observer = new ResizeObserver(([entry]) => this.viewportPx.set(Math.max(480, entry.contentRect.width)));
      observer.observe(element);
      destroyRef.onDestroy(() => observer.disconnect());
    });
    // The work of the gap open in the panel stays in view: when it is chosen (a problem stepped to,
    // an exam from the address) and when the scale changes under it (the panel narrows the lanes, a zoom).
    effect(() => {
      const toExamId = this.selectedGap();
      this.scale();
      if (toExamId !== null) afterNextRender(() => this.keepInView(toExamId), { injector: this.injector });
    });
    // On a new day (and on first showing), bring the working part into view: now on today, else the first exam (as the room timeline does).
    let shownDate = '';
    effect(() => {
      const plan = this.plan();
      if (plan.date === shownDate) return;
      shownDate = plan.date;
      afterNextRender(() => this.scrollToStart(), { injector: this.injector });
    });
  }

  /** Brings the work on a gap into view and puts the keyboard on it (the first person's, when several share it). */
  reveal(toExamId: number): void {
    afterNextRender(
      () => {
        const scroller = this.scroller().nativeElement;
        const work = scroller.querySelector<HTMLElement>(`[data-work-to="${toExamId}"]`);
        if (!work) return;
        centreAlongAxis(scroller, work);
        work.focus({ preventScroll: true });
      },
      { injector: this.injector },
    );
  }

  /** Scrolls sideways just enough to show the gap's first piece of work, if it is out of view. */
  private keepInView(toExamId: number): void {
    const scroller = this.scroller().nativeElement;
    const work = scroller.querySelector<HTMLElement>(`[data-work-to="${toExamId}"]`);
    if (!work) return;
    const box = work.getBoundingClientRect();
    const view = scroller.getBoundingClientRect();
    const left = view.left + LANE_HEADER_PX;
    if (box.left < left) scroller.scrollLeft -= left - box.left + 24;
    else if (box.right > view.right) scroller.scrollLeft += box.right - view.right + 24;
  }

  private scrollToStart(): void {
    scrollToDayStart(this.scroller().nativeElement, this.plan(), this.scale(), this.nowX());
  }
}
