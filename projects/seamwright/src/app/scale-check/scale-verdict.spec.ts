import { TRUE_SCALE_TOLERANCE, formatScale, judgeScale } from './scale-verdict';

describe('judgeScale', () => {
  it('calls a 1 in. square measuring 1 in. true', () => {
    expect(judgeScale(1, 1)).toEqual({ kind: 'true', scale: 1 });
  });

  it('calls a 15/16 in. square a shrunk print at 93.75 % and says to turn off fit-to-page', () => {
    const v = judgeScale(15 / 16, 1);
    expect(v.kind).toBe('shrunk');
    expect(v.scale).toBeCloseTo(0.9375, 10);
    expect(formatScale(v.scale)).toBe('93.8 %');
    expect(v.kind !== 'true' && v.advice.join(' ')).toContain('Fit to page');
    expect(v.kind !== 'true' && v.advice.join(' ')).toContain('100 %');
  });

  it('catches a typical fit-to-page shrink of 97 % (common practice, docs/design-notes.md#common-practice: a few per cent)', () => {
    expect(judgeScale(0.97, 1).kind).toBe('shrunk');
  });

  it('puts the edge of the tolerance just inside and just outside', () => {
    expect(judgeScale(1 + TRUE_SCALE_TOLERANCE - 1e-9, 1).kind).toBe('true');
    expect(judgeScale(1 + TRUE_SCALE_TOLERANCE + 1e-6, 1).kind).toBe('enlarged');
    expect(judgeScale(1 - TRUE_SCALE_TOLERANCE - 1e-6, 1).kind).toBe('shrunk');
  });

  it('measures the 2 cm square against 20 / 25.4 in. (1 in. = 25.4 mm exactly)', () => {
    const cmSquareIn = 20 / 25.4;
    expect(judgeScale(2 / 2.54, cmSquareIn).kind).toBe('true');
    // 1.94 cm measured of 2 cm: 97 %.
    const v = judgeScale(1.94 / 2.54, cmSquareIn);
    expect(v.scale).toBeCloseTo(0.97, 10);
    expect(v.kind).toBe('shrunk');
  });

  it('flags numbers no printer makes (the 2 cm square typed as 2 in.)', () => {
    expect(judgeScale(2 * 2.54, 1).kind).toBe('implausible');
    expect(judgeScale(0, 1).kind).toBe('implausible');
  });
});
