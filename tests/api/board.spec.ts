import type { Board, BoardRoom, Checklist } from '../../shared/api/board';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, local, tickAll } from './turnover-day';

describe('Rooms now: a room through its day, driven by the clock', () => {
  let h: Harness;
  let tech: Client;
  let frontdesk: Client;

  beforeAll(async () => {
    h = await startHarness();
    tech = await signedIn(h.app, 'tech');
    frontdesk = await signedIn(h.app, 'frontdesk');
    await importDay(await signedIn(h.app, 'scheduler'));
  });
  afterAll(() => h.close());

  const mr2 = async (): Promise<BoardRoom> => {
    const res = await frontdesk.get(`/api/days/${DAY}/board`);
    expect(res.status).toBe(200);
    return (res.body as Board).rooms.find((r) => r.name === 'MR 2')!;
  };
  const finish = async (accession: string): Promise<Checklist> => {
    const res = await tech.post(`/api/exams/${await examId(h, accession)}/finished`, {});
    expect(res.status).toBe(201);
    return res.body;
  };
  const complete = (c: Checklist, body: object = {}) => tech.post(`/api/turnovers/${c.turnoverId}/complete`, body);

  it('is closed before opening, showing the first patient next', async () => {
    at(h, '06:30');
    expect(await mr2()).toMatchObject({ state: 'closed', current: null, next: { accession: 'B-1', start: local('08:00') }, turnoverId: null });
  });

  it('is ready once open and before the first exam; the front desk marks an arrival', async () => {
    at(h, '07:40');
    const res = await frontdesk.post(`/api/exams/${await examId(h, 'B-1')}/arrived`, {});
    expect(res.status).toBe(200);
    expect(res.body.arrivedAt).toBe(local('07:40'));
    expect(await mr2()).toMatchObject({ state: 'ready', next: { accession: 'B-1', arrivedAt: local('07:40') }, runningLateMinutes: 0 });
  });

  it('is in exam from the slot start; ready-at = planned end + the planned turnover (20 min, the brief\'s plain MR case)', async () => {
    at(h, '08:10');
    expect(await mr2()).toMatchObject({ state: 'in exam', current: { accession: 'B-1' }, next: { accession: 'B-2' }, readyAt: local('08:50') });
  });

  it('stays in exam while the exam runs over; ready-at moves with the clock and the next patient runs late', async () => {
    at(h, '08:45');
    expect(await mr2()).toMatchObject({ state: 'in exam', readyAt: local('09:05'), next: { start: local('09:00') }, runningLateMinutes: 5 });
  });

  it('turns over after "exam finished", then dries, then is ready when completed', async () => {
    const opened = await finish('B-1');
    expect(opened).toMatchObject({ examEndedAt: local('08:45'), cleanType: 'routine', leaving: { accession: 'B-1' }, arriving: { accession: 'B-2' } });
    expect(await mr2()).toMatchObject({ state: 'turning over', turnoverId: opened.turnoverId, readyAt: local('09:05'), expectedReadyAt: local('09:05'), runningLateMinutes: 5 });

    // ready-at stays the plan while the work runs behind it, so the board can say "overdue";
    // how late the next patient runs follows the estimate (the 20 planned minutes from now)
    at(h, '09:06');
    expect(await mr2()).toMatchObject({ state: 'turning over', readyAt: local('09:05'), expectedReadyAt: local('09:26'), runningLateMinutes: 26 });
    // Half a minute later the estimate is 09:26:30: shown as 09:27 (the room is not ready at
    // 09:26), and the next patient runs late by what the card shows, 27 min, not by 26.5 rounded.
    h.clock.set(`${DAY}T09:06:30-06:00`);
    expect(await mr2()).toMatchObject({ readyAt: local('09:05'), expectedReadyAt: local('09:27'), runningLateMinutes: 27 });
    at(h, '08:45');

    // the hands-on work done faster than planned: every surface wiped at 08:45
    for (const key of ['clear', 'bore', 'table', 'coils', 'cushions', 'comfort', 'touch']) {
      expect((await tech.post(`/api/turnovers/${opened.turnoverId}/steps/${key}/done`, {})).status).toBe(200);
    }
    at(h, '08:49'); // the table's wait (2 min contact + 2 min dry) is over
    const done = await tickAll(h, tech, (await tech.get(`/api/rooms/${(await mr2()).roomId}/turnover?date=${DAY}`)).body);
    expect(done.steps.every((s) => s.done)).toBe(true);
    // the bore, wiped at 08:45, waits 2 min contact + 4 min dry: wet until 08:51
    expect(done.steps.find((s) => s.key === 'bore')!.wetUntil).toBe(local('08:51'));
    expect(await mr2()).toMatchObject({ state: 'drying', readyAt: local('08:51'), runningLateMinutes: 0 });

    at(h, '08:51');
    expect((await mr2()).state).toBe('turning over'); // dry, waiting for a technologist to confirm
    const res = await complete(done);
    expect(res.status).toBe(200);
    expect(res.body.completedAt).toBe(local('08:51'));
    expect(await mr2()).toMatchObject({ state: 'ready', readyAt: local('08:51'), next: { accession: 'B-2' }, current: null, turnoverId: null });
  });

  it('holds the air after an airborne case: CDC 2003 Appendix B Table B.1, 12 ACH → 35 min for 99.9 %', async () => {
    at(h, '09:30');
    const opened = await finish('B-2');
    expect(opened).toMatchObject({ cleanType: 'isolation', precaution: 'airborne', airHoldMinutes: 35, airHoldUntil: local('10:05') });
    expect(opened.steps[0]!.key).toBe('don');
    const done = await tickAll(h, tech, opened);
    at(h, '09:45');
    expect(await mr2()).toMatchObject({ state: 'air hold', readyAt: local('10:05') });

    const early = await complete(done);
    expect(early.status).toBe(422);
    expect(early.body.error.message).toMatch(/air hold lasts until 10:05/);

    at(h, '10:05');
    expect((await complete(done)).status).toBe(200);
    expect((await mr2()).state).toBe('ready');
  });

  it('shows the day\'s last exam in exam with nothing next', async () => {
    at(h, '10:50');
    expect(await mr2()).toMatchObject({ state: 'in exam', current: { accession: 'B-3' }, next: null, runningLateMinutes: 0 });
  });

  it('is ready, with no more exams, once the last exam\'s (terminal) turnover is complete within opening hours', async () => {
    at(h, '11:00');
    const opened = await finish('B-3');
    expect(opened.cleanType).toBe('terminal');
    await tickAll(h, tech, opened);
    h.clock.advance(15); // all surfaces dry, so the room may be made ready without a reason
    const res = await complete(opened);
    expect(res.status).toBe(200);
    expect(await mr2()).toMatchObject({ state: 'ready', current: null, next: null, readyAt: res.body.completedAt });
  });

  it('is closed after its closing time (19:00 by default)', async () => {
    at(h, '19:00');
    expect(await mr2()).toMatchObject({ state: 'closed', current: null, next: null, readyAt: null });
  });
});
