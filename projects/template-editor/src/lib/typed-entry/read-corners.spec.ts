import { readCorners } from './read-corners';

describe('readCorners', () => {
  it('reads x, y pairs with fractions, mixed numbers, decimals and centimetres', () => {
    expect(readCorners('2, 2; 10 1/2, 2; 10.25, 9¾; 0, -1/4', 'in')).toEqual({
      ok: true,
      points: [{ x: 2, y: 2 }, { x: 10.5, y: 2 }, { x: 10.25, y: 9.75 }, { x: 0, y: -0.25 }],
    });
    // 2.54 cm = 1 in. exactly (international yard and pound agreement, 1959).
    const cm = readCorners('0, 0; 2.54, 0; 2.54, 5.08', 'cm');
    expect(cm.ok && cm.points.map((p) => [+p.x.toFixed(9), +p.y.toFixed(9)])).toEqual([[0, 0], [1, 0], [1, 2]]);
  });

  it('says which corner is wrong', () => {
    expect(readCorners('1, 1; 2, 2', 'in')).toMatchObject({ ok: false, message: expect.stringMatching(/at least three corners/) });
    expect(readCorners('1, 1; 2; 3, 3', 'in')).toMatchObject({ ok: false, message: expect.stringMatching(/^corner 2 /) });
    expect(readCorners('1, 1; 2, 2; 3, x', 'in')).toMatchObject({ ok: false, message: expect.stringMatching(/^corner 3 /) });
  });
});
