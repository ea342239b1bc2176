import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import type { PatternDocument } from '@seamwright/piecing';
import { renderFrontViewSvg } from '@seamwright/template-editor';
import { PatternContext } from '../pattern-context.service';
import { NotifyService } from '../../core/notify.service';
import { PATTERN_FILE_EXTENSION, patternFileName } from '../../pattern-files/pattern-file-name';
import { saveFile } from '../../pattern-files/save-file';
import { pngSize, rasteriseSvg } from '../../pattern-files/rasterise-svg';

/**
 * The board's Download menu: the pattern file (`.seamwright.json`, docs/pattern-format.md) for those who
 * may change the design, and the front view as SVG (true size, in inches) or PNG for everyone who can
 * see the pattern. It takes the document on the board, unsaved edits included.
 */
@Component({
  selector: 'sw-pattern-file-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-stroked-button type="button" [matMenuTriggerFor]="menu" [disabled]="!document() || busy()">
      <mat-icon aria-hidden="true">download</mat-icon>Download
    </button>
    <mat-menu #menu="matMenu">
      @if (ctx.canEdit()) {
        <button mat-menu-item type="button" (click)="downloadPatternFile()">
          <mat-icon aria-hidden="true">data_object</mat-icon>Pattern file (.seamwright.json)
        </button>
      }
      <button mat-menu-item type="button" (click)="exportSvg()"><mat-icon aria-hidden="true">draw</mat-icon>Front view as SVG</button>
      <button mat-menu-item type="button" (click)="exportPng()"><mat-icon aria-hidden="true">image</mat-icon>Front view as PNG</button>
    </mat-menu>
  `,
})
export class PatternFileMenuComponent {
  protected readonly ctx = inject(PatternContext);
  private readonly notify = inject(NotifyService);
  /** The document on the board. */
  readonly document = input<PatternDocument | null>(null);
  protected readonly busy = signal(false);

  protected downloadPatternFile(): void {
    const doc = this.document();
    if (!doc || !this.ctx.canEdit()) return;
    const name = patternFileName(doc.title, PATTERN_FILE_EXTENSION);
    saveFile(new Blob([JSON.stringify(doc, null, 2) + '\n'], { type: 'application/json' }), name);
    this.notify.info(`Downloaded “${name}”`);
  }

  protected exportSvg(): void {
    const doc = this.document();
    if (!doc) return;
    const name = patternFileName(doc.title, '.svg');
    saveFile(new Blob([renderFrontViewSvg(doc)], { type: 'image/svg+xml' }), name);
    this.notify.info(`Downloaded “${name}” (${doc.canvas.widthIn} × ${doc.canvas.heightIn} in.)`);
  }

  protected async exportPng(): Promise<void> {
    const doc = this.document();
    if (!doc) return;
    const name = patternFileName(doc.title, '.png');
    const size = pngSize(doc.canvas.widthIn, doc.canvas.heightIn);
    this.busy.set(true);
    try {
      const png = await rasteriseSvg(renderFrontViewSvg(doc), size.widthPx, size.heightPx);
      saveFile(png, name);
      this.notify.info(`Downloaded “${name}” (${size.widthPx} × ${size.heightPx} px, ${Math.round(size.pxPerIn)} px per in.)`);
    } catch (err) {
      this.notify.error(err, 'The picture was not made');
    } finally {
      this.busy.set(false);
    }
  }
}
