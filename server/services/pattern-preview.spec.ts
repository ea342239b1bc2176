import { describe, expect, it } from 'vitest';
import { readPatternDocument } from '@seamwright/piecing';
import { sampleBlock } from '../../tests/fixtures/documents';
import { patternPreviewSvg } from './pattern-preview';

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
