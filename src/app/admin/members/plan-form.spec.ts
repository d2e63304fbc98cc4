import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { Plan } from '@contracts/membership/membership-answers';
import { PlanForm } from './plan-form';

const junior: Plan = {
  id: 2,
  code: 'junior',
  name: 'Junior',
  description: 'Under 18.',
  eligibility: 'junior',
  duesCents: 2000,
  joiningFeeCents: 0,
  active: true,
  sortOrder: 2,
};

describe('PlanForm', () => {
  let fixture: ComponentFixture<PlanForm>;
  let http: HttpTestingController;

  async function open(plan: Plan | null): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PlanForm);
    fixture.componentRef.setInput('plan', plan);
    fixture.componentRef.setInput('nextSortOrder', 4);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function type(el: HTMLElement, control: string, value: string): void {
    const input = el.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[formcontrolname=${control}]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  // The reply settles the save in a later microtask; let it run before waiting for the render it schedules.
  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  const submit = async (el: HTMLElement) => {
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    await fixture.whenStable();
  };

  /** The error text shown inside the same form field as the control. */
  const errorBeside = (el: HTMLElement, control: string) =>
    el
      .querySelector(`[formcontrolname=${control}]`)!
      .closest('mat-form-field')!
      .querySelector('mat-error')
      ?.textContent?.trim();

  afterEach(() => http.verify());

  it('should send dollars typed as "12.50" as 1250 cents when adding a plan', async () => {
    const el = await open(null);
    type(el, 'code', 'senior');
    type(el, 'name', 'Senior flyer');
    type(el, 'dues', '12.50');
    type(el, 'joiningFee', '5.05');
    await submit(el);
    const req = http.expectOne('/api/admin/members/plans');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({
      code: 'senior',
      name: 'Senior flyer',
      description: '',
      eligibility: 'any',
      duesCents: 1250,
      joiningFeeCents: 505,
      active: true,
      sortOrder: 4,
    });
    const saved: Plan[] = [];
    fixture.componentInstance.saved.subscribe((p) => saved.push(p));
    req.flush({ plan: { ...req.request.body, id: 9 } });
    await settle();
    expect(saved.map((p) => p.id)).toEqual([9]);
  });

  it('should patch an existing plan in cents without its code or who may hold it', async () => {
    const el = await open(junior);
    expect(el.querySelector<HTMLInputElement>('[formcontrolname=dues]')!.value).toBe('20.00');
    expect(el.querySelector<HTMLInputElement>('[formcontrolname=code]')!.disabled).toBe(true);
    type(el, 'dues', '12.50');
    el.querySelector<HTMLInputElement>('[formcontrolname=active] input')!.click();
    await submit(el);
    const req = http.expectOne('/api/admin/members/plans/2');
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({
      name: 'Junior',
      description: 'Under 18.',
      duesCents: 1250,
      joiningFeeCents: 0,
      active: false,
      sortOrder: 2,
    });
    req.flush({ plan: { ...junior, duesCents: 1250, active: false } });
  });

  it('should refuse dues that are not dollars and cents without calling the server', async () => {
    const el = await open(null);
    type(el, 'code', 'senior');
    type(el, 'name', 'Senior flyer');
    type(el, 'dues', '12.505');
    await submit(el);
    http.expectNone('/api/admin/members/plans');
    expect(errorBeside(el, 'dues')).toBe('Dues is not in the expected form.');
  });

  it('should show the server’s field errors beside the code and the dues fields', async () => {
    const el = await open(null);
    type(el, 'code', 'adult');
    type(el, 'name', 'Adult again');
    type(el, 'dues', '45.00');
    await submit(el);
    http.expectOne('/api/admin/members/plans').flush(
      {
        error: {
          code: 'duplicate_code',
          message: 'A plan with that code exists.',
          fields: { code: 'A plan with that code exists.', duesCents: 'Cannot be negative.' },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();
    expect(errorBeside(el, 'code')).toBe('A plan with that code exists.');
    expect(errorBeside(el, 'dues')).toBe('Cannot be negative.');
    expect(errorBeside(el, 'name')).toBeUndefined();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('A plan with that code exists.');
  });
});
