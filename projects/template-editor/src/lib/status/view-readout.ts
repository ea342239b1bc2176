import type { Viewport } from '../core/public-api';

/** One inch on a screen at 100 % zoom: 96 CSS pixels (CSS Values and Units, "absolute lengths"). */
const CSS_PX_PER_IN = 96;

/**
 * The view as the status line shows it: the zoom (100 % is true size on a screen of 96 CSS px per
 * inch), its exact pixels per inch, and the document point at the board's top-left corner, e.g.
 * "Zoom 42 % (40.000 px per in.), top left x -1.000 in., y -1.000 in." (", mirrored" when it is).
 */
export function viewReadout(v: Viewport): string {
  const leftIn = v.mirrored ? v.mirrorWidthIn + v.originX / v.scale : -v.originX / v.scale;
  const topIn = -v.originY / v.scale;
  const zoom = Math.round((v.scale / CSS_PX_PER_IN) * 100);
  const fix = (n: number) => (Math.abs(n) < 5e-4 ? 0 : n).toFixed(3);
  return `Zoom ${zoom} % (${v.scale.toFixed(3)} px per in.), top left x ${fix(leftIn)} in., y ${fix(topIn)} in.${v.mirrored ? ', mirrored' : ''}`;
}
