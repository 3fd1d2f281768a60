import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, input } from '@angular/core';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { DRY_MINUTES, HANDS_ON_MINUTES, type ProductView } from '@shared/api/protocols';
import { fieldMessage } from './form-problems';
import { MOBILITY_OPTIONS, PRECAUTION_OPTIONS, stepGroup, type Need, type StepGroup } from './protocol-form';

/**
 * One list of a protocol's steps (the turnover's, or the room's opening): each step's fields,
 * its needs as chips ("after X", "after X is dry"), the conditions it is done under; add,
 * remove and reorder. Every control is a native or Material one, so the list is keyboard-complete.
 */
@Component({
  selector: 'tw-protocol-steps',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatChipsModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './protocol-steps.html',
  styleUrl: './protocol-steps.scss',
})
export class ProtocolSteps {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  readonly steps = input.required<FormArray<StepGroup>>();
  /** "Turnover step" or "Opening step": names the buttons and the list. */
  readonly noun = input.required<string>();
  readonly products = input.required<readonly ProductView[]>();
  /** Ids unique per list (a dialog holds the turnover's and the opening's). */
  protected readonly idPrefix = computed(() => this.noun().toLowerCase().replace(/\W+/g, '-'));
  protected readonly handsOn = HANDS_ON_MINUTES;
  protected readonly dry = DRY_MINUTES;
  protected readonly mobilities = MOBILITY_OPTIONS;
  /** The yes/no conditions, each as any / only then / only without. */
  protected readonly yesNo = [
    { name: 'contrast', label: 'Contrast exam next' },
    { name: 'coilChange', label: 'Coil change' },
  ] as const;
  protected readonly precautions = PRECAUTION_OPTIONS;

  protected message(control: StepGroup['controls'][keyof StepGroup['controls']] | FormArray<StepGroup>): string {
    return fieldMessage(control);
  }

  protected name(step: StepGroup, index: number): string {
    return step.controls.label.value.trim() || step.controls.key.value.trim() || `${this.noun()} ${index + 1}`;
  }

  /** A need in words, e.g. "after Wipe table is dry". */
  protected needText(need: Need): string {
    const other = this.steps().controls.find((s) => s.controls.key.value === need.key);
    const name = other ? other.controls.label.value || need.key : `${need.key} (no such step)`;
    return need.dry ? `after ${name} is dry` : `after ${name}`;
  }

  /** The steps this one could wait for: every other step with a key, done or done and dry. */
  protected needChoices(step: StepGroup): { value: string; text: string }[] {
    const taken = new Set(step.controls.needs.value.map((n) => `${n.key}:${n.dry}`));
    return this.steps()
      .controls.filter((other) => other !== step && other.controls.key.value.trim() !== '')
      .flatMap((other) => {
        const key = other.controls.key.value.trim();
        const label = other.controls.label.value || key;
        return [
          { value: `${key}:false`, text: `after ${label}` },
          { value: `${key}:true`, text: `after ${label} is dry` },
        ];
      })
      .filter((choice) => !taken.has(choice.value));
  }

  protected addNeed(step: StepGroup, choice: string | null): void {
    if (!choice) return;
    const [key, dry] = choice.split(':');
    // waiting for a step done and dry already includes waiting for it done
    const others = step.controls.needs.value.filter((n) => n.key !== key);
    step.controls.needs.setValue([...others, { key: key!, dry: dry === 'true' }]);
    step.controls.needs.markAsDirty();
  }

  protected removeNeed(step: StepGroup, need: Need): void {
    step.controls.needs.setValue(step.controls.needs.value.filter((n) => n !== need));
    step.controls.needs.markAsDirty();
  }

  protected add(): void {
    const keys = new Set(this.steps().controls.map((s) => s.controls.key.value));
    let n = this.steps().length + 1;
    while (keys.has(`step-${n}`)) n++;
    const step = stepGroup(this.fb);
    step.controls.key.setValue(`step-${n}`);
    this.steps().push(step);
    const index = this.steps().length - 1;
    afterNextRender(() => this.host.nativeElement.querySelector<HTMLInputElement>(`[data-step="${index}"] input[formcontrolname="label"]`)?.focus(), { injector: this.injector });
  }

  protected remove(index: number): void {
    this.steps().removeAt(index);
    this.steps().markAsDirty();
  }

  protected move(index: number, by: -1 | 1): void {
    const steps = this.steps();
    const step = steps.at(index);
    steps.removeAt(index, { emitEvent: false });
    steps.insert(index + by, step);
    // keep the keyboard on the same button of the moved step
    const which = by < 0 ? 'up' : 'down';
    afterNextRender(() => this.host.nativeElement.querySelector<HTMLButtonElement>(`[data-step="${index + by}"] button[data-move="${which}"]:not([disabled])`)?.focus(), { injector: this.injector });
  }

  protected productName(id: number): string {
    return this.products().find((p) => p.id === id)?.name ?? `product ${id}`;
  }
}
