import { signedIn, startHarness, type Harness } from './harness';
import { TURNOVER_STAFF } from '../../shared/api/limits';

describe('rooms and settings API', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(() => h.close());

  it('lists the demo rooms in their order', async () => {
    const tech = await signedIn(h.app, 'tech');
    const res = await tech.get('/api/rooms');
    expect(res.status).toBe(200);
    expect(res.body.rooms.map((r: { name: string }) => r.name)).toEqual(['MR 1', 'MR 2', 'MR 3', 'CT 1']);
  });

  it('creates a room (201) with defaults for opening hours', async () => {
    const admin = await signedIn(h.app, 'admin');
    const res = await admin.post('/api/rooms', { name: 'US 1', modality: 'US', airChangesPerHour: 6, staff: 1 });
    expect(res.status).toBe(201);
    expect(res.body.room).toMatchObject({ name: 'US 1', modality: 'US', airChangesPerHour: 6, staff: 1, opensAt: '07:00' });
  });

  it.each([
    // DICOM PS3.3 C.7.3.1.1.1 defines modality codes; "MRI" is not one of them.
    [{ name: 'X', modality: 'MRI', airChangesPerHour: 6, staff: 1 }, 'modality'],
    [{ name: 'X', modality: 'MR', airChangesPerHour: 0, staff: 1 }, 'airChangesPerHour'],
    [{ name: 'X', modality: 'MR', airChangesPerHour: 61, staff: 1 }, 'airChangesPerHour'],
    [{ name: 'X', modality: 'MR', airChangesPerHour: 6, staff: TURNOVER_STAFF.max + 1 }, 'staff'], // one limit with the staffing routes
    [{ name: 'X', modality: 'MR', airChangesPerHour: 6, staff: 1.5 }, 'staff'],
    [{ name: '', modality: 'MR', airChangesPerHour: 6, staff: 1 }, 'name'],
  ])('refuses %j with 422 naming %s', async (body, field) => {
    const admin = await signedIn(h.app, 'admin');
    const res = await admin.post('/api/rooms', body);
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field)).toContain(field);
  });

  it('refuses a duplicate room name, whatever its case (422)', async () => {
    const admin = await signedIn(h.app, 'admin');
    const res = await admin.post('/api/rooms', { name: 'mr 1', modality: 'MR', airChangesPerHour: 6, staff: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/already exists/);
  });

  it('reads and updates settings with an IANA zone', async () => {
    const admin = await signedIn(h.app, 'admin');
    expect((await admin.get('/api/settings')).body.settings).toMatchObject({ timezone: 'America/Chicago', snugMarginMinutes: 3 });
    const res = await admin.put('/api/settings', { timezone: 'Europe/Berlin', snugMarginMinutes: 5 });
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ timezone: 'Europe/Berlin', snugMarginMinutes: 5 });
    expect((await admin.get('/api/settings')).body.settings.timezone).toBe('Europe/Berlin');
  });

  it('refuses a time zone that is not in the IANA database (422) and keeps the old one', async () => {
    const admin = await signedIn(h.app, 'admin');
    const before = (await admin.get('/api/settings')).body.settings;
    const res = await admin.put('/api/settings', { timezone: 'Mars/Olympus', snugMarginMinutes: 3 });
    expect(res.status).toBe(422);
    expect((await admin.get('/api/settings')).body.settings).toEqual(before);
  });
});
