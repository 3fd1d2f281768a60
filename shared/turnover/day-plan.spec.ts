import { computeDayPlan } from './day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanRoom } from './day-plan-input';
import { DEMO_SETUP, GENERIC_PROTOCOL, MR_PROTOCOL } from './demo-protocols';

const MR1: DayPlanRoom = { id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6 };
let nextId = 100;
/** An invented exam slot in MR 1 with nothing special. */
function slot(start: string, overrides: Partial<DayPlanExam> = {}): DayPlanExam {
  const id = nextId++;
  return {
    id, accession: `ACC${id}`, roomId: 1, start, durationMinutes: 30, procedure: 'MR lumbar spine without contrast',
    coil: 'spine', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1, ...overrides,
  };
}
const day = (exams: DayPlanExam[], extra: Partial<DayPlanInput> = {}): DayPlanInput => ({
  date: '2027-05-03', timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [MR1], exams, ...extra,
});

describe('computeDayPlan', () => {
  it('returns exams in start order with an opening gap and a gap between each pair', () => {
    const late = slot('2027-05-03T08:00:00-05:00');
    const early = slot('2027-05-03T07:10:00-05:00');
    const plan = computeDayPlan(day([late, early]));
    const room = plan.rooms[0];
    expect(room.exams.map((e) => e.id)).toEqual([early.id, late.id]);
    expect(room.gaps.map((g) => [g.fromExamId, g.toExamId])).toEqual([[null, early.id], [early.id, late.id]]);
    expect(room.gaps[0]).toMatchObject({ availableMinutes: 10, requiredMinutes: 7, verdict: 'fits', readyAt: '2027-05-03T07:07:00-05:00' });
    expect(room.gaps[1]).toMatchObject({ availableMinutes: 20, requiredMinutes: 20, verdict: 'snug', shortByMinutes: 0, staff: 1, airHoldMinutes: 0 });
    expect(plan.summary).toEqual({ fits: 1, snug: 1, short: 0, overlap: 0, minutesShort: 0 });
  });

  it("returns every time as ISO 8601 with the site's offset", () => {
    const exam = slot('2027-05-03T12:10:00Z');
    const room = computeDayPlan(day([exam])).rooms[0];
    expect(room).toMatchObject({ opensAt: '2027-05-03T07:00:00-05:00', closesAt: '2027-05-03T19:00:00-05:00' });
    expect(room.exams[0]).toMatchObject({ start: '2027-05-03T07:10:00-05:00', end: '2027-05-03T07:40:00-05:00', outsideHours: false });
    expect(room.gaps[0].steps[0]).toEqual({
      key: 'workstation', label: 'Workstation wipe-down', start: '2027-05-03T07:00:00-05:00',
      end: '2027-05-03T07:05:00-05:00', dryAt: '2027-05-03T07:07:00-05:00', person: 0,
    });
  });

  it('returns short and overlap gaps with the minutes lost in the summary', () => {
    const a = slot('2027-05-03T08:00:00-05:00');
    const b = slot('2027-05-03T08:45:00-05:00'); // 15 available, 20 required
    const c = slot('2027-05-03T09:10:00-05:00'); // b ends 09:15: overlap by 5
    const plan = computeDayPlan(day([a, b, c]));
    expect(plan.rooms[0].gaps.slice(1).map((g) => [g.verdict, g.availableMinutes, g.shortByMinutes])).toEqual([
      ['short', 15, 5],
      ['overlap', -5, 25],
    ]);
    expect(plan.summary).toEqual({ fits: 1, snug: 0, short: 1, overlap: 1, minutesShort: 30 });
  });

  it('returns the air hold after an airborne patient (70 min in a 6-ACH room) as the required time', () => {
    const a = slot('2027-05-03T08:00:00-05:00', { precaution: 'airborne' });
    const b = slot('2027-05-03T09:40:00-05:00');
    const gap = computeDayPlan(day([a, b])).rooms[0].gaps[1];
    expect(gap).toMatchObject({ requiredMinutes: 70, airHoldMinutes: 70, availableMinutes: 70, verdict: 'snug', readyAt: '2027-05-03T09:40:00-05:00' });
  });

  it('returns the turnover with a helper where staff is overridden for that gap', () => {
    const a = slot('2027-05-03T08:00:00-05:00');
    const b = slot('2027-05-03T08:47:00-05:00'); // 17 available
    expect(computeDayPlan(day([a, b])).rooms[0].gaps[1]).toMatchObject({ staff: 1, requiredMinutes: 20, verdict: 'short' });
    const gap = computeDayPlan(day([a, b], { staffOverrides: { [b.id]: 2 } })).rooms[0].gaps[1];
    expect(gap).toMatchObject({ staff: 2, requiredMinutes: 14, verdict: 'fits' });
    expect(new Set(gap.steps.map((s) => s.person))).toEqual(new Set([0, 1]));
  });

  it("returns the site's protocols, snug margin and products, with the generic protocol as fallback", () => {
    const us: DayPlanRoom = { id: 2, name: 'US 1', modality: 'US', staff: 1, airChangesPerHour: 6 };
    const a = slot('2027-05-03T08:00:00-05:00', { roomId: 2 });
    const b = slot('2027-05-03T08:45:00-05:00', { roomId: 2 });
    const plan = computeDayPlan(day([a, b], { rooms: [us], protocols: { MR: MR_PROTOCOL, '*': GENERIC_PROTOCOL }, snugMarginMinutes: 10 }));
    expect(plan.rooms[0].gaps[1].steps.map((s) => s.key)).toEqual(['clear', 'table', 'touch', 'linen', 'hygiene']);
    expect(plan.rooms[0].gaps[1]).toMatchObject({ requiredMinutes: 10, verdict: 'snug' });
    const quick = computeDayPlan(day([a, b], { rooms: [us], products: [{ key: 'standard', name: 'Quick wipe', contactMinutes: 1 }] }));
    expect(quick.rooms[0].gaps[1].requiredMinutes).toBe(9);
  });

  it('returns a room whose modality has no protocol (nor a `*` fallback) with no gaps, no verdicts and the reason', () => {
    const ct: DayPlanRoom = { id: 2, name: 'CT 1', modality: 'CT', staff: 1, airChangesPerHour: 12 };
    const a = slot('2027-05-03T08:00:00-05:00');
    const b = slot('2027-05-03T08:50:00-05:00');
    const c = slot('2027-05-03T08:00:00-05:00', { roomId: 2 });
    const d = slot('2027-05-03T08:05:00-05:00', { roomId: 2 }); // would overlap, but there is nothing to judge it by
    const plan = computeDayPlan(day([a, b, c, d], { rooms: [MR1, ct], protocols: { MR: MR_PROTOCOL } }));
    expect(plan.rooms[1]).toMatchObject({ protocol: null, message: 'No protocol for CT: set one up in Setup', gaps: [] });
    expect(plan.rooms[1]!.exams).toHaveLength(2);
    expect(plan.rooms[0]).toMatchObject({ protocol: { modality: 'MR', version: null }, message: null });
    expect(plan.summary).toEqual(computeDayPlan(day([a, b])).summary); // only MR 1's two gaps are counted
  });

  it('names the stored protocol version each room was planned with', () => {
    const stored = { ...MR_PROTOCOL, id: 7, version: 3, effectiveFrom: '2027-04-01' };
    const plan = computeDayPlan(day([slot('2027-05-03T08:00:00-05:00')], { protocols: { MR: stored } }));
    expect(plan.rooms[0]!.protocol).toEqual({ id: 7, modality: 'MR', version: 3, effectiveFrom: '2027-04-01' });
  });

  describe('edge cases', () => {
    it('returns a room without exams with no gaps', () => {
      const plan = computeDayPlan(day([]));
      expect(plan.rooms[0]).toMatchObject({ exams: [], gaps: [] });
      expect(plan.summary).toEqual({ fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 });
    });

    it('returns exams outside opening hours flagged, never refused (and an overlap with the opening)', () => {
      const early = slot('2027-05-03T06:30:00-05:00');
      const late = slot('2027-05-03T18:45:00-05:00');
      const room = computeDayPlan(day([late, early])).rooms[0];
      expect(room.exams.map((e) => e.outsideHours)).toEqual([true, true]);
      expect(room.gaps[0]).toMatchObject({ verdict: 'overlap', availableMinutes: -30 });
    });

    it("returns the room's own hours, a closing after midnight on the next day", () => {
      const night = { ...MR1, opensAt: '20:00', closesAt: '02:00' };
      const exam = slot('2027-05-04T01:00:00-05:00');
      const room = computeDayPlan(day([exam], { rooms: [night] })).rooms[0];
      expect(room).toMatchObject({ opensAt: '2027-05-03T20:00:00-05:00', closesAt: '2027-05-04T02:00:00-05:00' });
      expect(room.exams[0].outsideHours).toBe(false);
    });

    it('returns a start without offset read as local time at the site', () => {
      const room = computeDayPlan(day([slot('2027-05-03T07:30')])).rooms[0];
      expect(room.exams[0].start).toBe('2027-05-03T07:30:00-05:00');
    });

    it('returns the same plan when computed again (memoized turnovers are not shared mutable state)', () => {
      const input = day([slot('2027-05-03T08:00:00-05:00', { precaution: 'enteric' }), slot('2027-05-03T08:50:00-05:00')]);
      const first = JSON.stringify(computeDayPlan(input));
      expect(JSON.stringify(computeDayPlan(input))).toBe(first);
    });
  });

  describe('daylight-saving days (America/Chicago)', () => {
    it('returns real minutes on spring-forward day, 14 March 2027 (02:00→03:00)', () => {
      const a = slot('2027-03-14T01:20:00-06:00'); // ends 01:50 CST
      const b = slot('2027-03-14T03:10:00-05:00'); // wall clock says 80 minutes later
      const room = computeDayPlan(day([a, b], { date: '2027-03-14', rooms: [{ ...MR1, opensAt: '00:30' }] })).rooms[0];
      expect(room.exams.map((e) => e.end)).toEqual(['2027-03-14T01:50:00-06:00', '2027-03-14T03:40:00-05:00']);
      expect(room.gaps[1]).toMatchObject({ availableMinutes: 20, verdict: 'snug', readyAt: '2027-03-14T03:10:00-05:00' });
      expect(room.closesAt).toBe('2027-03-14T19:00:00-05:00');
    });

    it('returns real minutes and real order on fall-back day, 7 November 2027 (01:00–02:00 twice)', () => {
      const a = slot('2027-11-07T00:30:00-05:00', { durationMinutes: 20 }); // ends 00:50 CDT
      const second = slot('2027-11-07T01:05:00-06:00'); // the second 01:05, after the repeat
      const first = slot('2027-11-07T01:10:00-05:00', { durationMinutes: 10 }); // the first 01:10
      const room = computeDayPlan(day([second, first, a], { date: '2027-11-07', rooms: [{ ...MR1, opensAt: '00:00' }] })).rooms[0];
      expect(room.exams.map((e) => e.id)).toEqual([a.id, first.id, second.id]);
      // first ends 01:20 CDT; second starts 01:05 CST: −15 on the wall clock, 45 real minutes.
      expect(room.gaps.map((g) => g.availableMinutes)).toEqual([30, 20, 45]);
      expect(room.opensAt).toBe('2027-11-07T00:00:00-05:00');
      expect(room.closesAt).toBe('2027-11-07T19:00:00-06:00');
    });
  });

  describe('invalid input', () => {
    it('throws a RangeError on a bad date or time zone', () => {
      expect(() => computeDayPlan(day([], { date: '2027-02-30' }))).toThrow(RangeError);
      expect(() => computeDayPlan(day([], { date: '3 May' }))).toThrow(RangeError);
      expect(() => computeDayPlan(day([], { timezone: 'Mars/Olympus' }))).toThrow(RangeError);
    });

    it('throws on an exam in an unknown room', () => {
      expect(() => computeDayPlan(day([slot('2027-05-03T08:00:00-05:00', { roomId: 99 })]))).toThrow('unknown room 99');
    });

    it('throws a RangeError on a negative duration, an unparseable start or a staff override of 0', () => {
      expect(() => computeDayPlan(day([slot('2027-05-03T08:00:00-05:00', { durationMinutes: -5 })]))).toThrow(RangeError);
      expect(() => computeDayPlan(day([slot('soon')]))).toThrow(RangeError);
      const b = slot('2027-05-03T08:00:00-05:00');
      expect(() => computeDayPlan(day([b], { staffOverrides: { [b.id]: 0 } }))).toThrow(RangeError);
    });

    it('throws a RangeError on a bad opening time', () => {
      expect(() => computeDayPlan(day([slot('2027-05-03T08:00:00-05:00')], { rooms: [{ ...MR1, opensAt: '7am' }] }))).toThrow(RangeError);
    });
  });
});
