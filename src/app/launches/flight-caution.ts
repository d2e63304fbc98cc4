import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The caution on every flight page and the range table, in Padside's words. */
@Component({
  selector: 'ps-flight-caution',
  template: `
    <aside class="ps-caution" role="note" aria-label="Who decides">
      <strong>Padside keeps the record; people decide.</strong>
      The range safety officer decides what flies, from which pad and when, whatever this page shows. Fly under your
      national association's safety code and the local aviation and fire rules.
    </aside>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightCaution {}
