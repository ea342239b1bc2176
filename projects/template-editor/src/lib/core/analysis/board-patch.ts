import { degToRad, layoutStripSet, polygonBounds, type DerivedPatch, type Point, type StripSetLayout } from '@seamwright/piecing';

/**
 * One patch of a section as the board shows it: piecing's derived patch (its `index` is its identity,
 * its `labelPoint` where the label goes and where clicks and assignments find it) with the strip-set
 * drawing the board adds.
 */
export interface BoardPatch extends DerivedPatch {
  /** Guide lines of a strip set on this patch, as segments in inches. */
  guideLines: Array<[Point, Point]>;
  /** The strips of a strip set as bands across the patch (to draw clipped to the patch outline). */
  stripBands?: Array<{ fabricId: string; polygon: Point[] }>;
}

/** Result of the sewability check of one section's piecing order. */
export interface BoardSewability {
  /** Whether the current order can be sewn. */
  ok: boolean;
  /** The first patch (its number) that cannot be added, when the order fails. */
  failingPatchNumber?: number;
  /** Why, in words a quilter reads. */
  reason?: string;
}

/** Result of searching a sewable order. */
export type BoardOrderSearch =
  | { ok: true; order: number[] }
  | { ok: false; reason: string; suggestedSplit?: { a: Point; b: Point } };

/** The board's view of a derived patch: strip-set guide lines and bands when it has a strip set. */
export function toBoardPatch(p: DerivedPatch): BoardPatch {
  const out: BoardPatch = { ...p, guideLines: [] };
  if (p.stripSet) {
    try {
      const layout = layoutStripSet(p.polygon, p.stripSet);
      out.guideLines = layout.guideLines.flatMap((g) => g.segments.map((seg): [Point, Point] => [seg.a, seg.b]));
      out.stripBands = stripBands(layout, p.polygon);
    } catch {
      // A strip set that does not fit shows no guide lines; the properties panel says why.
    }
  }
  return out;
}

/**
 * Bands to draw each strip of a laid-out strip set: the strip's finished part across the set, long
 * enough along the strips to cover the patch (drawing clips them to the patch). The outer strips reach
 * out to the patch edges, as the fabric does once sewn and trimmed.
 */
function stripBands(layout: StripSetLayout, polygon: readonly Point[]): Array<{ fabricId: string; polygon: Point[] }> {
  const b = polygonBounds(polygon);
  const reach = Math.hypot(b.maxX - b.minX, b.maxY - b.minY) + 1;
  const a = degToRad(layout.axisAngleDeg);
  const u = { x: Math.cos(a), y: Math.sin(a) };
  const n = { x: -u.y, y: u.x };
  const at = (along: number, across: number): Point => ({ x: layout.centre.x + u.x * along + n.x * across, y: layout.centre.y + u.y * along + n.y * across });
  return layout.strips.map((st, i) => {
    const from = i === 0 ? -reach : st.fromAcrossIn;
    const to = i === layout.strips.length - 1 ? reach : st.toAcrossIn;
    return { fabricId: st.fabricId, polygon: [at(-reach, from), at(reach, from), at(reach, to), at(-reach, to)] };
  });
}
