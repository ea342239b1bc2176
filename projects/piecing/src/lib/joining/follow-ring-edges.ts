import type { PatternDocument, Point, Section, StraightGeometry } from '../document/pattern-schema';
import { circlesOfSections, distance, distanceToCircle, sweepRadToBulge, type Circle } from '../geometry/index';
import { CHORD_TOLERANCE_IN } from '../tolerance';

// Vertices this near a circle lie on it; chords whose middle is this near it follow it (inches).
const ON_CIRCLE_IN = 0.002;
const CHORD_MIDDLE_IN = 2 * CHORD_TOLERANCE_IN + 0.001;

/**
 * The document with every run of straight edges that follows the circle of an arc or wedge section
 * (vertices on the circle, each chord within the chord tolerance of it: an edge drawn against a ring as
 * a polyline) written as one curved edge with its bulge, so that `matchingMarks` marks it like a curved
 * edge. Only for finding marks: the outlines are the same within the chord tolerance. Sections without
 * such runs come back unchanged (the same objects).
 */
export function withRingEdgesAsCurves(doc: Pick<PatternDocument, 'sections'>): Pick<PatternDocument, 'sections'> {
  const circles = circlesOfSections(doc).filter((c) => c.edge !== 'curved-edge');
  if (circles.length === 0) return doc;
  return { sections: doc.sections.map((s) => (s.geometry.kind === 'straight' ? curveRuns(s, s.geometry, circles) : s)) };
}

function curveRuns(section: Section, g: StraightGeometry, circles: readonly Circle[]): Section {
  const n = g.vertices.length;
  const bulges = g.bulges ?? g.vertices.map(() => 0);
  // For each straight edge: the circle it follows (its ends on it, its middle within the chord tolerance).
  const follows = g.vertices.map((from, i) => {
    if (bulges[i] !== 0) return -1;
    const to = g.vertices[(i + 1) % n];
    const mid = { x: (from.x + to.x) / 2, y: (from.y + to.y) / 2 };
    return circles.findIndex((c) => distanceToCircle(from, c) <= ON_CIRCLE_IN && distanceToCircle(to, c) <= ON_CIRCLE_IN && distanceToCircle(mid, c) <= CHORD_MIDDLE_IN && distance(from, to) > 0);
  });
  // Start at an edge that begins a run (or follows none), so no run wraps past the end of the list.
  const start = follows.findIndex((c, i) => c !== follows[(i - 1 + n) % n]);
  if (start < 0) return section;
  const vertices: Point[] = [];
  const newBulges: number[] = [];
  let changed = false;
  let k = 0;
  while (k < n) {
    const i = (start + k) % n;
    const c = follows[i];
    let run = 1;
    while (c >= 0 && k + run < n && follows[(start + k + run) % n] === c) run++;
    const from = g.vertices[i];
    if (c >= 0 && run >= 2) {
      const circle = circles[c];
      let sweep = 0;
      for (let r = 0; r < run; r++) {
        const a = g.vertices[(i + r) % n];
        const b = g.vertices[(i + r + 1) % n];
        const da = Math.atan2(a.y - circle.centre.y, a.x - circle.centre.x);
        const db = Math.atan2(b.y - circle.centre.y, b.x - circle.centre.x);
        sweep += Math.atan2(Math.sin(db - da), Math.cos(db - da));
      }
      if (Math.abs(sweep) <= Math.PI) {
        vertices.push(from);
        newBulges.push(sweepRadToBulge(sweep));
        changed = true;
        k += run;
        continue;
      }
    }
    for (let r = 0; r < run; r++) {
      vertices.push(g.vertices[(i + r) % n]);
      newBulges.push(bulges[(i + r) % n]);
    }
    k += run;
  }
  if (!changed) return section;
  return { ...section, geometry: { kind: 'straight', vertices, bulges: newBulges } };
}
