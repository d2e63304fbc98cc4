import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { SignUpForm } from './sign-up-form';

const WORDING = {
  version: '2026-12-v1',
  text: 'Yes, the team may e-mail me about the lists I ticked.',
  topics: [
    { code: 'drops', label: 'new runs and drops' },
    { code: 'launches', label: 'launch days' },
    { code: 'build-logs', label: 'new build logs' },
  ],
};

describe('SignUpForm', () => {
  let fixture: ComponentFixture<SignUpForm>;
  let http: HttpTestingController;

  async function open(inputs: Record<string, unknown> = {}): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignUpForm);
    for (const [k, v] of Object.entries(inputs)) fixture.componentRef.setInput(k, v);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/subscriptions/wording').flush(WORDING);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  function typeEmail(el: HTMLElement, value: string): void {
    const input = el.querySelector<HTMLInputElement>('[formcontrolname=email]')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  const tick = (el: HTMLElement, label: string) => {
    const box = Array.from(el.querySelectorAll('mat-checkbox')).find((b) => b.textContent?.includes(label))!;
    (box.querySelector('input') as HTMLInputElement).click();
  };

  it('should show the consent wording and every list', async () => {
    const el = await open();
    expect(el.textContent).toContain(WORDING.text);
    expect(Array.from(el.querySelectorAll('mat-checkbox')).map((b) => b.textContent?.trim())).toEqual([
      'new runs and drops',
      'launch days',
      'new build logs',
    ]);
  });

  it('should ask for a list before sending anything', async () => {
    const el = await open();
    typeEmail(el, 'wren@example.test');
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    await fixture.whenStable();
    expect(el.textContent).toContain('Tick at least one list.');
    http.expectNone('/api/subscriptions');
  });

  it('should send the ticked lists with the page and say to check the inbox', async () => {
    const el = await open();
    tick(el, 'launch days');
    typeEmail(el, 'wren@example.test');
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    const req = http.expectOne('/api/subscriptions');
    expect(req.request.body).toEqual({ email: 'wren@example.test', topics: ['launches'], page: 'home' });
    req.flush({ queued: true }, { status: 202, statusText: 'Accepted' });
    await settle();
    expect(el.querySelector('[data-testid=sign-up-sent]')?.textContent).toContain('Check your inbox');
  });

  it('should offer only the next run of a product on its page, and send the product', async () => {
    const el = await open({ page: 'product', productId: 12, productName: 'Nose cone tee' });
    expect(Array.from(el.querySelectorAll('mat-checkbox')).map((b) => b.textContent?.trim())).toEqual([
      'the next run of Nose cone tee',
    ]);
    typeEmail(el, 'osric@example.test');
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    const req = http.expectOne('/api/subscriptions');
    expect(req.request.body).toEqual({
      email: 'osric@example.test',
      topics: ['drops'],
      page: 'product',
      productId: 12,
    });
    req.flush({ queued: true }, { status: 202, statusText: 'Accepted' });
    await settle();
  });

  it('should show the server’s message beside the e-mail field', async () => {
    const el = await open();
    tick(el, 'new build logs');
    typeEmail(el, 'wren@example.test');
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    http.expectOne('/api/subscriptions').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fields: { email: 'Enter a valid e-mail address.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(el.querySelector('mat-form-field')?.textContent).toContain('Enter a valid e-mail address.');
    expect(el.querySelector('[role=alert]')?.textContent).toContain('Some fields need attention.');
  });
});
