import { Message } from 'node-hl7-client';
import { appHl7Address } from '../../server/app';
import { queueMoveNotices } from '../../server/services/notices/slot-moves';
import { HL7_LOG_KEEP_DAYS } from '../../shared/api/hl7';
import { DEFAULT_HL7_MAPPING, type Hl7Mapping } from '../../shared/api/hl7-mapping';
import type { SetupRoom } from '../../shared/api/rooms';
import { siu } from '../fixtures/siu-messages';
import { MllpClient } from '../support/mllp-client';
import { signedIn, startHarness, type Client, type Harness } from './harness';

/**
 * The booking feed's site mapping, set up through the API as an admin does in Setup → Site:
 * precaution, mobility, coil and contrast read from the OBX and NTE codes the site names (with
 * its translations of sent values) and from its procedure-code table, never guessed; a room's
 * HL7 location code matched before its name, a notice that follows a feed change, and the
 * interface log's retention. Messages invented. Field positions, each named beside its check:
 * OBX-3 observation identifier and OBX-5 observation value, HL7 v2.5.1 chapter 7; NTE-3 comment,
 * MSA-1/MSA-3 and ERR-3 (table 0357), chapter 2; AIS-3 universal service identifier and AIL-3
 * location resource id, chapter 10. All from memory.
 */
const DAY = '2027-03-12'; // America/Chicago, -06:00
const HOOK_MS = 30_000;

const MAPPING: Hl7Mapping = {
  precaution: { source: 'obx', code: 'TW-PREC', values: [{ sent: 'ISO-AIR', value: 'airborne' }, { sent: 'ISO-C', value: 'contact' }] },
  mobility: { source: 'nte', code: 'Mobility:', values: [{ sent: 'WC', value: 'wheelchair' }] },
  coil: { source: 'obx', code: 'TW-COIL', values: [] },
  contrast: { source: 'obx', code: 'TW-CONTRAST', values: [] },
  procedures: [
    { code: 'MRBRAINC', coil: 'head', contrast: true },
    { code: 'MRLSPINE', coil: 'spine', contrast: null },
  ],
};

describe('HL7 booking feed: the site mapping', () => {
  let h: Harness;
  let feed: MllpClient;
  let admin: Client;
  let charge: Client;

  beforeAll(async () => {
    h = await startHarness({ hl7: { port: 0, host: '127.0.0.1' } });
    feed = await MllpClient.connect((await appHl7Address(h.app))!.port);
    [admin, charge] = await Promise.all([signedIn(h.app, 'admin'), signedIn(h.app, 'charge')]);
  }, HOOK_MS);
  afterAll(async () => {
    await feed?.close();
    await h?.close();
  }, HOOK_MS);

  // MSA-1 acknowledgment code, MSA-3 text, ERR-3.1 error code (chapter 2), read with node-hl7-client rather than our code
  const send = async (message: string) => {
    const ack = new Message({ text: await feed.send(message) });
    return { code: ack.get('MSA.1').toString(), text: ack.get('MSA.3').toString(), error: ack.get('ERR.3.1').toString() };
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
  const auditRows = () => h.db('setup_audit').where({ subject: 'Booking system feed (HL7)' }).orderBy('id');

  it('with nothing set up reads nothing: OBX, NTE and procedure codes the site has not named change nothing', async () => {
    expect((await admin.get('/api/hl7/mapping')).body.mapping).toEqual(DEFAULT_HL7_MAPPING);
    // OBX-3.1 TW-PREC with OBX-5 airborne, an NTE-3 "Mobility: stretcher", AIS-3.1 MRBRAINC
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||airborne', 'OBX|2|ST|TW-COIL^Coil^L||knee', 'NTE|1||Mobility: stretcher'];
    expect((await send(siu('S12', { control: 'M-0', accession: 'MAP-0', start: '202703120700-0600', minutes: 30, room: 'MR 2', procedure: 'MRBRAINC^MR brain^L', extra }))).code).toBe('AA');
    const stored = await exam('MAP-0');
    expect(stored).toMatchObject({ precaution: 'none', mobility: 'ambulatory', coil: null });
    expect(Boolean(stored.contrast)).toBe(false);
  });

  it('an admin saves the mapping: answered as stored, with one setup-audit row per real change', async () => {
    const saved = await admin.put('/api/hl7/mapping', { ...MAPPING, precaution: { ...MAPPING.precaution, values: [{ sent: ' ISO-AIR ', value: 'AIRBORNE' }, MAPPING.precaution.values[1]] } });
    expect(saved.status).toBe(200);
    expect(saved.body.mapping).toEqual(MAPPING);
    expect((await admin.get('/api/hl7/mapping')).body.mapping).toEqual(MAPPING);
    const rows = await auditRows();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ area: 'site', action: 'changed', username: 'admin' });
    expect(Object.keys(JSON.parse(rows[0].after)).sort()).toEqual(['coil', 'contrast', 'mobility', 'precaution', 'procedures']);
    expect((await admin.put('/api/hl7/mapping', MAPPING)).status).toBe(200);
    expect(await auditRows()).toHaveLength(1);
  });

  it('refuses a mapping with a 422 that names every problem at its field, and keeps the one stored', async () => {
    const bad = {
      precaution: { source: 'obx', code: ' ', values: [] },
      mobility: { source: 'nte', code: 'Mobility:', values: [{ sent: 'WC', value: 'rolling' }] },
      coil: { source: 'none', code: '', values: [{ sent: 'K', value: 'knee' }, { sent: 'k', value: 'flex' }] },
      contrast: { source: 'segment', code: 'X', values: [] },
      procedures: [{ code: 'MRKNEE', coil: 'knee', contrast: null }, { code: 'mrknee', coil: null, contrast: true }, { code: '', coil: null, contrast: null }],
    };
    const refused = await admin.put('/api/hl7/mapping', bad);
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('validation_failed');
    const fields = (refused.body.error.details.problems as { field: string }[]).map((p) => p.field).sort();
    expect(fields).toEqual(['coil.values.1.sent', 'contrast.source', 'mobility.values.0.value', 'precaution.code', 'procedures.1.code', 'procedures.2.code', 'procedures.2.coil']);
    expect((await admin.get('/api/hl7/mapping')).body.mapping).toEqual(MAPPING);
    expect(await auditRows()).toHaveLength(1);
  });

  it('reads precaution, coil and contrast from the OBX codes and mobility from the NTE the site named, through its translations', async () => {
    // OBX-3.1 (observation identifier) names the source, OBX-5 (value) is read; NTE-3 after the prefix
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||ISO-AIR', 'OBX|2|ST|TW-COIL^Coil^L||knee', 'OBX|3|ST|TW-CONTRAST^Contrast^L||Y', 'NTE|1||Mobility: WC'];
    expect((await send(siu('S12', { control: 'M-1', accession: 'MAP-1', start: '202703120800-0600', minutes: 30, room: 'MR 1', extra }))).code).toBe('AA');
    const stored = await exam('MAP-1');
    expect(stored).toMatchObject({ precaution: 'airborne', coil: 'knee', mobility: 'wheelchair' });
    expect(Boolean(stored.contrast)).toBe(true);
  });

  it('takes what the procedure-code table says (AIS-3.1, case aside) when no OBX or NTE gives it', async () => {
    const ack = await send(siu('S12', { control: 'M-2', accession: 'MAP-2', start: '202703120900-0600', minutes: 45, room: 'MR 1', procedure: 'MRBRAINC^MR brain with contrast^L' }));
    expect(ack.code).toBe('AA');
    const stored = await exam('MAP-2');
    expect(stored).toMatchObject({ coil: 'head', precaution: 'none', mobility: 'ambulatory', procedure: 'MR brain with contrast' });
    expect(Boolean(stored.contrast)).toBe(true);
    const spine = await send(siu('S12', { control: 'M-3', accession: 'MAP-3', start: '202703121000-0600', minutes: 30, room: 'MR 1', procedure: 'mrlspine^MR lumbar spine^L' }));
    expect(spine.code).toBe('AA');
    const lumbar = await exam('MAP-3');
    expect(lumbar).toMatchObject({ coil: 'spine', mobility: 'ambulatory' });
    expect(Boolean(lumbar.contrast)).toBe(false); // the row says no contrast either way: the import's default
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

  it('refuses with AE (ERR-3 103) a sent value that is neither ours nor translated, says why in MSA-3, and changes nothing', async () => {
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||quarantine'];
    const ack = await send(siu('S12', { control: 'M-6', accession: 'MAP-6', start: '202703121300-0600', minutes: 30, room: 'MR 1', extra }));
    expect(ack.code).toBe('AE');
    expect(ack.error).toBe('103'); // table 0357: table value not found (from memory)
    expect(ack.text).toContain('OBX TW-PREC (OBX-5) sent precaution "quarantine"');
    expect(ack.text).toContain('Setup');
    expect(await exam('MAP-6')).toBeUndefined();
    expect(await h.db('hl7_messages').where({ control_id: 'M-6' }).first()).toMatchObject({ ack_code: 'AE', accession: 'MAP-6' });
  });

  it('a change in Setup holds from the next message on', async () => {
    const off = { ...MAPPING, precaution: { source: 'none', code: '', values: [] } };
    expect((await admin.put('/api/hl7/mapping', off)).status).toBe(200);
    const extra = ['OBX|1|ST|TW-PREC^Isolation^L||quarantine'];
    expect((await send(siu('S12', { control: 'M-6b', accession: 'MAP-6B', start: '202703121330-0600', minutes: 15, room: 'MR 1', extra }))).code).toBe('AA');
    expect(await exam('MAP-6B')).toMatchObject({ precaution: 'none' });
    expect((await admin.put('/api/hl7/mapping', MAPPING)).status).toBe(200);
    const again = ['OBX|1|ST|TW-PREC^Isolation^L||ISO-C'];
    expect((await send(siu('S12', { control: 'M-6c', accession: 'MAP-6C', start: '202703121345-0600', minutes: 15, room: 'MR 1', extra: again }))).code).toBe('AA');
    expect(await exam('MAP-6C')).toMatchObject({ precaution: 'contact' });
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
