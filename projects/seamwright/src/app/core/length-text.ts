/*
 * Lengths typed by a person and lengths shown to one, through the piecing library's units
 * (the one place that parses "2 3/4 in." or "7 cm" and writes inches as quilters do).
 */
import { formatInches, parseLength, type InchDenominator } from '@seamwright/piecing';

/** A typed length read into inches, or why it could not be read. */
export type LengthReading = { ok: true; inches: number } | { ok: false; message: string };

/** Reads a typed length (fractions, decimals, in./cm/mm); `defaultUnit` applies when the text names none. */
export function readLength(text: string, defaultUnit: 'in' | 'cm'): LengthReading {
  if (!text.trim()) return { ok: false, message: 'Type what the square measures' };
  const r = parseLength(text, defaultUnit);
  return r.ok ? { ok: true, inches: r.inches } : { ok: false, message: r.message.charAt(0).toUpperCase() + r.message.slice(1) };
}

/** Inches as quilters write them: 2 ¾ in. (to the nearest ⅛ in. unless told otherwise). */
export function showInches(inches: number, denominator: InchDenominator = 8): string {
  return formatInches(inches, { style: 'unicode', denominator });
}

/** Yards as a decimal, as the shop and the CLI give them, in eighths: 2.375 → "2 ⅜ yd". */
export function showYards(yards: number): string {
  return `${showInches(yards).replace(/ in\.$/, '')} yd`;
}
