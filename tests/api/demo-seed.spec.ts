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
