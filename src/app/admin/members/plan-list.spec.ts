import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { Plan } from '@contracts/membership/membership-answers';
import { PlanList } from './plan-list';

const family: Plan = {
  id: 3,
  code: 'family',
  name: 'Family',
  description: 'One household.',
  eligibility: 'family',
  duesCents: 7000,
  joiningFeeCents: 1500,
  active: false,
  sortOrder: 3,
};

describe('PlanList', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  async function show(items: Plan[]): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(PlanList);
    TestBed.tick();
    TestBed.inject(HttpTestingController).expectOne('/api/admin/members/plans').flush({ items });
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('should say so when there are no plans', async () => {
    const el = await show([]);
    expect(el.querySelector('table')).toBeNull();
    expect(el.querySelector('ps-empty-state')!.textContent).toContain('No plans yet');
  });

  it('should list each plan with its dues, joining fee, who may hold it and whether it is offered', async () => {
    const el = await show([family]);
    const cells = Array.from(el.querySelectorAll('tbody td')).map((td) => td.textContent!.trim());
    expect(cells.slice(0, 6)).toEqual([
      'family',
      'Family',
      'A household at one address',
      '$70.00',
      '$15.00',
      'No, switched off',
    ]);
    expect(el.querySelector('tbody button')!.getAttribute('aria-label')).toBe('Edit the Family plan');
  });
});
