import request from 'supertest';
import { client, DEMO_PASSWORD, signedIn, startHarness, type Harness } from './harness';

describe('auth API', () => {
  let h: Harness;
  beforeEach(async () => {
    h = await startHarness();
  });
  afterEach(() => h.close());

  it('answers 401 to /me before sign-in and the user after', async () => {
    const c = await client(h.app);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    const login = await c.post('/api/auth/login', { username: 'charge', password: DEMO_PASSWORD });
    expect(login.status).toBe(200);
    expect(login.body.user).toMatchObject({ username: 'charge', role: 'charge' });
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ username: 'charge', role: 'charge' });
  });

  it('refuses a wrong password and an unknown user with the same status and message', async () => {
    const c = await client(h.app);
    const wrong = await c.post('/api/auth/login', { username: 'charge', password: 'nope' });
    const unknown = await c.post('/api/auth/login', { username: 'nobody', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error.message).toBe('Wrong username or password.');
  });

  it('runs the same password hash work for unknown users as for wrong passwords (timing class)', async () => {
    // Both paths must call scrypt exactly once; we count calls instead of timing them.
    const crypto = jest.requireActual('node:crypto') as typeof import('node:crypto');
    const spy = jest.spyOn(crypto, 'scrypt');
    const c = await client(h.app);
    await c.post('/api/auth/login', { username: 'charge', password: 'nope' });
    const afterWrong = spy.mock.calls.length;
    await c.post('/api/auth/login', { username: 'nobody', password: 'nope' });
    const unknownCalls = spy.mock.calls.length - afterWrong;
    spy.mockRestore();
    expect(afterWrong).toBeGreaterThanOrEqual(1);
    expect(unknownCalls).toBe(1);
  });

  it('ends the session at logout', async () => {
    const c = await signedIn(h.app, 'tech');
    const cookies = (await c.get('/api/auth/me')).request.cookies as unknown as string;
    expect((await c.post('/api/auth/logout')).status).toBe(204);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    // the old cookie, replayed, no longer names a session
    expect((await request(h.app).get('/api/auth/me').set('Cookie', cookies)).status).toBe(401);
  });

  it('sets an httpOnly known-device cookie at sign-in, sent only to the sign-in routes', async () => {
    const c = await client(h.app);
    const res = await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD });
    const device = (res.headers['set-cookie'] as unknown as string[]).find((v) => v.startsWith('turnwise.device'));
    expect(device).toMatch(/HttpOnly/i);
    expect(device).toMatch(/Path=\/api\/auth/i);
    expect(device).toMatch(/SameSite=Lax/i);
    const failed = await c.post('/api/auth/login', { username: 'tech', password: 'nope' });
    expect((failed.headers['set-cookie'] as unknown as string[] | undefined)?.some((v) => v.startsWith('turnwise.device')) ?? false).toBe(false);
  });

  it('issues a new session id at sign-in (no session fixation)', async () => {
    const c = await client(h.app);
    await c.post('/api/auth/login', { username: 'nobody', password: 'x' });
    const first = await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD });
    const sid1 = (first.headers['set-cookie'] as unknown as string[]).find((v) => v.startsWith('turnwise.sid='));
    const second = await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD });
    const sid2 = (second.headers['set-cookie'] as unknown as string[]).find((v) => v.startsWith('turnwise.sid='));
    expect(sid1).toBeDefined();
    expect(sid2).toBeDefined();
    expect(sid2!.split(';')[0]).not.toBe(sid1!.split(';')[0]);
  });

  it('sets an httpOnly, SameSite=Lax session cookie', async () => {
    const c = await client(h.app);
    const res = await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD });
    const sid = (res.headers['set-cookie'] as unknown as string[]).find((v) => v.startsWith('turnwise.sid='))!;
    expect(sid).toMatch(/HttpOnly/i);
    expect(sid).toMatch(/SameSite=Lax/i);
  });

  it('keeps the session across a server restart on the same database file', async () => {
    const c = await signedIn(h.app, 'scheduler');
    const cookies = (await c.get('/api/auth/me')).request.cookies as unknown as string;
    await h.restart();
    const res = await request(h.app).get('/api/auth/me').set('Cookie', cookies);
    expect(res.status).toBe(200);
    expect(res.body.user.username).toBe('scheduler');
  });

  it('refuses a state-changing request without the XSRF header (403)', async () => {
    const c = await client(h.app);
    const res = await c.agent.post('/api/auth/login').send({ username: 'tech', password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('xsrf_failed');
    const forged = await c.agent.post('/api/auth/login').set('X-XSRF-TOKEN', 'forged').send({ username: 'tech', password: DEMO_PASSWORD });
    expect(forged.status).toBe(403);
  });

  it('throttles after the allowed number of failed sign-ins with a clear message', async () => {
    await h.close();
    h = await startHarness({ signInLimits: { perAccount: 3, perAddress: 30 } });
    const c = await client(h.app);
    for (let i = 0; i < 3; i++) expect((await c.post('/api/auth/login', { username: 'tech', password: 'bad' })).status).toBe(401);
    const blocked = await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/Too many failed sign-ins/);
  });

  it('validates the sign-in body (422) and rejects malformed JSON (400) without a stack trace', async () => {
    const c = await client(h.app);
    const empty = await c.post('/api/auth/login', {});
    expect(empty.status).toBe(422);
    const bad = await c.agent.post('/api/auth/login').set('X-XSRF-TOKEN', c.token).set('Content-Type', 'application/json').send('{"username":');
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('lists demo accounts only in demo mode', async () => {
    const demo = await request(h.app).get('/api/auth/demo-accounts');
    expect(demo.status).toBe(200);
    expect(demo.body.accounts.map((a: { role: string }) => a.role).sort()).toEqual(['admin', 'charge', 'frontdesk', 'scheduler', 'tech']);
    expect(demo.body.password).toBe(DEMO_PASSWORD);
    // read from the table the demo seed writes: a deactivated demo user is no longer offered
    await h.db('users').where({ username: 'tech' }).update({ active: false });
    expect((await request(h.app).get('/api/auth/demo-accounts')).body.accounts.map((a: { username: string }) => a.username)).not.toContain('tech');
    await h.close();
    h = await startHarness({ demo: false });
    const none = await request(h.app).get('/api/auth/demo-accounts');
    expect(none.status).toBe(204);
    expect(none.text).toBe('');
  });

  it('answers unknown API routes with a JSON 404', async () => {
    const res = await request(h.app).get('/api/nope');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
