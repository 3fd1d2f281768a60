import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { EMPTY, Observable, catchError, filter, switchMap, tap } from 'rxjs';

import type { BoardShiftTask, Checklist } from '@shared/api/board';
import type { ApiError } from '@shared/api/errors';
import type { Room } from '@shared/api/rooms';
import { CautionKind, CautionNote } from '../../shared/ui/caution-note';
import { Clock } from '../../core/time/clock';
import { serverSkew } from '../../shared/ui/countdown';
import { DayEvents, DayStreamStatus } from '../../core/live/day-events';
import { dayRefreshes } from '../../core/live/day-refresh';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { SiteTime } from '../../shared/ui/site-time';
import { ChecklistStepRow } from './checklist-step-row';
import { notYetDone } from './step-readiness';
import { readLastRoom, rememberRoom } from './last-room';
import { ShiftTaskList } from './shift-task-list';
import { TurnoverClose } from './turnover-close';
import { ExamFinished, TurnoverExams } from './turnover-exams';
import { StepTick, TurnoverService } from './turnover-service';
import { TurnoverTabs } from './turnover-tabs';

/** Turnover: the technologist's checklist for one room's current (or next) turnover. Tablet first. */
@Component({
  selector: 'tw-turnover',
  imports: [
    MatFormFieldModule, MatIconModule, MatInputModule,
    CautionNote, ChecklistStepRow, LiveIndicator, ShiftTaskList, SiteTime, TurnoverClose, TurnoverExams, TurnoverTabs,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './turnover.html',
  styleUrl: './turnover.scss',
})
export class Turnover {
  private readonly service = inject(TurnoverService);
  private readonly events = inject(DayEvents);
  private readonly clock = inject(Clock);
  private readonly router = inject(Router);
  private readonly date = inject(SiteSettingsService).today;

  /** `?room=` from a Rooms now card; otherwise the room last used on this device. */
  readonly room = input<string | undefined>();

  protected readonly rooms = signal<Room[]>([]);
  protected readonly checklist = signal<Checklist | null>(null);
  protected readonly error = signal<ApiError | null>(null);
  protected readonly status = signal<DayStreamStatus>('connecting');
  protected readonly busy = signal(false);
  /** The step the server refused as still wet, so its row asks for a reason. */
  protected readonly reasonFor = signal<string | null>(null);
  /** The exam whose end the server refused as before its slot, so "Exam finished" asks why. */
  protected readonly finishReasonFor = signal<number | null>(null);
  /**
   * The turnover this screen just closed. The room's checklist moves on to the next turnover as
   * soon as the day's stream says so, which would otherwise hide that the close went through.
   */
  protected readonly justCompleted = signal<{ roomId: number; accession: string | null; at: string; roomName: string } | null>(null);
  private readonly skew = signal(0);
  /** The error shown came from fetching, so the next good fetch clears it (an action's error stays). */
  private fetchFailed = false;
  protected readonly now = computed(() => this.clock.now() + this.skew());

  protected readonly roomId = computed<number | null>(() => {
    const rooms = this.rooms();
    const wanted = Number(this.room() ?? readLastRoom());
    return rooms.some((room) => room.id === wanted) ? wanted : (rooms[0]?.id ?? null);
  });

  /**
   * The opening before the day's first exam: a read-only preview, since a turnover only opens
   * with "Exam finished"; what the technologist does now is the shift tasks.
   */
  protected readonly opening = computed(() => {
    const c = this.checklist();
    return !!c && c.turnoverId === null && !c.leaving && !!c.arriving;
  });

  /** Steps can be ticked once the exam has left (or at the opening) and the turnover is open. */
  protected readonly stepsOpen = computed(() => {
    const c = this.checklist();
    return !!c && c.turnoverId !== null && c.completedAt === null && (!c.leaving || !!c.examEndedAt) && !this.busy();
  });

  /**
   * The steps keyed by their turnover: a row is kept across fetches of one turnover only, so a
   * reason typed for this turnover never shows up on the next one's same step.
   */
  protected readonly stepRows = computed(() => {
    const c = this.checklist();
    return (c?.steps ?? []).map((step) => ({ key: `${c?.turnoverId ?? 'unopened'}:${step.key}`, step }));
  });

  protected readonly cautions = computed<CautionKind[]>(() => {
    const c = this.checklist();
    const kinds: CautionKind[] = ['general'];
    if (c?.modality === 'MR') kinds.push('mr');
    if (c && c.airHoldMinutes > 0) kinds.push('airborne');
    return kinds;
  });

  constructor() {
    this.service.rooms().pipe(takeUntilDestroyed()).subscribe({
      next: (rooms) => this.rooms.set(rooms),
      error: (error: ApiError) => this.error.set(error),
    });
    const wanted = computed(() => ({ roomId: this.roomId(), date: this.date() }));
    toObservable(wanted)
      .pipe(
        filter((at): at is { roomId: number; date: string } => at.roomId !== null && at.date !== null),
        tap(({ roomId }) => {
          this.checklist.set(null);
          if (this.justCompleted()?.roomId !== roomId) this.justCompleted.set(null);
          rememberRoom(roomId);
        }),
        switchMap(({ roomId, date }) =>
          dayRefreshes(this.events.stream(date), { onStatus: (status) => this.status.set(status) }).pipe(
            switchMap(() => this.quietly(this.service.checklist(roomId, date))),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  protected pickRoom(event: Event): void {
    const roomId = (event.target as HTMLSelectElement).value;
    void this.router.navigate([], { queryParams: { room: roomId }, queryParamsHandling: 'merge' });
  }

  protected examFinished({ examId, earlyReason }: ExamFinished): void {
    this.justCompleted.set(null);
    this.act(this.service.examFinished(examId, earlyReason), (error) => {
      if (error.code === 'exam_not_started') this.finishReasonFor.set(examId);
    });
  }

  protected tick(stepKey: string, tick: StepTick): void {
    const checklist = this.checklist();
    const step = checklist?.steps.find((candidate) => candidate.key === stepKey);
    if (checklist?.turnoverId == null || !step) return;
    // A 422 is about wetness only when every surface the step needs dry has been ticked (the
    // server's clock finds one still wet); otherwise it says which step to tick first, and a
    // reason field would not help.
    const mayBeWet = step.needsDry.length > 0 && notYetDone(step, checklist.steps).length === 0;
    this.act(this.service.stepDone(checklist.turnoverId, stepKey, tick), (error) => {
      if (error.status === 422 && !tick.earlyReason && mayBeWet) this.reasonFor.set(stepKey);
    });
  }

  protected complete(overrideReason: string | undefined): void {
    const id = this.checklist()?.turnoverId;
    if (id == null) return;
    this.act(this.service.complete(id, overrideReason), undefined, (closed) => {
      if (closed.completedAt) {
        this.justCompleted.set({ roomId: closed.roomId, accession: closed.leaving?.accession ?? null, at: closed.completedAt, roomName: closed.roomName });
      }
    });
  }

  protected shiftTaskDone(task: BoardShiftTask): void {
    this.busy.set(true);
    this.service.shiftTaskDone(task).subscribe({
      next: (updated) => {
        this.checklist.update((c) => c && { ...c, tasks: c.tasks.map((t) => (t.taskId === updated.taskId && t.due === updated.due ? updated : t)) });
        this.settle(null);
      },
      error: (error: ApiError) => this.settle(error),
    });
  }

  private act(call: Observable<Checklist>, onError?: (error: ApiError) => void, onDone?: (checklist: Checklist) => void): void {
    this.busy.set(true);
    this.reasonFor.set(null);
    call.subscribe({
      next: (checklist) => {
        this.show(checklist);
        this.settle(null);
        onDone?.(checklist);
      },
      error: (error: ApiError) => {
        this.settle(error);
        onError?.(error);
      },
    });
  }

  private quietly(call: Observable<Checklist>): Observable<Checklist> {
    return call.pipe(
      tap((checklist) => {
        this.show(checklist);
        if (this.fetchFailed) this.error.set(null);
        this.fetchFailed = false;
      }),
      catchError((error: ApiError) => {
        this.error.set(error);
        this.fetchFailed = true;
        return EMPTY;
      }),
    );
  }

  private show(checklist: Checklist): void {
    this.skew.set(serverSkew(checklist.now, this.clock.now()));
    // Form state belongs to one turnover: a reason asked for the last one must not carry over.
    if (checklist.turnoverId !== this.checklist()?.turnoverId) this.reasonFor.set(null);
    if (checklist.leaving?.examId !== this.finishReasonFor()) this.finishReasonFor.set(null);
    this.checklist.set(checklist);
  }

  private settle(error: ApiError | null): void {
    this.busy.set(false);
    this.error.set(error);
  }
}
