import type { PatternDocument, Point, Section } from '../../document/pattern-schema';
import { degToRad, expandRingRepeat, normaliseAngleDeg, pointOnCircle } from '../../geometry/index';

/** Default distance between matching marks along a shared curved edge, in inches. */
export const DEFAULT_MATCHING_MARK_SPACING_IN = 2;

// Centres and radii closer than this are the same circle (inches); angles closer than this are equal (degrees).
const SAME_CIRCLE_IN = 1e-4;
const SAME_ANGLE_DEG = 1e-7;

/** A mark on a curved edge of a section, to be matched with the same mark on its neighbour. */
export interface MatchingMark {
  /** On the exact arc, in document inches. */
  point: Point;
  /** Absolute angle about the arc's centre, degrees in [0, 360): the same on both neighbours. */
  angleDeg: number;
  radiusIn: number;
  centre: Point;
  /** Unit tangent (direction of increasing angle) and unit normal pointing out of this section. */
  tangent: Point;
  normal: Point;
  /** Which curved edge of this section: `outer` (the section lies inside the circle) or `inner`. */
  edge: 'outer' | 'inner';
  /** Arc length from the start of this section's edge (at its start angle), in inches. */
  alongEdgeIn: number;
  /**
   * `spacing`: one of the equally spaced marks of the shared stretch, on both neighbours.
   * `neighbour-seam`: where the neighbour's edge ends inside this edge (its corner, so a seam line lands here).
   */
  kind: 'spacing' | 'neighbour-seam';
  /** The neighbouring section copy (ring-repeat copies are `<id>_r<k>`) and its section label. */
  neighbourId: string;
  neighbourLabel: string;
}

/** The marks of one placed copy of a section. */
export interface SectionInstanceMarks {
  /** Copy id: the section id for copy 0, `<id>_r<k+1>` for ring-repeat copy k. */
  instanceId: string;
  index: number;
  marks: MatchingMark[];
}

/** The matching marks of a section: on its template (copy 0) and on every ring-repeat copy. */
export interface SectionMatchingMarks {
  sectionId: string;
  label: string;
  /** Marks of the section as drawn (ring-repeat copy 0): what its template carries. */
  marks: MatchingMark[];
  instances: SectionInstanceMarks[];
}

/** Settings for {@link matchingMarks}. */
export interface MatchingMarkOptions {
  /** Target distance between marks along a shared edge, in inches (the stretch is divided evenly). */
  spacingIn?: number;
}

interface CurvedEdge {
  owner: number;
  instanceId: string;
  label: string;
  centre: Point;
  radiusIn: number;
  startDeg: number;
  sweepDeg: number;
  edge: 'outer' | 'inner';
}

/**
 * Matching marks on every curved edge two sections share (design.md §5.8): arc sections sharing a radius,
 * a wedge's arc against an arc section's inner arc, ring-repeat copies included. Each shared stretch is
 * divided into equal arc lengths close to `spacingIn`, and both neighbours get marks at the same absolute
 * angles, so the marks coincide when the sections are sewn together. Where a neighbour's edge ends inside
 * an edge, that edge also gets a `neighbour-seam` mark.
 */
export function matchingMarks(document: Pick<PatternDocument, 'sections'>, options: MatchingMarkOptions = {}): SectionMatchingMarks[] {
  const spacingIn = options.spacingIn ?? DEFAULT_MATCHING_MARK_SPACING_IN;
  if (!(spacingIn > 0) || !Number.isFinite(spacingIn)) throw new RangeError(`mark spacing must be a positive number of inches, got ${spacingIn}`);

  const result: SectionMatchingMarks[] = [];
  const slots: MatchingMark[][] = [];
  const edges: CurvedEdge[] = [];
  for (const section of document.sections) {
    const entry: SectionMatchingMarks = { sectionId: section.id, label: section.label, marks: [], instances: [] };
    expandRingRepeat(section).forEach((copy, index) => {
      const marks: MatchingMark[] = [];
      entry.instances.push({ instanceId: copy.id, index, marks });
      const owner = slots.push(marks) - 1;
      edges.push(...curvedEdges(copy, owner));
    });
    entry.marks = entry.instances[0]?.marks ?? [];
    result.push(entry);
  }

  // Pair edges on the same circle: sort by radius so only near neighbours in the list are compared.
  edges.sort((a, b) => a.radiusIn - b.radiusIn);
  for (let i = 0; i < edges.length; i++) {
    for (let j = i + 1; j < edges.length && edges[j].radiusIn - edges[i].radiusIn <= SAME_CIRCLE_IN; j++) {
      const a = edges[i];
      const b = edges[j];
      if (a.owner === b.owner || a.edge === b.edge) continue;
      if (Math.hypot(a.centre.x - b.centre.x, a.centre.y - b.centre.y) > SAME_CIRCLE_IN) continue;
      for (const [lo, hi] of overlaps(a, b)) markSharedStretch(a, b, lo, hi, spacingIn, slots);
    }
  }
  for (const marks of slots) {
    marks.sort((m, n) => (m.edge === n.edge ? m.alongEdgeIn - n.alongEdgeIn : m.edge === 'outer' ? -1 : 1));
    // Two neighbours meeting inside an edge both mark the same point there: keep one mark.
    for (let k = marks.length - 1; k > 0; k--) {
      const m = marks[k];
      const prev = marks[k - 1];
      if (m.edge === prev.edge && Math.abs(m.alongEdgeIn - prev.alongEdgeIn) < 1e-9 && (m.kind === 'neighbour-seam' || prev.kind === 'neighbour-seam')) {
        marks.splice(m.kind === 'neighbour-seam' ? k : k - 1, 1);
      }
    }
  }
  return result;
}

function curvedEdges(section: Section, owner: number): CurvedEdge[] {
  const g = section.geometry;
  const base = { owner, instanceId: section.id, label: section.label };
  switch (g.kind) {
    case 'straight':
      return [];
    case 'wedge':
      return [{ ...base, centre: g.centre, radiusIn: g.radiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'outer' }];
    case 'arc':
      return [
        { ...base, centre: g.centre, radiusIn: g.outerRadiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'outer' },
        { ...base, centre: g.centre, radiusIn: g.innerRadiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'inner' },
      ];
  }
}

/** The angular stretches both edges cover, as [lo, hi] in a's frame (lo ≥ a.startDeg, degrees). */
function overlaps(a: CurvedEdge, b: CurvedEdge): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  const aEnd = a.startDeg + a.sweepDeg;
  for (const shift of [-360, 0, 360]) {
    const bStart = b.startDeg + shift;
    const lo = Math.max(a.startDeg, bStart);
    const hi = Math.min(aEnd, bStart + b.sweepDeg);
    if (hi - lo > SAME_ANGLE_DEG) out.push([lo, hi]);
  }
  return out;
}

function markSharedStretch(a: CurvedEdge, b: CurvedEdge, lo: number, hi: number, spacingIn: number, slots: MatchingMark[][]): void {
  const r = a.radiusIn;
  const lengthIn = r * degToRad(hi - lo);
  // Equal parts close to the spacing; at least one mark, in the middle of a short stretch.
  const parts = Math.max(2, Math.round(lengthIn / spacingIn));
  for (let i = 1; i < parts; i++) {
    const angle = lo + ((hi - lo) * i) / parts;
    slots[a.owner].push(makeMark(a, b, angle, 'spacing'));
    slots[b.owner].push(makeMark(b, a, angle, 'spacing'));
  }
  // A stretch end inside an edge is the neighbour's corner: mark it on the edge that runs on.
  for (const angle of [lo, hi]) {
    for (const [self, other] of [[a, b], [b, a]] as const) {
      if (strictlyInside(self, angle)) slots[self.owner].push(makeMark(self, other, angle, 'neighbour-seam'));
    }
  }
}

function strictlyInside(e: CurvedEdge, angleDeg: number): boolean {
  const rel = normaliseAngleDeg(angleDeg - e.startDeg);
  const full = e.sweepDeg >= 360 - SAME_ANGLE_DEG;
  if (full) return false;
  return rel > SAME_ANGLE_DEG && rel < e.sweepDeg - SAME_ANGLE_DEG;
}

function makeMark(self: CurvedEdge, other: CurvedEdge, angleDeg: number, kind: MatchingMark['kind']): MatchingMark {
  const rad = degToRad(angleDeg);
  const radial = { x: Math.cos(rad), y: Math.sin(rad) };
  const along = normaliseAngleDeg(angleDeg - self.startDeg);
  return {
    point: pointOnCircle(self.centre, self.radiusIn, rad),
    angleDeg: normaliseAngleDeg(angleDeg),
    radiusIn: self.radiusIn,
    centre: { x: self.centre.x, y: self.centre.y },
    tangent: { x: -radial.y, y: radial.x },
    normal: self.edge === 'outer' ? radial : { x: -radial.x, y: -radial.y },
    edge: self.edge,
    alongEdgeIn: self.radiusIn * degToRad(along > self.sweepDeg + SAME_ANGLE_DEG ? along - 360 : along),
    kind,
    neighbourId: other.instanceId,
    neighbourLabel: other.label,
  };
}
