import { ChangeDetectionStrategy, Component, afterNextRender, computed, effect, inject, input, Injector, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Router, RouterLink } from '@angular/router';

import type { Fix } from '@shared/fixes/model';
import type { PlanExam, PlannedDay } from '@shared/api/plan';
import type { DayRoster } from '@shared/api/roster';
import { AuthService } from '../../core/auth/auth-service';
import { may } from '../../core/auth/roles';
import { CautionNote, cautionsForDay } from '../../shared/ui/caution-note';
import { DayPicker } from '../../shared/ui/day-picker';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { Clock } from '../../core/time/clock';
import { VerdictSummary } from '../../shared/ui/verdict-summary';
import { BandLegend } from './band-legend';
import { DayFitStore } from './day-fit-store';
import { DayPlanStore } from './day-plan-store';
import { DayTimeline } from './day-timeline';
import { ExamDialog, type ExamDialogData } from './exam-dialog';
import { FitPanel } from './fit-panel';
import { GapPanel } from './gap-panel';
import { HistoryPanel } from './history-panel';
import { PatientsToCallPanel } from './patients-to-call-panel';
import { PeopleView } from './people-view';
import { gapPeopleWords } from './people-reason';
import { ProblemGap, firstProblemIn, problemGaps, stepProblem } from './problem-gaps';
import { ZOOMS, Zoom } from './timeline-scale';
import { RosterDialog, type RosterDialogData } from '../roster/roster-dialog';

/**
 * The Day plan: the day's timeline with its summary, filter, zoom, undo/redo, history and live
 * updates, and beside it the details and fixes of the gap picked. Read-only for roles that may
 * not move slots (the server refuses them anyway).
 */
@Component({
  selector: 'tw-day-plan',
  imports: [
    MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule, MatSlideToggleModule, RouterLink,
    BandLegend, CautionNote, DayPicker, DayTimeline, FitPanel, GapPanel, HistoryPanel, LiveIndicator, PatientsToCallPanel, PeopleView, VerdictSummary,
  ],
  providers: [DayPlanStore, DayFitStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(document:keydown)': 'onShortcut($event)' },
  templateUrl: './day-plan.html',
  styleUrl: './day-plan.scss',
})
export class DayPlan {
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);
  private readonly dialog = inject(MatDialog);
  private readonly clock = inject(Clock);
  private readonly user = inject(AuthService).user;
  private readonly role = computed(() => this.user()?.role ?? null);
  protected readonly store = inject(DayPlanStore);
  protected readonly fit = inject(DayFitStore);
  protected readonly today = inject(SiteSettingsService).today;

  /** `YYYY-MM-DD` from the address (`/day/…` or `/day?date=…`); absent means today at the site. */
  readonly date = input<string>();
  /** An accession from the address (`?exam=A3004`, e.g. from Import's problem gaps): open the gap before it. */
  readonly exam = input<string>();

  protected readonly day = computed(() => this.date() || this.today());
  protected readonly zooms = ZOOMS;
  protected readonly zoom = signal<Zoom>('4h');
  protected readonly onlyProblems = signal(false);
  protected readonly historyOpen = signal(false);
  /** A lane per room, or (when the day has a roster) a lane per person. */
  protected readonly view = signal<'rooms' | 'people'>('rooms');
  protected readonly hasRoster = computed(() => !!this.store.plan()?.people);
  /** The view drawn: back to the rooms when the day has no roster (another day, or the roster removed). */
  protected readonly shownView = computed(() => (this.hasRoster() ? this.view() : 'rooms'));
  /** The gap shown in the panel, by the exam it leads to. */
  protected readonly selectedGap = signal<number | null>(null);

  private readonly timeline = viewChild(DayTimeline);
  private readonly peopleView = viewChild(PeopleView);
  /** The day's snug, short and overlapping gaps in time order, and which of them is open. */
  protected readonly problems = computed(() => {
    const plan = this.store.plan();
    return plan ? problemGaps(plan) : [];
  });
  /** On today, how many of them are still ahead (", 2 still ahead"), when some are over; else nothing. */
  protected readonly aheadWords = computed(() => {
    if (this.day() !== this.today()) return '';
    const now = this.clock.minute();
    const ahead = this.problems().filter((problem) => problem.atMs >= now).length;
    return ahead < this.problems().length ? `, ${ahead} still ahead` : '';
  });
  protected readonly problemAt = computed(() => this.problems().findIndex((problem) => problem.gap.toExamId === this.selectedGap()));

  protected readonly mayMove = computed(() => may(this.role(), 'moveSlots'));
  protected readonly mayStaff = computed(() => may(this.role(), 'changeStaffing'));
  protected readonly mayImport = computed(() => may(this.role(), 'importDayList'));
  protected readonly mayFit = computed(() => may(this.role(), 'makeDayFit'));
  protected readonly empty = computed(() => this.store.plan()?.rooms.every((room) => room.exams.length === 0) ?? false);
  protected readonly selection = computed(() => {
    const toExamId = this.selectedGap();
    for (const room of this.store.plan()?.rooms ?? []) {
      const gap = room.gaps.find((candidate) => candidate.toExamId === toExamId);
      if (!gap) continue;
      const exam = (id: number | null) => room.exams.find((candidate) => candidate.id === id) ?? null;
      const to = exam(gap.toExamId);
      if (to) return { gap, room, to, from: exam(gap.fromExamId) };
    }
    return null;
  });
  /** With a roster: the open gap's crew and why it waited or ran short-handed, in words. */
  protected readonly selectionPeople = computed(() => {
    const s = this.selection();
    const plan = this.store.plan();
    return s && plan ? gapPeopleWords(plan, s.room, s.gap) : null;
  });
  protected readonly cautions = computed(() => cautionsForDay(this.store.plan()?.rooms ?? []));

  constructor() {
    effect(() => {
      const day = this.day();
      if (day) this.store.open(day);
    });
    let openedExam = '';
    effect(() => {
      const accession = this.exam();
      const plan = this.store.plan();
      if (!accession || !plan || `${plan.date}/${accession}` === openedExam) return;
      openedExam = `${plan.date}/${accession}`;
      const room = plan.rooms.find((candidate) => candidate.exams.some((exam) => exam.accession === accession));
      const exam = room?.exams.find((candidate) => candidate.accession === accession);
      const gap = room?.gaps.find((candidate) => candidate.toExamId === exam?.id);
      // After the render that draws the timeline, so it can scroll to the gap.
      if (room && gap) afterNextRender(() => this.openProblem({ room, gap, atMs: 0 }), { injector: this.injector });
    });
  }

  protected show(date: string): void {
    this.selectedGap.set(null);
    void this.router.navigate(['/day', date]);
  }

  /** The proposal takes the side panel: a gap panel open before it closes (it would stack under the proposal and reopen after it). */
  protected proposeFit(): void {
    this.selectedGap.set(null);
    void this.fit.propose();
  }

  protected closeGap(): void {
    const toExamId = this.selectedGap();
    this.selectedGap.set(null);
    // Back to where the keyboard was: the gap's marker on the timeline, or its work in the people view.
    afterNextRender(() => document.querySelector<HTMLElement>(`[data-gap-to="${toExamId}"], [data-work-to="${toExamId}"]`)?.focus(), { injector: this.injector });
  }

  /** Adds an exam (none given) or edits or cancels one, in a dialog; its answer is the day's new plan. */
  protected openExam(exam: PlanExam | null): void {
    const plan = this.store.plan();
    if (!plan) return;
    // A block opens for every role; only a role that may move slots gets the form to change it.
    const readOnly = !this.mayMove();
    if (readOnly && !exam) return;
    const data: ExamDialogData = { date: plan.date, rooms: plan.rooms.map((room) => ({ id: room.id, name: room.name })), exam, readOnly, mayPin: this.mayMove() };
    this.dialog
      .open<ExamDialog, ExamDialogData, PlannedDay>(ExamDialog, { data, width: '40rem' })
      .afterClosed()
      .subscribe((answer) => {
        if (answer) void this.store.accept(answer);
      });
  }

  /** Who is on shift (read-only for a role that may not change it); a saved roster replans the day. */
  protected openRoster(): void {
    const plan = this.store.plan();
    if (!plan) return;
    const data: RosterDialogData = { date: plan.date, rooms: plan.rooms.map((room) => ({ id: room.id, name: room.name })), readOnly: !may(this.role(), 'editRoster') };
    this.dialog
      .open<RosterDialog, RosterDialogData, DayRoster>(RosterDialog, { data, width: '64rem', maxWidth: '96vw', autoFocus: 'dialog' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.store.reload();
      });
  }

  protected applyFix(fix: Fix, acceptNewProblems: boolean): void {
    void this.store.applyFix(fix, acceptNewProblems);
  }

  /** Opens the problem gap after (`1`) or before (`-1`) the one open, and brings it into view. */
  protected stepProblem(direction: 1 | -1): void {
    const problem = stepProblem(this.problems(), this.selectedGap(), direction, this.fromMs());
    if (problem) this.openProblem(problem);
  }

  /** A room's "N to check": its first problem gap (on today, the first still ahead). */
  protected openRoomProblems(roomId: number): void {
    const problem = firstProblemIn(this.problems(), roomId, this.fromMs());
    if (problem) this.openProblem(problem);
  }

  /** Where stepping through problems starts: now on today (the morning's gaps are over), else the day's start. */
  private fromMs(): number | null {
    return this.day() === this.today() ? this.clock.now() : null;
  }

  private openProblem(problem: ProblemGap): void {
    this.selectedGap.set(problem.gap.toExamId);
    // Once the panel is drawn (its heading takes the keyboard as it opens), the keyboard goes back to the gap's mark.
    afterNextRender(
      () => {
        if (this.shownView() === 'people') this.peopleView()?.reveal(problem.gap.toExamId);
        else this.timeline()?.reveal(problem.room.id, problem.gap.toExamId);
      },
      { injector: this.injector },
    );
  }

  protected onShortcut(event: KeyboardEvent): void {
    const target = event.target;
    // Text fields keep their own keys (and their own undo).
    if (target instanceof Element && target.closest('input, textarea, select, [contenteditable="true"]')) return;
    if ((event.key === ']' || event.key === '[') && !event.ctrlKey && !event.metaKey && !event.altKey) {
      event.preventDefault();
      return this.stepProblem(event.key === ']' ? 1 : -1);
    }
    if (!this.mayMove() || !(event.ctrlKey || event.metaKey) || event.key.toLowerCase() !== 'z') return;
    event.preventDefault();
    void (event.shiftKey ? this.store.redo() : this.store.undo());
  }
}
