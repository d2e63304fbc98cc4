import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { DeleteAccountDialog } from './delete-account-dialog';

describe('DeleteAccountDialog', () => {
  const close = jest.fn();
  beforeEach(() => {
    close.mockReset();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
  });

  const submit = async (password: string) => {
    const fixture = TestBed.createComponent(DeleteAccountDialog);
    fixture.detectChanges();
    const input = fixture.nativeElement.querySelector('input[type="password"]') as HTMLInputElement;
    input.value = password;
    input.dispatchEvent(new Event('input'));
    (fixture.nativeElement.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    return fixture;
  };

  it('should show the server’s word beside the password and stay open when the password is wrong', async () => {
    const fixture = await submit('wrong one');
    const req = TestBed.inject(HttpTestingController).expectOne('/api/account/delete');
    expect(req.request.body).toEqual({ password: 'wrong one' });
    req.flush(
      {
        error: {
          code: 'invalid_request',
          message: 'That password is not right.',
          fields: { password: 'Not your password.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('mat-error')?.textContent).toContain('Not your password.');
    expect(fixture.nativeElement.querySelector('[role="alert"]')?.textContent).toContain('That password is not right.');
    expect(close).not.toHaveBeenCalled();
  });

  it('should close with true once the account is deleted', async () => {
    const fixture = await submit('the right one');
    TestBed.inject(HttpTestingController).expectOne('/api/account/delete').flush({ deleted: true });
    await fixture.whenStable();
    expect(close).toHaveBeenCalledWith(true);
  });

  it('should not send anything without a password', async () => {
    await submit('');
    TestBed.inject(HttpTestingController).expectNone('/api/account/delete');
    expect(close).not.toHaveBeenCalled();
  });
});
