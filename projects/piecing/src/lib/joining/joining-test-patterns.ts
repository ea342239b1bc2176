import type { PatternDocument, Point, Section } from '../document/pattern-schema';

/** A straight section from its corners (test data). */
export function straightSection(id: string, label: string, vertices: Point[]): Section {
  return { id, label, geometry: { kind: 'straight', vertices }, seams: [], patches: [] };
}

/** A document holding the sections, on a canvas of the given size (test data). */
export function documentOf(sections: Section[], widthIn = 8, heightIn = 8): PatternDocument {
  return {
    formatVersion: 2,
    title: 'Joining test',
    displayUnit: 'in',
    seamAllowanceIn: 0.25,
    piecingMarginIn: 0.5,
    blockCount: 1,
    pressingsPerTemplate: 16,
    canvas: { widthIn, heightIn },
    fabrics: [],
    sections,
  };
}

const r = (x0: number, y0: number, x1: number, y1: number): Point[] => [
  { x: x0, y: y0 },
  { x: x1, y: y0 },
  { x: x1, y: y1 },
  { x: x0, y: y1 },
];

/**
 * Three rhombi of a hexagon meeting at its centre (a "tumbling block"): X and Y share one straight
 * edge, and Z meets the X–Y unit along two edges that meet at the centre at 120°, so joining Z means
 * sewing into the corner and pivoting there: a Y seam.
 */
export function threeRhombi(): PatternDocument {
  const c = { x: 4, y: 4 };
  const at = (deg: number): Point => ({ x: c.x + 2 * Math.cos((deg * Math.PI) / 180), y: c.y + 2 * Math.sin((deg * Math.PI) / 180) });
  // Hexagon corners at 30°, 90°, … ; each rhombus is the centre and three consecutive corners.
  const rhombus = (from: number): Point[] => [c, at(from), at(from + 60), at(from + 120)];
  return documentOf([straightSection('x', 'X', rhombus(-90)), straightSection('y', 'Y', rhombus(30)), straightSection('z', 'Z', rhombus(150))]);
}

/**
 * Five rectangles: a U of left column L, bottom bar W and right column R round a notch filled by Z
 * (top) and V (below Z). Z touches L along x = 1 and R along x = 2, never W: joined onto the L–W–R
 * unit, Z meets it along two separate stretches of edge.
 */
export function notchedU(): PatternDocument {
  return documentOf(
    [
      straightSection('l', 'L', r(0, 0, 1, 3)),
      straightSection('w', 'W', r(0, 3, 3, 4)),
      straightSection('rt', 'R', r(2, 0, 3, 3)),
      straightSection('z', 'Z', r(1, 0, 2, 2)),
      straightSection('v', 'V', r(1, 2, 2, 3)),
    ],
    3,
    4,
  );
}

/** An n × n grid of 2 in. square sections, lettered A, B … row by row (a pieced block of squares). */
export function squareGrid(n: number): PatternDocument {
  const letter = (i: number): string => (i < 26 ? String.fromCharCode(65 + i) : letter(Math.floor(i / 26) - 1) + String.fromCharCode(65 + (i % 26)));
  return documentOf(
    Array.from({ length: n * n }, (_, k) => straightSection(`s${k}`, letter(k), r((k % n) * 2, Math.floor(k / n) * 2, (k % n) * 2 + 2, Math.floor(k / n) * 2 + 2))),
    2 * n,
    2 * n,
  );
}
