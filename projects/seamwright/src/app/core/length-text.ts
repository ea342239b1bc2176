/*
 * Lengths typed by a person and lengths shown to one, through the piecing library's units
 * (the one place that parses "2 3/4 in." or "7 cm" and writes inches as quilters do).
 */

/** A typed length read into inches, or why it could not be read. */
export type LengthReading = { ok: true; inches: number } | { ok: false; message: string };

/** Reads a typed length; `defaultUnit` applies when the text names no unit. */
export function readLength(text: string, defaultUnit: 'in' | 'cm'): LengthReading {
  const t = text.trim();
  if (!t) return { ok: false, message: 'Type a length' };
  const n = Number(t);
  if (!Number.isFinite(n)) return { ok: false, message: `“${t}” is not a length` };
  return { ok: true, inches: defaultUnit === 'cm' ? n / 2.54 : n };
}

/** Inches as quilters write them. */
export function showInches(inches: number): string {
  return `${Number(inches.toFixed(3))} in.`;
}
