import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { CertificationClasses } from './certification-classes';

const letters = (last: string) =>
  Array.from({ length: last.charCodeAt(0) - 64 }, (_v, i) => String.fromCharCode(65 + i));

describe('CertificationClasses', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [CertificationClasses],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });

  async function open() {
    const fixture = TestBed.createComponent(CertificationClasses);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/membership/policy').flush({
      certificationLevels: [
        { code: 'none', label: 'No high-power certification' },
        { code: 'L1', label: 'Level 1' },
        { code: 'L2', label: 'Level 2' },
      ],
    });
    http
      .expectOne('/api/admin/launches/settings')
      .flush({ classesByLevel: { none: letters('G'), L1: letters('I'), L2: letters('L'), OLD: ['A'] } });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const input = (code: string) => el.querySelector<HTMLInputElement>(`[data-testid=classes-${code}] input`)!;
    const type = (code: string, text: string) => {
      input(code).value = text;
      input(code).dispatchEvent(new Event('input'));
    };
    const submit = async () => {
      el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
      await fixture.whenStable();
      fixture.detectChanges();
    };
    return { fixture, http, el, input, type, submit };
  }

  it('should show each membership level with its classes as ranges, and a level the list no longer has', async () => {
    const { el, input } = await open();
    expect(input('none').value).toBe('A-G');
    expect(input('L2').value).toBe('A-L');
    expect(
      el.querySelector('[data-testid=classes-L1] mat-label, [data-testid=classes-L1] label')!.textContent,
    ).toContain('Level 1');
    expect(el.querySelector('[data-testid=classes-OLD]')!.textContent).toContain('no longer a membership level');
  });

  it('should save the classes typed as letters, level by level', async () => {
    const { fixture, http, el, type, submit, input } = await open();
    type('L1', 'a-g, h i');
    await submit();
    const req = http.expectOne('/api/admin/launches/settings');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body.classesByLevel).toEqual({
      none: letters('G'),
      L1: letters('I'),
      L2: letters('L'),
      OLD: ['A'],
    });
    req.flush(req.request.body);
    await new Promise((r) => setTimeout(r));
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('.notice[role=status]')!.textContent).toContain('Saved');
    // Written back as the shortest text that reads the same.
    expect(input('L1').value).toBe('A-I');
  });

  it('should keep a list it cannot read from the server and say why beside the field', async () => {
    const { http, el, type, submit } = await open();
    type('L2', 'A-L, 7');
    await submit();
    http.expectNone('/api/admin/launches/settings');
    expect(el.querySelector('[data-testid=classes-L2] mat-error')!.textContent).toContain('Use letters and ranges');
  });

  it('should ask for at least one class for every level', async () => {
    const { http, el, type, submit } = await open();
    type('L1', '');
    await submit();
    http.expectNone('/api/admin/launches/settings');
    expect(el.querySelector('[data-testid=classes-L1] mat-error')!.textContent).toContain('List at least one class.');
  });

  it("should put the server's word beside the level it names", async () => {
    const { fixture, http, el, submit } = await open();
    await submit();
    http.expectOne('/api/admin/launches/settings').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fields: { 'classesByLevel.L1.3': 'Use one letter per class.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await new Promise((r) => setTimeout(r));
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('Some fields need attention.');
    expect(el.querySelector('[data-testid=classes-L1] mat-error')!.textContent).toContain('Use one letter per class.');
  });
});
