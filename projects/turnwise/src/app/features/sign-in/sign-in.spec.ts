import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { errorInterceptor } from '../../core/http/error-interceptor';
import { SignIn } from './sign-in';

const DEMO_URL = '/api/auth/demo-accounts';

async function render(returnUrl?: string) {
  TestBed.configureTestingModule({
    imports: [SignIn],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const router = TestBed.inject(Router);
  const navigate = jest.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
  const fixture = TestBed.createComponent(SignIn);
  if (returnUrl) fixture.componentRef.setInput('returnUrl', returnUrl);
  await fixture.whenStable();
  return { fixture, navigate, backend: TestBed.inject(HttpTestingController), page: fixture.nativeElement as HTMLElement };
}

/** Lets pending promise callbacks run, then change detection. */
async function settle(fixture: ComponentFixture<SignIn>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

function type(page: HTMLElement, label: 'username' | 'password', value: string) {
  const input = page.querySelector<HTMLInputElement>(`input[formControlName="${label}"]`)!;
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

async function submitAs(setup: Awaited<ReturnType<typeof render>>, username: string, password: string) {
  type(setup.page, 'username', username);
  type(setup.page, 'password', password);
  setup.page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  return setup.backend.expectOne('/api/auth/login');
}

describe('SignIn', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('renders labelled username and password fields and a submit button', async () => {
    const { page, backend } = await render();
    backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    const labels = Array.from(page.querySelectorAll('mat-label')).map((label) => label.textContent?.trim());
    expect(labels).toEqual(['Username', 'Password']);
    expect(page.querySelector('input[type="password"]')).not.toBeNull();
    expect(page.querySelector('button[type="submit"]')?.textContent).toContain('Sign in');
  });

  it('draws its own icons, before the shell that registers the others has loaded', async () => {
    const { page, backend } = await render();
    backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    expect(page.querySelector('button[type="submit"] mat-icon svg')).not.toBeNull();
  });

  it('submits the credentials and goes to the role home', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    const request = await submitAs(setup, 'frankie', 'pw');
    expect(request.request.body).toEqual({ username: 'frankie', password: 'pw' });
    request.flush({ user: { username: 'frankie', role: 'frontdesk' } });
    await settle(setup.fixture);
    expect(setup.navigate).toHaveBeenCalledWith('/rooms-now');
  });

  it('goes back to the return address after signing in', async () => {
    const setup = await render('/reports?month=2027-03');
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    (await submitAs(setup, 'casey', 'pw')).flush({ user: { username: 'casey', role: 'charge' } });
    await settle(setup.fixture);
    expect(setup.navigate).toHaveBeenCalledWith('/reports?month=2027-03');
  });

  it('ignores a return address that leaves the site', async () => {
    const setup = await render('//elsewhere.example/phish');
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    (await submitAs(setup, 'casey', 'pw')).flush({ user: { username: 'casey', role: 'charge' } });
    await settle(setup.fixture);
    expect(setup.navigate).toHaveBeenCalledWith('/day');
  });

  it('shows "Wrong username or password" on 401 and stays on the page', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    (await submitAs(setup, 'casey', 'nope')).flush(
      { error: { code: 'invalid_credentials', message: 'Invalid credentials' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    await settle(setup.fixture);
    expect(setup.page.querySelector('[role="alert"]')?.textContent).toContain('Wrong username or password');
    expect(setup.navigate).not.toHaveBeenCalled();
  });

  it("shows the server's throttle message on 429", async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    (await submitAs(setup, 'casey', 'nope')).flush(
      { error: { code: 'too_many_attempts', message: 'Too many sign-in attempts. Try again in 15 minutes.' } },
      { status: 429, statusText: 'Too Many Requests' },
    );
    await settle(setup.fixture);
    expect(setup.page.querySelector('[role="alert"]')?.textContent).toContain('Try again in 15 minutes.');
  });

  it('does not send an empty form', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    setup.page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await settle(setup.fixture);
    setup.backend.expectNone('/api/auth/login');
    expect(setup.page.textContent).toContain('Enter your username.');
  });

  it('lists the demo accounts when the server is in demo mode, and fills the form from one', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush({
      password: 'demo-pass',
      accounts: [
        { username: 'demo-charge', role: 'charge' },
        { username: 'demo-desk', role: 'frontdesk' },
      ],
    });
    await settle(setup.fixture);
    const demo = setup.page.querySelector('section.demo');
    expect(demo?.textContent).toContain('demo-pass');
    const buttons = Array.from(demo!.querySelectorAll('button'));
    expect(buttons.map((button) => button.textContent?.trim())).toEqual(['demo-charge', 'demo-desk']);
    expect(demo?.textContent).toContain('Front desk');

    buttons[1].click();
    await settle(setup.fixture);
    expect(setup.page.querySelector<HTMLInputElement>('input[formControlName="username"]')!.value).toBe('demo-desk');
    expect(setup.page.querySelector<HTMLInputElement>('input[formControlName="password"]')!.value).toBe('demo-pass');
  });

  it('shows no demo accounts when the endpoint answers 204 (not demo mode)', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush(null, { status: 204, statusText: 'No Content' });
    await settle(setup.fixture);
    expect(setup.page.querySelector('section.demo')).toBeNull();
    expect(setup.page.textContent).not.toContain('Demo accounts');
  });

  it('shows no demo accounts, and no error, when the look-up fails', async () => {
    const setup = await render();
    setup.backend.expectOne(DEMO_URL).flush({ error: { code: 'not_found', message: 'Not found' } }, { status: 404, statusText: 'Not Found' });
    await settle(setup.fixture);
    expect(setup.page.querySelector('section.demo')).toBeNull();
    expect(setup.page.textContent).not.toContain('Demo accounts');
    expect(document.querySelector('mat-snack-bar-container')).toBeNull();
  });
});
