import type { HttpTestingController } from '@angular/common/http/testing';

import type { Checklist, ChecklistStep } from '@shared/api/board';

// An invented turnover at an invented site (UTC−5), cut down to three steps.
export const at = (hhmm: string, ss = '00') => `2027-03-15T${hhmm}:${ss}-05:00`;

export function exampleStep(key: string, label: string, overrides: Partial<ChecklistStep> = {}): ChecklistStep {
  return {
    key,
    label,
    handsOnMinutes: 2,
    waitMinutes: 0,
    contactMinutes: 0,
    needsDry: [],
    productKey: null,
    planned: { start: at('10:30'), end: at('10:32'), dryAt: at('10:32'), person: 1 },
    done: null,
    wetUntil: null,
    ...overrides,
  };
}

export const clear = exampleStep('clear', 'Patient out; coil, pads and linen off', { handsOnMinutes: 3 });
export const table = exampleStep('table', 'Table top and rails', {
  waitMinutes: 4,
  contactMinutes: 2,
  productKey: 'standard',
  planned: { start: at('10:33'), end: at('10:35'), dryAt: at('10:39'), person: 1 },
});
export const linen = exampleStep('linen', 'Fresh sheet and pillow', {
  handsOnMinutes: 1,
  needsDry: ['table'],
  planned: { start: at('10:39'), end: at('10:40'), dryAt: at('10:40'), person: 1 },
});

/** Done at `hhmm` by Robin, wet (for steps with a wait) until `wetUntil`. */
export function ticked(step: ChecklistStep, hhmm: string, wetUntil: string | null = null): ChecklistStep {
  return { ...step, done: { at: at(hhmm), by: 'Robin Example', productKey: step.productKey, earlyReason: null }, wetUntil };
}

export function exampleChecklist(overrides: Partial<Checklist> = {}): Checklist {
  return {
    roomId: 1,
    roomName: 'MR 1',
    modality: 'MR',
    date: '2027-03-15',
    now: at('10:30'),
    turnoverId: 9,
    leaving: { examId: 41, accession: 'ACC-2041', procedure: 'MR lumbar spine without contrast', start: at('09:50'), end: at('10:30'), precaution: 'none', arrivedAt: null },
    arriving: { examId: 42, accession: 'ACC-2042', procedure: 'MR knee without contrast', start: at('10:50'), end: at('11:20'), precaution: 'none', arrivedAt: null },
    examEndedAt: at('10:30'),
    cleanType: 'routine',
    precaution: 'none',
    staff: 1,
    airHoldMinutes: 0,
    airHoldUntil: null,
    airHoldPlannedUntil: null,
    airHoldPastNextStartMinutes: 0,
    steps: [clear, table, linen],
    readyAt: at('10:40'),
    completedAt: null,
    products: [
      { key: 'standard', name: 'Standard surface wipe', contactMinutes: 2 },
      { key: 'sporicidal', name: 'Sporicidal wipe', contactMinutes: 4 },
    ],
    tasks: [],
    ...overrides,
  };
}

/** Answers an MR room's kit request (the kit panel's own spec checks it) with an empty kit. */
export function flushKits(backend: HttpTestingController): void {
  for (const kit of backend.match((r) => /^\/api\/rooms\/\d+\/kit$/.test(r.url))) kit.flush({ kit: [], mrZones: null });
}
