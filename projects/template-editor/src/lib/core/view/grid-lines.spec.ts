import { describe, expect, it } from 'vitest';
import { gridLines, gridSteps } from './grid-lines';

describe('board grid', () => {
  it('picks minor lines at least 10 px apart and majors on whole inches or 5 cm', () => {
    // At 100 px/in. ⅛ in. is 12.5 px: minor ⅛ in., major 1 in.
    expect(gridSteps(100, 'in')).toEqual({ minor: 1 / 8, major: 1 });
    // At 20 px/in. ⅛ in. is 2.5 px, ½ in. 10 px.
    expect(gridSteps(20, 'in')).toEqual({ minor: 1 / 2, major: 2 });
    // At 100 px/in. 1 cm is 100/2.54 = 39.4 px (1 in. = 2.54 cm, NIST HB 44): 0.5 cm = 19.7 px.
    expect(gridSteps(100, 'cm')).toEqual({ minor: 0.5, major: 5 });
  });

  it('lays out the visible lines, majors marked, in screen pixels', () => {
    const v = { scale: 100, originX: 0, originY: 0, mirrored: false, mirrorWidthIn: 24 };
    const g = gridLines(v, 200, 100, 'in');
    expect(g.vertical).toHaveLength(17); // 0 … 2 in. every ⅛ in.
    expect(g.vertical.filter((l) => l.major).map((l) => l.px)).toEqual([0, 100, 200]);
    expect(g.horizontal.filter((l) => l.major).map((l) => l.value)).toEqual([0, 1]);
    const cm = gridLines(v, 254, 100, 'cm');
    // 2.54 in. = 6.45 cm wide: majors at 0 and 5 cm, the 5 cm line at 5/2.54 in. = 196.85 px.
    expect(cm.vertical.filter((l) => l.major).map((l) => l.value)).toEqual([0, 5]);
    expect(cm.vertical.find((l) => l.value === 5)!.px).toBeCloseTo((5 / 2.54) * 100, 9);
  });

  it('runs the ruler the other way in the mirrored view', () => {
    const v = { scale: 100, originX: 0, originY: 0, mirrored: true, mirrorWidthIn: 2 };
    const g = gridLines(v, 200, 100, 'in');
    const majors = g.vertical.filter((l) => l.major);
    expect(majors.find((l) => l.value === 0)!.px).toBeCloseTo(200, 9);
    expect(majors.find((l) => l.value === 2)!.px).toBeCloseTo(0, 9);
  });
});
