import type { AffineTransform, PatternDocument, QuiltPlan } from '@seamwright/piecing';
import { renderFrontViewSvg } from '@seamwright/template-editor-core';

/** Options of {@link quiltPictureSvg}. */
export interface QuiltPictureOptions {
  /** Makes the ids inside this picture unique on a page that shows several pictures. */
  idPrefix?: string;
  /** A cell to outline (the one the designer is changing), by row and column. */
  selected?: { row: number; col: number } | null;
}

const INK = '#34312c';
const EMPTY = '#ffffff';
const SELECTED = '#d81b60';
/** The binding as it shows from the front (a 2½ in. strip folded double shows about ⅜ in.; common practice). */
const BINDING_SHOWS_IN = 0.375;
/** Seam lines between setting pieces, in inches. */
const SEAM_IN = 0.03;

const num = (v: number) => String(+v.toFixed(4));

function escapeXml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] ?? c);
}

function matrix(t: AffineTransform): string {
  return `matrix(${t.map(num).join(' ')})`;
}

/**
 * The block as drawn (front view, no labels) as the inside of an SVG group in the document's own
 * coordinates: the patch groups of `renderFrontViewSvg`, without its paper and its title. Ids carry
 * `prefix`, so several pictures can share a page.
 */
export function blockGroupSvg(document: PatternDocument, prefix: string): { defs: string; body: string } {
  const lines = renderFrontViewSvg(document, { labels: false }).split('\n');
  const retag = (line: string) => line.replace(/id="(patch-|clip-)/g, `id="${prefix}$1`).replace(/#(patch-|clip-)/g, `#${prefix}$1`);
  const defs = lines.filter((l) => l.startsWith('<defs>')).map((l) => retag(l.slice('<defs>'.length, -'</defs>'.length)));
  const body = lines.filter((l) => l.startsWith('<g data-section')).map(retag);
  return { defs: defs.join(''), body: body.join('') };
}

/**
 * The finished quilt as a stand-alone SVG file, at true size in inches: binding edge, borders, sashing
 * and cornerstones or setting triangles, and every block as drafted (turned and mirrored per cell, or a
 * plain block), from the library's quilt plan. `document` carries the colourway's fabrics (see
 * `applyColourway`). Each block position is a `<g data-row data-col>` so a pointer can pick it.
 * Plain string output: shown inline on the Quilt tab and downloaded as SVG or PNG.
 */
export function quiltPictureSvg(document: PatternDocument, plan: QuiltPlan, options: QuiltPictureOptions = {}): string {
  const prefix = options.idPrefix ?? 'q-';
  const colours = new Map(document.fabrics.map((f) => [f.id, f.colour]));
  const colour = (id: string | null | undefined) => (id && colours.get(id)) || EMPTY;
  const { width: W, height: H } = plan.finishedSizeIn;
  const b = plan.blockBoundsIn;
  const block = blockGroupSvg(document, prefix);
  const blockId = `${prefix}block`;
  const parts: string[] = [];

  // Everything under the blocks: the quilt top's ground, then borders, sashing and setting triangles.
  parts.push(`<rect width="${num(W)}" height="${num(H)}" fill="${colour(plan.sashing?.fabricId ?? plan.settingTriangles?.fabricId)}"/>`);
  for (const r of plan.borderRects) {
    parts.push(`<rect data-part="border" x="${num(r.xIn)}" y="${num(r.yIn)}" width="${num(r.widthIn)}" height="${num(r.heightIn)}" fill="${colour(r.fabricId)}" stroke="${INK}" stroke-width="${SEAM_IN}"/>`);
  }
  for (const r of plan.sashingRects) {
    parts.push(`<rect data-part="sashing" x="${num(r.xIn)}" y="${num(r.yIn)}" width="${num(r.widthIn)}" height="${num(r.heightIn)}" fill="${colour(r.fabricId)}" stroke="${INK}" stroke-width="${SEAM_IN}"/>`);
  }
  for (const p of plan.sashingPolygons) {
    const points = p.points.map((pt) => `${num(pt.x)},${num(pt.y)}`).join(' ');
    parts.push(`<polygon data-part="sashing" points="${points}" fill="${colour(p.fabricId)}" stroke="${INK}" stroke-width="${SEAM_IN}"/>`);
  }
  for (const p of plan.settingTrianglePolygons) {
    const points = p.points.map((pt) => `${num(pt.x)},${num(pt.y)}`).join(' ');
    parts.push(`<polygon data-part="setting-triangle" points="${points}" fill="${colour(p.fabricId)}" stroke="${INK}" stroke-width="${SEAM_IN}"/>`);
  }

  const alternateFill = colour(document.quilt?.alternateFabricId);
  let selectedOutline = '';
  for (const cell of plan.cells) {
    const t = matrix(cell.transform);
    const outline = `<rect x="${num(b.x)}" y="${num(b.y)}" width="${num(b.width)}" height="${num(b.height)}"`;
    const content = cell.alternate
      ? `${outline} fill="${alternateFill}" stroke="${INK}" stroke-width="${SEAM_IN}"/>`
      : `<use href="#${blockId}"/>`;
    parts.push(`<g data-row="${cell.row}" data-col="${cell.col}" transform="${t}">${content}</g>`);
    if (options.selected && options.selected.row === cell.row && options.selected.col === cell.col) {
      selectedOutline = `<g transform="${t}">${outline} fill="none" stroke="${SELECTED}" stroke-width="4" vector-effect="non-scaling-stroke" stroke-dasharray="8 4"/></g>`;
    }
  }

  // The binding wraps the outer edge; from the front a narrow band of it shows all round.
  const inset = BINDING_SHOWS_IN / 2;
  parts.push(
    `<rect data-part="binding" x="${num(inset)}" y="${num(inset)}" width="${num(W - 2 * inset)}" height="${num(H - 2 * inset)}" fill="none" stroke="${colour(plan.binding.fabricId)}" stroke-width="${num(BINDING_SHOWS_IN)}"/>`,
    `<rect width="${num(W)}" height="${num(H)}" fill="none" stroke="${INK}" stroke-width="${SEAM_IN}"/>`,
  );
  if (selectedOutline) parts.push(selectedOutline);

  const title = escapeXml(`${plan.title}: quilt ${num(W)} × ${num(H)} in.`);
  const description = escapeXml(
    `${plan.setting === 'on-point' ? 'On point' : 'Straight'} setting, ${plan.columns} × ${plan.rows}, ${plan.blockCount} blocks, ${plan.borders.length} borders`,
  );
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${num(W)}in" height="${num(H)}in" viewBox="0 0 ${num(W)} ${num(H)}" role="img" aria-label="${title}">`,
    `<title>${title}</title>`,
    `<desc>${description}</desc>`,
    `<defs>${block.defs}<g id="${blockId}"><rect x="${num(b.x)}" y="${num(b.y)}" width="${num(b.width)}" height="${num(b.height)}" fill="${EMPTY}"/>${block.body}</g></defs>`,
    ...parts,
    '</svg>',
    '',
  ].join('\n');
}
