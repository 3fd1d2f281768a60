import { ChangeDetectionStrategy, Component, inject, input, linkedSignal } from '@angular/core';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';

import type { PlanExam } from '@shared/api/plan';
import { action } from '../../core/state/action';
import { DayFitService } from './day-fit-service';

/**
 * Pins an exam in the exam dialog: a pinned exam never moves when the day is made to fit. Saved
 * at once (apart from the form's Save); the plan updates through the day's live events.
 */
@Component({
  selector: 'tw-pin-toggle',
  imports: [MatSlideToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-slide-toggle class="pin" [checked]="pinned()" [disabled]="saving.pending()" (change)="set($event.checked)">
      Pinned: "Make the day fit" never moves {{ exam().accession }}
    </mat-slide-toggle>
    @if (saving.error(); as error) {
      <p class="error" role="alert">{{ error.message }}</p>
    }
  `,
  styles: `
    :host { display: grid; gap: 4px; grid-column: 1 / -1; margin: 4px 0 12px; }
    .error { margin: 0; color: var(--mat-sys-error); }
  `,
})
export class PinToggle {
  private readonly api = inject(DayFitService);
  readonly exam = input.required<PlanExam>();
  protected readonly pinned = linkedSignal(() => this.exam().pinned === true);
  protected readonly saving = action((examId: number, pinned: boolean) => this.api.pin(examId, pinned), 'The pin could not be saved. Try again.');

  protected async set(pinned: boolean): Promise<void> {
    const result = await this.saving.run(this.exam().id, pinned);
    this.pinned.set(result.status === 'done' ? result.value.pinned : !pinned);
  }
}
