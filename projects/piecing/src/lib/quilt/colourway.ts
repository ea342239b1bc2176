import type { PatternDocument } from '../document/pattern-schema';
import { QuiltPlanError } from './quilt-types';

/**
 * The document in one of its colourways (design §11): each fabric slot the colourway names takes the
 * colourway's name and colour; ids, usable WOF and the drafting stay, so the cutting list, previews,
 * booklet and print set follow by taking the returned document. A null or missing id returns the
 * document unchanged. Throws {@link QuiltPlanError} (field `colourwayId`) for an unknown id.
 */
export function applyColourway<D extends Pick<PatternDocument, 'fabrics' | 'colourways'>>(doc: D, colourwayId: string | null | undefined): D {
  if (colourwayId === null || colourwayId === undefined) return doc;
  const colourway = doc.colourways?.find((c) => c.id === colourwayId);
  if (!colourway) {
    const known = (doc.colourways ?? []).map((c) => `"${c.id}"`).join(', ') || 'none';
    throw new QuiltPlanError(`unknown colourway "${colourwayId}" (the pattern has: ${known})`, 'colourwayId');
  }
  return {
    ...doc,
    fabrics: doc.fabrics.map((f) => {
      const slot = colourway.fabrics[f.id];
      return slot ? { ...f, name: slot.name, colour: slot.colour } : f;
    }),
  };
}
