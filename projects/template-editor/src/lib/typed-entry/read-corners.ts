import { parseLength, type Point } from '@seamwright/piecing';
import type { BoardUnit } from '../core/public-api';

/**
 * Reads corners typed as x, y pairs separated by semicolons ("2, 2; 10 1/2, 2; 10 1/2, 10"), each
 * number as the side panel's fields read lengths (fractions, decimals, cm). Returns the points in
 * inches, or what is wrong in words.
 */
export function readCorners(text: string, unit: BoardUnit): { ok: true; points: Point[] } | { ok: false; message: string } {
  const pairs = text.split(';').map((p) => p.trim()).filter(Boolean);
  if (pairs.length < 3) return { ok: false, message: 'type at least three corners as x, y pairs separated by semicolons, e.g. 2, 2; 10, 2; 10, 10' };
  const points: Point[] = [];
  for (const [i, pair] of pairs.entries()) {
    const parts = pair.split(',').map((p) => p.trim());
    if (parts.length !== 2) return { ok: false, message: `corner ${i + 1} (“${pair}”): write it as x, y` };
    const xy: number[] = [];
    for (const part of parts) {
      const r = parseLength(part, unit);
      if (!r.ok) return { ok: false, message: `corner ${i + 1} (“${pair}”): ${r.message}` };
      xy.push(r.inches);
    }
    points.push({ x: xy[0], y: xy[1] });
  }
  return { ok: true, points };
}
