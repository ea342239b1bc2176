import type { PatternDocument, Point, Section } from '../document/index';
import { derivePatches, locatePoint, polygonArea, polygonCentroid, type DerivedPatch, type PatchDeriver } from '../geometry/index';
import { matchingMarks, sectionSeamAllowance, sectionStripSets, stripSetDisplayName, type SectionMatchingMarks } from '../fabrication/index';
import { planTemplateCopies } from './template-copies';
import type { PrintOptions } from './print-options';
import type { PrintPatch, PrintSegment, PrintTemplate } from './template-model';

type TemplateOptions = Pick<PrintOptions, 'foundation' | 'copies' | 'sectionIds'>;

/**
 * The templates of a print set, one per section of the document (ring-repeated sections are one
 * template printed several times), with everything the sheet draws: sewing and cutting lines, seams,
 * patch labels and fabrics, guide lines, matching marks, orientation and copies. `patchesOf` gives a
 * section's patches in piecing order (derived here unless the caller has them already), and `derive` the
 * same for the copies plan.
 */
export function buildPrintTemplates(
  document: PatternDocument,
  options: TemplateOptions,
  patchesOf: (section: Section) => DerivedPatch[] = (s) => derivePatches(s).patches,
  derive?: PatchDeriver,
): PrintTemplate[] {
  const wanted = options.sectionIds ? new Set(options.sectionIds) : null;
  const copies = planTemplateCopies(document, options, derive);
  const fabricName = new Map(document.fabrics.map((f) => [f.id, f.name]));
  const marks = new Map(matchingMarks(document).map((m) => [m.sectionId, m]));
  return document.sections
    .filter((s) => !wanted || wanted.has(s.id))
    .map((section) => buildTemplate(section, patchesOf(section), document, fabricName, copies.get(section.id) ?? 1, marks.get(section.id)));
}

function buildTemplate(
  section: Section,
  derived: DerivedPatch[],
  document: PatternDocument,
  fabricName: Map<string, string>,
  copies: number,
  marks: SectionMatchingMarks | undefined,
): PrintTemplate {
  const { sewingLine, cuttingLine } = sectionSeamAllowance(section, document.seamAllowanceIn);
  const patches: PrintPatch[] = derived.map((p) => ({
    label: p.label,
    ...(p.fabricId && fabricName.has(p.fabricId) ? { fabricName: fabricName.get(p.fabricId)! } : {}),
    ...(p.stripSet ? { stripSetName: stripSetDisplayName(p.stripSet.name, [p.label]) } : {}),
    polygon: p.polygon,
    labelAt: p.labelPoint,
  }));
  const guideLines = sectionStripSets(section, document.seamAllowanceIn, document.piecingMarginIn, derived).flatMap((s) =>
    s.layout.guideLines.flatMap((g) => g.segments.map((seg) => ({ a: seg.a, b: seg.b }))),
  );
  return {
    id: section.id,
    sectionId: section.id,
    sectionLabel: section.label,
    kind: section.geometry.kind,
    sewingLine,
    cuttingLine,
    seams: interiorSeams(derived.map((p) => p.polygon), sewingLine),
    patches,
    guideLines,
    matchingMarks: (marks?.marks ?? []).map((m) => ({ at: m.point, normal: m.normal })),
    orientation: orientationOf(section, sewingLine),
    freeRotation: section.geometry.kind !== 'straight',
    copies,
    areaSqIn: polygonArea(cuttingLine),
    ...(section.note ? { note: section.note } : {}),
  };
}

/** Edges of the patches that are not on the section outline: the seams as they were cut. */
function interiorSeams(polygons: readonly Point[][], outline: readonly Point[]): PrintSegment[] {
  const seen = new Set<string>();
  const seams: PrintSegment[] = [];
  const key = (p: Point) => `${p.x.toFixed(5)},${p.y.toFixed(5)}`;
  for (const ring of polygons) {
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % ring.length];
      const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
      if (locatePoint(mid, outline, 1e-6) !== 'inside') continue;
      const k1 = `${key(a)}|${key(b)}`;
      const k2 = `${key(b)}|${key(a)}`;
      if (seen.has(k1) || seen.has(k2)) continue;
      seen.add(k1);
      seams.push({ a, b });
    }
  }
  return seams;
}

/** Arcs and wedges point to their circle's centre; straight sections to the top of the block. */
function orientationOf(section: Section, sewingLine: readonly Point[]): PrintTemplate['orientation'] {
  const g = section.geometry;
  if (g.kind === 'straight') return { direction: { x: 0, y: -1 }, towards: 'top of block' };
  const from = polygonCentroid(sewingLine);
  const dx = g.centre.x - from.x;
  const dy = g.centre.y - from.y;
  const len = Math.hypot(dx, dy);
  if (len < 1e-6) return { direction: { x: 0, y: -1 }, towards: 'top of block' };
  return { direction: { x: dx / len, y: dy / len }, towards: 'centre' };
}
