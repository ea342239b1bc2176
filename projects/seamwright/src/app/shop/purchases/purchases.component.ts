import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Subscription, switchMap, take, takeWhile, timer } from 'rxjs';
import type { Page } from '../../core/api-types';
import { LoadState } from '../../core/load-state';
import { ShopService } from '../shop.service';
import type { Order } from '../shop-types';
import { formatMoney } from '@seamwright/api';
import { orderStatusLabel } from '../order-status';

/** How long the page waits for the provider's confirmation after checkout (one check a second). */
const CONFIRM_CHECKS = 60;

/** The buyer's purchases; after checkout it waits for the payment to be confirmed. */
@Component({
  selector: 'sw-purchases',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (waiting(); as w) {
      @if (w.status === 'pending') {
        <section class="banner" role="status" aria-live="polite">
          <mat-icon aria-hidden="true">hourglass_top</mat-icon>
          <span>Waiting for the payment provider to confirm your payment for “{{ w.patternTitle }}”…</span>
        </section>
        <mat-progress-bar mode="indeterminate" aria-label="Waiting for the payment" />
      } @else if (w.status === 'paid') {
        <section class="banner ok" role="status" aria-live="polite">
          <mat-icon aria-hidden="true">check_circle</mat-icon>
          <span>Payment received: “{{ w.patternTitle }}” is in your patterns with quilter access. A receipt is on its way by e-mail.</span>
          @if (w.patternId) { <a mat-flat-button [routerLink]="['/patterns', w.patternId]">Open the pattern</a> }
        </section>
      }
    }
    @if (timedOut()) {
      <p class="banner" role="alert">The payment is not confirmed yet. It can take a moment: reload this page in a minute.</p>
    }
    <h2>Your purchases</h2>
    @if (state.loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading purchases" /> }
    @if (state.value(); as page) {
      <div class="sw-table-wrap">
        <table mat-table [dataSource]="page.items" aria-label="Your purchases">
          <ng-container matColumnDef="pattern">
            <th mat-header-cell *matHeaderCellDef>Pattern</th>
            <td mat-cell *matCellDef="let o">
              @if (o.status === 'paid' && o.patternId) { <a [routerLink]="['/patterns', o.patternId]">{{ o.patternTitle }}</a> } @else { {{ o.patternTitle }} }
            </td>
          </ng-container>
          <ng-container matColumnDef="designer">
            <th mat-header-cell *matHeaderCellDef>Designer</th>
            <td mat-cell *matCellDef="let o">{{ o.seller?.displayName }}</td>
          </ng-container>
          <ng-container matColumnDef="amount">
            <th mat-header-cell *matHeaderCellDef class="num">Amount</th>
            <td mat-cell *matCellDef="let o" class="num">{{ money(o) }}</td>
          </ng-container>
          <ng-container matColumnDef="status">
            <th mat-header-cell *matHeaderCellDef>Status</th>
            <td mat-cell *matCellDef="let o"><span class="status status-{{ o.status }}">{{ statusLabel(o) }}</span></td>
          </ng-container>
          <ng-container matColumnDef="date">
            <th mat-header-cell *matHeaderCellDef>Date</th>
            <td mat-cell *matCellDef="let o">{{ (o.paidAt ?? o.createdAt) | date: 'd MMM y, HH:mm' }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
          <tr class="mat-mdc-row" *matNoDataRow><td class="empty" [attr.colspan]="columns.length">You have not bought any pattern yet. <a routerLink="/shop">Browse the shop</a>.</td></tr>
        </table>
      </div>
    }
  `,
  styles: `
    .banner { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; padding: 12px 16px; border-radius: 12px; background: var(--mat-sys-surface-container-high); margin-bottom: 8px; }
    .banner.ok { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    table { width: 100%; }
    .num { text-align: right; }
    .empty { padding: 24px 16px; color: var(--mat-sys-on-surface-variant); }
    .status { display: inline-block; padding: 2px 8px; border-radius: 10px; font-size: 0.8rem; background: var(--mat-sys-surface-container-high); }
    .status-paid { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
  `,
})
export class PurchasesComponent {
  /** `?order=` on the way back from checkout. */
  readonly order = input<string | undefined>();
  private readonly shop = inject(ShopService);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly state = new LoadState<Page<Order>>();
  protected readonly waiting = signal<Order | null>(null);
  protected readonly timedOut = signal(false);
  protected readonly columns = ['pattern', 'designer', 'amount', 'status', 'date'];
  protected readonly statusLabel = orderStatusLabel;
  private poll: Subscription | null = null;

  constructor() {
    effect(() => {
      const id = this.order();
      this.reload();
      if (id) this.watch(id);
    });
  }

  protected money(o: Order): string {
    return formatMoney(o.amountMinor, o.currency);
  }

  private reload(): void {
    this.state.run(this.shop.purchases());
  }

  /** Checks the order once a second until the provider's confirmation has arrived (or gives up). */
  private watch(orderId: string): void {
    this.poll?.unsubscribe();
    this.timedOut.set(false);
    this.poll = timer(0, 1000)
      .pipe(
        take(CONFIRM_CHECKS),
        switchMap(() => this.shop.order(orderId)),
        takeWhile((o) => o.status === 'pending', true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (o) => {
          this.waiting.set(o);
          if (o.status !== 'pending') this.reload();
        },
        complete: () => this.timedOut.set(this.waiting()?.status === 'pending'),
        error: () => this.waiting.set(null),
      });
  }
}
