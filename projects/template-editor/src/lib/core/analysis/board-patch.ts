import { layoutStripSet, locatePoint, stripSetBands, type DerivedPatch, type PatchAssignment, type Point, type Section } from '@seamwright/piecing';

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
  /** The rough-cut piece the designer set for this patch (commands keep it when they rewrite assignments). */
  roughCut?: PatchAssignment['roughCut'];
  /** Whether the designer asked for a piece template of this patch. */
  pieceTemplate?: boolean;
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

/**
 * Result of searching a sewable order: one found, or none exists, or (`undecided`) the search could
 * not tell within its work budget whether one exists.
 */
export type BoardOrderSearch =
  | { ok: true; order: number[] }
  | { ok: false; reason: string; suggestedSplit?: { a: Point; b: Point }; undecided?: true };

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

/** Adds what the designer said about the patch beyond fabric and strip set (rough cut, piece template). */
export function withPatchDetails(p: BoardPatch, assignment: PatchAssignment | undefined): BoardPatch {
  if (assignment?.roughCut) p.roughCut = assignment.roughCut;
  if (assignment?.pieceTemplate !== undefined) p.pieceTemplate = assignment.pieceTemplate;
  return p;
}

/**
 * The assignment piecing matched to a derived patch: the one with its number whose anchor lies in it
 * (numbers are unique in a section; the anchor test leaves out an assignment that lies in no patch).
 */
export function matchedAssignment(section: Pick<Section, 'patches'>, p: Pick<DerivedPatch, 'number' | 'polygon'>): PatchAssignment | undefined {
  return section.patches.find((a) => a.number === p.number && locatePoint(a.anchor, p.polygon) !== 'outside');
}
