import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { ClubRulesForm } from './club-rules-form';
import type { MembershipSettings } from '@contracts/membership/club-rules-schemas';
import { DEFAULT_CERTIFICATION_LEVELS } from '@contracts/membership/certification-levels';

const rules: MembershipSettings = {
  termRule: 'calendar',
  lateSeasonFrom: '09-01',
  graceDays: 30,
  prorate: false,
  waiverVersion: '2026-1',
  waiverText: 'I fly at my own risk.',
  safetyCodeVersion: '2026-1',
  associationName: 'the national association',
  certificationLevels: DEFAULT_CERTIFICATION_LEVELS.slice(0, 3),
};

describe('ClubRulesForm certification levels', () => {
  let fixture: ComponentFixture<ClubRulesForm>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ClubRulesForm);
    TestBed.tick();
    http.expectOne('/api/admin/members/settings').flush({ settings: rules });
    await fixture.whenStable();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  const rows = () => Array.from(el.querySelectorAll<HTMLElement>('[data-testid=level-row]'));
  const field = (row: HTMLElement, name: 'code' | 'label') =>
    row.querySelector<HTMLInputElement>(`[formcontrolname=${name}]`)!;
  const type = (input: HTMLInputElement, value: string) => {
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };
  const button = (name: string) =>
    Array.from(el.querySelectorAll<HTMLButtonElement>('button')).find(
      (b) => (b.getAttribute('aria-label') ?? b.textContent!.trim()) === name,
    )!;
  const save = async () => {
    button('Save club rules').click();
    await fixture.whenStable();
    const req = http.expectOne('/api/admin/members/settings');
    expect(req.request.method).toBe('PUT');
    return req;
  };
  // The reply settles the save in a later microtask; let it run before waiting for the render it schedules.
  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  it('should keep "none" first with no way to move or remove it, and saved codes fixed', async () => {
    expect(rows().map((r) => field(r, 'code').value)).toEqual(['none', 'L1', 'L2']);
    expect(rows()[0].querySelectorAll('button')).toHaveLength(0);
    expect(rows().every((r) => field(r, 'code').disabled)).toBe(true);
    expect(button('Move Level 1 up').disabled).toBe(true);
    expect(button('Move Level 2 down').disabled).toBe(true);
  });

  it('should send a new level at the end, and a moved level in its new place', async () => {
    button('Add a level').click();
    await fixture.whenStable();
    const added = rows()[3];
    expect(field(added, 'code').disabled).toBe(false);
    type(field(added, 'code'), 'L3');
    type(field(added, 'label'), 'Level 3');
    button('Move Level 1 down').click();
    await fixture.whenStable();
    const req = await save();
    expect(req.request.body).toEqual({
      ...rules,
      certificationLevels: [
        rules.certificationLevels[0],
        rules.certificationLevels[2],
        rules.certificationLevels[1],
        { code: 'L3', label: 'Level 3' },
      ],
    });
    req.flush({ settings: req.request.body });
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
    http.expectOne('/api/admin/members/settings').flush({ settings: req.request.body });
    await fixture.whenStable();
    expect(el.querySelector('.notice')!.textContent).toContain('Club rules saved.');
    expect(rows().map((r) => [field(r, 'code').value, field(r, 'code').disabled])).toEqual([
      ['none', true],
      ['L2', true],
      ['L1', true],
      ['L3', true],
    ]);
  });

  it('should put the server’s word on a level still held beside the list, and on a bad code in its row', async () => {
    button('Add a level').click();
    await fixture.whenStable();
    type(field(rows()[3], 'code'), 'l1');
    type(field(rows()[3], 'label'), 'Level one');
    button('Remove Level 2').click();
    await fixture.whenStable();
    const req = await save();
    expect(req.request.body.certificationLevels).toEqual([
      rules.certificationLevels[0],
      rules.certificationLevels[1],
      { code: 'l1', label: 'Level one' },
    ]);
    req.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fields: {
            certificationLevels: 'Still held: L2 (3 members).',
            'certificationLevels.2.code': 'This code is already in the list.',
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    const fieldset = el.querySelector('fieldset')!;
    expect(fieldset.querySelector('.field-problem[role=alert]')!.textContent).toContain('Still held: L2 (3 members).');
    expect(field(rows()[2], 'code').closest('mat-form-field')!.querySelector('mat-error')!.textContent).toContain(
      'This code is already in the list.',
    );
  });
});
