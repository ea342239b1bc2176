import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatTabsModule } from '@angular/material/tabs';
import { MatIconModule } from '@angular/material/icon';
import { AuthService } from '../core/auth.service';

/** The shop's frame: its heading, links to its screens, the tax note, and the routed screen. */
@Component({
  selector: 'sw-shop-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabsModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <header class="head">
      <h1>Pattern shop</h1>
      <p class="tax" role="note"><mat-icon aria-hidden="true">info</mat-icon>Taxes are out of scope: prices are what the buyer pays, and Seamwright does not calculate, add or collect any sales tax or VAT.</p>
    </header>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Shop" mat-stretch-tabs="false">
      <a mat-tab-link routerLink="/shop" [routerLinkActiveOptions]="{ exact: true }" routerLinkActive #browse="routerLinkActive" [active]="browse.isActive">
        <mat-icon aria-hidden="true" class="tab-icon">storefront</mat-icon>Browse
      </a>
      <a mat-tab-link routerLink="/shop/purchases" routerLinkActive #bought="routerLinkActive" [active]="bought.isActive">
        <mat-icon aria-hidden="true" class="tab-icon">shopping_bag</mat-icon>Your purchases
      </a>
      @if (auth.canDesign()) {
        <a mat-tab-link routerLink="/shop/sales" routerLinkActive #sales="routerLinkActive" [active]="sales.isActive">
          <mat-icon aria-hidden="true" class="tab-icon">receipt_long</mat-icon>Sales
        </a>
        <a mat-tab-link routerLink="/shop/publish" routerLinkActive #publish="routerLinkActive" [active]="publish.isActive">
          <mat-icon aria-hidden="true" class="tab-icon">sell</mat-icon>Publish
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel class="panel"><router-outlet /></mat-tab-nav-panel>
  `,
  styles: `
    .head h1 { margin-bottom: 4px; }
    .tax { display: flex; gap: 8px; align-items: center; margin: 0 0 8px; font-size: 0.9rem; color: var(--mat-sys-on-surface-variant); }
    .tax mat-icon { font-size: 20px; width: 20px; height: 20px; flex: none; }
    .tab-icon { margin-right: 8px; }
    .panel { display: block; padding-top: 16px; }
    @media (max-width: 840px) { .tab-icon { display: none; } }
  `,
})
export class ShopShellComponent {
  protected readonly auth = inject(AuthService);
}
