import { INCHES_PER_UNIT, toInches, type LengthUnit } from './length-units';

/** Outcome of reading a length typed by a person. */
export type ParsedLength = { ok: true; inches: number; unit: LengthUnit } | { ok: false; message: string };

/** Largest length accepted, in inches (a little over 270 yd: far more than any quilt needs). */
export const MAX_PARSED_INCHES = 10_000;

const VULGAR: Readonly<Record<string, [number, number]>> = {
  '¼': [1, 4], '½': [1, 2], '¾': [3, 4], '⅛': [1, 8], '⅜': [3, 8], '⅝': [5, 8], '⅞': [7, 8],
  '⅓': [1, 3], '⅔': [2, 3], '⅕': [1, 5], '⅖': [2, 5], '⅗': [3, 5], '⅘': [4, 5], '⅙': [1, 6], '⅚': [5, 6],
  '⅐': [1, 7], '⅑': [1, 9], '⅒': [1, 10],
};
const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUBSCRIPT = '₀₁₂₃₄₅₆₇₈₉';

const UNIT_WORDS: ReadonlyArray<[LengthUnit, string[]]> = [
  ['in', ['"', '″', '”', "''", 'in', 'in.', 'inch', 'inches', 'ins']],
  ['cm', ['cm', 'cm.', 'centimetre', 'centimetres', 'centimeter', 'centimeters']],
  ['mm', ['mm', 'mm.', 'millimetre', 'millimetres', 'millimeter', 'millimeters']],
  ['ft', ["'", '′', '’', 'ft', 'ft.', 'foot', 'feet']],
  ['yd', ['yd', 'yd.', 'yds', 'yds.', 'yard', 'yards']],
];

const EXAMPLES = 'write it like 2 3/4 in., 2¾", 2.75 or 7 cm';

function unitOf(word: string): LengthUnit | undefined {
  const w = word.toLowerCase();
  return UNIT_WORDS.find(([, words]) => words.includes(w))?.[0];
}

/** Turns superscript / subscript digits and the fraction slashes into plain `n/d`, so ⁵⁄₁₆ reads as 5/16. */
function normalise(text: string): string {
  let out = '';
  let inSuper = false;
  for (const ch of text) {
    const sup = SUPERSCRIPT.indexOf(ch);
    const sub = SUBSCRIPT.indexOf(ch);
    if (sup >= 0) {
      // A run of superscripts starts a fraction: keep it apart from a whole number before it.
      out += (inSuper ? '' : ' ') + String(sup);
      inSuper = true;
      continue;
    }
    inSuper = false;
    if (sub >= 0) out += String(sub);
    else if (ch === '⁄' || ch === '∕') out += '/';
    else if (ch === '−' || ch === '–') out += '-';
    else if (/\s/.test(ch)) out += ' ';
    else out += ch;
  }
  return out.replace(/ +/g, ' ').trim();
}

const NUMBER_PATTERNS: ReadonlyArray<{ re: RegExp; read: (m: RegExpMatchArray) => { value: number } | { message: string } }> = [
  // Mixed number: 2 3/4, 2-3/4, 2 - 3/4
  {
    re: /^(\d+)(?: ?- ?| )(\d+) ?\/ ?(\d+)/,
    read: (m) => mixed(m[1], Number(m[2]), Number(m[3]), m[0]),
  },
  // Whole number and vulgar fraction: 2¾, 2 ¾, 2-¾
  {
    re: new RegExp(`^(\\d+) ?-? ?([${Object.keys(VULGAR).join('')}])`),
    read: (m) => mixed(m[1], VULGAR[m[2]][0], VULGAR[m[2]][1], m[0]),
  },
  // Fraction alone: 3/4
  { re: /^(\d+) ?\/ ?(\d+)/, read: (m) => fraction(Number(m[1]), Number(m[2])) },
  // Vulgar fraction alone: ¾
  { re: new RegExp(`^([${Object.keys(VULGAR).join('')}])`), read: (m) => ({ value: VULGAR[m[1]][0] / VULGAR[m[1]][1] }) },
  // Decimal, with a point or a comma: 2.75, .75, 0,75
  { re: /^(\d+(?:[.,]\d+)?|[.,]\d+)(?![\d/])/, read: (m) => ({ value: Number(m[1].replace(',', '.')) }) },
];

function fraction(numerator: number, denominator: number): { value: number } | { message: string } {
  if (denominator === 0) return { message: 'a fraction cannot have 0 below the line' };
  return { value: numerator / denominator };
}

function mixed(whole: string, numerator: number, denominator: number, written: string): { value: number } | { message: string } {
  if (denominator === 0) return { message: 'a fraction cannot have 0 below the line' };
  if (numerator >= denominator) {
    const total = Number(whole) + numerator / denominator;
    return { message: `in ${written.trim()} the fraction should be less than 1 (${total} in all?)` };
  }
  return { value: Number(whole) + numerator / denominator };
}

/**
 * Reads a length as quilters write it: `2 3/4`, `2-3/4"`, `2¾`, `2 ¾ in.`, `2.75`, `¾`, `2 ⁵⁄₁₆`,
 * `7 cm`, `0.75cm`, `0,75 cm`, `7.5 mm`, `1 1/2 yd`. A number without a unit is in `defaultUnit`.
 * A leading minus sign is allowed (for offsets); callers check ranges. Never throws: nonsense gets a
 * message saying what is wrong.
 */
export function parseLength(text: string, defaultUnit: LengthUnit = 'in'): ParsedLength {
  if (typeof text !== 'string') return { ok: false, message: 'enter a length as text' };
  if (!(defaultUnit in INCHES_PER_UNIT)) return { ok: false, message: `unknown default unit "${String(defaultUnit)}"` };
  let rest = normalise(text);
  if (rest === '') return { ok: false, message: `enter a length; ${EXAMPLES}` };
  let sign = 1;
  const signMatch = /^([-+]) ?/.exec(rest);
  if (signMatch) {
    sign = signMatch[1] === '-' ? -1 : 1;
    rest = rest.slice(signMatch[0].length);
  }
  let value: number | undefined;
  for (const pattern of NUMBER_PATTERNS) {
    const m = rest.match(pattern.re);
    if (!m) continue;
    const read = pattern.read(m);
    if ('message' in read) return { ok: false, message: read.message };
    value = read.value;
    rest = rest.slice(m[0].length).trim();
    break;
  }
  if (value === undefined) {
    return { ok: false, message: unitOf(rest) ? `"${text.trim()}" has a unit but no number; ${EXAMPLES}` : `"${text.trim()}" is not a length; ${EXAMPLES}` };
  }
  let unit: LengthUnit = defaultUnit;
  if (rest !== '') {
    const found = unitOf(rest);
    if (!found) {
      if (/^[\d./¼½¾⅛⅜⅝⅞]/.test(rest)) return { ok: false, message: `"${text.trim()}" has more than one number; write one length, ${EXAMPLES}` };
      return { ok: false, message: `unknown unit "${rest}"; use in. ("), cm or mm` };
    }
    unit = found;
  }
  const inches = sign * toInches(value, unit);
  if (!Number.isFinite(inches) || Math.abs(inches) > MAX_PARSED_INCHES) return { ok: false, message: `"${text.trim()}" is too long a length (at most ${MAX_PARSED_INCHES} in.)` };
  return { ok: true, inches: inches === 0 ? 0 : inches, unit };
}
