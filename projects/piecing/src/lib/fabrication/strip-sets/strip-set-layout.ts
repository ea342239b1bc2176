import type { Point, StripSet } from '../../document/pattern-schema';
import { degToRad, lineChords, polygonCentroid } from '../../geometry/index';
import { GEOMETRY_EPSILON_IN } from '../../tolerance';
import { roundUpToEighthInch } from '../shared/rounding';

/** A printed line on a patch where the seam between two strips of its strip set must land. */
export interface GuideLine {
  /** Which strip seam: 1 is between the first and second strip. */
  seamNumber: number;
  /** Fabric of the strip before and after the seam. */
  fromFabricId: string;
  toFabricId: string;
  /** Signed distance across the strips from the set's centre line, in inches. */
  acrossIn: number;
  /** The seam line clipped to the patch: one segment for a convex patch, more where the patch is concave. */
  segments: Array<{ a: Point; b: Point }>;
}

/** One strip of a laid-out strip set. */
export interface StripPlacement {
  fabricId: string;
  finishedWidthIn: number;
  /** Cut width: finished + 2 × allowance. */
  cutWidthIn: number;
  /** Where the strip's finished part lies across the set, from its centre line, in inches. */
  fromAcrossIn: number;
  toAcrossIn: number;
}

/** A strip set placed on one patch: strips, guide lines and the sub-cut the patch takes. */
export interface StripSetLayout {
  stripSetId: string;
  /** The name the designer gave the set, or null (show {@link stripSetDisplayName}, never the id). */
  stripSetName: string | null;
  /** Direction of the strips, degrees from +x towards +y. */
  axisAngleDeg: number;
  /** A point on the set's centre line: the patch centroid moved across by the set's offset. */
  centre: Point;
  strips: StripPlacement[];
  guideLines: GuideLine[];
  /** Sum of the finished widths, in inches. */
  finishedWidthIn: number;
  /** Width of the sewn set, raw edges included: finished width + 2 × allowance. */
  sewnWidthIn: number;
  /** The patch's length along the strips and its span across them (from the centre line), in inches. */
  patchExtentAlongIn: number;
  patchAcross: { minIn: number; maxIn: number };
  /** Sub-cut length: the designer's (`subCutLengthIn` of the set) when set, else {@link computedSubCutLengthIn}. */
  subCutLengthIn: number;
  /** Sub-cut length the patch needs: extent along the strips + 2 × (allowance + margin), rounded up to ⅛ in. */
  computedSubCutLengthIn: number;
  /** Whether {@link subCutLengthIn} is the designer's. */
  subCutSetByDesigner: boolean;
  /** Whether the set's finished strips span the whole patch across (else the outer strips are too narrow). */
  coversPatch: boolean;
}

/** Cut width of a strip: finished width plus a seam allowance on each long edge. */
export function stripCutWidthIn(finishedWidthIn: number, allowanceIn = 0.25): number {
  return finishedWidthIn + 2 * allowanceIn;
}

/** Finished width of a strip sewn on both long edges: cut width less two seam allowances. */
export function stripFinishedWidthIn(cutWidthIn: number, allowanceIn = 0.25): number {
  return cutWidthIn - 2 * allowanceIn;
}

/**
 * Lays a strip set on a patch polygon: the strips run along `axisAngleDeg`, side by side, the set
 * centred on the patch centroid and moved across by `offsetIn` (positive towards the axis turned +90°).
 * Derives the guide lines (each strip seam clipped to the patch), the strips' cut widths and the
 * sub-cut length (the designer's when the set gives one). Pure; the inputs are untouched.
 */
export function layoutStripSet(polygon: readonly Point[], stripSet: StripSet, allowanceIn = 0.25, marginIn = 0.5): StripSetLayout {
  const angle = degToRad(stripSet.axisAngleDeg ?? 0);
  const u = { x: Math.cos(angle), y: Math.sin(angle) };
  const n = { x: -u.y, y: u.x };
  const centroid = polygonCentroid(polygon);
  const offset = stripSet.offsetIn ?? 0;
  const centre = { x: centroid.x + n.x * offset, y: centroid.y + n.y * offset };

  const finishedWidthIn = stripSet.strips.reduce((s, st) => s + st.finishedWidthIn, 0);
  const strips: StripPlacement[] = [];
  let across = -finishedWidthIn / 2;
  for (const st of stripSet.strips) {
    strips.push({
      fabricId: st.fabricId,
      finishedWidthIn: st.finishedWidthIn,
      cutWidthIn: stripCutWidthIn(st.finishedWidthIn, allowanceIn),
      fromAcrossIn: across,
      toAcrossIn: across + st.finishedWidthIn,
    });
    across += st.finishedWidthIn;
  }

  const guideLines: GuideLine[] = [];
  for (let k = 1; k < strips.length; k++) {
    const acrossIn = strips[k].fromAcrossIn;
    const a = { x: centre.x + n.x * acrossIn, y: centre.y + n.y * acrossIn };
    const b = { x: a.x + u.x, y: a.y + u.y };
    const segments = lineChords(polygon, a, b).map((c) => ({ a: { ...c.from.point }, b: { ...c.to.point } }));
    guideLines.push({ seamNumber: k, fromFabricId: strips[k - 1].fabricId, toFabricId: strips[k].fabricId, acrossIn, segments });
  }

  let minAlong = Infinity;
  let maxAlong = -Infinity;
  let minAcross = Infinity;
  let maxAcross = -Infinity;
  for (const p of polygon) {
    const dx = p.x - centre.x;
    const dy = p.y - centre.y;
    const al = dx * u.x + dy * u.y;
    const ac = dx * n.x + dy * n.y;
    if (al < minAlong) minAlong = al;
    if (al > maxAlong) maxAlong = al;
    if (ac < minAcross) minAcross = ac;
    if (ac > maxAcross) maxAcross = ac;
  }
  const patchExtentAlongIn = maxAlong - minAlong;
  const computedSubCutLengthIn = roundUpToEighthInch(patchExtentAlongIn + 2 * (allowanceIn + marginIn));
  return {
    stripSetId: stripSet.id,
    stripSetName: stripSet.name ?? null,
    axisAngleDeg: stripSet.axisAngleDeg ?? 0,
    centre,
    strips,
    guideLines,
    finishedWidthIn,
    sewnWidthIn: finishedWidthIn + 2 * allowanceIn,
    patchExtentAlongIn,
    patchAcross: { minIn: minAcross, maxIn: maxAcross },
    subCutLengthIn: stripSet.subCutLengthIn ?? computedSubCutLengthIn,
    computedSubCutLengthIn,
    subCutSetByDesigner: stripSet.subCutLengthIn !== undefined,
    coversPatch: minAcross >= -finishedWidthIn / 2 - GEOMETRY_EPSILON_IN && maxAcross <= finishedWidthIn / 2 + GEOMETRY_EPSILON_IN,
  };
}
