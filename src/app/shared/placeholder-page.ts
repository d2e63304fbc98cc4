import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';

/** A page whose feature has not landed yet; it says which piece of work fills it. */
@Component({
  selector: 'ps-placeholder-page',
  imports: [MatCardModule],
  template: `
    <section class="ps-page">
      <h1>{{ heading() }}</h1>
      <mat-card appearance="outlined">
        <mat-card-content>
          <p>{{ text() }}</p>
        </mat-card-content>
      </mat-card>
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlaceholderPage {
  readonly heading = input.required<string>();
  readonly text = input.required<string>();
}
