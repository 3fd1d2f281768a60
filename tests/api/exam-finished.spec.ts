import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, local, row } from './turnover-day';

/** "Exam finished" opens a turnover, its air hold and log entries: not for a slot that has not started. */
describe('"exam finished" and the slot\'s start', () => {
  let h: Harness;
  let tech: Client;
  let scheduler: Client;

  beforeEach(async () => {
    h = await startHarness();
    tech = await signedIn(h.app, 'tech');
    scheduler = await signedIn(h.app, 'scheduler');
  });
  afterEach(() => h.close());

  const finish = (accession: string, body: object = {}) => examId(h, accession).then((id) => tech.post(`/api/exams/${id}/finished`, body));

  it('refuses "exam finished" before the slot starts (422 exam_not_started) and logs the reason when one is given', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30), row('T-2', 'MR 2', '10:00', 30)]);
    at(h, '08:50');
    const refused = await finish('T-1');
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatchObject({ code: 'exam_not_started', details: { start: local('09:00') } });
    expect(refused.body.error.message).toMatch(/T-1 in MR 2 is booked to start at 09:00/);
    expect(await h.db('turnovers').count({ n: '*' }).first()).toEqual({ n: 0 });

    const confirmed = await finish('T-1', { earlyReason: 'Patient declined the scan at the door' });
    expect(confirmed.status).toBe(201);
    const { entries } = (await tech.get(`/api/log?date=${DAY}`)).body;
    expect(entries[0]).toMatchObject({ kind: 'exam finished', examAccession: 'T-1', earlyReason: 'Patient declined the scan at the door' });
  });

  it('needs no reason once the slot has started, and logs none', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30)]);
    at(h, '09:00');
    expect((await finish('T-1', { earlyReason: 'not needed' })).status).toBe(201);
    const { entries } = (await tech.get(`/api/log?date=${DAY}`)).body;
    expect(entries[0]).toMatchObject({ kind: 'exam finished', earlyReason: null });
  });

});
