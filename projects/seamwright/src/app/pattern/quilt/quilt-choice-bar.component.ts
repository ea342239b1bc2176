import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import type { ColourwayCopy } from '@seamwright/api';
import { applyColourway, applyFabricChoice, type PatternDocument } from '@seamwright/piecing';
import { NotifyService } from '../../core/notify.service';
import { PatternContext } from '../pattern-context.service';
import { ColourwayCopiesService } from './colourway-copies.service';
import { ColourwayCopyEditorComponent } from './colourway-copy-editor.component';
import { QuiltChoice } from './quilt-choice.service';

/**
 * The quilter's choice of quilt size and colourway before the cutting list and the print set: the
 * same choice as on the Quilt tab (one per open pattern). Offers the designer's colourways and the
 * signed-in user's own copies of them; a copy can be made from the colourway shown, changed and deleted.
 */
@Component({
  selector: 'sw-quilt-choice-bar',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, ColourwayCopyEditorComponent],
  template: `
    <div class="choices">
      @if (sizes().length) {
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Quilt size</mat-label>
          <mat-select [value]="sizeName() ?? ''" (selectionChange)="choice.sizeName.set($event.value || null)">
            <mat-option value="">As laid out ({{ layoutText() }})</mat-option>
            @for (s of sizes(); track s.name) { <mat-option [value]="s.name">{{ s.name }} ({{ s.columns }} × {{ s.rows }})</mat-option> }
          </mat-select>
        </mat-form-field>
      }
      @if (colourways().length || copies().length) {
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Colourway</mat-label>
          <mat-select [value]="fabricKey()" (selectionChange)="chooseFabrics($event.value)">
            <mat-option value="">The pattern's own fabrics</mat-option>
            @for (c of colourways(); track c.id) { <mat-option [value]="'cw:' + c.id">{{ c.name }}</mat-option> }
            @if (copies().length) {
              <mat-optgroup label="My copies">
                @for (c of copies(); track c.id) { <mat-option [value]="'copy:' + c.id">{{ c.name }}</mat-option> }
              </mat-optgroup>
            }
          </mat-select>
        </mat-form-field>
      }
      @if (patternId()) {
        <button mat-stroked-button type="button" [disabled]="making()" (click)="makeCopy()">
          <mat-icon aria-hidden="true">content_copy</mat-icon>Make my copy
        </button>
        @if (copy()) {
          <button mat-stroked-button type="button" [attr.aria-expanded]="editing()" aria-controls="copy-editor" (click)="editing.set(!editing())">
            <mat-icon aria-hidden="true">edit</mat-icon>{{ editing() ? 'Hide my copy' : 'Change my copy' }}
          </button>
        }
      }
    </div>
    @if (editing() && copy(); as c) {
      <sw-colourway-copy-editor id="copy-editor" [patternId]="patternId()" [copy]="c" [document]="document()" (closed)="editing.set(false)" />
    }
  `,
  styles: `
    :host { display: block; }
    .choices { display: flex; flex-wrap: wrap; gap: 8px; align-items: center; }
    mat-form-field { width: 240px; }
  `,
})
export class QuiltChoiceBarComponent {
  protected readonly choice = inject(QuiltChoice);
  private readonly ctx = inject(PatternContext, { optional: true });
  private readonly service = inject(ColourwayCopiesService);
  private readonly notify = inject(NotifyService);
  readonly document = input.required<PatternDocument>();
  protected readonly patternId = computed(() => this.ctx?.id() ?? '');
  protected readonly sizes = computed(() => this.document().quilt?.sizes ?? []);
  protected readonly colourways = computed(() => this.document().colourways ?? []);
  protected readonly copies = this.choice.copies;
  protected readonly copy = this.choice.copy;
  protected readonly editing = signal(false);
  protected readonly making = signal(false);
  protected readonly layoutText = computed(() => {
    const q = this.document().quilt;
    return q ? `${q.columns} × ${q.rows}` : '';
  });
  protected readonly sizeName = computed(() => chosenSize(this.document(), this.choice.sizeName()));
  protected readonly colourwayId = computed(() => chosenColourway(this.document(), this.choice.colourwayId()));
  /** The select's value: '' (own fabrics), 'cw:<id>' (a colourway) or 'copy:<id>' (one of my copies). */
  protected readonly fabricKey = computed(() => {
    const copy = this.copy();
    if (copy) return `copy:${copy.id}`;
    const id = this.colourwayId();
    return id ? `cw:${id}` : '';
  });

  constructor() {
    // The user's copies, once per open pattern (the choice is shared by the pattern's pages).
    effect(() => {
      const id = this.patternId();
      untracked(() => {
        if (!id || this.choice.copiesLoadedFor === id) return;
        this.choice.copiesLoadedFor = id;
        this.service.list(id).subscribe({
          next: (list) => this.choice.copies.set(list),
          error: (err: unknown) => this.notify.error(err, 'Your colourway copies could not be loaded'),
        });
      });
    });
  }

  protected chooseFabrics(value: string): void {
    if (value.startsWith('copy:')) this.choice.chooseCopy(value.slice('copy:'.length));
    else {
      this.choice.chooseColourway(value.startsWith('cw:') ? value.slice('cw:'.length) : null);
      this.editing.set(false);
    }
  }

  /** Copies the fabrics shown now (a colourway, or the pattern's own) and opens the copy for changes. */
  protected makeCopy(): void {
    this.making.set(true);
    // With a copy chosen, the new copy starts from the colourway that one came from.
    const source = this.copy() ? chosenColourway(this.document(), this.copy()!.sourceColourwayId) : this.colourwayId();
    this.service.create(this.patternId(), source).subscribe({
      next: (made) => {
        this.making.set(false);
        this.choice.keep(made);
        this.choice.chooseCopy(made.id);
        this.editing.set(true);
      },
      error: (err: unknown) => {
        this.making.set(false);
        this.notify.error(err, 'No copy made');
      },
    });
  }
}

/** The chosen size's name when the pattern still has it, else null (the layout as laid out). */
export function chosenSize(doc: PatternDocument | null, name: string | null): string | null {
  return name && doc?.quilt?.sizes.some((s) => s.name === name) ? name : null;
}

/** The chosen colourway's id when the pattern still has it, else null (its own fabrics). */
export function chosenColourway(doc: PatternDocument | null, id: string | null): string | null {
  return id && doc?.colourways?.some((c) => c.id === id) ? id : null;
}

/**
 * The document in the chosen fabrics: the user's copy when one is chosen (its fabrics given outright),
 * else the chosen colourway (or the pattern's own fabrics).
 */
export function documentInChoice(doc: PatternDocument, colourwayId: string | null, copy: ColourwayCopy | null): PatternDocument {
  return copy ? applyFabricChoice(doc, copy.fabrics) : applyColourway(doc, chosenColourway(doc, colourwayId));
}
