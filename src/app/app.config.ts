import { ApplicationConfig, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { provideHttpClient, withFetch, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { provideClientHydration, withIncrementalHydration } from '@angular/platform-browser';
import { provideRouter, withComponentInputBinding, withInMemoryScrolling } from '@angular/router';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/csrf-interceptor';
import { errorInterceptor } from './core/error-interceptor';

/**
 * Nothing waits for the API before the first paint: server-rendered pages arrive with their data (transfer state),
 * SiteNames and SessionStore fill in as their answers come, and the guards wait for the session themselves.
 */
export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding(), withInMemoryScrolling({ scrollPositionRestoration: 'enabled' })),
    // Our own CSRF header (X-CSRF-Token from /api/auth/csrf) replaces Angular's cookie-based one.
    provideHttpClient(
      withFetch(),
      withXsrfConfiguration({ cookieName: 'unused', headerName: 'unused' }),
      withInterceptors([csrfInterceptor, errorInterceptor]),
    ),
    // A tap before the script has arrived is replayed once the page is live (incremental hydration replays events
    // too); `@defer (hydrate on ...)` blocks stay server-rendered and load their code only when their trigger fires.
    provideClientHydration(withIncrementalHydration()),
  ],
};
