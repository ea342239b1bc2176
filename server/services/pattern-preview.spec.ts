import { describe, expect, it } from 'vitest';
import { readPatternDocument, type Point } from '@seamwright/piecing';
import { sampleBlock } from '../../tests/fixtures/documents';
import { patternPreviewSvg, simplifyRing } from './pattern-preview';

describe('simplifyRing', () => {
  const circle = (n: number, r: number): Point[] => Array.from({ length: n }, (_, i) => ({ x: r * Math.cos((2 * Math.PI * i) / n), y: r * Math.sin((2 * Math.PI * i) / n) }));

  it('keeps a chord per step the sagitta allows: r (1 − cos(θ/2)) ≤ tolerance', () => {
    // A circle of radius 10 in 3600 points, to within 0.05: the sagitta r(1 − cos(θ/2)) of a chord
    // spanning θ stays under 0.05 for θ ≤ 2·acos(0.995) ≈ 0.2 rad, so at least 2π/0.2 ≈ 31 chords.
    const kept = simplifyRing(circle(3600, 10), 0.05);
    expect(kept.length).toBeGreaterThanOrEqual(32);
    expect(kept.length).toBeLessThanOrEqual(64);
    // Every kept point is a point of the ring, in ring order.
    expect(kept[0]).toEqual({ x: 10, y: 0 });
  });

  it('leaves a square and a triangle whole and drops points on a straight edge', () => {
    const square = [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }];
    expect(simplifyRing(square, 0.01)).toEqual([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }]);
    const triangle = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }];
    expect(simplifyRing(triangle, 5)).toEqual(triangle);
  });
});

describe('patternPreviewSvg', () => {
  it('scales the drawing area to the width asked, keeping its proportions', () => {
    const doc = readPatternDocument({ ...sampleBlock('Wide'), canvas: { widthIn: 12, heightIn: 4 } });
    expect(patternPreviewSvg(doc, 96)).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="96" height="32" viewBox="0 0 12 4">/);
  });

  it('draws a patch whose fabric colour is not #rrggbb in white, writing nothing of the colour', () => {
    const doc = readPatternDocument(sampleBlock('Colours'));
    doc.fabrics[0].colour = 'red" onload="alert(1)';
    const svg = patternPreviewSvg(doc);
    expect(svg).not.toContain('onload');
    expect([...svg.matchAll(/fill="([^"]+)"/g)].map((m) => m[1])).toEqual(['#fffdf8', '#ffffff', '#e8dcc0', 'none']);
  });
});
