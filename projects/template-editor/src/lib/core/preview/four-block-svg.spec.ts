import { describe, expect, it } from 'vitest';
import { createSVGWindow } from 'svgdom';
import { readPatternDocument } from '@seamwright/piecing';
import { renderFourBlockSvg } from './four-block-svg';

/** A 6 in. square block drawn at (1, 1) on a 10 × 9 in. drawing area, cut on one diagonal: Plum above, Sand below. */
function block() {
  return readPatternDocument({
    formatVersion: 1,
    title: 'Half square',
    canvas: { widthIn: 10, heightIn: 9 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
      { id: 'sand', name: 'Sand', colour: '#e8dcc0' },
    ],
    colourways: [{ id: 'night', name: 'Night', fabrics: { plum: { name: 'Navy', colour: '#1d3557' } } }],
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: 7, y: 1 }, { x: 7, y: 7 }, { x: 1, y: 7 }] },
        seams: [{ id: 'm1', a: { x: 1, y: 1 }, b: { x: 7, y: 7 } }],
        patches: [
          { number: 1, anchor: { x: 5, y: 3 }, fabricId: 'plum' },
          { number: 2, anchor: { x: 3, y: 5 }, fabricId: 'sand' },
        ],
      },
    ],
  });
}

function parse(svg: string) {
  const window = createSVGWindow();
  const doc = window.document;
  doc.documentElement.innerHTML = svg;
  return (doc.documentElement.querySelector('svg') ?? doc.documentElement) as unknown as Element;
}

describe('renderFourBlockSvg', () => {
  it('lays four copies of the block 2 × 2, each cropped to the block, not the drawing area', () => {
    const root = parse(renderFourBlockSvg(block()));
    // Two 6 in. blocks each way: 12 × 12 in., whatever the 10 × 9 in. drawing area.
    expect(root.getAttribute('viewBox')).toBe('0 0 12 12');
    expect(root.getAttribute('width')).toBe('12in');
    const copies = [...root.children].filter((c) => c.tagName.toLowerCase() === 'svg');
    expect(copies.map((c) => [c.getAttribute('x'), c.getAttribute('y'), c.getAttribute('width'), c.getAttribute('height')])).toEqual([
      ['0', '0', '6', '6'],
      ['6', '0', '6', '6'],
      ['0', '6', '6', '6'],
      ['6', '6', '6', '6'],
    ]);
    // Each copy shows the block's own square (from its top-left corner at 1, 1), so the copies meet edge to edge.
    expect(new Set(copies.map((c) => c.getAttribute('viewBox')))).toEqual(new Set(['1 1 6 6']));
    expect(root.querySelectorAll('path[data-patch]').length).toBe(8);
  });

  it('draws in the fabrics it is given (a colourway applied first)', async () => {
    const { applyColourway } = await import('@seamwright/piecing');
    const own = renderFourBlockSvg(block());
    const night = renderFourBlockSvg(applyColourway(block(), 'night'));
    expect(own.match(/#6b2d5c/g)).toHaveLength(4);
    expect(night.match(/#1d3557/g)).toHaveLength(4);
    expect(night).not.toContain('#6b2d5c');
  });
});
