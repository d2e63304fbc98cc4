import { afterNextRender, type Injector } from '@angular/core';

// Controls that take focus themselves, then Material wrappers whose inner input does.
const FIELD =
  'input.ng-invalid, textarea.ng-invalid, mat-select.ng-invalid, mat-checkbox.ng-invalid, mat-radio-group.ng-invalid, mat-slide-toggle.ng-invalid';

/**
 * After a refused submit, moves focus to the first field in `host` that needs attention, so a person on a phone
 * (or with a screen reader) lands on the message instead of staying on the button far below it. Runs after the next
 * render, when server errors have reached the fields' classes.
 */
export function focusFirstInvalid(host: HTMLElement, injector: Injector): void {
  afterNextRender(
    {
      write: () => {
        const field = host.querySelector<HTMLElement>(FIELD);
        if (!field) return;
        const target = field.matches('input, textarea, mat-select')
          ? field
          : (field.querySelector<HTMLElement>('input, button') ?? field);
        target.focus();
        target.scrollIntoView({ block: 'center' });
      },
    },
    { injector },
  );
}
