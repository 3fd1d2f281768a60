import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { Observable, tap } from 'rxjs';

import type { BoardShiftTask, Checklist } from '@shared/api/board';
import { hasErrorCode } from '@shared/api/errors';
import { liveDay } from '../../core/live/day-refresh';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { Clock, serverNow } from '../../core/time/clock';
import { CautionKind, CautionNote } from '../../shared/ui/caution-note';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteTime } from '../../shared/ui/site-time';
import { ChecklistStepRow } from './checklist-step-row';
import { readLastRoom, rememberRoom } from './last-room';
import { MrKitPanel } from './mr-kit-panel';
import { ShiftTaskList } from './shift-task-list';
import { TurnoverClose } from './turnover-close';
import { ExamFinished, TurnoverExams } from './turnover-exams';
import { StepTick, TurnoverService } from './turnover-service';
import { TurnoverTabs } from './turnover-tabs';

/** Which checklist is shown: a room's, on a day. */
interface ChecklistAt {
  roomId: number;
  date: string;
}

/** Turnover: the technologist's checklist for one room's current (or next) turnover. Tablet first. */
@Component({
  selector: 'tw-turnover',
  imports: [
    MatFormFieldModule, MatIconModule, MatInputModule,
    CautionNote, ChecklistStepRow, LiveIndicator, MrKitPanel, ShiftTaskList, SiteTime, TurnoverClose, TurnoverExams, TurnoverTabs,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './turnover.html',
  styleUrl: './turnover.scss',
})
export class Turnover {
  private readonly service = inject(TurnoverService);
  private readonly router = inject(Router);
  private readonly date = inject(SiteSettingsService).today;
  private readonly server = serverNow(inject(Clock));

  /** `?room=` from a Rooms now card; otherwise the room last used on this device. */
  readonly room = input<string | undefined>();

  protected readonly rooms = serverState(() => this.service.rooms(), 'The rooms could not be shown.');
  private readonly at = computed<ChecklistAt | null>(
    () => {
      const roomId = this.roomId();
      const date = this.date();
      return roomId === null || date === null ? null : { roomId, date };
    },
    { equal: (a, b) => a?.roomId === b?.roomId && a?.date === b?.date },
  );
  protected readonly checklist = serverState(({ roomId, date }: ChecklistAt) => {
    rememberRoom(roomId);
    if (this.justCompleted()?.roomId !== roomId) this.justCompleted.set(null);
    return this.service.checklist(roomId, date).pipe(tap((checklist) => this.arrived(checklist)));
  }, 'The checklist could not be shown.');
  protected readonly status = liveDay(this.checklist, this.at, { day: (at) => at.date });
  /** Every change to the turnover (exam finished, a tick, complete) answers the whole checklist. */
  private readonly change = action((call: Observable<Checklist>) => call.pipe(tap((checklist) => this.arrived(checklist))));
  private readonly markTask = action((task: BoardShiftTask) => this.service.shiftTaskDone(task));
  protected readonly busy = computed(() => this.change.pending() || this.markTask.pending());
  /** An action's refusal stays until the next action; a failed fetch shows until a good one. */
  protected readonly error = computed(() => this.change.error() ?? this.markTask.error() ?? this.checklist.error() ?? this.rooms.error());
  /** The step the server refused as still wet, so its row asks for a reason. */
  protected readonly reasonFor = signal<string | null>(null);
  /** The exam whose end the server refused as before its slot, so "Exam finished" asks why. */
  protected readonly finishReasonFor = signal<number | null>(null);
  /**
   * The turnover this screen just closed. The room's checklist moves on to the next turnover as
   * soon as the day's stream says so, which would otherwise hide that the close went through.
   */
  protected readonly justCompleted = signal<{ roomId: number; accession: string | null; at: string; roomName: string } | null>(null);
  protected readonly now = this.server.now;

  protected readonly roomId = computed<number | null>(() => {
    const rooms = this.rooms.value() ?? [];
    const wanted = Number(this.room() ?? readLastRoom());
    return rooms.some((room) => room.id === wanted) ? wanted : (rooms[0]?.id ?? null);
  });

  /**
   * The opening before the day's first exam: a read-only preview, since a turnover only opens
   * with "Exam finished"; what the technologist does now is the shift tasks.
   */
  protected readonly opening = computed(() => {
    const c = this.checklist.value();
    return !!c && c.turnoverId === null && !c.leaving && !!c.arriving;
  });

  /** Steps can be ticked once the exam has left (or at the opening) and the turnover is open. */
  protected readonly stepsOpen = computed(() => {
    const c = this.checklist.value();
    return !!c && c.turnoverId !== null && c.completedAt === null && (!c.leaving || !!c.examEndedAt) && !this.busy();
  });

  /**
   * The steps keyed by their turnover: a row is kept across fetches of one turnover only, so a
   * reason typed for this turnover never shows up on the next one's same step.
   */
  protected readonly stepRows = computed(() => {
    const c = this.checklist.value();
    return (c?.steps ?? []).map((step) => ({ key: `${c?.turnoverId ?? 'unopened'}:${step.key}`, step }));
  });

  protected readonly cautions = computed<CautionKind[]>(() => {
    const c = this.checklist.value();
    const kinds: CautionKind[] = ['general'];
    if (c?.modality === 'MR') kinds.push('mr');
    if (c && c.airHoldMinutes > 0) kinds.push('airborne');
    return kinds;
  });

  constructor() {
    this.rooms.show('all');
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
    const turnoverId = this.checklist.value()?.turnoverId;
    if (turnoverId == null) return;
    const result = await this.run(this.service.stepDone(turnoverId, stepKey, tick));
    // Only a surface still wet by the server's clock asks for a reason; "tick X first" does not.
    if (result.status === 'failed' && hasErrorCode(result.error, 'surface_wet') && !tick.earlyReason) this.reasonFor.set(stepKey);
  }

  protected async complete(overrideReason: string | undefined): Promise<void> {
    const id = this.checklist.value()?.turnoverId;
    if (id == null) return;
    const result = await this.run(this.service.complete(id, overrideReason));
    if (result.status === 'done' && result.value.completedAt) {
      const closed = result.value;
      this.justCompleted.set({ roomId: closed.roomId, accession: closed.leaving?.accession ?? null, at: closed.completedAt!, roomName: closed.roomName });
    }
  }

  protected async shiftTaskDone(task: BoardShiftTask): Promise<void> {
    this.change.reset();
    const result = await this.markTask.run(task);
    const c = this.checklist.value();
    if (result.status === 'done' && c) {
      const updated = result.value;
      this.checklist.set({ ...c, tasks: c.tasks.map((t) => (t.taskId === updated.taskId && t.due === updated.due ? updated : t)) });
    }
  }

  /** Runs a change that answers the whole checklist: shown at once; a refusal stays on the page. */
  private async run(call: Observable<Checklist>) {
    this.reasonFor.set(null);
    this.markTask.reset();
    const result = await this.change.run(call);
    if (result.status === 'done') this.checklist.set(result.value);
    return result;
  }

  /** Every checklist shown, fetched or answered: the server's clock, and form state of one turnover only. */
  private arrived(checklist: Checklist): void {
    this.server.heard(checklist.now);
    // Form state belongs to one turnover: a reason asked for the last one must not carry over.
    if (checklist.turnoverId !== this.checklist.value()?.turnoverId) this.reasonFor.set(null);
    if (checklist.leaving?.examId !== this.finishReasonFor()) this.finishReasonFor.set(null);
  }
}
