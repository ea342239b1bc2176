import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink, RouterOutlet } from '@angular/router';
import { MatIconModule, MatIconRegistry } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatButtonModule } from '@angular/material/button';

/** The application shell: top bar and the routed page. */
@Component({
  selector: 'sw-root',
  imports: [RouterOutlet, RouterLink, MatToolbarModule, MatIconModule, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-toolbar class="sw-topbar">
      <a routerLink="/" class="sw-brand" aria-label="Seamwright home">
        <mat-icon aria-hidden="true">architecture</mat-icon>
        <span>Seamwright</span>
      </a>
    </mat-toolbar>
    <main class="sw-main"><router-outlet /></main>
  `,
  styles: `
    .sw-brand { display: inline-flex; gap: 8px; align-items: center; color: inherit; text-decoration: none; font-weight: 500; }
    .sw-main { padding: 24px; max-width: 1200px; margin: 0 auto; }
  `,
})
export class AppComponent {
  constructor() {
    // Icons come from the shipped Material Symbols font, not from a web service.
    inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
  }
}
