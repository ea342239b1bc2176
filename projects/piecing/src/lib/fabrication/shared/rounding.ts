import { INCHES_PER_UNIT } from '../../units/index';

/** One eighth of an inch, the step rough-cut sizes are rounded up to (common practice). */
export const EIGHTH_IN = 0.125;

/** Inches in a yard: 1 yd = 36 in. exactly (international yard, 1959; NIST Handbook 44). */
export const INCHES_PER_YARD = INCHES_PER_UNIT.yd;

/** Yardage is bought in steps of ⅛ yd = 4.5 in. (common practice). */
export const YARDAGE_STEP_IN = INCHES_PER_YARD / 8;

// A size computed as 3.0000000001 in. must not be rounded up to 3⅛ in.: allow a hair of float noise.
const NOISE = 1e-9;

/** Rounds `value` up to a whole number of `step`s (both in the same unit), ignoring float noise. */
export function roundUpToStep(value: number, step: number): number {
  if (!(step > 0)) throw new RangeError(`rounding step must be positive, got ${step}`);
  const rounded = Math.ceil(value / step - NOISE) * step;
  // Math.ceil(-1e-9) is -0; a length of nothing is plain 0 (JSON would not keep the sign anyway).
  return rounded === 0 ? 0 : rounded;
}

/** Rounds a length in inches up to the next ⅛ in. */
export function roundUpToEighthInch(valueIn: number): number {
  return roundUpToStep(valueIn, EIGHTH_IN);
}
