import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** Shown for any address that does not exist or is not the user's to see. */
@Component({
  selector: 'sw-not-found',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="nf" aria-labelledby="nf-title">
      <mat-icon class="big" aria-hidden="true">search_off</mat-icon>
      <h1 id="nf-title">Not found</h1>
      <p>There is nothing here, or it is not shared with you. If someone sent you this link, ask them to invite you.</p>
      <a mat-flat-button routerLink="/patterns">Go to your patterns</a>
    </section>
  `,
  styles: `
    .nf { text-align: center; padding: 48px 16px; max-width: 520px; margin: 0 auto; }
    .big { font-size: 64px; width: 64px; height: 64px; color: var(--mat-sys-primary); }
  `,
})
export class NotFoundComponent {}
