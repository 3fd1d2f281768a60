import type { TurnoverExam, TurnoverRoom } from '../model';

/** An invented exam with nothing special (ambulatory, no precaution, head coil, no contrast). */
export function exam(overrides: Partial<TurnoverExam> = {}): TurnoverExam {
  return { coil: 'head', precaution: 'none', mobility: 'ambulatory', contrast: false, ...overrides };
}

/** An invented MR room: one person, 6 air changes per hour. */
export const MR_ROOM: TurnoverRoom = { staff: 1, airChangesPerHour: 6, modality: 'MR' };
