import { ChangeDetectionStrategy, Component, ElementRef, afterNextRender, computed, effect, inject, input, output, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { of } from 'rxjs';

import type { PlanExam, PlanGap, PlanRoom } from '@shared/api/plan';
import { TURNOVER_STAFF } from '@shared/api/limits';
import type { Fix } from '@shared/fixes/model';
import { serverState } from '../../core/state/server-state';
import { Clock } from '../../core/time/clock';
import { CautionKind, CautionNote } from '../../shared/ui/caution-note';
import { SiteTime } from '../../shared/ui/site-time';
import { VerdictChip } from '../../shared/ui/verdict-chip';
import { DayPlanService } from './day-plan-service';
import { FixCard, isPartialFix } from './fix-card';
import type { GapPeopleWords } from './people-reason';

/**
 * One gap in full, beside the timeline: verdict, what it needs and has, ready-at, the steps in
 * order with who does each, the helpers on it, and the fixes the server suggests for it.
 */
@Component({
  selector: 'tw-gap-panel',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule, CautionNote, FixCard, SiteTime, VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-gap-panel', role: 'region', '[attr.aria-label]': 'title()', '(keydown.escape)': 'closed.emit()' },
  templateUrl: './gap-panel.html',
  styleUrl: './gap-panel.scss',
})
export class GapPanel {
  private readonly api = inject(DayPlanService);
  private readonly minute = inject(Clock).minute;

  readonly date = input.required<string>();
  readonly gap = input.required<PlanGap>();
  readonly room = input.required<PlanRoom>();
  readonly from = input<PlanExam | null>(null);
  readonly to = input.required<PlanExam>();
  /** Bumped by the store on every new plan: the fixes are fetched again. */
  readonly revision = input(0);
  readonly mayStaff = input(false);
  readonly mayApply = input(false);
  readonly busy = input(false);
  /** With a roster: the crew by label and why it started late or short-handed (see gapPeopleWords). */
  readonly people = input<GapPeopleWords | null>(null);
  readonly closed = output<void>();
  readonly staffChosen = output<number | null>();
  readonly applied = output<{ fix: Fix; acceptNewProblems: boolean }>();

  private readonly heading = viewChild.required<ElementRef<HTMLElement>>('heading');

  protected readonly staffChoices = Array.from({ length: TURNOVER_STAFF.max }, (_, i) => i + 1);
  protected readonly title = computed(() => `${this.gap().fromExamId === null ? 'Opening' : 'Turnover'} before ${this.to().accession}`);
  protected readonly late = computed(() => this.gap().verdict === 'short' || this.gap().verdict === 'overlap');
  /** The arriving patient's start has gone by: the turnover is over and no fix moves them (the server offers none). */
  protected readonly due = computed(() => Date.parse(this.to().start) < this.minute());
  protected readonly helperAdded = computed(() => this.gap().staff !== this.room().staff);
  protected readonly cautions = computed(() => {
    const kinds: CautionKind[] = ['general'];
    if (this.room().modality === 'MR') kinds.push('mr');
    if (this.gap().airHoldMinutes > 0) kinds.push('airborne');
    return kinds;
  });

  /** The server's fixes for a short or overlapping gap (none asked for one that fits), fetched again on every new plan. */
  private readonly fixesFor = computed(() => ({ date: this.date(), revision: this.revision(), toExamId: this.to().id, late: this.late() }));
  protected readonly fixes = serverState(
    ({ date, toExamId, late }: { date: string; toExamId: number; late: boolean }) => (late ? this.api.fixes(date, toExamId) : of<Fix[]>([])),
    'Fixes could not be loaded.',
  );

  /** Fixes that make the gap fit come first; those that only help (still short) after them. */
  protected readonly orderedFixes = computed(() => {
    const fixes = this.fixes.value() ?? [];
    return [...fixes.filter((fix) => !isPartialFix(fix)), ...fixes.filter(isPartialFix)];
  });

  constructor() {
    effect(() => this.fixes.show(this.fixesFor()));
    // Opening the panel takes the keyboard to it; Escape or Close brings it back to the timeline.
    afterNextRender(() => this.heading().nativeElement.focus());
  }

  protected chooseStaff(value: string): void {
    this.staffChosen.emit(value === 'room' ? null : Number(value));
  }
}
