// Application-wide providers: zoneless change detection, the router, HTTP with CSRF and error handling.
import {
  ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { provideRouter, withComponentInputBinding, withInMemoryScrolling, withRouterConfig } from '@angular/router';
import { routes } from './app.routes';
import { Session } from './core/auth/session';
import { provideApiHttp } from './core/http/provide-api-http';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    // Child pages of a build read :buildId as an input, so parameters are inherited.
    provideRouter(
      routes,
      withComponentInputBinding(),
      withRouterConfig({ paramsInheritanceStrategy: 'always' }),
      withInMemoryScrolling({ scrollPositionRestoration: 'top' }),
    ),
    provideApiHttp(),
    // Start loading the signed-in person at once; guards and the top bar wait on the same request.
    provideAppInitializer(() => {
      void inject(Session).load();
    }),
  ],
};
