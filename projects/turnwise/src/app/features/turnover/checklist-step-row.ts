import { ChangeDetectionStrategy, Component, computed, effect, input, linkedSignal, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Checklist, ChecklistStep } from '@shared/api/board';
import { NOTE_MAX_CHARS } from '@shared/api/limits';
import { countdown, isAhead } from '../../shared/ui/countdown';
import { SiteTime } from '../../shared/ui/site-time';
import { notYetDone, wetSurfaces } from './step-readiness';
import type { StepTick } from './turnover-service';

/**
 * One step of the checklist as a large touch row: what to do, for how long, when it was planned,
 * the product, and Done; once done, when and by whom, and the wet/dry countdown from the tick.
 */
@Component({
  selector: 'tw-checklist-step-row',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-checklist-step-row', role: 'listitem', '[class.done]': '!!step().done', '[attr.data-step]': 'step().key' },
  templateUrl: './checklist-step-row.html',
  styleUrl: './checklist-step-row.scss',
})
export class ChecklistStepRow {
  protected readonly noteMax = NOTE_MAX_CHARS;
  readonly step = input.required<ChecklistStep>();
  readonly steps = input.required<readonly ChecklistStep[]>();
  readonly products = input.required<Checklist['products']>();
  /** Now on the server's clock, in ms, ticking. */
  readonly now = input.required<number>();
  /** Off until the exam has left the room (or while a call is on its way). */
  readonly enabled = input(true);
  /** A read-only preview (the opening before the first exam): no product or Done at all. */
  readonly preview = input(false);
  /** The server said the surface is still wet: ask for the reason even if this screen thought it dry. */
  readonly askReason = input(false);

  readonly ticked = output<StepTick>();

  /** The product picked; starts at the protocol's default and follows it when the checklist changes. */
  protected readonly productKey = linkedSignal(() => this.step().productKey ?? '');
  protected readonly reasonOpen = signal(false);
  protected readonly reason = signal('');

  protected readonly wet = computed(() => wetSurfaces(this.step(), this.steps(), this.now()));
  protected readonly waitsFor = computed(() => notYetDone(this.step(), this.steps()));
  protected readonly disinfects = computed(() => this.step().productKey !== null);
  /** The contact time of the product picked (or used, once done), not only the protocol's default. */
  protected readonly contactMinutes = computed(() => {
    const step = this.step();
    const key = step.done ? step.done.productKey : this.productKey();
    return this.products().find((product) => product.key === key)?.contactMinutes ?? step.contactMinutes;
  });
  /** With two or more people on the turnover each row says whose step it is in the plan. */
  protected readonly shared = computed(() => this.steps().some((step) => step.planned.person > 1));

  /** "wet until 10:42 (3:20 left)" while the step's own surface is wet; null once dry or with no wait. */
  protected readonly wetLeft = computed(() => {
    const until = this.step().wetUntil;
    return isAhead(until, this.now()) ? countdown(until!, this.now()) : null;
  });

  constructor() {
    effect(() => {
      if (this.askReason()) this.reasonOpen.set(true);
    });
  }

  protected leftUntil(iso: string): string {
    return countdown(iso, this.now());
  }

  protected productName(key: string | null): string {
    return this.products().find((product) => product.key === key)?.name ?? key ?? '';
  }

  protected pickProduct(event: Event): void {
    this.productKey.set((event.target as HTMLSelectElement).value);
  }

  protected typeReason(event: Event): void {
    this.reason.set((event.target as HTMLInputElement).value);
  }

  protected done(): void {
    if (this.wet().length > 0 && !this.reasonOpen()) {
      this.reasonOpen.set(true);
      return;
    }
    const tick: StepTick = {};
    if (this.disinfects() && this.productKey()) tick.productKey = this.productKey();
    if (this.reasonOpen()) {
      const reason = this.reason().trim();
      if (!reason) return;
      tick.earlyReason = reason;
    }
    this.ticked.emit(tick);
  }
}
