import type { PatternDocument } from '../../document/index';
import { planCopies } from '../../fabrication/index';
import { derivePatches } from '../../geometry/index';

/** One section's copies figures (docs/design-notes.md#copies). */
export interface SectionCopiesFigures {
  sectionId: string;
  label: string;
  /** k: patches in the section, one pressing each. */
  patches: number;
  /** Sections sewn in the whole pattern: ring repeats × blocks. */
  uses: number;
  /** u = max(1, floor(P / k)): sections one freezer-paper template lasts. */
  sectionsPerTemplate: number;
  /** Freezer-paper prints: ceil(uses / u). */
  freezerPaperCopies: number;
}

/** One piece template's copies figures: one pressing per piece cut. */
export interface PieceCopiesFigures {
  label: string;
  pieces: number;
  /** ceil(pieces / P). */
  copies: number;
}

/** The §5.6 copies figures of a document with its pressings per template P. */
export interface CopiesFigures {
  pressingsPerTemplate: number;
  sections: SectionCopiesFigures[];
}

/**
 * Copies by docs/design-notes.md#copies: a foundation template is pressed once per patch, so a
 * section of k patches costs k pressings and a template must last a whole section; one template
 * serves max(1, floor(P / k)) sections and copies = ceil(uses / that).
 */
export function copiesFigures(document: PatternDocument): CopiesFigures {
  const P = document.pressingsPerTemplate;
  const plan = planCopies(document);
  return {
    pressingsPerTemplate: P,
    sections: document.sections.map((section, i) => {
      const k = Math.max(1, derivePatches(section).patches.length);
      const uses = plan.sections[i].templatesNeeded;
      const u = Math.max(1, Math.floor(P / k));
      return { sectionId: section.id, label: section.label, patches: k, uses, sectionsPerTemplate: u, freezerPaperCopies: Math.ceil(uses / u) };
    }),
  };
}

/** A piece template's copies: one pressing per piece, copies = ceil(pieces / P). */
export function pieceTemplateCopies(pieces: number, pressingsPerTemplate: number): number {
  return Math.max(1, Math.ceil(pieces / pressingsPerTemplate));
}

/** The rule in words, for the cover and the template sheets. */
export function copiesRuleText(P: number): string {
  return (
    `Freezer paper loses its hold by pressings: a foundation template is ironed on for the first patch and pressed once for each patch added, ` +
    `so a section of k patches costs k pressings and one template must last the whole section. With ${P} pressings per template, ` +
    `one template serves max(1, floor(${P} / k)) sections: copies = ceil(sections to sew / that). A piece template is pressed once per piece cut: ` +
    `copies = ceil(pieces / ${P}). Paper foundations are torn away: one print per section sewn.`
  );
}
