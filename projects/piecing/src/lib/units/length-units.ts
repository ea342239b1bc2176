/** Units a length can be written in. The document itself is always in inches. */
export type LengthUnit = 'in' | 'cm' | 'mm' | 'ft' | 'yd';

/** Units a user can choose to see (the pattern's `displayUnit`). */
export type DisplayUnit = 'in' | 'cm';

/** Exact conversion factors to inches: 1 in. = 25.4 mm exactly, 1 yd = 36 in. (international yard, 1959; NIST HB 44). */
export const INCHES_PER_UNIT: Readonly<Record<LengthUnit, number>> = {
  in: 1,
  cm: 1 / 2.54,
  mm: 1 / 25.4,
  ft: 12,
  yd: 36,
};

/** Centimetres per inch, exactly. */
export const CM_PER_INCH = 2.54;

/** Converts a length in `unit` to inches. */
export function toInches(value: number, unit: LengthUnit): number {
  return value * INCHES_PER_UNIT[unit];
}

/** Converts inches to `unit`. */
export function fromInches(inches: number, unit: LengthUnit): number {
  return inches / INCHES_PER_UNIT[unit];
}

/** Thrown by the formatters for a value that is not a finite number. */
export class UnitInputError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = 'UnitInputError';
  }
}
