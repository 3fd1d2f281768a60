import { signedIn, startHarness, type Client, type Harness } from './harness';

type Day = { weekday: number; closed: boolean; opensAt: string; closesAt: string };

/** Monday to Sunday, each weekday its own hours; `changes` by ISO weekday (1 Monday … 7 Sunday). */
function week(changes: Record<number, Partial<Day>> = {}): Day[] {
  return [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, closed: false, opensAt: '07:00', closesAt: '19:00', ...changes[weekday] }));
}

describe('Setup: a room’s opening hours per weekday', () => {
  let h: Harness;
  let admin: Client;
  let id: number;
  // 2027-03-10 is a Wednesday; the demo site is in America/Chicago (CST, UTC−6, until 14 March 2027)
  const room = { name: 'US 1', modality: 'US', airChangesPerHour: 6, staff: 1, opensAt: '08:00', closesAt: '18:00' };
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z' });
    admin = await signedIn(h.app, 'admin');
    id = (await admin.post('/api/rooms', room)).body.room.id as number;
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  const planRoom = async (day: string) => (await admin.get(`/api/days/${day}/plan`)).body.rooms.find((r: { id: number }) => r.id === id);
  const boardRoom = async () => (await admin.get('/api/days/2027-03-10/board')).body.rooms.find((r: { roomId: number }) => r.roomId === id);

  it('a room without its own week keeps its usual hours every weekday', async () => {
    const setup = (await admin.get('/api/rooms/setup')).body.rooms.find((r: { id: number }) => r.id === id);
    expect(setup.week).toEqual(week(Object.fromEntries([1, 2, 3, 4, 5, 6, 7].map((d) => [d, { opensAt: '08:00', closesAt: '18:00' }]))));
    expect(await planRoom('2027-03-14')).toMatchObject({ closed: false, opensAt: '2027-03-14T08:00:00-05:00', closesAt: '2027-03-14T18:00:00-05:00' });
  });

  it('saves the week; the plan takes each day’s hours from its weekday, a closed weekday is closed on the plan and the board', async () => {
    const before = (await admin.get('/api/days/2027-03-13/plan')).headers['etag'];
    const res = await admin.put(`/api/rooms/${id}`, { ...room, week: week({ 3: { closed: true }, 6: { opensAt: '08:00', closesAt: '12:30' }, 7: { closed: true } }) });
    expect(res.status).toBe(200);
    expect(res.body.room.week[5]).toEqual({ weekday: 6, closed: false, opensAt: '08:00', closesAt: '12:30' });
    // the setup version rose: a cached plan is not served again
    expect((await admin.get('/api/days/2027-03-13/plan')).headers['etag']).not.toBe(before);
    expect(await planRoom('2027-03-13')).toMatchObject({ closed: false, opensAt: '2027-03-13T08:00:00-06:00', closesAt: '2027-03-13T12:30:00-06:00' });
    // Sunday 14 March 2027, the day US clocks go forward: closed, no open hours
    const sunday = await planRoom('2027-03-14');
    expect(sunday.closed).toBe(true);
    expect(sunday.opensAt).toBe(sunday.closesAt);
    expect(await planRoom('2027-03-15')).toMatchObject({ closed: false, opensAt: '2027-03-15T07:00:00-05:00' });
    // today is a Wednesday, closed: 08:00 local would be open on the usual hours (ready), but the room is closed
    expect((await boardRoom()).state).toBe('closed');
    await admin.put(`/api/rooms/${id}`, { ...room, week: week() });
    expect((await boardRoom()).state).toBe('ready');
  });

  it('allows hours over midnight, as the engine reads a closing before the opening (the next day)', async () => {
    const res = await admin.put(`/api/rooms/${id}`, { ...room, week: week({ 5: { opensAt: '18:00', closesAt: '02:00' } }) });
    expect(res.status).toBe(200);
    expect(await planRoom('2027-03-12')).toMatchObject({ opensAt: '2027-03-12T18:00:00-06:00', closesAt: '2027-03-13T02:00:00-06:00' });
  });

  it('refuses a bad week with 422 listing every problem on its field', async () => {
    const bad = week({ 1: { opensAt: '7am' }, 3: { opensAt: '09:00', closesAt: '09:00' } });
    bad[6] = { ...bad[6]!, weekday: 1 };
    const res = await admin.put(`/api/rooms/${id}`, { ...room, week: bad });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field).sort()).toEqual(['week.0.opensAt', 'week.2.closesAt', 'week.6.weekday']);
    const short = await admin.put(`/api/rooms/${id}`, { ...room, week: week().slice(0, 6) });
    expect(short.body.error.details.problems).toEqual([{ field: 'week', message: 'give all seven days, Monday to Sunday' }]);
    // a closed day needs no distinct hours
    expect((await admin.put(`/api/rooms/${id}`, { ...room, week: week({ 7: { closed: true, opensAt: '00:00', closesAt: '00:00' } }) })).status).toBe(200);
  });

  it('writes one audit row per change, with the week before → after', async () => {
    const entries = (await admin.get('/api/audit?limit=100')).body.entries.filter((e: { area: string; subject: string }) => e.area === 'room' && e.subject === 'US 1');
    const last = entries[0];
    expect(last).toMatchObject({ action: 'changed' });
    expect(last.before.week).toContain('Fri 18:00–02:00');
    expect(last.after.week).toContain('Sun closed');
    // the refused change left no row: created + five saves
    expect(entries.map((e: { action: string }) => e.action)).toEqual(['changed', 'changed', 'changed', 'changed', 'created']);
  });

  it('lets only an admin change the week', async () => {
    const charge = await signedIn(h.app, 'charge');
    expect((await charge.put(`/api/rooms/${id}`, { ...room, week: week() })).status).toBe(403);
  });
});
