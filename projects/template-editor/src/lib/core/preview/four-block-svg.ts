import { blockDrawingBounds, type PatternDocument } from '@seamwright/piecing';
import { renderFrontViewSvg } from './front-view-svg';

const num = (v: number) => String(+v.toFixed(4));

/**
 * Four copies of the block side by side, 2 × 2, as one SVG file: the front view (no labels) cropped to
 * the block's sewing lines (`blockDrawingBounds`, design §11), so where the copies meet shows the
 * secondary pattern a quilt of this block makes. Plain string output.
 */
export function renderFourBlockSvg(document: PatternDocument): string {
  const b = blockDrawingBounds(document);
  const front = renderFrontViewSvg(document, { labels: false }).replace(/^<\?xml[^>]*>\s*/, '');
  const copy = (col: number, row: number) =>
    front.replace(
      /^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="[^"]*" height="[^"]*" viewBox="[^"]*"/,
      `<svg x="${num(col * b.width)}" y="${num(row * b.height)}" width="${num(b.width)}" height="${num(b.height)}" viewBox="${num(b.x)} ${num(b.y)} ${num(b.width)} ${num(b.height)}" preserveAspectRatio="none"`,
    );
  const w = num(2 * b.width);
  const h = num(2 * b.height);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}in" height="${h}in" viewBox="0 0 ${w} ${h}">`,
    copy(0, 0),
    copy(1, 0),
    copy(0, 1),
    copy(1, 1),
    '</svg>',
    '',
  ].join('\n');
}
