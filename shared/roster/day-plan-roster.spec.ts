import { DateTime } from 'luxon';
import { computeDayPlan, computeDaySummary } from '../turnover/day-plan';
import type { DayPlanExam, DayPlanInput, DayPlanPerson, DayPlanRoom } from '../turnover/day-plan-input';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { planTurnover } from '../turnover/plan-turnover';
import { seededRandom } from '../turnover/testing/seeded-random';
import { gapVerdict } from '../turnover/verdict';
import type { CrewJob, CrewProblem } from './crew-problem';
import { bruteForceCrews } from './testing/brute-force';

const MR1: DayPlanRoom = { id: 1, name: 'MR 1', modality: 'MR', staff: 1, airChangesPerHour: 6 };
const MR2: DayPlanRoom = { id: 2, name: 'MR 2', modality: 'MR', staff: 1, airChangesPerHour: 6 };
const CT1: DayPlanRoom = { id: 3, name: 'CT 1', modality: 'CT', staff: 1, airChangesPerHour: 12 };
const DATE = '2027-05-03';
const ZONE = 'America/Chicago';
let nextId = 500;

/** An invented exam slot with nothing special. */
function slot(roomId: number, hhmm: string, durationMinutes: number, overrides: Partial<DayPlanExam> = {}): DayPlanExam {
  const id = nextId++;
  return {
    id, accession: `ACC${id}`, roomId, start: `${DATE}T${hhmm}:00-05:00`, durationMinutes, procedure: 'MR knee without contrast',
    coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1, ...overrides,
  };
}
const aide = (id: string, label: string, roomIds: number[], extra: Partial<DayPlanPerson> = {}): DayPlanPerson => ({
  id, name: null, label, role: 'aide', start: '07:00', end: '15:00', breaks: [], roomIds, ...extra,
});
const day = (rooms: DayPlanRoom[], exams: DayPlanExam[], extra: Partial<DayPlanInput> = {}): DayPlanInput => ({
  date: DATE, timezone: ZONE, ...DEMO_SETUP, rooms, exams, ...extra,
});

describe('computeDayPlan with a roster', () => {
  describe('invented example: the aide is in MR 2 until 10:12', () => {
    // Invented example. One aide covers MR 1 and MR 2, walking 3 minutes between them (common
    // practice, no source). MR 2's patient leaves at 09:52 and its turnover takes the aide 20
    // minutes; MR 1's leaves at 10:00, its next patient is booked at 10:29.
    const mr1a = slot(1, '09:00', 60);
    const mr1b = slot(1, '10:29', 30);
    const mr2a = slot(2, '09:00', 52);
    const mr2b = slot(2, '10:20', 30);
    const input = day([MR1, MR2], [mr1a, mr1b, mr2a, mr2b], { roster: { source: 'day', walkingMinutes: 3, people: [aide('r1-1', 'Aide 1', [1, 2])] } });

    it('returns MR 1 short by 6 min: the aide works in MR 2 until 10:12, walks over and starts at 10:15', () => {
      const plan = computeDayPlan(input);
      const gap = plan.rooms[0]!.gaps[1]!;
      expect(gap).toMatchObject({
        toExamId: mr1b.id, availableMinutes: 29, requiredMinutes: 35, verdict: 'short', shortByMinutes: 6,
        readyAt: '2027-05-03T10:35:00-05:00', staff: 1, crew: ['r1-1'],
        people: { kind: 'busy', personId: 'r1-1', roomId: 2, until: '2027-05-03T10:12:00-05:00', wanted: 1, got: 1, waitedMinutes: 15 },
      });
      expect(gap.steps[0]!.start).toBe('2027-05-03T10:15:00-05:00');
      expect(plan.rooms[1]!.gaps[1]).toMatchObject({ toExamId: mr2b.id, verdict: 'fits', crew: ['r1-1'], people: null });
    });

    it("returns the aide's day: each turnover's hands-on work, one room at a time", () => {
      const people = computeDayPlan(input).people!;
      expect(people).toMatchObject({ source: 'day', walkingMinutes: 3, uncoveredRoomIds: [], provenOptimal: true });
      expect(people.people[0]!.work.map((w) => [w.roomId, w.start.slice(11, 16), w.end.slice(11, 16)])).toEqual([
        [1, '07:00', '07:07'],
        [2, '07:10', '07:17'],
        [2, '09:52', '10:12'],
        [1, '10:15', '10:35'],
      ]);
    });

    it('counts the gap in the summary alike whether or not the steps are written out', () => {
      expect(computeDaySummary(input)).toEqual(computeDayPlan(input).summary);
      expect(computeDayPlan(input).summary.short).toBe(1);
    });

    it('returns the same gap as without a roster when a second aide covers MR 1', () => {
      const two = { ...input, roster: { source: 'day' as const, walkingMinutes: 3, people: [aide('r1-1', 'Aide 1', [1, 2]), aide('r1-2', 'Aide 2', [1])] } };
      const gap = computeDayPlan(two).rooms[0]!.gaps[1]!;
      const without = computeDayPlan({ ...input, roster: undefined }).rooms[0]!.gaps[1]!;
      expect(gap).toMatchObject({ verdict: without.verdict, requiredMinutes: without.requiredMinutes, readyAt: without.readyAt, crew: ['r1-2'], people: null });
    });
  });

  describe('edge cases', () => {
    const exams = [slot(1, '08:00', 30), slot(1, '08:50', 30), slot(3, '08:00', 15), slot(3, '08:30', 15)];

    it('returns the plan of today, field for field, without a roster', () => {
      const plan = computeDayPlan(day([MR1, CT1], exams));
      expect(plan.people).toBeUndefined();
      expect(plan.rooms.flatMap((r) => r.gaps).every((g) => !('crew' in g) && !('people' in g))).toBe(true);
    });

    it("plans a room nobody on the roster covers with its own staff, and lists it", () => {
      const input = day([MR1, CT1], exams, { roster: { source: 'weekly', walkingMinutes: 3, people: [aide('r1', 'Aide 1', [1])] } });
      const plan = computeDayPlan(input);
      expect(plan.rooms[1]!.gaps).toEqual(computeDayPlan(day([MR1, CT1], exams)).rooms[1]!.gaps);
      expect(plan.people!.uncoveredRoomIds).toEqual([3]);
    });

    it('marks a turnover after everyone has gone home as nobody’s: short by its whole turnover', () => {
      const late = [slot(1, '14:00', 60), slot(1, '15:30', 30)];
      const plan = computeDayPlan(day([MR1], late, { roster: { source: 'day', walkingMinutes: 3, people: [aide('r1', 'Aide 1', [1])] } }));
      expect(plan.rooms[0]!.gaps[1]).toMatchObject({ crew: [], verdict: 'short', shortByMinutes: 20, requiredMinutes: 50, people: { kind: 'nobody', got: 0, wanted: 1 } });
    });

    it('runs a two-person turnover with the one person free and says who is missing', () => {
      const room = { ...MR1, staff: 2 };
      const input = day([room, MR2], [slot(1, '09:00', 60), slot(1, '10:30', 30), slot(2, '09:00', 60), slot(2, '10:30', 30)], {
        roster: { source: 'day', walkingMinutes: 3, people: [aide('r1', 'Aide 1', [1]), aide('r2', 'Aide 2', [1, 2])] },
      });
      const gap = computeDayPlan(input).rooms[0]!.gaps[1]!;
      expect(gap.crew).toEqual(['r1']);
      expect(gap.staff).toBe(1);
      expect(gap.people).toMatchObject({ kind: 'busy', personId: 'r2', roomId: 2, wanted: 2, got: 1, waitedMinutes: 0 });
    });

    it('counts real minutes on the day clocks spring forward (America/Chicago, 14 March 2027)', () => {
      const dst: DayPlanInput = {
        date: '2027-03-14', timezone: ZONE, ...DEMO_SETUP, rooms: [MR1],
        exams: [{ ...slot(1, '00:00', 30), start: '2027-03-14T01:30:00-06:00' }, { ...slot(1, '00:00', 30), start: '2027-03-14T03:20:00-05:00' }],
        roster: { source: 'day', walkingMinutes: 3, people: [aide('r1', 'Aide 1', [1], { start: '01:00', end: '06:00' })] },
      };
      const gap = computeDayPlan({ ...dst, rooms: [{ ...MR1, opensAt: '01:00' }] }).rooms[0]!.gaps[1]!;
      // 02:00 → 03:00: from 02:00 (A's end, CST) to 03:20 CDT is 20 real minutes.
      expect(gap).toMatchObject({ availableMinutes: 20, requiredMinutes: 20, verdict: 'snug', crew: ['r1'] });
    });
  });

  describe('against brute force on whole plans (2 rooms × up to 4 exams each, 1–3 people)', () => {
    it('gives every gap the verdict of the brute-force optimum', () => {
      const rand = seededRandom(303);
      const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));
      const at = (minutes: number) => DateTime.fromISO(DATE, { zone: ZONE }).plus({ minutes });
      let bothCovered = 0;
      for (let n = 0; n < 80; n++) {
        const rooms = [{ ...MR1, staff: int(1, 2) }, { ...MR2, staff: int(1, 2) }];
        const exams: DayPlanExam[] = [];
        for (const room of rooms) {
          let t = 7 * 60 + int(5, 30);
          for (let e = int(1, 4); e > 0; e--) {
            const duration = int(10, 40);
            exams.push({ ...slot(room.id, '00:00', duration, { precaution: rand() < 0.2 ? 'contact' : 'none' }), start: at(t).toISO()! });
            t += duration + int(-3, 30);
          }
        }
        const people: DayPlanPerson[] = Array.from({ length: int(1, 3) }, (_, p) => {
          const start = 7 * 60 + int(-10, 60);
          const hh = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
          const breaks = rand() < 0.4 ? [{ start: hh(start + 40), end: hh(start + 40 + int(5, 20)) }] : [];
          return aide(`p${p}`, `Aide ${p + 1}`, [[1], [2], [1, 2]][int(0, 2)]!, { start: hh(start), end: hh(start + int(60, 240)), breaks });
        });
        const walkingMinutes = int(0, 5);
        const input = day(rooms, exams, { roster: { source: 'day', walkingMinutes, people } });
        const plan = computeDayPlan(input);

        // The same day as a crew problem, built here from the turnover engine alone.
        // A room nobody covers keeps its own staff: its gaps are those of the plan without a roster.
        const covered = rooms.filter((room) => people.some((p) => p.roomIds.includes(room.id)));
        const jobs: (CrewJob & { toExamId: number })[] = [];
        for (const room of covered) {
          const mine = exams.filter((e) => e.roomId === room.id).sort((a, b) => Date.parse(a.start) - Date.parse(b.start));
          mine.forEach((exam, i) => {
            const previous = i > 0 ? mine[i - 1]! : null;
            const fromMs = previous ? Date.parse(previous.start) + previous.durationMinutes * 60_000 : at(7 * 60).toMillis();
            const toMs = Date.parse(exam.start);
            const requiredMinutes = [0];
            const busyMinutes = [0];
            for (let k = 1; k <= room.staff; k++) {
              const turnover = planTurnover({ leaving: previous, arriving: exam, room: { ...room, staff: k }, protocol: DEMO_SETUP.protocols.MR!, products: DEMO_SETUP.products, staff: k });
              requiredMinutes.push(turnover.requiredMinutes);
              busyMinutes.push(Math.max(...turnover.steps.map((s) => s.end)));
            }
            jobs.push({ toExamId: exam.id, fromMs, toMs, roomId: room.id, availableMinutes: Math.floor((toMs - fromMs) / 60_000), wanted: room.staff, requiredMinutes, busyMinutes });
          });
        }
        jobs.sort((a, b) => a.fromMs - b.fromMs || a.roomId - b.roomId);
        const wall = (hhmm: string) => DateTime.fromISO(`${DATE}T${hhmm}`, { zone: ZONE }).toMillis();
        const problem: CrewProblem = {
          jobs,
          walkMs: walkingMinutes * 60_000,
          people: people.map((p) => ({ startMs: wall(p.start), endMs: wall(p.end), breaks: p.breaks.map((b) => ({ startMs: wall(b.start), endMs: wall(b.end) })), roomIds: p.roomIds })),
        };
        const { best } = bruteForceCrews(problem);
        const expected = new Map(jobs.map((job, j) => [job.toExamId, gapVerdict({ availableMinutes: job.availableMinutes, requiredMinutes: best.required[j]! })]));
        for (const gap of computeDayPlan({ ...input, roster: undefined }).rooms.flatMap((r) => r.gaps)) {
          if (!expected.has(gap.toExamId)) expected.set(gap.toExamId, { verdict: gap.verdict, shortByMinutes: gap.shortByMinutes });
        }
        if (covered.length === 2) bothCovered++;
        const gaps = plan.rooms.flatMap((r) => r.gaps);
        expect(gaps.map((g) => [g.toExamId, g.verdict, g.shortByMinutes])).toEqual(gaps.map((g) => [g.toExamId, expected.get(g.toExamId)!.verdict, expected.get(g.toExamId)!.shortByMinutes]));
      }
      // Most days have people competing across both rooms, not one room each planned apart.
      expect(bothCovered).toBeGreaterThan(30);
    });
  });
});
