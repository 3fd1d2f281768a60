import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { type AbstractControl, FormArray, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { EXAM_LIST_LIMITS } from '@shared/exam-list/columns';
import { HL7_FIELD_VALUES, HL7_MAPPED_FIELDS, HL7_MAPPING_LIMITS, type Hl7FieldMapping, type Hl7MappedField, type Hl7Mapping, type Hl7Source } from '@shared/api/hl7-mapping';
import { action } from '../../core/state/action';
import { fieldMessage, submitForm } from './form-problems';
import { Hl7MappingApi } from './hl7-mapping-api';

type TranslationGroup = FormGroup<{ sent: FormControl<string>; value: FormControl<string> }>;
type FieldGroup = FormGroup<{ source: FormControl<Hl7Source>; code: FormControl<string>; values: FormArray<TranslationGroup> }>;
type ProcedureGroup = FormGroup<{ code: FormControl<string>; coil: FormControl<string>; contrast: FormControl<ContrastChoice> }>;
/** mat-select shows a null value as nothing chosen, so "not said" is a value of its own here. */
type ContrastChoice = 'with' | 'without' | 'not-said';
const CONTRAST_CHOICE = new Map<boolean | null, ContrastChoice>([[true, 'with'], [false, 'without'], [null, 'not-said']]);

/** Each mapped field in people's words, with what a booking gets when the feed reads nothing for it. */
const FIELDS: { key: Hl7MappedField; label: string; otherwise: string }[] = [
  { key: 'precaution', label: 'Precaution', otherwise: 'none' },
  { key: 'mobility', label: 'Mobility', otherwise: 'ambulatory' },
  { key: 'coil', label: 'Coil', otherwise: 'no coil' },
  { key: 'contrast', label: 'Contrast', otherwise: 'no contrast' },
];

/**
 * Setup → Site → Booking system feed (HL7): where the feed's SIU messages say an exam's
 * precaution, mobility, coil and contrast (an OBX code or an NTE prefix, with translations of
 * what the booking system sends), and the procedure-code table. Nothing is read unless named.
 */
@Component({
  selector: 'tw-hl7-mapping-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './hl7-mapping-form.html',
  styleUrl: './hl7-mapping-form.scss',
})
export class Hl7MappingForm {
  private readonly api = inject(Hl7MappingApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly fields = FIELDS;
  protected readonly ours = HL7_FIELD_VALUES;
  protected readonly limits = { ...HL7_MAPPING_LIMITS, coil: EXAM_LIST_LIMITS.coilMaxChars };
  protected readonly formError = signal<string | null>(null);
  protected readonly saved = signal(false);
  protected readonly loading = signal(true);
  protected readonly form = this.fb.group({
    precaution: this.field(),
    mobility: this.field(),
    coil: this.field(),
    contrast: this.field(),
    procedures: this.fb.array<ProcedureGroup>([]),
  });
  protected readonly saving = action(() => this.api.save(this.value()));

  constructor() {
    this.api.mapping().subscribe({
      next: (mapping) => {
        this.show(mapping);
        this.loading.set(false);
      },
      error: (error: { message: string }) => this.formError.set(error.message),
    });
  }

  protected group(field: Hl7MappedField): FieldGroup {
    return this.form.controls[field];
  }

  protected message(control: FormControl<unknown>): string {
    return fieldMessage(control);
  }

  protected addTranslation(field: Hl7MappedField): void {
    this.group(field).controls.values.push(this.translation({ sent: '', value: '' }));
  }

  protected removeTranslation(field: Hl7MappedField, index: number): void {
    this.group(field).controls.values.removeAt(index);
  }

  protected addProcedure(): void {
    this.form.controls.procedures.push(this.procedure({ code: '', coil: null, contrast: null }));
  }

  protected removeProcedure(index: number): void {
    this.form.controls.procedures.removeAt(index);
  }

  protected async save(): Promise<void> {
    this.saved.set(false);
    // a problem across fields (a row with neither coil nor contrast) may be fixed in another field: the server checks again
    forEachControl(this.form, (c) => c.updateValueAndValidity({ emitEvent: false }));
    const done = await submitForm(this.form, this.saving, this.formError);
    if (done) {
      this.show(done.value);
      this.saved.set(true);
    }
  }

  private value(): Hl7Mapping {
    const raw = this.form.getRawValue();
    const field = (f: Hl7MappedField): Hl7FieldMapping => ({ ...raw[f], code: raw[f].source === 'none' ? '' : raw[f].code });
    return {
      precaution: field('precaution'),
      mobility: field('mobility'),
      coil: field('coil'),
      contrast: field('contrast'),
      procedures: raw.procedures.map((p) => ({ code: p.code, coil: p.coil.trim() === '' ? null : p.coil, contrast: p.contrast === 'not-said' ? null : p.contrast === 'with' })),
    };
  }

  /** Rebuilds the rows from a mapping (as loaded, or as the server stored it). */
  private show(mapping: Hl7Mapping): void {
    for (const f of HL7_MAPPED_FIELDS) {
      const group = this.group(f);
      group.controls.values.clear();
      for (const v of mapping[f].values) group.controls.values.push(this.translation(v));
      group.patchValue({ source: mapping[f].source, code: mapping[f].code });
    }
    this.form.controls.procedures.clear();
    for (const p of mapping.procedures) this.form.controls.procedures.push(this.procedure(p));
    this.form.markAsPristine();
  }

  private field(): FieldGroup {
    return this.fb.group({
      source: this.fb.control<Hl7Source>('none'),
      code: ['', Validators.maxLength(HL7_MAPPING_LIMITS.codeMaxChars)],
      values: this.fb.array<TranslationGroup>([]),
    });
  }

  private translation(v: { sent: string; value: string }): TranslationGroup {
    return this.fb.group({ sent: [v.sent, [Validators.required, Validators.maxLength(HL7_MAPPING_LIMITS.codeMaxChars)]], value: [v.value, Validators.required] });
  }

  private procedure(p: { code: string; coil: string | null; contrast: boolean | null }): ProcedureGroup {
    return this.fb.group({
      code: [p.code, [Validators.required, Validators.maxLength(HL7_MAPPING_LIMITS.codeMaxChars)]],
      coil: [p.coil ?? '', Validators.maxLength(EXAM_LIST_LIMITS.coilMaxChars)],
      contrast: this.fb.control<ContrastChoice>(CONTRAST_CHOICE.get(p.contrast)!),
    });
  }
}

function forEachControl(control: AbstractControl, visit: (leaf: AbstractControl) => void): void {
  if (control instanceof FormGroup || control instanceof FormArray) Object.values(control.controls).forEach((c: AbstractControl) => forEachControl(c, visit));
  else visit(control);
}
