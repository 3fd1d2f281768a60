import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subject, Subscription, catchError, firstValueFrom, map, of, switchMap } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import { isApiError } from '@shared/api/errors';
import type { DayPlan, PlanExam } from '@shared/api/plan';
import type { Room } from '@shared/api/rooms';
import type { Fix } from '@shared/fixes/model';
import { AuthService } from '../../core/auth/auth-service';
import { SiteSettingsService } from '../../shared/ui/site-settings-service';
import { DayEvents } from '../../shared/ui/day-events';
import { DayPlanService, MoveReason } from './day-plan-service';
import { dayPlanInputOf } from './plan-preview';

/** A message about the last change, shown in the banner above the timeline. */
export interface Notice {
  tone: 'error' | 'info';
  text: string;
}

export type LiveState = 'connecting' | 'live' | 'offline';

/** How long "Updated by …" stays up after someone else changed the day. */
const UPDATED_BY_MS = 6000;

/**
 * The day on screen and every change to it. Each change answers the day's new plan, which
 * replaces the one shown; changes made elsewhere arrive on the event stream and are refetched.
 * One per Day plan screen (provided by the component), so leaving the screen closes the stream.
 */
@Injectable()
export class DayPlanStore {
  private readonly api = inject(DayPlanService);
  private readonly events = inject(DayEvents);
  private readonly settings = inject(SiteSettingsService).settings;
  private readonly user = inject(AuthService).user;

  readonly date = signal<string | null>(null);
  readonly status = signal<'loading' | 'loaded' | 'failed'>('loading');
  readonly plan = signal<DayPlan | null>(null);
  readonly error = signal<ApiError | null>(null);
  readonly rooms = signal<Room[]>([]);
  /** A change is on its way to the server; the screen holds further changes until it answers. */
  readonly busy = signal(false);
  readonly notice = signal<Notice | null>(null);
  readonly live = signal<LiveState>('connecting');
  readonly updatedBy = signal<string | null>(null);
  /** Bumped whenever a new plan arrives, so panels showing fixes or history refetch. */
  readonly revision = signal(0);

  /** The engine input for live previews while dragging. */
  readonly previewInput = computed(() => {
    const plan = this.plan();
    return plan ? dayPlanInputOf(plan, this.rooms(), this.settings()?.snugMarginMinutes ?? 3) : null;
  });

  private readonly reloads = new Subject<void>();
  private stream: Subscription | null = null;
  private updatedByTimer: ReturnType<typeof setTimeout> | undefined;

  constructor() {
    const reloading = this.reloads
      .pipe(switchMap(() => this.fetch(this.date())))
      .subscribe((result) => (isApiError(result) ? this.fail(result) : this.accept(result)));
    inject(DestroyRef).onDestroy(() => {
      reloading.unsubscribe();
      this.stream?.unsubscribe();
      clearTimeout(this.updatedByTimer);
    });
    this.loadRooms();
  }

  /** Shows another day: drops the old plan and listens to the new day's changes. */
  open(date: string): void {
    if (date === this.date()) return;
    this.date.set(date);
    this.plan.set(null);
    this.status.set('loading');
    this.notice.set(null);
    this.reloads.next();
    this.listen(date);
  }

  /** Fetches the day again, keeping the current plan on screen until the new one arrives. */
  reload(): void {
    if (!this.plan()) this.status.set('loading');
    this.reloads.next();
  }

  move(exam: PlanExam, roomId: number, start: string, reason: MoveReason): Promise<boolean> {
    return this.change(this.api.move(exam.id, { start, roomId, version: exam.version, reason }));
  }

  undo(): Promise<boolean> {
    return this.change(this.api.undo(this.date()!));
  }

  redo(): Promise<boolean> {
    return this.change(this.api.redo(this.date()!));
  }

  gapStaffing(toExamId: number, staff: number | null): Promise<boolean> {
    return this.change(this.api.gapStaffing(toExamId, staff));
  }

  applyFix(fix: Fix, acceptNewProblems: boolean): Promise<boolean> {
    return this.change(this.api.applyFix(this.date()!, fix.id, acceptNewProblems));
  }

  /** The room's usual staff; answers rooms, so the plan is fetched again to show its effect. */
  async roomStaffing(roomId: number, staff: number): Promise<boolean> {
    const ok = await this.change(this.api.roomStaffing(roomId, staff).pipe(map((rooms) => (this.rooms.set(rooms), null))));
    if (ok) this.reload();
    return ok;
  }

  dismissNotice(): void {
    this.notice.set(null);
  }

  private async change(request: Observable<DayPlan | null>): Promise<boolean> {
    this.busy.set(true);
    try {
      const plan = await firstValueFrom(request);
      if (plan) this.accept(plan);
      this.notice.set(null);
      return true;
    } catch (error) {
      const apiError = isApiError(error) ? error : { status: 0, code: 'unexpected', message: 'That change could not be made. Try again.' };
      this.notice.set({ tone: apiError.status === 409 && /nothing to/i.test(apiError.message) ? 'info' : 'error', text: apiError.message });
      // Stale: someone changed the day first, so show what is really there now.
      if (apiError.status === 409) this.reload();
      return false;
    } finally {
      this.busy.set(false);
    }
  }

  private fetch(date: string | null): Observable<DayPlan | ApiError> {
    if (!date) return of();
    return this.api.plan(date).pipe(catchError((error: unknown) => of(asApiError(error))));
  }

  private accept(plan: DayPlan): void {
    if (plan.date !== this.date()) return;
    this.plan.set(plan);
    this.error.set(null);
    this.status.set('loaded');
    this.revision.update((n) => n + 1);
  }

  private fail(error: ApiError): void {
    // A failed refresh keeps the day on screen; only a day never shown turns into the error state.
    if (this.plan()) this.notice.set({ tone: 'error', text: error.message });
    else (this.error.set(error), this.status.set('failed'));
  }

  private listen(date: string): void {
    this.stream?.unsubscribe();
    this.live.set('connecting');
    let opened = false;
    this.stream = this.events.stream(date).subscribe((message) => {
      if (message.type === 'status') {
        if (message.status === 'reconnecting') return this.live.set('offline');
        if (message.status === 'connecting') return;
        this.live.set('live');
        // A reconnection may have missed changes; the first opening needs nothing new.
        if (opened) this.reload();
        opened = true;
        return;
      }
      this.live.set('live');
      const notice = message.event;
      if (!notice || notice.reason === 'staffing') this.loadRooms();
      this.reload();
      const me = this.user();
      if (notice?.by && notice.by !== (me?.displayName || me?.username)) this.showUpdatedBy(notice.by);
    });
  }

  private showUpdatedBy(by: string): void {
    clearTimeout(this.updatedByTimer);
    this.updatedBy.set(by);
    this.updatedByTimer = setTimeout(() => this.updatedBy.set(null), UPDATED_BY_MS);
  }

  private loadRooms(): void {
    // Rooms only feed the drag preview; without them the preview stays off and the plan still shows.
    this.api.rooms().pipe(catchError(() => of(null))).subscribe((rooms) => rooms && this.rooms.set(rooms));
  }
}

function asApiError(error: unknown): ApiError {
  return isApiError(error) ? error : { status: 0, code: 'unexpected', message: 'The day plan could not be shown. Try again.' };
}
