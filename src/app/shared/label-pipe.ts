import { Pipe, PipeTransform } from '@angular/core';
import { labelOf } from '@contracts/labels/label-of';

/** A code as the words people read, from one of the label maps in `contracts/labels`: `{{ r.state | label: runStates }}`. */
@Pipe({ name: 'label' })
export class LabelPipe implements PipeTransform {
  transform(code: string | null | undefined, labels: Readonly<Record<string, string>>): string {
    return labelOf(labels, code);
  }
}
