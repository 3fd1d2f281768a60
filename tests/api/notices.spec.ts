import nodemailer from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { appMailer } from '../../server/app';
import { queueImportDigest } from '../../server/services/notices/import-digest';
import { queueNotices } from '../../server/services/notices/queue';
import { sendDue } from '../../server/services/notices/sender';
import { writeSettings } from '../../server/services/settings';
import { queueMoveNotices } from '../../server/services/notices/slot-moves';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * E-mail notices end to end: an import with a short gap queues a digest, the sender delivers it
 * over real SMTP to the demo mail server on loopback, the Outbox lists it; a refusing SMTP server
 * leads to retries with back-off; a notice is never queued or sent twice; an unsubscribe link
 * turns the notice off; slot moves within the batch window go out as one message per room.
 */
const DAY = '2027-03-10'; // the harness's today, America/Chicago (-06:00)
const PUBLIC_URL = 'https://turnwise.example.test';

function row(acc: string, room: string, start: string, dur: number, precaution = 'none') {
  return [acc, room, start, String(dur), 'MR exam', 'knee', precaution, 'ambulatory', 'no', ''];
}

// The worked values of day-plan.spec.ts: after an enteric case the MR protocol needs 24 min and
// 20 are available, so N-2's gap is short by 4 (demo defaults).
const SHORT_DAY = toCsv([EXAM_LIST_HEADER, row('N-1', 'MR 1', '09:40', 30, 'enteric'), row('N-2', 'MR 1', '10:30', 30), row('N-3', 'MR 3', '11:00', 30)]);

const HOOK_MS = 30_000;

describe('e-mail notices', () => {
  let h: Harness;
  let admin: Client;
  let charge: Client;
  let scheduler: Client;
  const mailCount = async () => Number((await h.db('caught_mail').count({ n: '*' }).first())!.n);
  const ctx = { publicUrl: PUBLIC_URL, secret: 'test-secret' };

  beforeAll(async () => {
    h = await startHarness({ publicUrl: PUBLIC_URL });
    [admin, charge, scheduler] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge'), signedIn(h.app, 'scheduler')]);
    const on = { 'import-digest': true, 'slot-moves': true };
    expect((await charge.put('/api/profile/notices', { email: 'charge@example.test', kinds: on })).status).toBe(200);
    expect((await scheduler.put('/api/profile/notices', { email: 'scheduler@example.test', kinds: on })).status).toBe(200);
    await writeSettings(h.db, { noticesSender: 'notices@example.test' });
  }, HOOK_MS);
  afterAll(() => h.close(), HOOK_MS);

  it('refuses a bad address on the profile with the field named', async () => {
    const res = await charge.put('/api/profile/notices', { email: 'not-an-address', kinds: { 'import-digest': true, 'slot-moves': true } });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems).toEqual([expect.objectContaining({ field: 'email' })]);
  });

  it('an import with a short gap queues one digest per recipient, then sends it over SMTP to the demo mail server', async () => {
    const res = await scheduler.upload(`/api/days/${DAY}/exams/import`, SHORT_DAY, 'short.csv');
    expect(res.status).toBe(200);
    expect(res.body.summary.short).toBe(1);

    const queued = await h.db('notices').where({ kind: 'import-digest' }).orderBy('id');
    expect(queued.map((n) => JSON.parse(n.recipients)[0]).sort()).toEqual(['charge@example.test', 'scheduler@example.test']);
    expect(queued.every((n) => n.status === 'queued')).toBe(true);
    const text: string = queued[0].text;
    expect(text).toContain('MR 1');
    expect(text).toContain('10:30 before N-2: short by 4 min (turnover needs 24 min, 20 min available)');
    expect(text).toContain(`${PUBLIC_URL}/day/${DAY}`);
    expect(text).toContain(`${PUBLIC_URL}/api/notices/unsubscribe?token=`);
    expect(queued[0].html).toContain('short by 4 min');

    const transport = await appMailer(h.app).transport();
    const report = await sendDue(h.db, transport!, h.clock.now());
    expect(report).toEqual({ sent: 2, retrying: 0, failed: 0 });
    const caught = await h.db('caught_mail').orderBy('id');
    expect(caught).toHaveLength(2);
    expect(caught.map((m) => JSON.parse(m.envelope_to)[0]).sort()).toEqual(['charge@example.test', 'scheduler@example.test']);
    expect(caught[0].envelope_from).toBe('notices@example.test');
    expect(caught[0].subject).toBe(`Turnwise: 1 problem gap on ${DAY} after an import`);
    expect(caught[0].text).toContain('short by 4 min');
    expect(caught[0].html).toContain('<li>10:30 before N-2');
    // RFC 2369 (List-Unsubscribe) header on the wire
    expect(caught[0].raw.replace(/\r?\n[ \t]+/g, ' ')).toMatch(/^List-Unsubscribe: <https:\/\/turnwise\.example\.test\/api\/notices\/unsubscribe\?token=/m);

    const outbox = await admin.get('/api/outbox');
    expect(outbox.status).toBe(200);
    expect(outbox.body.delivery).toBe('demo-server');
    const listed = outbox.body.notices.filter((n: { kind: string }) => n.kind === 'import-digest');
    expect(listed).toHaveLength(2);
    expect(listed[0]).toMatchObject({ status: 'sent', attempts: 1, lastError: null, subject: caught[0].subject });
    const one = await admin.get(`/api/outbox/${listed[0].id}`);
    expect(one.body.text).toContain('short by 4 min');
    expect(one.body.html).toContain('<ul>');
  });

  it('never queues or sends the same notice twice', async () => {
    const before = await mailCount();
    const userId = (await h.db('users').where({ username: 'scheduler' }).first('id')).id;
    expect(await queueImportDigest(h.db, ctx, { day: DAY, userId, now: h.clock.now() })).toBe(0);
    expect(await sendDue(h.db, (await appMailer(h.app).transport())!, h.clock.now())).toEqual({ sent: 0, retrying: 0, failed: 0 });
    expect(await mailCount()).toBe(before);
  });

  it('a notice left `sending` by a crash is sent once, after the stale limit', async () => {
    const userId = (await h.db('users').where({ username: 'charge' }).first('id')).id;
    const notice = { key: 'test:crash', kind: 'import-digest' as const, userId, to: 'charge@example.test', subject: 'Crash test', text: 'x', html: '<p>x</p>', unsubscribeUrl: null };
    expect(await queueNotices(h.db, [notice], h.clock.now())).toBe(1);
    // as if a sender claimed it and the process died before the SMTP answer
    await h.db('notices').where({ idempotency_key: 'test:crash' }).update({ status: 'sending', attempts: 1, claimed_at: h.clock.now().toISOString() });
    const transport = (await appMailer(h.app).transport())!;
    const before = await mailCount();
    const at = (minutes: number) => new Date(h.clock.now().getTime() + minutes * 60_000);
    expect((await sendDue(h.db, transport, at(5), { staleSendingMinutes: 10 })).sent).toBe(0);
    expect((await sendDue(h.db, transport, at(10), { staleSendingMinutes: 10 })).sent).toBe(1);
    expect((await sendDue(h.db, transport, at(30), { staleSendingMinutes: 10 })).sent).toBe(0);
    expect(await mailCount()).toBe(before + 1);
    expect(await h.db('notices').where({ idempotency_key: 'test:crash' }).first()).toMatchObject({ status: 'sent', attempts: 2 });
  });

  it('a refusing SMTP server leads to retries with back-off, the error in the Outbox, then failed', async () => {
    const refusing = new SMTPServer({
      authOptional: true,
      disabledCommands: ['AUTH', 'STARTTLS'],
      logger: false,
      onRcptTo: (_address, _session, callback) => callback(Object.assign(new Error('Mailbox unavailable'), { responseCode: 550 })),
    });
    await new Promise<void>((resolve) => refusing.listen(0, '127.0.0.1', () => resolve()));
    const port = (refusing.server.address() as { port: number }).port;
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
    try {
      const userId = (await h.db('users').where({ username: 'charge' }).first('id')).id;
      const t0 = h.clock.now();
      const at = (minutes: number) => new Date(t0.getTime() + minutes * 60_000);
      await queueNotices(h.db, [{ key: 'test:refused', kind: 'import-digest', userId, to: 'charge@example.test', subject: 'Refused', text: 'x', html: '<p>x</p>', unsubscribeUrl: null }], t0);
      const row = () => h.db('notices').where({ idempotency_key: 'test:refused' }).first();
      const options = { maxAttempts: 3, backoffMinutes: 1 };

      expect(await sendDue(h.db, transport, at(0), options)).toEqual({ sent: 0, retrying: 1, failed: 0 });
      expect(await row()).toMatchObject({ status: 'queued', attempts: 1, next_attempt_at: at(1).toISOString() });
      expect((await row()).last_error).toContain('550');
      // not due before its back-off
      expect(await sendDue(h.db, transport, at(0.5), options)).toEqual({ sent: 0, retrying: 0, failed: 0 });
      expect(await sendDue(h.db, transport, at(1), options)).toEqual({ sent: 0, retrying: 1, failed: 0 });
      expect(await row()).toMatchObject({ status: 'queued', attempts: 2, next_attempt_at: at(3).toISOString() }); // waits twice as long
      expect(await sendDue(h.db, transport, at(3), options)).toEqual({ sent: 0, retrying: 0, failed: 1 });
      expect(await row()).toMatchObject({ status: 'failed', attempts: 3 });

      const failed = await admin.get('/api/outbox?status=failed');
      const shown = failed.body.notices.find((n: { subject: string }) => n.subject === 'Refused');
      expect(shown).toMatchObject({ status: 'failed', attempts: 3 });
      expect(shown.lastError).toContain('Mailbox unavailable');
    } finally {
      transport.close();
      await new Promise<void>((resolve) => refusing.close(() => resolve()));
    }
  });

  it('moves within the batch window go out as one message per room to the day’s followers, old → new', async () => {
    const plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    const mr3 = plan.rooms.find((r: { name: string }) => r.name === 'MR 3');
    const exam = mr3.exams.find((e: { accession: string }) => e.accession === 'N-3');
    const first = await scheduler.patch(`/api/exams/${exam.id}`, { version: exam.version, start: `${DAY}T11:10:00-06:00` });
    expect(first.status).toBe(200);
    h.clock.advance(1);
    const second = await scheduler.patch(`/api/exams/${exam.id}`, { version: exam.version + 1, start: `${DAY}T11:20:00-06:00` });
    expect(second.status).toBe(200);

    // the window (2 minutes from the first move) is still open
    expect(await queueMoveNotices(h.db, ctx, h.clock.now())).toBe(0);
    h.clock.advance(2);
    // to the charge technologist only: the scheduler made every one of these moves
    expect(await queueMoveNotices(h.db, ctx, h.clock.now())).toBe(1);
    expect(await queueMoveNotices(h.db, ctx, h.clock.now())).toBe(0);
    const moved = await h.db('notices').where({ kind: 'slot-moves' });
    expect(moved).toHaveLength(1);
    expect(JSON.parse(moved[0].recipients)).toEqual(['charge@example.test']);
    expect(moved[0].subject).toBe(`Turnwise: 1 slot moved in MR 3 on ${DAY}`);
    expect(moved[0].text).toContain('N-3: 11:00 → 11:20');
  });

  it('the unsubscribe link turns the notice off without signing in; a forged one is 404', async () => {
    const digest = await h.db('notices').where({ kind: 'import-digest' }).whereLike('recipients', '%charge@%').first();
    const link = /(\/api\/notices\/unsubscribe\?token=[^\s]+)/.exec(digest.text)![1];
    const anonymous = await signedIn(h.app, 'tech'); // any browser; the link needs no account of its own
    await anonymous.post('/api/auth/logout');
    const forged = link.replace(/token=(\d+)\./, 'token=$1x.');
    expect((await anonymous.get(forged)).status).toBe(404);
    const res = await anonymous.get(link);
    expect(res.status).toBe(200);
    expect(res.text).toContain('Notice turned off');
    expect((await charge.get('/api/profile/notices')).body.kinds).toEqual({ 'import-digest': false, 'slot-moves': true, 'day-before': true, 'weekly-summary': true });
  });
});
