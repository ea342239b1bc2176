import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { Page } from '../core/api-types';
import type { Listing, ListingBody, MyShop, Order, SalesPage, ShopCurrency } from './shop-types';

const base = '/api/shop';
const enc = encodeURIComponent;

/** The pattern shop's API: listings, publishing, checkout, purchases and sales. */
@Injectable({ providedIn: 'root' })
export class ShopService {
  private readonly http = inject(HttpClient);

  listings(q: string, page = 1, pageSize = 24): Observable<Page<Listing>> {
    let params = new HttpParams().set('page', page).set('pageSize', pageSize);
    if (q.trim()) params = params.set('q', q.trim());
    return this.http.get<Page<Listing>>(`${base}/listings`, { params });
  }

  listing(patternId: string): Observable<Listing> {
    return this.http.get<{ listing: Listing }>(`${base}/listings/${enc(patternId)}`).pipe(map((r) => r.listing));
  }

  /** Starts a purchase; answers the provider's checkout page to send the browser to. */
  checkout(patternId: string): Observable<{ order: Order; checkoutUrl: string }> {
    return this.http.post<{ order: Order; checkoutUrl: string }>(`${base}/listings/${enc(patternId)}/checkout`, {});
  }

  order(orderId: string): Observable<Order> {
    return this.http.get<{ order: Order }>(`${base}/orders/${enc(orderId)}`).pipe(map((r) => r.order));
  }

  purchases(page = 1, pageSize = 50): Observable<Page<Order>> {
    return this.http.get<Page<Order>>(`${base}/purchases`, { params: { page, pageSize } });
  }

  sales(page = 1, pageSize = 50): Observable<SalesPage> {
    return this.http.get<SalesPage>(`${base}/sales`, { params: { page, pageSize } });
  }

  refund(orderId: string): Observable<Order> {
    return this.http.post<{ order: Order }>(`${base}/sales/${enc(orderId)}/refund`, {}).pipe(map((r) => r.order));
  }

  myShop(): Observable<MyShop> {
    return this.http.get<MyShop>(`${base}/mine`);
  }

  setCurrency(currency: ShopCurrency): Observable<{ currency: ShopCurrency }> {
    return this.http.put<{ shop: { currency: ShopCurrency } }>(`${base}/mine`, { currency }).pipe(map((r) => r.shop));
  }

  saveListing(patternId: string, body: ListingBody): Observable<Listing> {
    return this.http.put<{ listing: Listing }>(`${base}/listings/${enc(patternId)}`, body).pipe(map((r) => r.listing));
  }
}
