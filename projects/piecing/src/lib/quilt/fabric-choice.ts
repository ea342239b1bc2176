import type { PatternDocument } from '../document/pattern-schema';

/** One fabric slot as a quilter chose it: the name and colour shown in place of the document's. */
export interface FabricChoiceSlot {
  name: string;
  colour: string;
}

/**
 * The document in fabrics given outright (a quilter's own copy of a colourway, design §11 and
 * docs/quilt-layout.md): each slot named in `fabrics` (keyed by document fabric id) takes that name and
 * colour; ids, usable WOF and the drafting stay, so the cutting list, yardage, previews and print set
 * follow by taking the returned document. Slots not named, and names of slots the document lacks, are
 * left alone. The document's colourways are kept, so a colourway chosen afterwards still applies.
 */
export function applyFabricChoice<D extends Pick<PatternDocument, 'fabrics'>>(doc: D, fabrics: Readonly<Record<string, FabricChoiceSlot>>): D {
  return {
    ...doc,
    fabrics: doc.fabrics.map((f) => {
      const slot = Object.hasOwn(fabrics, f.id) ? fabrics[f.id] : undefined;
      return slot ? { ...f, name: slot.name, colour: slot.colour } : f;
    }),
  };
}
