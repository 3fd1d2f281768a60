import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, provideRouter } from '@angular/router';

import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { fakeAuth } from '../../../testing/fake-auth';
import { Profile } from './profile';

async function render(mustChangePassword: boolean) {
  const auth = fakeAuth({ username: 'rtaylor', role: 'tech', displayName: 'Robin Taylor', mustChangePassword });
  TestBed.configureTestingModule({
    imports: [Profile],
    providers: [provideRouter([]), provideApiHttp(), provideHttpClientTesting(), provideIcons(), auth.provider, { provide: MatSnackBar, useValue: { open: jest.fn() } }],
  });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  const fixture = TestBed.createComponent(Profile);
  await settle(fixture);
  return { fixture, auth: auth.fake, navigate, backend: TestBed.inject(HttpTestingController), page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

function fill(page: HTMLElement, values: { currentPassword: string; newPassword: string; repeat: string }): void {
  for (const [name, value] of Object.entries(values)) {
    const input = page.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }
  page.querySelector('form')!.dispatchEvent(new Event('submit'));
}

const errorUnder = (page: HTMLElement, name: string) =>
  page.querySelector(`input[formcontrolname="${name}"]`)!.closest('mat-form-field')!.querySelector('mat-error')?.textContent?.trim();

describe('Profile', () => {
  it('states the policy and says why when the password must change', async () => {
    const { page } = await render(true);
    expect(page.textContent).toContain('Use at least 12 characters');
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Choose your own password to continue');
  });

  it('checks the repeat and the length before sending', async () => {
    const { fixture, page, backend } = await render(false);
    fill(page, { currentPassword: 'old-password-1', newPassword: 'new-password-12', repeat: 'new-password-13' });
    await settle(fixture);
    expect(errorUnder(page, 'repeat')).toBe('does not match the new password');
    fill(page, { currentPassword: 'old-password-1', newPassword: 'short', repeat: 'short' });
    await settle(fixture);
    expect(errorUnder(page, 'newPassword')).toBe('use at least 12 characters');
    backend.expectNone('/api/profile/password');
  });

  it('shows a wrong current password under its field (the API’s 422 problem)', async () => {
    const { fixture, page, backend, auth } = await render(false);
    fill(page, { currentPassword: 'not-it', newPassword: 'new-password-12', repeat: 'new-password-12' });
    backend
      .expectOne({ method: 'PUT', url: '/api/profile/password' })
      .flush(
        { error: { code: 'validation_failed', message: 'The current password is not right.', details: { problems: [{ field: 'currentPassword', message: 'does not match your current password' }] } } },
        { status: 422, statusText: 'Unprocessable' },
      );
    await settle(fixture);
    expect(errorUnder(page, 'currentPassword')).toBe('does not match your current password');
    expect(auth.passwordChanged).not.toHaveBeenCalled();
  });

  it('after a required change, opens the gate and goes to the role’s home screen', async () => {
    const { fixture, page, backend, auth, navigate } = await render(true);
    fill(page, { currentPassword: 'first-password-12', newPassword: 'my-own-password-34', repeat: 'my-own-password-34' });
    const request = backend.expectOne({ method: 'PUT', url: '/api/profile/password' });
    expect(request.request.body).toEqual({ currentPassword: 'first-password-12', newPassword: 'my-own-password-34' });
    request.flush({ user: { id: 7, username: 'rtaylor', role: 'tech', mustChangePassword: false } });
    await settle(fixture);
    expect(auth.passwordChanged).toHaveBeenCalled();
    expect(navigate).toHaveBeenCalledWith('/turnover');
  });
});
