import { CM_PER_INCH, UnitInputError, type DisplayUnit } from './length-units';

/** Fractions of an inch a length is rounded to. */
export type InchDenominator = 2 | 4 | 8 | 16 | 32;

/** A length rounded to a fraction of an inch: sign × (whole + numerator / denominator), fraction reduced. */
export interface InchFraction {
  negative: boolean;
  whole: number;
  numerator: number;
  /** Reduced denominator (1 when the length is a whole number of inches). */
  denominator: number;
  /** The rounded length, in inches. */
  inches: number;
}

/** Options for {@link formatInches}. */
export interface FormatInchesOptions {
  /** Round to the nearest 1/denominator in. Default 8. */
  denominator?: InchDenominator;
  /** 'ascii' writes `2 3/4 in.`; 'unicode' writes `2 ¾ in.` (and `2 ⁵⁄₁₆ in.` where no single glyph exists). Default 'ascii'. */
  style?: 'ascii' | 'unicode';
  /** Whether to append the unit, ` in.`. Default true. */
  withUnit?: boolean;
}

const GLYPHS: Readonly<Record<string, string>> = { '1/2': '½', '1/4': '¼', '3/4': '¾', '1/8': '⅛', '3/8': '⅜', '5/8': '⅝', '7/8': '⅞' };
const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUBSCRIPT = '₀₁₂₃₄₅₆₇₈₉';

function assertFinite(value: number, what: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new UnitInputError(`${what} must be a finite number, got ${String(value)}`);
}

/** Rounds inches to the nearest 1/denominator (halves round away from zero) and reduces the fraction. */
export function roundToFraction(inches: number, denominator: InchDenominator = 8): InchFraction {
  assertFinite(inches, 'length');
  if (![2, 4, 8, 16, 32].includes(denominator)) throw new UnitInputError(`denominator must be 2, 4, 8, 16 or 32, got ${String(denominator)}`);
  const units = Math.round(Math.abs(inches) * denominator);
  const negative = inches < 0 && units > 0;
  const whole = Math.floor(units / denominator);
  let numerator = units - whole * denominator;
  let den: number = denominator;
  while (numerator > 0 && numerator % 2 === 0) {
    numerator /= 2;
    den /= 2;
  }
  if (numerator === 0) den = 1;
  return { negative, whole, numerator, denominator: den, inches: (negative ? -1 : 1) * (units / denominator) };
}

/**
 * Writes inches the way quilters read them, rounded to the nearest 1/8 (or 1/16 …) in.:
 * whole inches, a space, the reduced fraction, then ` in.`: `2 3/4 in.`, `3/8 in.`, `3 in.`, `0 in.`,
 * `-1/4 in.`. With `style: 'unicode'`: `2 ¾ in.`, `2 ⁵⁄₁₆ in.`.
 */
export function formatInches(inches: number, options: FormatInchesOptions = {}): string {
  const f = roundToFraction(inches, options.denominator ?? 8);
  const unicode = options.style === 'unicode';
  let fractionText = '';
  if (f.numerator > 0) {
    const ascii = `${f.numerator}/${f.denominator}`;
    fractionText = unicode ? (GLYPHS[ascii] ?? `${toScript(f.numerator, SUPERSCRIPT)}⁄${toScript(f.denominator, SUBSCRIPT)}`) : ascii;
  }
  const number = f.whole > 0 && fractionText ? `${f.whole} ${fractionText}` : fractionText || String(f.whole);
  return `${f.negative ? '-' : ''}${number}${options.withUnit === false ? '' : ' in.'}`;
}

function toScript(n: number, digits: string): string {
  return String(n)
    .split('')
    .map((d) => digits[Number(d)])
    .join('');
}

/** Writes inches as centimetres with up to `decimals` decimals (trailing zeros dropped): `6.99 cm`, `7 cm`. */
export function formatCentimetres(inches: number, decimals = 2, withUnit = true): string {
  assertFinite(inches, 'length');
  const cm = inches * CM_PER_INCH;
  let text = cm.toFixed(Math.max(0, Math.min(4, Math.floor(decimals))));
  if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '');
  if (/^-0$/.test(text)) text = '0';
  return withUnit ? `${text} cm` : text;
}

/** Options for {@link formatLength}. */
export interface FormatLengthOptions extends FormatInchesOptions {
  /** Decimals for centimetres. Default 2. */
  decimals?: number;
}

/** Writes a length in the user's display unit: {@link formatInches} or {@link formatCentimetres}. */
export function formatLength(inches: number, unit: DisplayUnit, options: FormatLengthOptions = {}): string {
  if (unit === 'cm') return formatCentimetres(inches, options.decimals ?? 2, options.withUnit ?? true);
  return formatInches(inches, options);
}
