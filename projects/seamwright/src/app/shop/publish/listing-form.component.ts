import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { RouterLink } from '@angular/router';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { toSignal, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { switchMap, startWith } from 'rxjs';
import type { ShopCurrency } from '../shop-types';
import { formatMoney, parseMoney } from '@seamwright/api';
import { priceExample } from './price-field';

/** The controls of one pattern's listing. */
export interface ListingForm {
  /** The price as typed, in the currency's units ("12.50"); see price-field.ts. */
  price: FormControl<string>;
  description: FormControl<string>;
  published: FormControl<boolean>;
}

/** One pattern's price, description and published switch on the publish screen. */
@Component({
  selector: 'sw-listing-form',
  imports: [RouterLink, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSlideToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form class="listing" [formGroup]="form()" (ngSubmit)="save.emit()" [attr.aria-label]="'Listing of ' + title()" novalidate>
      <div class="top">
        <h3><a [routerLink]="['/patterns', patternId()]">{{ title() }}</a></h3>
        <span class="sw-muted">{{ paidOrders() }} paid {{ paidOrders() === 1 ? 'order' : 'orders' }}</span>
        <span class="sw-grow"></span>
        <mat-slide-toggle formControlName="published">Published</mat-slide-toggle>
      </div>
      <div class="fields">
        <mat-form-field appearance="outline" class="price">
          <mat-label>Price in {{ code() }}</mat-label>
          <input matInput type="text" inputmode="decimal" autocomplete="off" formControlName="price" required />
          <mat-hint>{{ preview() }}</mat-hint>
          <mat-error>{{ priceMessage() }}</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline" class="desc">
          <mat-label>Description for buyers</mat-label>
          <textarea matInput formControlName="description" rows="3" maxlength="2000" required></textarea>
          <mat-error>{{ form().controls.description.errors?.['server'] ?? 'A description is required' }}</mat-error>
        </mat-form-field>
      </div>
      <!-- disabledInteractive: the button keeps focus while the listing is saved. -->
      <button mat-flat-button type="submit" disabledInteractive [disabled]="saving() || !currency()">Save listing</button>
    </form>
  `,
  styles: `
    .listing { border: 1px solid var(--sw-card-edge); border-radius: 12px; padding: 8px 16px 16px; margin-bottom: 16px; }
    .top { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
    .top h3 { margin: 8px 0; font: var(--mat-sys-title-medium); }
    .top a { text-decoration: none; }
    .fields { display: flex; flex-wrap: wrap; gap: 12px; margin-top: 8px; align-items: flex-start; }
    .price { width: 220px; }
    .desc { flex: 1 1 320px; }
  `,
})
export class ListingFormComponent {
  readonly title = input.required<string>();
  readonly patternId = input.required<string>();
  readonly paidOrders = input(0);
  readonly form = input.required<FormGroup<ListingForm>>();
  /** The shop's currency; null before the designer picked one. */
  readonly currency = input<ShopCurrency | null>(null);
  /** Whether this listing is being saved. */
  readonly saving = input(false);
  /** Emitted when the designer saves this listing. */
  readonly save = output<void>();
  private readonly price = toSignal(toObservable(this.form).pipe(switchMap((f) => f.controls.price.valueChanges.pipe(startWith(f.controls.price.value)))));

  /** The currency's code as buyers see it, "EUR". */
  protected code(): string {
    return (this.currency() ?? 'usd').toUpperCase();
  }

  protected preview(): string {
    const c = this.currency();
    if (!c) return 'Choose the shop currency first';
    const minor = parseMoney(this.price() ?? '', c);
    return minor !== null ? `Buyers pay ${formatMoney(minor, c)}` : `In ${c.toUpperCase()}, e.g. ${priceExample(c)}`;
  }

  protected priceMessage(): string {
    const e = this.form().controls.price.errors;
    if (!e) return '';
    if (e['server']) return String(e['server']);
    if (e['price']) return String(e['price']);
    return 'A price is required';
  }
}
