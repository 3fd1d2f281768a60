import type { ChecklistStep } from '@shared/api/board';

/** A surface a step needs dry that is still wet from its own tick. */
export interface WetSurface {
  key: string;
  label: string;
  wetUntil: string;
}

/**
 * The surfaces `step` needs dry that are still wet at `nowMs`: ticking it now is early and the
 * server asks for a reason. A needed step not yet done is not listed here (see {@link notYetDone}).
 *
 * @example
 * wetSurfaces(linen, steps, Date.parse('2027-03-15T10:40:00-05:00')); // [{ key: 'table', label: 'Table top and rails', wetUntil: '…10:42…' }]
 */
export function wetSurfaces(step: ChecklistStep, steps: readonly ChecklistStep[], nowMs: number): WetSurface[] {
  return step.needsDry.flatMap((key) => {
    const needed = steps.find((candidate) => candidate.key === key);
    if (!needed?.done || !needed.wetUntil || Date.parse(needed.wetUntil) <= nowMs) return [];
    return [{ key, label: needed.label, wetUntil: needed.wetUntil }];
  });
}

/**
 * Labels of the steps `step` needs dry that nobody has ticked yet: a hint, since work is often
 * ticked off in a batch after it was done.
 *
 * @example
 * notYetDone(linen, steps); // ['Table top and rails']
 */
export function notYetDone(step: ChecklistStep, steps: readonly ChecklistStep[]): string[] {
  return step.needsDry.flatMap((key) => {
    const needed = steps.find((candidate) => candidate.key === key);
    return needed && !needed.done ? [needed.label] : [];
  });
}
