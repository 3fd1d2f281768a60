import { ChangeDetectionStrategy, Component, computed, input, linkedSignal, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Checklist } from '@shared/api/board';
import { NOTE_MAX_CHARS } from '@shared/api/limits';
import { countdown, isAhead } from '../../shared/ui/countdown';
import { RoomStateChip } from '../../shared/ui/room-state-chip';
import { SiteTime } from '../../shared/ui/site-time';

/**
 * The end of a turnover: ready-at as recomputed from what happened, the air hold countdown, and
 * "Turnover complete" once every step is done. Closing during an air hold or while a surface is
 * still wet needs a stated reason.
 */
@Component({
  selector: 'tw-turnover-close',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, RoomStateChip, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './turnover-close.html',
  styleUrl: './turnover-close.scss',
})
export class TurnoverClose {
  protected readonly noteMax = NOTE_MAX_CHARS;
  readonly checklist = input.required<Checklist>();
  /** Now on the server's clock, in ms, ticking. */
  readonly now = input.required<number>();
  readonly busy = input(false);

  /** The override reason when closing early (air hold, wet surface), else undefined. */
  readonly completed = output<string | undefined>();

  /** Which turnover this is: the form below belongs to it alone and starts empty for the next one. */
  private readonly turnoverId = computed(() => this.checklist().turnoverId);
  protected readonly overrideOpen = linkedSignal({ source: this.turnoverId, computation: () => false });
  protected readonly overrideReason = linkedSignal({ source: this.turnoverId, computation: () => '' });
  /** A turnover opens with "Exam finished"; before that there is nothing to close, only the plan to show. */
  protected readonly open = computed(() => this.turnoverId() !== null);

  protected readonly missing = computed(() => this.checklist().steps.filter((step) => !step.done).length);
  /** Counts from the recorded end only: the server sends no `airHoldUntil` before "Exam finished". */
  protected readonly holdLeft = computed(() => {
    const c = this.checklist();
    return c.examEndedAt && isAhead(c.airHoldUntil, this.now()) ? countdown(c.airHoldUntil!, this.now()) : null;
  });
  /** Surfaces still wet: closing now lets the next patient use them before their contact time is up. */
  protected readonly stillWet = computed(() =>
    this.checklist().steps.filter((step) => step.done && isAhead(step.wetUntil, this.now())).map((step) => ({ label: step.label, until: step.wetUntil! })),
  );
  protected readonly canComplete = computed(() => {
    const c = this.checklist();
    return c.turnoverId !== null && c.completedAt === null && this.missing() === 0 && !this.busy();
  });

  protected typeReason(event: Event): void {
    this.overrideReason.set((event.target as HTMLInputElement).value);
  }

  /** Closing before the air hold ends or while a surface is wet needs a stated reason (the server asks too). */
  protected readonly early = computed(() => this.holdLeft() !== null || this.stillWet().length > 0);
  protected readonly reasonLabel = computed(() =>
    this.holdLeft() !== null ? 'Why close before the air hold ends?' : 'Why close while surfaces are still wet?',
  );

  protected complete(): void {
    if (!this.early()) {
      this.completed.emit(undefined);
    } else if (!this.overrideOpen()) {
      this.overrideOpen.set(true);
    } else if (this.overrideReason().trim()) {
      this.completed.emit(this.overrideReason().trim());
    }
  }
}
