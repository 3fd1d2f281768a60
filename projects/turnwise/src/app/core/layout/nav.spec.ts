import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { fakeAuth } from '../../../testing/fake-auth';
import { Role } from '../auth/roles';
import { provideIcons } from './icons';
import { Nav } from './nav';

async function linksFor(role: Role | null) {
  const { provider } = fakeAuth(role ? { username: 'sam', role } : null);
  TestBed.configureTestingModule({ imports: [Nav], providers: [provideRouter([]), provideIcons(), provider] });
  const fixture = TestBed.createComponent(Nav);
  await fixture.whenStable();
  const links = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('a'));
  return links.map((link) => ({ text: link.textContent?.trim(), href: link.getAttribute('href') }));
}

describe('Nav', () => {
  it('shows the front desk only the day plan and the room board', async () => {
    expect(await linksFor('frontdesk')).toEqual([
      { text: 'Day plan', href: '/day' },
      { text: 'Rooms now', href: '/rooms-now' },
    ]);
  });

  it('shows a technologist the turnover checklist but not import, reports or setup', async () => {
    const texts = (await linksFor('tech')).map((link) => link.text);
    expect(texts).toEqual(['Day plan', 'Rooms now', 'Turnover']);
  });

  it('shows the charge technologist everything but setup', async () => {
    const texts = (await linksFor('charge')).map((link) => link.text);
    expect(texts).toEqual(['Day plan', 'Import', 'Rooms now', 'Turnover', 'Reports']);
  });

  it('shows an admin every screen, the Outbox and the Interface log included', async () => {
    const texts = (await linksFor('admin')).map((link) => link.text);
    expect(texts).toEqual(['Day plan', 'Import', 'Rooms now', 'Turnover', 'Reports', 'Setup', 'Outbox', 'Interface log']);
  });

  it('shows nothing when nobody is signed in', async () => {
    expect(await linksFor(null)).toEqual([]);
  });
});
