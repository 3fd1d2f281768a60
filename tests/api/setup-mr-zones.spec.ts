import { signedIn, startHarness, type Client, type Harness } from './harness';

// The four zones are the ACR's (ACR Manual on MR Safety; ACR Guidance Document on MR Safe
// Practices, 2013): I public, II reception/screening, III restricted and access-controlled, IV the magnet room.
describe('Setup: an MR room’s zone layout', () => {
  let h: Harness;
  let admin: Client;
  beforeAll(async () => {
    h = await startHarness({ now: '2027-03-10T14:00:00Z' });
    admin = await signedIn(h.app, 'admin');
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  const room = async (name: string) => (await admin.get('/api/rooms/setup')).body.rooms.find((r: { name: string }) => r.name === name);
  const fields = (r: { body: { error: { details: { problems: { field: string }[] } } } }) => r.body.error.details.problems.map((p) => p.field);

  it('saves where the kit is kept and what is Zone IV; the kit answer carries it for every signed-in role', async () => {
    const mr = await room('MR 2');
    expect(mr.mrZones).toBeNull();
    const { id, name, modality, airChangesPerHour, staff, opensAt, closesAt } = mr;
    const zones = { kitKeptIn: 'zone-iii', zoneIvAreas: 'Magnet room, door M2 from the control room', notes: 'Kit cart parks in the control room alcove.' };
    const res = await admin.put(`/api/rooms/${id}`, { name, modality, airChangesPerHour, staff, opensAt, closesAt, mrZones: zones });
    expect(res.status).toBe(200);
    expect(res.body.room.mrZones).toEqual(zones);
    const tech = await signedIn(h.app, 'tech');
    const kit = await tech.get(`/api/rooms/${id}/kit`);
    expect(kit.status).toBe(200);
    expect(kit.body.mrZones).toEqual(zones);
    const audit = (await admin.get('/api/audit?limit=5')).body.entries[0];
    expect(audit).toMatchObject({ area: 'room', action: 'changed', subject: 'MR 2' });
    expect(audit.after.mrZones).toContain('kit kept in Zone III');
  });

  it('refuses a zone layout for a room that is not MR, and an unknown zone, with 422 on the field', async () => {
    const ct = await room('CT 1');
    const base = { name: ct.name, modality: ct.modality, airChangesPerHour: ct.airChangesPerHour };
    const notMr = await admin.put(`/api/rooms/${ct.id}`, { ...base, mrZones: { kitKeptIn: 'zone-iii' } });
    expect(notMr.status).toBe(422);
    expect(fields(notMr)).toEqual(['mrZones']);
    const mr = await room('MR 1');
    const zoneV = await admin.put(`/api/rooms/${mr.id}`, { name: mr.name, modality: 'MR', airChangesPerHour: 12, mrZones: { kitKeptIn: 'zone-v', notes: 'x'.repeat(501) } });
    expect(fields(zoneV).sort()).toEqual(['mrZones.kitKeptIn', 'mrZones.notes']);
    // the kit answer of a room that is not MR has no layout
    expect((await admin.get(`/api/rooms/${ct.id}/kit`)).body.mrZones).toBeNull();
  });
});
