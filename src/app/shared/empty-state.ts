import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** What a list shows when it has nothing in it: an icon, a sentence and an optional next step (projected). */
@Component({
  selector: 'ps-empty-state',
  imports: [MatIconModule],
  template: `
    <div class="empty" role="status">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <p>{{ message() }}</p>
      <ng-content />
    </div>
  `,
  styles: `
    .empty {
      text-align: center;
      padding: 40px 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    mat-icon {
      font-size: 40px;
      width: 40px;
      height: 40px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmptyState {
  readonly icon = input('inventory_2');
  readonly message = input.required<string>();
}
