import { ChangeDetectionStrategy, Component, provideZonelessChangeDetection } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';

/**
 * The smallest Angular 21 app, the yardstick for the storefront's initial JavaScript and its Lighthouse performance.
 * It paints one word because Lighthouse cannot score a page that paints nothing.
 */
@Component({ selector: 'ps-empty', template: '<p>Empty</p>', changeDetection: ChangeDetectionStrategy.OnPush })
class Empty {}

bootstrapApplication(Empty, { providers: [provideZonelessChangeDetection()] }).catch((err: unknown) =>
  console.error(err),
);
