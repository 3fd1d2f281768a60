import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import type { EnvironmentProviders } from '@angular/core';

import { errorInterceptor } from './error-interceptor';

/**
 * The app's one HttpClient: every failure becomes a typed ApiError (details included) and every
 * state-changing request carries the XSRF header the server checks against its cookie. Specs
 * provide the same, so what a screen receives in a test is what it receives in the app.
 */
export function provideApiHttp(): EnvironmentProviders {
  return provideHttpClient(
    withInterceptors([errorInterceptor]),
    withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
  );
}
