import { PNG_MAX_AREA_PX, PNG_MAX_SIDE_PX, pngSize } from './rasterise-svg';

describe('pngSize', () => {
  it('draws 96 pixels per inch when the picture fits', () => {
    expect(pngSize(12, 10)).toEqual({ widthPx: 1152, heightPx: 960, pxPerIn: 96 });
  });

  it('scales a long drawing down to the largest side', () => {
    const s = pngSize(200, 20);
    expect(s.widthPx).toBe(PNG_MAX_SIDE_PX);
    expect(s.pxPerIn).toBeCloseTo(PNG_MAX_SIDE_PX / 200, 9);
    expect(s.heightPx).toBe(Math.floor(20 * s.pxPerIn));
  });

  it('scales a large square drawing down to the largest area, keeping its proportions', () => {
    const s = pngSize(90, 72);
    expect(s.widthPx * s.heightPx).toBeLessThanOrEqual(PNG_MAX_AREA_PX);
    expect(s.widthPx * s.heightPx).toBeGreaterThan(PNG_MAX_AREA_PX * 0.99);
    expect(s.widthPx / s.heightPx).toBeCloseTo(90 / 72, 2);
  });
});
