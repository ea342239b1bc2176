import { z } from 'zod';
import { PAPER_NAMES, type PaperName } from './paper';

/** Smallest overlap between neighbouring tiles of a template, in inches (issue 4). */
export const MIN_TILE_OVERLAP_IN = 0.5;

/** Creation date used when the caller gives none: fixed, so output stays reproducible. */
export const DEFAULT_CREATED_AT = '1970-01-01T00:00:00Z';

/**
 * Options of a print set, as the app, the API and the command line send them. JSON only (no font
 * bytes): the fonts are passed beside these, see {@link PrintFonts}.
 */
export const printOptionsSchema = z
  .object({
    paper: z.enum(PAPER_NAMES as [PaperName, ...PaperName[]]).default('letter'),
    /** Printable margin on every side, in inches (most home printers need at least ¼ in.). */
    marginIn: z.number().min(0.25).max(1.5).default(0.5),
    /** Whether templates are printed mirrored (the printed side is the back of the block). */
    mirrored: z.boolean().default(true),
    /** Overlap between neighbouring tiles of a large template, in inches. */
    tileOverlapIn: z.number().min(MIN_TILE_OVERLAP_IN).max(2).default(MIN_TILE_OVERLAP_IN),
    /**
     * What the templates are printed on: on paper foundations every use needs its own print; a
     * freezer-paper template is reused for several pressings (docs/design-notes.md#copies).
     */
    foundation: z.enum(['paper', 'freezer-paper']).default('paper'),
    /** Whether each template is printed as many times as the copies plan says, or once. */
    copies: z.enum(['plan', 'single']).default('plan'),
    /** Print only these sections (by id); all when absent. */
    sectionIds: z.array(z.string().min(1).max(64)).max(2000).optional(),
    /** Whether the booklet carries the fabric requirements and the cutting instructions. */
    includeCuttingList: z.boolean().default(true),
    /**
     * Whether to print a pattern with a section that is not sewable as numbered: without it the print set
     * is refused with the reason; with it every page of such a section says so.
     */
    printUnsewable: z.boolean().default(false),
    /**
     * Creation date written into the PDF (ISO 8601, e.g. the revision's time). Same document + same
     * options give the same bytes, so this must come from the revision, not from the clock.
     */
    createdAt: z.iso.datetime({ offset: true }).default(DEFAULT_CREATED_AT),
    /**
     * A named size of the pattern's quilt layout (`quilt.sizes[].name`, design §11): the print set is then
     * for the whole quilt in that size (blocks, copies and yardage for all its blocks, a quilt assembly
     * page, the finished quilt size and size chart on the cover). Without it the print set is for the block.
     */
    quiltSize: z.string().trim().min(1).max(60).optional(),
    /** A colourway of the pattern (`colourways[].id`): fabrics named and coloured as in that colourway. */
    colourwayId: z.string().min(1).max(64).optional(),
  })
  .strict();

/** Print-set options with defaults filled in. */
export type PrintOptions = z.infer<typeof printOptionsSchema>;
/** Print-set options as a client sends them (defaults may be missing). */
export type PrintOptionsInput = z.input<typeof printOptionsSchema>;

/**
 * The TrueType fonts embedded in the PDF (the files shipped in `fonts/`). The library never reads
 * files itself: Node callers read them from disk, the browser fetches `/fonts/…`.
 */
export interface PrintFonts {
  regular: Uint8Array;
  bold: Uint8Array;
}

/** File names of the shipped fonts the print set embeds. */
export const PRINT_FONT_FILES = { regular: 'Roboto-Regular.ttf', bold: 'Roboto-Bold.ttf' } as const;

/**
 * Loads the print fonts through a caller-supplied loader, e.g.
 * `loadPrintFonts((f) => readFile(join(fontsDir, f)))` in Node or
 * `loadPrintFonts((f) => fetch('/fonts/' + f).then((r) => r.arrayBuffer()))` in the browser.
 */
export async function loadPrintFonts(
  load: (fileName: string) => Promise<Uint8Array | ArrayBuffer>,
): Promise<PrintFonts> {
  const [regular, bold] = await Promise.all([load(PRINT_FONT_FILES.regular), load(PRINT_FONT_FILES.bold)]);
  return { regular: toBytes(regular), bold: toBytes(bold) };
}

function toBytes(data: Uint8Array | ArrayBuffer): Uint8Array {
  return data instanceof Uint8Array ? data : new Uint8Array(data);
}

/** Validates print options; throws a zod error listing every problem. */
export function readPrintOptions(input: unknown): PrintOptions {
  return printOptionsSchema.parse(input ?? {});
}
