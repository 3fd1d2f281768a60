import { Message } from 'node-hl7-client';
import { appHl7Address } from '../../server/app';
import { queueMoveNotices } from '../../server/services/notices/slot-moves';
import { HL7_LOG_KEEP_DAYS } from '../../shared/api/hl7';
import type { SetupRoom } from '../../shared/api/rooms';
import { siu } from '../fixtures/siu-messages';
import { MllpClient } from '../support/mllp-client';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * The booking feed's site mapping: precaution, mobility, coil and contrast read from OBX and NTE
 * codes the site names and from its procedure-code table, a room's HL7 location code matched
 * before its name, a notice that follows a feed change, and the interface log's retention.
 * Messages invented. OBX-3 observation identifier, OBX-5 observation value, NTE-3 comment: HL7
 * v2.5.1 chapter 7 and chapter 2 (from memory); AIS-3 universal service identifier, AIL-3
 * location resource id: chapter 10 (from memory).
 */
const DAY = '2027-03-12'; // America/Chicago, -06:00
const HOOK_MS = 30_000;

const MAPPING = {
  observations: {
    precaution: { obx: 'TW-PREC' },
    mobility: { ntePrefix: 'Mobility:' },
    coil: { obx: 'TW-COIL' },
    contrast: { obx: 'TW-CONTRAST' },
  },
  procedures: {
    MRBRAINC: { contrast: true, coil: 'head' },
    MRSPINE: { mobility: 'stretcher' },
  },
};

describe('HL7 booking feed: the site mapping', () => {
  let h: Harness;
  let feed: MllpClient;
  let admin: Client;
  let charge: Client;

  beforeAll(async () => {
    h = await startHarness({ hl7: { port: 0, host: '127.0.0.1', mapping: MAPPING } });
    feed = await MllpClient.connect((await appHl7Address(h.app))!.port);
    [admin, charge] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge')]);
  }, HOOK_MS);
  afterAll(async () => {
    await feed?.close();
    await h?.close();
  }, HOOK_MS);

  // MSA-1 acknowledgment code, MSA-3 text (chapter 2), read with node-hl7-client rather than our code
  const send = async (message: string) => {
    const ack = new Message({ text: await feed.send(message) });
    return { code: ack.get('MSA.1').toString(), text: ack.get('MSA.3').toString() };
  };
  const exam = (accession: string) => h.db('exams').where({ accession }).first();
  const roomNamed = async (name: string): Promise<SetupRoom> => {
    const rooms: SetupRoom[] = (await admin.get('/api/rooms/setup')).body.rooms;
    return rooms.find((r) => r.name === name)!;
  };
  const saveRoom = (room: SetupRoom, hl7Code: string | null) => {
    const { name, modality, airChangesPerHour, staff, opensAt, closesAt } = room;
    return admin.put(`/api/rooms/${room.id}`, { name, modality, airChangesPerHour, staff, opensAt, closesAt, hl7Code });
  };

  it('reads precaution, coil and contrast from the OBX codes and mobility from the NTE the site named', async () => {
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||contact', 'OBX|2|ST|TW-COIL^Coil^L||knee', 'OBX|3|ST|TW-CONTRAST^Contrast^L||Y', 'NTE|1||Mobility: wheelchair'];
    expect((await send(siu('S12', { control: 'M-1', accession: 'MAP-1', start: '202703120800-0600', minutes: 30, room: 'MR 1', extra }))).code).toBe('AA');
    const stored = await exam('MAP-1');
    expect(stored).toMatchObject({ precaution: 'contact', coil: 'knee', mobility: 'wheelchair' });
    expect(Boolean(stored.contrast)).toBe(true);
  });

  it('takes what the procedure-code table says (AIS-3.1) when no OBX or NTE gives it', async () => {
    const ack = await send(siu('S12', { control: 'M-2', accession: 'MAP-2', start: '202703120900-0600', minutes: 45, room: 'MR 1', procedure: 'MRBRAINC^MR brain with contrast^L' }));
    expect(ack.code).toBe('AA');
    const stored = await exam('MAP-2');
    expect(stored).toMatchObject({ coil: 'head', precaution: 'none', mobility: 'ambulatory', procedure: 'MR brain with contrast' });
    expect(Boolean(stored.contrast)).toBe(true);
    const spine = await send(siu('S12', { control: 'M-3', accession: 'MAP-3', start: '202703121000-0600', minutes: 30, room: 'MR 1', procedure: 'MRSPINE^MR spine^L' }));
    expect(spine.code).toBe('AA');
    expect(await exam('MAP-3')).toMatchObject({ mobility: 'stretcher', coil: null });
  });

  it('an OBX wins over the procedure table; an S14 without them keeps what the exam has', async () => {
    const extra = ['OBX|1|ST|TW-CONTRAST^Contrast^L||N'];
    expect((await send(siu('S12', { control: 'M-4', accession: 'MAP-4', start: '202703121100-0600', minutes: 45, room: 'MR 2', procedure: 'MRBRAINC^MR brain^L', extra }))).code).toBe('AA');
    const stored = await exam('MAP-4');
    expect(Boolean(stored.contrast)).toBe(false);
    expect(stored.coil).toBe('head');
    const modified = await send(siu('S14', { control: 'M-5', accession: 'MAP-4', start: '202703121100-0600', minutes: 45, room: 'MR 2', procedure: 'MRKNEE^MR knee^L' }));
    expect(modified.code).toBe('AA');
    expect(await exam('MAP-4')).toMatchObject({ coil: 'head', procedure: 'MR knee' });
  });

  it('refuses with AE a value the import would refuse, and changes nothing', async () => {
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||quarantine'];
    const ack = await send(siu('S12', { control: 'M-6', accession: 'MAP-6', start: '202703121300-0600', minutes: 30, room: 'MR 1', extra }));
    expect(ack.code).toBe('AE');
    expect(ack.text).toMatch(/precaution/i);
    expect(await exam('MAP-6')).toBeUndefined();
  });

  it("matches AIL-3 to a room's HL7 location code before any room's name; a code two rooms share is refused", async () => {
    const mr3 = await roomNamed('MR 3');
    const saved = await saveRoom(mr3, 'MRI-NORTH');
    expect(saved.status).toBe(200);
    expect(saved.body.room.hl7Code).toBe('MRI-NORTH');
    expect((await send(siu('S12', { control: 'M-7', accession: 'MAP-7', start: '202703121400-0600', minutes: 30, room: 'mri-north' }))).code).toBe('AA');
    expect((await exam('MAP-7')).room_id).toBe(mr3.id);

    // MR 3 answering to "MR 1" takes the message that names MR 1
    expect((await saveRoom(mr3, 'MR 1')).status).toBe(200);
    expect((await send(siu('S12', { control: 'M-8', accession: 'MAP-8', start: '202703121500-0600', minutes: 30, room: 'MR 1' }))).code).toBe('AA');
    expect((await exam('MAP-8')).room_id).toBe(mr3.id);

    const clash = await saveRoom(await roomNamed('MR 2'), 'mr 1');
    expect(clash.status).toBe(422);
    expect(clash.body.error.details.problems).toEqual([expect.objectContaining({ field: 'hl7Code' })]);
    // cleared: names match again
    const cleared = await saveRoom(mr3, '');
    expect(cleared.body.room.hl7Code).toBeNull();
    expect((await send(siu('S12', { control: 'M-9', accession: 'MAP-9', start: '202703121600-0600', minutes: 30, room: 'MR 1' }))).code).toBe('AA');
    expect((await exam('MAP-9')).room_id).not.toBe(mr3.id);
  });

  it("a feed's reschedule reaches the day's followers as a slot-move notice, old → new", async () => {
    expect((await charge.put('/api/profile/notices', { email: 'charge@example.test', kinds: { 'import-digest': false, 'slot-moves': true } })).status).toBe(200);
    const ctx = { publicUrl: 'https://turnwise.example.test', secret: 'test-secret' };
    // everything before is told, so the notice below holds the feed's change alone
    h.clock.advance(5);
    await queueMoveNotices(h.db, ctx, h.clock.now());
    await h.db('notices').where({ kind: 'slot-moves' }).delete();

    const ack = await send(siu('S13', { control: 'M-10', accession: 'MAP-2', start: '202703120930-0600', minutes: 45, room: 'MR 1', sentAt: '20270312080000-0600' }));
    expect(ack.code).toBe('AA');
    h.clock.advance(3); // past the batch window
    expect(await queueMoveNotices(h.db, ctx, h.clock.now())).toBe(1);
    const notice = await h.db('notices').where({ kind: 'slot-moves' }).first();
    expect(JSON.parse(notice.recipients)).toEqual(['charge@example.test']);
    expect(notice.text).toContain('MAP-2: 09:00 → 09:30');
  });

  it(`keeps ${HL7_LOG_KEEP_DAYS} days of the interface log: older messages go as new ones arrive`, async () => {
    const day = 24 * 60 * 60 * 1000;
    const at = (daysAgo: number) => new Date(h.clock.now().getTime() - daysAgo * day).toISOString();
    const row = (control: string, daysAgo: number) => ({ received_at: at(daysAgo), last_received_at: at(daysAgo), sender: 'RIS^OLD', control_id: control, message_type: 'SIU^S12', ack_code: 'AA', outcome: 'old', raw: 'MSH|^~\\&|RIS|OLD' });
    // the test's own rows sort first by id: moved below the feed's rows
    const firstId = (await h.db('hl7_messages').min({ id: 'id' }).first())!.id as number;
    await h.db('hl7_messages').insert([
      { id: firstId - 3, ...row('OLD-1', HL7_LOG_KEEP_DAYS + 30) },
      { id: firstId - 2, ...row('OLD-2', HL7_LOG_KEEP_DAYS + 1) },
      { id: firstId - 1, ...row('KEPT-1', HL7_LOG_KEEP_DAYS - 1) },
    ]);
    expect((await send(siu('S12', { control: 'M-11', accession: 'MAP-11', start: '202703121700-0600', minutes: 30, room: 'MR 2' }))).code).toBe('AA');
    const left = (await h.db('hl7_messages').where('sender', 'RIS^OLD').pluck('control_id')) as string[];
    expect(left).toEqual(['KEPT-1']);
  });
});
