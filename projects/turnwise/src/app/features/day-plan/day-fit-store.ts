import { Injectable, computed, effect, inject, signal } from '@angular/core';

import type { DayFitAnswer } from '@shared/api/day-fit';
import { action } from '../../core/state/action';
import { DayFitService } from './day-fit-service';
import { DayPlanStore } from './day-plan-store';
import { fitPreview } from './fit-preview';

/**
 * "Make the day fit" on the Day plan: asks for the proposal, keeps it while it is previewed on
 * the timeline, applies it (the day's new plan goes to the plan's store, so Undo and the
 * patients to call work as after any change) or discards it. Provided by the Day plan screen.
 */
@Injectable()
export class DayFitStore {
  private readonly api = inject(DayFitService);
  private readonly plan = inject(DayPlanStore);
  private readonly asking = action((date: string) => this.api.propose(date), 'The day could not be made to fit. Try again.');
  private readonly applying = action((date: string, proposal: DayFitAnswer) => this.api.apply(date, proposal), 'The proposal could not be applied. Try again.');

  readonly proposal = signal<DayFitAnswer | null>(null);
  readonly asked = this.asking.pending;
  readonly busy = computed(() => this.asking.pending() || this.applying.pending());
  /** The proposal drawn on the timeline: its rooms recomputed, the old places ghosted. */
  readonly preview = computed(() => {
    const proposal = this.proposal();
    const day = this.plan.plan();
    return proposal && day && day.date === proposal.date ? fitPreview(day, proposal) : null;
  });

  constructor() {
    // Another day shown: its proposal does not belong there.
    effect(() => {
      const date = this.plan.date();
      if (this.proposal() && this.proposal()!.date !== date) this.proposal.set(null);
    });
  }

  async propose(): Promise<void> {
    const date = this.plan.date();
    if (!date) return;
    const result = await this.asking.run(date);
    if (result.status === 'failed') return this.plan.tell({ tone: 'error', text: result.error.message });
    if (result.value.date === this.plan.date()) this.proposal.set(result.value);
  }

  async apply(): Promise<void> {
    const proposal = this.proposal();
    if (!proposal) return;
    const result = await this.applying.run(proposal.date, proposal);
    if (result.status === 'failed') {
      this.plan.tell({ tone: 'error', text: result.error.message });
      // The day moved on (fit_stale) or an exam changed since: the proposal is no good any more.
      if (result.error.status === 409) {
        this.proposal.set(null);
        this.plan.reload();
      }
      return;
    }
    this.proposal.set(null);
    await this.plan.accept(result.value);
  }

  discard(): void {
    this.proposal.set(null);
  }
}
