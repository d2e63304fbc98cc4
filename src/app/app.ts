import { ChangeDetectionStrategy, Component } from '@angular/core';
import { Shell } from './core/shell/shell';

/** The root: everything sits inside Padside's shell. */
@Component({
  selector: 'ps-root',
  imports: [Shell],
  template: '<ps-shell />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {}
