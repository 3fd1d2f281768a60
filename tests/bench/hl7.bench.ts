import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { appHl7Address } from '../../server/app';
import { DEMO_PASSWORD } from '../../seeds/support/demo-accounts';
import { startHarness } from '../api/harness';
import { siu } from '../fixtures/siu-messages';
import { MllpClient } from '../support/mllp-client';

const DAYS = ['2027-03-15', '2027-03-16', '2027-03-17', '2027-03-18', '2027-03-19'];
const ROOMS = ['MR 1', 'MR 2', 'MR 3'];
const BOOKINGS = 500;
const LATENCY_SAMPLES = 20;

const ts = (day: string, minutes: number) => `${day.replaceAll('-', '')}${String(7 + Math.floor(minutes / 60)).padStart(2, '0')}${String(minutes % 60).padStart(2, '0')}-0500`;

/**
 * HL7 booking feed: 1,000 SIU messages (500 S12 bookings, then an S13 reschedule of each) over
 * one MLLP connection, each sent after the previous ACK as MLLP senders do; then the time from
 * writing an S13 to its event on an open SSE stream of the day (`GET /api/days/:date/events`).
 */
export async function benchHl7(): Promise<string[]> {
  const h = await startHarness({ hl7: { port: 0, host: '127.0.0.1' } });
  const server = h.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const feed = await MllpClient.connect((await appHl7Address(h.app))!.port);
  let stream: http.ClientRequest | undefined;
  try {
    const messages: string[] = [];
    for (let i = 0; i < BOOKINGS; i++) {
      const day = DAYS[i % DAYS.length]!;
      const slot = Math.floor(i / DAYS.length);
      const room = ROOMS[slot % ROOMS.length]!;
      const at = Math.floor(slot / ROOMS.length) * 20;
      messages.push(siu('S12', { control: `B-${i}`, accession: `BENCH-${i}`, start: ts(day, at % 660), minutes: 15, room }));
      messages.push(siu('S13', { control: `R-${i}`, accession: `BENCH-${i}`, start: ts(day, (at + 5) % 660), minutes: 15, room, sentAt: '20270315060000-0500' }));
    }
    const ordered = [...messages.filter((_, i) => i % 2 === 0), ...messages.filter((_, i) => i % 2 === 1)];
    let refused = 0;
    const started = performance.now();
    for (const message of ordered) if (!(await feed.send(message)).includes('MSA|AA|')) refused++;
    const seconds = (performance.now() - started) / 1000;
    const lines = [`hl7: ${ordered.length} SIU messages (S12 then S13) over one MLLP connection in ${seconds.toFixed(2)} s: ${(ordered.length / seconds).toFixed(0)} messages/s applied (${refused} not AA)`];

    const cookie = await signIn(base);
    const day = DAYS[0]!;
    const heard: (() => void)[] = [];
    await new Promise<void>((ready, fail) => {
      stream = http.get(`${base}/api/days/${day}/events`, { headers: { Cookie: cookie } }, (res) => {
        res.setEncoding('utf8');
        res.on('data', (text: string) => {
          if (text.includes('retry:')) ready();
          if (text.includes('"hl7"')) heard.splice(0).forEach((hear) => hear());
        });
      });
      stream.on('error', fail);
    });
    const times: number[] = [];
    for (let n = 0; n < LATENCY_SAMPLES; n++) {
      const event = new Promise<void>((resolve) => heard.push(resolve));
      const t0 = performance.now();
      await feed.write(Buffer.concat([Buffer.from([0x0b]), Buffer.from(siu('S13', { control: `L-${n}`, accession: 'BENCH-0', start: ts(day, 300 + n * 20), minutes: 15, room: 'MR 1', sentAt: `202703150${7 + Math.floor(n / 60)}${String(n % 60).padStart(2, '0')}00-0500` })), Buffer.from([0x1c, 0x0d])]));
      await event;
      times.push(performance.now() - t0);
      await feed.next();
    }
    times.sort((a, b) => a - b);
    lines.push(`hl7: message written → its SSE event: median ${times[Math.floor(times.length / 2)]!.toFixed(1)} ms, max ${times.at(-1)!.toFixed(1)} ms (${LATENCY_SAMPLES} S13)`);
    return lines;
  } finally {
    stream?.destroy();
    await feed.close();
    await new Promise((resolve) => server.close(resolve));
    await h.close();
  }
}

async function signIn(base: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => res.headers.getSetCookie().forEach((c) => jar.set(c.split(';')[0]!.split('=')[0]!, c.split(';')[0]!.split('=')[1]!));
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  keep(await fetch(`${base}/api/health`));
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Cookie: cookie(), 'X-XSRF-TOKEN': decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') },
    body: JSON.stringify({ username: 'scheduler', password: DEMO_PASSWORD }),
  });
  if (login.status !== 200) throw new Error(`bench sign-in failed: ${login.status}`);
  keep(login);
  return cookie();
}

if (require.main === module) {
  benchHl7().then((lines) => lines.forEach((line) => console.log(line)), (err) => {
    console.error(err);
    process.exit(1);
  });
}
