import { ApplicationConfig, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection, inject, provideAppInitializer } from '@angular/core';
import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { provideRouter, withComponentInputBinding, withInMemoryScrolling } from '@angular/router';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/csrf-interceptor';
import { errorInterceptor } from './core/error-interceptor';
import { SessionStore } from './core/session-store';
import { SiteNames } from './core/site-names';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding(), withInMemoryScrolling({ scrollPositionRestoration: 'enabled' })),
    // Our own CSRF header (X-CSRF-Token from /api/auth/csrf) replaces Angular's cookie-based one.
    provideHttpClient(withXsrfConfiguration({ cookieName: 'unused', headerName: 'unused' }), withInterceptors([csrfInterceptor, errorInterceptor])),
    provideAppInitializer(() => Promise.all([inject(SessionStore).load(), inject(SiteNames).load()])),
  ],
};
