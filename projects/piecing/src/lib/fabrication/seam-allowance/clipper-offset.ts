import ClipperLib from 'clipper-lib';
import type { Point } from '../../document/pattern-schema';
import { CHORD_TOLERANCE_IN, CLIPPER_SCALE, MITRE_LIMIT } from '../../tolerance';
import { signedArea } from '../../geometry/index';
import { OutwardRingOffset } from './outward-ring-offset';

/** How offset edges meet at a corner: a sharp mitre (cut off at the mitre limit), a round arc, or squared off. */
export type OffsetJoin = 'mitre' | 'round' | 'square';

/** Settings for an offset; every field has a default from `tolerance.ts`. */
export interface OffsetOptions {
  /** Longest mitre, as a multiple of the offset distance, before the corner is squared off. */
  mitreLimit?: number;
  /** Largest distance between a round join's arc and its chords, in inches. */
  arcToleranceIn?: number;
}

/** A ring in clipper-lib's integer units (CLIPPER_SCALE per inch). */
export type IntegerRing = ClipperLib.IntPoint[];

const JOIN_TYPES: Record<OffsetJoin, ClipperLib.JoinType> = {
  mitre: ClipperLib.JoinType.jtMiter,
  round: ClipperLib.JoinType.jtRound,
  square: ClipperLib.JoinType.jtSquare,
};

/** Converts a ring in inches to clipper-lib's integer units, once, at the one fixed scale. */
export function toIntegerRing(points: readonly Point[]): IntegerRing {
  const out: IntegerRing = new Array(points.length);
  for (let i = 0; i < points.length; i++) {
    out[i] = { X: Math.round(points[i].x * CLIPPER_SCALE), Y: Math.round(points[i].y * CLIPPER_SCALE) };
  }
  return out;
}

/** Converts a ring from clipper-lib's integer units back to inches. */
export function fromIntegerRing(ring: IntegerRing): Point[] {
  const out: Point[] = new Array(ring.length);
  for (let i = 0; i < ring.length; i++) out[i] = { x: ring[i].X / CLIPPER_SCALE, y: ring[i].Y / CLIPPER_SCALE };
  return out;
}

/**
 * Offsets polygons with one clipper-lib ClipperOffset, reused from call to call: for batches (every patch
 * of a cutting list, every template of a print set), where building a fresh offsetter per polygon costs
 * allocations and garbage collection. Not shared between callers; each batch makes its own.
 */
export class PolygonOffsetter {
  private readonly offset: ClipperLib.ClipperOffset;
  private readonly mitreLimit: number;
  private readonly outward = new OutwardRingOffset();

  constructor(options: OffsetOptions = {}) {
    const mitreLimit = options.mitreLimit ?? MITRE_LIMIT;
    const arcToleranceIn = options.arcToleranceIn ?? CHORD_TOLERANCE_IN;
    if (!(mitreLimit >= 1)) throw new RangeError(`mitre limit must be at least 1, got ${mitreLimit}`);
    if (!(arcToleranceIn > 0)) throw new RangeError(`arc tolerance must be a positive number of inches, got ${arcToleranceIn}`);
    this.mitreLimit = mitreLimit;
    this.offset = new ClipperLib.ClipperOffset(mitreLimit, arcToleranceIn * CLIPPER_SCALE);
  }

  /**
   * Offsets integer rings (outer rings and holes, wound opposite ways) by `distanceIn` (outward when
   * positive). Returns the integer result rings; the input is untouched.
   *
   * A single ring offset outward with mitre or square joins skips ClipperOffset's closing union when its
   * raw offset proves to need it only for the loops at concave corners (see {@link OutwardRingOffset});
   * the result is the same ring.
   */
  offsetIntegerRings(rings: readonly IntegerRing[], distanceIn: number, join: OffsetJoin = 'mitre'): IntegerRing[] {
    if (!Number.isFinite(distanceIn)) throw new RangeError(`offset distance must be a finite number of inches, got ${distanceIn}`);
    if (rings.length === 1 && distanceIn > 0 && join !== 'round') {
      const ring = this.outward.offsetIntegerRing(rings[0], this.outwardSettings(distanceIn, join));
      if (ring) return [ring];
    }
    return this.clipperOffset(rings, distanceIn, join);
  }

  /** ClipperOffset in full: the raw offset, then its union. */
  private clipperOffset(rings: readonly IntegerRing[], distanceIn: number, join: OffsetJoin): IntegerRing[] {
    this.offset.Clear();
    // clipper-lib copies the points into its own nodes, so the input stays intact.
    this.offset.AddPaths(rings as IntegerRing[], JOIN_TYPES[join], ClipperLib.EndType.etClosedPolygon);
    const solution: IntegerRing[] = [];
    this.offset.Execute(solution, distanceIn * CLIPPER_SCALE);
    this.offset.Clear();
    return solution;
  }

  /**
   * Offsets a simple polygon (inches, either winding) by `distanceIn`: outward when positive, inward when
   * negative. Returns the largest result ring, wound the same way as the input, or an empty array when an
   * inward offset leaves nothing.
   */
  offsetPolygon(points: readonly Point[], distanceIn: number, join: OffsetJoin = 'mitre'): Point[] {
    if (!Number.isFinite(distanceIn)) throw new RangeError(`offset distance must be a finite number of inches, got ${distanceIn}`);
    if (distanceIn > 0 && join !== 'round') {
      // Straight from inches to the grid and back, without the union where it would change nothing.
      const ring = this.outward.offsetInchRing(points, CLIPPER_SCALE, this.outwardSettings(distanceIn, join));
      if (ring) return ring;
    }
    const rings = this.clipperOffset([toIntegerRing(points)], distanceIn, join);
    let best: IntegerRing | undefined;
    let bestArea = 0;
    for (const ring of rings) {
      const area = Math.abs(ClipperLib.Clipper.Area(ring));
      if (area > bestArea) {
        bestArea = area;
        best = ring;
      }
    }
    if (!best) return [];
    const result = fromIntegerRing(best);
    return Math.sign(signedArea(result)) === Math.sign(signedArea(points)) ? result : result.reverse();
  }

  private outwardSettings(distanceIn: number, join: OffsetJoin) {
    return { delta: distanceIn * CLIPPER_SCALE, mitreLimit: this.mitreLimit, squareJoins: join === 'square' };
  }
}

/**
 * Offsets integer rings (outer rings and holes, wound opposite ways) by `distanceIn` (outward when
 * positive) with clipper-lib's ClipperOffset. Returns the integer result rings; the input is untouched.
 */
export function offsetIntegerRings(
  rings: readonly IntegerRing[],
  distanceIn: number,
  join: OffsetJoin = 'mitre',
  options: OffsetOptions = {},
): IntegerRing[] {
  return new PolygonOffsetter(options).offsetIntegerRings(rings, distanceIn, join);
}

/**
 * Offsets a simple polygon (inches, either winding) by `distanceIn`: outward when positive, inward when
 * negative, mitre joins by default (cut off at the mitre limit). Returns the largest result ring, wound
 * the same way as the input, or an empty array when an inward offset leaves nothing.
 */
export function offsetPolygon(
  points: readonly Point[],
  distanceIn: number,
  join: OffsetJoin = 'mitre',
  options: OffsetOptions = {},
): Point[] {
  return new PolygonOffsetter(options).offsetPolygon(points, distanceIn, join);
}
