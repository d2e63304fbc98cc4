import { ChangeDetectionStrategy, Component, provideZonelessChangeDetection } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';

/** The smallest Angular 21 app, the yardstick for the storefront's initial JavaScript. */
@Component({ selector: 'ps-empty', template: '', changeDetection: ChangeDetectionStrategy.OnPush })
class Empty {}

bootstrapApplication(Empty, { providers: [provideZonelessChangeDetection()] }).catch((err: unknown) => console.error(err));
