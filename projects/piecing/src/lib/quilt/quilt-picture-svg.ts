/*
 * The picture of a finished quilt as SVG text (design §11, docs/quilt-layout.md): one writer for the app
 * (Quilt tab, colourway cards, SVG and PNG downloads) and the server (shop listings). Framework-free: plain
 * strings from the quilt plan and the block's patches.
 */
import type { PatternDocument, Point, Section } from '../document/pattern-schema';
import { stripSetBands } from '../fabrication/strip-sets/strip-bands';
import { derivePatches, type DerivedPatch } from '../geometry/derive-patches';
import { ringRepeatTransforms } from '../geometry/ring-repeat';
import { flattenSectionOutline } from '../geometry/section-outline';
import { simplifyClosedRing } from '../geometry/simplify-ring';
import { applyColourway } from './colourway';
import { quiltPlan } from './quilt-plan';
import type { AffineTransform, QuiltPlan } from './quilt-types';

/** Options of {@link quiltPictureSvg}. */
export interface QuiltPictureSvgOptions {
  /** The plan to draw; without one it is worked out for `sizeName` and `colourwayId`. */
  plan?: QuiltPlan | null;
  /** A named size (when no plan is given). */
  sizeName?: string | null;
  /** The colourway to draw in; default the plan's. Missing or null with no plan colourway: the document's fabrics. */
  colourwayId?: string | null;
  /** Makes the ids inside this picture unique on a page that shows several pictures. Default `q-`. */
  idPrefix?: string;
  /** A block position to outline (the one the designer is changing). */
  selected?: { row: number; col: number } | null;
  /**
   * Width in pixels, for a small picture (a shop listing): `width`/`height` in pixels and lines kept at least a
   * fraction of a pixel. Without it the picture is at true size in inches, with an XML declaration (a file).
   */
  widthPx?: number;
}

const INK = '#34312c';
const EMPTY = '#ffffff';
const SELECTED = '#d81b60';
const COLOUR = /^#[0-9a-fA-F]{6}$/;
/** The binding as it shows from the front (a 2½ in. strip folded double shows about ⅜ in.; common practice). */
const BINDING_SHOWS_IN = 0.375;
/** Seam lines between setting pieces, in inches. */
const SETTING_SEAM_IN = 0.03;
/** Block lines in the block's drawing units (inches as drafted): seams hairline, section outlines heavier. */
const BLOCK_SEAM_IN = 0.015;
const BLOCK_OUTLINE_IN = 0.035;

function escapeXml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] ?? c);
}

/**
 * The finished quilt as SVG text: the quilt top's ground, borders, sashing and cornerstones (straight or on
 * point), setting triangles, every block as drafted (drawn once, placed per cell with the plan's transform, so
 * turned and mirrored per cell; plain blocks as squares of their fabric), the binding edge, and a `<title>`
 * naming the quilt and its size. Each block position is a `<g data-row data-col>` so a pointer can pick it;
 * setting parts carry `data-part`. Only numbers, colours checked against `#rrggbb` and ids made here reach
 * the markup (the title is escaped), so the text can be shown inline or as an `<img>`.
 */
export function quiltPictureSvg(document: PatternDocument, options: QuiltPictureSvgOptions = {}): string {
  const plan = options.plan ?? quiltPlan(document, { sizeName: options.sizeName, colourwayId: options.colourwayId });
  const colourwayId = options.colourwayId !== undefined ? options.colourwayId : plan.colourwayId;
  const doc = applyColourway(document, colourwayId);
  const prefix = options.idPrefix ?? 'q-';
  const colours = new Map(doc.fabrics.filter((f) => COLOUR.test(f.colour)).map((f) => [f.id, f.colour]));
  const colour = (id: string | null | undefined) => (id && colours.get(id)) || EMPTY;
  const { width: W, height: H } = plan.finishedSizeIn;
  const b = plan.blockBoundsIn;

  const px = options.widthPx !== undefined ? Math.max(1, Math.round(options.widthPx)) : null;
  const pxPerIn = px !== null && W > 0 ? px / W : null;
  // Numbers: a tenth of a pixel is the finest step worth writing in a small picture; 4 places at true size.
  const places = pxPerIn ? Math.max(2, Math.min(6, Math.ceil(Math.log10(pxPerIn * 10)))) : 4;
  const n = (v: number) => String(+v.toFixed(places));
  const points = (ring: readonly Point[]) => ring.map((p) => `${n(p.x)},${n(p.y)}`).join(' ');
  const matrix = (t: AffineTransform) => `matrix(${t.map(n).join(' ')})`;

  // The block's drawing units per quilt inch, and the finest line worth drawing in them.
  const first = plan.cells.find((c) => !c.alternate) ?? plan.cells[0];
  const blockScale = first ? Math.hypot(first.transform[0], first.transform[1]) || 1 : 1;
  const pxPerBlockUnit = pxPerIn ? pxPerIn * blockScale : null;
  const atLeastPx = (inches: number, pxMin: number, pxPerUnit: number | null) => (pxPerUnit ? Math.max(inches, pxMin / pxPerUnit) : inches);
  const settingSeam = n(atLeastPx(SETTING_SEAM_IN, 0.6, pxPerIn));
  const block = blockPictureMarkup(doc, `${prefix}`, {
    n,
    points: pxPerBlockUnit ? (ring) => points(simplifyClosedRing(ring, 0.5 / pxPerBlockUnit)) : points,
    colour,
    seam: n(atLeastPx(BLOCK_SEAM_IN, 0.3, pxPerBlockUnit)),
    outline: n(atLeastPx(BLOCK_OUTLINE_IN, 0.7, pxPerBlockUnit)),
  });
  const blockId = `${prefix}b`;
  const box = `x="${n(b.x)}" y="${n(b.y)}" width="${n(b.width)}" height="${n(b.height)}"`;
  const seamAttrs = `stroke="${INK}" stroke-width="${settingSeam}"`;
  const parts: string[] = [];

  // Everything under the blocks: the quilt top's ground, then borders, sashing and setting triangles.
  parts.push(`<rect width="${n(W)}" height="${n(H)}" fill="${colour(plan.sashing?.fabricId ?? plan.settingTriangles?.fabricId)}"/>`);
  const rect = (part: string, r: { xIn: number; yIn: number; widthIn: number; heightIn: number; fabricId: string | null }) =>
    `<rect data-part="${part}" x="${n(r.xIn)}" y="${n(r.yIn)}" width="${n(r.widthIn)}" height="${n(r.heightIn)}" fill="${colour(r.fabricId)}" ${seamAttrs}/>`;
  for (const r of plan.borderRects) parts.push(rect('border', r));
  for (const r of plan.sashingRects) parts.push(rect('sashing', r));
  for (const p of plan.sashingPolygons) parts.push(`<polygon data-part="sashing" points="${points(p.points)}" fill="${colour(p.fabricId)}" ${seamAttrs}/>`);
  for (const p of plan.settingTrianglePolygons) parts.push(`<polygon data-part="setting-triangle" points="${points(p.points)}" fill="${colour(p.fabricId)}" ${seamAttrs}/>`);

  const alternateFill = colour(document.quilt?.alternateFabricId);
  let selectedOutline = '';
  for (const cell of plan.cells) {
    const t = matrix(cell.transform);
    const content = cell.alternate ? `<rect ${box} fill="${alternateFill}" ${seamAttrs}/>` : `<use href="#${blockId}"/>`;
    parts.push(`<g data-row="${cell.row}" data-col="${cell.col}" transform="${t}">${content}</g>`);
    if (options.selected && options.selected.row === cell.row && options.selected.col === cell.col) {
      selectedOutline = `<g transform="${t}"><rect ${box} fill="none" stroke="${SELECTED}" stroke-width="4" vector-effect="non-scaling-stroke" stroke-dasharray="8 4"/></g>`;
    }
  }

  // The binding wraps the outer edge; from the front a narrow band of it shows all round.
  const binding = atLeastPx(BINDING_SHOWS_IN, 2, pxPerIn);
  const inset = binding / 2;
  parts.push(
    `<rect data-part="binding" x="${n(inset)}" y="${n(inset)}" width="${n(W - 2 * inset)}" height="${n(H - 2 * inset)}" fill="none" stroke="${colour(plan.binding.fabricId)}" stroke-width="${n(binding)}"/>`,
    `<rect width="${n(W)}" height="${n(H)}" fill="none" ${seamAttrs}/>`,
  );
  if (selectedOutline) parts.push(selectedOutline);

  const colourway = colourwayId ? document.colourways?.find((c) => c.id === colourwayId)?.name : undefined;
  const inches = (v: number) => String(+v.toFixed(2));
  const title = escapeXml(`${plan.title}: quilt ${inches(W)} × ${inches(H)} in.${colourway ? `, ${colourway}` : ''}`);
  const description = escapeXml(
    `${plan.setting === 'on-point' ? 'On point' : 'Straight'} setting, ${plan.columns} × ${plan.rows}, ${plan.blockCount} blocks${plan.sashing ? ', sashing' : ''}, ${plan.borders.length} borders`,
  );
  const size = px !== null ? `width="${px}" height="${Math.max(1, Math.round((px * H) / W))}"` : `width="${n(W)}in" height="${n(H)}in"`;
  return [
    px === null ? '<?xml version="1.0" encoding="UTF-8"?>\n' : '',
    `<svg xmlns="http://www.w3.org/2000/svg" ${size} viewBox="0 0 ${n(W)} ${n(H)}" role="img" aria-label="${title}">`,
    `<title>${title}</title><desc>${description}</desc>`,
    `<defs>${block.defs}<g id="${blockId}"><rect ${box} fill="${EMPTY}"/>${block.body}</g></defs>`,
    parts.join(''),
    '</svg>',
    px === null ? '\n' : '',
  ].join('');
}

/** How a block picture writes numbers, points and colours, and its two stroke widths (see {@link blockPictureMarkup}). */
export interface BlockWriter {
  n: (v: number) => string;
  points: (ring: readonly Point[]) => string;
  colour: (fabricId: string | null | undefined) => string;
  seam: string;
  outline: string;
}

/**
 * The block as drafted, seen from the front, in the document's own coordinates: every patch filled with its
 * fabric (a strip-set patch with its strips, clipped to it), seams, section outlines, and each ring-repeat copy
 * as a turned copy of its section. Ids start with `prefix`.
 */
export function blockPictureMarkup(document: PatternDocument, prefix: string, w: BlockWriter): { defs: string; body: string } {
  const defs: string[] = [];
  const body: string[] = [];
  document.sections.forEach((section, s) => {
    const id = `${prefix}s${s}`;
    const drawn = sectionMarkup(section, id, w);
    if (!drawn) return;
    defs.push(drawn.clips);
    const copies = ringRepeatTransforms(section);
    if (copies.length === 1) {
      body.push(drawn.group);
      return;
    }
    defs.push(drawn.group.replace('<g ', `<g id="${id}" `));
    for (const t of copies) {
      const turn = t.index === 0 ? '' : ` transform="rotate(${w.n(t.angleDeg)} ${w.n(t.centre.x)} ${w.n(t.centre.y)})"`;
      body.push(`<use href="#${id}"${turn}/>`);
    }
  });
  return { defs: defs.join(''), body: body.join('') };
}

function sectionMarkup(section: Section, id: string, w: BlockWriter): { group: string; clips: string } | null {
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
  patches.forEach((p, i) => {
    const bands = p.stripSet ? stripSetBands(p.polygon, p.stripSet) : [];
    if (bands.length > 0) {
      const clipId = `${id}c${i}`;
      clips.push(`<clipPath id="${clipId}"><polygon points="${w.points(p.polygon)}"/></clipPath>`);
      parts.push(
        `<g clip-path="url(#${clipId})" stroke="none">${bands.map((band) => `<polygon points="${w.points(band.polygon)}" fill="${w.colour(band.fabricId)}"/>`).join('')}</g>`,
        `<polygon points="${w.points(p.polygon)}" fill="none"/>`,
      );
    } else {
      parts.push(`<polygon points="${w.points(p.polygon)}" fill="${w.colour(p.fabricId)}"/>`);
    }
  });
  if (outline.length > 2) parts.push(`<polygon points="${w.points(outline)}" fill="none" stroke-width="${w.outline}"/>`);
  return { group: `<g stroke="${INK}" stroke-width="${w.seam}" stroke-linejoin="round">${parts.join('')}</g>`, clips: clips.join('') };
}
