import { z } from 'zod';
import { ValidationError } from './errors';

/** Parses request input with a schema; a failure becomes a 422 listing every problem. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown, what = 'request'): z.infer<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const problems = result.error.issues.map((issue) => ({
    field: issue.path.join('.') || what,
    message: issue.message,
  }));
  const summary = problems.map((p) => `${p.field}: ${p.message}`).join('; ');
  throw new ValidationError(`Invalid ${what}: ${summary}`, { problems });
}
