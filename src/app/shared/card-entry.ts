import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { CardEntry } from '@contracts/shop/shop-answers';

/** How card payments take a card: labelled test tokens against the local fake, or Stripe.js with a publishable key. */
export type { CardEntry };

/** Reads the card entry mode the server is configured for; dues and the shop both ask it. */
@Injectable({ providedIn: 'root' })
export class CardEntryApi {
  private readonly http = inject(HttpClient);

  cardEntry(): Observable<CardEntry> {
    return this.http.get<CardEntry>('/api/payments/card-entry');
  }
}
