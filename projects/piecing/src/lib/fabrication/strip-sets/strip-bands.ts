import type { Point, StripSet } from '../../document/pattern-schema';
import { polygonBounds } from '../../geometry/polygon';
import { degToRad } from '../../geometry/vector';
import { layoutStripSet } from './strip-set-layout';

/** One strip of a strip set as a band to draw across its patch (clip it to the patch outline). */
export interface StripBand {
  fabricId: string;
  polygon: Point[];
}

/**
 * Bands to draw each strip of a strip-set patch: the strip's finished part across the set, long enough
 * along the strips to cover the patch (drawing clips them to the patch). The outer strips reach out to
 * the patch edges, as the fabric does once sewn and trimmed. Empty when the set does not fit the patch.
 */
export function stripSetBands(polygon: readonly Point[], stripSet: StripSet): StripBand[] {
  let layout: ReturnType<typeof layoutStripSet>;
  try {
    layout = layoutStripSet(polygon, stripSet);
  } catch {
    return [];
  }
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
