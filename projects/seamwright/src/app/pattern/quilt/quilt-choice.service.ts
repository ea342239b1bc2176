import { Injectable, signal } from '@angular/core';

/**
 * The quilt size and colourway chosen on the pattern page, shared by the Quilt tab, the cutting list
 * and the print page. Provided by the pattern page, so each open pattern has its own choice.
 * Null means the pattern's own layout (no named size) and its own fabrics (no colourway).
 */
@Injectable()
export class QuiltChoice {
  /** The chosen named size, or null for the layout's own columns and rows. */
  readonly sizeName = signal<string | null>(null);
  /** The chosen colourway's id, or null for the pattern's own fabrics. */
  readonly colourwayId = signal<string | null>(null);
}
