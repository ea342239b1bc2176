import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatCentimetres, formatInches, formatLength, roundToFraction } from './format-length';
import { toInches, UnitInputError } from './length-units';
import { parseLength } from './parse-length';

const inches = (text: string, unit: Parameters<typeof parseLength>[1] = 'in') => {
  const r = parseLength(text, unit);
  if (!r.ok) throw new Error(`expected "${text}" to parse: ${r.message}`);
  return r.inches;
};
const message = (text: string) => {
  const r = parseLength(text);
  if (r.ok) throw new Error(`expected "${text}" to be rejected`);
  return r.message;
};

describe('parseLength', () => {
  it('reads inches as quilters write them', () => {
    for (const text of ['2 3/4', '2¾', '2 ¾', '2.75', '2-3/4"', '2 3/4 in', '2 3/4 in.', '2 3/4 inches', '2.75"', '2¾″', '  2 3/4  ', '2-¾', '2 ³⁄₄', '2³⁄₄', '2 3⁄4"', '2,75']) {
      expect(inches(text)).toBe(2.75);
    }
    expect(inches('¾')).toBe(0.75);
    expect(inches('3/8"')).toBe(0.375);
    expect(inches('.25')).toBe(0.25);
    expect(inches('2 5/16')).toBe(2.3125);
    expect(inches('2 ⁵⁄₁₆ in.')).toBe(2.3125);
    expect(inches('7')).toBe(7);
    expect(inches('-1/4')).toBe(-0.25);
    expect(inches('−⅛')).toBe(-0.125);
  });

  it('reads centimetres, millimetres and yards (1 in. = 2.54 cm, 1 yd = 36 in. exactly: NIST HB 44)', () => {
    expect(inches('7 cm')).toBeCloseTo(7 / 2.54, 14);
    expect(inches('0.75cm')).toBeCloseTo(0.75 / 2.54, 14);
    expect(inches('0,75 cm')).toBeCloseTo(0.75 / 2.54, 14);
    expect(inches('7.5 mm')).toBeCloseTo(0.75 / 2.54, 14);
    expect(inches('25.4 mm')).toBeCloseTo(1, 14);
    expect(inches('1 1/2 yd')).toBe(54);
    expect(inches('1/8 yd')).toBe(4.5); // an eighth of a yard is 4½ in. (common practice: yardage in ⅛ yd steps)
    // A bare number takes the default unit.
    expect(inches('7', 'cm')).toBeCloseTo(7 / 2.54, 14);
    expect(inches('2 in', 'cm')).toBe(2);
  });

  it('explains nonsense clearly', () => {
    expect(message('')).toMatch(/^enter a length/);
    expect(message('abc')).toBe('"abc" is not a length; write it like 2 3/4 in., 2¾", 2.75 or 7 cm');
    expect(message('cm')).toMatch(/has a unit but no number/);
    expect(message('3/0')).toBe('a fraction cannot have 0 below the line');
    expect(message('2 5/4')).toBe('in 2 5/4 the fraction should be less than 1 (3.25 in all?)');
    expect(message('2 furlongs')).toBe('unknown unit "furlongs"; use in. ("), cm or mm');
    expect(message('2 3')).toMatch(/more than one number/);
    expect(message('99999 in')).toMatch(/too long/);
    expect(message('1e400')).toMatch(/unknown unit|not a length/);
  });

  it('property: never throws, whatever the text', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.string({ unit: 'grapheme' }), fc.stringMatching(/^[-\d ./¾⅜⁵⁄₁₆"a-z,]{0,12}$/)), (text) => {
        const r = parseLength(text);
        if (r.ok) expect(Number.isFinite(r.inches)).toBe(true);
        else expect(r.message.length).toBeGreaterThan(0);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('formatInches', () => {
  it('writes whole inches, a space, the reduced fraction and " in."', () => {
    expect(formatInches(2.75)).toBe('2 3/4 in.');
    expect(formatInches(0.375)).toBe('3/8 in.');
    expect(formatInches(3)).toBe('3 in.');
    expect(formatInches(0)).toBe('0 in.');
    expect(formatInches(-0.25)).toBe('-1/4 in.');
    expect(formatInches(2.75, { style: 'unicode' })).toBe('2 ¾ in.');
    expect(formatInches(2.3125, { denominator: 16, style: 'unicode' })).toBe('2 ⁵⁄₁₆ in.');
    expect(formatInches(2.3125, { denominator: 16 })).toBe('2 5/16 in.');
    expect(formatInches(0.875, { withUnit: false })).toBe('7/8');
  });

  it('rounds to the nearest eighth or sixteenth, halves away from zero', () => {
    expect(formatInches(2.3125)).toBe('2 3/8 in.'); // 2 5/16 is half-way: up
    expect(formatInches(2.31)).toBe('2 1/4 in.');
    expect(formatInches(2.9999)).toBe('3 in.');
    expect(formatInches(-0.01)).toBe('0 in.'); // no "-0"
    expect(formatInches(1 / 2.54, { denominator: 16 })).toBe('3/8 in.'); // 1 cm = 0.3937 in., nearest 1/16 is 6/16
    expect(roundToFraction(0.3, 16)).toEqual({ negative: false, whole: 0, numerator: 5, denominator: 16, inches: 0.3125 });
  });

  it('rejects values it cannot write', () => {
    expect(() => formatInches(Number.NaN)).toThrow(UnitInputError);
    expect(() => formatInches(Infinity)).toThrow(/finite/);
    expect(() => formatInches(1, { denominator: 3 as 8 })).toThrow(/denominator/);
  });

  it('round-trips every sixteenth from -4 to 100 in., in both styles', () => {
    for (let k = -64; k <= 1600; k++) {
      const value = k / 16;
      expect(inches(formatInches(value, { denominator: 16 }))).toBe(value);
      expect(inches(formatInches(value, { denominator: 16, style: 'unicode' }))).toBe(value);
      if (k % 2 === 0) expect(inches(formatInches(value))).toBe(value);
    }
  });

  it('property: format then parse lands within half a step of the value', () => {
    fc.assert(
      fc.property(fc.double({ min: -500, max: 500, noNaN: true }), fc.constantFrom(8, 16) as fc.Arbitrary<8 | 16>, (value, denominator) => {
        const back = inches(formatInches(value, { denominator }));
        expect(Math.abs(back - value)).toBeLessThanOrEqual(0.5 / denominator + 1e-9);
      }),
    );
  });
});

describe('centimetres', () => {
  it('writes centimetres with up to two decimals', () => {
    expect(formatCentimetres(0.25)).toBe('0.64 cm'); // ¼ in. = 0.635 cm
    expect(formatCentimetres(toInches(7, 'cm'))).toBe('7 cm');
    expect(formatLength(toInches(0.75, 'cm'), 'cm')).toBe('0.75 cm');
    expect(formatLength(2.75, 'in')).toBe('2 3/4 in.');
    expect(formatLength(1, 'cm', { decimals: 1 })).toBe('2.5 cm');
  });

  it('round-trips centimetres to within the last decimal', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 300, noNaN: true }), (value) => {
        const back = inches(formatCentimetres(value));
        expect(Math.abs(back - value) * 2.54).toBeLessThanOrEqual(0.005 + 1e-9);
      }),
    );
  });
});
