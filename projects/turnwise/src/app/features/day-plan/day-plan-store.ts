import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subscription, map, of, skip, tap } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import type { MoveReason } from '@shared/api/limits';
import type { PlanExam, PlannedDay } from '@shared/api/plan';
import type { Fix } from '@shared/fixes/model';
import { AuthService } from '../../core/auth/auth-service';
import { DayEvents, type DayStreamStatus } from '../../core/live/day-events';
import { dayRefreshes } from '../../core/live/day-refresh';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { movedByBookingSystem } from './booking-moves';
import { DayPlanService } from './day-plan-service';
import { PatientToCall, movedExams, withMoves } from './patients-to-call';

/** A message about the last change, shown in the banner above the timeline. */
export interface Notice {
  tone: 'error' | 'info';
  text: string;
}

/** How long "Updated by …" stays up after someone else changed the day. */
const UPDATED_BY_MS = 6000;

/** Refusals that only say there was nothing to do: told as information, not as an error. */
const NOTHING_TO_DO: readonly string[] = ['nothing_to_undo', 'nothing_to_redo'];
/** Refusals that mean the day changed under the user: the screen shows what is there now. */
const DAY_MOVED_ON: readonly string[] = ['stale_version', 'changed_since', 'fix_stale', 'day_changed'];

/**
 * The day on screen (a {@link serverState}) and every change to it (one {@link action}: a change
 * answers the day's new plan, which replaces the one shown). Changes made elsewhere arrive on the
 * day's event stream and are refetched. One per Day plan screen (provided by the component), so
 * leaving the screen closes the stream.
 */
@Injectable()
export class DayPlanStore {
  private readonly api = inject(DayPlanService);
  private readonly events = inject(DayEvents);
  private readonly user = inject(AuthService).user;

  private readonly day = serverState((date: string) => this.api.plan(date), 'The day plan could not be shown. Try again.');
  private readonly change = action((request: Observable<PlannedDay | null>) => request, 'That change could not be made. Try again.');

  /** The day's changes and the user's undo/redo, per user on the server (never in the shared plan). */
  private readonly changes = serverState((date: string) => this.api.history(date), 'The changes could not be loaded.');

  readonly date = this.day.key;
  readonly plan = this.day.value;
  readonly status = computed(() => (this.day.status() === 'idle' ? 'loading' : this.day.status()));
  readonly error = this.day.error;
  /** Bumped whenever a new plan arrives, so panels showing fixes or history refetch. */
  readonly revision = this.day.revision;
  /** A change is on its way to the server; the screen holds further changes until it answers. */
  readonly busy = this.change.pending;
  readonly notice = signal<Notice | null>(null);
  readonly live = signal<DayStreamStatus>('connecting');
  readonly updatedBy = signal<string | null>(null);
  /** Patients whose slot this screen's moves, fixes, undos and redos changed, since the day was opened or the list cleared. */
  readonly calls = signal<PatientToCall[]>([]);
  readonly history = this.changes.value;
  readonly historyStatus = computed(() => (this.changes.status() === 'idle' ? 'loading' : this.changes.status()));
  readonly historyError = this.changes.error;
  readonly canUndo = computed(() => this.history()?.canUndo ?? false);
  readonly canRedo = computed(() => this.history()?.canRedo ?? false);
  /** Exams the booking feed moved after a hand change, marked on their blocks. */
  readonly movedByBooking = computed(() => movedByBookingSystem(this.history()?.changes ?? []));
  /** The engine input for live previews while dragging: the server's own, sent with the plan. */
  readonly previewInput = computed(() => this.plan()?.input ?? null);

  private stream: Subscription | null = null;
  private updatedByTimer: ReturnType<typeof setTimeout> | undefined;

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      this.stream?.unsubscribe();
      clearTimeout(this.updatedByTimer);
    });
  }

  /** Shows another day: drops the old plan and listens to the new day's changes. */
  open(date: string): void {
    if (date === this.date()) return;
    this.notice.set(null);
    this.calls.set([]);
    this.day.show(date);
    this.changes.show(date);
    this.listen(date);
  }

  /** Fetches the day again, keeping the current plan on screen until the new one arrives. */
  reload(): void {
    this.day.reload();
    this.changes.reload();
  }

  move(exam: PlanExam, roomId: number, start: string, reason: MoveReason): Promise<boolean> {
    return this.apply(this.api.move(exam.id, { start, roomId, version: exam.version, reason }));
  }

  undo(): Promise<boolean> {
    return this.apply(this.api.undo(this.date()!));
  }

  redo(): Promise<boolean> {
    return this.apply(this.api.redo(this.date()!));
  }

  gapStaffing(toExamId: number, staff: number | null): Promise<boolean> {
    return this.apply(this.api.gapStaffing(toExamId, staff));
  }

  applyFix(fix: Fix, acceptNewProblems: boolean): Promise<boolean> {
    return this.apply(this.api.applyFix(this.date()!, fix.id, acceptNewProblems));
  }

  /** The room's usual staff; answers rooms, so the plan (and its input) is fetched again. */
  async roomStaffing(roomId: number, staff: number): Promise<boolean> {
    const ok = await this.apply(this.api.roomStaffing(roomId, staff).pipe(map(() => null)));
    if (ok) this.reload();
    return ok;
  }

  /**
   * A plan answered by a change the screen made itself (the exam dialog's add, edit or cancel,
   * which shows its own refusals): shown like any change's answer.
   */
  accept(plan: PlannedDay): Promise<boolean> {
    return this.apply(of(plan));
  }

  /** A refusal the screen made itself (e.g. a drop on a lane of another modality). */
  tell(notice: Notice): void {
    this.notice.set(notice);
  }

  dismissNotice(): void {
    this.notice.set(null);
  }

  clearCalls(): void {
    this.calls.set([]);
  }

  private async apply(request: Observable<PlannedDay | null>): Promise<boolean> {
    const result = await this.change.run(request);
    if (result.status === 'failed') {
      this.refused(result.error);
      return false;
    }
    // An answer for a day no longer shown (the user moved on meanwhile) is dropped.
    const before = this.plan();
    if (result.value && result.value.date === this.date()) {
      if (before) this.calls.update((list) => withMoves(list, movedExams(before, result.value!)));
      this.day.set(result.value);
    }
    // Whatever changed, the user's undo and redo may have too.
    this.changes.reload();
    this.notice.set(null);
    return true;
  }

  private refused(error: ApiError): void {
    this.notice.set({ tone: NOTHING_TO_DO.includes(error.code) ? 'info' : 'error', text: error.message });
    // Someone changed the day first, so show what is really there now.
    if (DAY_MOVED_ON.includes(error.code) || NOTHING_TO_DO.includes(error.code)) this.reload();
  }

  /** Refetches on every change event and after a reconnection (the day was fetched on opening). */
  private listen(date: string): void {
    this.stream?.unsubscribe();
    this.live.set('connecting');
    const stream = this.events.stream(date).pipe(
      tap((message) => {
        if (message.type !== 'change') return;
        const me = this.user();
        const by = message.event?.by;
        if (by && by !== (me?.displayName || me?.username)) this.showUpdatedBy(by);
      }),
    );
    this.stream = dayRefreshes(stream, { onStatus: (status) => this.live.set(status) })
      .pipe(skip(1))
      .subscribe(() => this.reload());
  }

  private showUpdatedBy(by: string): void {
    clearTimeout(this.updatedByTimer);
    this.updatedBy.set(by);
    this.updatedByTimer = setTimeout(() => this.updatedBy.set(null), UPDATED_BY_MS);
  }
}
