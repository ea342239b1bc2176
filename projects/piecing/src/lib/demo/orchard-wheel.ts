import type { Fabric, PatternDocument, Point, Section } from '../document/pattern-schema';
import { degToRad, flattenArc } from '../geometry/index';
import { polar, round6, seam } from './demo-helpers';
import { orchardWheelColourways, orchardWheelQuilt } from './orchard-wheel-quilt';

/** Fabrics of the Orchard Wheel demo (invented). */
export const ORCHARD_WHEEL_FABRICS: Fabric[] = [
  { id: 'plum', name: 'Plum', colour: '#6d3b5e', usableWofIn: 42 },
  { id: 'oat', name: 'Oat', colour: '#e9dcc1', usableWofIn: 42 },
  { id: 'sage', name: 'Sage', colour: '#9aae8c', usableWofIn: 42 },
  { id: 'marigold', name: 'Marigold', colour: '#e2a03a', usableWofIn: 41 },
  { id: 'ink', name: 'Ink', colour: '#262b3d', usableWofIn: 42 },
];

const SIZE_IN = 26;
const CENTRE: Point = { x: 13, y: 13 };
const UP_DEG = -90; // straight up on screen (y points down)

/**
 * "Orchard Wheel", the demo medallion (invented, docs/design-notes.md#demo-data): an 8-point star of wedges at the centre
 * (radius 5 in.), a ring of 8 arc sections (5–8 in.) each carrying a pieced centre stripe (strip set Plum
 * 2 in. + Oat 1 in. + Plum 2 in.) with guide lines, a ring of 16 arc sections (8–11 in.) of points, and 4
 * straight corner sections squaring the 22 in. circle to a 26 in. block. Each ring is one section with a
 * ring repeat. Every section is sewable in its patch order. Set into a quilt with three named sizes and two
 * colourways (orchard-wheel-quilt.ts).
 */
export function buildOrchardWheel(): PatternDocument {
  return {
    formatVersion: 2,
    title: 'Orchard Wheel',
    displayUnit: 'in',
    seamAllowanceIn: 0.25,
    piecingMarginIn: 0.5,
    blockCount: 1,
    pressingsPerTemplate: 16,
    canvas: { widthIn: SIZE_IN, heightIn: SIZE_IN },
    fabrics: ORCHARD_WHEEL_FABRICS.map((f) => ({ ...f })),
    sections: [starWedge(), stripeBand(), pointsRing(), corner()],
    quilt: orchardWheelQuilt(),
    colourways: orchardWheelColourways(),
  };
}

/** A: one star point in a 45° wedge — the point (Marigold) from the centre to the rim, Ink either side. */
function starWedge(): Section {
  const start = UP_DEG - 22.5;
  const tip = polar(CENTRE, 5, UP_DEG);
  const left = polar(CENTRE, 2, start);
  const right = polar(CENTRE, 2, start + 45);
  return {
    id: 'star',
    label: 'A',
    geometry: { kind: 'wedge', centre: { ...CENTRE }, radiusIn: 5, startAngleDeg: start, sweepDeg: 45 },
    // The tip is a vertex of the flattened rim (14 chords at 0.002 in.), so both seams end on it exactly.
    seams: [seam('a-left', tip, left, 0), seam('a-right', tip, right, 0)],
    patches: [
      { number: 1, anchor: polar(CENTRE, 2.5, UP_DEG), fabricId: 'marigold' },
      { number: 2, anchor: polar(CENTRE, 4, UP_DEG - 15), fabricId: 'ink' },
      { number: 3, anchor: polar(CENTRE, 4, UP_DEG + 15), fabricId: 'ink' },
    ],
    ringRepeat: { count: 8, centre: { ...CENTRE } },
    note: 'Press the star point towards the centre.',
  };
}

/** B: the band 5–8 in. with a pieced centre stripe, Sage either side. */
function stripeBand(): Section {
  const start = UP_DEG - 22.5;
  // The stripe patch narrows from 2.8 in. at the rim to 2 in. at the inner edge, centred on the radius
  // straight up; seams run from the inner arc to the outer arc.
  const onCircle = (r: number, across: number): Point => ({ x: round6(CENTRE.x + across), y: round6(CENTRE.y - Math.sqrt(r * r - across * across)) });
  return {
    id: 'stripe-band',
    label: 'B',
    geometry: { kind: 'arc', centre: { ...CENTRE }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: start, sweepDeg: 45 },
    seams: [seam('b-left', onCircle(5, -1), onCircle(8, -1.4)), seam('b-right', onCircle(5, 1), onCircle(8, 1.4))],
    patches: [
      {
        number: 1,
        anchor: polar(CENTRE, 6.5, UP_DEG),
        stripSet: {
          id: 'centre-stripe',
          name: 'Centre stripe',
          strips: [
            { fabricId: 'plum', finishedWidthIn: 2 },
            { fabricId: 'oat', finishedWidthIn: 1 },
            { fabricId: 'plum', finishedWidthIn: 2 },
          ],
          // The strips run along the radius (straight up), so the Oat stripe points at the star.
          axisAngleDeg: UP_DEG,
          offsetIn: 0,
        },
      },
      { number: 2, anchor: polar(CENTRE, 6.5, UP_DEG - 17), fabricId: 'sage' },
      { number: 3, anchor: polar(CENTRE, 6.5, UP_DEG + 17), fabricId: 'sage' },
    ],
    ringRepeat: { count: 8, centre: { ...CENTRE } },
    note: 'Sew the stripe set first; lay its Oat stripe between the two guide lines.',
  };
}

/** C: one of 16 points, 8–11 in.: a Plum point on the inner arc reaching the rim, Oat either side. */
function pointsRing(): Section {
  const mid = UP_DEG; // a point straight above each stripe
  const start = mid - 11.25;
  const tip = polar(CENTRE, 11, mid);
  return {
    id: 'points',
    label: 'C',
    geometry: { kind: 'arc', centre: { ...CENTRE }, innerRadiusIn: 8, outerRadiusIn: 11, startAngleDeg: start, sweepDeg: 22.5 },
    // The tip lies on the exact rim, within the chord tolerance of its flattened chord.
    seams: [seam('c-left', tip, polar(CENTRE, 8, mid - 7), 0), seam('c-right', tip, polar(CENTRE, 8, mid + 7), 0)],
    patches: [
      { number: 1, anchor: polar(CENTRE, 9, mid), fabricId: 'plum' },
      { number: 2, anchor: polar(CENTRE, 9.5, mid - 8), fabricId: 'oat' },
      { number: 3, anchor: polar(CENTRE, 9.5, mid + 8), fabricId: 'oat' },
    ],
    ringRepeat: { count: 16, centre: { ...CENTRE } },
  };
}

/** D: the top-left corner outside the 11 in. circle, split corner to circle into Ink and Sage. */
function corner(): Section {
  // The corner's inner edge follows the circle: its vertices lie on it, chords within 0.002 in.
  const arc = flattenArc(CENTRE, 11, degToRad(-90), degToRad(-90)).map((p) => ({ x: round6(p.x), y: round6(p.y) }));
  const vertices: Point[] = [{ x: 0, y: 0 }, { x: 13, y: 0 }, ...arc, { x: 0, y: 13 }];
  const onCircle = polar(CENTRE, 11, -135);
  return {
    id: 'corner',
    label: 'D',
    geometry: { kind: 'straight', vertices },
    seams: [seam('d-diagonal', { x: 0, y: 0 }, onCircle)],
    patches: [
      { number: 1, anchor: { x: 6, y: 2 }, fabricId: 'ink' },
      { number: 2, anchor: { x: 2, y: 6 }, fabricId: 'sage' },
    ],
    ringRepeat: { count: 4, centre: { ...CENTRE } },
  };
}
