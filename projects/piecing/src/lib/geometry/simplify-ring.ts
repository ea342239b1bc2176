import type { Point } from '../document/pattern-schema';

/**
 * A closed ring with the points dropped that lie within `toleranceIn` of the line through their kept
 * neighbours (Ramer–Douglas–Peucker, run on the ring opened at its first point).
 */
export function simplifyClosedRing(ring: readonly Point[], toleranceIn: number): Point[] {
  if (ring.length <= 3) return [...ring];
  const open = [...ring, ring[0]];
  const keep = new Uint8Array(open.length);
  keep[0] = keep[open.length - 1] = 1;
  const stack: Array<[number, number]> = [[0, open.length - 1]];
  while (stack.length > 0) {
    const [from, to] = stack.pop()!;
    const a = open[from];
    const b = open[to];
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const length = Math.hypot(dx, dy);
    let worst = -1;
    let worstAt = -1;
    for (let i = from + 1; i < to; i++) {
      const p = open[i];
      const d = length === 0 ? Math.hypot(p.x - a.x, p.y - a.y) : Math.abs(dx * (p.y - a.y) - dy * (p.x - a.x)) / length;
      if (d > worst) {
        worst = d;
        worstAt = i;
      }
    }
    if (worstAt >= 0 && worst > toleranceIn) {
      keep[worstAt] = 1;
      stack.push([from, worstAt], [worstAt, to]);
    }
  }
  const kept = open.slice(0, -1).filter((_, i) => keep[i] === 1);
  return kept.length >= 3 ? kept : [...ring];
}
