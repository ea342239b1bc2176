import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject } from '@angular/core';
import { filter } from 'rxjs';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatIconModule, MatIconRegistry } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatButtonModule } from '@angular/material/button';
import { MatMenuModule } from '@angular/material/menu';
import { MatTooltipModule } from '@angular/material/tooltip';
import { AuthService } from './core/auth.service';
import { ThemeService } from './core/theme.service';

/** The application shell: top bar with navigation, theme switch and account menu; the routed page. */
@Component({
  selector: 'sw-root',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatIconModule, MatButtonModule, MatMenuModule, MatTooltipModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <a class="sw-skip" href="#main">Skip to content</a>
    <mat-toolbar class="sw-topbar" role="banner">
      <a routerLink="/" class="sw-brand" aria-label="Seamwright home">
        <mat-icon aria-hidden="true">architecture</mat-icon>
        <span>Seamwright</span>
      </a>
      <nav class="sw-nav" aria-label="Main">
        @for (link of links(); track link.path) {
          <a mat-button [routerLink]="link.path" routerLinkActive="sw-active" ariaCurrentWhenActive="page">{{ link.label }}</a>
        }
      </nav>
      <!-- On a narrow screen (or a page zoomed to 400 %) the links fold into this menu. -->
      <button mat-icon-button type="button" class="sw-nav-fold" [matMenuTriggerFor]="mainMenu" aria-label="Main menu">
        <mat-icon aria-hidden="true">menu</mat-icon>
      </button>
      <mat-menu #mainMenu="matMenu">
        @for (link of links(); track link.path) {
          <a mat-menu-item [routerLink]="link.path" routerLinkActive="sw-active" ariaCurrentWhenActive="page">{{ link.label }}</a>
        }
      </mat-menu>
      <span class="sw-spacer"></span>
      <button
        mat-icon-button
        type="button"
        (click)="theme.toggle()"
        [attr.aria-label]="theme.theme() === 'dark' ? 'Use light theme' : 'Use dark theme'"
        [matTooltip]="theme.theme() === 'dark' ? 'Light theme' : 'Dark theme'"
      >
        <mat-icon aria-hidden="true">{{ theme.theme() === 'dark' ? 'light_mode' : 'dark_mode' }}</mat-icon>
      </button>
      @if (auth.user(); as user) {
        <button mat-button type="button" [matMenuTriggerFor]="account" class="sw-account" aria-label="Account menu">
          <mat-icon aria-hidden="true">account_circle</mat-icon>
          <span class="sw-account-name">{{ user.displayName }}</span>
        </button>
        <mat-menu #account="matMenu">
          <div class="sw-menu-who" role="presentation">{{ user.email }} · {{ user.role }}</div>
          <a mat-menu-item routerLink="/account/password"><mat-icon aria-hidden="true">key</mat-icon>Change password</a>
          <button mat-menu-item type="button" (click)="signOut()"><mat-icon aria-hidden="true">logout</mat-icon>Sign out</button>
        </mat-menu>
      } @else {
        <a mat-button routerLink="/sign-in">Sign in</a>
      }
    </mat-toolbar>
    <main id="main" class="sw-main" tabindex="-1"><router-outlet /></main>
  `,
  styles: `
    :host { display: flex; flex-direction: column; min-height: 100%; }
    .sw-brand { display: inline-flex; gap: 8px; align-items: center; color: inherit; text-decoration: none; font-weight: 500; margin-right: 16px; }
    .sw-nav { display: flex; gap: 4px; }
    .sw-nav-fold { display: none; }
    .sw-nav a { color: inherit; }
    .sw-nav a.sw-active { background: color-mix(in srgb, currentColor 16%, transparent); }
    .sw-spacer { flex: 1; }
    .sw-account { color: inherit; }
    .sw-menu-who { padding: 8px 16px; font-size: 0.85rem; opacity: 0.75; }
    .sw-main { flex: 1; width: 100%; box-sizing: border-box; padding: 24px; max-width: 1280px; margin: 0 auto; outline: none; }
    .sw-skip { position: absolute; left: -9999px; top: 0; z-index: 10; padding: 8px 12px; background: var(--mat-sys-surface); color: var(--mat-sys-on-surface); }
    .sw-skip:focus { left: 8px; top: 8px; }
    @media (max-width: 840px) {
      .sw-main { padding: 16px 12px; }
      .sw-account-name { display: none; }
      .sw-brand span { display: none; }
    }
    @media (max-width: 600px) {
      .sw-nav { display: none; }
      .sw-nav-fold { display: inline-flex; }
      .sw-brand { margin-right: 4px; }
      .sw-main { padding: 12px 8px; }
      .sw-topbar { padding: 0 4px; gap: 0; }
    }
  `,
})
export class AppComponent {
  protected readonly auth = inject(AuthService);
  protected readonly theme = inject(ThemeService);
  private readonly router = inject(Router);
  /** The main links, the same in the bar and in its folded menu. */
  protected readonly links = computed(() => [
    ...(this.auth.signedIn() ? [{ path: '/patterns', label: 'Patterns' }, { path: '/shop', label: 'Shop' }] : []),
    { path: '/scale-check', label: 'Scale check' },
    ...(this.auth.user()?.role === 'admin' ? [{ path: '/admin', label: 'Admin' }] : []),
  ]);

  constructor() {
    // Icons come from the shipped Material Symbols font, not from a web service.
    inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
    this.auth.load().subscribe({ error: () => undefined });
    this.focusMainOnPageChange();
  }

  /**
   * After moving to another page, keyboard and screen-reader users start at the page's content,
   * not at the top bar. Switching parts of one pattern keeps the focus where it is (on the tabs).
   */
  private focusMainOnPageChange(): void {
    let lastPage = '';
    const sub = this.router.events.pipe(filter((e): e is NavigationEnd => e instanceof NavigationEnd)).subscribe((e) => {
      const page = e.urlAfterRedirects.split(/[?#]/)[0].split('/').slice(0, 3).join('/');
      if (lastPage && page !== lastPage) document.getElementById('main')?.focus({ preventScroll: true });
      lastPage = page;
    });
    inject(DestroyRef).onDestroy(() => sub.unsubscribe());
  }

  protected signOut(): void {
    this.auth.signOut().subscribe(() => void this.router.navigate(['/sign-in']));
  }
}
