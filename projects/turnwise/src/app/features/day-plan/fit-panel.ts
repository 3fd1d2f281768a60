import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { DayFitAnswer } from '@shared/api/day-fit';

import { verdictWords } from './gap-view';

/** `HH:MM` of an ISO time written with the site's offset (as the server writes every time). */
const clock = (iso: string) => iso.slice(11, 16);

/** Why an exam stays put, in the panel's words. */
const FIXED_WORDS: Readonly<Record<DayFitAnswer['fixed'][number]['reason'], string>> = {
  passed: 'past their start time',
  started: 'started',
  arrived: 'arrived',
  pinned: 'pinned',
};

/**
 * The proposal beside the timeline: what it changes, the patients to call, what stays unsolved
 * and why, and Apply or Discard. The timeline shows the same proposal (old places ghosted).
 */
@Component({
  selector: 'tw-fit-panel',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-fit-panel', role: 'region', 'aria-labelledby': 'tw-fit-title' },
  template: `
    @let p = proposal();
    <header>
      <h2 id="tw-fit-title">Make the day fit</h2>
      <button mat-icon-button type="button" class="close" aria-label="Discard the proposal" (click)="discarded.emit()"><mat-icon svgIcon="close" /></button>
    </header>
    <p class="summary" role="status">{{ summary() }}</p>
    <p class="solver">{{ solverWords() }}</p>
    @if (roster()) {
      <p class="roster-note">
        @if (proposal().solver.roster === 'exact') {
          Planned with the roster's people: who works each turnover was planned with the moves
          (one place at a time, walking between rooms, breaks and shifts); the People view shows
          each person's work.
        } @else {
          Planned with the roster's people: a turnover gets the crew the roster gives it and waits for
          someone busy in another room, and people the roster leaves free can help. Who works which
          turnover is settled after the moves, so a gap can still depend on people: check the People view.
        }
      </p>
    }
    @if (p.calls.length > 0) {
      <h3>Patients to call <span class="count">{{ p.calls.length }}</span></h3>
      <ul class="calls">
        @for (call of p.calls; track call.examId) {
          <li><span class="accession">{{ call.accession }}</span> {{ time(call.fromStart) }} → {{ time(call.toStart) }}{{ roomChange(call.fromRoomId, call.toRoomId) }}</li>
        }
      </ul>
    }
    @if (otherMoves().length > 0) {
      <h3>Other rooms, same time</h3>
      <ul class="calls">
        @for (move of otherMoves(); track move.examId) {
          <li><span class="accession">{{ move.accession }}</span> {{ roomName(move.from.roomId) }} → {{ roomName(move.to.roomId) }}</li>
        }
      </ul>
    }
    @if (p.helpers.length > 0) {
      <h3>Helpers</h3>
      <ul class="calls">
        @for (h of p.helpers; track h.toExamId) {
          <li>{{ h.label }} on the turnover before <span class="accession">{{ h.accession }}</span> ({{ h.staffFrom }} → {{ h.staffTo }} people)</li>
        }
      </ul>
    }
    @if (ahead().length > 0) {
      <h3 class="unsolved">Still short or overlapping <span class="count">{{ ahead().length }}</span></h3>
      <ul class="remaining">
        @for (gap of ahead(); track gap.toExamId) {
          <li><span class="accession">{{ gap.accession }}</span> in {{ roomName(gap.roomId) }}: {{ leftWords(gap) }}</li>
        }
      </ul>
    }
    @if (over().length > 0) {
      <details class="over">
        <summary>Earlier today, past changing <span class="count">{{ over().length }}</span></summary>
        <ul class="remaining">
          @for (gap of over(); track gap.toExamId) {
            <li><span class="accession">{{ gap.accession }}</span> in {{ roomName(gap.roomId) }}: {{ leftWords(gap) }}</li>
          }
        </ul>
      </details>
    }
    @if (p.fixed.length > 0) {
      <p class="fixed" [title]="fixedList()">May not move: {{ fixedWords() }}.</p>
    }
    <div class="actions">
      <button mat-flat-button type="button" class="apply" [disabled]="busy() || p.changes.length === 0" (click)="applied.emit()">Apply</button>
      <button mat-stroked-button type="button" class="discard" [disabled]="busy()" (click)="discarded.emit()">Discard</button>
    </div>
  `,
  styles: `
    :host { display: grid; gap: 8px; padding: 12px 16px; border-radius: var(--tw-radius-l); border: 1px solid var(--mat-sys-outline-variant); background: var(--mat-sys-surface-container-low); align-content: start; }
    header { display: flex; align-items: center; justify-content: space-between; }
    h2 { margin: 0; font: var(--mat-sys-title-medium); }
    h3 { margin: 4px 0 0; font: var(--mat-sys-title-small); display: flex; gap: 8px; align-items: baseline; }
    .count { font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); }
    p { margin: 0; font: var(--mat-sys-body-medium); }
    .roster-note { font: var(--mat-sys-body-small); padding: 8px; border-radius: 4px; background: var(--mat-sys-surface-container-high); }
    .solver, .fixed { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    ul { margin: 0; padding: 0 0 0 18px; font: var(--mat-sys-body-medium); font-variant-numeric: tabular-nums; display: grid; gap: 2px; }
    .accession { font-weight: 500; }
    .over summary { cursor: pointer; font: var(--mat-sys-title-small); color: var(--mat-sys-on-surface-variant); display: flex; gap: 8px; align-items: baseline; }
    .over summary::before { content: '▸'; }
    .over[open] summary::before { content: '▾'; }
    .over summary::-webkit-details-marker { display: none; }
    .over ul { margin-top: 4px; color: var(--mat-sys-on-surface-variant); }
    .actions { display: flex; gap: 8px; flex-wrap: wrap; margin-top: 4px; }
  `,
})
export class FitPanel {
  readonly proposal = input.required<DayFitAnswer>();
  readonly rooms = input.required<readonly { id: number; name: string }[]>();
  readonly busy = input(false);
  /** The day has a roster: the proposal is planned with its crews, in rounds (said in the panel). */
  readonly roster = input(false);
  readonly applied = output<void>();
  readonly discarded = output<void>();

  protected readonly time = clock;
  /**
   * The gaps left whose arriving exam has started or is already due: their turnover is over or
   * past changing, so they are listed apart (folded) from those still ahead.
   */
  protected readonly over = computed(() => {
    const gone = new Set(this.proposal().fixed.filter((f) => f.reason === 'started' || f.reason === 'passed').map((f) => f.examId));
    return this.proposal().remaining.filter((gap) => gone.has(gap.toExamId));
  });
  protected readonly ahead = computed(() => {
    const over = new Set(this.over());
    return this.proposal().remaining.filter((gap) => !over.has(gap));
  });
  protected readonly otherMoves = computed(() => this.proposal().moves.filter((m) => m.minutesMoved === 0));
  protected readonly summary = computed(() => {
    const { objective, changes } = this.proposal();
    const [ahead, over] = [this.ahead().length, this.over().length];
    const earlier = over > 0 ? ` ${over} gap${over === 1 ? '' : 's'} earlier today ${over === 1 ? 'is' : 'are'} past changing (${over === 1 ? 'its exam has' : 'their exams have'} started or ${over === 1 ? 'is' : 'are'} due).` : '';
    if (changes.length === 0 && ahead === 0) return `${over > 0 ? 'Every gap still ahead fits' : 'Every gap already fits'}: nothing to change.${earlier}`;
    const parts = [`${objective.examsMoved} exam${objective.examsMoved === 1 ? '' : 's'} moved`];
    if (objective.minutesMoved > 0) parts.push(`${objective.minutesMoved} min in all`);
    if (objective.helpersAdded > 0) parts.push(`${objective.helpersAdded} helper${objective.helpersAdded === 1 ? '' : 's'}`);
    if (objective.dayEndsAt) parts.push(`the day ends at ${clock(objective.dayEndsAt)}`);
    const still = over > 0 ? ' still ahead' : '';
    const cleared = ahead === 0 ? `Clears every short and overlapping gap${still}` : `Leaves ${ahead} gap${ahead === 1 ? '' : 's'}${still} short or overlapping`;
    return `${cleared}: ${parts.join(', ')}.${earlier}`;
  });
  protected readonly solverWords = computed(() => {
    const { solver } = this.proposal();
    if (solver.status === 'nothing-to-do') return 'Nothing to solve.';
    const scope = solver.scope === 'whole' ? 'whole day' : 'around each problem gap';
    const took = `found in ${(solver.milliseconds / 1000).toFixed(1)} s`;
    if (solver.roster === 'exact' && solver.status === 'optimal') return `Best possible with the roster's people (whole day, who works each turnover included); ${took}.`;
    // Planned in rounds, never proven the best: a window's optimality gap says nothing of the day's.
    if (solver.rosterRounds !== undefined) {
      const count = (n: number | undefined, one: string, more: string) => (n ? [`${n} ${n === 1 ? one : more}`] : []);
      const steps = [...count(solver.rosterRounds, 'round', 'rounds'), ...count(solver.rosterPushes, 'push along a room', 'pushes along rooms'), ...count(solver.rosterWindows, 'window', 'windows'), ...count(solver.rosterReturned, 'move taken back', 'moves taken back')];
      const words = steps.length > 1 ? `${steps.slice(0, -1).join(', ')} and ${steps.at(-1)}` : steps.join('');
      const limited = solver.status === 'time-limit' ? ' within the time limit' : '';
      return `Best found in ${words}${limited} with the roster's crews (not proven the best possible); ${took}.`;
    }
    if (solver.status === 'optimal' && solver.scope === 'whole') return `Best possible (whole day); ${took}.`;
    if (solver.status === 'optimal') return `Best within reach of each problem gap (a day this size is not searched whole); ${took}.`;
    const gap = solver.mipGap >= 1 ? 'not known' : `${(solver.mipGap * 100).toFixed(0)} %`;
    return `Best found within the time limit (${scope}); optimality gap ${gap}.`;
  });
  /** By reason, short enough for a busy afternoon ("12 started, 2 arrived, FX-9 pinned"); every accession in the title. */
  protected readonly fixedWords = computed(() => {
    const fixed = this.proposal().fixed;
    return (['passed', 'started', 'arrived', 'pinned'] as const)
      .map((reason) => fixed.filter((f) => f.reason === reason))
      .filter((list) => list.length > 0)
      .map((list) => (list.length <= 2 ? `${list.map((f) => f.accession).join(', ')} ${FIXED_WORDS[list[0]!.reason]}` : `${list.length} ${FIXED_WORDS[list[0]!.reason]}`))
      .join('; ');
  });
  protected readonly fixedList = computed(() => this.proposal().fixed.map((f) => `${f.accession} (${FIXED_WORDS[f.reason]})`).join(', '));

  /** A gap left: its verdict and why, without saying "short by" twice when the people's words already open with it. */
  protected leftWords(gap: DayFitAnswer['remaining'][number]): string {
    if (gap.reason.startsWith(`Short by ${gap.shortByMinutes} min`)) return gap.verdict === 'overlap' ? `overlap — ${gap.reason}` : gap.reason;
    return `${verdictWords(gap)} — ${gap.reason}`;
  }

  protected roomName(id: number): string {
    return this.rooms().find((r) => r.id === id)?.name ?? `room ${id}`;
  }

  protected roomChange(from: number, to: number): string {
    return from === to ? '' : `, ${this.roomName(from)} → ${this.roomName(to)}`;
  }
}
