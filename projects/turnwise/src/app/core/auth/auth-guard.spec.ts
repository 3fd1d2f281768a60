import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';

import { fakeAuth } from '../../../testing/fake-auth';
import { authGuard } from './auth-guard';
import { SessionUser } from './roles';

function runGuard(user: SessionUser | null, url: string) {
  const { provider } = fakeAuth(user);
  TestBed.configureTestingModule({ providers: [provideRouter([]), provider] });
  return TestBed.runInInjectionContext(() =>
    authGuard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot),
  );
}

describe('authGuard', () => {
  it('sends a signed-out user to sign in, keeping where they were going', async () => {
    const result = await runGuard(null, '/reports?room=MR%202');
    expect(result).toBeInstanceOf(UrlTree);
    const tree = result as UrlTree;
    expect(tree.root.children['primary'].segments.map((s) => s.path)).toEqual(['sign-in']);
    expect(tree.queryParams['returnUrl']).toBe('/reports?room=MR%202');
  });

  it('lets a signed-in user through', async () => {
    await expect(runGuard({ username: 'pat', role: 'tech' }, '/turnover')).resolves.toBe(true);
  });
});
