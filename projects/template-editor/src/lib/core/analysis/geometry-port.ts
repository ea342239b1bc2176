import type { Point, Section, SectionGeometry, StripSet } from '@seamwright/piecing';

/** One patch of a section as the board shows it: derived from the outline and seams. */
export interface BoardPatch {
  /** Position in the derived order (0-based, stable for a given outline and seam list). */
  index: number;
  /** Piecing number, 1-based. */
  number: number;
  /** Label as quilters write it: section label + number, e.g. "A3". */
  label: string;
  /** The patch outline, closed implicitly, in inches. */
  polygon: Point[];
  /** A point inside the patch (where its label goes, and how assignments find it). */
  anchor: Point;
  fabricId?: string;
  stripSet?: StripSet;
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
 * Everything the editor needs to know about section geometry. The editor never computes geometry
 * itself: {@link piecingGeometry} answers through `@seamwright/piecing`; tests may pass the same.
 */
export interface GeometryPort {
  /** The flattened outline of a section geometry. */
  outline(geometry: SectionGeometry): Point[];
  /** The derived patches with their piecing numbers and assignments, in split order (array position = `index`). */
  patches(section: Section): BoardPatch[];
  /** Problems with the section's seams or patch assignments, in words (a seam that stops short …). */
  problems(section: Section): string[];
  /** The sewability check of the section's current order (`patches`: its derived patches, when known). */
  sewability(section: Section, patches?: readonly BoardPatch[]): BoardSewability;
  /** A sewable order for the section (patch numbers in sewing order), or why there is none. */
  findOrder(section: Section): BoardOrderSearch;
  /** The cutting line (outline + seam allowance) of a section, or null when it cannot be made. */
  cuttingLine(section: Section, allowanceIn: number): Point[] | null;
  /** Whether a point lies inside or on a ring. */
  contains(ring: readonly Point[], p: Point): boolean;
}
