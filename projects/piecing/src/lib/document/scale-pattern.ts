import type { PatternDocument, Point, Section } from './pattern-schema';
import { parsePatternDocument, type DocumentIssue } from './parse-pattern';
import { expandRingRepeat } from '../geometry/ring-repeat';
import { flattenSectionOutline } from '../geometry/section-outline';
import { polygonArea } from '../geometry/polygon';
import { CHORD_TOLERANCE_IN, GEOMETRY_EPSILON_IN, MIN_PATCH_AREA_SQ_IN } from '../tolerance';

/** Keys holding a length in inches: the pattern format names every length `…In` (docs/pattern-format.md). */
const LENGTH_KEY = /In$/;

/** Scaled values are kept to a billionth of an inch, so a resize does not leave 4.499999999999999 in the file. */
function scaleValue(v: number, factor: number): number {
  const r = Math.round(v * factor * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}

/**
 * Every length in `value` multiplied by `factor`: numbers under a `…In` key and the `x`, `y` of points.
 * Everything else is kept as it is — angles (`…Deg`), counts, ids, names, and ratios such as the bulge of
 * a curved edge, which describe a shape and not a size. Walking by the format's naming rule means a length
 * field added to a section later is scaled without a change here.
 */
function scaleLengths<T>(value: T, factor: number): T {
  if (Array.isArray(value)) return value.map((v: unknown) => scaleLengths(v, factor)) as T;
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) {
    out[key] = typeof v === 'number' && (LENGTH_KEY.test(key) || key === 'x' || key === 'y') ? scaleValue(v, factor) : scaleLengths(v, factor);
  }
  return out as T;
}

/**
 * The section scaled by `factor` about the drawing's origin (0, 0): outline (vertices, arc and wedge
 * centres and radii, any per-edge lengths), seams, patch anchors, ring-repeat centre, and the finished
 * strip widths and offset of strip sets (a strip set is part of the design: a 2 in. strip in a block made
 * half as large becomes 1 in.). Angles, sweeps, piecing order, fabrics and names stay.
 */
export function scaleSection(section: Section, factor: number): Section {
  return scaleLengths(section, factor);
}

/**
 * The whole design scaled by `factor` about the drawing's origin: every section ({@link scaleSection}),
 * the drawing area and the trace image (its origin and width, so it stays under the drawing). What
 * belongs to sewing and not to the design keeps its value: the seam allowance, the piecing margin, the
 * fabrics' usable widths, the block count and pressings per template. The cutting list of the result
 * is therefore worked out afresh ({@link buildCuttingList}), not scaled.
 *
 * Pure; does not validate the result (a large factor can push lengths past {@link MAX_SIZE_IN}): use
 * {@link resizePattern} for a checked resize. Throws a RangeError for a factor that is not a finite
 * positive number.
 */
export function scalePattern(document: PatternDocument, factor: number): PatternDocument {
  if (!Number.isFinite(factor) || factor <= 0) throw new RangeError(`scale factor must be a finite number above zero, not ${factor}`);
  return {
    ...document,
    canvas: scaleLengths(document.canvas, factor),
    sections: document.sections.map((s) => scaleSection(s, factor)),
    ...(document.referenceImage ? { referenceImage: scaleLengths(document.referenceImage, factor) } : {}),
    // A block size the quilt layout sets is the block's: it scales with it (sashing and borders do not).
    ...(document.quilt?.blockSizeIn
      ? { quilt: { ...document.quilt, blockSizeIn: { width: document.quilt.blockSizeIn.width * factor, height: document.quilt.blockSizeIn.height * factor } } }
      : {}),
  };
}

/** A new finished size for the drawing area, in inches. */
export interface FinishedSize {
  widthIn: number;
  heightIn: number;
}

/**
 * The factor a resize to `target` scales the design by. A design scales by one factor in both directions
 * (circles stay circles, angles stay angles), so when the new width and height are not in the old
 * proportion the design takes the smaller ratio and fits inside the new area.
 */
export function resizeFactor(canvas: FinishedSize, target: FinishedSize): number {
  return Math.min(target.widthIn / canvas.widthIn, target.heightIn / canvas.heightIn);
}

/** The outcome of {@link resizePattern}. */
export type ResizeResult =
  | { ok: true; factor: number; document: PatternDocument }
  | { ok: false; factor: number; issues: DocumentIssue[] };

/**
 * The design resized to a new finished size: scaled by {@link resizeFactor} about the drawing's origin,
 * with the drawing area set to `target` exactly, then checked like any document read from a file. When
 * the result is not a valid pattern (a length past the largest size, a seam shrunk to nothing …) the
 * issues say why, with their paths, and no document is given.
 */
export function resizePattern(document: PatternDocument, target: FinishedSize): ResizeResult {
  const factor = resizeFactor(document.canvas, target);
  if (!Number.isFinite(factor) || factor <= 0) return { ok: false, factor, issues: [{ path: 'canvas', message: 'the new size must be greater than zero' }] };
  const scaled = { ...scalePattern(document, factor), canvas: { widthIn: target.widthIn, heightIn: target.heightIn } };
  const parsed = parsePatternDocument(scaled);
  return parsed.ok ? { ok: true, factor, document: parsed.document } : { ok: false, factor, issues: parsed.issues };
}

/** A section that lies partly or wholly outside the drawing area. */
export interface SectionOutsideCanvas {
  sectionId: string;
  label: string;
  /** `wholly`: no part of any copy lies on the drawing area; `partly`: some of it does. */
  extent: 'partly' | 'wholly';
}

/**
 * The sections (every ring-repeat copy counted) that reach outside the drawing area, from (0, 0) to
 * (canvas width, canvas height), in document order. Outlines are flattened at `toleranceIn`; a point
 * within `edgeToleranceIn` of the area's edge counts as on it.
 */
export function sectionsOutsideCanvas(document: PatternDocument, toleranceIn = CHORD_TOLERANCE_IN, edgeToleranceIn = GEOMETRY_EPSILON_IN): SectionOutsideCanvas[] {
  const { widthIn, heightIn } = document.canvas;
  const outside = (p: Point) => p.x < -edgeToleranceIn || p.y < -edgeToleranceIn || p.x > widthIn + edgeToleranceIn || p.y > heightIn + edgeToleranceIn;
  const out: SectionOutsideCanvas[] = [];
  for (const section of document.sections) {
    let anyOutside = false;
    let anyInside = false;
    for (const copy of expandRingRepeat(section)) {
      const ring = flattenSectionOutline(copy.geometry, toleranceIn);
      if (!ring.some(outside)) {
        anyInside = true;
        continue;
      }
      anyOutside = true;
      if (polygonArea(clipToRectangle(ring, widthIn, heightIn)) > MIN_PATCH_AREA_SQ_IN) anyInside = true;
    }
    if (anyOutside) out.push({ sectionId: section.id, label: section.label, extent: anyInside ? 'partly' : 'wholly' });
  }
  return out;
}

/**
 * The ring clipped to the rectangle [0, w] × [0, h] (Sutherland–Hodgman against each side in turn). The
 * window is convex, so the area of the result is the area of the overlap even for a concave ring (any
 * zero-width bridges it leaves add nothing).
 */
function clipToRectangle(ring: readonly Point[], widthIn: number, heightIn: number): Point[] {
  const sides: Array<{ inside: (p: Point) => boolean; cross: (a: Point, b: Point) => Point }> = [
    { inside: (p) => p.x >= 0, cross: (a, b) => atX(a, b, 0) },
    { inside: (p) => p.x <= widthIn, cross: (a, b) => atX(a, b, widthIn) },
    { inside: (p) => p.y >= 0, cross: (a, b) => atY(a, b, 0) },
    { inside: (p) => p.y <= heightIn, cross: (a, b) => atY(a, b, heightIn) },
  ];
  let points: Point[] = ring.slice();
  for (const side of sides) {
    const next: Point[] = [];
    points.forEach((current, i) => {
      const previous = points[(i + points.length - 1) % points.length];
      if (side.inside(current)) {
        if (!side.inside(previous)) next.push(side.cross(previous, current));
        next.push(current);
      } else if (side.inside(previous)) next.push(side.cross(previous, current));
    });
    points = next;
    if (points.length === 0) break;
  }
  return points;
}

function atX(a: Point, b: Point, x: number): Point {
  const t = (x - a.x) / (b.x - a.x);
  return { x, y: a.y + t * (b.y - a.y) };
}

function atY(a: Point, b: Point, y: number): Point {
  const t = (y - a.y) / (b.y - a.y);
  return { x: a.x + t * (b.x - a.x), y };
}
