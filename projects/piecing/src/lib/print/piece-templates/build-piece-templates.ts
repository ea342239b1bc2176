import type { PatternDocument, Point } from '../../document/index';
import { derivePatches, lineChords, type PatchDeriver } from '../../geometry/index';
import { layoutStripSet, pieceTemplateCopies, PolygonOffsetter, stripSetDisplayName } from '../../fabrication/index';
import type { PrintSegment } from '../template-model';

/** A line printed on a piece template with what it is for. */
export interface PieceTemplateLine extends PrintSegment {
  /** "seam 1 (Plum | Oat)" for a strip seam, "centre of Oat" for a stripe's centre line. */
  label: string;
}

/**
 * A cutting template of one patch (docs/design-notes.md#copies): ironed on the fabric or strip set to
 * cut one shaped piece. In the drawing plane, as seen from the front of the block (the right side of
 * the fabric it is ironed on).
 */
export interface PieceTemplate {
  sectionId: string;
  sectionLabel: string;
  patchLabel: string;
  /** The patch outline: its sewing lines. */
  sewingLine: Point[];
  /** The patch plus its seam allowance: where to cut. */
  cuttingLine: Point[];
  /** Strip seams that must land on these lines, clipped to the cutting line. */
  guideLines: PieceTemplateLine[];
  /** Centre lines of the stripes between two seams, clipped to the cutting line. */
  centreLines: PieceTemplateLine[];
  /** What the piece is cut from: the strip set's name, or the fabric's. */
  material: string;
  /** Pieces the whole pattern cuts with it: ring repeats × blocks. */
  pieces: number;
  /** Prints: ceil(pieces / pressings per template). */
  copies: number;
}

/**
 * The piece templates of a document: every patch cut from a strip set, and every patch the designer
 * marked for one (`pieceTemplate`). `derive` gives a section's patches when the caller has them already.
 */
export function buildPieceTemplates(
  document: PatternDocument,
  sectionIds?: readonly string[],
  derive: PatchDeriver = (s) => derivePatches(s),
): PieceTemplate[] {
  const wanted = sectionIds ? new Set(sectionIds) : null;
  const fabricName = new Map(document.fabrics.map((f) => [f.id, f.name]));
  const offsetter = new PolygonOffsetter();
  const out: PieceTemplate[] = [];
  for (const section of document.sections) {
    if (wanted && !wanted.has(section.id)) continue;
    const marked = new Set(section.patches.filter((p) => p.pieceTemplate).map((p) => p.number));
    const pieces = (section.ringRepeat?.count ?? 1) * document.blockCount;
    for (const patch of derive(section).patches) {
      if (!patch.stripSet && !marked.has(patch.number)) continue;
      const cuttingLine = offsetter.offsetPolygon(patch.polygon, document.seamAllowanceIn, 'mitre');
      const guideLines: PieceTemplateLine[] = [];
      const centreLines: PieceTemplateLine[] = [];
      let material = (patch.fabricId && fabricName.get(patch.fabricId)) || 'fabric';
      if (patch.stripSet) {
        material = stripSetDisplayName(patch.stripSet.name, [patch.label]);
        const layout = layoutStripSet(patch.polygon, patch.stripSet, document.seamAllowanceIn, document.piecingMarginIn);
        const angle = (layout.axisAngleDeg * Math.PI) / 180;
        const u = { x: Math.cos(angle), y: Math.sin(angle) };
        const n = { x: -u.y, y: u.x };
        const across = (d: number): [Point, Point] => {
          const p = { x: layout.centre.x + n.x * d, y: layout.centre.y + n.y * d };
          return [p, { x: p.x + u.x, y: p.y + u.y }];
        };
        const clip = (d: number, label: string, into: PieceTemplateLine[]) => {
          const [a, b] = across(d);
          for (const c of lineChords(cuttingLine, a, b)) into.push({ a: { ...c.from.point }, b: { ...c.to.point }, label });
        };
        for (const g of layout.guideLines) {
          clip(g.acrossIn, `seam ${g.seamNumber} (${fabricName.get(g.fromFabricId) ?? 'strip'} | ${fabricName.get(g.toFabricId) ?? 'strip'})`, guideLines);
        }
        layout.strips.forEach((strip, i) => {
          if (i === 0 || i === layout.strips.length - 1) return;
          clip((strip.fromAcrossIn + strip.toAcrossIn) / 2, `centre of ${fabricName.get(strip.fabricId) ?? 'stripe'}`, centreLines);
        });
      }
      out.push({
        sectionId: section.id,
        sectionLabel: section.label,
        patchLabel: patch.label,
        sewingLine: patch.polygon,
        cuttingLine,
        guideLines,
        centreLines,
        material,
        pieces,
        copies: pieceTemplateCopies(pieces, document.pressingsPerTemplate),
      });
    }
  }
  return out;
}
