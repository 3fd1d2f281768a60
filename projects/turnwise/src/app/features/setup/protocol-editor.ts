import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { startWith } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import {
  FALLBACK_MODALITY,
  modalitySchema,
  newProtocolVersionSchema,
  protocolBodySchema,
  type EffectPreview as Preview,
  type ModalityProtocols,
  type ProductView,
  type ProtocolBody,
  type ProtocolVersionAnswer,
} from '@shared/api/protocols';
import { MODALITIES } from '@shared/api/rooms';
import { action } from '../../core/state/action';
import { CautionNote } from '../../shared/ui/caution-note';
import { EffectPreview } from './effect-preview';
import { fieldMessage, schemaValidator } from './form-problems';
import { PrecautionExtras } from './precaution-extras';
import { everyControl, placeProblems, protocolForm, toBody } from './protocol-form';
import { ProtocolSteps } from './protocol-steps';
import { ProtocolsApi } from './protocols-api';
import { StepAdjustments } from './step-adjustments';

export interface ProtocolEditorData {
  /** The modality edited; null: a new one, chosen in the dialog. */
  modality: string | null;
  /** The version to start from (the current one, or null for a new modality). */
  base: ProtocolBody | null;
  /** Today at the site: the earliest "effective from". */
  today: string;
  products: readonly ProductView[];
  /** Every modality's protocols: a new one may start from a copy of another's current version. */
  protocols: readonly ModalityProtocols[];
}

const START: ProtocolBody = protocolBodySchema.parse({ steps: [{ key: 'step-1', label: 'First step', handsOnMinutes: 1 }] });

/** `YYYY-MM-DD`, today or later: a past day keeps the version it used. */
function fromToday(today: string): ValidatorFn {
  const format = schemaValidator(newProtocolVersionSchema.shape.effectiveFrom);
  return (control) => format(control) ?? (String(control.value) < today ? { schema: `choose ${today} or later: a past day keeps the version it used` } : null);
}

/**
 * A new version of a modality's protocol: the steps, opening steps, precaution extras and
 * adjustments of `protocolBodySchema`, effective from a chosen day. The schema checks the draft
 * before it is sent (its words under the fields); the API's 422 problems (cycles, unknown
 * steps, a disinfecting step without a product) land on the fields they name. The draft's
 * effect can be previewed before it is saved.
 */
@Component({
  selector: 'tw-protocol-editor',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    CautionNote,
    EffectPreview,
    PrecautionExtras,
    ProtocolSteps,
    StepAdjustments,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './protocol-editor.html',
  styleUrl: './protocol-editor.scss',
})
export class ProtocolEditor {
  private readonly api = inject(ProtocolsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly ref = inject(MatDialogRef<ProtocolEditor, ProtocolVersionAnswer>);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  protected readonly data = inject<ProtocolEditorData>(MAT_DIALOG_DATA);
  protected readonly fallback = FALLBACK_MODALITY;
  protected readonly formError = signal<string | null>(null);
  protected readonly preview = signal<Preview | null>(null);
  protected readonly products = this.data.products;

  protected readonly form = this.fb.group({
    modality: [this.data.modality ?? '', schemaValidator(modalitySchema)],
    effectiveFrom: [this.data.today, fromToday(this.data.today)],
    note: ['', schemaValidator(newProtocolVersionSchema.shape.note)],
    body: protocolForm(this.fb, this.data.base ?? START),
  });

  /** Modalities a new protocol may be for: those without one yet. */
  protected readonly newModalities = [...MODALITIES, FALLBACK_MODALITY].filter((m) => !this.data.protocols.some((p) => p.modality === m));
  /** Current versions a new protocol may start from. */
  protected readonly copySources = this.data.protocols.filter((p) => p.current !== null);

  private readonly bodyValue = toSignal(this.form.valueChanges.pipe(startWith(null)));
  /** The turnover's steps, for the adjustments' step choices. */
  protected readonly stepChoices = computed(() => {
    this.bodyValue();
    return this.form.controls.body.controls.steps.controls
      .map((s) => ({ key: s.controls.key.value.trim(), label: s.controls.label.value.trim() || s.controls.key.value }))
      .filter((s) => s.key !== '');
  });

  protected readonly saving = action(() => this.api.saveProtocol({ ...this.form.getRawValue(), body: toBody(this.form.controls.body) }));
  protected readonly previewing = action(() => this.api.previewProtocol({ modality: this.form.controls.modality.value, body: toBody(this.form.controls.body) }));

  protected message(control: AbstractControl): string {
    return fieldMessage(control);
  }

  protected copyFrom(modality: string): void {
    const source = this.copySources.find((p) => p.modality === modality)?.current;
    if (!source) return;
    this.form.setControl('body', protocolForm(this.fb, source.body));
    this.preview.set(null);
  }

  protected async runPreview(): Promise<void> {
    if (!this.checked()) return;
    const result = await this.previewing.run();
    if (result.status === 'failed') return this.refused(result.error);
    this.preview.set(result.value);
    placeProblems(this.form, result.value.problems, 'server');
    if (result.value.problems.length > 0) this.showFirstProblem();
  }

  protected async save(): Promise<void> {
    if (!this.checked()) return;
    const result = await this.saving.run();
    if (result.status === 'done') this.ref.close(result.value);
    else this.refused(result.error);
  }

  /** Runs the fields' checks and then the API's schema on the whole draft; false (fields marked) when it would be refused. */
  private checked(): boolean {
    this.formError.set(null);
    // drop the last round's problems: the fields' own validators run again
    for (const control of everyControl(this.form).reverse()) control.updateValueAndValidity({ onlySelf: true, emitEvent: false });
    const parsed = newProtocolVersionSchema.safeParse({ ...this.form.getRawValue(), body: toBody(this.form.controls.body) });
    if (!parsed.success) placeProblems(this.form, parsed.error.issues.map((i) => ({ field: i.path.join('.'), message: i.message })), 'schema');
    if (this.form.valid && parsed.success) return true;
    this.form.markAllAsTouched();
    this.formError.set('Check the marked fields.');
    this.showFirstProblem();
    return false;
  }

  private refused(error: ApiError): void {
    const problems = (error.details as { problems?: { field: string; message: string }[] } | undefined)?.problems ?? [];
    if (error.code === 'validation_failed' && problems.length > 0) {
      placeProblems(this.form, problems, 'server');
      this.formError.set(`The server refused this version: ${problems.map((p) => p.message).join('; ')}`);
      this.showFirstProblem();
    } else {
      this.formError.set(error.message);
    }
  }

  /** Scrolls to the first field or list that says what is wrong, and puts the keyboard there. */
  private showFirstProblem(): void {
    afterNextRender(
      () => {
        const first = this.host.nativeElement.querySelector<HTMLElement>('.mat-form-field-invalid, tw-protocol-steps .form-error');
        first?.scrollIntoView({ block: 'center' });
        first?.querySelector<HTMLElement>('input, textarea, [role="combobox"]')?.focus();
      },
      { injector: this.injector },
    );
  }
}
