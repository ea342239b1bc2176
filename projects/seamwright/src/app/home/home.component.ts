import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

/** The landing page: what Seamwright does, for designers and quilters. */
@Component({
  selector: 'sw-home',
  imports: [MatCardModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Design it. Check it sews. Print it true to size.</h1>
    <p class="lead">
      Seamwright turns foundation-paper-pieced designs into patterns a quilter can sew: sections checked for a
      sewable piecing order, a true ¼ in. seam allowance, cutting lists and print sets with a test square on
      every sheet.
    </p>
    <div class="cards">
      <mat-card appearance="outlined">
        <mat-card-header><mat-icon matCardAvatar>draw</mat-icon><mat-card-title>For designers</mat-card-title></mat-card-header>
        <mat-card-content>Draft straight, arc and wedge sections on the Drafting board and number the piecing order.</mat-card-content>
      </mat-card>
      <mat-card appearance="outlined">
        <mat-card-header><mat-icon matCardAvatar>content_cut</mat-icon><mat-card-title>For quilters</mat-card-title></mat-card-header>
        <mat-card-content>Print at 100 %, measure the test square, cut and sew, and keep a Sewing log.</mat-card-content>
      </mat-card>
    </div>
  `,
  styles: `
    .lead { font-size: 1.1rem; max-width: 60ch; }
    .cards { display: grid; grid-template-columns: repeat(auto-fit, minmax(260px, 1fr)); gap: 16px; margin-top: 24px; }
  `,
})
export class HomeComponent {}
