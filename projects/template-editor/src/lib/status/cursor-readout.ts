import { formatCentimetres, formatInches, type Point } from '@seamwright/piecing';
import type { BoardUnit } from '../core/public-api';

/** The pointer position as the status line shows it: in the board unit, and as quilters write it. */
export function cursorReadout(p: Point | null, unit: BoardUnit): { exact: string; quilter: string } | null {
  if (!p) return null;
  if (unit === 'cm') {
    return { exact: `x ${formatCentimetres(p.x)}, y ${formatCentimetres(p.y)}`, quilter: `${formatCentimetres(p.x, 1)} × ${formatCentimetres(p.y, 1)}` };
  }
  return {
    exact: `x ${p.x.toFixed(3)} in., y ${p.y.toFixed(3)} in.`,
    quilter: `${formatInches(p.x, { style: 'unicode' })} × ${formatInches(p.y, { style: 'unicode' })}`,
  };
}
