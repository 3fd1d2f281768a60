import { signedIn, startHarness, type Client, type Harness } from './harness';

describe('Setup: rooms, equipment, kits, site and audit', () => {
  let h: Harness;
  let admin: Client;
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z' });
    admin = await signedIn(h.app, 'admin');
  });
  afterAll(() => h.close());

  const roomId = async (name: string) => (await h.db('rooms').where({ name }).first('id')).id as number;
  const ct = { name: 'CT 2', modality: 'CT', airChangesPerHour: 12, staff: 1, opensAt: '08:00', closesAt: '18:00' };

  it('edits a room: name, modality, air changes, staff and hours; the plan shows it', async () => {
    const made = await admin.post('/api/rooms', ct);
    const id = made.body.room.id as number;
    const res = await admin.put(`/api/rooms/${id}`, { ...ct, name: 'CT 2 (new)', airChangesPerHour: 15, staff: 2, opensAt: '07:30', closesAt: '20:00' });
    expect(res.status).toBe(200);
    expect(res.body.room).toMatchObject({ id, name: 'CT 2 (new)', airChangesPerHour: 15, staff: 2, opensAt: '07:30', closesAt: '20:00', retired: false });
    const plan = await admin.get('/api/days/2027-03-12/plan');
    expect(plan.status).toBe(200);
    expect(JSON.stringify(plan.body)).toContain('CT 2 (new)');
  });

  it.each([
    [{ modality: 'MRI' }, 'modality'], // DICOM PS3.3 C.7.3.1.1.1 modality codes: "MRI" is not one
    [{ airChangesPerHour: 0 }, 'airChangesPerHour'],
    [{ opensAt: '7am' }, 'opensAt'],
    [{ opensAt: '18:00', closesAt: '08:00' }, 'closesAt'],
    [{ name: 'mr 1' }, 'name'],
  ])('refuses a room edit %j with 422 naming %s', async (change, field) => {
    const id = await roomId('CT 1');
    const res = await admin.put(`/api/rooms/${id}`, { ...ct, name: 'CT 1', ...change });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field)).toContain(field);
  });

  it('retires a room without history loss: off the room list, board and plan, still in Setup; refused while exams are booked', async () => {
    const busy = await admin.post(`/api/rooms/${await roomId('MR 1')}/retire`, {});
    expect([busy.status, busy.body.error.code]).toEqual([409, 'room_has_exams']);
    expect(busy.body.error.details.count).toBeGreaterThan(0);

    const id = await roomId('CT 2 (new)');
    const res = await admin.post(`/api/rooms/${id}/retire`, {});
    expect(res.body.room).toMatchObject({ retired: true, retiredAt: '2027-03-10T14:00:00.000Z' });
    expect(await h.db('rooms').where({ id }).first('id')).toBeDefined();
    const names = (r: { body: { rooms: { name: string }[] } }) => r.body.rooms.map((x) => x.name);
    expect(names(await admin.get('/api/rooms'))).not.toContain('CT 2 (new)');
    expect(names(await admin.get('/api/days/2027-03-10/board'))).not.toContain('CT 2 (new)');
    expect(JSON.stringify((await admin.get('/api/days/2027-03-12/plan')).body)).not.toContain('CT 2 (new)');
    expect((await admin.get('/api/rooms/setup')).body.rooms.find((r: { id: number }) => r.id === id)).toMatchObject({ retired: true });

    const back = await admin.post(`/api/rooms/${id}/restore`, {});
    expect(back.body.room.retired).toBe(false);
    expect(names(await admin.get('/api/rooms'))).toContain('CT 2 (new)');
  });

  it('keeps equipment with its ASTM F2503 marking; MR Conditional needs its conditions', async () => {
    const bad = await admin.post('/api/equipment', { name: 'Cart', kind: 'cart', marking: 'mr-conditional' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems).toEqual([{ field: 'conditions', message: 'an MR Conditional item needs its conditions from the label' }]);
    const res = await admin.post('/api/equipment', { name: 'Plastic cart', kind: 'cart', marking: 'mr-conditional', conditions: '3 T or less; spatial gradient 20 T/m or less' });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({ name: 'Plastic cart', kind: 'cart', marking: 'mr-conditional', retired: false, roomIds: [] });
    expect((await admin.post('/api/equipment', { name: 'X', kind: 'trolley', marking: 'safe-ish' })).body.error.details.problems.map((p: { field: string }) => p.field)).toEqual(['kind', 'marking']);
  });

  it('an MR room’s kit refuses MR Unsafe and unmarked items with 422 naming ASTM F2503 and Zone IV; a CT room takes them', async () => {
    const add = async (name: string, kind: string, marking: string) => (await admin.post('/api/equipment', { name, kind, marking })).body.item.id as number;
    const safeMop = await add('Fibreglass mop', 'mop', 'mr-safe');
    const steelBucket = await add('Steel bucket', 'bucket', 'mr-unsafe');
    const bottle = await add('Spray bottle (unknown)', 'spray-bottle', 'not-marked');
    const mr = await roomId('MR 2');

    const refused = await admin.put(`/api/rooms/${mr}/kit`, { equipmentIds: [safeMop, steelBucket, bottle] });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('kit_not_mr_safe');
    // ASTM F2503 marking; ACR Guidance Document on MR Safe Practices (2013): Zone IV is the magnet room
    expect(refused.body.error.message).toMatch(/ASTM F2503/);
    expect(refused.body.error.message).toMatch(/Zone IV/);
    expect(refused.body.error.details.items.map((i: { name: string }) => i.name)).toEqual(['Steel bucket', 'Spray bottle (unknown)']);
    expect((await admin.get(`/api/rooms/${mr}/kit`)).body.kit).toEqual([]);

    const ok = await admin.put(`/api/rooms/${mr}/kit`, { equipmentIds: [safeMop] });
    expect(ok.body.kit.map((i: { name: string }) => i.name)).toEqual(['Fibreglass mop']);
    const tech = await signedIn(h.app, 'tech');
    expect((await tech.get(`/api/rooms/${mr}/kit`)).body.kit[0]).toMatchObject({ name: 'Fibreglass mop', marking: 'mr-safe' });

    const ctRoom = await roomId('CT 1');
    expect((await admin.put(`/api/rooms/${ctRoom}/kit`, { equipmentIds: [steelBucket] })).status).toBe(200);
    // the rule cannot be side-stepped: re-marking a kit item, or making its room MR
    const remark = await admin.put(`/api/equipment/${safeMop}`, { name: 'Fibreglass mop', kind: 'mop', marking: 'not-marked' });
    expect([remark.status, remark.body.error.code]).toEqual([422, 'kit_not_mr_safe']);
    const toMr = await admin.put(`/api/rooms/${ctRoom}`, { name: 'CT 1', modality: 'MR', airChangesPerHour: 12, staff: 1, opensAt: '07:00', closesAt: '19:00' });
    expect([toMr.status, toMr.body.error.code]).toEqual([422, 'kit_not_mr_safe']);

    const retired = await admin.post(`/api/equipment/${safeMop}/retire`, {});
    expect(retired.body.item).toMatchObject({ retired: true, roomIds: [] });
    expect((await admin.get(`/api/rooms/${mr}/kit`)).body.kit).toEqual([]);
  });

  it('site: name, IANA zone, snug margin and the notices e-mail sender', async () => {
    const res = await admin.put('/api/settings', { siteName: 'North Imaging', timezone: 'America/Chicago', snugMarginMinutes: 4, noticesSender: 'imaging-notices@example.org' });
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ siteName: 'North Imaging', snugMarginMinutes: 4, noticesSender: 'imaging-notices@example.org' });
    const bad = await admin.put('/api/settings', { timezone: 'America/Chicago', snugMarginMinutes: 4, noticesSender: 'not an address' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field)).toEqual(['noticesSender']);
  });

  it('lists every setup change newest first, paged, with before → after', async () => {
    const all = (await admin.get('/api/audit?limit=100')).body;
    expect(all.total).toBe(all.entries.length);
    const ids = all.entries.map((e: { id: number }) => e.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    expect(all.entries[0]).toMatchObject({ area: 'site', action: 'changed', by: { username: 'admin' }, after: { siteName: 'North Imaging', snugMarginMinutes: 4 } });
    const areas = new Set(all.entries.map((e: { area: string }) => e.area));
    expect([...areas].sort()).toEqual(['equipment', 'kit', 'room', 'site']);
    expect(all.entries.find((e: { action: string; subject: string }) => e.action === 'changed' && e.subject === 'CT 2 (new)')).toMatchObject({
      before: { name: 'CT 2', airChangesPerHour: 12 },
      after: { name: 'CT 2 (new)', airChangesPerHour: 15 },
    });
    // refused changes leave no row
    expect(all.entries.filter((e: { area: string; subject: string }) => e.area === 'kit' && e.subject === 'MR 2')).toHaveLength(1);

    const page2 = (await admin.get('/api/audit?limit=3&offset=3')).body;
    expect(page2.entries.map((e: { id: number }) => e.id)).toEqual(ids.slice(3, 6));
    expect((await admin.get('/api/audit?limit=0')).status).toBe(422);
  });
});
