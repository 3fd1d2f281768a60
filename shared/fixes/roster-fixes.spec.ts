import { computeDayPlan } from '../turnover/day-plan';
import type { DayPlanExam, DayPlanInput } from '../turnover/day-plan-input';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { withChanges } from './apply-changes';
import { suggestGapFixes } from './suggest';

const exam = (id: number, roomId: number, start: string, durationMinutes: number): DayPlanExam => ({
  id, accession: `R-${id}`, roomId, start: `2027-05-03T${start}:00-05:00`, durationMinutes, procedure: 'MR knee without contrast',
  coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1,
});

// Invented example: one aide for MR 1 and MR 2, 3 minutes' walk (common practice, no source). MR 2's
// patient leaves at 09:52, MR 1's at 10:00; R-2 at 10:29 is short by 6 min for want of the aide.
const input: DayPlanInput = {
  date: '2027-05-03', timezone: 'America/Chicago', ...DEMO_SETUP,
  rooms: [{ id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6 }, { id: 2, name: 'MR 2', modality: 'MR', staff: 1, airChangesPerHour: 6 }],
  exams: [exam(1, 1, '09:00', 60), exam(2, 1, '10:29', 30), exam(3, 2, '09:00', 52), exam(4, 2, '10:20', 30)],
  roster: { source: 'day', walkingMinutes: 3, people: [{ id: 'r1-1', name: null, label: 'Aide 1', role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }] },
};

describe('suggestGapFixes on a day with a roster', () => {
  it('offers fixes for a gap short for want of people, weighed with the roster as the plan is', () => {
    expect(computeDayPlan(input).rooms[0]!.gaps[1]).toMatchObject({ verdict: 'short', shortByMinutes: 6 });
    // Without the roster the gap fits, and would get no fixes at all.
    expect(suggestGapFixes({ ...input, roster: undefined }, 2)).toEqual([]);
    const fixes = suggestGapFixes(input, 2)!;
    expect(fixes.length).toBeGreaterThan(0);
    for (const fix of fixes) {
      // Each fix's day after is the plan's own summary with the fix applied.
      expect(fix.effect.summaryAfter).toEqual(computeDayPlan(withChanges(input, fix.changes)).summary);
    }
    const push = fixes.find((fix) => fix.kind === 'push-later')!;
    expect(computeDayPlan(withChanges(input, push.changes)).rooms[0]!.gaps[1]!.verdict).toBe('fits');
  });
});
