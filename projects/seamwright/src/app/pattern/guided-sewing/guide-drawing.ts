import { polygonBounds, type Point } from '@seamwright/piecing';

/** How a shape is shown: the patch to place now, patches sewn already, ones still to come, or context. */
export type ShapeState = 'current' | 'done' | 'todo' | 'context';

/** One patch (or part) to draw. */
export interface DrawnShape {
  polygon: Point[];
  /** Fabric colour, or null for none. */
  fill: string | null;
  state: ShapeState;
  /** Text at `labelAt` (patch number, ✓ …). */
  label?: string;
  labelAt?: Point;
}

/** What a step drawing holds, in the drawing plane (inches, front of the block). */
export interface GuideDrawing {
  shapes: DrawnShape[];
  /** Lines to sew, as open paths. */
  lines: Point[][];
  /** Matching marks. */
  marks: Point[];
  /** Whether to draw the mirror image (the printed side of a foundation). */
  mirrored: boolean;
}

/** The drawing as SVG-ready data: points strings in a view box, mirrored when asked. */
export interface DrawingView {
  viewBox: string;
  fontSize: number;
  markRadius: number;
  shapes: { points: string; fill: string | null; state: ShapeState; label?: string; x?: number; y?: number }[];
  lines: string[];
  marks: Point[];
}

const points = (ring: readonly Point[]) => ring.map((p) => `${round(p.x)},${round(p.y)}`).join(' ');
const round = (n: number) => Math.round(n * 1000) / 1000;

/**
 * Places a drawing in an SVG view box. The mirror image turns x about the middle of the drawing, as a
 * foundation is printed (the printed side is the back of the block); text stays readable because only
 * positions are mirrored, never the text itself.
 */
export function drawingView(d: GuideDrawing): DrawingView {
  const all = d.shapes.flatMap((s) => s.polygon);
  if (all.length === 0) return { viewBox: '0 0 1 1', fontSize: 0.1, markRadius: 0.05, shapes: [], lines: [], marks: [] };
  const { minX, maxX, minY, maxY } = polygonBounds(all);
  const flip = (p: Point): Point => (d.mirrored ? { x: minX + maxX - p.x, y: p.y } : p);
  const span = Math.max(maxX - minX, maxY - minY, 0.1);
  const pad = span * 0.04;
  return {
    viewBox: `${round(minX - pad)} ${round(minY - pad)} ${round(maxX - minX + 2 * pad)} ${round(maxY - minY + 2 * pad)}`,
    fontSize: round(span / 14),
    markRadius: round(span / 70),
    shapes: d.shapes.map((s) => {
      const at = s.labelAt ? flip(s.labelAt) : undefined;
      return { points: points(s.polygon.map(flip)), fill: s.fill, state: s.state, label: s.label, x: at && round(at.x), y: at && round(at.y) };
    }),
    lines: d.lines.map((l) => points(l.map(flip))),
    marks: d.marks.map(flip),
  };
}
