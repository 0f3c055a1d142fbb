// Application-wide providers: zoneless change detection, the router, HTTP with CSRF and error handling, the service worker.
import {
  ApplicationConfig,
  inject,
  Injector,
  isDevMode,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { provideServiceWorker } from '@angular/service-worker';
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
    // The installed app: the shell and the builds last seen load without signal (ngsw-config.json). Registered once
    // the app is stable, or after 30 s at most, so it never competes with the first screen.
    provideServiceWorker('ngsw-worker.js', { enabled: !isDevMode(), registrationStrategy: 'registerWhenStable:30000' }),
    // Start loading the signed-in person at once; guards and the top bar wait on the same request.
    provideAppInitializer(() => {
      const injector = inject(Injector);
      // Captures left waiting by an earlier visit are sent once someone is signed in, whatever page opens; the queue
      // is loaded lazily so it adds nothing to the first screen's download.
      void inject(Session)
        .load()
        .then((user) => user && import('./features/receipts/services/capture-queue').then(({ CaptureQueue }) => injector.get(CaptureQueue)));
    }),
  ],
};
