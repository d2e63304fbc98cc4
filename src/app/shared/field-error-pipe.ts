import { Pipe, PipeTransform } from '@angular/core';
import { AbstractControl } from '@angular/forms';

/** The one message to show for a control: the server's word first, then the client's checks. */
export function controlMessage(control: AbstractControl, label: string): string | null {
  const e = control.errors;
  if (!e) return null;
  if (e['server']) return e['server'] as string;
  // A date picker's input holds text it could not read as a date.
  if (e['matDatepickerParse']) return 'Enter the date as YYYY-MM-DD, or pick it in the calendar.';
  if (e['required']) return `${label} is required.`;
  if (e['email']) return 'Enter a valid e-mail address.';
  if (e['minlength'])
    return `Use at least ${(e['minlength'] as { requiredLength: number }).requiredLength} characters.`;
  if (e['maxlength']) return `Use at most ${(e['maxlength'] as { requiredLength: number }).requiredLength} characters.`;
  if (e['min']) return `Must be at least ${(e['min'] as { min: number }).min}.`;
  if (e['max']) return `Must be at most ${(e['max'] as { max: number }).max}.`;
  if (e['pattern']) return `${label} is not in the expected form.`;
  return `${label} needs attention.`;
}

/**
 * `<mat-error>{{ form.controls.email | fieldError: 'E-mail' }}</mat-error>`. Impure on purpose: control errors
 * are not signals, and server errors arrive without a value change.
 */
@Pipe({ name: 'fieldError', pure: false })
export class FieldErrorPipe implements PipeTransform {
  transform(control: AbstractControl, label: string): string | null {
    return controlMessage(control, label);
  }
}
