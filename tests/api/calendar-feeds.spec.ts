import ICAL from 'ical.js';
import { DateTime } from 'luxon';
import { FEED_MISSES_PER_WINDOW } from '../../server/routes/calendar';
import { ruleOccurrences } from '../../server/services/shift-task-rules';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { client, signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * Calendar feeds, read back with an independent parser (ical.js) and checked against RFC 5545,
 * section named beside each check. Invented exams on the harness's today in America/Chicago,
 * whose clocks spring forward on 2027-03-14 (inside the window the shift tasks are expanded over).
 */
const DAY = '2027-03-10';
const ZONE = 'America/Chicago';
const PUBLIC_URL = 'https://turnwise.example.test';
const HOOK_MS = 30_000;
// long and with two-octet characters, so lines must fold and the fold must count octets
const LONG_PROCEDURE = 'MR knee, left, with the extended cartilage mapping sequence and a second série for the ménisque';

function row(acc: string, room: string, start: string, dur: number, procedure = 'MR exam') {
  return [acc, room, start, String(dur), procedure, 'knee', 'none', 'ambulatory', 'no', ''];
}

const LIST = toCsv([EXAM_LIST_HEADER, row('CF-1', 'MR 1', '09:00', 30, LONG_PROCEDURE), row('CF-2', 'MR 1', '09:50', 30), row('CF-3', 'MR 1', '11:00', 30)]);

interface Parsed {
  text: string;
  cal: ICAL.Component;
  events: ICAL.Component[];
}

/** The feed at a URL the API handed out, read by a client with no session (a calendar app). */
async function fetchFeed(c: Client, url: string): Promise<{ status: number; type: string; parsed: Parsed | null }> {
  const res = await c.get(url.replace(PUBLIC_URL, '')).buffer(true).parse((r, done) => {
    let text = '';
    r.setEncoding('utf8');
    r.on('data', (chunk: string) => (text += chunk));
    r.on('end', () => done(null, text));
  });
  if (res.status !== 200) return { status: res.status, type: String(res.headers['content-type']), parsed: null };
  const text = res.body as string;
  const cal = new ICAL.Component(ICAL.parse(text));
  return { status: 200, type: String(res.headers['content-type']), parsed: { text, cal, events: cal.getAllSubcomponents('vevent') } };
}

const byUid = (p: Parsed, uid: string) => p.events.find((e) => e.getFirstPropertyValue('uid') === uid);

describe('calendar feeds', () => {
  let h: Harness;
  let charge: Client;
  let tech: Client;
  let scheduler: Client;
  let app: Client;
  let feeds: { label: string; url: string }[];
  const examId = async (accession: string) => (await h.db('exams').where({ day: DAY, accession }).first('id', 'version')) as { id: number; version: number };
  const roomFeedUrl = () => feeds.find((f) => f.label === 'MR 1')!.url;

  beforeAll(async () => {
    h = await startHarness({ publicUrl: PUBLIC_URL });
    [charge, tech, scheduler] = await Promise.all([signedIn(h.app, 'charge'), signedIn(h.app, 'tech'), signedIn(h.app, 'scheduler')]);
    app = await client(h.app);
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, LIST, 'feeds.csv')).status).toBe(200);
    const rotated = await charge.post('/api/profile/calendar/rotate', {});
    expect(rotated.status).toBe(200);
    feeds = rotated.body.feeds;
  }, HOOK_MS);
  afterAll(() => h.close(), HOOK_MS);

  it('shows whether feeds are on, never the address', async () => {
    const status = await charge.get('/api/profile/calendar');
    expect(status.body).toEqual({ active: true, createdAt: expect.any(String), lastUsedAt: null });
    expect(JSON.stringify(status.body)).not.toContain('/api/calendar/');
    expect(feeds[0]).toEqual({ label: 'My shift tasks and rooms', url: expect.stringMatching(/^https:\/\/turnwise\.example\.test\/api\/calendar\/[A-Za-z0-9_-]{43}\/mine\.ics$/) });
  });

  it('serves a room feed without a session as text/calendar in UTF-8', async () => {
    const feed = await fetchFeed(app, roomFeedUrl());
    expect(feed.status).toBe(200);
    expect(feed.type).toBe('text/calendar; charset=utf-8');
    expect(feed.parsed!.events.length).toBeGreaterThanOrEqual(3);
  });

  it('every event has UID and DTSTAMP (RFC 5545 §3.6.1), DTSTAMP in UTC (§3.8.7.2)', async () => {
    const { parsed } = await fetchFeed(app, roomFeedUrl());
    for (const event of parsed!.events) {
      expect(event.getFirstPropertyValue('uid')).toEqual(expect.stringMatching(/@turnwise\.example\.test$/));
      expect(event.getFirstProperty('dtstamp')).not.toBeNull();
    }
    expect(parsed!.text).toMatch(/^DTSTAMP:\d{8}T\d{6}Z\r$/m);
    expect(parsed!.text).not.toMatch(/^DTSTAMP:\d{8}T\d{6}\r$/m);
  });

  it('ends every line in CRLF and folds lines at 75 octets (RFC 5545 §3.1)', async () => {
    const { parsed } = await fetchFeed(app, roomFeedUrl());
    const text = parsed!.text;
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text).not.toMatch(/[^\r]\n/);
    expect(text).not.toMatch(/\r(?!\n)/);
    const lines = text.slice(0, -2).split('\r\n');
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    // the long procedure did need folding, and unfolding gives it back whole
    expect(lines.some((l) => l.startsWith(' '))).toBe(true);
    const cf1 = await examId('CF-1');
    expect(byUid(parsed!, `exam-${cf1.id}@turnwise.example.test`)!.getFirstPropertyValue('summary')).toBe(`CF-1 ${LONG_PROCEDURE}`);
  });

  it('writes local times with a TZID whose VTIMEZONE is in the feed (RFC 5545 §3.6.5), DTEND exclusive (§3.6.1)', async () => {
    const { parsed } = await fetchFeed(app, roomFeedUrl());
    const zones = parsed!.cal.getAllSubcomponents('vtimezone').map((z) => z.getFirstPropertyValue('tzid'));
    for (const event of parsed!.events) {
      for (const name of ['dtstart', 'dtend']) {
        const tzid = event.getFirstProperty(name)!.getParameter('tzid');
        expect(tzid).toBe(ZONE);
        expect(zones).toContain(tzid);
      }
    }
    const cf1 = await examId('CF-1');
    const exam = new ICAL.Event(byUid(parsed!, `exam-${cf1.id}@turnwise.example.test`)!);
    expect(exam.startDate.toString()).toBe('2027-03-10T09:00:00');
    // a 30-minute exam from 09:00 ends at 09:30, the first minute it no longer takes
    expect(exam.endDate.toString()).toBe('2027-03-10T09:30:00');
    // the turnover after CF-1 ends at its ready-at time and starts its required minutes before
    const cf2 = await examId('CF-2');
    const turnover = new ICAL.Event(byUid(parsed!, `turnover-${cf1.id}-${cf2.id}@turnwise.example.test`)!);
    const plan = (await charge.get(`/api/days/${DAY}/plan`)).body;
    const gap = plan.rooms.flatMap((r: { gaps: { toExamId: number; readyAt: string; requiredMinutes: number }[] }) => r.gaps).find((g: { toExamId: number }) => g.toExamId === cf2.id);
    expect(DateTime.fromISO(turnover.endDate.toString(), { zone: ZONE }).toMillis()).toBe(Date.parse(gap.readyAt));
    expect(turnover.duration.toSeconds()).toBe(gap.requiredMinutes * 60);
  });

  it('raises SEQUENCE when an exam moves (RFC 5545 §3.8.7.4), keeping its UID', async () => {
    const cf2 = await examId('CF-2');
    const uid = `exam-${cf2.id}@turnwise.example.test`;
    const before = byUid((await fetchFeed(app, roomFeedUrl())).parsed!, uid)!;
    const moved = await scheduler.patch(`/api/exams/${cf2.id}`, { start: `${DAY}T10:10:00-06:00`, version: cf2.version, reason: 'drag' });
    expect(moved.status).toBe(200);
    const after = byUid((await fetchFeed(app, roomFeedUrl())).parsed!, uid)!;
    expect(Number(after.getFirstPropertyValue('sequence'))).toBeGreaterThan(Number(before.getFirstPropertyValue('sequence')));
    expect(new ICAL.Event(after).startDate.toString()).toBe('2027-03-10T10:10:00');
  });

  it('keeps a cancelled exam as STATUS:CANCELLED (RFC 5545 §3.8.1.11) with a higher SEQUENCE', async () => {
    const cf3 = await examId('CF-3');
    const uid = `exam-${cf3.id}@turnwise.example.test`;
    const before = byUid((await fetchFeed(app, roomFeedUrl())).parsed!, uid)!;
    expect(before.getFirstPropertyValue('status')).toBe('CONFIRMED');
    expect((await scheduler.delete(`/api/exams/${cf3.id}?version=${cf3.version}`)).status).toBeLessThan(300);
    const after = byUid((await fetchFeed(app, roomFeedUrl())).parsed!, uid)!;
    expect(after.getFirstPropertyValue('status')).toBe('CANCELLED');
    expect(Number(after.getFirstPropertyValue('sequence'))).toBeGreaterThan(Number(before.getFirstPropertyValue('sequence')));
  });

  it('gives each shift task an RRULE whose occurrences are the app’s own (RFC 5545 §3.3.10), across the spring-forward change', async () => {
    const rotated = await tech.post('/api/profile/calendar/rotate', {});
    const { parsed } = await fetchFeed(app, rotated.body.feeds[0].url);
    const tasks = parsed!.events.filter((e) => String(e.getFirstPropertyValue('uid')).startsWith('shift-task-'));
    const stored: { id: number; rrule: string }[] = await h.db('shift_tasks').where({ active: true }).select('id', 'rrule');
    expect(tasks).toHaveLength(stored.length);
    for (const vtz of parsed!.cal.getAllSubcomponents('vtimezone')) ICAL.TimezoneService.register(vtz);
    const from = '2027-03-08';
    const to = '2027-03-22';
    const end = DateTime.fromISO(to, { zone: ZONE }).toMillis();
    const begin = DateTime.fromISO(from, { zone: ZONE }).toMillis();
    for (const component of tasks) {
      expect(component.getFirstProperty('rrule')).not.toBeNull();
      const id = Number(/^shift-task-(\d+)@/.exec(String(component.getFirstPropertyValue('uid')))![1]);
      const event = new ICAL.Event(component);
      const theirs: number[] = [];
      const it = event.iterator();
      for (let next = it.next(); next && next.toJSDate().getTime() < end; next = it.next()) {
        if (next.toJSDate().getTime() >= begin) theirs.push(next.toJSDate().getTime());
      }
      const ours = ruleOccurrences(stored.find((s) => s.id === id)!.rrule, { zone: ZONE, from, to }).map((d) => d.toMillis());
      expect(theirs.length).toBeGreaterThan(0);
      expect(theirs).toEqual(ours);
    }
  });

  it('answers 404 for a revoked, a rotated-away and an unknown token', async () => {
    const old = roomFeedUrl();
    expect((await fetchFeed(app, old)).status).toBe(200);
    const again = await charge.post('/api/profile/calendar/rotate', {});
    expect((await fetchFeed(app, old)).status).toBe(404);
    const fresh = again.body.feeds.find((f: { label: string }) => f.label === 'MR 1').url as string;
    expect((await fetchFeed(app, fresh)).status).toBe(200);
    expect((await charge.delete('/api/profile/calendar')).status).toBe(204);
    expect((await fetchFeed(app, fresh)).status).toBe(404);
    expect((await charge.get('/api/profile/calendar')).body.active).toBe(false);
    expect((await fetchFeed(app, `${PUBLIC_URL}/api/calendar/${'A'.repeat(43)}/mine.ics`)).status).toBe(404);
  });

  // last: it spends this address's allowance for the rest of the file
  it('throttles an address that keeps asking for unknown tokens (429 too_many_attempts), not the token routes', async () => {
    const unknown = (n: number) => `/api/calendar/${n.toString().padStart(43, 'B')}/mine.ics`;
    const statuses: number[] = [];
    for (let n = 1; n <= FEED_MISSES_PER_WINDOW; n++) statuses.push((await app.get(unknown(n))).status);
    // the tests above asked for a few unknown tokens of their own from this address
    expect(statuses.filter((s) => s === 404).length).toBeGreaterThan(FEED_MISSES_PER_WINDOW - 10);
    expect(statuses.filter((s) => s !== 404 && s !== 429)).toEqual([]);
    const throttled = await app.get(unknown(FEED_MISSES_PER_WINDOW + 1));
    expect(throttled.status).toBe(429);
    expect(throttled.body.error.code).toBe('too_many_attempts');
    expect((await charge.get('/api/profile/calendar')).status).toBe(200);
  });
});
