import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { applyColourway, quiltPictureSvg, type PatternDocument, type QuiltPlan } from '@seamwright/piecing';
import { renderFrontViewSvg } from '@seamwright/template-editor-core';
import { QuiltPictureComponent } from './quilt-picture.component';
import { addColourway, removeColourway, updateColourway, updateColourwayFabric, type QuiltEdit } from './quilt-edits';

/** One picture of the row of colourways. */
interface ColourwayCard {
  id: string | null;
  name: string;
  svg: string;
  swatches: Array<{ name: string; colour: string }>;
}

/**
 * The colourways side by side (a small quilt picture of each, or the block when there is no quilt),
 * the choice of the one shown, and for designers adding, renaming, re-colouring and removing them.
 */
@Component({
  selector: 'sw-colourways',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, QuiltPictureComponent],
  templateUrl: './colourways.component.html',
  styleUrl: './colourways.component.scss',
})
export class ColourwaysComponent {
  readonly document = input.required<PatternDocument>();
  /** The colourway shown, or null for the pattern's own fabrics. */
  readonly chosenId = input<string | null>(null);
  readonly canEdit = input(false);
  /** A change to the pattern, applied by the page to its newest copy (see `QuiltEdit`). */
  readonly edit = output<QuiltEdit>();
  readonly choose = output<string | null>();

  /** The quilt as planned for the page (its geometry is the same in every colourway), or null to show the block. */
  readonly plan = input<QuiltPlan | null>(null);
  protected readonly cards = computed<ColourwayCard[]>(() => {
    const doc = this.document();
    const plan = this.plan();
    const picture = (d: PatternDocument, prefix: string) => (plan ? quiltPictureSvg(d, { plan, colourwayId: null, idPrefix: prefix }) : renderFrontViewSvg(d, { labels: false }));
    const usedIds = plan ? new Set(plan.fabrics.map((f) => f.id)) : null;
    const card = (id: string | null, name: string, d: PatternDocument, i: number): ColourwayCard => ({
      id,
      name,
      svg: picture(d, `cw${i}-`),
      swatches: d.fabrics.filter((f) => !usedIds || usedIds.has(f.id)).map((f) => ({ name: f.name, colour: f.colour })),
    });
    return [card(null, 'The pattern’s own fabrics', doc, 0), ...(doc.colourways ?? []).map((c, i) => card(c.id, c.name, applyColourway(doc, c.id), i + 1))];
  });
  /** The colourway open for changes (designers), with each fabric slot's name and colour in it. */
  protected readonly editing = computed(() => {
    const doc = this.document();
    const c = doc.colourways?.find((x) => x.id === this.chosenId());
    if (!c) return null;
    return { id: c.id, name: c.name, slots: doc.fabrics.map((f) => ({ fabricId: f.id, slotName: f.name, ...(c.fabrics[f.id] ?? { name: f.name, colour: f.colour }) })) };
  });

  protected add(): void {
    const chosen = this.chosenId();
    let made: string | null = null;
    // The page applies an edit as it is sent (outputs are synchronous), so `made` is known below.
    this.edit.emit((doc) => {
      const next = addColourway(doc, doc.colourways?.find((c) => c.id === chosen) ?? null);
      made = next.colourways?.at(-1)?.id ?? null;
      return next;
    });
    this.choose.emit(made);
  }

  protected rename(id: string, name: string): void {
    const trimmed = name.trim();
    if (trimmed) this.edit.emit((doc) => updateColourway(doc, id, { name: trimmed.slice(0, 80) }));
  }

  protected setFabric(id: string, fabricId: string, change: { name?: string; colour?: string }): void {
    if (change.name !== undefined && !change.name.trim()) return;
    this.edit.emit((doc) => updateColourwayFabric(doc, id, fabricId, change));
  }

  protected remove(id: string): void {
    this.choose.emit(null);
    this.edit.emit((doc) => removeColourway(doc, id));
  }
}
