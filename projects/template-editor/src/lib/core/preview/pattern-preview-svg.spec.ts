import { describe, expect, it } from 'vitest';
import { createSVGWindow } from 'svgdom';
import { readPatternDocument } from '@seamwright/piecing';
import { renderPatternPreviewSvg } from './pattern-preview-svg';

function pattern() {
  return readPatternDocument({
    formatVersion: 1,
    title: 'Preview <test>',
    canvas: { widthIn: 24, heightIn: 12 },
    fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }],
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: 7, y: 1 }, { x: 7, y: 7 }, { x: 1, y: 7 }] },
        seams: [{ id: 'm1', a: { x: 4, y: 1 }, b: { x: 4, y: 7 } }],
        patches: [{ number: 1, anchor: { x: 2, y: 4 }, fabricId: 'plum' }],
      },
      {
        id: 'b',
        label: 'B',
        geometry: { kind: 'arc', centre: { x: 16, y: 6 }, innerRadiusIn: 2, outerRadiusIn: 5, startAngleDeg: 0, sweepDeg: 45 },
        ringRepeat: { count: 8, centre: { x: 16, y: 6 } },
      },
    ],
  });
}

/** Parses the SVG with svgdom's DOM (an independent XML reader) to count its elements. */
function parse(svg: string) {
  const window = createSVGWindow();
  const doc = window.document;
  doc.documentElement.innerHTML = svg;
  return doc.documentElement;
}

describe('renderPatternPreviewSvg', () => {
  it('draws every patch of every placement with its fabric, in a picture as wide as asked', () => {
    const svg = renderPatternPreviewSvg(pattern(), { widthPx: 480, window: createSVGWindow() });
    expect(svg.startsWith('<svg')).toBe(true);
    const root = parse(svg).querySelector('svg')!;
    expect(root.getAttribute('width')).toBe('480');
    // 24 × 12 in. drawing area at 480 px wide → 240 px high.
    expect(root.getAttribute('height')).toBe('240');
    expect(root.getAttribute('viewBox')).toBe('0 0 24 12');
    // Section A: 2 patches + outline; section B: 8 ring copies × (1 patch + outline).
    expect(root.querySelectorAll('polygon').length).toBe(3 + 8 * 2);
    const fills = [...root.querySelectorAll('polygon')].map((p) => p.getAttribute('fill'));
    expect(fills.filter((f) => f === '#6b2d5c')).toHaveLength(1);
    const texts = [...root.querySelectorAll('text')].map((t) => t.textContent);
    expect(texts.sort()).toEqual(['A1', 'A2', 'B1']);
    expect(svg).toContain('Preview &lt;test&gt;');
  });

  it('mirrors the drawing about the vertical centre of the drawing area', () => {
    const svg = renderPatternPreviewSvg(pattern(), { widthPx: 240, window: createSVGWindow(), labels: true });
    const mirrored = renderPatternPreviewSvg(pattern(), { widthPx: 240, window: createSVGWindow(), labels: true, mirrored: true });
    const x = (s: string) => Number(parse(s).querySelector('text')!.getAttribute('x'));
    expect(x(svg) + x(mirrored)).toBeCloseTo(24, 3);
    expect(mirrored).toContain('matrix(-1,0,0,1,24,0)');
  });

  it('draws a strip-set patch as its strips, clipped to the patch', () => {
    const doc = pattern();
    const withStrips = {
      ...doc,
      fabrics: [...doc.fabrics, { id: 'oat', name: 'Oat', colour: '#e8dcc0', usableWofIn: 42 }],
      sections: [
        {
          ...doc.sections[0],
          patches: [{ number: 1, anchor: { x: 2, y: 4 }, stripSet: { id: 't1', strips: [{ fabricId: 'plum', finishedWidthIn: 2 }, { fabricId: 'oat', finishedWidthIn: 1 }, { fabricId: 'plum', finishedWidthIn: 2 }], axisAngleDeg: 90, offsetIn: 0 } }],
        },
      ],
    };
    const root = parse(renderPatternPreviewSvg(withStrips, { widthPx: 480, window: createSVGWindow() })).querySelector('svg')!;
    expect(root.querySelectorAll('clipPath')).toHaveLength(1);
    const fills = [...root.querySelectorAll('g[clip-path] polygon')].map((p) => p.getAttribute('fill'));
    expect(fills).toEqual(['#6b2d5c', '#e8dcc0', '#6b2d5c']);
  });

  it('refuses a width that is not a positive number', () => {
    expect(() => renderPatternPreviewSvg(pattern(), { widthPx: 0, window: createSVGWindow() })).toThrow(/widthPx/);
  });
});
