import type { DayFitAnswer } from '@shared/api/day-fit';
import { applyRefusalWords, appliedWords } from './day-fit-store';

describe('applyRefusalWords', () => {
  const refusal = (problems: { field: string; message: string }[]) => ({
    status: 422,
    code: 'validation_failed',
    message: 'This proposal cannot be applied as sent.',
    details: { problems },
  });

  it('names the first two problems, counts the rest and asks for a new proposal', () => {
    const words = applyRefusalWords(
      refusal([
        { field: 'changes.0', message: 'PU-1 may not move (passed)' },
        { field: 'changes.0.to.start', message: 'PU-1 would start at 08:50, which has passed' },
        { field: 'changes.1.to.start', message: 'PU-2 would start at 09:30, which has passed' },
      ]),
    );
    expect(words).toBe('This proposal cannot be applied as sent: PU-1 may not move (passed); PU-1 would start at 08:50, which has passed and 1 more. Make the day fit again.');
  });

  it('keeps any other refusal’s own message', () => {
    expect(applyRefusalWords({ status: 409, code: 'fit_stale', message: 'The day has changed since this proposal was made; nothing was applied. Make the day fit again.' })).toBe(
      'The day has changed since this proposal was made; nothing was applied. Make the day fit again.',
    );
    expect(applyRefusalWords(refusal([]))).toBe('This proposal cannot be applied as sent.');
  });
});

describe('appliedWords', () => {
  // Invented: only what the words read.
  const proposal = (examsMoved: number, calls: number, helpers: number) =>
    ({ objective: { examsMoved }, calls: Array.from({ length: calls }), helpers: Array.from({ length: helpers }) }) as unknown as DayFitAnswer;

  it('says what was applied, whom to call and that Undo takes it all back', () => {
    expect(appliedWords(proposal(2, 2, 0))).toBe('Proposal applied: 2 exams moved. Call the 2 patients under Patients to call. Undo takes all of it back.');
    expect(appliedWords(proposal(1, 1, 1))).toBe('Proposal applied: 1 exam moved, 1 helper added. Call the patient under Patients to call. Undo takes all of it back.');
    expect(appliedWords(proposal(1, 0, 0))).toBe('Proposal applied: 1 exam moved. Undo takes all of it back.');
  });
});
