import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { formatDate, formatDay } from '@contracts/dates/club-dates';
import type { CheckedBy, CheckInResult } from '@contracts/membership/check-in-answers';
import { SiteNames } from '../../core/site-names';

/** ok: a fact on record; claim: the member's word, not yet checked; stop: missing, expired or not current. */
type Tone = 'ok' | 'claim' | 'stop';

interface Answer {
  key: string;
  label: string;
  words: string;
  tone: Tone;
}

// A mark beside the words (the words carry the meaning; the mark is decoration for sighted staff).
const MARK: Record<Tone, string> = { ok: '✓', claim: '?', stop: '✗' };

/** The three answers in words, for a member the card matched; dates in the club format, checks dated in club time. */
export function checkInAnswers(r: CheckInResult, timeZone: string): Answer[] {
  const checked = (v: CheckedBy) =>
    `checked ${formatDate(v.at, timeZone)}${v.by ? ` by ${v.by}` : ''} against ${v.against}`;
  const d = r.dues!;
  const a = r.association!;
  const c = r.certification!;
  const dues: Answer = {
    key: 'dues',
    label: 'Club dues',
    ...(d.answer === 'current'
      ? { words: `current to ${formatDay(d.termEnd ?? '')}`, tone: 'ok' as const }
      : d.answer === 'grace'
        ? { words: `in grace: the term ended ${formatDay(d.termEnd ?? '')}`, tone: 'ok' as const }
        : {
            words: `not current: the term ended ${d.termEnd ? formatDay(d.termEnd) : 'without a payment'}`,
            tone: 'stop' as const,
          }),
  };
  const association: Answer = {
    key: 'association',
    label: 'Association membership',
    ...(a.answer === 'verified'
      ? { words: `${a.number}, current to ${formatDay(a.expires ?? '')}; ${checked(a.verified!)}`, tone: 'ok' as const }
      : a.answer === 'claimed'
        ? { words: `${a.number} to ${formatDay(a.expires ?? '')}: claimed, not yet checked`, tone: 'claim' as const }
        : a.answer === 'expired'
          ? { words: `${a.number}: expired ${formatDay(a.expires ?? '')}`, tone: 'stop' as const }
          : { words: 'not on file', tone: 'stop' as const }),
  };
  const certification: Answer = {
    key: 'certification',
    label: 'Certification',
    ...(c.answer === 'verified'
      ? { words: `${c.label}; ${checked(c.verified!)}`, tone: 'ok' as const }
      : c.answer === 'claimed'
        ? { words: `${c.label}: claimed, not yet checked`, tone: 'claim' as const }
        : { words: 'none on record', tone: 'claim' as const }),
  };
  return [dues, association, certification];
}

/** The check-in verdict: the overall answer, then dues, association and certification each in words. */
@Component({
  selector: 'ps-check-in-verdict',
  templateUrl: './check-in-verdict.html',
  styleUrl: './check-in-verdict.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckInVerdict {
  readonly result = input.required<CheckInResult>();
  private readonly site = inject(SiteNames);
  protected readonly mark = MARK;
  protected readonly known = computed(() => this.result().status !== 'unknown' && this.result().dues !== null);
  protected readonly answers = computed(() =>
    this.known() ? checkInAnswers(this.result(), this.site.timeZone()) : [],
  );
  protected readonly headline = computed(() => {
    if (!this.known()) return 'Unknown card: the code does not match any member';
    return this.result().mayFly
      ? 'May fly: dues current, association membership current and checked'
      : 'Not cleared to fly: see the answers below';
  });
}
