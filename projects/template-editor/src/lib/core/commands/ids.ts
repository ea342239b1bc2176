import type { PatternDocument } from '@seamwright/piecing';

let counter = 0;

/** A new id that fits the document schema (letters, digits, "-"), unique within this page. */
export function newId(prefix: string): string {
  counter = (counter + 1) % 1_000_000;
  const random = Math.floor(Math.random() * 36 ** 4).toString(36).padStart(4, '0');
  return `${prefix}-${Date.now().toString(36)}${counter.toString(36)}${random}`;
}

/** Section letters as quilters write them: 0 → A, 25 → Z, 26 → AA … */
export function sectionLetters(index: number): string {
  let n = index;
  let out = '';
  do {
    out = String.fromCharCode(65 + (n % 26)) + out;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return out;
}

/** The first section label not yet used in the document. */
export function nextSectionLabel(document: PatternDocument, taken: ReadonlySet<string> = new Set()): string {
  const used = new Set(document.sections.map((s) => s.label));
  for (let i = 0; ; i++) {
    const label = sectionLetters(i);
    if (!used.has(label) && !taken.has(label)) return label;
  }
}
