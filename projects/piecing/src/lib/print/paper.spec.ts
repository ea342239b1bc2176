import { describe, expect, it } from 'vitest';
import { PAPER_NAMES, PAPER_SIZES, POINTS_PER_INCH, printableArea, printableAreaSqIn, sheetSizeIn } from './paper';

// Reference sizes, written out from the standards (not from our table):
// ISO 216: A4 = 210 × 297 mm, A3 = 297 × 420 mm; ANSI/ASME Y14.1: Letter 8.5 × 11 in., Tabloid 11 × 17 in.;
// Legal 8.5 × 14 in. (North American practice). 1 in. = 25.4 mm exactly; 1 pt = 1/72 in. (ISO 32000-1 §8.3.2.3).
const REFERENCE_PT: Record<string, [number, number]> = {
  letter: [8.5 * 72, 11 * 72],
  legal: [8.5 * 72, 14 * 72],
  tabloid: [11 * 72, 17 * 72],
  a4: [(210 / 25.4) * 72, (297 / 25.4) * 72],
  a3: [(297 / 25.4) * 72, (420 / 25.4) * 72],
};

describe('paper sizes', () => {
  it.each(PAPER_NAMES)('%s matches its standard size', (name) => {
    const p = PAPER_SIZES[name];
    expect(p.widthIn * POINTS_PER_INCH).toBeCloseTo(REFERENCE_PT[name][0], 9);
    expect(p.heightIn * POINTS_PER_INCH).toBeCloseTo(REFERENCE_PT[name][1], 9);
  });

  it('A4 is 595.276 × 841.890 pt (ISO 216 in points, to the thousandth)', () => {
    expect(PAPER_SIZES.a4.widthIn * 72).toBeCloseTo(595.276, 3);
    expect(PAPER_SIZES.a4.heightIn * 72).toBeCloseTo(841.89, 3);
  });

  it('landscape swaps the sides', () => {
    expect(sheetSizeIn('tabloid', 'landscape')).toEqual({ widthIn: 17, heightIn: 11 });
  });

  it('printable area is the sheet less the margin on every side', () => {
    expect(printableArea('letter', 'portrait', 0.5)).toEqual({ x: 0.5, y: 0.5, width: 7.5, height: 10 });
    expect(printableAreaSqIn('letter', 0.5)).toBeCloseTo(75, 12);
    expect(() => printableArea('letter', 'portrait', 5)).toThrow(/leaves nothing printable/);
  });
});
