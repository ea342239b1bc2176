import { applyColourway, quiltPlan, quiltSizes, type PatternDocument, type QuiltPlan } from '@seamwright/piecing';
import { patternPreviewSvg } from '../services/pattern-preview';

/** Width of a listing's quilt picture in pixels (a 160 px picture at twice the density). */
export const QUILT_PICTURE_WIDTH_PX = 320;

/** One row of a listing's size chart (design §11), as stored with the listing. */
export interface ListingQuiltSize {
  name: string;
  widthIn: number;
  heightIn: number;
  blockCount: number;
  totalYards: number;
}

/** One quilt picture of a listing: the pattern's own fabrics (colourwayId null) or one colourway. */
export interface ListingQuiltPicture {
  colourwayId: string | null;
  name: string;
  svg: string;
}

/** What a listing shows of a pattern's quilt layout; both null when the pattern has no quilt. */
export interface ListingQuiltFacts {
  quiltSizes: ListingQuiltSize[] | null;
  quiltPictures: ListingQuiltPicture[] | null;
}

const INK = '#34312c';
const EMPTY = '#ffffff';
const COLOUR = /^#[0-9a-fA-F]{6}$/;
const round = (v: number, places = 3) => Math.round(v * 10 ** places) / 10 ** places;

/**
 * The size chart and the quilt pictures of a pattern with a quilt layout, worked out when its listing is
 * saved and stored with it (so a listing page never reads documents). A pattern without a quilt, or one
 * whose layout cannot be planned, gives nulls: the listing shows nothing of a quilt.
 */
export function listingQuiltFacts(document: PatternDocument): ListingQuiltFacts {
  if (!document.quilt) return { quiltSizes: null, quiltPictures: null };
  try {
    const sizes = quiltSizes(document).map((s) => ({
      name: s.name,
      widthIn: round(s.finishedSizeIn.width),
      heightIn: round(s.finishedSizeIn.height),
      blockCount: s.blockCount,
      totalYards: round(s.totalYards),
    }));
    const ways: Array<{ colourwayId: string | null; name: string }> = [
      { colourwayId: null, name: 'Pattern fabrics' },
      ...(document.colourways ?? []).map((c) => ({ colourwayId: c.id, name: c.name })),
    ];
    const pictures = ways.map((w) => {
      const coloured = applyColourway(document, w.colourwayId);
      return { ...w, svg: quiltListingSvg(coloured, quiltPlan(document, { colourwayId: w.colourwayId })) };
    });
    return { quiltSizes: sizes, quiltPictures: pictures };
  } catch {
    // A quilt that cannot be planned is never worth refusing a listing for; the page shows no quilt.
    return { quiltSizes: null, quiltPictures: null };
  }
}

/**
 * A small picture of the finished quilt as laid out: borders, sashing, setting triangles and every block
 * drawn once (the block preview of the pattern list, in `document`'s fabrics) and placed per cell with the
 * plan's transform; plain alternate blocks as squares of their fabric. Only numbers, checked colours and
 * ids made here reach the markup; it is shown as an `<img>`.
 */
export function quiltListingSvg(document: PatternDocument, plan: QuiltPlan, widthPx = QUILT_PICTURE_WIDTH_PX): string {
  const { width: W, height: H } = plan.finishedSizeIn;
  const width = Math.max(1, Math.round(widthPx));
  const height = Math.max(1, Math.round((width * H) / W));
  const pxPerIn = width / W;
  const n = (v: number) => String(+v.toFixed(3));
  const colours = new Map(document.fabrics.filter((f) => COLOUR.test(f.colour)).map((f) => [f.id, f.colour]));
  const colour = (id: string | null | undefined) => (id && colours.get(id)) || EMPTY;
  const seam = n(1 / pxPerIn);
  const b = plan.blockBoundsIn;

  // The block once, in its drawing coordinates, drawn as finely as it shows on the quilt.
  const first = plan.cells.find((c) => !c.alternate);
  const scale = first ? Math.hypot(first.transform[0], first.transform[1]) : 1;
  const blockPx = document.canvas.widthIn * scale * pxPerIn;
  const blockSvg = patternPreviewSvg(document, blockPx);
  const inner = blockSvg.slice(blockSvg.indexOf('>') + 1, blockSvg.lastIndexOf('</svg>'));
  const box = `x="${n(b.x)}" y="${n(b.y)}" width="${n(b.width)}" height="${n(b.height)}"`;

  const rect = (r: { xIn: number; yIn: number; widthIn: number; heightIn: number; fabricId: string | null }) =>
    `<rect x="${n(r.xIn)}" y="${n(r.yIn)}" width="${n(r.widthIn)}" height="${n(r.heightIn)}" fill="${colour(r.fabricId)}"/>`;
  const parts: string[] = [
    `<rect width="${n(W)}" height="${n(H)}" fill="${colour(plan.sashing?.fabricId ?? plan.settingTriangles?.fabricId)}"/>`,
    ...plan.borderRects.map(rect),
    ...plan.sashingRects.map(rect),
    ...plan.sashingPolygons.map((p) => `<polygon points="${p.points.map((pt) => `${n(pt.x)},${n(pt.y)}`).join(' ')}" fill="${colour(p.fabricId)}"/>`),
    ...plan.settingTrianglePolygons.map((p) => `<polygon points="${p.points.map((pt) => `${n(pt.x)},${n(pt.y)}`).join(' ')}" fill="${colour(p.fabricId)}"/>`),
  ];
  const alternate = colour(document.quilt?.alternateFabricId);
  for (const cell of plan.cells) {
    const t = `matrix(${cell.transform.map((v) => n(v)).join(' ')})`;
    parts.push(cell.alternate ? `<rect ${box} fill="${alternate}" transform="${t}"/>` : `<use href="#qb" transform="${t}"/>`);
  }
  parts.push(`<rect width="${n(W)}" height="${n(H)}" fill="none" stroke="${colour(plan.binding.fabricId)}" stroke-width="${n(Math.max(0.375, 2 / pxPerIn))}"/>`);
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${n(W)} ${n(H)}">` +
    `<defs><clipPath id="qbc"><rect ${box}/></clipPath><g id="qb" clip-path="url(#qbc)">${inner}</g></defs>` +
    `<g stroke="${INK}" stroke-width="${seam}">${parts.join('')}</g></svg>`
  );
}
