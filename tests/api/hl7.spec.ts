import { Message } from 'node-hl7-client';
import { appHl7Address } from '../../server/app';
import { DayEvents } from '../../server/services/day-events';
import type { DayEvent } from '../../shared/api/changes';
import type { Hl7LogMessage, Hl7LogPage } from '../../shared/api/hl7';
import { INVENTED_PATIENT, siu } from '../fixtures/siu-messages';
import { frame, MllpClient } from '../support/mllp-client';
import { signedIn, startHarness, type Client, type Harness } from './harness';

// America/Chicago (the demo site): -06:00 until clocks skip 02:00 → 03:00 on 14 March 2027, then -05:00.
const DAY = '2027-03-12';
const DST_DAY = '2027-03-14';

interface Ack {
  code: string;
  controlId: string;
  text: string;
  error: string;
  raw: string;
}

/** Reads an ACK with node-hl7-client's parser (not the server's code). */
function readAck(text: string): Ack {
  const ack = new Message({ text });
  return {
    code: ack.get('MSA.1').toString(), // MSA-1 acknowledgment code (v2.5.1 chapter 2)
    controlId: ack.get('MSA.2').toString(), // MSA-2 message control id: the message's MSH-10
    text: ack.get('MSA.3').toString(), // MSA-3 text message: why
    error: ack.get('ERR.3.1').toString(), // ERR-3 HL7 error code (table 0357)
    raw: text,
  };
}

describe('HL7 v2 SIU booking feed over MLLP', () => {
  let h: Harness;
  let port: number;
  let feed: MllpClient;
  let admin: Client;
  let scheduler: Client;
  const heard: DayEvent[] = [];
  const events = new DayEvents();
  let stop: () => void;

  beforeAll(async () => {
    h = await startHarness({ events, hl7: { port: 0, host: '127.0.0.1' } });
    stop = events.subscribe(DAY, (e) => heard.push(e));
    port = (await appHl7Address(h.app))!.port;
    feed = await MllpClient.connect(port);
    admin = await signedIn(h.app, 'admin');
    scheduler = await signedIn(h.app, 'scheduler');
  }, 30_000);
  afterAll(async () => {
    stop?.();
    await feed?.close();
    await h?.close();
  }, 30_000);

  const send = async (message: string) => readAck(await feed.send(message));
  const exam = (accession: string) => h.db('exams').where({ accession }).first();
  const roomName = async (id: number) => (await h.db('rooms').where({ id }).first('name')).name as string;
  const logOf = async (control: string): Promise<Hl7LogMessage> => {
    const row = await h.db('hl7_messages').where({ control_id: control }).first('id');
    return (await admin.get(`/api/hl7/messages/${row.id}`)).body;
  };

  it('books an exam from S12 and acknowledges it AA with MSA-2 = MSH-10; the plan, history and live stream show it', async () => {
    heard.length = 0;
    const ack = await send(siu('S12', { control: 'C-100', accession: 'HL-1', start: '202703120915-0600', minutes: 45, room: 'MR 1' }));
    expect(ack).toMatchObject({ code: 'AA', controlId: 'C-100' });
    // the ACK's own header: MSH-9 ACK^S12^ACK (chapter 2)
    expect(new Message({ text: ack.raw }).get('MSH.9.1').toString()).toBe('ACK');
    const stored = await exam('HL-1');
    expect(stored).toMatchObject({ day: DAY, start_at: '2027-03-12T09:15:00-06:00', duration_minutes: 45, procedure: 'MR knee' });
    expect(await roomName(stored.room_id)).toBe('MR 1');
    // not given in the message and no source set up: the import's defaults, never a guess
    expect(stored).toMatchObject({ precaution: 'none', mobility: 'ambulatory', coil: null });
    expect(Boolean(stored.contrast)).toBe(false);
    const plan = await scheduler.get(`/api/days/${DAY}/plan`);
    expect(plan.body.rooms.flatMap((r: { exams: { accession: string }[] }) => r.exams.map((e) => e.accession))).toContain('HL-1');
    const history = (await scheduler.get(`/api/days/${DAY}/history`)).body;
    expect(history.changes[0]).toMatchObject({ reason: 'hl7', displayName: 'Booking system (HL7)' });
    expect(history.changes[0].summary).toMatch(/^Added HL-1: MR 1 09:15, 45 min/);
    expect(heard).toContainEqual(expect.objectContaining({ date: DAY, kind: 'plan', reason: 'hl7' }));
  });

  it('acknowledges a repeated control id again and applies it once', async () => {
    const message = siu('S12', { control: 'C-101', accession: 'HL-2', start: '202703121000-0600', minutes: 30, room: 'MR 2' });
    expect((await send(message)).code).toBe('AA');
    const changes = (await h.db('plan_changes').count({ n: '*' }).first())!.n;
    const again = await send(message);
    expect(again).toMatchObject({ code: 'AA', controlId: 'C-101' });
    expect(await h.db('exams').where({ accession: 'HL-2' }).count({ n: '*' }).first()).toEqual({ n: 1 });
    expect((await h.db('plan_changes').count({ n: '*' }).first())!.n).toBe(changes);
    expect((await logOf('C-101')).timesReceived).toBe(2);
  });

  it('reschedules (S13), modifies (S14), and takes exams off for S15, S17 and S26', async () => {
    expect((await send(siu('S12', { control: 'C-110', accession: 'HL-3', start: '202703121100-0600', minutes: 30, room: 'MR 1' }))).code).toBe('AA');
    expect((await send(siu('S13', { control: 'C-111', accession: 'HL-3', start: '202703121230-0600', minutes: 30, room: 'MR 2', sentAt: '20270312071000-0600' }))).code).toBe('AA');
    let stored = await exam('HL-3');
    expect(stored.start_at).toBe('2027-03-12T12:30:00-06:00');
    expect(await roomName(stored.room_id)).toBe('MR 2');
    expect((await send(siu('S14', { control: 'C-112', accession: 'HL-3', start: '202703121230-0600', minutes: 50, room: 'MR 2', sentAt: '20270312072000-0600' }))).code).toBe('AA');
    stored = await exam('HL-3');
    expect(stored).toMatchObject({ duration_minutes: 50, start_at: '2027-03-12T12:30:00-06:00' });

    for (const [event, accession, control] of [['S15', 'HL-4', 'C-120'], ['S17', 'HL-5', 'C-130'], ['S26', 'HL-6', 'C-140']] as const) {
      expect((await send(siu('S12', { control: `${control}a`, accession, start: '202703121400-0600', minutes: 20, room: 'MR 3' }))).code).toBe('AA');
      expect(await exam(accession)).toBeDefined();
      const ack = await send(siu(event, { control, accession, status: event === 'S26' ? 'Noshow' : 'Cancelled', sentAt: '20270312080000-0600' }));
      expect(ack).toMatchObject({ code: 'AA', controlId: control });
      expect(await exam(accession)).toBeUndefined();
    }
    const history = (await scheduler.get(`/api/days/${DAY}/history`)).body.changes as { summary: string; reason: string }[];
    expect(history.find((c) => c.summary.startsWith('Cancelled HL-6'))).toMatchObject({ reason: 'hl7', summary: expect.stringContaining('(no-show)') });
  });

  it('refuses a modification (S14) before its booking (S12) with AE and MSA-3, then takes both in order', async () => {
    const before = await send(siu('S14', { control: 'C-150', accession: 'HL-7', start: '202703121500-0600', minutes: 30, room: 'MR 1' }));
    expect(before).toMatchObject({ code: 'AE', controlId: 'C-150', error: '204' });
    expect(before.text).toMatch(/HL-7 is not on the plan.*S12/);
    expect(await exam('HL-7')).toBeUndefined();
    expect((await send(siu('S12', { control: 'C-151', accession: 'HL-7', start: '202703121500-0600', minutes: 30, room: 'MR 1' }))).code).toBe('AA');
    expect((await send(siu('S14', { control: 'C-152', accession: 'HL-7', start: '202703121500-0600', minutes: 40, room: 'MR 1', sentAt: '20270312071500-0600' }))).code).toBe('AA');
    expect((await exam('HL-7')).duration_minutes).toBe(40);
  });

  it('refuses an unknown room, another modality and a stale message with AE and MSA-3 saying why', async () => {
    const unknown = await send(siu('S12', { control: 'C-160', accession: 'HL-8', start: '202703121600-0600', minutes: 30, room: 'MR 9' }));
    expect(unknown).toMatchObject({ code: 'AE', controlId: 'C-160', error: '204' });
    expect(unknown.text).toContain('Unknown room "MR 9"');
    expect(await exam('HL-8')).toBeUndefined();

    expect((await send(siu('S12', { control: 'C-161', accession: 'HL-9', start: '202703121600-0600', minutes: 30, room: 'MR 1', sentAt: '20270312090000-0600' }))).code).toBe('AA');
    const other = await send(siu('S13', { control: 'C-162', accession: 'HL-9', start: '202703121600-0600', minutes: 30, room: 'CT 1', sentAt: '20270312091000-0600' }));
    expect(other.code).toBe('AE');
    expect(other.text).toContain('CT 1 is a CT room');
    const stale = await send(siu('S13', { control: 'C-163', accession: 'HL-9', start: '202703121700-0600', minutes: 30, room: 'MR 1', sentAt: '20270312085000-0600' }));
    expect(stale.code).toBe('AE');
    expect(stale.text).toMatch(/^Stale/);
    expect((await exam('HL-9')).start_at).toBe('2027-03-12T16:00:00-06:00');
  });

  it('rejects what is not an SIU message with AR (chapter 2: unsupported message type 200, unreadable)', async () => {
    const adt = await send('MSH|^~\\&|ADT|INVENTED|TURNWISE|IMG|20270312070000||ADT^A01|C-170|P|2.5.1\rPID|1||X||Invented^Person');
    expect(adt).toMatchObject({ code: 'AR', controlId: 'C-170', error: '200' });
    const junk = await send('this is not HL7');
    expect(junk).toMatchObject({ code: 'AR', controlId: '' });
    expect(junk.text).toContain('MSH');
  });

  it('flags a move of an exam someone moved by hand after the last message', async () => {
    expect((await send(siu('S12', { control: 'C-180', accession: 'HL-10', start: '202703120800-0600', minutes: 30, room: 'MR 3', sentAt: '20270312060000-0600' }))).code).toBe('AA');
    const stored = await exam('HL-10');
    const moved = await scheduler.patch(`/api/exams/${stored.id}`, { start: '2027-03-12T08:40:00-06:00', version: stored.version, reason: 'drag' });
    expect(moved.status).toBe(200);
    const ack = await send(siu('S13', { control: 'C-181', accession: 'HL-10', start: '202703120900-0600', minutes: 30, room: 'MR 3', sentAt: '20270312061000-0600' }));
    expect(ack.code).toBe('AA');
    expect((await exam('HL-10')).start_at).toBe('2027-03-12T09:00:00-06:00');
    const log = await logOf('C-181');
    expect(log).toMatchObject({ afterManualChange: true, ackCode: 'AA' });
    const history = (await scheduler.get(`/api/days/${DAY}/history`)).body.changes[0];
    expect(history).toMatchObject({ reason: 'hl7', afterManualChange: true });
    expect(history.summary).toContain('moved by the booking system after a manual change');
    // a later message with no hand move between is not flagged
    await send(siu('S13', { control: 'C-182', accession: 'HL-10', start: '202703120930-0600', minutes: 30, room: 'MR 3', sentAt: '20270312062000-0600' }));
    expect((await logOf('C-182')).afterManualChange).toBe(false);
    const after = (await scheduler.get(`/api/days/${DAY}/history`)).body.changes;
    expect(after[0]).toMatchObject({ reason: 'hl7', afterManualChange: false });
    expect(after.find((c: { reason: string }) => c.reason === 'drag')).toMatchObject({ afterManualChange: false });
  });

  it('reads a message split across TCP packets, even between 0x1C and 0x0D', async () => {
    const bytes = frame(siu('S12', { control: 'C-190', accession: 'HL-11', start: '202703121800-0600', minutes: 20, room: 'MR 1' }));
    const answer = feed.next();
    const pause = () => new Promise((resolve) => setTimeout(resolve, 20));
    await feed.write(bytes.subarray(0, 30));
    await pause();
    await feed.write(bytes.subarray(30, bytes.length - 1));
    await pause();
    await feed.write(bytes.subarray(bytes.length - 1));
    expect(readAck(await answer)).toMatchObject({ code: 'AA', controlId: 'C-190' });
    expect(await exam('HL-11')).toBeDefined();
  });

  it('survives garbage, an unterminated frame and a silent half frame; other connections keep working', async () => {
    const garbage = await MllpClient.connect(port);
    const endless = await MllpClient.connect(port);
    const silent = await MllpClient.connect(port);
    try {
      await garbage.write(Buffer.from([0x00, 0xff, 0x1c, 0x0d, 0x41, 0x1c, 0x42]));
      await silent.write(Buffer.concat([Buffer.from([0x0b]), Buffer.from('MSH|^~\\&|RIS|INVENTED|TURNWISE|IMG|')]));
      // one start block and more than the 1 MB frame limit without an end block: that connection is closed
      await endless.write(Buffer.concat([Buffer.from([0x0b]), Buffer.alloc(1024 * 1024 + 10, 0x41)])).catch(() => {});
      await endless.closed;
      expect(endless.destroyed).toBe(true);
      const other = await MllpClient.connect(port);
      try {
        const ack = readAck(await other.send(siu('S12', { control: 'C-200', accession: 'HL-12', start: '202703121830-0600', minutes: 15, room: 'MR 2' })));
        expect(ack).toMatchObject({ code: 'AA', controlId: 'C-200' });
      } finally {
        await other.close();
      }
      // the garbage connection is still served once it sends a real frame
      expect(readAck(await garbage.send(siu('S12', { control: 'C-201', accession: 'HL-13', start: '202703121845-0600', minutes: 10, room: 'MR 2' }))).code).toBe('AA');
      expect(silent.destroyed).toBe(false);
    } finally {
      await Promise.all([garbage.close(), endless.close(), silent.close()]);
    }
  });

  it('reads times on a DST day with and without an offset, and refuses a local time the change skips', async () => {
    // no offset: site time on its date; 08:30 on 14 March 2027 is CDT (-05:00)
    expect((await send(siu('S12', { control: 'C-210', accession: 'HL-14', start: '202703140830', minutes: 30, room: 'MR 1' }))).code).toBe('AA');
    expect(await exam('HL-14')).toMatchObject({ day: DST_DAY, start_at: '2027-03-14T08:30:00-05:00' });
    // with an offset: that instant; 08:30-06:00 is 09:30 CDT
    expect((await send(siu('S12', { control: 'C-211', accession: 'HL-15', start: '202703140830-0600', minutes: 30, room: 'MR 2' }))).code).toBe('AA');
    expect(await exam('HL-15')).toMatchObject({ day: DST_DAY, start_at: '2027-03-14T09:30:00-05:00' });
    const skipped = await send(siu('S12', { control: 'C-212', accession: 'HL-16', start: '202703140230', minutes: 30, room: 'MR 3' }));
    expect(skipped.code).toBe('AE');
    expect(skipped.text).toContain('02:30 does not exist on 2027-03-14');
  });

  it('logs every message without its patient segments; the log is paged and admin-only', async () => {
    const log = await logOf('C-100');
    expect(log).toMatchObject({ messageType: 'SIU^S12', ackCode: 'AA', sender: 'RIS^INVENTED', accession: 'HL-1', day: DAY });
    expect(log.outcome).toMatch(/^Added HL-1/);
    expect(log.raw).toMatch(/^MSH\|/);
    expect(log.raw).toContain('\rSCH|');
    expect(log.raw).not.toMatch(/(^|\r)PID\|/);
    expect(log.raw).not.toContain(INVENTED_PATIENT.family);
    expect(log.raw).not.toContain(INVENTED_PATIENT.birth);
    const refused = await logOf('C-160');
    expect(refused).toMatchObject({ ackCode: 'AE', changeId: null, outcome: expect.stringContaining('Unknown room') });

    const first: Hl7LogPage = (await admin.get('/api/hl7/messages?limit=3')).body;
    expect(first.messages).toHaveLength(3);
    expect(first.listener).toEqual({ host: '127.0.0.1', port });
    const second: Hl7LogPage = (await admin.get(`/api/hl7/messages?limit=3&before=${first.before}`)).body;
    expect(second.messages[0]!.id).toBeLessThan(first.messages[2]!.id);
    expect((await admin.get('/api/hl7/messages?limit=0')).status).toBe(422);
    expect((await scheduler.get('/api/hl7/messages')).status).toBe(403);
  });
});
