import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { debounceTime, distinctUntilChanged } from 'rxjs';
import type { Page } from '../../core/api-types';
import { LoadState } from '../../core/load-state';
import { ShopService } from '../shop.service';
import type { Listing } from '../shop-types';
import { formatMoney } from '@seamwright/api';
import { listingFacts } from '../listing-facts';
import { ListingPictureComponent } from '../listing-picture.component';

/** Published patterns from every designer, newest first, searchable by title. */
@Component({
  selector: 'sw-shop-browse',
  imports: [RouterLink, ReactiveFormsModule, ListingPictureComponent, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="sw-toolbar-row">
      <mat-form-field appearance="outline" class="filter" subscriptSizing="dynamic">
        <mat-label>Search the shop</mat-label>
        <mat-icon matPrefix aria-hidden="true">search</mat-icon>
        <input matInput [formControl]="filter" type="search" />
      </mat-form-field>
      @if (state.value(); as page) { <span class="sw-muted" aria-live="polite">{{ page.total }} {{ page.total === 1 ? 'pattern' : 'patterns' }}</span> }
    </div>
    @if (state.loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading the shop" /> }
    @if (state.value(); as page) {
      <ul class="grid" role="list" aria-label="Patterns for sale">
        @for (l of page.items; track l.patternId) {
          <li>
            <mat-card appearance="outlined" class="card">
              <mat-card-header>
                <mat-card-title><a [routerLink]="['/shop/patterns', l.patternId]">{{ l.title }}</a></mat-card-title>
                <mat-card-subtitle>by {{ l.designer.displayName }} · {{ facts(l) }}</mat-card-subtitle>
              </mat-card-header>
              <mat-card-content>
                <sw-listing-picture class="picture" [listing]="l" />
                <p class="desc">{{ l.description }}</p>
              </mat-card-content>
              <mat-card-actions class="actions">
                <span class="price">{{ money(l) }}</span>
                @if (l.access) {
                  <a mat-stroked-button [routerLink]="['/patterns', l.patternId]"><mat-icon aria-hidden="true">check</mat-icon>{{ l.access === 'owner' ? 'Yours' : 'In your patterns' }}</a>
                } @else {
                  <a mat-flat-button [routerLink]="['/shop/patterns', l.patternId]" [attr.aria-label]="'View ' + l.title">View</a>
                }
              </mat-card-actions>
            </mat-card>
          </li>
        } @empty {
          <li class="empty sw-muted">{{ filter.value ? 'No published pattern matches “' + filter.value + '”.' : 'Nothing is for sale yet.' }}</li>
        }
      </ul>
    }
  `,
  styles: `
    .filter { width: min(360px, 100%); }
    .grid { list-style: none; margin: 0; padding: 0; display: grid; gap: 16px; grid-template-columns: repeat(auto-fill, minmax(280px, 1fr)); }
    .card { height: 100%; display: flex; flex-direction: column; }
    .card a { text-decoration: none; }
    .desc { display: -webkit-box; -webkit-line-clamp: 3; -webkit-box-orient: vertical; overflow: hidden; margin: 8px 0 0; }
    mat-card-content { flex: 1; }
    .picture { display: block; margin-top: 12px; }
    .actions { display: flex; justify-content: space-between; align-items: center; padding: 8px 16px 16px; }
    .price { font: var(--mat-sys-title-medium); }
    .empty { padding: 24px 4px; }
  `,
})
export class ShopBrowseComponent implements OnInit {
  private readonly shop = inject(ShopService);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly state = new LoadState<Page<Listing>>();
  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly facts = listingFacts;

  ngOnInit(): void {
    this.load();
    this.filter.valueChanges.pipe(debounceTime(250), distinctUntilChanged(), takeUntilDestroyed(this.destroyRef)).subscribe(() => this.load());
  }

  protected money(l: Listing): string {
    return formatMoney(l.priceMinor, l.currency);
  }

  private load(): void {
    this.state.run(this.shop.listings(this.filter.value));
  }
}
