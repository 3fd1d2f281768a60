import type { WritableSignal } from '@angular/core';
import type { AbstractControl, FormGroup, ValidatorFn } from '@angular/forms';
import type { ZodType } from 'zod';

import type { ApiError } from '@shared/api/errors';
import type { Action } from '../../core/state/action';

/** One field-level problem of a 422 (`details.problems`). */
interface Problem {
  field: string;
  message: string;
}

/**
 * Puts a 422's problems on the form's own fields (as the `server` error, shown by
 * {@link fieldMessage}); returns what no field can show (another refusal, or a problem about the
 * request as a whole), or null when every problem found its field.
 */
export function showProblems(form: FormGroup, error: ApiError, fieldOf: (field: string) => string = (f) => f): string | null {
  const details = (error as { details?: { problems?: Problem[] } }).details;
  const problems = details?.problems ?? [];
  const unplaced: Problem[] = [];
  for (const problem of problems) {
    const control = form.get(fieldOf(problem.field));
    if (!control) {
      unplaced.push(problem);
      continue;
    }
    control.setErrors({ ...control.errors, server: problem.message });
    control.markAsTouched();
  }
  if (problems.length === 0 || error.code !== 'validation_failed') return error.message;
  return unplaced.length > 0 ? unplaced.map((p) => p.message).join('; ') : null;
}

/** The message under a field: the server's words first, then the client's own checks (same rules). */
export function fieldMessage(control: AbstractControl | null): string {
  const errors = control?.errors;
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return errors['server'];
  if (typeof errors['schema'] === 'string') return errors['schema'];
  if (errors['required']) return 'required';
  if (errors['minlength']) return `use at least ${errors['minlength'].requiredLength} characters`;
  if (errors['maxlength']) return `use at most ${errors['maxlength'].requiredLength} characters`;
  if (errors['min']) return `at least ${errors['min'].min}`;
  if (errors['max']) return `at most ${errors['max'].max}`;
  if (errors['email']) return 'not an e-mail address';
  if (errors['pattern']) return 'not in the expected form';
  return 'check this value';
}

/**
 * A Setup form's save: refuses an invalid form with its fields marked, else runs the save and
 * puts a refusal's problems on the fields (the rest in `formError`). Resolves to `{value}` once
 * saved (the value may itself be empty, e.g. a 204), or null when nothing was saved.
 *
 * @example
 * const saved = await submitForm(this.form, this.saving, this.formError);
 * if (saved) this.ref.close(saved.value);
 */
export async function submitForm<T>(form: FormGroup, saving: Action<[], T>, formError: WritableSignal<string | null>, invalidText = 'Check the marked fields.'): Promise<{ value: T } | null> {
  formError.set(null);
  if (form.invalid) {
    form.markAllAsTouched();
    formError.set(invalidText);
    return null;
  }
  const result = await saving.run();
  if (result.status === 'done') return { value: result.value };
  formError.set(showProblems(form, result.error) ?? invalidText);
  return null;
}

/**
 * A field checked by the API's own zod schema for it, so the form refuses what the server would,
 * in the same words (`{schema: message}`, shown by {@link fieldMessage}).
 *
 * @example
 * contactMinutes: [3, schemaValidator(productInputSchema.shape.contactMinutes)]
 */
export function schemaValidator(schema: ZodType, read: (value: unknown) => unknown = (v) => v): ValidatorFn {
  return (control) => {
    const result = schema.safeParse(read(control.value));
    return result.success ? null : { schema: result.error.issues[0]?.message ?? 'check this value' };
  };
}

/** A number input's value for a schema: '' and null are "not given", anything else a number. */
export function numberOrNull(value: unknown): number | null {
  return value === '' || value === null || value === undefined ? null : Number(value);
}
