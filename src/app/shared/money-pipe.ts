import { Pipe, PipeTransform } from '@angular/core';

const CAD = new Intl.NumberFormat('en-CA', { style: 'currency', currency: 'CAD' });

/** Integer cents as Canadian dollars: `{{ 1999 | money }}` -> `$19.99`. */
@Pipe({ name: 'money' })
export class MoneyPipe implements PipeTransform {
  transform(cents: number | null | undefined): string {
    return cents === null || cents === undefined ? '' : CAD.format(cents / 100);
  }
}
