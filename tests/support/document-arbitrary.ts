/**
 * fast-check arbitraries for VALID pattern documents, built from the schema's rules
 * (projects/piecing/src/lib/document/pattern-schema.ts): unique fabric, section and patch ids,
 * labels of capital letters, colours `#rrggbb`, lengths > 0 and ≤ 200 in., arcs with inner < outer
 * radius, sweeps in (0°, 360°], references only to fabrics that exist. Straight outlines are convex
 * (points on a circle at increasing angles) so they never cross themselves; every seam has length.
 */
import fc from 'fast-check';
import type { PatternDocumentInput } from '@seamwright/piecing';
import { sectionLabel } from './documents';

const round3 = (v: number) => Math.round(v * 1000) / 1000;
const coord = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true }).map(round3);
const point = (min: number, max: number) => fc.record({ x: coord(min, max), y: coord(min, max) });
/** Uniform in [-m, m] in steps of m/1000 (fast-check's doubles favour 0 and the bounds). */
const unit = (m: number) => fc.integer({ min: -1000, max: 1000 }).map((k) => (k / 1000) * m);
const hex = fc.integer({ min: 0, max: 0xffffff }).map((n) => `#${n.toString(16).padStart(6, '0')}`);

/** Convex polygon: n points on a circle at strictly increasing angles at least 10° apart. */
const convexPolygon = fc
  .record({
    centre: point(-40, 40),
    radius: coord(0.5, 15),
    gaps: fc.array(fc.double({ min: 1, max: 6, noNaN: true }), { minLength: 3, maxLength: 9 }),
    turn: fc.double({ min: 0, max: 360, noNaN: true }),
  })
  .map(({ centre, radius, gaps, turn }) => {
    const total = gaps.reduce((a, b) => a + b, 0);
    let acc = 0;
    return gaps.map((g) => {
      const angle = ((turn + (acc / total) * 360) * Math.PI) / 180;
      acc += g;
      return { x: round3(centre.x + radius * Math.cos(angle)), y: round3(centre.y + radius * Math.sin(angle)) };
    });
  })
  // At least 10° between neighbours keeps every edge long enough to be an edge.
  .filter((pts) => pts.every((p, i) => Math.hypot(p.x - pts[(i + 1) % pts.length].x, p.y - pts[(i + 1) % pts.length].y) > 0.05));

const geometry = fc.oneof(
  convexPolygon.map((vertices) => ({ kind: 'straight' as const, vertices })),
  fc
    .record({ centre: point(-30, 30), inner: coord(0.5, 15), width: coord(0.25, 8), start: coord(-360, 360), sweep: coord(5, 360) })
    .map((g) => ({ kind: 'arc' as const, centre: g.centre, innerRadiusIn: g.inner, outerRadiusIn: round3(g.inner + g.width), startAngleDeg: g.start, sweepDeg: g.sweep })),
  fc
    .record({ centre: point(-30, 30), radius: coord(0.5, 15), start: coord(-360, 360), sweep: coord(5, 360) })
    .map((g) => ({ kind: 'wedge' as const, centre: g.centre, radiusIn: g.radius, startAngleDeg: g.start, sweepDeg: g.sweep })),
);

/** The section's rough centre and size, to place seams and anchors where they can matter. */
function extent(g: { kind: string } & Record<string, any>): { cx: number; cy: number; r: number } {
  if (g.kind === 'straight') {
    const xs = g.vertices.map((p: { x: number }) => p.x);
    const ys = g.vertices.map((p: { y: number }) => p.y);
    return { cx: (Math.min(...xs) + Math.max(...xs)) / 2, cy: (Math.min(...ys) + Math.max(...ys)) / 2, r: Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) / 2 };
  }
  return { cx: g.centre.x, cy: g.centre.y, r: g.kind === 'arc' ? g.outerRadiusIn : g.radiusIn };
}

/** A valid pattern document (input form: defaults may be left out). */
export const validDocumentArb: fc.Arbitrary<PatternDocumentInput> = fc
  .record({
    title: fc.string({ minLength: 1, maxLength: 60 }).filter((t) => t.trim().length > 0),
    displayUnit: fc.constantFrom('in' as const, 'cm' as const),
    seamAllowanceIn: fc.constantFrom(0.25, 0.125, 0.375, 0.5, 1),
    piecingMarginIn: fc.constantFrom(0, 0.25, 0.5, 1),
    blockCount: fc.integer({ min: 1, max: 4 }),
    pressingsPerTemplate: fc.integer({ min: 1, max: 40 }),
    fabricCount: fc.integer({ min: 0, max: 4 }),
    fabricColours: fc.array(hex, { minLength: 4, maxLength: 4 }),
    wofs: fc.array(fc.constantFrom(40, 41, 42, 44), { minLength: 4, maxLength: 4 }),
    sections: fc.array(
      fc.record({
        geometry,
        // Seams as lines through a point near the middle at some angle, long enough to cross the
        // whole section (a seam splits the patch it crosses); sometimes a short one that may not.
        seams: fc.array(
          // Unbiased: fast-check's bias towards small values gives the same seam again and again.
          fc.noBias(fc.record({ u: unit(0.5), v: unit(0.5), angle: fc.integer({ min: 0, max: 1799 }).map((a) => a / 10), reach: fc.constantFrom(3, 3, 3, 0.4) })),
          { maxLength: 4 },
        ),
        patches: fc.uniqueArray(
          fc.noBias(fc.record({ number: fc.integer({ min: 1, max: 12 }), u: unit(1), v: unit(1), fabric: fc.integer({ min: -1, max: 3 }), stripes: fc.integer({ min: 0, max: 3 }) })),
          { selector: (p) => p.number, maxLength: 4 },
        ),
        ring: fc.option(fc.record({ count: fc.integer({ min: 2, max: 12 }), centre: point(-30, 30) }), { nil: undefined }),
        note: fc.option(fc.string({ maxLength: 40 }), { nil: undefined }),
      }),
      { minLength: 1, maxLength: 4 },
    ),
  })
  .map((r) => {
    const fabrics = Array.from({ length: r.fabricCount }, (_, i) => ({ id: `f${i}`, name: `Fabric ${i + 1}`, colour: r.fabricColours[i], usableWofIn: r.wofs[i] }));
    const sections = r.sections.map((s, i) => {
      const { cx, cy, r: size } = extent(s.geometry);
      const at = (u: number, v: number) => ({ x: round3(cx + u * size), y: round3(cy + v * size) });
      const seams = s.seams
        .map((m, j) => {
          const t = (m.angle * Math.PI) / 180;
          const dx = Math.cos(t) * m.reach;
          const dy = Math.sin(t) * m.reach;
          return { id: `m${j}`, a: at(m.u - dx, m.v - dy), b: at(m.u + dx, m.v + dy) };
        })
        .filter((m) => Math.hypot(m.a.x - m.b.x, m.a.y - m.b.y) > 0.01);
      const patches = s.patches.map((p) => {
        const patch: Record<string, unknown> = { number: p.number, anchor: at(p.u * 0.5, p.v * 0.5) };
        if (p.fabric >= 0 && p.fabric < fabrics.length) patch['fabricId'] = fabrics[p.fabric].id;
        if (p.stripes >= 2 && fabrics.length > 0) {
          patch['stripSet'] = {
            id: `set${i}-${p.number}`,
            strips: Array.from({ length: p.stripes }, (_, k) => ({ fabricId: fabrics[k % fabrics.length].id, finishedWidthIn: [1, 0.5, 2][k % 3] })),
            axisAngleDeg: (p.number * 37) % 180,
          };
        }
        return patch;
      });
      return {
        id: `sec${i}`,
        label: sectionLabel(i),
        geometry: s.geometry,
        seams,
        patches,
        ...(s.ring ? { ringRepeat: s.ring } : {}),
        ...(s.note !== undefined ? { note: s.note } : {}),
      };
    });
    return {
      formatVersion: 1 as const,
      title: r.title,
      displayUnit: r.displayUnit,
      seamAllowanceIn: r.seamAllowanceIn,
      piecingMarginIn: r.piecingMarginIn,
      blockCount: r.blockCount,
      pressingsPerTemplate: r.pressingsPerTemplate,
      canvas: { widthIn: 60, heightIn: 60 },
      fabrics,
      sections,
    } as PatternDocumentInput;
  });
