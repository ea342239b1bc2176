import type { PatternDocument } from '../../document/pattern-schema';
import { derivePatches, type PatchDeriver } from '../../geometry/index';

/** How many copies of one section's template the pattern needs (docs/design-notes.md#copies). */
export interface SectionCopies {
  sectionId: string;
  label: string;
  /** Copies of the section in one block: its ring-repeat count, or 1. */
  perBlock: number;
  /** Times the section is sewn in the whole pattern: perBlock × block count. Paper foundations are torn
   * away after sewing, so this is also the number of paper copies to print. */
  templatesNeeded: number;
  /** k: patches in the section. A freezer-paper foundation is ironed on for the first patch and pressed once for each patch added: k pressings per section sewn. */
  patches: number;
  /** u = max(1, floor(P / k)): sections one freezer-paper template lasts (a template must last a whole section). */
  sectionsPerTemplate: number;
  /** Freezer-paper copies to print: ceil(templatesNeeded / u). */
  printedCopies: number;
  /** The figures in words, e.g. `B: 3 patches = 3 pressings per section; 16 pressings last 5 sections; 8 to sew → 2 copies`. */
  figures: string;
}

/** Why a patch gets a piece template. */
export type PieceTemplateReason = 'strip-set' | 'designer';

/** Copies of one piece template: freezer paper ironed on fabric (or a strip set) to cut one shaped piece. */
export interface PieceTemplateCopies {
  sectionId: string;
  /** `B1` */
  patchLabel: string;
  patchNumber: number;
  /** Cut from a strip set (always gets one), or marked by the designer (`pieceTemplate`). */
  reason: PieceTemplateReason;
  /** Pieces to cut: the section's uses (ring repeats × blocks). One pressing each. */
  pieces: number;
  /** ceil(pieces / P). */
  copies: number;
  /** e.g. `B1: 8 pieces, one pressing each; 16 pressings per template → 1 copy`. */
  figures: string;
}

/** Copies for the whole pattern, section by section and piece template by piece template, with totals. */
export interface CopyPlan {
  /** P: pressings a freezer-paper template survives. */
  pressingsPerTemplate: number;
  blockCount: number;
  sections: SectionCopies[];
  pieceTemplates: PieceTemplateCopies[];
  totalTemplatesNeeded: number;
  /** Freezer-paper foundation copies, all sections. */
  totalPrintedCopies: number;
  /** Freezer-paper piece-template copies, all piece templates. */
  totalPieceTemplateCopies: number;
  /** The rule in words, for the cover and the print page ({@link copiesRuleText}). */
  rule: string;
}

/**
 * How many of each template the pattern needs (docs/design-notes.md#copies). Templates needed =
 * ring repeats × blocks per section (paper foundations: one print per use). Freezer paper loses its hold
 * by pressings: a foundation template is pressed once per patch of its section (k pressings) and must
 * last the whole section, so one serves u = max(1, floor(P / k)) sections and copies = ceil(uses / u).
 * A piece template is pressed once per piece cut: copies = ceil(pieces / P). Patches cut from a strip
 * set, and patches the designer marks (`pieceTemplate`), get a piece template. `pressingsPerTemplate`
 * overrides the document's setting P; `derive` gives a section's patches (the print set passes the ones it
 * derived already).
 */
export function planCopies(
  document: Pick<PatternDocument, 'sections' | 'blockCount' | 'pressingsPerTemplate'>,
  pressingsPerTemplate = document.pressingsPerTemplate,
  derive: PatchDeriver = (s) => derivePatches(s),
): CopyPlan {
  if (!Number.isInteger(pressingsPerTemplate) || pressingsPerTemplate < 1) {
    throw new RangeError(`pressings per template must be a whole number, 1 or more, got ${pressingsPerTemplate}`);
  }
  const P = pressingsPerTemplate;
  const sections: SectionCopies[] = [];
  const pieceTemplates: PieceTemplateCopies[] = [];
  for (const s of document.sections) {
    const perBlock = s.ringRepeat?.count ?? 1;
    const templatesNeeded = perBlock * document.blockCount;
    const derived = derive(s).patches;
    const k = Math.max(1, derived.length);
    const copies = foundationCopies(templatesNeeded, k, P);
    sections.push({
      sectionId: s.id,
      label: s.label,
      perBlock,
      templatesNeeded,
      patches: k,
      sectionsPerTemplate: copies.sectionsPerTemplate,
      printedCopies: copies.copies,
      figures: `${s.label}: ${plural(k, 'patch', 'patches')} = ${plural(k, 'pressing')} per section; ${P} pressings last ${plural(copies.sectionsPerTemplate, 'section')}; ${templatesNeeded} to sew → ${plural(copies.copies, 'copy', 'copies')}`,
    });
    const marked = new Set(s.patches.filter((p) => p.pieceTemplate).map((p) => p.number));
    for (const patch of derived) {
      const reason: PieceTemplateReason | null = patch.stripSet ? 'strip-set' : marked.has(patch.number) ? 'designer' : null;
      if (!reason) continue;
      const n = pieceTemplateCopies(templatesNeeded, P);
      pieceTemplates.push({
        sectionId: s.id,
        patchLabel: patch.label,
        patchNumber: patch.number,
        reason,
        pieces: templatesNeeded,
        copies: n,
        figures: `${patch.label}: ${plural(templatesNeeded, 'piece')}, one pressing each; ${P} pressings per template → ${plural(n, 'copy', 'copies')}`,
      });
    }
  }
  return {
    pressingsPerTemplate: P,
    blockCount: document.blockCount,
    sections,
    pieceTemplates,
    totalTemplatesNeeded: sections.reduce((n, s) => n + s.templatesNeeded, 0),
    totalPrintedCopies: sections.reduce((n, s) => n + s.printedCopies, 0),
    totalPieceTemplateCopies: pieceTemplates.reduce((n, t) => n + t.copies, 0),
    rule: copiesRuleText(P),
  };
}

/**
 * Freezer-paper copies of a foundation template (docs/design-notes.md#copies): a section of k patches
 * costs k pressings and a template must last a whole section, so one template serves
 * u = max(1, floor(P / k)) sections and `uses` sections take ceil(uses / u) copies.
 */
export function foundationCopies(uses: number, patches: number, pressingsPerTemplate: number): { sectionsPerTemplate: number; copies: number } {
  const sectionsPerTemplate = Math.max(1, Math.floor(pressingsPerTemplate / Math.max(1, patches)));
  return { sectionsPerTemplate, copies: Math.ceil(uses / sectionsPerTemplate) };
}

/** Freezer-paper copies of a piece template: one pressing per piece cut, copies = ceil(pieces / P) (at least 1). */
export function pieceTemplateCopies(pieces: number, pressingsPerTemplate: number): number {
  return Math.max(1, Math.ceil(pieces / pressingsPerTemplate));
}

/** The copies rule in words, with P filled in, for the cover and the print page. */
export function copiesRuleText(pressingsPerTemplate: number): string {
  const P = pressingsPerTemplate;
  return (
    `Paper foundations are torn away after sewing: print one for every section sewn. Freezer paper loses its hold by pressings, ` +
    `not by sections: a foundation template is ironed on for the first patch and pressed once for each patch added, so a section ` +
    `of k patches costs k pressings, and a template must last the whole section. With ${P} pressings per template, one template ` +
    `serves max(1, floor(${P} / k)) sections, and copies = ceil(sections to sew / that). A piece template is pressed once for each ` +
    `piece cut: copies = ceil(pieces / ${P}).`
  );
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
