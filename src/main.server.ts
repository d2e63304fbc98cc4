import { type BootstrapContext, bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { serverConfig } from './app/app.config.server';

/** The server build's bootstrap: the same app, with the server-only providers. */
export default function bootstrap(context: BootstrapContext) {
  return bootstrapApplication(App, serverConfig, context);
}
