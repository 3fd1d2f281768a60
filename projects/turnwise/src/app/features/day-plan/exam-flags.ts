import { AFTER_MANUAL_CHANGE } from '@shared/api/hl7';
import type { PlanExam, Precaution } from '@shared/api/plan';

/** What about an exam shapes its turnover, each as an icon and the words for it. */
export interface ExamFlag {
  kind: 'precaution' | 'coil' | 'contrast' | 'booking';
  icon: string;
  text: string;
}

const PRECAUTION_ICONS: Readonly<Record<Exclude<Precaution, 'none'>, string>> = {
  contact: 'back_hand',
  enteric: 'sanitizer',
  droplet: 'masks',
  airborne: 'air',
};

/**
 * The precaution, coil and contrast of an exam, precaution first because it changes the
 * turnover most. Defaults that change nothing (no precaution, no contrast) are left out. Then
 * whether the booking feed moved it after someone's hand change (the day's history says).
 */
export function examFlags(exam: Pick<PlanExam, 'precaution' | 'coil' | 'contrast'>, movedByBooking = false): ExamFlag[] {
  const flags: ExamFlag[] = [];
  if (exam.precaution !== 'none') {
    flags.push({ kind: 'precaution', icon: PRECAUTION_ICONS[exam.precaution], text: `${exam.precaution} precautions` });
  }
  if (exam.coil) flags.push({ kind: 'coil', icon: 'sensors', text: `${exam.coil} coil` });
  if (exam.contrast) flags.push({ kind: 'contrast', icon: 'vaccines', text: 'contrast' });
  // last: it is about the slot's history, not the turnover
  if (movedByBooking) flags.push({ kind: 'booking', icon: 'sync_problem', text: AFTER_MANUAL_CHANGE });
  return flags;
}
