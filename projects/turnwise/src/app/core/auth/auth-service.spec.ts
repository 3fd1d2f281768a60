import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';

import { errorInterceptor } from '../http/error-interceptor';
import { AuthService } from './auth-service';

function setUp() {
  const snackBar = { open: jest.fn() };
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      { provide: MatSnackBar, useValue: snackBar },
    ],
  });
  return { auth: TestBed.inject(AuthService), backend: TestBed.inject(HttpTestingController), snackBar };
}

const unauthenticated = { error: { code: 'unauthenticated', message: 'Sign in first.' } };

describe('AuthService', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('load() asks the server once and remembers the answer', async () => {
    const { auth, backend } = setUp();
    const first = auth.load();
    const second = auth.load();
    backend.expectOne('/api/auth/me').flush({ user: { username: 'casey', role: 'charge' } });
    await expect(first).resolves.toEqual({ username: 'casey', role: 'charge' });
    await expect(second).resolves.toEqual({ username: 'casey', role: 'charge' });
    await auth.load();
    backend.expectNone('/api/auth/me');
    expect(auth.user()).toEqual({ username: 'casey', role: 'charge' });
  });

  it('load() treats 401 as signed out, quietly', async () => {
    const { auth, backend, snackBar } = setUp();
    const loaded = auth.load();
    backend.expectOne('/api/auth/me').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    await expect(loaded).resolves.toBeNull();
    expect(auth.user()).toBeNull();
    expect(snackBar.open).not.toHaveBeenCalled();
  });

  it('login() posts the credentials and sets the user', async () => {
    const { auth, backend } = setUp();
    const signedIn = auth.login('pat', 'secret');
    const request = backend.expectOne('/api/auth/login');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ username: 'pat', password: 'secret' });
    request.flush({ user: { username: 'pat', role: 'tech' } });
    await signedIn;
    expect(auth.user()).toEqual({ username: 'pat', role: 'tech' });
  });

  it('login() rejects with an ApiError on wrong credentials and leaves the user signed out', async () => {
    const { auth, backend, snackBar } = setUp();
    const signedIn = auth.login('pat', 'wrong');
    backend.expectOne('/api/auth/login').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    await expect(signedIn).rejects.toMatchObject({ status: 401, code: 'unauthenticated' });
    expect(auth.user()).toBeNull();
    expect(snackBar.open).not.toHaveBeenCalled();
  });

  it('logout() forgets the user even when the server cannot be reached', async () => {
    const { auth, backend } = setUp();
    const signedIn = auth.login('pat', 'secret');
    backend.expectOne('/api/auth/login').flush({ user: { username: 'pat', role: 'tech' } });
    await signedIn;
    const signedOut = auth.logout();
    backend.expectOne('/api/auth/logout').error(new ProgressEvent('error'));
    await expect(signedOut).rejects.toMatchObject({ status: 0 });
    expect(auth.user()).toBeNull();
    await expect(auth.load()).resolves.toBeNull();
  });
});
