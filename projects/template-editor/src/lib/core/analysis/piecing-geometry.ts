import {
  checkSewability,
  degToRad,
  type StripSetLayout,
  derivePatches,
  findSewableOrder,
  flattenSectionOutline,
  layoutStripSet,
  locatePoint,
  polygonBounds,
  polygonCentroid,
  sectionCuttingLine,
  splitSection,
  type Point,
  type Section,
} from '@seamwright/piecing';
import type { BoardOrderSearch, BoardPatch, BoardSewability, GeometryPort } from './geometry-port';

/**
 * A point strictly inside a patch ring, for its label and its assignment anchor: the centroid when it
 * is inside (every convex patch), otherwise the middle of the widest inside stretch of the horizontal
 * line through the centroid.
 */
export function interiorPoint(ring: readonly Point[]): Point {
  const c = polygonCentroid(ring);
  if (locatePoint(c, ring) === 'inside') return c;
  const b = polygonBounds(ring);
  for (const fraction of [0.5, 0.35, 0.65, 0.2, 0.8]) {
    const y = fraction === 0.5 && c.y > b.minY && c.y < b.maxY ? c.y : b.minY + (b.maxY - b.minY) * fraction;
    const xs: number[] = [];
    for (let i = 0, n = ring.length; i < n; i++) {
      const p = ring[i];
      const q = ring[(i + 1) % n];
      if (p.y > y !== q.y > y) xs.push(p.x + ((y - p.y) * (q.x - p.x)) / (q.y - p.y));
    }
    xs.sort((u, v) => u - v);
    let best: Point | null = null;
    let width = 0;
    for (let i = 0; i + 1 < xs.length; i += 2) {
      if (xs[i + 1] - xs[i] > width) {
        width = xs[i + 1] - xs[i];
        best = { x: (xs[i] + xs[i + 1]) / 2, y };
      }
    }
    if (best) return best;
  }
  return c;
}

function samePolygon(a: readonly Point[], b: readonly Point[]): boolean {
  return a.length === b.length && a.length > 0 && a[0].x === b[0].x && a[0].y === b[0].y && a[a.length - 1].x === b[b.length - 1].x;
}

/**
 * Bands to draw each strip of a laid-out strip set: the strip's finished part across the set, long
 * enough along the strips to cover the patch (drawing clips them to the patch). The outer strips reach
 * out to the patch edges, as the fabric does once sewn and trimmed.
 */
function stripBands(layout: StripSetLayout, polygon: readonly Point[]): Array<{ fabricId: string; polygon: Point[] }> {
  const b = polygonBounds(polygon);
  const reach = Math.hypot(b.maxX - b.minX, b.maxY - b.minY) + 1;
  const a = degToRad(layout.axisAngleDeg);
  const u = { x: Math.cos(a), y: Math.sin(a) };
  const n = { x: -u.y, y: u.x };
  const at = (along: number, across: number): Point => ({ x: layout.centre.x + u.x * along + n.x * across, y: layout.centre.y + u.y * along + n.y * across });
  return layout.strips.map((st, i) => {
    const from = i === 0 ? -reach : st.fromAcrossIn;
    const to = i === layout.strips.length - 1 ? reach : st.toAcrossIn;
    return { fabricId: st.fabricId, polygon: [at(-reach, from), at(reach, from), at(reach, to), at(-reach, to)] };
  });
}

/** The geometry port answered by `@seamwright/piecing`. */
export function piecingGeometry(): GeometryPort {
  return {
    outline: (geometry) => flattenSectionOutline(geometry),
    patches(section: Section): BoardPatch[] {
      const { patches } = derivePatches(section);
      // Index = position in the split order, which depends only on the outline and the seams, so it
      // stays put while numbers change.
      const { polygons } = splitSection(section);
      return patches.map((p) => {
        const index = polygons.findIndex((q) => samePolygon(q, p.polygon));
        const out: BoardPatch = {
          index,
          number: p.number,
          label: p.label,
          polygon: p.polygon,
          anchor: interiorPoint(p.polygon),
          guideLines: [],
        };
        if (p.fabricId) out.fabricId = p.fabricId;
        if (p.stripSet) {
          out.stripSet = p.stripSet;
          try {
            const layout = layoutStripSet(p.polygon, p.stripSet);
            out.guideLines = layout.guideLines.flatMap((g) => g.segments.map((seg): [Point, Point] => [seg.a, seg.b]));
            out.stripBands = stripBands(layout, p.polygon);
          } catch {
            // A strip set that does not fit shows no guide lines; the properties panel says why.
          }
        }
        return out;
      }).sort((p, q) => p.index - q.index);
    },
    problems: (section) => derivePatches(section).problems.map((p) => p.message),
    sewability(section: Section, patches?: readonly BoardPatch[]): BoardSewability {
      const verdict = checkSewability(patches ? [...patches].sort((a, b) => a.number - b.number) : section);
      if (verdict.sewable || !verdict.failure) return { ok: true };
      return { ok: false, failingPatchNumber: verdict.failure.patchNumber, reason: verdict.failure.message };
    },
    findOrder(section: Section): BoardOrderSearch {
      const r = findSewableOrder(section);
      if (r.found) return { ok: true, order: r.order };
      return r.suggestion
        ? { ok: false, reason: `${r.message} ${r.suggestion.message}`.trim(), suggestedSplit: { a: r.suggestion.from, b: r.suggestion.to } }
        : { ok: false, reason: r.message };
    },
    cuttingLine(section, allowanceIn) {
      try {
        return sectionCuttingLine(section, allowanceIn);
      } catch {
        return null;
      }
    },
    contains: (ring, p) => locatePoint(p, ring) !== 'outside',
  };
}
