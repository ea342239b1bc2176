import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { buildCuttingList, formatLength, type Section } from '@seamwright/piecing';
import { renameStripSet, setPatchPieceTemplate, setPatchRoughCut, setStripSetSubCutLength, type BoardPatch } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { OptionalLengthFieldComponent } from './optional-length-field.component';

/**
 * How a selected patch is cut, the way designers write it: its rough-cut piece (left empty, the
 * program computes it; typing one side alone makes a square), whether the print set carries a piece
 * template of it, and for a strip-set patch the set's name for quilters and its sub-cut length.
 */
@Component({
  selector: 'sw-patch-cutting',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, OptionalLengthFieldComponent],
  template: `
    <h4 id="sw-rough-cut-title">Rough cut</h4>
    <div class="grid" role="group" aria-labelledby="sw-rough-cut-title">
      <sw-optional-length-field label="Rough-cut width" [value]="patch().roughCut?.widthIn ?? null" [unit]="unit()" [placeholder]="computedSide(0)" [readOnly]="ro()" (valueChange)="setSide('widthIn', $event)" />
      <sw-optional-length-field label="Rough-cut length" [value]="patch().roughCut?.lengthIn ?? null" [unit]="unit()" [placeholder]="computedSide(1)" [readOnly]="ro()" (valueChange)="setSide('lengthIn', $event)" />
    </div>
    <p class="muted" data-testid="rough-cut-state">
      @if (patch().roughCut; as cut) {
        Set by you: {{ size(cut.widthIn, cut.lengthIn) }}.
        @if (computed(); as c) {
          Computed would be {{ size(c.widthIn, c.lengthIn) }}.
        }
      } @else if (computed(); as c) {
        Computed: {{ size(c.widthIn, c.lengthIn) }} (the patch with its allowance and piecing margin). Type one side for a square.
      } @else {
        Computed by the cutting list.
      }
    </p>
    @if (patch().roughCut && !ro()) {
      <button mat-button type="button" (click)="clearRoughCut()">Use the computed size</button>
    }
    <mat-checkbox
      [checked]="patch().pieceTemplate === true || !!patch().stripSet"
      [disabled]="ro() || !!patch().stripSet"
      (change)="setPieceTemplate($event.checked)"
      aria-describedby="sw-piece-template-hint"
      >Piece template</mat-checkbox
    >
    <p class="muted" id="sw-piece-template-hint">
      {{ patch().stripSet ? 'A patch cut from a strip set always gets a piece template in the print set.' : 'Print a cutting template of this patch with its allowance.' }}
    </p>
    @if (patch().stripSet; as set) {
      <h4 id="sw-strip-set-cutting-title">Strip set for quilters</h4>
      <div class="grid" role="group" aria-labelledby="sw-strip-set-cutting-title">
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Strip set name</mat-label>
          <input matInput #name [value]="set.name ?? ''" maxlength="80" [placeholder]="'Strip set for ' + patch().label" [readonly]="ro()" aria-label="Strip set name" (change)="rename(set.id, name.value)" (keydown.enter)="name.blur()" />
        </mat-form-field>
        <sw-optional-length-field label="Sub-cut length" [value]="set.subCutLengthIn ?? null" [unit]="unit()" [readOnly]="ro()" (valueChange)="setSubCut(set.id, $event)" />
      </div>
    }
  `,
  styles: `
    :host { display: block; }
    h4 { margin: 10px 0 6px; font-size: 13px; font-weight: 500; }
    .grid { display: grid; grid-template-columns: repeat(2, minmax(0, 1fr)); gap: 8px; margin-bottom: 4px; align-items: start; }
    .muted { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); margin: 4px 0 8px; }
    mat-form-field { width: 100%; }
  `,
})
export class PatchCuttingComponent {
  /** The section of the patch. */
  readonly section = input.required<Section>();
  /** The selected patch as the board shows it. */
  readonly patch = input.required<BoardPatch>();

  private readonly session = inject(EditorSession);
  protected readonly ro = this.session.readOnly;
  protected readonly unit = computed(() => this.session.settings().unit);

  /** The rough-cut piece the cutting list computes for the patch (its own setting left out), shorter side first. */
  protected readonly computed = computed(() => {
    const doc = this.session.document();
    const section = this.section();
    const label = this.patch().label;
    const plain = { ...section, patches: section.patches.map(({ roughCut: _cut, ...rest }) => rest) };
    try {
      const found = buildCuttingList({ ...doc, blockCount: 1, sections: [plain] }).patches.find((p) => p.patchLabel === label);
      return found ? { widthIn: found.cutWidthIn, lengthIn: found.cutLengthIn } : null;
    } catch {
      return null;
    }
  });

  protected size(widthIn: number, lengthIn: number): string {
    const u = this.unit();
    return Math.abs(widthIn - lengthIn) < 1e-9 ? `${formatLength(widthIn, u)} square` : `${formatLength(widthIn, u, { withUnit: false })} × ${formatLength(lengthIn, u)}`;
  }

  protected computedSide(i: 0 | 1): string {
    const c = this.computed();
    return c ? `computed: ${formatLength(i === 0 ? c.widthIn : c.lengthIn, this.unit(), { withUnit: false })}` : 'computed';
  }

  protected setSide(side: 'widthIn' | 'lengthIn', value: number | null): void {
    const p = this.patch();
    const s = this.section();
    if (value === null) return this.clearRoughCut();
    const old = p.roughCut;
    // One side typed alone is a square, the way designers write "3 in. square".
    const piece = old ? { ...old, [side]: value } : { widthIn: value, lengthIn: value };
    this.session.apply('Rough cut', (d) => setPatchRoughCut(d, s.id, p.index, piece, this.session.editor.analysis));
  }

  protected clearRoughCut(): void {
    const p = this.patch();
    const s = this.section();
    this.session.apply('Computed rough cut', (d) => setPatchRoughCut(d, s.id, p.index, undefined, this.session.editor.analysis));
  }

  protected setPieceTemplate(on: boolean): void {
    const p = this.patch();
    const s = this.section();
    this.session.apply(on ? 'Piece template' : 'No piece template', (d) => setPatchPieceTemplate(d, s.id, p.index, on, this.session.editor.analysis));
  }

  protected rename(stripSetId: string, name: string): void {
    this.session.apply('Name strip set', (d) => renameStripSet(d, stripSetId, name));
  }

  protected setSubCut(stripSetId: string, lengthIn: number | null): void {
    this.session.apply('Sub-cut length', (d) => setStripSetSubCutLength(d, stripSetId, lengthIn ?? undefined));
  }
}
