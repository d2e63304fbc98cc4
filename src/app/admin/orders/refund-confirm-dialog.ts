import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MoneyPipe } from '../../shared/money-pipe';
import type { RefundPreview } from '@contracts/shop/staff-order-answers';

/** What the confirmation shows: the computed refund, the lines it covers and the units going back on sale. */
export interface RefundConfirmData {
  orderNumber: string;
  preview: RefundPreview;
  lines: { label: string; quantity: number; goodsCents: number }[];
  unitsBackOnSale: number;
}

/** The treasurer's last look at a refund before it goes to the card: goods, shipping, each tax, the total. */
@Component({
  selector: 'ps-refund-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule, MoneyPipe],
  templateUrl: './refund-confirm-dialog.html',
  styleUrl: './refund-confirm-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RefundConfirmDialog {
  protected readonly data = inject<RefundConfirmData>(MAT_DIALOG_DATA);
}
