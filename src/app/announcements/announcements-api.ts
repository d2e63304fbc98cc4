import { HttpClient, HttpHeaders } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  ConfirmedSignUp,
  ConsentWording,
  MySubscription,
  SignUpAnswer,
  UnsubscribeTarget,
} from '@contracts/announcements/subscription-answers';
import type { SignUpInput } from '@contracts/announcements/subscription-schemas';

/** The public side of announcements: sign-up, confirmation, unsubscribe, and the person's own lists. */
@Injectable({ providedIn: 'root' })
export class AnnouncementsApi {
  private readonly http = inject(HttpClient);

  /** The consent wording the sign-up form must show, with its version. */
  wording() {
    return this.http.get<ConsentWording>('/api/subscriptions/wording');
  }

  /** Asks for news by e-mail; nothing is sent until the address confirms. */
  signUp(body: SignUpInput) {
    return this.http.post<SignUpAnswer>('/api/subscriptions', body);
  }

  /** Confirms a sign-up with the token from the e-mail. */
  confirm(token: string) {
    return this.http.get<{ confirmed: ConfirmedSignUp }>('/api/subscriptions/confirm', {
      params: { token },
    });
  }

  /** What an unsubscribe link would stop, for the page to ask before it does. */
  describeUnsubscribe(token: string) {
    return this.http.get<UnsubscribeTarget>('/api/subscriptions/unsubscribe', {
      params: { token },
    });
  }

  /** The same form POST a mail client makes for one-click unsubscribe (RFC 8058). */
  unsubscribe(token: string) {
    const headers = new HttpHeaders({ 'Content-Type': 'application/x-www-form-urlencoded' });
    return this.http.post<{ unsubscribed: UnsubscribeTarget }>(
      '/api/subscriptions/unsubscribe',
      'List-Unsubscribe=One-Click',
      { params: { token }, headers },
    );
  }

  /** The signed-in person's lists and their consent on each. */
  mine() {
    return this.http.get<{ items: MySubscription[] }>('/api/account/subscriptions');
  }
}
