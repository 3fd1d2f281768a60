import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { HANDS_ON_MINUTES, PRECAUTION_LEVELS, type PrecautionLevel, type ProductView } from '@shared/api/protocols';
import { fieldMessage } from './form-problems';
import type { ExtrasGroup } from './protocol-form';
import { StepAdjustments } from './step-adjustments';

/** What each precaution level of the leaving exam adds: protective equipment first, a product, longer steps, an air hold. */
@Component({
  selector: 'tw-precaution-extras',
  imports: [ReactiveFormsModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, StepAdjustments],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @for (level of levels; track level) {
      @let extras = group(level);
      <fieldset [formGroup]="extras">
        <legend>After {{ level }} precautions</legend>
        <div class="row">
          <mat-checkbox formControlName="hasDon">Put on protective equipment first</mat-checkbox>
          @if (extras.controls.hasDon.value) {
            <ng-container formGroupName="don">
              <mat-form-field class="label">
                <mat-label>Step label</mat-label>
                <input matInput formControlName="label" required maxlength="80" />
                <mat-error>{{ message(extras.controls.don.controls.label) }}</mat-error>
              </mat-form-field>
              <mat-form-field class="minutes">
                <mat-label>Hands-on (min)</mat-label>
                <input matInput type="number" formControlName="handsOnMinutes" [min]="handsOn.min" [max]="handsOn.max" step="0.5" required />
                <mat-error>{{ message(extras.controls.don.controls.handsOnMinutes) }}</mat-error>
              </mat-form-field>
            </ng-container>
          }
        </div>
        <div class="row">
          <mat-form-field class="product">
            <mat-label>Product for every disinfecting step</mat-label>
            <mat-select formControlName="productId">
              <mat-option [value]="null">Each step's own product</mat-option>
              @for (product of products(); track product.id) {
                @if (!product.retired || extras.controls.productId.value === product.id) {
                  <mat-option [value]="product.id">{{ product.name }} ({{ product.contactMinutes }} min)</mat-option>
                }
              }
            </mat-select>
            <mat-hint>{{ level === 'enteric' ? 'Spore formers: a sporicidal product' : 'E.g. a product your policy names for this precaution' }}</mat-hint>
            <mat-error>{{ message(extras.controls.productId) }}</mat-error>
          </mat-form-field>
          <mat-checkbox formControlName="airHold">Hold the room until the air is exchanged</mat-checkbox>
        </div>
        <p class="sub">Longer or extra hands-on time (e.g. longer hand hygiene)</p>
        <tw-step-adjustments [adjustments]="extras.controls.adjust" [steps]="steps()" [what]="'after ' + level + ' precautions'" />
      </fieldset>
    }
  `,
  styles: `
    :host { display: block; }
    fieldset { border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; margin: 0 0 12px; padding: 4px 12px 8px; }
    legend { font: var(--mat-sys-title-small); padding: 0 4px; }
    .row { display: flex; flex-wrap: wrap; align-items: center; column-gap: 12px; }
    .label { flex: 2 1 200px; }
    .minutes { flex: 0 1 120px; }
    .product { flex: 1 1 260px; }
    .sub { margin: 4px 0 0; font: var(--mat-sys-label-large); }
  `,
})
export class PrecautionExtras {
  readonly precautions = input.required<FormGroup<Record<PrecautionLevel, ExtrasGroup>>>();
  readonly products = input.required<readonly ProductView[]>();
  readonly steps = input.required<readonly { key: string; label: string }[]>();
  protected readonly levels = PRECAUTION_LEVELS;
  protected readonly handsOn = HANDS_ON_MINUTES;

  protected group(level: PrecautionLevel): ExtrasGroup {
    return this.precautions().controls[level];
  }

  protected message(control: Parameters<typeof fieldMessage>[0]): string {
    return fieldMessage(control);
  }
}
