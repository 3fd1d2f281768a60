import { Injectable, computed, effect, inject, signal } from '@angular/core';

import type { DayFitAnswer } from '@shared/api/day-fit';
import type { ApiError, Problem } from '@shared/api/errors';
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
      this.plan.tell({ tone: 'error', text: applyRefusalWords(result.error) });
      // The day moved on (fit_stale), an exam changed or time passed since: the proposal is no good any more.
      if (result.error.status === 409 || result.error.status === 422) {
        this.proposal.set(null);
        this.plan.reload();
      }
      return;
    }
    this.proposal.set(null);
    if (await this.plan.accept(result.value)) this.plan.tell({ tone: 'info', text: appliedWords(proposal) });
  }

  discard(): void {
    this.proposal.set(null);
  }
}

/**
 * Why a proposal was not applied, in words to act on: a 422 names its first problems (an exam
 * already due, a start that has passed since the proposal was made) and asks for a new one.
 *
 * @example
 * applyRefusalWords(refusal); // 'This proposal cannot be applied as sent: PU-2 would start at 09:40, which has passed. Make the day fit again.'
 */
export function applyRefusalWords(error: ApiError): string {
  const problems = (error.details as { problems?: Problem[] } | undefined)?.problems ?? [];
  if (error.status !== 422 || problems.length === 0) return error.message;
  const shown = problems.slice(0, 2).map((p) => p.message);
  const more = problems.length > shown.length ? ` and ${problems.length - shown.length} more` : '';
  return `${error.message.replace(/\.$/, '')}: ${shown.join('; ')}${more}. Make the day fit again.`;
}

/**
 * What an applied proposal did, said where the Day plan says what happened: the panel is gone
 * with it, so without this nothing on screen would confirm it.
 *
 * @example
 * appliedWords(proposal); // 'Proposal applied: 2 exams moved. Call the 2 patients under Patients to call. Undo takes all of it back.'
 */
export function appliedWords(proposal: DayFitAnswer): string {
  const moved = proposal.objective.examsMoved;
  const calls = proposal.calls.length;
  const helpers = proposal.helpers.length;
  const done = [`${moved} exam${moved === 1 ? '' : 's'} moved`, ...(helpers > 0 ? [`${helpers} helper${helpers === 1 ? '' : 's'} added`] : [])].join(', ');
  const call = calls > 0 ? ` Call the ${calls === 1 ? 'patient' : `${calls} patients`} under Patients to call.` : '';
  return `Proposal applied: ${done}.${call} Undo takes all of it back.`;
}
