import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { TURNOVER_STAFF } from '../../shared/api/limits';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, room: string, start: string, dur: number, precaution = 'none') =>
  [acc, room, start, String(dur), 'MR exam', 'knee', precaution, 'ambulatory', 'no', ''];

describe('moving slots, staffing, fixes, undo and the live stream', () => {
  let h: Harness;
  let charge: Client;
  let scheduler: Client;

  beforeEach(async () => {
    h = await startHarness();
    charge = await signedIn(h.app, 'charge');
    scheduler = await signedIn(h.app, 'scheduler');
    const table = [
      EXAM_LIST_HEADER,
      row('M-1', 'MR 1', '08:00', 30),
      row('M-2', 'MR 1', '08:40', 30), // 10 available, 20 needed (brief: plain MR turnover, one person) → short by 10
      row('M-3', 'MR 1', '10:00', 30),
      row('N-1', 'MR 2', '08:00', 30),
      row('C-1', 'CT 1', '08:00', 15),
    ];
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'day.csv')).status).toBe(200);
  });
  afterEach(() => h.close());

  const plan = async () => (await charge.get(`/api/days/${DAY}/plan`)).body;
  const exam = async (acc: string) => {
    for (const r of (await plan()).rooms) for (const e of r.exams) if (e.accession === acc) return { ...e, room: r };
    throw new Error(acc);
  };
  const gapBefore = async (acc: string) => {
    const e = await exam(acc);
    return e.room.gaps.find((g: { toExamId: number }) => g.toExamId === e.id);
  };

  it('a move later turns a short gap into fits and answers the new plan', async () => {
    expect(await gapBefore('M-2')).toMatchObject({ verdict: 'short', shortByMinutes: 10 });
    const m2 = await exam('M-2');
    const res = await scheduler.patch(`/api/exams/${m2.id}`, { start: t('08:55'), version: m2.version, reason: 'drag' });
    expect(res.status).toBe(200);
    const gap = res.body.rooms[0].gaps.find((g: { toExamId: number }) => g.toExamId === m2.id);
    expect(gap).toMatchObject({ verdict: 'fits', availableMinutes: 25 });
    expect((await exam('M-2')).version).toBe(m2.version + 1);
  });

  it('refuses a stale version with 409 naming who changed it', async () => {
    const m2 = await exam('M-2');
    await scheduler.patch(`/api/exams/${m2.id}`, { start: t('08:50'), version: m2.version, reason: 'drag' });
    const res = await charge.patch(`/api/exams/${m2.id}`, { start: t('09:00'), version: m2.version, reason: 'drag' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Noor Haddad changed it at/);
    expect(res.body.error).toMatchObject({ code: 'stale_version', details: { currentVersion: m2.version + 1, changedBy: { username: 'scheduler', displayName: 'Noor Haddad' } } });
    expect((await exam('M-2')).start).toBe(t('08:50'));
  });

  it('refuses a move to a room of another modality, or out of the day, with 422', async () => {
    const m2 = await exam('M-2');
    const ct = (await plan()).rooms.find((r: { name: string }) => r.name === 'CT 1');
    const other = await scheduler.patch(`/api/exams/${m2.id}`, { roomId: ct.id, version: m2.version });
    expect(other.status).toBe(422);
    expect(other.body.error.message).toMatch(/MR exam; CT 1 is a CT room/);
    expect(other.body.error).toMatchObject({ code: 'other_modality', details: { examModality: 'MR', roomModality: 'CT' } });
    const late = await scheduler.patch(`/api/exams/${m2.id}`, { start: `${DAY}T23:50:00-06:00`, version: m2.version });
    expect(late.status).toBe(422);
    expect(late.body.error).toMatchObject({ code: 'outside_day', details: { day: DAY, timezone: 'America/Chicago' } });
    expect((await exam('M-2')).version).toBe(m2.version);
  });

  it('moves an exam to another room of the same modality', async () => {
    const m2 = await exam('M-2');
    const mr2 = (await plan()).rooms.find((r: { name: string }) => r.name === 'MR 2');
    const res = await scheduler.patch(`/api/exams/${m2.id}`, { roomId: mr2.id, start: t('09:30'), version: m2.version });
    expect(res.status).toBe(200);
    expect((await exam('M-2')).room.name).toBe('MR 2');
  });

  it('forbids the front desk and technologists from moving slots (403)', async () => {
    const m2 = await exam('M-2');
    for (const role of ['frontdesk', 'tech'] as const) {
      const c = await signedIn(h.app, role);
      expect((await c.patch(`/api/exams/${m2.id}`, { start: t('09:00'), version: m2.version })).status).toBe(403);
    }
  });

  it('records every move in the history and undo/redo restore it as new entries', async () => {
    const m2 = await exam('M-2');
    await scheduler.patch(`/api/exams/${m2.id}`, { start: t('09:00'), version: m2.version, reason: 'keyboard' });
    const undo = await scheduler.post(`/api/days/${DAY}/undo`);
    expect(undo.status).toBe(200);
    expect((await exam('M-2')).start).toBe(t('08:40'));
    const redo = await scheduler.post(`/api/days/${DAY}/redo`);
    expect(redo.status).toBe(200);
    expect((await exam('M-2')).start).toBe(t('09:00'));
    const history = (await charge.get(`/api/days/${DAY}/history`)).body.changes;
    expect(history.map((c: { reason: string }) => c.reason)).toEqual(['redo', 'undo', 'keyboard']);
    expect(history[2]).toMatchObject({ username: 'scheduler', changes: [{ type: 'move', from: { start: t('08:40') }, to: { start: t('09:00') } }] });
    const nothing = await charge.post(`/api/days/${DAY}/redo`); // charge has nothing of its own to redo
    expect([nothing.status, nothing.body.error.code]).toEqual([409, 'nothing_to_redo']);
    const none = await charge.post(`/api/days/${DAY}/undo`);
    expect([none.status, none.body.error.code]).toEqual([409, 'nothing_to_undo']);
  });

  it('refuses to undo a move that someone has changed since (409 changed_since), and keeps their move', async () => {
    const m2 = await exam('M-2');
    await scheduler.patch(`/api/exams/${m2.id}`, { start: t('09:00'), version: m2.version });
    await charge.patch(`/api/exams/${m2.id}`, { start: t('09:10'), version: m2.version + 1 });
    const undo = await scheduler.post(`/api/days/${DAY}/undo`);
    expect(undo.status).toBe(409);
    expect(undo.body.error).toMatchObject({ code: 'changed_since', details: { accession: 'M-2', examId: m2.id } });
    expect((await exam('M-2')).start).toBe(t('09:10'));
  });

  it('adds a helper to one turnover and the required time drops (two people: 14 min, brief worked value)', async () => {
    const m2 = await exam('M-2');
    const res = await charge.put(`/api/exams/${m2.id}/staffing`, { staff: 2 });
    expect(res.status).toBe(200);
    expect(await gapBefore('M-2')).toMatchObject({ staff: 2, requiredMinutes: 14, verdict: 'short', shortByMinutes: 4 });
    expect((await scheduler.put(`/api/exams/${m2.id}/staffing`, { staff: 2 })).status).toBe(403);
    expect((await charge.put(`/api/exams/${m2.id}/staffing`, { staff: TURNOVER_STAFF.max + 1 })).status).toBe(422);
    expect((await charge.put(`/api/exams/${m2.id}/staffing`, { staff: TURNOVER_STAFF.max })).status).toBe(200); // as many as a room may have
  });

  it('suggests fixes for the short gap, none of which leaves a new short gap unannounced', async () => {
    const m2 = await exam('M-2');
    const { fixes } = (await charge.get(`/api/days/${DAY}/fixes`)).body;
    const forGap = fixes.filter((f: { toExamId: number }) => f.toExamId === m2.id);
    expect(forGap.map((f: { kind: string }) => f.kind)).toEqual(expect.arrayContaining(['push-later', 'other-room', 'add-helper']));
    const push = forGap.find((f: { kind: string }) => f.kind === 'push-later');
    expect(push.effect).toMatchObject({ verdictAfter: 'fits', newProblems: 0 });
    const res = await charge.post(`/api/days/${DAY}/fixes/apply`, { fixId: push.id });
    expect(res.status).toBe(200);
    expect(res.body.plan.summary.short + res.body.plan.summary.overlap).toBe(0);
    expect((await gapBefore('M-2')).verdict).toBe('fits');
    const history = (await charge.get(`/api/days/${DAY}/history`)).body.changes;
    expect(history).toHaveLength(1);
    expect(history[0].reason).toBe('suggestion');
    // the same fix again is stale
    const stale = await charge.post(`/api/days/${DAY}/fixes/apply`, { fixId: push.id });
    expect([stale.status, stale.body.error.code]).toEqual([409, 'fix_stale']);
    expect((await scheduler.post(`/api/days/${DAY}/fixes/apply`, { fixId: push.id })).status).toBe(403);
  });

  it('streams a change event to an open day stream when a slot moves', async () => {
    const server = http.createServer(h.app).listen(0);
    const port = (server.address() as AddressInfo).port;
    const cookie = (await charge.get('/api/auth/me')).request.cookies as unknown as string;
    try {
      let moving: Promise<{ status: number }> | undefined;
      const received = new Promise<string>((resolve, reject) => {
        const req = http.get({ port, path: `/api/days/${DAY}/events`, headers: { Cookie: cookie } }, (res) => {
          expect(res.headers['content-type']).toMatch(/text\/event-stream/);
          let buffer = '';
          res.on('data', (chunk) => {
            buffer += chunk;
            if (buffer.includes('event: change')) {
              resolve(buffer);
              req.destroy();
            }
          });
          // once the stream is open, move a slot
          moving = exam('M-2').then((m2) => scheduler.patch(`/api/exams/${m2.id}`, { start: t('09:00'), version: m2.version, reason: 'drag' }));
        });
        req.on('error', reject);
      });
      const text = await received;
      // The move's own answer too: its plan is read after the event goes out, and a request still
      // running when the suite closes its database waits for a connection that never comes.
      expect((await moving!).status).toBe(200);
      const data = JSON.parse(/data: (.*)/.exec(text.slice(text.indexOf('event: change')))![1]!);
      expect(data).toMatchObject({ date: DAY, kind: 'plan', reason: 'drag', by: 'Noor Haddad' });
    } finally {
      server.close();
    }
  });
});
