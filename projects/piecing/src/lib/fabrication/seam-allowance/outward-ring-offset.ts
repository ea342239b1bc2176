import type ClipperLib from 'clipper-lib';
import type { Point } from '../../document/pattern-schema';

/**
 * The outward offset of one ring without ClipperOffset's closing union, where that union would change
 * nothing but the corner loops (docs/design-notes.md#seam-allowance).
 *
 * clipper-lib's ClipperOffset (6.4.2) offsets every edge, joins convex corners with a mitre (or squares
 * them off past the mitre limit) and, at every concave corner, leaves a small loop: the end of the
 * previous offset edge, the corner itself, the start of the next offset edge. It then unions the whole
 * raw ring (positive fill) to cut those loops and any real overlaps away. On flattened arcs every inner
 * arc vertex is concave, so that union — a full sweep with an intersection per loop — is most of the
 * work. Here the same raw offset is built with clipper-lib's formulas and rounding, each concave loop is
 * replaced by the point where its two offset edges cross, and the result is checked:
 *
 * - every offset edge runs the way its source edge runs (no edge was overrun by its neighbours),
 * - every loop really crosses (its two offset edges pass each other) and is wound like the ring,
 * - no segment of the cleaned ring meets another, nor any loop's side, but at shared corners (a loop lies
 *   along the two ring edges at its crossing, on their inner side, so it is not tried against those).
 *
 * Then the raw ring covers the cleaned ring once and each loop twice, with nothing outside, so its
 * positive-fill union is the cleaned ring, and that is what comes back (collinear points dropped, as the
 * union drops them). When any check fails the caller runs ClipperOffset in full. The answers agree up to
 * the grid: the crossing point is rounded here from the exact offset lines, in the union from the rounded
 * edge ends, and a loop a few grid steps across may stick out of the ring by less than a step.
 */

/** clipper-lib's rounding to its grid: half away from zero (Clipper.Round). */
function round(v: number): number {
  return v < 0 ? -Math.round(-v) : Math.round(v);
}

/** Settings of one outward offset, in clipper-lib's grid units. */
interface OutwardSettings {
  /** Offset distance in grid units (> 0). */
  delta: number;
  /** Longest mitre, as a multiple of the distance, before a corner is squared off. */
  mitreLimit: number;
  /** Whether every convex corner is squared off (clipper-lib's square joins) instead of mitred. */
  squareJoins: boolean;
}

/**
 * Outward offsets of single rings, with working buffers kept from call to call (one per batch, like
 * PolygonOffsetter, never shared between callers). Each method answers undefined when the ring needs
 * ClipperOffset's union (overlapping offsets, spikes, fewer than three distinct points, no area); the
 * input is untouched.
 */
export class OutwardRingOffset {
  private xs = new Float64Array(64);
  private ys = new Float64Array(64);
  private nx = new Float64Array(64);
  private ny = new Float64Array(64);
  /** Source point count, after dropping repeats. */
  private n = 0;
  /** Whether the source ring was walked backwards to give it positive area. */
  private reversed = false;
  /** Cleaned ring, then (from loopBase) each loop's A, P, B, so one index space serves the segment check. */
  private px = new Float64Array(256);
  private py = new Float64Array(256);
  /** For each cleaned point, the source edge whose offset arrives at it (-1: the side of a squared corner). */
  private arriving = new Int32Array(128);
  /** Cleaned-ring index of each loop's crossing point. */
  private loops = new Int32Array(64);
  private m = 0;
  private loopCount = 0;
  /** Index of the first loop point in px, py. */
  private loopBase = 0;
  private segA = new Int32Array(256);
  private segB = new Int32Array(256);
  private keys = new Float64Array(256);
  /** Segment indices sorted by their left ends. */
  private order = new Int32Array(256);
  /** Each segment's box: min x, max x, min y, max y. */
  private boxes = new Float64Array(1024);

  /** The outward offset of an integer ring, wound with positive area (clipper-lib's outer-ring orientation). */
  offsetIntegerRing(ring: readonly ClipperLib.IntPoint[], settings: OutwardSettings): ClipperLib.IntPoint[] | undefined {
    this.loadStart(ring.length);
    for (let i = 0; i < ring.length; i++) this.loadPoint(ring[i].X, ring[i].Y);
    if (!this.run(settings)) return undefined;
    const out: ClipperLib.IntPoint[] = [];
    this.emit((x, y) => out.push({ X: x, Y: y }));
    return out;
  }

  /**
   * The outward offset of a ring in inches, put on the grid at `scale` units per inch as toIntegerRing
   * does, and back in inches, wound like the input.
   */
  offsetInchRing(points: readonly Point[], scale: number, settings: OutwardSettings): Point[] | undefined {
    this.loadStart(points.length);
    for (let i = 0; i < points.length; i++) this.loadPoint(Math.round(points[i].x * scale), Math.round(points[i].y * scale));
    if (!this.run(settings)) return undefined;
    const out: Point[] = [];
    this.emit((x, y) => out.push({ x: x / scale, y: y / scale }));
    return this.reversed ? out.reverse() : out;
  }

  private loadStart(length: number): void {
    this.n = 0;
    if (this.xs.length < length) {
      const size = 2 * length;
      this.xs = new Float64Array(size);
      this.ys = new Float64Array(size);
      this.nx = new Float64Array(size);
      this.ny = new Float64Array(size);
    }
  }

  /** Adds a source point unless it repeats the one before (ClipperOffset.AddPath). */
  private loadPoint(x: number, y: number): void {
    const n = this.n;
    if (n > 0 && this.xs[n - 1] === x && this.ys[n - 1] === y) return;
    this.xs[n] = x;
    this.ys[n] = y;
    this.n = n + 1;
  }

  /** Builds the cleaned ring and checks it; false when ClipperOffset's union is needed. */
  private run({ delta, mitreLimit, squareJoins }: OutwardSettings): boolean {
    const { xs, ys, nx, ny } = this;
    let n = this.n;
    // No repeated closing point.
    while (n > 1 && xs[n - 1] === xs[0] && ys[n - 1] === ys[0]) n--;
    if (n < 3 || !(delta > 0)) return false;
    // ClipperOffset.FixOrientations: a ring of negative area is walked backwards.
    const area = twiceArea(xs, ys, n);
    if (area === 0) return false;
    this.reversed = area < 0;
    if (this.reversed) {
      xs.subarray(0, n).reverse();
      ys.subarray(0, n).reverse();
    }
    // Unit normals of each edge i → i + 1, pointing outward (ClipperOffset.GetUnitNormal).
    for (let i = 0; i < n; i++) {
      const j = i + 1 === n ? 0 : i + 1;
      const dx = xs[j] - xs[i];
      const dy = ys[j] - ys[i];
      const f = 1 / Math.sqrt(dx * dx + dy * dy);
      nx[i] = dy * f;
      ny[i] = -dx * f;
    }
    // At most two cleaned points per source point, and three loop points for each.
    const capacity = 5 * n;
    if (this.px.length < capacity) {
      this.px = new Float64Array(2 * capacity);
      this.py = new Float64Array(2 * capacity);
      this.arriving = new Int32Array(2 * capacity);
      this.loops = new Int32Array(2 * capacity);
    }
    const { px, py, arriving, loops } = this;
    // Loop points go after room for the longest cleaned ring (two points per source point).
    const loopBase = 2 * n;
    // ClipperOffset.DoOffset: the squared form of the mitre limit.
    const mitreBound = mitreLimit > 2 ? 2 / (mitreLimit * mitreLimit) : 0.5;
    let m = 0;
    let loopCount = 0;
    // ClipperOffset.OffsetPoint for each vertex j, k being the edge before it.
    let k = n - 1;
    for (let j = 0; j < n; j++) {
      const x = xs[j];
      const y = ys[j];
      const dot = nx[k] * nx[j] + ny[k] * ny[j];
      let sinA = nx[k] * ny[j] - nx[j] * ny[k];
      if (Math.abs(sinA * delta) < 1) {
        // Nearly straight on: one point, and the next corner is measured from the same edge.
        if (dot <= 0) return false; // a spike turning back on itself
        px[m] = round(x + nx[k] * delta);
        py[m] = round(y + ny[k] * delta);
        arriving[m++] = k;
        continue;
      }
      sinA = Math.max(-1, Math.min(1, sinA));
      const r = 1 + dot;
      if (sinA * delta < 0) {
        // Concave: the point where the two offset edges cross (the mitre formula, inside the turn).
        if (r < 1e-9) return false;
        const q = delta / r;
        loops[loopCount++] = m;
        px[m] = round(x + (nx[k] + nx[j]) * q);
        py[m] = round(y + (ny[k] + ny[j]) * q);
        arriving[m++] = k;
        const at = loopBase + 3 * (loopCount - 1);
        px[at] = round(x + nx[k] * delta);
        py[at] = round(y + ny[k] * delta);
        px[at + 1] = x;
        py[at + 1] = y;
        px[at + 2] = round(x + nx[j] * delta);
        py[at + 2] = round(y + ny[j] * delta);
      } else if (!squareJoins && r >= mitreBound) {
        // ClipperOffset.DoMiter.
        const q = delta / r;
        px[m] = round(x + (nx[k] + nx[j]) * q);
        py[m] = round(y + (ny[k] + ny[j]) * q);
        arriving[m++] = k;
      } else {
        // ClipperOffset.DoSquare.
        const t = Math.tan(Math.atan2(sinA, dot) / 4);
        px[m] = round(x + delta * (nx[k] - ny[k] * t));
        py[m] = round(y + delta * (ny[k] + nx[k] * t));
        arriving[m++] = k;
        px[m] = round(x + delta * (nx[j] + ny[j] * t));
        py[m] = round(y + delta * (ny[j] - nx[j] * t));
        arriving[m++] = -1;
      }
      k = j;
    }
    this.loopBase = loopBase;
    this.m = m;
    this.loopCount = loopCount;
    return this.check();
  }

  /** Whether the raw ring's positive-fill union is the cleaned ring (see the file's comment). */
  private check(): boolean {
    const { px, py, arriving, loops, nx, ny, m, loopCount } = this;
    // Every offset edge runs the way its source edge runs (direction (−ny, nx) of its normal).
    for (let i = 0; i < m; i++) {
      const e = arriving[i];
      if (e < 0) continue;
      const prev = i === 0 ? m - 1 : i - 1;
      if (-(px[i] - px[prev]) * ny[e] + (py[i] - py[prev]) * nx[e] <= 0) return false;
    }
    if (twiceArea(px, py, m) <= 0) return false;

    const segments = m + 4 * loopCount;
    if (this.segA.length < segments) {
      this.segA = new Int32Array(2 * segments);
      this.segB = new Int32Array(2 * segments);
      this.keys = new Float64Array(2 * segments);
    }
    const { segA, segB } = this;
    for (let i = 0; i < m; i++) {
      segA[i] = i;
      segB[i] = i + 1 === m ? 0 : i + 1;
    }
    for (let l = 0; l < loopCount; l++) {
      const x = loops[l];
      const a = this.loopBase + 3 * l;
      const p = a + 1;
      const b = a + 2;
      const next = x + 1 === m ? 0 : x + 1;
      const eIn = arriving[x];
      const eOut = arriving[next];
      // The crossing lies inside both raw offset edges: A beyond it along the arriving edge, B before it
      // along the leaving one; and the loop X → A → P → B turns left at P, so it is wound like the ring
      // (its corners at A and B are right angles, up to the grid).
      if ((px[a] - px[x]) * -ny[eIn] + (py[a] - py[x]) * nx[eIn] <= 0) return false;
      if (eOut < 0 || (px[x] - px[b]) * -ny[eOut] + (py[x] - py[b]) * nx[eOut] <= 0) return false;
      if (side(px, py, a, p, b) <= 0) return false;
      const s = m + 4 * l;
      segA[s] = x;
      segB[s] = a;
      segA[s + 1] = a;
      segB[s + 1] = p;
      segA[s + 2] = p;
      segB[s + 2] = b;
      segA[s + 3] = b;
      segB[s + 3] = x;
    }
    return !this.anySegmentsMeet(segments);
  }

  /**
   * Whether two segments meet anywhere but at an end point they share (and there, run along each other).
   * Loops are not tried against loops nor against themselves: each is a kite (right angles at A and B)
   * wound like the ring and lies inside it, so where loops overlap they only add to the ring's winding.
   * Nor is a loop tried against the two ring edges at its crossing X: it lies on their inner side, along
   * their lines (X → A continues the arriving edge, B → X leads into the leaving one), which the grid
   * rounding of X would turn into false alarms on gentle curves. Segments are sorted by their left end and
   * each is tried only against those whose x-span overlaps its own. Grid coordinates (a few million)
   * keep every product exact in doubles.
   */
  private anySegmentsMeet(count: number): boolean {
    const { px, py, segA, segB, loops, m } = this;
    if (this.boxes.length < 4 * count) this.boxes = new Float64Array(8 * count);
    const boxes = this.boxes;
    const keys = this.keys.subarray(0, count);
    // Left end and index in one number, so the sort needs no comparator.
    const shift = count < 65536 ? 65536 : 2 ** Math.ceil(Math.log2(count + 1));
    for (let s = 0; s < count; s++) {
      const a = segA[s];
      const b = segB[s];
      const minX = px[a] < px[b] ? px[a] : px[b];
      boxes[4 * s] = minX;
      boxes[4 * s + 1] = px[a] < px[b] ? px[b] : px[a];
      boxes[4 * s + 2] = py[a] < py[b] ? py[a] : py[b];
      boxes[4 * s + 3] = py[a] < py[b] ? py[b] : py[a];
      keys[s] = minX * shift + s;
    }
    keys.sort();
    if (this.order.length < count) this.order = new Int32Array(2 * count);
    const order = this.order;
    for (let o = 0; o < count; o++) order[o] = indexOf(keys[o], shift);
    for (let oi = 0; oi < count; oi++) {
      const s = order[oi];
      const maxX = boxes[4 * s + 1];
      const minY = boxes[4 * s + 2];
      const maxY = boxes[4 * s + 3];
      // For a loop's segment, its crossing X: the ring edges X − 1 → X and X → X + 1 are not tried against it.
      const xs = s >= m ? loops[(s - m) >> 2] : -1;
      for (let oj = oi + 1; oj < count; oj++) {
        const t = order[oj];
        if (boxes[4 * t] > maxX) break;
        if (xs >= 0) {
          if (t >= m || t === xs || t === (xs === 0 ? m - 1 : xs - 1)) continue;
        } else if (t >= m) {
          const xt = loops[(t - m) >> 2];
          if (s === xt || s === (xt === 0 ? m - 1 : xt - 1)) continue;
        }
        if (boxes[4 * t + 3] < minY || boxes[4 * t + 2] > maxY) continue;
        if (segmentsMeet(px, py, segA[s], segB[s], segA[t], segB[t])) return true;
      }
    }
    return false;
  }

  /** Hands out the cleaned ring, leaving out points on a straight line between their neighbours (as the union does). */
  private emit(push: (x: number, y: number) => void): void {
    const { px, py, m } = this;
    for (let i = 0; i < m; i++) {
      const prev = i === 0 ? m - 1 : i - 1;
      const next = i + 1 === m ? 0 : i + 1;
      if ((px[i] - px[prev]) * (py[next] - py[i]) - (py[i] - py[prev]) * (px[next] - px[i]) !== 0) push(px[i], py[i]);
    }
  }
}

/** The segment index packed into a sort key (see anySegmentsMeet). */
function indexOf(key: number, shift: number): number {
  const r = key % shift;
  return r < 0 ? r + shift : r;
}

/** Twice the signed area of the first n points (shoelace; positive where clipper-lib's Orientation is true). */
function twiceArea(xs: Float64Array, ys: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0, j = n - 1; i < n; j = i++) s += xs[j] * ys[i] - xs[i] * ys[j];
  return s;
}

/** Whether segments a1–b1 and a2–b2 (point indices) meet other than at one shared end with distinct directions. */
function segmentsMeet(xs: Float64Array, ys: Float64Array, a1: number, b1: number, a2: number, b2: number): boolean {
  const shared = a1 === a2 || a1 === b2 ? a1 : b1 === a2 || b1 === b2 ? b1 : -1;
  if (shared >= 0) {
    const u = shared === a1 ? b1 : a1;
    const v = shared === a2 ? b2 : a2;
    if (u === v) return true; // the same segment twice
    const ux = xs[u] - xs[shared];
    const uy = ys[u] - ys[shared];
    const vx = xs[v] - xs[shared];
    const vy = ys[v] - ys[shared];
    // Two segments from one point meet again only if they leave it in the same direction.
    return ux * vy - uy * vx === 0 && ux * vx + uy * vy > 0;
  }
  const d1 = side(xs, ys, a2, b2, a1);
  const d2 = side(xs, ys, a2, b2, b1);
  const d3 = side(xs, ys, a1, b1, a2);
  const d4 = side(xs, ys, a1, b1, b2);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  return (
    (d1 === 0 && within(xs, ys, a2, b2, a1)) ||
    (d2 === 0 && within(xs, ys, a2, b2, b1)) ||
    (d3 === 0 && within(xs, ys, a1, b1, a2)) ||
    (d4 === 0 && within(xs, ys, a1, b1, b2))
  );
}

/** Which side of the line a → b the point p lies: positive on the left (cross product, exact on the grid). */
function side(xs: Float64Array, ys: Float64Array, a: number, b: number, p: number): number {
  return (xs[b] - xs[a]) * (ys[p] - ys[a]) - (ys[b] - ys[a]) * (xs[p] - xs[a]);
}

/** Whether p, collinear with a → b, lies within the segment's box. */
function within(xs: Float64Array, ys: Float64Array, a: number, b: number, p: number): boolean {
  return Math.min(xs[a], xs[b]) <= xs[p] && xs[p] <= Math.max(xs[a], xs[b]) && Math.min(ys[a], ys[b]) <= ys[p] && ys[p] <= Math.max(ys[a], ys[b]);
}
