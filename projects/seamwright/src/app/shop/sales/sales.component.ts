import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { switchMap, take, takeWhile, timer } from 'rxjs';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import { ShopService } from '../shop.service';
import type { Order, SalesPage } from '../shop-types';
import { formatMoney } from '@seamwright/api';
import { orderStatusLabel } from '../order-status';

/** The designer's sales: who bought what, totals per currency, refunds. */
@Component({
  selector: 'sw-sales',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (state.loading() && !state.value()) { <mat-progress-bar mode="indeterminate" aria-label="Loading sales" /> }
    @if (state.value(); as page) {
      <section class="totals" aria-label="Totals">
        @for (t of page.totals; track t.currency) {
          <div class="total"><span class="big">{{ money(t.amountMinor, t.currency) }}</span><span class="sw-muted">{{ t.orders }} paid {{ t.orders === 1 ? 'order' : 'orders' }}</span></div>
        } @empty {
          @if (page.items.length) {
            <p class="sw-muted">No paid orders at the moment: every sale below was refunded.</p>
          } @else {
            <p class="sw-muted">No paid orders yet. <a routerLink="/shop/publish">Publish a pattern</a> to start selling.</p>
          }
        }
      </section>
      <div class="sw-table-wrap">
        <table mat-table [dataSource]="page.items" aria-label="Sales">
          <ng-container matColumnDef="pattern">
            <th mat-header-cell *matHeaderCellDef>Pattern</th>
            <td mat-cell *matCellDef="let o">{{ o.patternTitle }}</td>
          </ng-container>
          <ng-container matColumnDef="buyer">
            <th mat-header-cell *matHeaderCellDef>Buyer</th>
            <td mat-cell *matCellDef="let o">{{ o.buyer?.displayName }} <span class="sw-muted">{{ o.buyer?.email }}</span></td>
          </ng-container>
          <ng-container matColumnDef="amount">
            <th mat-header-cell *matHeaderCellDef class="num">Amount</th>
            <td mat-cell *matCellDef="let o" class="num">{{ money(o.amountMinor, o.currency) }}</td>
          </ng-container>
          <ng-container matColumnDef="status">
            <th mat-header-cell *matHeaderCellDef>Status</th>
            <td mat-cell *matCellDef="let o"><span class="status status-{{ o.status }}">{{ statusLabel(o) }}</span></td>
          </ng-container>
          <ng-container matColumnDef="paid">
            <th mat-header-cell *matHeaderCellDef>Paid</th>
            <td mat-cell *matCellDef="let o">{{ o.paidAt | date: 'd MMM y, HH:mm' }}</td>
          </ng-container>
          <ng-container matColumnDef="actions">
            <th mat-header-cell *matHeaderCellDef><span class="sw-sr-only">Actions</span></th>
            <td mat-cell *matCellDef="let o">
              @if (o.status === 'paid' && !o.refundRequested) {
                <button mat-stroked-button type="button" (click)="refund(o)" [disabled]="busy() === o.id" [attr.aria-label]="'Refund ' + o.buyer?.displayName + ' for ' + o.patternTitle">Refund</button>
              }
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
          <tr class="mat-mdc-row" *matNoDataRow><td class="empty" [attr.colspan]="columns.length">No sales yet.</td></tr>
        </table>
      </div>
      <p class="sw-muted note">A refund returns the whole amount through the payment provider and takes back the buyer’s quilter access once the provider confirms it.</p>
    }
  `,
  styles: `
    .totals { display: flex; flex-wrap: wrap; gap: 16px; margin-bottom: 16px; }
    .total { display: flex; flex-direction: column; padding: 12px 16px; border: 1px solid var(--sw-card-edge); border-radius: 12px; min-width: 160px; }
    .big { font: var(--mat-sys-headline-small); }
    table { width: 100%; }
    .num { text-align: right; }
    .empty { padding: 24px 16px; color: var(--mat-sys-on-surface-variant); }
    .status { display: inline-block; padding: 2px 8px; border-radius: 10px; font-size: 0.8rem; background: var(--mat-sys-surface-container-high); }
    .status-paid { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    .note { margin-top: 12px; }
  `,
})
export class SalesComponent implements OnInit {
  private readonly shop = inject(ShopService);
  private readonly notify = inject(NotifyService);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly state = new LoadState<SalesPage>();
  protected readonly busy = signal<string | null>(null);
  protected readonly columns = ['pattern', 'buyer', 'amount', 'status', 'paid', 'actions'];
  protected readonly statusLabel = orderStatusLabel;
  protected readonly money = formatMoney;

  ngOnInit(): void {
    this.state.run(this.shop.sales());
  }

  protected refund(o: Order): void {
    const amount = formatMoney(o.amountMinor, o.currency);
    if (!confirm(`Refund ${amount} to ${o.buyer?.displayName ?? 'the buyer'} and take back their access to “${o.patternTitle}”?`)) return;
    this.busy.set(o.id);
    this.shop.refund(o.id).subscribe({
      next: () => {
        this.notify.info(`Refund of ${amount} asked for; access ends when the provider confirms it`);
        this.followRefund(o.id);
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.notify.error(err, 'Refund not made');
      },
    });
  }

  /** Reloads until the provider's refund confirmation has arrived (a few seconds at most). */
  private followRefund(orderId: string): void {
    timer(0, 1000)
      .pipe(
        take(20),
        switchMap(() => this.shop.order(orderId)),
        takeWhile((o) => o.status === 'paid', true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        complete: () => {
          this.busy.set(null);
          this.state.run(this.shop.sales());
        },
      });
  }
}
