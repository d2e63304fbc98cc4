import { HttpBackend } from '@angular/common/http';
import { type ApplicationConfig, CSP_NONCE, mergeApplicationConfig } from '@angular/core';
import { provideServerRendering, withRoutes } from '@angular/ssr';
import { appConfig } from './app.config';
import { serverRoutes } from './app.routes.server';
import { LoopbackBackend } from './core/rendering/loopback-backend';
import { renderContext } from './core/rendering/render-context';

/** The server render: the browser app's providers, the server routes, the visitor-only HTTP and the nonce. */
export const serverConfig: ApplicationConfig = mergeApplicationConfig(appConfig, {
  providers: [
    provideServerRendering(withRoutes(serverRoutes)),
    { provide: HttpBackend, useClass: LoopbackBackend },
    { provide: CSP_NONCE, useFactory: () => renderContext()?.nonce ?? null },
  ],
});
