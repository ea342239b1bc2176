import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../../../../tests/support/random';
import { polygonBounds } from '../../geometry/index';
import { fitBounds, scaledRing } from './diagram';

describe('scaledRing', () => {
  it('plus the fit’s corner gives exactly the points the fit maps, mirrored or not, in every box of one size', () => {
    const random = seededRandom(16);
    const ring = Array.from({ length: 40 }, () => ({ x: 100 * random() - 20, y: 80 * random() + 3 }));
    const bounds = polygonBounds(ring);
    for (const mirrored of [false, true]) {
      const first = fitBounds(bounds, { x: 0.3, y: 0.5, width: 1.5, height: 1.25 }, mirrored);
      const offsets = scaledRing(bounds, first.scale, mirrored, ring);
      for (let k = 0; k < 20; k++) {
        const fit = fitBounds(bounds, { x: 10 * random(), y: 14 * random(), width: 1.5, height: 1.25 }, mirrored);
        expect(fit.scale).toBe(first.scale);
        const placed = offsets.map((o) => ({ x: fit.x0 + o.x, y: fit.y0 + o.y }));
        // toEqual with numbers compares with Object.is: bit for bit, as the PDF bytes need.
        expect(placed).toEqual(ring.map(fit.map));
      }
    }
  });

  it('differs from the fit when scaled for another size of box', () => {
    const ring = [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 2 }];
    const bounds = polygonBounds(ring);
    const small = fitBounds(bounds, { x: 0, y: 0, width: 1, height: 1 });
    const large = fitBounds(bounds, { x: 0, y: 0, width: 2, height: 2 });
    const placed = scaledRing(bounds, small.scale, false, ring).map((o) => ({ x: large.x0 + o.x, y: large.y0 + o.y }));
    expect(placed).not.toEqual(ring.map(large.map));
  });
});
