import { Clipboard } from '@angular/cdk/clipboard';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { CalendarFeedStatus } from '@shared/api/calendar';
import { provideApiHttp } from '../../core/http/api-http';
import { button, settle } from '../../../testing/setup-dialogs';
import { CalendarFeeds } from './calendar-feeds';

const URL_MINE = 'https://turnwise.example.test/api/calendar/tok/mine.ics';
const URL_ROOM = 'https://turnwise.example.test/api/calendar/tok/rooms/1.ics';

async function render(status: CalendarFeedStatus) {
  const clipboard = { copy: jest.fn().mockReturnValue(true) };
  TestBed.configureTestingModule({
    imports: [CalendarFeeds],
    providers: [provideApiHttp(), provideHttpClientTesting(), { provide: MatSnackBar, useValue: { open: jest.fn() } }, { provide: Clipboard, useValue: clipboard }],
  });
  const fixture = TestBed.createComponent(CalendarFeeds);
  const backend = TestBed.inject(HttpTestingController);
  await settle(fixture);
  backend.expectOne({ method: 'GET', url: '/api/profile/calendar' }).flush(status);
  await settle(fixture);
  return { fixture, backend, clipboard, page: fixture.nativeElement as HTMLElement };
}

describe('CalendarFeeds', () => {
  it('turns feeds on and shows each address once with a copy button', async () => {
    const { fixture, page, backend, clipboard } = await render({ active: false, createdAt: null, lastUsedAt: null });
    expect(page.textContent).toContain('Your feeds are off');
    button(page, 'Turn feeds on').click();
    backend.expectOne({ method: 'POST', url: '/api/profile/calendar/rotate' }).flush({
      active: true,
      createdAt: '2027-03-10T14:00:00.000Z',
      lastUsedAt: null,
      feeds: [
        { label: 'My shift tasks and rooms', url: URL_MINE },
        { label: 'MR 1', url: URL_ROOM },
      ],
    });
    await settle(fixture);
    expect(Array.from(page.querySelectorAll('code')).map((c) => c.textContent)).toEqual([URL_MINE, URL_ROOM]);
    page.querySelector<HTMLButtonElement>('button[aria-label="Copy the address of MR 1"]')!.click();
    await settle(fixture);
    expect(clipboard.copy).toHaveBeenCalledWith(URL_ROOM);
    expect(page.querySelector('button[aria-label="Copy the address of MR 1"]')!.textContent!.trim()).toBe('Copied');
  });

  it('never shows an address it was not just given, and turns feeds off', async () => {
    const { fixture, page, backend } = await render({ active: true, createdAt: '2027-03-01T08:00:00.000Z', lastUsedAt: null });
    expect(page.querySelector('code')).toBeNull();
    expect(page.textContent).toContain('make new ones');
    button(page, 'Turn feeds off').click();
    backend.expectOne({ method: 'DELETE', url: '/api/profile/calendar' }).flush(null, { status: 204, statusText: 'No Content' });
    await settle(fixture);
    expect(page.textContent).toContain('Your feeds are off');
  });

  it('says why when making addresses is refused', async () => {
    const { fixture, page, backend } = await render({ active: true, createdAt: '2027-03-01T08:00:00.000Z', lastUsedAt: null });
    button(page, 'Make new addresses').click();
    backend
      .expectOne({ method: 'POST', url: '/api/profile/calendar/rotate' })
      .flush({ error: { code: 'too_many_attempts', message: 'Too many new calendar addresses. Wait a few minutes and try again.' } }, { status: 429, statusText: 'Too Many Requests' });
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('Too many new calendar addresses');
    expect(page.querySelector('code')).toBeNull();
  });
});
