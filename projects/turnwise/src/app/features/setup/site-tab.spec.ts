import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { SiteSettings } from '@shared/api/settings';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { errorUnder, refusal, settle, submit, type } from '../../../testing/setup-dialogs';
import { SiteTab } from './site-tab';

const SETTINGS: SiteSettings = { siteName: 'North Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3, noticesSender: '', dayBeforeNoticeAt: '16:00', walkingMinutes: 3 };

async function render() {
  TestBed.configureTestingModule({
    imports: [SiteTab],
    providers: [provideApiHttp(), provideHttpClientTesting(), provideIcons(), { provide: MatSnackBar, useValue: { open: jest.fn() } }],
  });
  const fixture = TestBed.createComponent(SiteTab);
  const backend = TestBed.inject(HttpTestingController);
  await settle(fixture);
  backend.expectOne({ method: 'GET', url: '/api/settings' }).flush({ settings: SETTINGS });
  await settle(fixture);
  return { fixture, backend, page: fixture.nativeElement as HTMLElement };
}

const TIME = 'input[formcontrolname="dayBeforeNoticeAt"]';
const timeInput = (page: HTMLElement) => page.querySelector<HTMLInputElement>(TIME)!;
const errorUnderTime = (page: HTMLElement) => errorUnder(page, TIME);
const setTime = (page: HTMLElement, value: string) => type(page, TIME, value);

describe('SiteTab: day-before notice time', () => {
  it('shows the stored time and saves a new one with the rest of the site', async () => {
    const { fixture, backend, page } = await render();
    expect(timeInput(page).value).toBe('16:00');
    setTime(page, '15:30');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/settings' });
    expect(request.request.body).toEqual({ ...SETTINGS, dayBeforeNoticeAt: '15:30' });
    request.flush({ settings: { ...SETTINGS, dayBeforeNoticeAt: '15:30' } });
    await settle(fixture);
    expect(page.querySelector('[role="status"]')?.textContent).toContain('Saved');
  });

  it('puts the API’s 422 problem for the time under its field', async () => {
    const { fixture, backend, page } = await render();
    submit(page);
    backend
      .expectOne({ method: 'PUT', url: '/api/settings' })
      .flush(...refusal([{ field: 'dayBeforeNoticeAt', message: 'use HH:MM, 00:00 to 23:59' }]));
    await settle(fixture);
    expect(errorUnderTime(page)).toBe('use HH:MM, 00:00 to 23:59');
  });

  it('refuses an empty time before sending, in the API schema’s words', async () => {
    const { fixture, backend, page } = await render();
    setTime(page, '');
    submit(page);
    await settle(fixture);
    backend.expectNone({ method: 'PUT', url: '/api/settings' });
    expect(errorUnderTime(page)).toBe('use HH:MM, 00:00 to 23:59');
  });
});
