import { Injectable, computed, signal } from '@angular/core';
import type { ColourwayCopy } from '@seamwright/api';

/**
 * The quilt size and colourway chosen on the pattern page, shared by the Quilt tab, the cutting list
 * and the print page. Provided by the pattern page, so each open pattern has its own choice.
 * Null means the pattern's own layout (no named size) and its own fabrics (no colourway). A quilter's
 * own colourway copy, when chosen, stands in for the colourway (the two are never chosen together).
 */
@Injectable()
export class QuiltChoice {
  /** The chosen named size, or null for the layout's own columns and rows. */
  readonly sizeName = signal<string | null>(null);
  /** The chosen colourway's id, or null for the pattern's own fabrics. */
  readonly colourwayId = signal<string | null>(null);
  /** The chosen colourway copy's id (the signed-in user's own), or null. */
  readonly colourwayCopyId = signal<string | null>(null);
  /** The signed-in user's copies of this pattern's colourways, once loaded. */
  readonly copies = signal<ColourwayCopy[]>([]);
  /** The pattern the copies were loaded for (they are loaded once per open pattern). */
  copiesLoadedFor: string | null = null;
  /** The chosen copy, when it still exists. */
  readonly copy = computed(() => this.copies().find((c) => c.id === this.colourwayCopyId()) ?? null);

  /** Chooses a designer's colourway (or the pattern's own fabrics), leaving any copy. */
  chooseColourway(id: string | null): void {
    this.colourwayCopyId.set(null);
    this.colourwayId.set(id);
  }

  /** Chooses one of the user's copies in place of a colourway. */
  chooseCopy(id: string): void {
    this.colourwayId.set(null);
    this.colourwayCopyId.set(id);
  }

  /** Puts a saved copy in the list (new or changed). */
  keep(copy: ColourwayCopy): void {
    this.copies.update((list) => (list.some((c) => c.id === copy.id) ? list.map((c) => (c.id === copy.id ? copy : c)) : [...list, copy]));
  }

  /** Takes a deleted copy out of the list and the choice. */
  forget(copyId: string): void {
    this.copies.update((list) => list.filter((c) => c.id !== copyId));
    if (this.colourwayCopyId() === copyId) this.colourwayCopyId.set(null);
  }
}
