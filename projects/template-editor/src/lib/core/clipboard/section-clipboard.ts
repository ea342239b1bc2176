import type { PatternDocument, Section } from '@seamwright/piecing';
import { newId, nextSectionLabel } from '../commands/ids';
import { moveSection } from '../commands/section-commands';

/** What copy puts on the clipboard: deep copies of sections, independent of the document. */
export interface SectionClipboard {
  sections: Section[];
}

/** Copies sections (deep, so later edits do not reach the clipboard). */
export function copySections(document: PatternDocument, sectionIds: readonly string[]): SectionClipboard {
  const ids = new Set(sectionIds);
  return { sections: structuredClone(document.sections.filter((s) => ids.has(s.id))) };
}

/**
 * Pastes clipboard sections moved by (dx, dy), each with a new id and the next free label; patch
 * fabrics that the pattern does not have are dropped. Returns the document and the new ids.
 */
export function pasteSections(
  document: PatternDocument,
  clipboard: SectionClipboard,
  dx = 0.5,
  dy = 0.5,
): { document: PatternDocument; sectionIds: string[] } {
  const fabricIds = new Set(document.fabrics.map((f) => f.id));
  let doc = document;
  const sectionIds: string[] = [];
  for (const original of clipboard.sections) {
    const copy: Section = structuredClone(original);
    copy.id = newId('s');
    copy.label = nextSectionLabel(doc);
    copy.seams = copy.seams.map((m) => ({ ...m, id: newId('m') }));
    copy.patches = copy.patches.map((p) => {
      const next = { ...p };
      if (next.fabricId && !fabricIds.has(next.fabricId)) delete next.fabricId;
      if (next.stripSet && next.stripSet.strips.some((st) => !fabricIds.has(st.fabricId))) delete next.stripSet;
      return next;
    });
    if (copy.ringRepeat) copy.ringRepeat = { ...copy.ringRepeat, centre: { x: copy.ringRepeat.centre.x + dx, y: copy.ringRepeat.centre.y + dy } };
    doc = moveSection({ ...doc, sections: [...doc.sections, copy] }, copy.id, dx, dy);
    sectionIds.push(copy.id);
  }
  return { document: doc, sectionIds };
}
