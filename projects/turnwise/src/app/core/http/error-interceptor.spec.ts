import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { ApiError } from '@shared/api/errors';
import { fakeAuth } from '../../../testing/fake-auth';
import { errorInterceptor } from './error-interceptor';
import { ErrorNotice } from './error-notice';
import { showsOwnErrors } from './shows-own-errors';

function setUp() {
  const { fake, provider } = fakeAuth({ username: 'casey', role: 'charge' });
  const notice = { show: jest.fn() };
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provider,
      { provide: ErrorNotice, useValue: notice },
    ],
  });
  const router = TestBed.inject(Router);
  jest.spyOn(router, 'url', 'get').mockReturnValue('/day?date=2027-03-14');
  const navigate = jest.spyOn(router, 'navigate').mockResolvedValue(true);
  return {
    auth: fake,
    notice,
    navigate,
    http: TestBed.inject(HttpClient),
    backend: TestBed.inject(HttpTestingController),
  };
}

/** Sends a request, answers it with the given failure and returns what the caller receives. */
async function fail(
  setup: ReturnType<typeof setUp>,
  url: string,
  body: string | object | null,
  status: number,
  options: { ownErrors?: boolean } = {},
): Promise<ApiError> {
  const result = firstValueFrom(
    setup.http.get(url, options.ownErrors ? { context: showsOwnErrors() } : {}),
  ).then(
    () => {
      throw new Error('expected the request to fail');
    },
    (error: ApiError) => error,
  );
  setup.backend.expectOne(url).flush(body, { status, statusText: 'x' });
  return result;
}

describe('errorInterceptor', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('turns a 500 into an ApiError and shows the server message to the user', async () => {
    const setup = setUp();
    const error = await fail(setup, '/api/rooms', { error: { code: 'internal', message: 'The database is busy.' } }, 500);
    expect(error).toEqual({ status: 500, code: 'internal', message: 'The database is busy.' });
    expect(setup.notice.show).toHaveBeenCalledWith('The database is busy.');
    expect(setup.navigate).not.toHaveBeenCalled();
  });

  it('on a 401 forgets the user and sends them to sign in, coming back to where they were', async () => {
    const setup = setUp();
    const error = await fail(setup, '/api/days/2027-03-14/plan', { error: { code: 'unauthenticated', message: 'Sign in first.' } }, 401);
    expect(error.status).toBe(401);
    expect(setup.auth.clear).toHaveBeenCalled();
    expect(setup.navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/day?date=2027-03-14' } });
    expect(setup.notice.show).not.toHaveBeenCalled();
  });

  it('after a sign-out, a late 401 of a call still under way does not send the user back with a returnUrl', async () => {
    const setup = setUp();
    setup.auth.signInAs(null);
    await fail(setup, '/api/setup/checklist', { error: { code: 'unauthenticated', message: 'Sign in first.' } }, 401);
    expect(setup.navigate).not.toHaveBeenCalled();
    expect(setup.notice.show).not.toHaveBeenCalled();
  });

  it('leaves a 401 from the "who am I" call alone: that is how signed-out is learned', async () => {
    const setup = setUp();
    await fail(setup, '/api/auth/me', { error: { code: 'unauthenticated', message: 'Sign in first.' } }, 401, { ownErrors: true });
    expect(setup.auth.clear).not.toHaveBeenCalled();
    expect(setup.navigate).not.toHaveBeenCalled();
    expect(setup.notice.show).not.toHaveBeenCalled();
  });

  it('skips the snack bar when the caller shows the error itself, still handing over an ApiError', async () => {
    const setup = setUp();
    const error = await fail(setup, '/api/exams/7', { error: { code: 'stale_version', message: 'Someone moved this slot first.' } }, 409, { ownErrors: true });
    expect(error).toEqual({ status: 409, code: 'stale_version', message: 'Someone moved this slot first.' });
    expect(setup.notice.show).not.toHaveBeenCalled();
  });

  it('hands over the refusal\'s details, so no caller reads the English message to decide', async () => {
    const setup = setUp();
    const error = await fail(
      setup,
      '/api/turnovers/4/steps',
      { error: { code: 'surface_wet', message: 'The table is still wet.', details: { wet: ['table'] } } },
      422,
      { ownErrors: true },
    );
    expect(error).toEqual({ status: 422, code: 'surface_wet', message: 'The table is still wet.', details: { wet: ['table'] } });
  });

  it('keeps an import refusal\'s per-row errors and table as details, through the one HttpClient', async () => {
    const setup = setUp();
    const refusal = {
      error: { code: 'validation_failed', message: 'The file has 1 error.' },
      errors: [{ row: 2, column: 'duration_min', message: 'must be a whole number' }],
      table: [['accession', 'duration_min'], ['A1', 'x']],
    };
    const error = await fail(setup, '/api/days/2027-03-14/exams/import', refusal, 422, { ownErrors: true });
    expect(error.details).toEqual({ errors: refusal.errors, table: refusal.table });
  });

  it('keeps a short plain-text body, as a rate limiter might send', async () => {
    const setup = setUp();
    const error = await fail(setup, '/api/rooms', 'Too many attempts, wait a minute.', 429);
    expect(error).toEqual({ status: 429, code: 'http_429', message: 'Too many attempts, wait a minute.' });
  });

  it('explains an unreachable server instead of showing "HTTP 0"', async () => {
    const setup = setUp();
    const result = firstValueFrom(setup.http.get('/api/rooms')).catch((error: ApiError) => error);
    setup.backend.expectOne('/api/rooms').error(new ProgressEvent('error'));
    const error = (await result) as ApiError;
    expect(error.status).toBe(0);
    expect(error.code).toBe('unreachable');
    expect(setup.notice.show).toHaveBeenCalledWith(expect.stringContaining('cannot reach'));
  });
});
