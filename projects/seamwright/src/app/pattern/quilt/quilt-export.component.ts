import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { quiltPictureSvg, type PatternDocument, type QuiltPlan } from '@seamwright/piecing';
import { NotifyService } from '../../core/notify.service';
import { patternFileName } from '../../pattern-files/pattern-file-name';
import { saveFile } from '../../pattern-files/save-file';
import { pngSize, rasteriseSvg } from '../../pattern-files/rasterise-svg';

/** File name of a quilt picture: the title, the colourway when one is chosen, "quilt". */
export function quiltPictureFileName(title: string, colourwayName: string | null, extension: '.svg' | '.png'): string {
  return patternFileName(`${title}${colourwayName ? ` ${colourwayName}` : ''} quilt`, extension);
}

/** Downloads of the quilt picture as shown (chosen size and colourway): SVG at true size in inches, or PNG. */
@Component({
  selector: 'sw-quilt-export',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-stroked-button type="button" (click)="downloadSvg()" [disabled]="busy()"><mat-icon aria-hidden="true">download</mat-icon>Quilt picture (SVG)</button>
    <button mat-stroked-button type="button" (click)="downloadPng()" [disabled]="busy()"><mat-icon aria-hidden="true">image</mat-icon>Quilt picture (PNG)</button>
  `,
  styles: `:host { display: inline-flex; gap: 8px; flex-wrap: wrap; }`,
})
export class QuiltExportComponent {
  private readonly notify = inject(NotifyService);
  /** The pattern in the colourway shown. */
  readonly document = input.required<PatternDocument>();
  readonly plan = input.required<QuiltPlan>();
  readonly colourwayName = input<string | null>(null);
  protected readonly busy = signal(false);

  private picture(): string {
    return quiltPictureSvg(this.document(), { plan: this.plan(), colourwayId: null, idPrefix: 'q-' });
  }

  protected downloadSvg(): void {
    const name = quiltPictureFileName(this.document().title, this.colourwayName(), '.svg');
    const { width, height } = this.plan().finishedSizeIn;
    saveFile(new Blob([this.picture()], { type: 'image/svg+xml' }), name);
    this.notify.info(`Downloaded “${name}” (${width} × ${height} in.)`);
  }

  protected async downloadPng(): Promise<void> {
    const name = quiltPictureFileName(this.document().title, this.colourwayName(), '.png');
    const { width, height } = this.plan().finishedSizeIn;
    // A quilt is large: 96 px per inch would pass the canvas limits, so the picture is scaled to fit them.
    const size = pngSize(width, height);
    this.busy.set(true);
    try {
      const png = await rasteriseSvg(this.picture(), size.widthPx, size.heightPx);
      saveFile(png, name);
      this.notify.info(`Downloaded “${name}” (${size.widthPx} × ${size.heightPx} px)`);
    } catch (err) {
      this.notify.error(err, 'The picture was not made');
    } finally {
      this.busy.set(false);
    }
  }
}
