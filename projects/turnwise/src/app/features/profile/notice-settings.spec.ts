import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import { NOTICE_KINDS, type NoticeKind, type NoticePreferences } from '@shared/api/notices';
import { provideApiHttp } from '../../core/http/api-http';
import { errorUnder, refusal, settle, submit, type } from '../../../testing/setup-dialogs';
import { NoticeSettings } from './notice-settings';

const allOn = Object.fromEntries(NOTICE_KINDS.map((k) => [k, true])) as Record<NoticeKind, boolean>;

async function render(prefs: NoticePreferences) {
  TestBed.configureTestingModule({
    imports: [NoticeSettings],
    providers: [provideApiHttp(), provideHttpClientTesting(), { provide: MatSnackBar, useValue: { open: jest.fn() } }],
  });
  const fixture = TestBed.createComponent(NoticeSettings);
  const backend = TestBed.inject(HttpTestingController);
  await settle(fixture);
  backend.expectOne({ method: 'GET', url: '/api/profile/notices' }).flush(prefs);
  await settle(fixture);
  return { fixture, backend, page: fixture.nativeElement as HTMLElement };
}

const EMAIL = 'input[formcontrolname="email"]';
const emailInput = (page: HTMLElement) => page.querySelector<HTMLInputElement>(EMAIL)!;
const toggle = (page: HTMLElement, kind: NoticeKind) => page.querySelector<HTMLButtonElement>(`mat-slide-toggle[data-kind="${kind}"] button`)!;
const errorUnderEmail = (page: HTMLElement) => errorUnder(page, EMAIL);
const typeEmail = (page: HTMLElement, value: string) => type(page, EMAIL, value);

describe('NoticeSettings', () => {
  it('shows the stored address and one switch per notice, as stored', async () => {
    const { page } = await render({ email: 'robin@example.test', kinds: { ...allOn, 'slot-moves': false } });
    expect(emailInput(page).value).toBe('robin@example.test');
    expect(page.querySelectorAll('mat-slide-toggle')).toHaveLength(NOTICE_KINDS.length);
    expect(toggle(page, 'import-digest').getAttribute('aria-checked')).toBe('true');
    expect(toggle(page, 'slot-moves').getAttribute('aria-checked')).toBe('false');
  });

  it('saves the address and the switches as the API takes them', async () => {
    const { fixture, page, backend } = await render({ email: null, kinds: allOn });
    typeEmail(page, ' robin@example.test ');
    toggle(page, 'import-digest').click();
    await settle(fixture);
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/profile/notices' });
    expect(request.request.body).toEqual({ email: 'robin@example.test', kinds: { ...allOn, 'import-digest': false } });
    request.flush({ email: 'robin@example.test', kinds: { ...allOn, 'import-digest': false } });
    await settle(fixture);
    expect(page.querySelector('[role="status"]')?.textContent).toContain('saved');
  });

  it('refuses a malformed address before sending, in the API schema’s words', async () => {
    const { fixture, page, backend } = await render({ email: null, kinds: allOn });
    typeEmail(page, 'not-an-address');
    submit(page);
    await settle(fixture);
    expect(errorUnderEmail(page)).toBe('not an e-mail address');
    backend.expectNone({ method: 'PUT', url: '/api/profile/notices' });
  });

  it('puts the API’s 422 problem under its field', async () => {
    const { fixture, page, backend } = await render({ email: null, kinds: allOn });
    typeEmail(page, 'robin@example.test');
    submit(page);
    backend
      .expectOne({ method: 'PUT', url: '/api/profile/notices' })
      .flush(...refusal([{ field: 'email', message: 'this address is refused here' }]));
    await settle(fixture);
    expect(errorUnderEmail(page)).toBe('this address is refused here');
    expect(page.querySelector('[role="status"]')).toBeNull();
  });
});
