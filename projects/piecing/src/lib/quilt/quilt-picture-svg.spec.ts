import { describe, expect, it } from 'vitest';
import { sampleBlock } from '../../../../../tests/fixtures/documents';
import { readPatternDocument } from '../document/parse-pattern';
import type { PatternDocument, QuiltLayoutInput } from '../document/pattern-schema';
import { quiltPictureSvg } from './quilt-picture-svg';
import { quiltPlan } from './quilt-plan';

/** The 4 in. sample block (Plum above the diagonal, Oat below) set into `quilt`, with Sage and Ink for the setting and a colourway Dusk. */
function doc(quilt: QuiltLayoutInput, title = 'Quilt test'): PatternDocument {
  const base = sampleBlock(title, 4);
  return readPatternDocument({
    ...base,
    fabrics: [...base.fabrics, { id: 'sage', name: 'Sage', colour: '#9aae8c' }, { id: 'ink', name: 'Ink', colour: '#262b3d' }],
    colourways: [{ id: 'dusk', name: 'Dusk', fabrics: { plum: { name: 'Midnight', colour: '#1b1f3a' } } }],
    quilt,
  });
}

const count = (svg: string, re: RegExp) => svg.match(re)?.length ?? 0;

describe('quiltPictureSvg', () => {
  const turned = doc({
    columns: 2,
    rows: 1,
    cells: [
      { row: 0, col: 0, mirrored: true },
      { row: 0, col: 1, rotateDeg: 90 },
    ],
    binding: { fabricId: 'ink' },
  });

  it('places the block once per cell, mirrored or turned with the cell transform', () => {
    const svg = quiltPictureSvg(turned);
    expect(count(svg, /<g data-row="\d+" data-col="\d+"/g)).toBe(2);
    expect(count(svg, /<use href="#q-b"\/>/g)).toBe(2);
    // Plane geometry: the 4 in. block drawn 0…4 each way. Mirrored left to right about its centre (2, 2):
    // x' = −x + 4, y' = y. Turned a quarter clockwise on screen (y down) and centred on (6, 2): x' = −y + 8, y' = x.
    expect(svg).toContain('<g data-row="0" data-col="0" transform="matrix(-1 0 0 1 4 0)">');
    expect(svg).toContain('<g data-row="0" data-col="1" transform="matrix(0 1 -1 0 8 0)">');
    // True size in inches, a file: 2 blocks of 4 in. across, one down.
    expect(svg.startsWith('<?xml')).toBe(true);
    expect(svg).toContain('width="8in" height="4in" viewBox="0 0 8 4"');
    expect(svg).toContain('<title>Quilt test: quilt 8 × 4 in.</title>');
  });

  it('draws in the colourway asked for: its colours, not the slot it replaces', () => {
    const own = quiltPictureSvg(turned);
    expect(own).toContain('fill="#6b2d5c"');
    expect(own).not.toContain('#1b1f3a');
    const dusk = quiltPictureSvg(turned, { colourwayId: 'dusk' });
    expect(dusk).toContain('fill="#1b1f3a"');
    expect(dusk).not.toContain('#6b2d5c');
    // Oat is not in the colourway: it keeps its own colour; the binding is Ink.
    expect(dusk).toContain('fill="#e8dcc0"');
    expect(dusk).toMatch(/data-part="binding"[^>]*stroke="#262b3d"/);
    expect(dusk).toContain('<title>Quilt test: quilt 8 × 4 in., Dusk</title>');
    // A plan made in Dusk draws in Dusk unless told otherwise; colourwayId null draws the document as given.
    const plan = quiltPlan(turned, { colourwayId: 'dusk' });
    expect(quiltPictureSvg(turned, { plan })).toContain('#1b1f3a');
    expect(quiltPictureSvg(turned, { plan, colourwayId: null })).not.toContain('#1b1f3a');
  });

  it('draws on-point sashing, cornerstones and setting triangles, and a small picture in pixels', () => {
    const onPoint = doc({
      setting: 'on-point',
      columns: 2,
      rows: 2,
      settingTrianglesFabricId: 'sage',
      sashing: { widthIn: 1, fabricId: 'sage', cornerstoneFabricId: 'ink' },
      borders: [{ widthIn: 1, fabricId: 'ink' }],
    });
    const plan = quiltPlan(onPoint);
    const svg = quiltPictureSvg(onPoint, { plan, widthPx: 200, idPrefix: 'q' });
    // docs/quilt-layout.md: 2 × 2 on point is 5 blocks, 4·2·2 = 16 strips and 2·2·2 + 2 + 2 = 12 cornerstones;
    // 2·1 + 2·1 = 4 side and 4 corner triangles; 4 border rectangles.
    expect(count(svg, /<use href="#qb"\/>/g)).toBe(5);
    expect(count(svg, /data-part="sashing"/g)).toBe(16 + 12);
    expect(count(svg, /data-part="setting-triangle"/g)).toBe(8);
    expect(count(svg, /data-part="border"/g)).toBe(4);
    // A square quilt: 200 × 200 px, no XML declaration (shown as an <img>).
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="200" height="200" /);
    expect(svg).toContain('role="img"');
  });

  it('escapes the title and writes only checked colours', () => {
    const svg = quiltPictureSvg(doc({ columns: 1, rows: 1 }, 'Stars & <Stripes>'));
    expect(svg).toContain('<title>Stars &amp; &lt;Stripes&gt;: quilt 4 × 4 in.</title>');
    expect(svg).not.toContain('<Stripes>');
  });
});
