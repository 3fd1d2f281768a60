import type { Express } from 'express';
import request from 'supertest';
import { client, DEMO_PASSWORD, signedIn, startHarness, type Harness } from './harness';

jest.setTimeout(60_000);

const setCookies = (res: request.Response): string[] => (res.headers['set-cookie'] as unknown as string[] | undefined) ?? [];
const cookieNamed = (res: request.Response, name: string) => setCookies(res).find((c) => c.startsWith(`${name}=`));
/** The known-device cookie is named per account: `turnwise.device.<digest>`. */
const deviceCookie = (res: request.Response) => setCookies(res).find((c) => c.startsWith('turnwise.device.'));
/** A Set-Cookie line cut down to what a browser sends back: `name=value`. */
const sentBack = (cookie: string | undefined) => cookie?.split(';')[0] ?? '';
const valueOf = (cookie: string | undefined) => decodeURIComponent(cookie?.split(';')[0]?.split('=').slice(1).join('=') ?? '');

/**
 * A sign-in from a cookie-less caller (an attacker's script), with its own freshly issued XSRF
 * token sent by hand, so the Secure cookies of production mode do not get in the way.
 */
async function bareSignIn(app: Express, body: { username: string; password: string }, from?: string, extraCookie?: string) {
  const token = valueOf(cookieNamed(await request(app).get('/api/health'), 'XSRF-TOKEN'));
  const cookie = [`XSRF-TOKEN=${encodeURIComponent(token)}`, extraCookie].filter(Boolean).join('; ');
  const req = request(app).post('/api/auth/login').set('Cookie', cookie).set('X-XSRF-TOKEN', token);
  if (from) req.set('X-Forwarded-For', from);
  return req.send(body);
}

describe('sign-in throttle', () => {
  let h: Harness | undefined;
  afterEach(async () => {
    await h?.close();
    h = undefined;
  }, 30_000);

  it('counts failures per connecting address when TRUST_PROXY is unset, whatever X-Forwarded-For says', async () => {
    // production mode used to trust one proxy hop, so a rotating header got a fresh budget each time
    h = await startHarness({ production: true, signInLimits: { perAccount: 100, perAddress: 5 } });
    for (let i = 1; i <= 5; i++) {
      expect((await bareSignIn(h.app, { username: `ghost-${i}`, password: 'guess' }, `203.0.113.${i}`)).status).toBe(401);
    }
    const blocked = await bareSignIn(h.app, { username: 'ghost-6', password: 'guess' }, '203.0.113.6');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error).toMatchObject({ code: 'too_many_attempts', message: expect.stringMatching(/this address/) });
  });

  it('honours X-Forwarded-For from a configured proxy only, one budget per client address', async () => {
    h = await startHarness({ trustProxy: ['loopback'], signInLimits: { perAccount: 100, perAddress: 5 } });
    for (let i = 1; i <= 5; i++) {
      expect((await bareSignIn(h.app, { username: `ghost-${i}`, password: 'guess' }, '203.0.113.7')).status).toBe(401);
    }
    expect((await bareSignIn(h.app, { username: 'ghost-6', password: 'guess' }, '203.0.113.7')).status).toBe(429);
    expect((await bareSignIn(h.app, { username: 'ghost-6', password: 'guess' }, '203.0.113.8')).status).toBe(401);
  });

  it('locks an account after its failures from any number of addresses', async () => {
    // each new address used to get a fresh set of guesses at the same account
    h = await startHarness({ production: true, trustProxy: ['loopback'], signInLimits: { perAccount: 3, perAddress: 100 } });
    for (let i = 1; i <= 3; i++) {
      expect((await bareSignIn(h.app, { username: 'tech', password: 'guess' }, `203.0.113.${i}`)).status).toBe(401);
    }
    const blocked = await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, '203.0.113.4');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/this account/);
    // unknown usernames are throttled the same way, so a 429 does not tell which accounts exist
    for (let i = 1; i <= 3; i++) await bareSignIn(h.app, { username: 'nobody', password: 'guess' }, `198.51.100.${i}`);
    expect((await bareSignIn(h.app, { username: 'nobody', password: 'guess' }, '198.51.100.9')).status).toBe(429);
  });

  it('lets the user in from their known device while failures elsewhere lock the account', async () => {
    h = await startHarness({ trustProxy: ['loopback'], signInLimits: { perAccount: 3, perAddress: 100 } });
    const device = await client(h.app);
    const first = await device.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD }).set('X-Forwarded-For', '198.51.100.20');
    expect(first.status).toBe(200);
    const known = deviceCookie(first);
    expect(known).toMatch(/HttpOnly/i);
    expect((await device.post('/api/auth/logout')).status).toBe(204);
    await device.get('/api/health');

    for (let i = 0; i < 3; i++) expect((await bareSignIn(h.app, { username: 'tech', password: 'guess' }, '203.0.113.66')).status).toBe(401);
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, '203.0.113.66')).status).toBe(429);

    const again = await device.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD }).set('X-Forwarded-For', '198.51.100.20');
    expect(again.status).toBe(200);
    expect((await device.get('/api/auth/me')).body.user.username).toBe('tech');
  });

  it('gives no way around the lock with a forged device cookie or another account’s device cookie', async () => {
    h = await startHarness({ signInLimits: { perAccount: 3, perAddress: 100 } });
    const techLogin = await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD });
    const techDevice = sentBack(deviceCookie(techLogin));
    const chargeDevice = sentBack(deviceCookie(await bareSignIn(h.app, { username: 'charge', password: DEMO_PASSWORD })));
    const [name, value] = techDevice.split('=') as [string, string];
    const forged = `${name}=${value.slice(0, -4)}AAAA`;

    for (let i = 0; i < 3; i++) await bareSignIn(h.app, { username: 'tech', password: 'guess' });
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, undefined, forged)).status).toBe(429);
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, undefined, chargeDevice)).status).toBe(429);
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, undefined, techDevice)).status).toBe(200);
  });

  it('limits a known device’s own failures to that device', async () => {
    h = await startHarness({ signInLimits: { perAccount: 3, perAddress: 100 } });
    const device = sentBack(deviceCookie(await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD })));
    for (let i = 0; i < 3; i++) expect((await bareSignIn(h.app, { username: 'tech', password: 'guess' }, undefined, device)).status).toBe(401);
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, undefined, device)).status).toBe(429);
    // the account-wide budget was not spent, so a first sign-in on another device still works
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('lets a known device through when others on its shared address used up the address budget', async () => {
    h = await startHarness({ trustProxy: ['loopback'], signInLimits: { perAccount: 100, perAddress: 3 } });
    const ward = '198.51.100.30';
    const device = sentBack(deviceCookie(await bareSignIn(h.app, { username: 'charge', password: DEMO_PASSWORD }, '192.0.2.1')));
    for (let i = 1; i <= 3; i++) await bareSignIn(h.app, { username: `ghost-${i}`, password: 'guess' }, ward);
    expect((await bareSignIn(h.app, { username: 'tech', password: DEMO_PASSWORD }, ward)).status).toBe(429);
    expect((await bareSignIn(h.app, { username: 'charge', password: DEMO_PASSWORD }, ward, device)).status).toBe(200);
  });
});

describe('XSRF and caching', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  it('refuses an attacker-chosen equal cookie and header (403 xsrf_failed), signed in or not', async () => {
    const anonymous = await request(h.app)
      .post('/api/auth/login')
      .set('Cookie', 'XSRF-TOKEN=attacker-chosen')
      .set('X-XSRF-TOKEN', 'attacker-chosen')
      .send({ username: 'tech', password: DEMO_PASSWORD });
    expect(anonymous.status).toBe(403);
    expect(anonymous.body.error.code).toBe('xsrf_failed');

    const victim = await signedIn(h.app, 'admin');
    const forged = await victim.agent
      .post('/api/rooms')
      .set('Cookie', 'XSRF-TOKEN=attacker-chosen')
      .set('X-XSRF-TOKEN', 'attacker-chosen')
      .send({ name: 'Forged room', modality: 'MR', airChangesPerHour: 10, staff: 1 });
    expect(forged.status).toBe(403);
    expect(forged.body.error.code).toBe('xsrf_failed');
  });

  it('refuses a token issued to another session', async () => {
    const attacker = await signedIn(h.app, 'charge');
    const victim = await signedIn(h.app, 'scheduler');
    const res = await request(h.app)
      .post('/api/auth/logout')
      .set('Cookie', `turnwise.sid=${victim.cookie('turnwise.sid')}; XSRF-TOKEN=${encodeURIComponent(attacker.token)}`)
      .set('X-XSRF-TOKEN', attacker.token);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('xsrf_failed');
    expect((await victim.get('/api/auth/me')).status).toBe(200);
  });

  it('issues a new token at sign-in that the client can post with; the signed-out token stops working', async () => {
    const c = await client(h.app);
    const before = c.token;
    const login = await c.post('/api/auth/login', { username: 'admin', password: DEMO_PASSWORD });
    expect(login.status).toBe(200);
    const after = valueOf(cookieNamed(login, 'XSRF-TOKEN'));
    expect(after).not.toBe('');
    expect(after).not.toBe(before);
    expect(c.token).toBe(after);

    const stale = await c.agent
      .post('/api/rooms')
      .set('Cookie', `XSRF-TOKEN=${encodeURIComponent(before)}`)
      .set('X-XSRF-TOKEN', before)
      .send({ name: 'Stale room', modality: 'MR', airChangesPerHour: 10, staff: 1 });
    expect(stale.status).toBe(403);
    const fresh = await c.post('/api/rooms', { name: 'Fresh room', modality: 'MR', airChangesPerHour: 10, staff: 1 });
    expect(fresh.status).toBe(201);
  });

  it('answers 401, not 403, when the session behind a signed token has ended', async () => {
    const c = await signedIn(h.app, 'admin');
    await h.db('sessions').del();
    const res = await c.post('/api/rooms', { name: 'Late room', modality: 'MR', airChangesPerHour: 10, staff: 1 });
    expect(res.status).toBe(401);
  });

  it('clears the session and XSRF cookies at logout', async () => {
    const c = await signedIn(h.app, 'tech');
    const res = await c.post('/api/auth/logout');
    expect(res.status).toBe(204);
    for (const name of ['XSRF-TOKEN', 'turnwise.sid']) {
      expect(cookieNamed(res, name)).toMatch(/^[^=]+=;.*Expires=Thu, 01 Jan 1970/i);
      expect(c.cookie(name)).toBeUndefined();
    }
    // the next page load gets a fresh token, so signing in again works
    await c.get('/api/auth/demo-accounts');
    expect((await c.post('/api/auth/login', { username: 'tech', password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('marks API answers Cache-Control: no-store, errors included', async () => {
    const c = await signedIn(h.app, 'charge');
    const answers = [
      await request(h.app).get('/api/health'),
      await request(h.app).get('/api/auth/me'),
      await request(h.app).get('/api/nope'),
      await request(h.app).post('/api/auth/login').send({}),
      await c.get('/api/auth/me'),
      await c.get('/api/rooms'),
      await c.get('/api/days/2027-03-10/board'),
    ];
    expect(answers.map((res) => res.status)).toEqual([200, 401, 404, 403, 200, 200, 200]);
    for (const res of answers) expect(res.headers['cache-control']).toBe('no-store');
  });
});
