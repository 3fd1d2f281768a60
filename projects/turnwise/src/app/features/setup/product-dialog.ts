import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import {
  PRODUCT_KINDS,
  PRODUCT_KIND_LABELS,
  PRODUCT_MINUTES_MAX,
  SHORT_CONTACT_CAUTION,
  SHORT_CONTACT_MINUTES,
  productInputSchema,
  type EffectPreview as Preview,
  type ProductAnswer,
  type ProductInput,
  type ProductView,
} from '@shared/api/protocols';
import { applicationsOf } from '@shared/turnover/protocols';
import { action } from '../../core/state/action';
import { CautionNote } from '../../shared/ui/caution-note';
import { EffectPreview } from './effect-preview';
import { fieldMessage, numberOrNull, schemaValidator, showProblems, submitForm } from './form-problems';
import { ProtocolsApi } from './protocols-api';

const field = productInputSchema.shape;

/**
 * Add or edit a disinfectant product. Says when a step with it is re-wetted (it dries before the
 * label contact time) and when the contact time is under CDC's 1 minute; an edit can preview its
 * effect on required minutes and this week's verdicts before it is saved.
 */
@Component({
  selector: 'tw-product-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, CautionNote, EffectPreview],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ product ? 'Edit ' + product.name : 'Add a product' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <tw-caution-note />
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required maxlength="80" />
          <mat-hint>As on the label, e.g. a wipe's brand and strength</mat-hint>
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Kind</mat-label>
          <mat-select formControlName="kind" required>
            @for (kind of kinds; track kind) {
              <mat-option [value]="kind">{{ kindLabels[kind] }}</mat-option>
            }
          </mat-select>
          <mat-hint>Sporicidal products are for enteric precautions (spore formers)</mat-hint>
          <mat-error>{{ message('kind') }}</mat-error>
        </mat-form-field>
        <div class="hours">
          <mat-form-field>
            <mat-label>Label contact time (min)</mat-label>
            <input matInput type="number" formControlName="contactMinutes" min="0" [max]="minutesMax" step="0.25" required />
            <mat-hint>How long the surface must stay wet</mat-hint>
            <mat-error>{{ message('contactMinutes') }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Stays wet for (min)</mat-label>
            <input matInput type="number" formControlName="staysWetMinutes" min="0" [max]="minutesMax" step="0.25" />
            <mat-hint>One application, from the label or a test; optional</mat-hint>
            <mat-error>{{ message('staysWetMinutes') }}</mat-error>
          </mat-form-field>
        </div>
        @if (applications() > 1) {
          <p class="rewet" role="status">
            One application dries after {{ values().staysWetMinutes }} min, before the {{ values().contactMinutes }} min contact time,
            so a disinfecting step with this product is wetted {{ applications() }} times (⌈{{ values().contactMinutes }} ÷ {{ values().staysWetMinutes }}⌉)
            and its hands-on time is {{ applications() }} × the step's minutes. The surface must stay wet for the whole label contact time.
          </p>
        }
        @if (shortContact()) {
          <p class="warning" role="status">{{ shortContactCaution }}</p>
        }
        <mat-form-field>
          <mat-label>Registration number</mat-label>
          <input matInput formControlName="registration" maxlength="80" />
          <mat-hint>As printed on the label, e.g. an EPA Reg. No.; the cleaning log shows it</mat-hint>
          <mat-error>{{ message('registration') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Notes</mat-label>
          <textarea matInput formControlName="notes" rows="2" maxlength="500"></textarea>
          <mat-error>{{ message('notes') }}</mat-error>
        </mat-form-field>
        @if (product) {
          @if (preview(); as answer) {
            <tw-effect-preview [preview]="answer" />
          } @else {
            <p class="policy">Preview the effect to see required minutes and this week's verdicts before and after.</p>
          }
        } @else {
          <p class="policy">A new product changes no turnover until a protocol uses it.</p>
        }
        @if (formError(); as text) {
          <p class="form-error" role="alert">{{ text }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        @if (product) {
          <button mat-button type="button" (click)="runPreview()" [disabled]="previewing.pending()">Preview effect</button>
        }
        <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ product ? 'Save product' : 'Add product' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './setup-dialog.scss',
})
export class ProductDialog {
  private readonly api = inject(ProtocolsApi);
  private readonly ref = inject(MatDialogRef<ProductDialog, ProductAnswer>);
  protected readonly product = inject<ProductView | null>(MAT_DIALOG_DATA, { optional: true });
  protected readonly kinds = PRODUCT_KINDS;
  protected readonly kindLabels = PRODUCT_KIND_LABELS;
  protected readonly minutesMax = PRODUCT_MINUTES_MAX;
  protected readonly shortContactCaution = SHORT_CONTACT_CAUTION;
  protected readonly formError = signal<string | null>(null);
  protected readonly preview = signal<Preview | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.product?.name ?? '', schemaValidator(field.name)],
    kind: [this.product?.kind ?? 'standard', schemaValidator(field.kind)],
    contactMinutes: [this.product?.contactMinutes ?? (null as number | null), schemaValidator(field.contactMinutes, numberOrNull)],
    staysWetMinutes: [this.product?.staysWetMinutes ?? (null as number | null), schemaValidator(field.staysWetMinutes, numberOrNull)],
    registration: [this.product?.registration ?? '', schemaValidator(field.registration)],
    notes: [this.product?.notes ?? '', schemaValidator(field.notes)],
  });

  protected readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly applications = computed(() => {
    const contact = numberOrNull(this.values().contactMinutes);
    const wet = numberOrNull(this.values().staysWetMinutes);
    return contact !== null && contact > 0 ? applicationsOf({ contactMinutes: contact, staysWetMinutes: wet }) : 1;
  });
  protected readonly shortContact = computed(() => {
    const contact = numberOrNull(this.values().contactMinutes);
    return contact !== null && contact > 0 && contact < SHORT_CONTACT_MINUTES;
  });

  protected readonly saving = action(() => (this.product ? this.api.updateProduct(this.product.id, this.body()) : this.api.createProduct(this.body())));
  protected readonly previewing = action((id: number) => this.api.previewProduct(id, this.body()));

  protected message(name: keyof typeof this.form.controls): string {
    return fieldMessage(this.form.controls[name]);
  }

  protected async runPreview(): Promise<void> {
    this.formError.set(null);
    if (!this.product) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Check the marked fields.');
      return;
    }
    const result = await this.previewing.run(this.product.id);
    if (result.status === 'done') this.preview.set(result.value);
    else this.formError.set(showProblems(this.form, result.error) ?? 'Check the marked fields.');
  }

  protected async save(): Promise<void> {
    const saved = await submitForm(this.form, this.saving, this.formError);
    if (saved) this.ref.close(saved.value);
  }

  private body(): ProductInput {
    const value = this.form.getRawValue();
    return {
      ...value,
      name: value.name.trim(),
      contactMinutes: numberOrNull(value.contactMinutes) ?? 0,
      staysWetMinutes: numberOrNull(value.staysWetMinutes),
    };
  }
}
