import { ROLES, type Role } from '../../shared/api/auth';
import { client, signedIn, startHarness, type Client, type Harness } from './harness';
import { ROUTE_TABLE } from './route-table';

/**
 * Every API route × every role (and no sign-in): 401 without a session, 403 for a role the
 * product's role table does not allow, 2xx for one it does. New routes are added to route-table.ts.
 */
describe('role matrix', () => {
  let h: Harness;
  const clients = new Map<Role, Client>();

  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z' });
    for (const role of ROLES) clients.set(role, await signedIn(h.app, role));
  });
  afterAll(() => h.close());

  for (const route of ROUTE_TABLE) {
    describe(`${route.method.toUpperCase()} ${route.path}`, () => {
      it(route.allowed === 'public' ? 'is public' : 'answers 401 without a session', async () => {
        const anon = await client(h.app);
        const res = await route.send(anon, await route.prepare?.(h));
        if (route.allowed === 'public') expect(res.status).toBeLessThan(300);
        else expect(res.status).toBe(401);
      });

      for (const role of ROLES) {
        const allowed = route.allowed === 'public' || route.allowed === 'signed-in' || route.allowed.includes(role);
        it(`${allowed ? 'allows' : 'forbids (403)'} ${role}`, async () => {
          const res = await route.send(clients.get(role)!, await route.prepare?.(h));
          // On failure, show the body so a 422 from a stale test payload is told apart from a role bug.
          const ok = res.status < 300 || (route.alsoOk ?? []).includes(res.status);
          if (allowed) expect([res.status, ok ? '' : JSON.stringify(res.body)]).toEqual([expect.any(Number), '']);
          else expect(res.status).toBe(403);
        });
      }
    });
  }

});
