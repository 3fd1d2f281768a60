import type { DayPlan, PlanExam, PlanGap, PlanRoom, PlanStep, Verdict } from '@shared/api/plan';

// Invented test data (no real exams, rooms or people). Times carry a -05:00 site offset.

/** An exam at `HH:MM` site time on 2027-03-15. */
export function exampleExam(id: number, start: string, end: string, extra: Partial<PlanExam> = {}): PlanExam {
  return {
    id,
    accession: `ACC-${id}`,
    roomId: 1,
    start: `2027-03-15T${start}:00-05:00`,
    end: `2027-03-15T${end}:00-05:00`,
    durationMinutes: 30,
    procedure: 'MR knee without contrast',
    coil: 'knee',
    precaution: 'none',
    mobility: 'ambulatory',
    contrast: false,
    notes: null,
    version: 1,
    outsideHours: false,
    ...extra,
  };
}

export function exampleStep(key: string, label: string, start: string, end: string, dryAt = end, person = 0): PlanStep {
  const at = (hhmm: string) => `2027-03-15T${hhmm}:00-05:00`;
  return { key, label, start: at(start), end: at(end), dryAt: at(dryAt), person };
}

export function exampleGap(
  fromExamId: number | null,
  toExamId: number,
  verdict: Verdict,
  extra: Partial<PlanGap> = {},
): PlanGap {
  return {
    fromExamId,
    toExamId,
    availableMinutes: 30,
    requiredMinutes: 20,
    verdict,
    shortByMinutes: 0,
    readyAt: '2027-03-15T08:50:00-05:00',
    airHoldMinutes: 0,
    staff: 1,
    steps: [exampleStep('clear', 'Patient out; coil, pads and linen off', '08:30', '08:33')],
    ...extra,
  };
}

export function exampleRoom(exams: PlanExam[], gaps: PlanGap[], extra: Partial<PlanRoom> = {}): PlanRoom {
  return {
    id: 1,
    name: 'MR 1',
    modality: 'MR',
    staff: 1,
    protocol: { id: 1, modality: 'MR', version: 1, effectiveFrom: '2027-01-01' },
    message: null,
    closed: false,
    opensAt: '2027-03-15T07:00:00-05:00',
    closesAt: '2027-03-15T19:00:00-05:00',
    exams,
    gaps,
    ...extra,
  };
}

export function examplePlan(rooms: PlanRoom[]): DayPlan {
  const summary = { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
  for (const gap of rooms.flatMap((room) => room.gaps)) {
    summary[gap.verdict] += 1;
    summary.minutesShort += gap.shortByMinutes;
  }
  return { date: '2027-03-15', timezone: 'America/Chicago', rooms, summary };
}
