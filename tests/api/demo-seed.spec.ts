import { DateTime } from 'luxon';
import { loadDayPlan } from '../../server/services/day-plan';
import { seedDemo } from '../../server/seeding';
import { startHarness, type Harness } from './harness';

describe('demo seed', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-06-02T12:00:00Z' });
  });
  afterAll(() => h.close());

  it("seeds today's list (in the site zone) with the intended mix of verdicts", async () => {
    const today = DateTime.fromISO('2027-06-02T12:00:00Z').setZone('America/Chicago').toISODate()!;
    const plan = await loadDayPlan(h.db, today);
    const exams = plan.rooms.flatMap((r) => r.exams);
    for (const room of plan.rooms) expect(room.exams.length).toBeGreaterThanOrEqual(8);
    expect(plan.summary.overlap).toBe(1);
    expect(plan.summary.short).toBeGreaterThanOrEqual(2);
    expect(plan.summary.snug).toBeGreaterThanOrEqual(2);
    expect(plan.summary.fits).toBeGreaterThan(plan.summary.short + plan.summary.snug + plan.summary.overlap);
    expect(new Set(exams.map((e) => e.precaution))).toEqual(new Set(['none', 'contact', 'enteric', 'droplet', 'airborne']));
    expect(exams.some((e) => e.contrast)).toBe(true);
    expect(exams.some((e) => e.mobility === 'stretcher')).toBe(true);
    expect(plan.rooms.flatMap((r) => r.gaps).some((g) => g.airHoldMinutes > 0)).toBe(true);
  });

  it('is idempotent: a second start adds nothing', async () => {
    const before = await h.db('exams').count({ n: '*' });
    await seedDemo(h.db, h.clock.now());
    expect(await h.db('exams').count({ n: '*' })).toEqual(before);
    expect(await h.db('users').count({ n: '*' })).toEqual([{ n: 5 }]);
  });
});

describe('demo history', () => {
  it('plays the day forward to now: past turnovers are finished, ticked and closed, later ones are untouched', async () => {
    const h = await startHarness({ seedDay: true, now: '2027-06-02T19:30:00Z' }); // 14:30 in Chicago (CDT)
    try {
      await seedDemo(h.db, h.clock.now(), { history: true });
      const turnovers = await h.db('turnovers').where({ day: '2027-06-02' });
      expect(turnovers.length).toBeGreaterThan(8);
      expect(turnovers.every((t) => Date.parse(t.exam_ended_at) <= h.clock.now().getTime())).toBe(true);
      const exams = await h.db('exams').where({ day: '2027-06-02' });
      const future = exams.filter((e) => Number(e.start_ms) > h.clock.now().getTime()).map((e) => e.id);
      expect(turnovers.some((t) => future.includes(t.from_exam_id))).toBe(false);
      // closed turnovers take their planned time or a little longer: never all exactly as planned
      const required = new Map((await loadDayPlan(h.db, '2027-06-02')).rooms.flatMap((r) => r.gaps).map((g) => [g.fromExamId, g.requiredMinutes]));
      const late = turnovers
        .filter((t) => t.completed_at && required.has(t.from_exam_id)) // the day's last exam has no gap after it
        .map((t) => (Number(t.completed_ms) - Number(t.exam_ended_ms)) / 60_000 - required.get(t.from_exam_id)!);
      expect(late.length).toBeGreaterThan(4);
      expect(Math.min(...late)).toBeGreaterThanOrEqual(0);
      expect(Math.max(...late)).toBeGreaterThan(0);
      const entries = await h.db('cleaning_log').count({ n: '*' });
      expect(Number(entries[0]!['n'])).toBeGreaterThan(turnovers.length * 5);
      // idempotent
      await seedDemo(h.db, h.clock.now(), { history: true });
      expect(await h.db('turnovers').where({ day: '2027-06-02' })).toHaveLength(turnovers.length);
    } finally {
      await h.close();
    }
  });
});
