import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import { NotFoundComponent } from '../../not-found/not-found.component';
import { ShopService } from '../shop.service';
import type { Listing } from '../shop-types';
import { formatMoney } from '@seamwright/api';
import { listingFacts } from '../listing-facts';
import { ListingPictureComponent } from '../listing-picture.component';
import { ListingQuiltComponent } from './listing-quilt.component';

/** One pattern in the shop: what it is, its price, and Buy (or Open, once it is yours). */
@Component({
  selector: 'sw-listing-detail',
  imports: [DatePipe, RouterLink, ListingPictureComponent, ListingQuiltComponent, MatButtonModule, MatIconModule, MatProgressBarModule, NotFoundComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (state.notFound()) {
      <sw-not-found />
    } @else {
      @if (state.loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading the pattern" /> }
      @if (state.value(); as l) {
        <article class="detail" aria-labelledby="listing-title">
          <h2 id="listing-title">{{ l.title }}</h2>
          <p class="sw-muted">by {{ l.designer.displayName }} · {{ facts(l) }}@if (l.publishedAt) { · in the shop since {{ l.publishedAt | date: 'd MMM y' }} }</p>
          @if (!l.published) { <p class="draft" role="status">Not published: only you can see this page.</p> }
          <div class="about">
            <sw-listing-picture [listing]="l" [sizePx]="240" />
            <p class="desc">{{ l.description }}</p>
          </div>
          @if (l.quilt; as quilt) { <sw-listing-quilt [quilt]="quilt" [title]="l.title" /> }
          <p class="includes">Buying gives you quilter access to the pattern: print sets at true scale with test squares, the scale check and your own sewing log. You cannot change the design.</p>
          @if (cancelled()) { <p class="cancelled" role="status">Checkout was cancelled; nothing was charged.</p> }
          <div class="buy">
            <span class="price" data-testid="price">{{ money(l) }}</span>
            @if (l.access) {
              <a mat-flat-button [routerLink]="['/patterns', l.patternId]"><mat-icon aria-hidden="true">open_in_new</mat-icon>Open the pattern</a>
              <span class="sw-muted">{{ l.access === 'owner' ? 'This is your pattern.' : 'You have this pattern.' }}</span>
            } @else {
              <button mat-flat-button type="button" (click)="buy(l)" [disabled]="buying()"><mat-icon aria-hidden="true">shopping_cart</mat-icon>Buy for {{ money(l) }}</button>
              <span class="sw-muted">You will confirm the payment on the payment provider’s page.</span>
            }
          </div>
          @if (buying()) { <mat-progress-bar mode="indeterminate" aria-label="Opening checkout" /> }
        </article>
      }
    }
  `,
  styles: `
    .detail { max-width: 720px; }
    .detail h2 { margin-top: 0; margin-bottom: 4px; font: var(--mat-sys-headline-small); }
    .about { display: flex; flex-wrap: wrap; gap: 24px; align-items: flex-start; margin-top: 16px; }
    .desc { flex: 1 1 280px; margin: 0; white-space: pre-line; font-size: 1.05rem; }
    .includes { border-left: 3px solid var(--mat-sys-primary); padding-left: 12px; }
    .draft, .cancelled { padding: 8px 12px; border-radius: 8px; background: var(--mat-sys-surface-container-high); }
    .buy { display: flex; flex-wrap: wrap; gap: 16px; align-items: center; margin: 24px 0 12px; }
    .price { font: var(--mat-sys-headline-small); }
  `,
})
export class ListingDetailComponent {
  /** From the URL. */
  readonly patternId = input.required<string>();
  /** `?cancelled=1` when the buyer came back from checkout without paying. */
  readonly cancelled = input<string | undefined>();
  private readonly shop = inject(ShopService);
  private readonly notify = inject(NotifyService);
  protected readonly state = new LoadState<Listing>();
  protected readonly buying = signal(false);
  protected readonly facts = listingFacts;

  constructor() {
    effect(() => this.state.run(this.shop.listing(this.patternId())));
  }

  protected money(l: Listing): string {
    return formatMoney(l.priceMinor, l.currency);
  }

  protected buy(l: Listing): void {
    this.buying.set(true);
    this.shop.checkout(l.patternId).subscribe({
      // The provider's hosted page is another site: a full page navigation, not a route.
      next: (r) => window.location.assign(r.checkoutUrl),
      error: (err: unknown) => {
        this.buying.set(false);
        this.notify.error(err, 'Checkout did not start');
        this.state.run(this.shop.listing(l.patternId));
      },
    });
  }
}
