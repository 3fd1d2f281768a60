import { computeDayPlan, computeDaySummary } from './day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanRoom } from './day-plan-input';
import { DEMO_SETUP } from './demo-protocols';

// The expected minutes come from the engine's own MR protocol (20 min between two plain exams,
// as day-plan.spec.ts shows): the project's model, not a published value.
const MR1: DayPlanRoom = { id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6 };
const CT1: DayPlanRoom = { id: 2, name: 'CT 1', modality: 'CT', staff: 2, airChangesPerHour: 12 };
let nextId = 500;
/** An invented exam slot with nothing special unless overridden. */
function slot(start: string, overrides: Partial<DayPlanExam> = {}): DayPlanExam {
  const id = nextId++;
  return {
    id, accession: `SUM${id}`, roomId: 1, start, durationMinutes: 30, procedure: 'MR knee without contrast',
    coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1, ...overrides,
  };
}
const day = (exams: DayPlanExam[], extra: Partial<DayPlanInput> = {}): DayPlanInput => ({
  date: '2027-05-03', timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [MR1, CT1], exams, ...extra,
});

describe('computeDaySummary', () => {
  it('returns the counts and minutes short of a day with every verdict', () => {
    const exams = [
      slot('2027-05-03T08:00:00-05:00'), // opening gap: fits
      slot('2027-05-03T08:45:00-05:00'), // 15 available, 20 required: short by 5
      slot('2027-05-03T09:10:00-05:00'), // previous ends 09:15: overlap by 5, short by 25
      slot('2027-05-03T10:00:00-05:00'), // 20 available, 20 required: snug
    ];
    expect(computeDaySummary(day(exams))).toEqual({ fits: 1, snug: 1, short: 1, overlap: 1, minutesShort: 30 });
  });

  it('returns exactly the summary of the full plan, across rooms, staff overrides, precautions and a fall-back day', () => {
    const exams = [
      slot('2027-11-07T00:30:00-05:00', { precaution: 'airborne' }),
      slot('2027-11-07T01:10:00-05:00', { durationMinutes: 10, mobility: 'stretcher' }),
      slot('2027-11-07T01:05:00-06:00', { coil: 'head', contrast: true }),
      slot('2027-11-07T08:00', { roomId: 2, precaution: 'contact' }),
      slot('2027-11-07T08:40:00-06:00', { roomId: 2, precaution: 'enteric' }),
      slot('2027-11-07T09:20:00-06:00', { roomId: 2 }),
    ];
    const input = day(exams, { date: '2027-11-07', staffOverrides: { [exams[2].id]: 2 }, snugMarginMinutes: 5 });
    const summary = computeDaySummary(input);
    expect(summary).toEqual(computeDayPlan(input).summary);
    expect(summary.fits + summary.snug + summary.short + summary.overlap).toBe(exams.length);
  });

  it('throws what computeDayPlan throws', () => {
    const cases: DayPlanInput[] = [
      day([], { date: '2027-02-30' }),
      day([], { timezone: 'Mars/Olympus' }),
      day([slot('2027-05-03T08:00:00-05:00', { roomId: 99 })]),
      day([slot('2027-05-03T08:00:00-05:00', { durationMinutes: -5 })]),
      day([slot('soon')]),
      day([slot('2027-05-03T08:00:00-05:00')], { rooms: [{ ...MR1, opensAt: '7am' }] }),
      day([slot('2027-05-03T08:00:00-05:00')], { snugMarginMinutes: -1 }),
    ];
    for (const input of cases) {
      let thrown: Error | undefined;
      try {
        computeDayPlan(input);
      } catch (error) {
        thrown = error as Error;
      }
      expect(thrown).toBeInstanceOf(Error);
      expect(() => computeDaySummary(input)).toThrow(thrown!.constructor as new () => Error);
      expect(() => computeDaySummary(input)).toThrow(thrown!.message);
    }
  });
});
