import type { Point } from '../../document/pattern-schema';
import { PolygonOffsetter } from '../seam-allowance/clipper-offset';
import { CLIPPER_SCALE } from '../../tolerance';
import { roundUpToEighthInch } from '../shared/rounding';

/**
 * Offsets come back on clipper's integer grid (1 / CLIPPER_SCALE in.), so an extent of exactly 2½ in.
 * may measure 2.50014 in.: sizes within this of an eighth are that eighth, not the next one up.
 */
export const OFFSET_GRID_NOISE_IN = 3 / CLIPPER_SCALE;

/** Rounds a measured extent up to ⅛ in., forgiving the offset grid's noise. */
export function roundCutSizeIn(extentIn: number): number {
  return roundUpToEighthInch(extentIn - OFFSET_GRID_NOISE_IN);
}
import { minAreaRectangle, type OrientedRectangle } from './min-area-rectangle';

/** The rough-cut rectangle for one patch. */
export interface PatchRoughCut {
  /** The smallest rectangle around the patch grown by allowance + margin, unrounded. */
  rectangle: OrientedRectangle;
  /** Its shorter and longer sides rounded up to ⅛ in.: the size to cut. */
  widthIn: number;
  lengthIn: number;
}

/**
 * The rough-cut piece for a patch: the minimum-area rectangle around the patch offset outward by the
 * seam allowance plus the piecing margin (mitre joins, as for cutting lines), sides rounded up to ⅛ in.
 * Pass an `offsetter` to reuse one across many patches.
 */
export function patchRoughCut(polygon: readonly Point[], allowanceIn = 0.25, marginIn = 0.5, offsetter = new PolygonOffsetter()): PatchRoughCut {
  const grown = offsetter.offsetPolygon(polygon, allowanceIn + marginIn, 'mitre');
  const rectangle = minAreaRectangle(grown.length > 0 ? grown : polygon);
  const a = roundCutSizeIn(rectangle.alongIn);
  const b = roundCutSizeIn(rectangle.acrossIn);
  return { rectangle, widthIn: Math.min(a, b), lengthIn: Math.max(a, b) };
}
