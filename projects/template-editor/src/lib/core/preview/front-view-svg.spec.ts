import { describe, expect, it } from 'vitest';
import { createSVGWindow } from 'svgdom';
import { readPatternDocument, type Point } from '@seamwright/piecing';
import { renderFrontViewSvg } from './front-view-svg';

function pattern() {
  return readPatternDocument({
    formatVersion: 1,
    title: 'Front <view> & "test"',
    canvas: { widthIn: 24, heightIn: 12.5 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
      { id: 'sand', name: 'Sand', colour: '#e8dcc0' },
    ],
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: 7, y: 1 }, { x: 7, y: 7 }, { x: 1, y: 7 }] },
        seams: [{ id: 'm1', a: { x: 4, y: 1 }, b: { x: 4, y: 7 } }],
        patches: [
          { number: 1, anchor: { x: 2, y: 4 }, fabricId: 'plum' },
          {
            number: 2,
            anchor: { x: 6, y: 4 },
            stripSet: {
              id: 'plum-sand',
              strips: [
                { fabricId: 'sand', finishedWidthIn: 1 },
                { fabricId: 'plum', finishedWidthIn: 2 },
              ],
              axisAngleDeg: 90,
            },
          },
        ],
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

/** Reads the SVG with svgdom's DOM (an independent XML reader). */
function parse(svg: string): Element {
  const window = createSVGWindow();
  const doc = window.document;
  doc.documentElement.innerHTML = svg.replace(/^<\?xml[^>]*>\s*/, '');
  return doc.documentElement.querySelector('svg') ?? doc.documentElement;
}

/** Corners of an `M x y L x y … Z` path. */
function corners(d: string): Point[] {
  return d
    .replace(/^M|Z$/g, '')
    .split('L')
    .map((pair) => {
      const [x, y] = pair.split(' ').map(Number);
      return { x, y };
    });
}

/** Shoelace area (standard mensuration), always positive. */
function area(ring: Point[]): number {
  let twice = 0;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % ring.length];
    twice += p.x * q.y - q.x * p.y;
  }
  return Math.abs(twice) / 2;
}

describe('renderFrontViewSvg', () => {
  it('is as large as the drawing area, in inches, with a viewBox in inches', () => {
    const svg = parse(renderFrontViewSvg(pattern()));
    expect(svg.getAttribute('width')).toBe('24in');
    expect(svg.getAttribute('height')).toBe('12.5in');
    expect(svg.getAttribute('viewBox')).toBe('0 0 24 12.5');
  });

  it('draws one path per patch, at true size, filled with its fabric', () => {
    const svg = parse(renderFrontViewSvg(pattern()));
    const paths = [...svg.querySelectorAll('path')];
    // A: two patches; B: one patch sewn 8 times round the ring.
    expect(paths.map((p) => p.getAttribute('data-patch'))).toEqual(['A1', 'A2', ...Array<string>(8).fill('B1')]);
    const a1 = paths[0];
    expect(a1.getAttribute('fill')).toBe('#6b2d5c');
    // A1 is the 3 × 6 in. left half of the 6 in. square.
    expect(area(corners(a1.getAttribute('d') ?? ''))).toBeCloseTo(18, 9);
    // Each B copy is an annular sector: (θ/2)(R² − r²) = (π/8)(25 − 4) sq in., less the chords' shortfall (≤ 0.002 in. deep).
    for (const b of paths.slice(2)) {
      expect(area(corners(b.getAttribute('d') ?? ''))).toBeCloseTo((Math.PI / 8) * 21, 1);
      expect(b.getAttribute('fill')).toBe('#ffffff');
    }
  });

  it('fills a strip-set patch with its strips, clipped to the patch', () => {
    const svg = parse(renderFrontViewSvg(pattern()));
    const a2 = svg.querySelector('path[data-patch="A2"]');
    expect(a2?.getAttribute('fill')).toBe('none');
    const clipped = svg.querySelector(`g[clip-path="url(#clip-${a2?.getAttribute('id')})"]`);
    expect([...(clipped?.querySelectorAll('polygon') ?? [])].map((p) => p.getAttribute('fill'))).toEqual(['#e8dcc0', '#6b2d5c']);
    expect(svg.querySelector(`clipPath#clip-${a2?.getAttribute('id')} use`)?.getAttribute('href')).toBe(`#${a2?.getAttribute('id')}`);
  });

  it('labels each template patch once, inside it, in ink that reads on its fabric', () => {
    const svg = parse(renderFrontViewSvg(pattern()));
    const texts = [...svg.querySelectorAll('text')];
    expect(texts.map((t) => t.textContent)).toEqual(['A1', 'A2', 'B1']);
    // Plum is dark: light ink. The empty B1 is white: dark ink.
    expect(texts[0].getAttribute('fill')).toBe('#fffdf8');
    // A2's label, at its centre, sits on the plum strip (the wider one, across the middle), not on the
    // sand strip listed first: light ink.
    expect(texts[1].getAttribute('fill')).toBe('#fffdf8');
    expect(texts[2].getAttribute('fill')).toBe('#34312c');
    expect(Number(texts[0].getAttribute('x'))).toBeCloseTo(2.5, 9);
    expect(renderFrontViewSvg(pattern(), { labels: false })).not.toContain('<text');
  });

  it('escapes the title and draws an outline per placed section', () => {
    const text = renderFrontViewSvg(pattern());
    expect(text).toContain('<title>Front &lt;view&gt; &amp; &quot;test&quot;</title>');
    const svg = parse(text);
    expect(svg.querySelectorAll('g[data-section]').length).toBe(9);
    expect(svg.querySelectorAll('g[data-section] > polygon[fill="none"]').length).toBe(9);
  });

  it('draws an empty drawing area as a sheet with nothing on it', () => {
    const svg = parse(renderFrontViewSvg(readPatternDocument({ formatVersion: 1, title: 'Empty', canvas: { widthIn: 10, heightIn: 8 } })));
    expect(svg.querySelectorAll('path').length).toBe(0);
    expect(svg.querySelector('rect')?.getAttribute('width')).toBe('10');
  });
});
