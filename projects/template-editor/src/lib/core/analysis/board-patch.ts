import { layoutStripSet, stripSetBands, type DerivedPatch, type Point } from '@seamwright/piecing';

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

/**
 * The board's view of a derived patch: strip-set guide lines and bands when it has a strip set. Takes
 * the freshly derived patch itself (not a copy, so its label point is still found only when read).
 */
export function toBoardPatch(p: DerivedPatch): BoardPatch {
  const out = Object.assign(p, { guideLines: [] as Array<[Point, Point]> }) as BoardPatch;
  if (p.stripSet) {
    try {
      const layout = layoutStripSet(p.polygon, p.stripSet);
      out.guideLines = layout.guideLines.flatMap((g) => g.segments.map((seg): [Point, Point] => [seg.a, seg.b]));
      out.stripBands = stripSetBands(p.polygon, p.stripSet);
    } catch {
      // A strip set that does not fit shows no guide lines; the properties panel says why.
    }
  }
  return out;
}
