import { TestBed } from '@angular/core/testing';
import {
  ActivatedRouteSnapshot,
  RedirectCommand,
  Router,
  RouterStateSnapshot,
  UrlTree,
  provideRouter,
} from '@angular/router';

import { fakeAuth } from '../../../testing/fake-auth';
import { homeRedirectGuard, roleGuard } from './role-guard';
import { Role, SessionUser } from './roles';

const route = {} as ActivatedRouteSnapshot;
const state = { url: '/reports' } as RouterStateSnapshot;

function setUp(user: SessionUser | null) {
  const { provider } = fakeAuth(user);
  TestBed.configureTestingModule({ providers: [provideRouter([]), provider] });
  return TestBed.inject(Router);
}

function run(roles: readonly Role[]) {
  return TestBed.runInInjectionContext(() => roleGuard(roles)(route, state));
}

describe('roleGuard', () => {
  it('lets a role listed for the screen through', async () => {
    setUp({ username: 'casey', role: 'charge' });
    await expect(run(['charge', 'admin'])).resolves.toBe(true);
  });

  it('shows "not available" to a role not listed, without changing the address', async () => {
    const router = setUp({ username: 'frankie', role: 'frontdesk' });
    const result = await run(['charge', 'admin']);
    expect(result).toBeInstanceOf(RedirectCommand);
    const command = result as RedirectCommand;
    expect(router.serializeUrl(command.redirectTo as UrlTree)).toBe('/not-available');
    expect(command.navigationBehaviorOptions?.browserUrl).toBe('/reports');
  });

  it('sends a signed-out user to sign in', async () => {
    const router = setUp(null);
    const result = await run(['admin']);
    expect(router.serializeUrl(result as UrlTree)).toBe('/sign-in');
  });
});

describe('homeRedirectGuard', () => {
  it.each([
    ['frontdesk', '/rooms-now'],
    ['tech', '/turnover'],
    ['scheduler', '/day'],
  ] as const)('sends %s to %s', async (role, home) => {
    const router = setUp({ username: 'sam', role });
    const result = await TestBed.runInInjectionContext(() => homeRedirectGuard(route, state));
    expect(router.serializeUrl(result as UrlTree)).toBe(home);
  });
});
