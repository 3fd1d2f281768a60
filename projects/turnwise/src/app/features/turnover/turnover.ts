import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { EMPTY, Observable, catchError, filter, switchMap, tap } from 'rxjs';

import type { BoardShiftTask, Checklist } from '@shared/api/board';
import { hasErrorCode, type ApiError } from '@shared/api/errors';
import type { Room } from '@shared/api/rooms';
import { action } from '../../core/state/action';
import { CautionKind, CautionNote } from '../../shared/ui/caution-note';
import { Clock } from '../../core/time/clock';
import { serverSkew } from '../../shared/ui/countdown';
import { DayEvents, DayStreamStatus } from '../../core/live/day-events';
import { dayRefreshes } from '../../core/live/day-refresh';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { SiteTime } from '../../shared/ui/site-time';
import { ChecklistStepRow } from './checklist-step-row';
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
  /** Every change to the turnover (exam finished, a tick, complete) answers the whole checklist. */
  private readonly change = action((call: Observable<Checklist>) => call);
  private readonly markTask = action((task: BoardShiftTask) => this.service.shiftTaskDone(task));
  protected readonly busy = computed(() => this.change.pending() || this.markTask.pending());
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

  protected async examFinished({ examId, earlyReason }: ExamFinished): Promise<void> {
    this.justCompleted.set(null);
    const result = await this.run(this.service.examFinished(examId, earlyReason));
    // the server's clock decides whether the slot has started: ask why, then send it again
    if (result.status === 'failed' && hasErrorCode(result.error, 'exam_not_started')) this.finishReasonFor.set(examId);
  }

  protected async tick(stepKey: string, tick: StepTick): Promise<void> {
    const turnoverId = this.checklist()?.turnoverId;
    if (turnoverId == null) return;
    const result = await this.run(this.service.stepDone(turnoverId, stepKey, tick));
    // Only a surface still wet by the server's clock asks for a reason; "tick X first" does not.
    if (result.status === 'failed' && hasErrorCode(result.error, 'surface_wet') && !tick.earlyReason) this.reasonFor.set(stepKey);
  }

  protected async complete(overrideReason: string | undefined): Promise<void> {
    const id = this.checklist()?.turnoverId;
    if (id == null) return;
    const result = await this.run(this.service.complete(id, overrideReason));
    if (result.status === 'done' && result.value.completedAt) {
      const closed = result.value;
      this.justCompleted.set({ roomId: closed.roomId, accession: closed.leaving?.accession ?? null, at: closed.completedAt!, roomName: closed.roomName });
    }
  }

  protected async shiftTaskDone(task: BoardShiftTask): Promise<void> {
    const result = await this.markTask.run(task);
    this.error.set(result.status === 'failed' ? result.error : null);
    if (result.status === 'done') {
      const updated = result.value;
      this.checklist.update((c) => c && { ...c, tasks: c.tasks.map((t) => (t.taskId === updated.taskId && t.due === updated.due ? updated : t)) });
    }
  }

  /** Runs a change that answers the whole checklist: shown at once; a refusal stays on the page. */
  private async run(call: Observable<Checklist>) {
    this.reasonFor.set(null);
    const result = await this.change.run(call);
    if (result.status === 'done') this.show(result.value);
    this.error.set(result.status === 'failed' ? result.error : null);
    return result;
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
}
