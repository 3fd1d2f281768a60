import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { HANDS_ON_MINUTES } from '@shared/api/protocols';
import { fieldMessage } from './form-problems';
import { adjustmentGroup, type AdjustmentGroup } from './protocol-form';

/** Hands-on changes by step ("wipe table: add 2 min", "hygiene: set to 3 min"), e.g. for a stretcher patient. */
@Component({
  selector: 'tw-step-adjustments',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @for (row of adjustments().controls; track row; let i = $index) {
      <div class="adjustment" [formGroup]="row">
        <mat-form-field class="step">
          <mat-label>Step</mat-label>
          <mat-select formControlName="step" required>
            @for (step of steps(); track step.key) {
              <mat-option [value]="step.key">{{ step.label }}</mat-option>
            }
            @if (row.controls.step.value && !known(row.controls.step.value)) {
              <mat-option [value]="row.controls.step.value">{{ row.controls.step.value }} (no such step)</mat-option>
            }
          </mat-select>
          <mat-error>{{ message(row.controls.step) }}</mat-error>
        </mat-form-field>
        <mat-form-field class="mode">
          <mat-label>Change</mat-label>
          <mat-select formControlName="mode">
            <mat-option value="add">add</mat-option>
            <mat-option value="set">set to</mat-option>
          </mat-select>
        </mat-form-field>
        <mat-form-field class="minutes">
          <mat-label>Minutes</mat-label>
          <input matInput type="number" formControlName="minutes" [min]="handsOn.min" [max]="handsOn.max" step="0.5" required />
          <mat-error>{{ message(row.controls.minutes) }}</mat-error>
        </mat-form-field>
        <button mat-icon-button type="button" (click)="remove(i)" [attr.aria-label]="'Remove the ' + what() + ' change ' + (i + 1)">
          <mat-icon svgIcon="remove_circle" aria-hidden="true" />
        </button>
      </div>
    } @empty {
      <p class="muted">No change.</p>
    }
    <button mat-button type="button" (click)="add()" [disabled]="steps().length === 0">
      <mat-icon svgIcon="add_circle" aria-hidden="true" />Add a change {{ what() }}
    </button>
  `,
  styles: `
    :host { display: block; }
    .adjustment { display: flex; flex-wrap: wrap; align-items: center; column-gap: 12px; }
    .step { flex: 2 1 200px; }
    .mode { flex: 0 1 110px; }
    .minutes { flex: 0 1 110px; }
    .muted { color: var(--mat-sys-on-surface-variant); margin: 4px 0; }
  `,
})
export class StepAdjustments {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly adjustments = input.required<FormArray<AdjustmentGroup>>();
  /** The turnover's steps to choose from. */
  readonly steps = input.required<readonly { key: string; label: string }[]>();
  /** Which adjustment this is, in words ("for a stretcher"), for the buttons' names. */
  readonly what = input.required<string>();
  protected readonly handsOn = HANDS_ON_MINUTES;

  protected message(control: AdjustmentGroup['controls'][keyof AdjustmentGroup['controls']]): string {
    return fieldMessage(control);
  }

  protected known(key: string): boolean {
    return this.steps().some((s) => s.key === key);
  }

  protected add(): void {
    this.adjustments().push(adjustmentGroup(this.fb, { step: this.steps()[0]?.key ?? '', addMinutes: 1 }));
  }

  protected remove(index: number): void {
    this.adjustments().removeAt(index);
    this.adjustments().markAsDirty();
  }
}
