import { TestBed } from '@angular/core/testing';
import { SiteNames } from '../../core/site-names';
import { UNKNOWN_CARD, type CheckInResult } from '@contracts/membership/check-in-answers';
import { CheckInVerdict } from './check-in-verdict';

const claimed: CheckInResult = {
  status: 'active',
  memberNumber: '01042',
  name: 'Wren Okonkwo',
  mayFly: false,
  termEnd: '2028-12-31',
  associationName: 'the Sprocketeer Rocketry Association',
  dues: { answer: 'current', termEnd: '2028-12-31' },
  association: { answer: 'claimed', number: 'NA-31337', expires: '2099-12-31', verified: null },
  certification: { answer: 'claimed', level: 'L3', label: 'Level 3', verified: null },
};

const checked = {
  at: '2028-04-10T17:00:00.000Z',
  by: 'Tess Treasurer',
  against: 'association card, seen at the field',
};

describe('CheckInVerdict', () => {
  beforeEach(() =>
    TestBed.configureTestingModule({
      providers: [{ provide: SiteNames, useValue: { timeZone: () => 'America/Winnipeg' } }],
    }),
  );
  function render(result: CheckInResult): HTMLElement {
    const fixture = TestBed.createComponent(CheckInVerdict);
    fixture.componentRef.setInput('result', result);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }
  const answer = (el: HTMLElement, key: string) => el.querySelector(`[data-testid=answer-${key}]`)!;

  it('should show claims in words, not as ticks, and not clear the member to fly', () => {
    const el = render(claimed);
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.querySelector('h2')!.textContent).toContain('Not cleared to fly');
    expect(verdict.classList).toContain('stop');
    expect(verdict.classList).not.toContain('ok');
    expect(answer(el, 'dues').textContent).toContain('current to Dec 31, 2028');
    expect(answer(el, 'dues').classList).toContain('ok');
    for (const key of ['association', 'certification']) {
      expect(answer(el, key).textContent).toContain('claimed, not yet checked');
      expect(answer(el, key).classList).toContain('claim');
      expect(answer(el, key).textContent).not.toContain('✓');
    }
    expect(answer(el, 'association').textContent).toContain('Association membership:');
    expect(answer(el, 'certification').textContent).toContain('Level 3');
  });

  it('should clear the member to fly only when the server says so, naming who checked what', () => {
    const el = render({
      ...claimed,
      mayFly: true,
      association: { ...claimed.association!, answer: 'verified', expires: '2028-12-31', verified: checked },
    });
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.querySelector('h2')!.textContent).toContain('May fly');
    expect(verdict.classList).toContain('ok');
    expect(answer(el, 'association').textContent).toContain(
      'NA-31337, current to Dec 31, 2028; checked Apr 10, 2028 by Tess Treasurer against association card, seen at the field',
    );
    expect(answer(el, 'association').querySelector('.mark')!.textContent).toBe('✓');
    // The certification stays a separate answer: still a claim.
    expect(answer(el, 'certification').textContent).toContain('claimed, not yet checked');
  });

  it('should say why not: lapsed dues and an expired association, each in words', () => {
    const el = render({
      ...claimed,
      status: 'lapsed',
      dues: { answer: 'not_current', termEnd: '2027-12-31' },
      association: { ...claimed.association!, answer: 'expired', expires: '2028-01-31' },
    });
    expect(answer(el, 'dues').textContent).toContain('not current: the term ended Dec 31, 2027');
    expect(answer(el, 'dues').classList).toContain('stop');
    expect(answer(el, 'association').textContent).toContain('expired Jan 31, 2028');
  });

  it('should defer to the range safety officer', () => {
    expect(render(claimed).textContent).toContain('The range safety officer decides');
  });

  it('should show an unknown card without member details', () => {
    const el = render(UNKNOWN_CARD);
    expect(el.querySelector('h2')!.textContent).toContain('Unknown card');
    expect(el.querySelector('ul')).toBeNull();
  });
});
