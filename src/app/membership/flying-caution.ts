import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** The flying caution for dues, card and check-in pages, in Padside's words. */
@Component({
  selector: 'ps-flying-caution',
  template: `
    <aside class="ps-caution" role="note" aria-label="Before you fly">
      <strong>Before you fly.</strong>
      Flying at a club launch needs current club dues and a current membership with {{ associationName() }}, which
      carries the insurance. Every flight follows the association's safety code and the local aviation and fire rules.
      High-power motors need the matching certification level. The range safety officer has the final word on every
      flight.
    </aside>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlyingCaution {
  readonly associationName = input('your national rocketry association');
}
