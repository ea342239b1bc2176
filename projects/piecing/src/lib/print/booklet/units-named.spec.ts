import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { UNIT_LABELS_MAX, unitsNamed } from './draw-joining-plan';

/** The rule stated plainly (a regular expression over the whole text), to check the one-pass version against. */
function byExpression(text: string): string {
  return text.replace(/unit (\d+) \(([^()]*)\)/g, (whole, n: string, list: string) => {
    const count = list.split(', ').length;
    return count > UNIT_LABELS_MAX ? `unit ${n} (made in step ${n}, ${count} sections)` : whole;
  });
}

const labels = (n: number) => Array.from({ length: n }, (_, i) => `S${i + 1}`).join(', ');

describe('unitsNamed', () => {
  it('names a unit of more than eight sections by its step and keeps smaller ones listed', () => {
    expect(unitsNamed(`Join unit 3 (${labels(8)}) to unit 12 (${labels(9)})`)).toBe(`Join unit 3 (${labels(8)}) to unit 12 (made in step 12, 9 sections)`);
    expect(unitsNamed(`Press the seam toward unit 499 (${labels(2000)})`)).toBe('Press the seam toward unit 499 (made in step 499, 2000 sections)');
    expect(unitsNamed('Join A to B')).toBe('Join A to B');
  });

  it('leaves a list with a bracket inside it as written', () => {
    const text = `unit 4 (${labels(9)} (ring), ${labels(3)})`;
    expect(unitsNamed(text)).toBe(text);
  });

  it('agrees with the rule stated as a regular expression on any text made of its pieces', () => {
    const piece = fc.constantFrom('unit ', '1', '23', ' (', '(', ')', ', ', ',', ' ', 'A', 'B7', 'unit 5 (', labels(9), labels(8));
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 40 }).map((p) => p.join('')), (text) => {
        expect(unitsNamed(text)).toBe(byExpression(text));
      }),
      { numRuns: 2000 },
    );
  });
});
