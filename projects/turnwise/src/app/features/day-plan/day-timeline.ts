import {
  ChangeDetectionStrategy, Component, DestroyRef, ElementRef, Injector, afterNextRender, computed, effect, inject, input, output,
  signal, viewChild,
} from '@angular/core';

import type { MoveReason } from '@shared/api/limits';
import type { DayPlan, PlanExam, PlanRoom } from '@shared/api/plan';
import { Clock } from '../../core/time/clock';
import { DayPlanStore } from './day-plan-store';
import { LANE_HEADER_PX, LANE_HEIGHT_PX } from './lane-size';
import { centreAlongAxis, nowLineClear, scrollToDayStart } from './lane-scroll';
import { LaneWindow } from './lane-window';
import type { FitGhost, FitPreview } from './fit-preview';
import { previewMove } from './plan-preview';
import { DragPointer, PointerDrag } from './pointer-drag';
import { markStart, measureSinceStart } from './render-marks';
import { RoomLane } from './room-lane';
import { TimeAxis } from './time-axis';
import { PendingMove, clampStart, moveStatus, movedWithoutGaps, nextLane } from './slot-moves';
import { SNAP_MINUTES, Zoom, dayRange, readablePxPerMinute, scaleFor, siteIso, snapToMinutes, xOf } from './timeline-scale';

const MINUTE = 60_000;
/** A press and release further apart than this moved the slot (PointerDrag's threshold): not a click. */
const CLICK_WOBBLE_PX = 4;

/**
 * The lanes of the day on a shared time axis, with the now line. Slots move by pointer (drag
 * along or across lanes, 5-minute steps) or by keyboard; while moving, the touched rooms are
 * recomputed in the browser with the server's engine so the gaps show their would-be verdicts.
 */
@Component({
  selector: 'tw-day-timeline',
  imports: [RoomLane, TimeAxis],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './day-timeline.html',
  styleUrl: './day-timeline.scss',
})
export class DayTimeline {
  private readonly store = inject(DayPlanStore);
  protected readonly movedByBooking = this.store.movedByBooking;
  private readonly injector = inject(Injector);

  readonly plan = input.required<DayPlan>();
  readonly zoom = input<Zoom>('4h');
  readonly onlyProblems = input(false);
  readonly mayMove = input(false);
  readonly mayStaff = input(false);
  readonly selectedGap = input<number | null>(null);
  /** Today at the site; the now line shows only on that day. */
  readonly today = input<string | null>(null);
  readonly gapOpened = output<number>();
  readonly roomStaffChanged = output<{ roomId: number; staff: number }>();
  readonly roomProblemsOpened = output<number>();
  /** A drop the timeline refused itself (a lane of another modality), in words. */
  readonly refusal = output<string>();
  /** An exam block clicked (without dragging it) or pressed with Enter or Space: open the exam. */
  readonly examOpened = output<PlanExam>();
  /** A "make the day fit" proposal to show: its rooms instead of the plan's, old places ghosted. */
  readonly fit = input<FitPreview | null>(null);
  protected readonly noGhosts: readonly FitGhost[] = [];
  protected readonly noneProposed: ReadonlySet<number> = new Set();

  private readonly scroller = viewChild.required<ElementRef<HTMLElement>>('scroller');
  private readonly lanesEl = viewChild.required<ElementRef<HTMLElement>>('laneList');
  private readonly viewportPx = signal(1000);
  private readonly nowMs = inject(Clock).minute;

  protected readonly headerPx = LANE_HEADER_PX;
  protected readonly pending = signal<PendingMove | null>(null);
  /** While dragging: the lane under the pointer when it cannot take the slot (another modality). */
  private readonly refusedLane = signal<PlanRoom | null>(null);
  protected readonly range = computed(() => dayRange(this.plan()));
  private readonly shortestExam = computed(() => {
    const minutes = this.plan().rooms.flatMap((room) => room.exams.map((exam) => exam.durationMinutes));
    return minutes.length ? Math.min(...minutes) : null;
  });
  protected readonly scale = computed(() => scaleFor(this.range(), this.zoom(), this.viewportPx() - LANE_HEADER_PX, readablePxPerMinute(this.shortestExam())));
  protected readonly nowX = computed(() => {
    const now = this.nowMs();
    const { startMs, endMs } = this.scale();
    return this.plan().date === this.today() && now >= startMs && now <= endMs ? xOf(this.scale(), now) : null;
  });
  /** The now line is drawn only clear of the sticky room names (see nowLineClear). */
  protected readonly nowClear = nowLineClear(() => this.scroller().nativeElement, this.nowX);

  /** Each exam with the room it is stored in, to find where a move starts from. */
  private readonly homes = computed(() => new Map(this.plan().rooms.flatMap((room) => room.exams.map((exam) => [exam.id, { exam, room }] as const))));
  private readonly preview = computed(() => {
    const move = this.pending();
    const input = this.store.previewInput();
    if (!move) return null;
    const start = siteIso(move.startMs, this.plan().timezone);
    return (input && previewMove(input, { examId: move.exam.id, roomId: move.roomId, start })) ?? null;
  });
  protected readonly lanes = computed((): PlanRoom[] => {
    const fit = this.fit();
    const rooms = fit ? this.plan().rooms.map((room) => fit.rooms.get(room.id) ?? room) : this.plan().rooms;
    const move = this.pending();
    if (!move) return rooms;
    const preview = this.preview();
    if (preview) return rooms.map((room) => preview.get(room.id) ?? room);
    const tz = this.plan().timezone;
    return movedWithoutGaps(rooms, move, siteIso(move.startMs, tz), siteIso(move.startMs + move.exam.durationMinutes * MINUTE, tz));
  });
  /** Lanes drawn in full; the others show their header only until they come near the view. */
  protected readonly lanesInView = new LaneWindow(this.plan);
  protected readonly status = computed(() => {
    const move = this.pending();
    if (!move) return '';
    const refused = this.refusedLane();
    if (refused) return otherModality(move.exam, refused, this.plan().rooms);
    const words = moveStatus(move, this.lanes().find((room) => room.id === move.roomId));
    return move.reason === 'keyboard' ? `${words}. Enter saves, Escape cancels.` : words;
  });

  private drag: PointerDrag | null = null;
  /** Where the last press began: a click that ends far from it was a drag, not an opening. */
  private pressedAt: { x: number; y: number } | null = null;

  constructor() {
    const destroyRef = inject(DestroyRef);
    destroyRef.onDestroy(() => this.drag?.end());

    afterNextRender(() => {
      const element = this.scroller().nativeElement;
      // Measured now, before the first scroll to "now", so that scroll uses the real scale.
      if (element.clientWidth > 0) this.viewportPx.set(Math.max(480, element.clientWidth));
      this.lanesInView.seen(element);
      // Passive and outside the template: a scroll only redraws when it reaches another lane.
      const onScroll = () => this.lanesInView.seen(element);
      element.addEventListener('scroll', onScroll, { passive: true });
      destroyRef.onDestroy(() => element.removeEventListener('scroll', onScroll));
      if (typeof ResizeObserver === 'undefined') return;
      const observer = new ResizeObserver(([entry]) => {
        this.viewportPx.set(Math.max(480, entry.contentRect.width));
        this.lanesInView.seen(element, entry.contentRect.height);
      });
      observer.observe(element);
      destroyRef.onDestroy(() => observer.disconnect());
    });

    // Marks for the benchmark: from a plan's arrival to its lanes on screen.
    effect(() => {
      this.plan();
      markStart('tw-plan-render');
      afterNextRender(() => measureSinceStart('tw-plan-render'), { injector: this.injector });
    });

    // On a new day, bring the working part of it into view: now on today, else the first exam.
    let shownDate = '';
    effect(() => {
      const plan = this.plan();
      if (plan.date === shownDate) return;
      shownDate = plan.date;
      afterNextRender(() => this.scrollToStart(), { injector: this.injector });
    });
  }

  /** Saves a move (the drop of a drag, or Enter after keyboard moves); the lanes keep the preview until the server answers. */
  async drop(examId: number, roomId: number, startMs: number, reason: MoveReason = 'drag'): Promise<void> {
    const home = this.homes().get(examId);
    if (!home) return this.pending.set(null);
    if (roomId === home.room.id && startMs === Date.parse(home.exam.start)) return this.pending.set(null);
    this.pending.set({ exam: home.exam, roomId, startMs, reason });
    await this.store.move(home.exam, roomId, siteIso(startMs, this.plan().timezone), reason);
    this.pending.set(null);
    this.focusExam(examId);
  }

  protected onPointerDown(event: PointerEvent): void {
    this.pressedAt = { x: event.clientX, y: event.clientY };
    if (!this.mayMove() || event.button !== 0 || this.store.busy()) return;
    const block = (event.target as Element).closest<HTMLElement>('[data-exam-id]');
    const home = block && this.homes().get(Number(block.dataset['examId']));
    if (!home) return;
    this.warmPreview(home.exam, home.room.id);
    this.drag?.end();
    this.drag = new PointerDrag(event, {
      frame: (at) => this.dragFrame(home.exam, home.room.id, at),
      drop: (at) => {
        this.dragFrame(home.exam, home.room.id, at);
        const refused = this.refusedLane();
        if (refused) {
          // Dropped on a lane that cannot take it: the slot stays where it was, and the user is told why.
          this.refusedLane.set(null);
          this.pending.set(null);
          this.refusal.emit(otherModality(home.exam, refused, this.plan().rooms));
          return;
        }
        const move = this.pending();
        if (move) void this.drop(move.exam.id, move.roomId, move.startMs, 'drag');
      },
      cancel: () => (this.pending.set(null), this.refusedLane.set(null)),
    });
  }

  /**
   * Readies the engine while the button is still down: its input for the day and the turnovers
   * of the pressed slot's room (kept in the engine's cache), so the first frame of the drag does
   * not pay for them.
   */
  private warmPreview(exam: PlanExam, roomId: number): void {
    const input = this.store.previewInput();
    if (input) previewMove(input, { examId: exam.id, roomId, start: exam.start });
  }

  /** The would-be room and start under the pointer: 5-minute steps, and only lanes of the exam's modality. */
  private dragFrame(exam: PlanExam, originRoomId: number, at: DragPointer): void {
    markStart('tw-drag-frame');
    const base = this.plan().rooms;
    const top = this.lanesEl().nativeElement.getBoundingClientRect().top;
    const index = Math.min(base.length - 1, Math.max(0, Math.floor((at.y - top) / LANE_HEIGHT_PX)));
    const modality = base.find((room) => room.id === originRoomId)!.modality;
    // A lane of another modality cannot take the slot: it stays in the lane it was last allowed in,
    // and the status line says why.
    const roomId = base[index].modality === modality ? base[index].id : (this.pending()?.roomId ?? originRoomId);
    this.refusedLane.set(base[index].modality === modality ? null : base[index]);
    const moved = Date.parse(exam.start) + ((at.x - at.x0) / this.scale().pxPerMinute) * MINUTE;
    const startMs = clampStart(snapToMinutes(moved), exam.durationMinutes, this.range());
    const current = this.pending();
    // Most frames move the pointer within the same 5-minute step: nothing to recompute or redraw.
    if (current?.exam.id === exam.id && current.roomId === roomId && current.startMs === startMs) return measureSinceStart('tw-drag-frame');
    this.pending.set({ exam, roomId, startMs, reason: 'drag' });
    afterNextRender(() => measureSinceStart('tw-drag-frame'), { injector: this.injector });
  }

  /** A click on a block that did not move it opens the exam (every role: read-only for those who may not move). */
  protected onClick(event: MouseEvent): void {
    const block = (event.target as Element).closest<HTMLElement>('[data-exam-id]');
    const home = block && this.homes().get(Number(block.dataset['examId']));
    const from = this.pressedAt;
    this.pressedAt = null;
    if (!home || this.pending() || (from && Math.hypot(event.clientX - from.x, event.clientY - from.y) >= CLICK_WOBBLE_PX)) return;
    this.examOpened.emit(home.exam);
  }

  protected onKeyDown(event: KeyboardEvent): void {
    const block = (event.target as Element).closest<HTMLElement>('[data-exam-id]');
    const home = block && this.homes().get(Number(block.dataset['examId']));
    if (!home) return;
    const pending = this.pending();
    // Enter (or Space) on a block with no move under way opens the exam; with a move, Enter saves it.
    if ((event.key === 'Enter' || event.key === ' ') && !pending) {
      event.preventDefault();
      this.examOpened.emit(home.exam);
      return;
    }
    if (!this.mayMove()) return;
    const current: PendingMove =
      pending?.exam.id === home.exam.id ? pending : { exam: home.exam, roomId: home.room.id, startMs: Date.parse(home.exam.start), reason: 'keyboard' };
    let next: PendingMove | null = current;
    if ((event.key === 'ArrowLeft' || event.key === 'ArrowRight') && !event.altKey) {
      const step = (event.key === 'ArrowLeft' ? -SNAP_MINUTES : SNAP_MINUTES) * MINUTE;
      next = { ...current, reason: 'keyboard', startMs: clampStart(current.startMs + step, home.exam.durationMinutes, this.range()) };
    } else if ((event.key === 'ArrowUp' || event.key === 'ArrowDown') && event.altKey) {
      const roomId = nextLane(this.plan().rooms, current.roomId, home.room.modality, event.key === 'ArrowUp' ? -1 : 1);
      next = roomId === null ? current : { ...current, reason: 'keyboard', roomId };
    } else if (event.key === 'Enter' && pending?.exam.id === home.exam.id) {
      event.preventDefault();
      void this.drop(home.exam.id, pending.roomId, pending.startMs, 'keyboard');
      return;
    } else if (event.key === 'Escape' && pending) {
      next = null;
    } else {
      return;
    }
    event.preventDefault();
    this.pending.set(next);
    if (next) this.lanesInView.reveal(this.scroller().nativeElement, next.roomId);
    this.focusExam(home.exam.id);
  }

  /** Brings a gap into view (its lane drawn, scrolled to its marker) and puts the keyboard on its marker. */
  reveal(roomId: number, toExamId: number): void {
    const scroller = this.scroller().nativeElement;
    this.lanesInView.reveal(scroller, roomId);
    afterNextRender(
      () => {
        const marker = this.lanesEl().nativeElement.querySelector<HTMLElement>(`[data-gap-to="${toExamId}"]`);
        if (!marker) return;
        centreAlongAxis(scroller, marker);
        marker.focus({ preventScroll: true });
      },
      { injector: this.injector },
    );
  }

  /** A moved block is drawn anew (in another lane, or after the server's answer): keep the keyboard on it. */
  private focusExam(examId: number): void {
    afterNextRender(() => this.lanesEl().nativeElement.querySelector<HTMLElement>(`[data-exam-id="${examId}"]`)?.focus(), { injector: this.injector });
  }

  private scrollToStart(): void {
    scrollToDayStart(this.scroller().nativeElement, this.plan(), this.scale(), this.nowX());
  }
}

/** "ACC-2 stays in MR 1: CT 1 takes CT exams only, and ACC-2 is MR." */
function otherModality(exam: PlanExam, lane: PlanRoom, rooms: readonly PlanRoom[]): string {
  const home = rooms.find((room) => room.exams.some((candidate) => candidate.id === exam.id));
  return `${exam.accession} stays in ${home?.name ?? 'its room'}: ${lane.name} takes ${lane.modality} exams only, and ${exam.accession} is ${home?.modality ?? 'another modality'}.`;
}
