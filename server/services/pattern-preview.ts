import { blockPictureMarkup, simplifyClosedRing, type PatternDocument, type Point } from '@seamwright/piecing';

/**
 * Version of {@link patternPreviewSvg}'s drawing. Raise it when the drawing changes: the pattern list
 * draws stored previews of an older version again.
 */
export const PREVIEW_RENDERER_VERSION = 2;

/** Width of a list preview in pixels: twice the 48 px thumbnail, for high-density screens. */
export const PREVIEW_WIDTH_PX = 96;

const EMPTY = '#ffffff';
const PAPER = '#fffdf8';
const COLOUR = /^#[0-9a-fA-F]{6}$/;

/**
 * A small SVG picture of a pattern for the pattern list, drawn from piecing's patches: the drawing area,
 * every patch filled with its fabric (a strip-set patch with its strips), seams and outlines, and each
 * ring-repeat copy as a turned copy of its section (`<use>`). No labels: at thumbnail size they cannot
 * be read.
 *
 * Nothing the user typed reaches the markup: it holds numbers, colours checked against `#rrggbb`
 * (the document schema's own rule, checked again here) and ids it makes itself. It is shown as an
 * `<img>` (a data: URL), where SVG runs no script either way.
 */
export function patternPreviewSvg(document: PatternDocument, widthPx = PREVIEW_WIDTH_PX): string {
  const { widthIn, heightIn } = document.canvas;
  const width = Math.max(1, Math.round(widthPx));
  const height = Math.max(1, Math.round((width * heightIn) / widthIn));
  const pxPerIn = width / widthIn;
  // A tenth of a pixel is the finest step worth writing.
  const decimals = Math.max(0, Math.min(6, Math.ceil(-Math.log10(1 / pxPerIn / 10))));
  const n = (v: number) => String(+v.toFixed(decimals));
  // Arcs are flattened finely for cutting; a picture this small needs a point per half pixel at most.
  const points = (ring: readonly Point[]) =>
    simplifyClosedRing(ring, 0.5 / pxPerIn)
      .map((p) => `${n(p.x)},${n(p.y)}`)
      .join(' ');
  const colours = new Map(document.fabrics.filter((f) => COLOUR.test(f.colour)).map((f) => [f.id, f.colour]));
  const colour = (fabricId: string | null | undefined) => (fabricId && colours.get(fabricId)) || EMPTY;
  const strokeIn = Math.max(0.5, Math.min(1.5, pxPerIn / 30)) / pxPerIn;
  // The block as piecing's picture writer draws it (the Quilt tab and shop pictures use the same).
  const { defs, body } = blockPictureMarkup(document, '', { n, points, colour, seam: n(strokeIn * 0.6), outline: n(strokeIn * 1.4) });
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${n(widthIn)} ${n(heightIn)}">` +
    (defs ? `<defs>${defs}</defs>` : '') +
    `<rect width="${n(widthIn)}" height="${n(heightIn)}" fill="${PAPER}"/>` +
    `${body}</svg>`
  );
}
