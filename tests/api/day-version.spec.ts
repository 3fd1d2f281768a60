import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { dayVersion } from '../../server/services/day-version';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10'; // America/Chicago, -06:00
const t = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
const row = (acc: string, room: string, start: string) => [acc, room, start, '30', 'MR exam', 'knee', 'none', 'ambulatory', 'no', ''];
const list = (...rows: string[][]) => toCsv([EXAM_LIST_HEADER, ...rows]);
const importUrl = (query = '') => `/api/days/${DAY}/exams/import${query}`;

describe('day versions: the plan cache, its ETag, and an import bound to its preview', () => {
  let h: Harness;
  let scheduler: Client;
  let charge: Client;
  beforeEach(async () => {
    h = await startHarness();
    scheduler = await signedIn(h.app, 'scheduler');
    charge = await signedIn(h.app, 'charge');
    expect((await scheduler.upload(importUrl(), list(row('M-1', 'MR 1', '08:00'), row('M-2', 'MR 1', '08:40')), 'day.csv')).status).toBe(200);
  }, 30_000);
  afterEach(() => h.close(), 30_000);

  const examId = async (accession: string) => (await h.db('exams').where({ day: DAY, accession }).first()) as { id: number; version: number };

  it('rises with every change to the day, by any path, and only for that day', async () => {
    const v0 = await dayVersion(h.db, DAY);
    expect(v0).toBeGreaterThan(0);
    const m2 = await examId('M-2');
    await h.db('exams').where({ id: m2.id }).update({ notes: 'raw write' });
    const v1 = await dayVersion(h.db, DAY);
    expect(v1).toBeGreaterThan(v0);
    const user = await h.db('users').first();
    await h.db('gap_staffing').insert({ to_exam_id: m2.id, staff: 2, user_id: user.id, updated_at: new Date().toISOString() });
    const v2 = await dayVersion(h.db, DAY);
    expect(v2).toBeGreaterThan(v1);
    await h.db('exams').where({ id: m2.id }).delete();
    expect(await dayVersion(h.db, DAY)).toBeGreaterThan(v2);
    expect(await dayVersion(h.db, '2027-03-11')).toBe(0);
  });

  it('serves an unchanged plan with the same ETag, 304 on revalidation, and a new one after a move', async () => {
    const first = await charge.get(`/api/days/${DAY}/plan`);
    expect(first.status).toBe(200);
    expect(first.headers['etag']).toMatch(/^"[\w-]+"$/);
    expect(first.headers['cache-control']).toBe('private, no-cache');
    const again = await charge.get(`/api/days/${DAY}/plan`);
    expect(again.headers['etag']).toBe(first.headers['etag']);
    expect(again.body).toEqual(first.body);
    const revalidated = await charge.agent.get(`/api/days/${DAY}/plan`).set('If-None-Match', first.headers['etag']);
    expect(revalidated.status).toBe(304);

    const m2 = await examId('M-2');
    expect((await charge.patch(`/api/exams/${m2.id}`, { start: t('09:30'), version: m2.version, reason: 'drag' })).status).toBe(200);
    const after = await charge.get(`/api/days/${DAY}/plan`);
    expect(after.headers['etag']).not.toBe(first.headers['etag']);
    const moved = after.body.rooms.flatMap((r: { exams: { accession: string; start: string }[] }) => r.exams).find((e: { accession: string }) => e.accession === 'M-2');
    expect(moved.start).toBe(t('09:30'));
    expect((await charge.agent.get(`/api/days/${DAY}/plan`).set('If-None-Match', first.headers['etag'])).status).toBe(200);
  });

  it('a new plan follows a room staffing change (the setup is part of the key)', async () => {
    const room = (await h.db('rooms').where({ name: 'MR 1' }).first()) as { id: number };
    const m2 = await examId('M-2');
    const required = async () =>
      (await charge.get(`/api/days/${DAY}/plan`)).body.rooms
        .find((r: { id: number }) => r.id === room.id)
        .gaps.find((g: { toExamId: number }) => g.toExamId === m2.id).requiredMinutes;
    expect((await charge.patch(`/api/rooms/${room.id}/staffing`, { staff: 1 })).status).toBe(200);
    // The product brief's default MR turnover: 20 min for one person, 14 for two.
    expect(await required()).toBe(20);
    expect((await charge.patch(`/api/rooms/${room.id}/staffing`, { staff: 2 })).status).toBe(200);
    expect(await required()).toBe(14);
  });

  it('a new plan follows a settings change, even one written straight to the database', async () => {
    const first = await charge.get(`/api/days/${DAY}/plan`);
    await h.db('settings').insert({ key: 'snugMarginMinutes', value: '30' }).onConflict('key').merge();
    const after = await charge.get(`/api/days/${DAY}/plan`);
    expect(after.headers['etag']).not.toBe(first.headers['etag']);
    const m2 = await examId('M-2');
    const gap = after.body.rooms.flatMap((r: { gaps: { toExamId: number; verdict: string }[] }) => r.gaps).find((g: { toExamId: number }) => g.toExamId === m2.id);
    expect(gap.verdict).not.toBe('fits');
  });

  it('an import commit refuses (409 day_changed) when a slot moved after its preview, and keeps the move', async () => {
    const file = list(row('M-1', 'MR 1', '08:00'), row('M-2', 'MR 1', '08:40'), row('M-3', 'MR 1', '11:00'));
    const preview = await scheduler.upload(importUrl('?dryRun=true'), file, 'day.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.added).toEqual(['M-3']);
    expect(preview.body.changed).toEqual([]);

    const m2 = await examId('M-2');
    expect((await charge.patch(`/api/exams/${m2.id}`, { start: t('09:30'), version: m2.version, reason: 'drag' })).status).toBe(200);

    const commit = await scheduler.upload(importUrl(`?dayVersion=${preview.body.dayVersion}`), file, 'day.csv');
    expect(commit.status).toBe(409);
    expect(commit.body.error.code).toBe('day_changed');
    expect(commit.body.error.details).toEqual({ previewedVersion: preview.body.dayVersion, currentVersion: expect.any(Number) });
    expect((await examId('M-2')).version).toBe(m2.version + 1);
    expect(await h.db('exams').where({ day: DAY, accession: 'M-3' }).first()).toBeUndefined();

    // Previewed again, the file now shows both changes, and commits.
    const again = await scheduler.upload(importUrl('?dryRun=true'), file, 'day.csv');
    expect(again.body.changed).toEqual([expect.objectContaining({ accession: 'M-2', fields: ['start'] })]);
    expect((await scheduler.upload(importUrl(`?dayVersion=${again.body.dayVersion}`), file, 'day.csv')).status).toBe(200);
  });

  it('refuses a dayVersion that is not a whole number', async () => {
    const res = await scheduler.upload(importUrl('?dayVersion=abc'), list(row('M-1', 'MR 1', '08:00')), 'day.csv');
    expect(res.status).toBe(422);
  });
});
