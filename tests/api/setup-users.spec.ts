import { client, DEMO_PASSWORD, signedIn, startHarness, type Client, type Harness } from './harness';

const FIRST = 'first-password-12';
const OWN = 'my-own-password-34';

/** Signs in with a username and password; the client and the answer. */
async function signIn(h: Harness, username: string, password: string): Promise<{ c: Client; status: number; body: { user?: { mustChangePassword?: boolean } } }> {
  const c = await client(h.app);
  const res = await c.post('/api/auth/login', { username, password });
  return { c, status: res.status, body: res.body };
}

describe('Setup: users', () => {
  let h: Harness;
  let admin: Client;
  beforeAll(async () => {
    h = await startHarness();
    admin = await signedIn(h.app, 'admin');
  });
  afterAll(() => h.close());

  /** Stored sessions signed in as the user (`sess` is text on SQLite, json on PostgreSQL). */
  const sessionsOf = async (id: number) =>
    ((await h.db('sessions').select('sess')) as { sess: unknown }[]).filter((r) => (typeof r.sess === 'string' ? JSON.parse(r.sess) : r.sess)?.passport?.user === id).length;
  const newUser = (username: string, role = 'tech') => admin.post('/api/users', { username, displayName: `Person ${username}`, email: `${username}@example.org`, role, password: FIRST });

  it('creates a user with role, name and e-mail, who must change the first password', async () => {
    const res = await newUser('rtaylor');
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ username: 'rtaylor', displayName: 'Person rtaylor', email: 'rtaylor@example.org', role: 'tech', active: true, mustChangePassword: true });
    expect(JSON.stringify(res.body)).not.toMatch(/scrypt|password_hash/);
    const list = await admin.get('/api/users');
    expect(list.body.users.map((u: { username: string }) => u.username)).toContain('rtaylor');
  });

  it('refuses a taken username (any case), a short password and a bad e-mail, naming each field (422)', async () => {
    const taken = await newUser('RTAYLOR');
    expect(taken.status).toBe(422);
    expect(taken.body.error.details.problems).toEqual([{ field: 'username', message: 'already taken' }]);
    const bad = await admin.post('/api/users', { username: 'x y', displayName: '', email: 'nope', role: 'boss', password: 'short' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field).sort()).toEqual(['displayName', 'email', 'password', 'role', 'username']);
  });

  it('gates a user whose password must change: 403 password_change_required everywhere but the profile, then free', async () => {
    await newUser('gated');
    const { c, status, body } = await signIn(h, 'gated', FIRST);
    expect(status).toBe(200);
    expect(body.user?.mustChangePassword).toBe(true);
    const refused = await c.get('/api/days/2027-03-10/plan');
    expect([refused.status, refused.body.error.code]).toEqual([403, 'password_change_required']);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await c.get('/api/profile')).status).toBe(200);

    const wrong = await c.put('/api/profile/password', { currentPassword: 'not-it-at-all', newPassword: OWN });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.details.problems[0].field).toBe('currentPassword');
    const same = await c.put('/api/profile/password', { currentPassword: FIRST, newPassword: FIRST });
    expect(same.body.error.details.problems[0].field).toBe('newPassword');

    const changed = await c.put('/api/profile/password', { currentPassword: FIRST, newPassword: OWN });
    expect(changed.status).toBe(200);
    expect(changed.body.user.mustChangePassword).toBe(false);
    expect((await c.get('/api/days/2027-03-10/plan')).status).toBe(200);
    expect((await signIn(h, 'gated', OWN)).status).toBe(200);
    expect((await signIn(h, 'gated', FIRST)).status).toBe(401);
  });

  it('states the password policy: fewer than 12 characters is refused', async () => {
    const c = await signedIn(h.app, 'scheduler');
    const res = await c.put('/api/profile/password', { currentPassword: DEMO_PASSWORD, newPassword: '11-chars-xx' });
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems).toEqual([{ field: 'newPassword', message: 'use at least 12 characters' }]);
  });

  it('a reset ends the user’s sessions and makes them change the new password at next sign-in', async () => {
    const { body } = await newUser('resetme');
    const id = body.user.id as number;
    const first = await signIn(h, 'resetme', FIRST);
    await first.c.put('/api/profile/password', { currentPassword: FIRST, newPassword: OWN });
    expect((await first.c.get('/api/rooms')).status).toBe(200);

    const reset = await admin.post(`/api/users/${id}/password`, { password: 'reset-password-56' });
    expect(reset.status).toBe(200);
    expect(reset.body.user.mustChangePassword).toBe(true);
    expect((await first.c.get('/api/rooms')).status).toBe(401);
    const again = await signIn(h, 'resetme', 'reset-password-56');
    expect(again.body.user?.mustChangePassword).toBe(true);
    expect((await again.c.get('/api/rooms')).body.error.code).toBe('password_change_required');
  });

  it('deactivating ends every session of that user at once: their next request is 401, and they cannot sign in', async () => {
    const { body } = await newUser('leaver');
    const id = body.user.id as number;
    const one = await signIn(h, 'leaver', FIRST);
    const two = await signIn(h, 'leaver', FIRST);
    expect(await sessionsOf(id)).toBe(2);

    const res = await admin.post(`/api/users/${id}/deactivate`, {});
    expect([res.status, res.body.user.active]).toEqual([200, false]);
    expect(await sessionsOf(id)).toBe(0);
    expect((await one.c.get('/api/profile')).status).toBe(401);
    expect((await two.c.get('/api/auth/me')).status).toBe(401);
    expect((await signIn(h, 'leaver', FIRST)).status).toBe(401);

    expect((await admin.post(`/api/users/${id}/reactivate`, {})).body.user.active).toBe(true);
    expect((await signIn(h, 'leaver', FIRST)).status).toBe(200);
  });

  it('changes a role; the user’s next request has the new role', async () => {
    const { body } = await newUser('mover', 'frontdesk');
    const { c } = await signIn(h, 'mover', FIRST);
    await c.put('/api/profile/password', { currentPassword: FIRST, newPassword: OWN });
    expect((await c.get('/api/log?date=2027-03-10')).status).toBe(403);
    const res = await admin.patch(`/api/users/${body.user.id}`, { role: 'charge' });
    expect(res.body.user.role).toBe('charge');
    expect((await c.get('/api/log?date=2027-03-10')).status).toBe(200);
  });

  it('never removes or demotes the last active admin (409 last_admin); with a second admin it may', async () => {
    const self = (await admin.get('/api/profile')).body.user.id as number;
    const demote = await admin.patch(`/api/users/${self}`, { role: 'tech' });
    expect([demote.status, demote.body.error.code]).toEqual([409, 'last_admin']);
    const deactivate = await admin.post(`/api/users/${self}/deactivate`, {});
    expect([deactivate.status, deactivate.body.error.code]).toEqual([409, 'last_admin']);
    expect((await admin.get('/api/profile')).body.user).toMatchObject({ role: 'admin', active: true });

    const second = await newUser('deputy', 'admin');
    const demoteOther = await admin.patch(`/api/users/${second.body.user.id}`, { role: 'scheduler' });
    expect(demoteOther.status).toBe(200);
    await admin.patch(`/api/users/${second.body.user.id}`, { role: 'admin' });
    const now = await admin.patch(`/api/users/${self}`, { displayName: 'Still admin' });
    expect(now.status).toBe(200);
  });

  it('a production install creates its accounts from the first admin (no demo accounts needed)', async () => {
    const { c } = await signIn(h, 'deputy', FIRST);
    await c.put('/api/profile/password', { currentPassword: FIRST, newPassword: OWN });
    const made = await c.post('/api/users', { username: 'frontdesk2', displayName: 'Desk Two', email: 'desk2@example.org', role: 'frontdesk', password: FIRST });
    expect(made.status).toBe(201);
  });

  it('every user change is one audit row: who, what, before → after, never a password', async () => {
    const res = await admin.get('/api/audit?limit=100');
    const rows = res.body.entries as { area: string; action: string; subject: string; by: { username: string }; before: unknown; after: unknown }[];
    expect(rows.find((r) => r.subject === 'mover' && r.action === 'role changed')).toMatchObject({ area: 'user', by: { username: 'admin' }, before: { role: 'frontdesk' }, after: { role: 'charge' } });
    expect(rows.find((r) => r.subject === 'leaver' && r.action === 'deactivated')).toMatchObject({ before: { active: true }, after: { active: false } });
    expect(rows.find((r) => r.subject === 'resetme' && r.action === 'password reset')).toBeDefined();
    expect(JSON.stringify(rows)).not.toMatch(/first-password|reset-password|scrypt/);
  });
});
