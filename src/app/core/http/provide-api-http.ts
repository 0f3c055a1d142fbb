// The HTTP client set-up for the API, shared by the app and its tests so both run the same chain.
import { EnvironmentProviders } from '@angular/core';
import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { apiErrorInterceptor } from './api-error-interceptor';

export function provideApiHttp(): EnvironmentProviders {
  return provideHttpClient(
    withInterceptors([apiErrorInterceptor]),
    // Angular adds the header only to mutating requests with relative URLs, which is all we send.
    withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
  );
}
