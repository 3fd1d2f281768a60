import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { SiteSettings } from '@shared/api/settings';
import { provideApiHttp } from '../../core/http/api-http';
import { SiteTab } from './site-tab';

const SETTINGS: SiteSettings = { siteName: 'North Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3, noticesSender: '', dayBeforeNoticeAt: '16:00' };

async function render() {
  TestBed.configureTestingModule({
    imports: [SiteTab],
    providers: [provideApiHttp(), provideHttpClientTesting(), { provide: MatSnackBar, useValue: { open: jest.fn() } }],
  });
  const fixture = TestBed.createComponent(SiteTab);
  const backend = TestBed.inject(HttpTestingController);
  await settle(fixture);
  backend.expectOne({ method: 'GET', url: '/api/settings' }).flush({ settings: SETTINGS });
  await settle(fixture);
  return { fixture, backend, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

const timeInput = (page: HTMLElement) => page.querySelector<HTMLInputElement>('input[formcontrolname="dayBeforeNoticeAt"]')!;
const errorUnderTime = (page: HTMLElement) => timeInput(page).closest('mat-form-field')!.querySelector('mat-error')?.textContent?.trim();

function setTime(page: HTMLElement, value: string): void {
  timeInput(page).value = value;
  timeInput(page).dispatchEvent(new Event('input'));
}

describe('SiteTab: day-before notice time', () => {
  it('shows the stored time and saves a new one with the rest of the site', async () => {
    const { fixture, backend, page } = await render();
    expect(timeInput(page).value).toBe('16:00');
    setTime(page, '15:30');
    page.querySelector('form')!.dispatchEvent(new Event('submit'));
    const request = backend.expectOne({ method: 'PUT', url: '/api/settings' });
    expect(request.request.body).toEqual({ ...SETTINGS, dayBeforeNoticeAt: '15:30' });
    request.flush({ settings: { ...SETTINGS, dayBeforeNoticeAt: '15:30' } });
    await settle(fixture);
    expect(page.querySelector('[role="status"]')?.textContent).toContain('Saved');
  });

  it('puts the API’s 422 problem for the time under its field', async () => {
    const { fixture, backend, page } = await render();
    page.querySelector('form')!.dispatchEvent(new Event('submit'));
    backend
      .expectOne({ method: 'PUT', url: '/api/settings' })
      .flush(
        { error: { code: 'validation_failed', message: 'The settings are not valid.', details: { problems: [{ field: 'dayBeforeNoticeAt', message: 'use HH:MM, 00:00 to 23:59' }] } } },
        { status: 422, statusText: 'Unprocessable' },
      );
    await settle(fixture);
    expect(errorUnderTime(page)).toBe('use HH:MM, 00:00 to 23:59');
  });

  it('refuses an empty time before sending, in the API schema’s words', async () => {
    const { fixture, backend, page } = await render();
    setTime(page, '');
    page.querySelector('form')!.dispatchEvent(new Event('submit'));
    await settle(fixture);
    backend.expectNone({ method: 'PUT', url: '/api/settings' });
    expect(errorUnderTime(page)).toBe('use HH:MM, 00:00 to 23:59');
  });
});
