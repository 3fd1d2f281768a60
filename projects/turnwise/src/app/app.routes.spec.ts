import { Location } from '@angular/common';
import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Title } from '@angular/platform-browser';
import { Router, TitleStrategy, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { fakeAuth } from '../testing/fake-auth';
import { routes } from './app.routes';
import { SessionUser } from './core/auth/roles';
import { provideIcons } from './core/layout/icons';
import { PageTitle } from './core/layout/page-title';

async function visit(user: SessionUser | null, url: string) {
  const { provider } = fakeAuth(user);
  TestBed.configureTestingModule({
    providers: [
      provideRouter(routes),
      { provide: TitleStrategy, useClass: PageTitle },
      provideHttpClient(),
      provideHttpClientTesting(),
      provideIcons(),
      provider,
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  return {
    url: TestBed.inject(Router).url,
    /** What the address bar shows (differs from url after a skipLocationChange redirect). */
    address: TestBed.inject(Location).path(),
    text: harness.routeNativeElement?.textContent ?? '',
    title: TestBed.inject(Title).getTitle(),
  };
}

describe('app routes', () => {
  it('sends a signed-out visitor to sign in with the address they asked for', async () => {
    const page = await visit(null, '/reports');
    expect(page.url).toBe('/sign-in?returnUrl=%2Freports');
    expect(page.title).toBe('Sign in · Turnwise');
  });

  it('opens the bare address on the role home screen', async () => {
    const page = await visit({ username: 'frankie', role: 'frontdesk' }, '/');
    expect(page.url).toBe('/rooms-now');
    expect(page.title).toBe('Rooms now · Turnwise');
  });

  it('tells a role it may not use a screen, keeping the address', async () => {
    const page = await visit({ username: 'pat', role: 'tech' }, '/reports');
    expect(page.address).toBe('/reports');
    expect(page.text).toContain('Not available for your role');
    expect(page.text).toContain('Technologist');
  });

  it.each([
    ['/day', 'Day plan'],
    ['/import', 'Import'],
    ['/rooms-now', 'Rooms now'],
    ['/turnover', 'Turnover'],
    ['/reports', 'Reports'],
    ['/setup', 'Setup'],
  ])('lets an admin open %s', async (url, name) => {
    const page = await visit({ username: 'ada', role: 'admin' }, url);
    expect(page.url).toBe(url);
    expect(page.title).toBe(`${name} · Turnwise`);
  });

  it('opens the day sheet outside the shell, for a signed-in role only', async () => {
    const page = await visit({ username: 'pat', role: 'tech' }, '/day/2027-03-10/sheet');
    expect(page.url).toBe('/day/2027-03-10/sheet');
    expect(page.title).toBe('Day sheet · Turnwise');
    expect(document.querySelector('tw-day-sheet')).not.toBeNull();
    expect(document.querySelector('tw-shell')).toBeNull();
    TestBed.resetTestingModule();
    expect((await visit(null, '/day/2027-03-10/sheet')).url).toBe('/sign-in?returnUrl=%2Fday%2F2027-03-10%2Fsheet');
  });

  it('shows a page-not-found screen for an unknown address', async () => {
    const page = await visit(null, '/no-such-screen');
    expect(page.text).toContain('Page not found');
    expect(page.title).toBe('Page not found · Turnwise');
  });
});
