import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import { toApiError } from '../../core/api-error';
import { applyServerIssues } from '../../auth/form-errors';
import { ShopService } from '../shop.service';
import { SHOP_CURRENCIES, type MyShop, type ShopCurrency } from '../shop-types';
import { CURRENCY_NAMES, formatMoney, formatMoneyAmount, parseMoney } from '@seamwright/api';
import { ListingFormComponent, type ListingForm } from './listing-form.component';
import { priceExample, priceValidator } from './price-field';

/** The designer's shop settings: one currency for the shop, and price, description and publishing per pattern. */
@Component({
  selector: 'sw-publish-settings',
  imports: [RouterLink, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, MatSlideToggleModule, ListingFormComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (state.loading() && !state.value()) { <mat-progress-bar mode="indeterminate" aria-label="Loading your shop" /> }
    <section class="card" aria-labelledby="currency-title">
      <h2 id="currency-title">Shop currency</h2>
      <form class="row" [formGroup]="currencyForm" (ngSubmit)="saveCurrency()">
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Currency</mat-label>
          <mat-select formControlName="currency">
            @for (c of currencies; track c) { <mat-option [value]="c">{{ c.toUpperCase() }} — {{ names[c] }}</mat-option> }
          </mat-select>
        </mat-form-field>
        <button mat-flat-button type="submit" [disabled]="savingCurrency()">Save currency</button>
      </form>
      <p class="sw-muted">Every pattern in your shop is priced in this currency. Prices are typed in the currency, e.g. {{ unitHint() }}. Changing the currency does not convert them: check your prices after a change.</p>
    </section>

    @if (state.value(); as mine) {
      <h2>Your patterns</h2>
      @if (!mine.shop) { <p class="sw-muted" role="status">Save a currency first; then you can price and publish patterns.</p> }
      @for (p of mine.patterns; track p.patternId) {
        <sw-listing-form
          [title]="p.title"
          [patternId]="p.patternId"
          [paidOrders]="p.paidOrders"
          [form]="formFor(p.patternId)"
          [currency]="mine.shop?.currency ?? null"
          [saving]="saving() === p.patternId"
          (save)="saveListing(p.patternId, p.title)"
        />
      } @empty {
        <p class="sw-muted">You have no patterns yet. <a routerLink="/patterns">Make one</a> to sell it here.</p>
      }
    }
  `,
  styles: `
    .card { border: 1px solid var(--sw-card-edge); border-radius: 12px; padding: 8px 16px 4px; background: var(--mat-sys-surface-container-low); }
    .card h2 { margin-top: 8px; }
    .row { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
  `,
})
export class PublishSettingsComponent implements OnInit {
  private readonly shop = inject(ShopService);
  private readonly notify = inject(NotifyService);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly state = new LoadState<MyShop>();
  protected readonly currencies = SHOP_CURRENCIES;
  protected readonly names = CURRENCY_NAMES;
  protected readonly currency = new FormControl<ShopCurrency>('usd', { nonNullable: true });
  protected readonly currencyForm = new FormGroup({ currency: this.currency });
  private readonly currencyValue = toSignal(this.currency.valueChanges, { initialValue: this.currency.value });
  protected readonly savingCurrency = signal(false);
  protected readonly saving = signal<string | null>(null);
  private readonly forms = new Map<string, FormGroup<ListingForm>>();

  ngOnInit(): void {
    this.load();
  }

  protected unitHint(): string {
    return priceExample(this.currencyValue());
  }

  /** The currency prices are typed in: the shop's saved one (the picker may show an unsaved choice). */
  private shopCurrency(): ShopCurrency {
    return this.state.value()?.shop?.currency ?? this.currency.value;
  }

  protected formFor(patternId: string): FormGroup<ListingForm> {
    let form = this.forms.get(patternId);
    if (!form) {
      const listing = this.state.value()?.patterns.find((p) => p.patternId === patternId)?.listing;
      form = this.fb.group({
        price: this.fb.control(listing ? formatMoneyAmount(listing.priceMinor, this.shopCurrency()) : '', [priceValidator(() => this.shopCurrency())]),
        description: this.fb.control(listing?.description ?? '', [Validators.required, Validators.maxLength(2000)]),
        published: this.fb.control(listing?.published ?? false),
      }) as FormGroup<ListingForm>;
      this.forms.set(patternId, form);
    }
    return form;
  }

  protected saveCurrency(): void {
    this.savingCurrency.set(true);
    this.shop.setCurrency(this.currency.value).subscribe({
      next: (s) => {
        this.savingCurrency.set(false);
        this.notify.info(`Your shop sells in ${s.currency.toUpperCase()}`);
        this.load();
      },
      error: (err: unknown) => {
        this.savingCurrency.set(false);
        this.notify.error(err, 'Currency not saved');
      },
    });
  }

  protected saveListing(patternId: string, title: string): void {
    const form = this.formFor(patternId);
    // The save button stays focusable while saving (disabledInteractive); Enter in a field must not save twice.
    if (this.saving() === patternId) return;
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const v = form.getRawValue();
    this.saving.set(patternId);
    // The validator has read the price, so it parses; the amount goes in minor units, read digit by digit.
    const priceMinor = parseMoney(v.price, this.shopCurrency())!;
    this.shop.saveListing(patternId, { priceMinor, description: v.description.trim(), published: v.published }).subscribe({
      next: (l) => {
        this.saving.set(null);
        form.markAsPristine();
        this.notify.info(l.published ? `“${title}” is in the shop at ${formatMoney(l.priceMinor, l.currency)}` : `“${title}” saved, not published`);
      },
      error: (err: unknown) => {
        this.saving.set(null);
        // The server names the price field by its minor-unit body field.
        const issues = toApiError(err).issues.map((i) => (i.path === 'priceMinor' ? { ...i, path: 'price' } : i));
        const rest = applyServerIssues(form, issues);
        if (rest.length || !toApiError(err).issues.length) this.notify.error(err, 'Listing not saved');
      },
    });
  }

  private load(): void {
    this.state.run(this.shop.myShop(), (mine) => {
      this.forms.clear();
      if (mine.shop) this.currency.setValue(mine.shop.currency);
    });
  }
}
