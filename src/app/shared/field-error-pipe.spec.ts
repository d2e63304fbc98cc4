import { FormControl, Validators } from '@angular/forms';
import { controlMessage } from './field-error-pipe';

describe('controlMessage', () => {
  it('should prefer the server message over the client checks', () => {
    const c = new FormControl('', Validators.required);
    c.setErrors({ required: true, server: 'Already registered.' });
    expect(controlMessage(c, 'E-mail')).toBe('Already registered.');
  });

  it('should word the client checks with the label', () => {
    expect(controlMessage(new FormControl('', Validators.required), 'Name')).toBe('Name is required.');
    expect(controlMessage(new FormControl('abc', Validators.minLength(12)), 'Password')).toBe(
      'Use at least 12 characters.',
    );
    expect(controlMessage(new FormControl('ok', Validators.required), 'Name')).toBeNull();
  });

  it('should ask for YYYY-MM-DD when a date picker could not read the text', () => {
    const c = new FormControl(null);
    c.setErrors({ matDatepickerParse: { text: '05/05/1991' }, required: true });
    expect(controlMessage(c, 'Date of birth')).toBe('Enter the date as YYYY-MM-DD, or pick it in the calendar.');
  });
});
