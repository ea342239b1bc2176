import type { Fabric, PatternDocument, Section } from '../../document/index';
import { derivePatches, type DerivedPatch } from '../../geometry/index';
import { buildCuttingList, stripSetDisplayName, type CuttingList } from '../../fabrication/index';
import type { PdfPen } from '../pdf-pen';
import type { PrintOptions } from '../print-options';
import type { UnsewableSection } from './unsewable-sections';

/** What every booklet page draws from, worked out once per print set. */
export interface BookletContext {
  pen: PdfPen;
  document: PatternDocument;
  options: PrintOptions;
  fabrics: Map<string, Fabric>;
  /** Each section's patches in piecing order. */
  patches: Map<string, DerivedPatch[]>;
  cuttingList: CuttingList;
  /** Sections not sewable as numbered (printed anyway), by id. */
  unsewable: Map<string, UnsewableSection>;
}

/** Builds the booklet context of a document. */
export function bookletContext(
  pen: PdfPen,
  document: PatternDocument,
  options: PrintOptions,
  unsewable: readonly UnsewableSection[],
): BookletContext {
  return {
    pen,
    document,
    options,
    fabrics: new Map(document.fabrics.map((f) => [f.id, f])),
    patches: new Map(document.sections.map((s) => [s.id, [...derivePatches(s).patches].sort((a, b) => a.number - b.number)])),
    cuttingList: buildCuttingList(document),
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
