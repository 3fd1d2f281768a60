import type { DayEvent } from '../../shared/api/changes';
import type { Checklist, LogEntry } from '../../shared/api/board';
import { DayEvents } from '../../server/services/day-events';
import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, roomId, row } from './turnover-day';

describe('the append-only cleaning log', () => {
  let h: Harness;
  let tech: Client;
  let charge: Client;
  let mr2: number;
  const events = new DayEvents();
  const heard: DayEvent[] = [];

  beforeAll(async () => {
    h = await startHarness({ events });
    events.subscribe(DAY, (e) => heard.push(e));
    tech = await signedIn(h.app, 'tech');
    charge = await signedIn(h.app, 'charge');
    await importDay(await signedIn(h.app, 'scheduler'), [
      EXAM_LIST_HEADER,
      row('L-0930', 'MR 1', '09:30', 30),
      row('L-1030', 'MR 2', '10:30', 30),
      row('L-1130', 'MR 2', '11:30', 30),
    ]);
    mr2 = await roomId(h, 'MR 2');

    // MR 2 after the 10:30 patient: finished at 11:00, every surface wiped at once, the sheet
    // laid early (with a reason), the rest once dry, completed at 11:10.
    at(h, '11:00');
    const c: Checklist = (await tech.post(`/api/exams/${await examId(h, 'L-1030')}/finished`, {})).body;
    const tick = async (key: string, body: object = {}) => {
      const res = await tech.post(`/api/turnovers/${c.turnoverId}/steps/${key}/done`, body);
      if (res.status !== 200) throw new Error(`${key}: ${JSON.stringify(res.body)}`);
    };
    for (const key of ['clear', 'bore', 'table', 'coils', 'cushions', 'comfort', 'touch']) await tick(key);
    at(h, '11:01');
    await tick('linen', { earlyReason: 'Next patient waiting in a wheelchair' });
    at(h, '11:04');
    for (const key of ['coilset', 'cushionset', 'covers', 'hygiene']) await tick(key);
    at(h, '11:10');
    heard.length = 0;
    const done = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, {});
    if (done.status !== 200) throw new Error(JSON.stringify(done.body));
  }, 30_000); // a whole turnover through the API; slow only when every suite runs at once
  afterAll(() => h.close());

  const log = async (query = ''): Promise<LogEntry[]> => {
    const res = await tech.get(`/api/log?date=${DAY}${query}`);
    expect(res.status).toBe(200);
    return res.body.entries;
  };

  it('publishes a change event when a turnover completes', () => {
    expect(heard).toEqual(expect.arrayContaining([expect.objectContaining({ date: DAY, kind: 'board', reason: 'turnover complete', by: 'Mika Lindahl' })]));
    expect(heard.some((e) => e.kind === 'log')).toBe(true);
  });

  it("answers the auditor: who cleaned MR 2 after the 10:30 patient, with what, and how long each surface stayed wet", async () => {
    const entries = (await log(`&roomId=${mr2}`)).filter((e) => e.examAccession === 'L-1030');
    const step = (key: string) => entries.find((e) => e.kind === 'step' && e.stepKey === key)!;
    expect(entries.map((e) => e.kind)).toEqual(expect.arrayContaining(['exam finished', 'step', 'turnover complete']));
    expect(entries[0]).toMatchObject({ kind: 'turnover complete', roomName: 'MR 2', displayName: 'Mika Lindahl', cleanType: 'routine' });
    // table: wiped 11:00, next used by the sheet at 11:01 → 1 min achieved of 2 required, with the reason on the sheet's entry
    expect(step('table')).toMatchObject({ displayName: 'Mika Lindahl', productName: 'Standard surface wipe', contactRequiredMinutes: 2, contactAchievedMinutes: 1 });
    expect(step('linen')).toMatchObject({ earlyReason: 'Next patient waiting in a wheelchair', contactRequiredMinutes: null, contactAchievedMinutes: null });
    // coils, cushions, hearing protection: next used at 11:04 → 4 min
    for (const key of ['coils', 'cushions', 'comfort']) expect(step(key)).toMatchObject({ contactRequiredMinutes: 2, contactAchievedMinutes: 4 });
    // nothing in the protocol needs the bore or the counters dry: they were next usable at the completion, 11:10
    expect(step('bore').contactAchievedMinutes).toBe(10);
    expect(step('touch').contactAchievedMinutes).toBe(10);
  });

  it('lists newest first and filters by room, date and person', async () => {
    const all = await log();
    const times = all.map((e) => Date.parse(e.at));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(await log(`&roomId=${await roomId(h, 'MR 1')}`)).toEqual([]);
    expect(await log('&user=charge')).toEqual([]);
    expect((await log('&user=tech')).length).toBe(all.length);
    expect((await tech.get('/api/log?date=2027-03-11')).body.entries).toEqual([]);
    // the same day check as every route: a real calendar day, not only its shape
    const bad = await tech.get('/api/log?date=2027-02-30');
    expect([bad.status, bad.body.error.code]).toEqual([422, 'validation_failed']);
  });

  it('has no route that updates or deletes an entry', async () => {
    const [entry] = await log();
    expect([404, 405]).toContain((await charge.put(`/api/log/${entry!.id}`, { note: 'x' })).status);
    expect([404, 405]).toContain((await charge.patch(`/api/log/${entry!.id}`, { note: 'x' })).status);
    expect([404, 405]).toContain((await charge.delete(`/api/log/${entry!.id}`)).status);
    expect((await log())[0]).toEqual(entry);
  });

  it('refuses a raw SQL update or delete (triggers), on the entries and on the contact times', async () => {
    // the error comes from SQLite through a native module; read its message rather than rely on its class
    const failure = async (query: PromiseLike<unknown>) => {
      try {
        return `no error: ${JSON.stringify(await query)}`;
      } catch (err) {
        return String((err as { message?: unknown }).message ?? err);
      }
    };
    expect(Number((await h.db('cleaning_log').count({ n: '*' }))[0]!['n'])).toBeGreaterThan(0);
    expect(await failure(h.db('cleaning_log').update({ note: 'rewritten' }))).toMatch(/cleaning_log is append-only/);
    expect(await failure(h.db('cleaning_log').delete())).toMatch(/cleaning_log is append-only/);
    expect(await failure(h.db('cleaning_log_contact').update({ achieved_minutes: 99 }))).toMatch(/cleaning_log_contact is append-only/);
    expect(await failure(h.db('cleaning_log_contact').delete())).toMatch(/cleaning_log_contact is append-only/);
    expect((await h.db('cleaning_log').whereNotNull('note')).length).toBe(0);
  });

  it('chains corrections: each is a new entry pointing at the one it corrects', async () => {
    const table = (await log()).find((e) => e.stepKey === 'table' && e.kind === 'step')!;
    const first = await charge.post(`/api/log/${table.id}/corrections`, { note: 'Table wiped by Jules, not Mika' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ kind: 'correction', correctsId: table.id, stepKey: 'table', roomName: 'MR 2', examAccession: 'L-1030', username: 'charge' });
    const second = await tech.post(`/api/log/${first.body.id}/corrections`, { note: 'Confirmed with Jules' });
    expect(second.body.correctsId).toBe(first.body.id);
    expect((await log()).find((e) => e.id === table.id)).toEqual(table);
    expect((await charge.post(`/api/log/${table.id}/corrections`, { note: '  ' })).status).toBe(422);
    expect((await charge.post('/api/log/999999/corrections', { note: 'x' })).status).toBe(404);
  });

  it('exports CSV with a header row, escaping cells a spreadsheet would evaluate (=, +, -, @)', async () => {
    const [latest] = await log();
    const notes = ['=HYPERLINK("http://example.invalid","open")', '+1 minute', '-2 minutes', '@SUM(A1:A2)'];
    for (const note of notes) expect((await charge.post(`/api/log/${latest!.id}/corrections`, { note })).status).toBe(201);
    const res = await tech.get(`/api/log.csv?date=${DAY}&roomId=${mr2}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.text.split('\r\n');
    expect(lines[0]).toBe('id,at,day,room,exam,clean type,entry,step,product,contact required (min),contact achieved (min),early because,note,corrects,username,name');
    expect(res.text).toContain(`"'=HYPERLINK(""http://example.invalid"",""open"")"`);
    expect(res.text).toContain(",'+1 minute,");
    expect(res.text).toContain(",'-2 minutes,");
    expect(res.text).toContain(",'@SUM(A1:A2),");
    expect(res.text).not.toMatch(/,[=+\-@]/);
  });

  it('is read by technologists, charge and admin only', async () => {
    for (const role of ['frontdesk', 'scheduler'] as const) {
      const c = await signedIn(h.app, role);
      expect((await c.get('/api/log')).status).toBe(403);
      expect((await c.get('/api/log.csv')).status).toBe(403);
    }
  });
});
