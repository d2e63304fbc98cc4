import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The flying caution shown on every post the hazard rule marks; the wording matches the server's feeds. */
@Component({
  selector: 'ps-hazard-notice',
  imports: [MatIconModule],
  template: `
    <aside class="ps-caution hazard" role="note" aria-labelledby="hazard-heading">
      <h2 id="hazard-heading"><mat-icon aria-hidden="true">local_fire_department</mat-icon> Safety first</h2>
      <p>
        Rocket motors and ejection charges burn and can injure. Fly only under your national rocketry association’s
        safety code and the local aviation and fire rules, at a sanctioned launch where the range safety officer has the
        final word. High-power motors need the matching certification. What we describe here is our own experience, not
        instructions.
      </p>
    </aside>
  `,
  styles: `
    .hazard {
      margin: 16px 0 24px;
    }
    h2 {
      font-size: 1rem;
      margin: 0 0 4px;
      display: flex;
      gap: 6px;
      align-items: center;
    }
    p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HazardNotice {}
