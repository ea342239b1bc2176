import {
  derivePatches,
  flattenSectionOutline,
  stripSetBands,
  ringRepeatTransforms,
  simplifyClosedRing,
  type DerivedPatch,
  type PatternDocument,
  type Point,
  type Section,
} from '@seamwright/piecing';

/**
 * Version of {@link patternPreviewSvg}'s drawing. Raise it when the drawing changes: the pattern list
 * draws stored previews of an older version again.
 */
export const PREVIEW_RENDERER_VERSION = 1;

/** Width of a list preview in pixels: twice the 48 px thumbnail, for high-density screens. */
export const PREVIEW_WIDTH_PX = 96;

const INK = '#34312c';
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
  const colour = (fabricId: string | undefined) => (fabricId !== undefined && colours.get(fabricId)) || EMPTY;
  const strokeIn = Math.max(0.5, Math.min(1.5, pxPerIn / 30)) / pxPerIn;

  const defs: string[] = [];
  const body: string[] = [];
  document.sections.forEach((section, s) => {
    const drawn = sectionMarkup(section, `s${s}`, { n, points, colour, strokeIn });
    if (!drawn) return;
    const transforms = ringRepeatTransforms(section);
    if (transforms.length === 1) {
      body.push(drawn.clips, drawn.group);
      return;
    }
    defs.push(drawn.clips, drawn.group.replace('<g ', `<g id="s${s}" `));
    for (const t of transforms) {
      const turn = t.index === 0 ? '' : ` transform="rotate(${n(t.angleDeg)} ${n(t.centre.x)} ${n(t.centre.y)})"`;
      body.push(`<use href="#s${s}"${turn}/>`);
    }
  });
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${n(widthIn)} ${n(heightIn)}">` +
    (defs.length ? `<defs>${defs.join('')}</defs>` : '') +
    `<rect width="${n(widthIn)}" height="${n(heightIn)}" fill="${PAPER}"/>` +
    `<g stroke="${INK}" stroke-linejoin="round">${body.join('')}</g></svg>`
  );
}

interface Writer {
  n: (v: number) => string;
  points: (ring: readonly Point[]) => string;
  colour: (fabricId: string | undefined) => string;
  strokeIn: number;
}

/** One section as drawn (copy 0): its patches and outline in a `<g>`, with the clip paths its strips need. */
function sectionMarkup(section: Section, id: string, w: Writer): { group: string; clips: string } | null {
  let outline: Point[];
  try {
    outline = flattenSectionOutline(section.geometry);
  } catch {
    return null;
  }
  let patches: DerivedPatch[] = [];
  try {
    patches = derivePatches(section).patches;
  } catch {
    // A section whose seams cannot be split is drawn as its outline alone.
  }
  const clips: string[] = [];
  const parts: string[] = [];
  const seamWidth = w.n(w.strokeIn * 0.6);
  patches.forEach((p, i) => {
    const fill = w.colour(p.stripSet ? p.stripSet.strips[0]?.fabricId : p.fabricId);
    parts.push(`<polygon points="${w.points(p.polygon)}" fill="${fill}"/>`);
    const bands = p.stripSet ? stripSetBands(p.polygon, p.stripSet) : [];
    if (bands.length > 0) {
      const clipId = `${id}c${i}`;
      clips.push(`<clipPath id="${clipId}"><polygon points="${w.points(p.polygon)}"/></clipPath>`);
      parts.push(
        `<g clip-path="url(#${clipId})" stroke="none">${bands.map((b) => `<polygon points="${w.points(b.polygon)}" fill="${w.colour(b.fabricId)}"/>`).join('')}</g>`,
        `<polygon points="${w.points(p.polygon)}" fill="none"/>`,
      );
    }
  });
  if (outline.length > 2) parts.push(`<polygon points="${w.points(outline)}" fill="none" stroke-width="${w.n(w.strokeIn * 1.4)}"/>`);
  return { group: `<g stroke-width="${seamWidth}">${parts.join('')}</g>`, clips: clips.join('') };
}
