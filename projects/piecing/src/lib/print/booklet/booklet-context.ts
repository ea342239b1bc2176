import type { Fabric, PatternDocument, Section } from '../../document/index';
import { rememberingDeriver, type DerivedPatch, type PatchDeriver } from '../../geometry/index';
import { buildCuttingList, stripSetDisplayName, type CuttingList } from '../../fabrication/index';
import type { PdfPen } from '../pdf-pen';
import type { PrintOptions } from '../print-options';
import { checkSewability, type SewabilityVerdict } from '../../sewability/index';
import type { UnsewableSection } from './unsewable-sections';

/** What every booklet page draws from, worked out once per print set. */
export interface BookletContext {
  pen: PdfPen;
  document: PatternDocument;
  options: PrintOptions;
  fabrics: Map<string, Fabric>;
  /** Each section's patches in piecing order. */
  patches: Map<string, DerivedPatch[]>;
  /** Each section's sewability in its numbered order, checked once on those patches. */
  verdicts: Map<string, SewabilityVerdict>;
  cuttingList: CuttingList;
  /** Sections not sewable as numbered (printed anyway), by id. */
  unsewable: Map<string, UnsewableSection>;
}

/** Each section's patches in piecing order and its sewability verdict, worked out once per print set. */
export interface SectionFacts {
  /** Every section's patches and problems, each derived once (shared: read, never change). */
  derive: PatchDeriver;
  patches: Map<string, DerivedPatch[]>;
  verdicts: Map<string, SewabilityVerdict>;
}

/** Derives every section's patches once and checks each section's sewability on them. */
export function sectionFacts(document: Pick<PatternDocument, 'sections'>, derive: PatchDeriver = rememberingDeriver()): SectionFacts {
  const patches = new Map(document.sections.map((s) => [s.id, [...derive(s).patches].sort((a, b) => a.number - b.number)]));
  const verdicts = new Map(document.sections.map((s) => [s.id, checkSewability(patches.get(s.id)!)]));
  return { derive, patches, verdicts };
}

/** Builds the booklet context of a document. */
export function bookletContext(
  pen: PdfPen,
  document: PatternDocument,
  options: PrintOptions,
  unsewable: readonly UnsewableSection[],
  facts: SectionFacts = sectionFacts(document),
): BookletContext {
  return {
    pen,
    document,
    options,
    fabrics: new Map(document.fabrics.map((f) => [f.id, f])),
    patches: facts.patches,
    verdicts: facts.verdicts,
    cuttingList: buildCuttingList(document, facts.derive),
    unsewable: new Map(unsewable.map((u) => [u.sectionId, u])),
  };
}

/** How many of a section the whole pattern sews: ring copies × blocks. */
export function sectionUses(document: Pick<PatternDocument, 'blockCount'>, section: Section): number {
  return (section.ringRepeat?.count ?? 1) * document.blockCount;
}

/** The fabric colour of a patch for diagrams (grey when the patch has no fabric). */
export function fabricColour(ctx: BookletContext, fabricId: string | undefined): string {
  return (fabricId && ctx.fabrics.get(fabricId)?.colour) || '#d0d0d0';
}

/** What a patch is cut from, in words: its fabric, or the strip set's name. */
export function patchMaterial(ctx: BookletContext, patch: DerivedPatch): string {
  if (patch.stripSet) return `a slice of ${stripSetNameOf(ctx, patch)}`;
  return (patch.fabricId && ctx.fabrics.get(patch.fabricId)?.name) || 'fabric of your choice';
}

/** What quilters call the strip set a patch is cut from: its name, or the patches it fills (never an id). */
export function stripSetNameOf(ctx: BookletContext, patch: DerivedPatch): string {
  const listed = ctx.cuttingList.stripSets.find((s) => s.patchLabels.includes(patch.label));
  return listed ? stripSetDisplayName(listed.name, listed.patchLabels) : stripSetDisplayName(patch.stripSet?.name, [patch.label]);
}
