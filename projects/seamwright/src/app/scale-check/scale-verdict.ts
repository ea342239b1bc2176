/**
 * What a measured test square says about how the sheet was printed.
 * Inputs in inches; the library's test squares are 1 in. and 2 cm (TEST_SQUARE_IN, TEST_SQUARE_CM_IN).
 */

/**
 * Largest scale error still called true: ±1 %, i.e. ±1/100 in. on the 1 in. square, finer than a
 * quilting ruler's 1/16 in. marks read by eye (common practice; the tolerance is our choice).
 */
export const TRUE_SCALE_TOLERANCE = 0.01;

/** Below this or above the inverse, the number typed is more likely a mistake than a print. */
const IMPLAUSIBLE = 0.5;

export type ScaleVerdict =
  | { kind: 'true'; scale: number }
  | { kind: 'shrunk' | 'enlarged'; scale: number; advice: string[] }
  | { kind: 'implausible'; scale: number; advice: string[] };

/** Compares the measured side of a test square with its true side. */
export function judgeScale(measuredIn: number, expectedIn: number): ScaleVerdict {
  const scale = measuredIn / expectedIn;
  if (!(scale > 0) || scale < IMPLAUSIBLE || scale > 1 / IMPLAUSIBLE) {
    return {
      kind: 'implausible',
      scale,
      advice: ['Check which square you measured and the unit you typed: the number is far from any print scale.'],
    };
  }
  if (Math.abs(scale - 1) <= TRUE_SCALE_TOLERANCE) return { kind: 'true', scale };
  const common = ['Print again at 100 % / actual size (in the print dialog, "Scale: 100" or "Actual size").', 'Measure the test square again before cutting any fabric.'];
  return scale < 1
    ? {
        kind: 'shrunk',
        scale,
        advice: ['Turn off "Fit to page", "Shrink to fit" or "Fit to printable area".', ...common],
      }
    : {
        kind: 'enlarged',
        scale,
        advice: ['Turn off any zoom or "Fill page" setting, and check the paper size matches the paper in the tray.', ...common],
      };
}

/** A scale as a percentage with one decimal: 0.968 → "96.8 %". */
export function formatScale(scale: number): string {
  return `${(scale * 100).toFixed(1)} %`;
}
