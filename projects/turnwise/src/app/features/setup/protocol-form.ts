import { AbstractControl, FormArray, FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import type { ZodType } from 'zod';

import {
  MOBILITY_LEVELS,
  PRECAUTION_LEVELS,
  protocolStepSchema,
  stepNeedSchema,
  type OnlyWhen,
  type PrecautionExtras,
  type PrecautionLevel,
  type ProtocolBody,
  type ProtocolBodyInput,
  type ProtocolStepFields,
} from '@shared/api/protocols';
import { numberOrNull, schemaValidator } from './form-problems';

/** A yes/no condition as a select: any (not a condition), yes, no. */
export type Condition = 'any' | 'yes' | 'no';
export type Need = { key: string; dry: boolean };
export type AdjustMode = 'add' | 'set';

const stepField = protocolStepSchema.shape;
const minutes = (schema: ZodType) => schemaValidator(schema, numberOrNull);

/**
 * The protocol editor's form: the body of `protocolBodySchema`, one control per field it holds,
 * so a zod issue's or a 422 problem's path (`steps.2.handsOnMinutes`) names its control. Two
 * shapes differ from the API's and are converted by {@link toBody}: a yes/no condition is
 * any / yes / no, an adjustment is a step, a mode (add or set) and minutes.
 */
export function stepGroup(fb: NonNullableFormBuilder, step?: ProtocolStepFields) {
  const when: OnlyWhen = step?.onlyWhen ?? {};
  return fb.group({
    key: [step?.key ?? '', schemaValidator(stepField.key)],
    label: [step?.label ?? '', schemaValidator(stepField.label)],
    handsOnMinutes: [step?.handsOnMinutes ?? (1 as number | null), minutes(stepField.handsOnMinutes)],
    dryMinutes: [step?.dryMinutes ?? (0 as number | null), minutes(stepField.dryMinutes)],
    disinfects: [step?.disinfects ?? false],
    productId: [step?.productId ?? (null as number | null)],
    needs: new FormControl<Need[]>(step?.needs.map((n) => ({ key: n.key, dry: n.dry })) ?? [], { nonNullable: true }),
    onlyWhen: fb.group({
      contrast: [toCondition(when.contrast)],
      coilChange: [toCondition(when.coilChange)],
      mobility: [[...(when.mobility ?? [])] as string[]],
      precaution: [[...(when.precaution ?? [])] as string[]],
    }),
    afterAllOthers: [step?.afterAllOthers ?? false],
  });
}
export type StepGroup = ReturnType<typeof stepGroup>;

export function adjustmentGroup(fb: NonNullableFormBuilder, adjustment?: { step: string; addMinutes?: number; setMinutes?: number }) {
  const mode: AdjustMode = adjustment?.setMinutes !== undefined ? 'set' : 'add';
  return fb.group({
    step: [adjustment?.step ?? '', schemaValidator(stepNeedSchema.shape.key)],
    mode: [mode],
    minutes: [adjustment?.setMinutes ?? adjustment?.addMinutes ?? (1 as number | null), minutes(stepField.handsOnMinutes)],
  });
}
export type AdjustmentGroup = ReturnType<typeof adjustmentGroup>;

function adjustments(fb: NonNullableFormBuilder, list: readonly { step: string; addMinutes?: number; setMinutes?: number }[]) {
  return fb.array(list.map((a) => adjustmentGroup(fb, a)));
}

function extrasGroup(fb: NonNullableFormBuilder, extras: PrecautionExtras) {
  return fb.group({
    hasDon: [extras.don !== null],
    don: fb.group({
      label: [extras.don?.label ?? 'Protective equipment on', schemaValidator(stepField.label)],
      handsOnMinutes: [extras.don?.handsOnMinutes ?? (1 as number | null), minutes(stepField.handsOnMinutes)],
    }),
    adjust: adjustments(fb, extras.adjust),
    productId: [extras.productId],
    airHold: [extras.airHold],
  });
}
export type ExtrasGroup = ReturnType<typeof extrasGroup>;

export function protocolForm(fb: NonNullableFormBuilder, body: ProtocolBody) {
  const extras = {} as Record<PrecautionLevel, ExtrasGroup>;
  for (const level of PRECAUTION_LEVELS) extras[level] = extrasGroup(fb, body.precautions[level]);
  return fb.group({
    steps: fb.array(body.steps.map((s) => stepGroup(fb, s))),
    openingSteps: fb.array(body.openingSteps.map((s) => stepGroup(fb, s))),
    defaultProductId: [body.defaultProductId],
    precautions: fb.group(extras),
    mobility: fb.group({
      ambulatory: adjustments(fb, body.mobility.ambulatory),
      wheelchair: adjustments(fb, body.mobility.wheelchair),
      stretcher: adjustments(fb, body.mobility.stretcher),
    }),
    coilChange: adjustments(fb, body.coilChange),
  });
}
export type ProtocolForm = ReturnType<typeof protocolForm>;

/** The API's body from the form (not yet checked: the schema does that). */
export function toBody(form: ProtocolForm): ProtocolBodyInput {
  const value = form.getRawValue();
  const precautions = {} as Record<PrecautionLevel, unknown>;
  for (const level of PRECAUTION_LEVELS) {
    const extras = value.precautions[level];
    precautions[level] = {
      don: extras.hasDon ? { label: extras.don.label.trim(), handsOnMinutes: numberOrNull(extras.don.handsOnMinutes) } : null,
      adjust: extras.adjust.map(toAdjustment),
      productId: extras.productId,
      airHold: extras.airHold,
    };
  }
  return {
    steps: value.steps.map(toStep),
    openingSteps: value.openingSteps.map(toStep),
    defaultProductId: value.defaultProductId,
    precautions: precautions as ProtocolBodyInput['precautions'],
    mobility: {
      ambulatory: value.mobility.ambulatory.map(toAdjustment),
      wheelchair: value.mobility.wheelchair.map(toAdjustment),
      stretcher: value.mobility.stretcher.map(toAdjustment),
    },
    coilChange: value.coilChange.map(toAdjustment),
  } as ProtocolBodyInput;
}

function toStep(step: StepGroup['value']) {
  const when = step.onlyWhen!;
  const onlyWhen: Record<string, unknown> = {};
  if (when.contrast !== 'any') onlyWhen['contrast'] = when.contrast === 'yes';
  if (when.coilChange !== 'any') onlyWhen['coilChange'] = when.coilChange === 'yes';
  if (when.mobility!.length > 0) onlyWhen['mobility'] = when.mobility;
  if (when.precaution!.length > 0) onlyWhen['precaution'] = when.precaution;
  return {
    key: step.key!.trim(),
    label: step.label!.trim(),
    handsOnMinutes: numberOrNull(step.handsOnMinutes),
    dryMinutes: numberOrNull(step.dryMinutes) ?? 0,
    disinfects: step.disinfects,
    productId: step.disinfects ? step.productId : null,
    needs: step.needs,
    onlyWhen,
    afterAllOthers: step.afterAllOthers,
  };
}

function toAdjustment(adjustment: AdjustmentGroup['value']) {
  const value = numberOrNull(adjustment.minutes) ?? undefined;
  return adjustment.mode === 'set' ? { step: adjustment.step!, setMinutes: value } : { step: adjustment.step!, addMinutes: value };
}

function toCondition(value: boolean | undefined): Condition {
  return value === undefined ? 'any' : value ? 'yes' : 'no';
}

/**
 * The control a problem's path names, or its nearest ancestor: `body.steps.2.needs.0.key` lands
 * on the step's needs, `body.mobility.wheelchair.1.addMinutes` on that adjustment's minutes, a
 * cycle on `body.steps` on the step list itself.
 */
export function controlAt(form: AbstractControl, path: string): AbstractControl {
  const parts = path.split('.').filter((p) => p !== '');
  if (parts[parts.length - 1] === 'addMinutes' || parts[parts.length - 1] === 'setMinutes') parts[parts.length - 1] = 'minutes';
  for (let length = parts.length; length > 0; length--) {
    const found = form.get(parts.slice(0, length).join('.'));
    if (found) return found;
  }
  return form;
}

/** Puts each problem on its control (as `schema` for the client's own checks, `server` for the API's). */
export function placeProblems(form: AbstractControl, problems: readonly { field: string; message: string }[], kind: 'schema' | 'server'): void {
  for (const problem of problems) {
    const control = controlAt(form, problem.field);
    const previous: string | undefined = control.errors?.[kind];
    // the field's own validator may already say it in the same words
    if (previous?.split('; ').includes(problem.message)) continue;
    control.setErrors({ ...control.errors, [kind]: previous ? `${previous}; ${problem.message}` : problem.message });
    control.markAsTouched();
  }
}

/** Every control under `control`, depth first (to clear or mark them all). */
export function everyControl(control: AbstractControl): AbstractControl[] {
  const children = control instanceof FormGroup || control instanceof FormArray ? Object.values(control.controls) : [];
  return [control, ...children.flatMap((child) => everyControl(child as AbstractControl))];
}

export const MOBILITY_OPTIONS = MOBILITY_LEVELS;
export const PRECAUTION_OPTIONS = ['none', ...PRECAUTION_LEVELS] as const;
