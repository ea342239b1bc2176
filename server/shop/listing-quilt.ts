import { quiltPictureSvg, quiltPlan, quiltSizes, type PatternDocument } from '@seamwright/piecing';

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
    // The geometry is the same in every colourway: plan once, draw in each one's fabrics.
    const plan = quiltPlan(document);
    const pictures = ways.map((w) => ({
      ...w,
      svg: quiltPictureSvg(document, { plan, colourwayId: w.colourwayId, idPrefix: 'q', widthPx: QUILT_PICTURE_WIDTH_PX }),
    }));
    return { quiltSizes: sizes, quiltPictures: pictures };
  } catch {
    // A quilt that cannot be planned is never worth refusing a listing for; the page shows no quilt.
    return { quiltSizes: null, quiltPictures: null };
  }
}
