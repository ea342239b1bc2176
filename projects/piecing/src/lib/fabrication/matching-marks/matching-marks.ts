import type { PatternDocument, Point, Section } from '../../document/pattern-schema';
import { degToRad, expandRingRepeat, normaliseAngleDeg, pointOnCircle, radToDeg, sectionEdges, straightSectionSignedArea } from '../../geometry/index';

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
  /** On a straight section's curved edge: which edge (edge i runs from vertex i to vertex i + 1). */
  edgeIndex?: number;
  /** Arc length from the start of this section's edge (at its smaller angle), in inches. */
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

/** The matching marks of a section: for its template and for every ring-repeat copy. */
export interface SectionMatchingMarks {
  sectionId: string;
  label: string;
  /**
   * The marks the template carries, placed as the section is drawn (copy 0): the marks every copy has at
   * the same place (copies around a ring may meet their neighbours differently; those extra marks are
   * only in `instances`).
   */
  marks: MatchingMark[];
  instances: SectionInstanceMarks[];
}

/** Settings for {@link matchingMarks}. */
export interface MatchingMarkOptions {
  /** Target distance between marks along a shared edge, in inches. */
  spacingIn?: number;
}

interface CurvedEdge {
  slot: number;
  sectionIndex: number;
  copyIndex: number;
  instanceId: string;
  label: string;
  centre: Point;
  radiusIn: number;
  startDeg: number;
  sweepDeg: number;
  edge: 'outer' | 'inner';
  edgeIndex?: number;
  /** Ring-repeat count when the ring turns about this edge's centre (so the marks must repeat with it), else 1. */
  ringCount: number;
}

/**
 * Matching marks on every curved edge two sections share (docs/design-notes.md#matching-marks): arc sections sharing a radius,
 * a wedge's arc against an arc section's inner arc, a straight section's curved edge against either (a
 * corner whose edge follows a ring), ring-repeat copies included. Marks lie on a grid of
 * equal arc-length steps around each shared circle, so both neighbours get marks at the same absolute
 * angles and they coincide when the sections are sewn together. The number of steps round the circle
 * is the one closest to circumference / `spacingIn` that is a multiple of every ring-repeat count on that
 * circle, so every copy of a ring carries the same marks (one template serves them all). Grid points
 * too near a corner are left out on both sides. Where a neighbour's edge ends inside an edge, that edge
 * also gets a `neighbour-seam` mark.
 */
export function matchingMarks(document: Pick<PatternDocument, 'sections'>, options: MatchingMarkOptions = {}): SectionMatchingMarks[] {
  const spacingIn = options.spacingIn ?? DEFAULT_MATCHING_MARK_SPACING_IN;
  if (!(spacingIn > 0) || !Number.isFinite(spacingIn)) throw new RangeError(`mark spacing must be a positive number of inches, got ${spacingIn}`);

  const result: SectionMatchingMarks[] = [];
  const slots: MatchingMark[][] = [];
  const edges: CurvedEdge[] = [];
  document.sections.forEach((section, sectionIndex) => {
    const entry: SectionMatchingMarks = { sectionId: section.id, label: section.label, marks: [], instances: [] };
    const ring = section.ringRepeat;
    expandRingRepeat(section).forEach((copy, copyIndex) => {
      const marks: MatchingMark[] = [];
      entry.instances.push({ instanceId: copy.id, index: copyIndex, marks });
      const slot = slots.push(marks) - 1;
      for (const e of curvedEdges(copy)) {
        const ringCount = ring && Math.hypot(ring.centre.x - e.centre.x, ring.centre.y - e.centre.y) <= SAME_CIRCLE_IN ? ring.count : 1;
        edges.push({ ...e, slot, sectionIndex, copyIndex, instanceId: copy.id, label: copy.label, ringCount });
      }
    });
    result.push(entry);
  });

  for (const group of groupByCircle(edges)) markCircle(group, spacingIn, slots);

  for (const marks of slots) dedupeAndSort(marks);
  document.sections.forEach((section, i) => {
    result[i].marks = templateMarks(result[i].instances, section.ringRepeat ? 360 / section.ringRepeat.count : 0);
  });
  return result;
}

function curvedEdges(section: Section): Array<Pick<CurvedEdge, 'centre' | 'radiusIn' | 'startDeg' | 'sweepDeg' | 'edge' | 'edgeIndex'>> {
  const g = section.geometry;
  switch (g.kind) {
    case 'straight': {
      // A curve turning the way the outline winds bulges out of the section: the section lies inside its circle.
      const winding = Math.sign(straightSectionSignedArea(g));
      return sectionEdges(g).flatMap((e) => {
        if (!e.arc) return [];
        const { centre, radiusIn, startRad, sweepRad } = e.arc;
        const fromRad = sweepRad > 0 ? startRad : startRad + sweepRad;
        return [{
          centre,
          radiusIn,
          startDeg: normaliseAngleDeg(radToDeg(fromRad)),
          sweepDeg: radToDeg(Math.abs(sweepRad)),
          edge: Math.sign(sweepRad) === winding ? 'outer' : 'inner',
          edgeIndex: e.index,
        }];
      });
    }
    case 'wedge':
      return [{ centre: g.centre, radiusIn: g.radiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'outer' }];
    case 'arc':
      return [
        { centre: g.centre, radiusIn: g.outerRadiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'outer' },
        { centre: g.centre, radiusIn: g.innerRadiusIn, startDeg: normaliseAngleDeg(g.startAngleDeg), sweepDeg: g.sweepDeg, edge: 'inner' },
      ];
  }
}

/** Edges on the same circle (centre and radius within SAME_CIRCLE_IN), in document order within a group. */
function groupByCircle(edges: CurvedEdge[]): CurvedEdge[][] {
  const sorted = [...edges].sort((a, b) => a.radiusIn - b.radiusIn);
  const groups: CurvedEdge[][] = [];
  const used = new Uint8Array(sorted.length);
  for (let i = 0; i < sorted.length; i++) {
    if (used[i]) continue;
    const group = [sorted[i]];
    used[i] = 1;
    for (let j = i + 1; j < sorted.length && sorted[j].radiusIn - sorted[i].radiusIn <= SAME_CIRCLE_IN; j++) {
      if (!used[j] && Math.hypot(sorted[j].centre.x - sorted[i].centre.x, sorted[j].centre.y - sorted[i].centre.y) <= SAME_CIRCLE_IN) {
        group.push(sorted[j]);
        used[j] = 1;
      }
    }
    group.sort((a, b) => a.sectionIndex - b.sectionIndex || a.copyIndex - b.copyIndex || (a.edge === b.edge ? 0 : a.edge === 'outer' ? -1 : 1));
    groups.push(group);
  }
  return groups;
}

function markCircle(group: CurvedEdge[], spacingIn: number, slots: MatchingMark[][]): void {
  const pairs: Array<{ a: CurvedEdge; b: CurvedEdge; lo: number; hi: number }> = [];
  for (let i = 0; i < group.length; i++) {
    for (let j = i + 1; j < group.length; j++) {
      const a = group[i];
      const b = group[j];
      if (a.slot === b.slot || a.edge === b.edge) continue;
      for (const [lo, hi] of overlaps(a, b)) pairs.push({ a, b, lo, hi });
    }
  }
  if (pairs.length === 0) return;

  const r = group[0].radiusIn;
  const ringLcm = group.reduce((l, e) => lcm(l, e.ringCount), 1);
  const base = Math.max(1, Math.round((2 * Math.PI * r) / spacingIn));
  const steps = ringLcm * Math.max(1, Math.round(base / ringLcm));
  const stepDeg = 360 / steps;
  const corners = group.flatMap((e) => (e.sweepDeg >= 360 - SAME_ANGLE_DEG ? [] : [e.startDeg, e.startDeg + e.sweepDeg]));
  const phaseDeg = gridPhase(corners, stepDeg, group[0].startDeg);
  // Marks closer than this to any corner on the circle are dropped on both sides (degrees).
  const cornerGapDeg = Math.min((0.25 / r) * (180 / Math.PI), stepDeg / 4);
  const nearCorner = (angle: number) => corners.some((c) => Math.abs(((angle - c + 540) % 360) - 180) < cornerGapDeg);

  for (const { a, b, lo, hi } of pairs) {
    // Grid angles k·step + phase strictly inside (lo, hi).
    const first = Math.ceil((lo - phaseDeg) / stepDeg - 1e-9);
    for (let k = first; phaseDeg + k * stepDeg < hi - SAME_ANGLE_DEG; k++) {
      const angle = phaseDeg + k * stepDeg;
      if (angle <= lo + SAME_ANGLE_DEG || nearCorner(angle)) continue;
      slots[a.slot].push(makeMark(a, b, angle, 'spacing'));
      slots[b.slot].push(makeMark(b, a, angle, 'spacing'));
    }
    // A stretch end inside an edge is the neighbour's corner: mark it on the edge that runs on.
    for (const angle of [lo, hi]) {
      for (const [self, other] of [[a, b], [b, a]] as const) {
        if (strictlyInside(self, angle)) slots[self.slot].push(makeMark(self, other, angle, 'neighbour-seam'));
      }
    }
  }
}

/**
 * Where the grid starts: in the middle of the widest gap between the corners' angles taken modulo one
 * step, so the grid points sit as far from every corner as they can (half a step when the corners all
 * fall on one grid, as around a ring). The ring repeats turn by whole steps, so every copy gets the same.
 */
function gridPhase(corners: number[], stepDeg: number, fallbackDeg: number): number {
  if (corners.length === 0) return fallbackDeg;
  const residues = corners.map((c) => ((c % stepDeg) + stepDeg) % stepDeg).sort((a, b) => a - b);
  let bestGap = -1;
  let phase = fallbackDeg;
  for (let i = 0; i < residues.length; i++) {
    const from = residues[i];
    const to = i + 1 < residues.length ? residues[i + 1] : residues[0] + stepDeg;
    if (to - from > bestGap + 1e-9) {
      bestGap = to - from;
      phase = from + (to - from) / 2;
    }
  }
  return phase;
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

function strictlyInside(e: CurvedEdge, angleDeg: number): boolean {
  if (e.sweepDeg >= 360 - SAME_ANGLE_DEG) return false;
  const rel = normaliseAngleDeg(angleDeg - e.startDeg);
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
    ...(self.edgeIndex !== undefined ? { edgeIndex: self.edgeIndex } : {}),
    alongEdgeIn: self.radiusIn * degToRad(along > self.sweepDeg + SAME_ANGLE_DEG ? along - 360 : along),
    kind,
    neighbourId: other.instanceId,
    neighbourLabel: other.label,
  };
}

function dedupeAndSort(marks: MatchingMark[]): void {
  marks.sort((m, n) =>
    m.edge === n.edge
      ? (m.edgeIndex ?? 0) - (n.edgeIndex ?? 0) || m.alongEdgeIn - n.alongEdgeIn || (m.kind === n.kind ? 0 : m.kind === 'spacing' ? -1 : 1)
      : m.edge === 'outer' ? -1 : 1,
  );
  // Two neighbours meeting inside an edge both mark the point there, and a grid mark may fall on it: keep one.
  for (let k = marks.length - 1; k > 0; k--) {
    const m = marks[k];
    const prev = marks[k - 1];
    if (m.edge === prev.edge && m.edgeIndex === prev.edgeIndex && Math.abs(m.alongEdgeIn - prev.alongEdgeIn) < 1e-9 && m.kind === 'neighbour-seam') marks.splice(k, 1);
  }
}

/** Marks of copy 0 that every copy has at the same place relative to itself (copy k turned back by k steps). */
function templateMarks(instances: SectionInstanceMarks[], ringStepDeg: number): MatchingMark[] {
  const [first, ...rest] = instances;
  if (!first) return [];
  return first.marks.filter((m) =>
    rest.every((inst) =>
      inst.marks.some((o) => o.edge === m.edge && o.kind === m.kind && Math.abs(((o.angleDeg - inst.index * ringStepDeg - m.angleDeg + 540) % 360) - 180) < 1e-6),
    ),
  );
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

function lcm(a: number, b: number): number {
  return (a / gcd(a, b)) * b;
}
