import { MAX_FIX_CHANGES_PER_CALL, MAX_FIX_GAPS_PER_CALL, type Fix, type FixesPage } from '../../shared/fixes';
import { createFixesPool, type FixesPool } from '../../server/workers/fixes-pool';
import { crowdedRoomDay } from './fixes-days';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DEMO_DAY = '2027-03-10'; // the demo seed's "today" for this clock (America/Chicago)
const CROWDED_DAY = '2027-03-11';
const CROWDED_EXAMS = 2000; // the most rows an imported day list may have

/**
 * Suggested fixes stay bounded on a big day. Before, one call weighed every fix of every problem
 * gap by recomputing the whole day: a 2,000-exam day took well over 30 s of CPU (and the hook
 * timeout below fails it); now a call covers at most 20 problem gaps, or one gap on demand.
 */
describe('suggested fixes, paged and per gap', () => {
  let h: Harness;
  let pool: FixesPool;
  let tech: Client;
  let charge: Client;
  const examIds: number[] = [];

  beforeAll(async () => {
    pool = createFixesPool();
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z', fixesPool: pool });
    tech = await signedIn(h.app, 'tech');
    charge = await signedIn(h.app, 'charge');
    // An invented crowded day: 2,000 exams in MR 1, each starting before the one before it ends.
    const room = await h.db('rooms').where({ name: 'MR 1' }).first();
    const rows = crowdedRoomDay(CROWDED_EXAMS, CROWDED_DAY).exams.map((exam) => ({
      day: CROWDED_DAY,
      accession: exam.accession,
      room_id: room.id,
      start_at: exam.start,
      start_ms: Date.parse(exam.start),
      duration_minutes: exam.durationMinutes,
      procedure: exam.procedure,
      coil: exam.coil,
      precaution: exam.precaution,
      mobility: exam.mobility,
      contrast: exam.contrast,
      notes: null,
      version: 1,
      updated_at: '2027-03-10T14:00:00Z',
    }));
    await h.db.batchInsert('exams', rows, 200);
    examIds.push(...(await h.db('exams').where({ day: CROWDED_DAY }).orderBy('start_ms').orderBy('id').pluck('id')));
  }, 60_000);

  afterAll(async () => {
    await pool.close();
    await h.close();
  }, 30_000);

  const page = async (query: string): Promise<FixesPage> => {
    const res = await tech.get(`/api/days/${CROWDED_DAY}/fixes${query}`);
    expect([res.status, res.body.error]).toEqual([200, undefined]);
    return res.body;
  };

  it(`answers a ${CROWDED_EXAMS}-exam day with the fixes of at most ${MAX_FIX_GAPS_PER_CALL} problem gaps and a cursor`, async () => {
    const first = await page('');
    // every gap overlaps, the first too (the list starts before MR 1 opens)
    expect(first.problemGaps).toBe(CROWDED_EXAMS);
    // each push cascades through the rest of the list, so the page ends early at its changes budget
    const covered = first.gaps.length;
    expect(covered).toBeGreaterThanOrEqual(1);
    expect(covered).toBeLessThanOrEqual(MAX_FIX_GAPS_PER_CALL);
    expect(first.gaps).toEqual(examIds.slice(0, covered));
    expect(first.next).toBe(first.gaps.at(-1));
    expect(first.fixes.filter((f) => f.toExamId !== first.next).reduce((n, f) => n + f.changes.length, 0)).toBeLessThan(MAX_FIX_CHANGES_PER_CALL);
    expect(first.fixes.every((fix) => first.gaps.includes(fix.toExamId))).toBe(true);

    const second = await page(`?after=${first.next}&limit=1`);
    expect(second.gaps).toEqual(examIds.slice(covered, covered + 1));
    expect(second.next).toBe(second.gaps.at(-1));
    // later in the list the cascades are short, and a page covers its full 20 gaps
    const late = await page(`?after=${examIds.at(-60)}`);
    expect(late.gaps).toEqual(examIds.slice(-59, -59 + MAX_FIX_GAPS_PER_CALL));

    const last = await page(`?after=${examIds.at(-2)}`);
    expect(last).toMatchObject({ gaps: [examIds.at(-1)], next: null });
  }, 60_000);

  it("answers one gap's fixes on demand, the same as its page gives", async () => {
    const first = await page('?limit=3');
    for (const toExamId of first.gaps) {
      const res = await tech.get(`/api/days/${CROWDED_DAY}/fixes?gap=${toExamId}`);
      expect(res.status).toBe(200);
      expect(res.body.fixes).toEqual(first.fixes.filter((fix) => fix.toExamId === toExamId));
    }
    // a gap that is not short or overlapping has nothing to fix
    const plan = (await tech.get(`/api/days/${DEMO_DAY}/plan`)).body as { rooms: { gaps: { toExamId: number; verdict: string }[] }[] };
    const fitting = plan.rooms.flatMap((r) => r.gaps).find((g) => g.verdict === 'fits')!;
    expect((await tech.get(`/api/days/${DEMO_DAY}/fixes?gap=${fitting.toExamId}`)).body).toEqual({ fixes: [] });
  }, 60_000);

  it('applies a fix of the crowded day, recomputing only its gap', async () => {
    const { fixes } = (await tech.get(`/api/days/${CROWDED_DAY}/fixes?gap=${examIds[1]}`)).body as { fixes: Fix[] };
    const helper = fixes.find((fix) => fix.kind === 'add-helper')!;
    const res = await charge.post(`/api/days/${CROWDED_DAY}/fixes/apply`, { fixId: helper.id, acceptNewProblems: true });
    expect(res.status).toBe(200);
    expect(res.body.plan.summary).toEqual(helper.effect.summaryAfter);
    expect((await charge.post(`/api/days/${CROWDED_DAY}/undo`)).status).toBe(200);
  }, 60_000);

  it('gives the demo day the fixes it gave before, gap by gap', async () => {
    const { gaps, fixes, problemGaps, next } = await (await tech.get(`/api/days/${DEMO_DAY}/fixes`)).body;
    expect([gaps.length, problemGaps, next]).toEqual([4, 4, null]);
    const perGap: Fix[] = [];
    for (const toExamId of gaps) perGap.push(...(await tech.get(`/api/days/${DEMO_DAY}/fixes?gap=${toExamId}`)).body.fixes);
    expect(perGap).toEqual(fixes);
    // as the whole-day computation suggested them before suggestions were paged (ids are the seed's exam ids)
    expect(perGap.map((f) => [f.id, f.title, f.effect.verdictAfter, f.effect.shortByAfter, f.effect.newProblems])).toEqual([
      ['push-later:3', 'Start TWD-20270310-003 7 min later, at 09:25', 'fits', 0, 0],
      ['add-helper:3', 'Add a helper before TWD-20270310-003 (2 people)', 'fits', 0, 0],
      ['push-later:13', 'Start TWD-20270310-013 7 min later, at 10:44', 'fits', 0, 0],
      ['add-helper:13', 'Add a helper before TWD-20270310-013 (2 people)', 'fits', 0, 0],
      ['isolation-last:13', "Move the enteric-precaution case TWD-20270310-012 to the end of MR 2's list", 'fits', 0, 0],
      ['push-later:26', 'Start TWD-20270310-026 7 min later, at 14:22', 'fits', 0, 0],
      ['add-helper:26', 'Add a helper before TWD-20270310-026 (3 people)', 'short', 3, 0],
      ['push-later:36', 'Start TWD-20270310-036 21 min later, at 12:01', 'fits', 0, 0],
      ['add-helper:36', 'Add a helper before TWD-20270310-036 (2 people)', 'overlap', 15, 0],
    ]);
  }, 30_000);

  it('refuses a bad query with 422, and an exam not on the day with 404', async () => {
    for (const query of ['?limit=0', `?limit=${MAX_FIX_GAPS_PER_CALL + 1}`, '?limit=2.5', '?gap=abc', `?gap=${examIds[1]}&limit=2`, `?gap=${examIds[1]}&after=${examIds[0]}`]) {
      const res = await tech.get(`/api/days/${CROWDED_DAY}/fixes${query}`);
      expect([query, res.status, res.body.error?.code]).toEqual([query, 422, 'validation_failed']);
    }
    const notThere = examIds.at(-1)! + 1000;
    // (an exam of another day is not on this one; a query field the route does not know is ignored)
    for (const [day, query] of [[CROWDED_DAY, `?gap=${notThere}`], [CROWDED_DAY, `?after=${notThere}`], [DEMO_DAY, `?gap=${examIds[1]}&x=1`]] as const) {
      const res = await tech.get(`/api/days/${day}/fixes${query}`);
      expect([query, res.status, res.body.error?.code]).toEqual([query, 404, 'not_found']);
    }
  }, 30_000);
});
