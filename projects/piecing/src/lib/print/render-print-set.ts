import type { jsPDF } from 'jspdf';
import type { PatternDocument, Section } from '../document/index';
import { drawCover } from './draw-cover';
import { drawSheetFrame } from './draw-sheet-frame';
import { drawTileMaps } from './draw-tile-maps';
import { drawPlacement } from './draw-template';
import { drawSheetNotes } from './draw-sheet-notes';
import { canonicalJson, pdfDateUtc, stableHash128 } from './deterministic-ids';
import type { PlannedSheet, PrintLayout } from './layout-types';
import { POINTS_PER_INCH, type SheetOrientation } from './paper';
import { embedFonts, PdfPen } from './pdf-pen';
import { layoutTemplates } from './plan-print-layout';
import { buildPrintTemplates } from './print-templates';
import { printOptionsSchema, type PrintFonts, type PrintOptions, type PrintOptionsInput } from './print-options';
import { sheetFrame, type SheetFrame } from './sheet-frame';
import { bookletContext, sectionFacts, type BookletContext, type SectionFacts } from './booklet/booklet-context';
import { BookletWriter } from './booklet/booklet-writer';
import { drawBookletCover, type ContentsEntry } from './booklet/draw-booklet-cover';
import { drawCuttingInstructions } from './booklet/draw-cutting-instructions';
import { drawFabricRequirements } from './booklet/draw-fabric-requirements';
import { drawJoiningPlan } from './booklet/draw-joining-plan';
import { drawNotesAndCautions } from './booklet/draw-notes-and-cautions';
import { drawPiecingSteps } from './booklet/draw-piecing-steps';
import { drawTrimming } from './booklet/draw-trimming';
import { finishedBlockSize } from './booklet/finished-size';
import type { SectionPressing } from './booklet/section-pressing';
import { findUnsewableSections, UnsewablePatternError } from './booklet/unsewable-sections';
import { drawQuiltAssembly, drawQuiltFabric, quiltPrintDocument } from './booklet/quilt-booklet';
import { resolveJoiningPlan, sectionSeamPressing } from '../joining/index';
import { planCopies, type CopyPlan } from '../fabrication/index';
import { buildPieceTemplates } from './piece-templates/build-piece-templates';
import { drawPieceTemplates } from './piece-templates/draw-piece-templates';

/** Options of {@link renderPrintSet}: the JSON print options plus the font bytes to embed. */
export type RenderPrintSetOptions = PrintOptionsInput & { fonts: PrintFonts };

/** A rendered print set. */
export interface PrintSetResult {
  pdf: Uint8Array;
  /** Pages in the PDF: cover, how to print, booklet, template sheets and piece templates. */
  sheetCount: number;
  /** Sheets before the templates: the cover, the printing sheet and the booklet. */
  bookletSheetCount: number;
  /** N: sheets carrying foundation templates (sheets bookletSheetCount + 1 … bookletSheetCount + N). */
  templateSheetCount: number;
  /** Sheets of piece templates, after the foundation templates. */
  pieceTemplateSheetCount: number;
  /** M = ceil(total template area / printable area). */
  lowerBoundSheets: number;
  layout: PrintLayout;
}

/** Called after each step: `done` of `total` steps (one per template sheet, plus booklet and closing). */
export type PrintProgress = (done: number, total: number) => void;

/**
 * Plans the sheets of a print set without writing a PDF (for the app's sheet preview): the same
 * templates {@link renderPrintSet} lays out, numbered from sheet 2 (the booklet's length is only
 * known once it is written). Pure.
 */
export function planPrintLayout(document: PatternDocument, options: PrintOptionsInput = {}): PrintLayout {
  const opts = printOptionsSchema.parse(options);
  return layoutTemplates(buildPrintTemplates(quiltPrintDocument(document, opts), opts), opts);
}

/** One page's header: subtitle, the sections it is about, and for template sheets the sheet plan. */
interface PageHeading {
  subtitle: string;
  sectionIds: string[];
  sheet?: PlannedSheet;
}

/**
 * Renders the print set of a document: the booklet (cover with the finished size, how to print, fabric
 * requirements, cutting instructions, piecing steps per section, trimming, joining plan, designer's
 * notes and cautions), then the template sheets at true scale (tiled, packed, mirrored unless asked
 * otherwise) and the piece templates. Every sheet carries the test squares. Refuses a pattern with a
 * section not sewable as numbered ({@link UnsewablePatternError}) unless `printUnsewable` is set.
 * Same document + same options → same bytes. Runs in Node and in the browser; yields between sheets.
 */
export async function renderPrintSet(
  document: PatternDocument,
  options: RenderPrintSetOptions,
  onProgress?: PrintProgress,
): Promise<PrintSetResult> {
  const { fonts, ...json } = options;
  const opts = printOptionsSchema.parse(json);
  // In the chosen colourway, and for the whole quilt in the chosen size (docs/quilt-layout.md).
  document = quiltPrintDocument(document, opts);
  const wanted = opts.sectionIds ? new Set(opts.sectionIds) : null;
  const facts = sectionFacts(document);
  const unsewable = findUnsewableSections({ sections: document.sections.filter((s) => !wanted || wanted.has(s.id)) }, (s) => facts.verdicts.get(s.id)!);
  if (unsewable.length > 0 && !opts.printUnsewable) throw new UnsewablePatternError(unsewable);
  const templates = buildPrintTemplates(document, opts, (s) => facts.patches.get(s.id)!, facts.derive);
  const pieceTemplates = buildPieceTemplates(document, opts.sectionIds, facts.derive);
  const byId = new Map(templates.map((t) => [t.id, t]));
  let done = 0;
  let total = 3;
  const step = async () => {
    done++;
    onProgress?.(done, total);
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
  };

  // jsPDF is loaded only when a PDF is written, so pages that import the library for geometry or
  // layout (the board, the cutting list, the sheet preview) do not carry it. Its streams are compressed
  // by our FlateEncode (pdf-flate.ts: fflate at a faster level, the string built in chunks).
  const [{ jsPDF: JsPdf }, { useFastFlate }] = await Promise.all([import('jspdf'), import('./pdf-flate')]);
  useFastFlate(JsPdf.API);
  const coverFrame = sheetFrame(opts.paper, 'portrait', opts.marginIn);
  const doc = new JsPdf({
    unit: 'pt',
    format: [coverFrame.widthIn * POINTS_PER_INCH, coverFrame.heightIn * POINTS_PER_INCH],
    orientation: 'portrait',
    floatPrecision: 3,
    putOnlyUsedFonts: true,
    compress: true,
  });
  doc.setFileId(stableHash128(canonicalJson({ document, options: opts })));
  doc.setCreationDate(pdfDateUtc(opts.createdAt));
  doc.setProperties({ title: `${document.title} — print set`, subject: 'Foundation-paper-piecing pattern and templates', creator: 'Seamwright' });
  embedFonts(doc, fonts);
  const pen = new PdfPen(doc);

  const frames: SheetFrame[] = [coverFrame];
  const headings: PageHeading[] = [{ subtitle: 'Cover — the pattern at a glance', sectionIds: [] }];
  addSheet(doc, coverFrame);
  frames.push(coverFrame);
  headings.push({ subtitle: 'How to print — read this sheet first', sectionIds: [] });
  const portraitSheet = () => {
    const frame = sheetFrame(opts.paper, 'portrait', opts.marginIn);
    addSheet(doc, frame);
    frames.push(frame);
    return frame;
  };

  const ctx = bookletContext(pen, document, opts, unsewable, facts);
  const booklet = new BookletWriter(pen, portraitSheet);
  if (opts.includeCuttingList) {
    drawFabricRequirements(ctx, booklet);
    drawQuiltFabric(ctx, booklet);
    drawCuttingInstructions(ctx, booklet);
  }
  drawPiecingSteps(ctx, booklet, (section) => sectionPressing(section, facts));
  drawTrimming(ctx, booklet);
  drawJoiningPlan(ctx, booklet, resolveJoiningPlan(document));
  drawQuiltAssembly(ctx, booklet);
  drawNotesAndCautions(ctx, booklet);
  for (const s of booklet.sheets) headings.push({ subtitle: s.subtitle, sectionIds: s.sectionIds });
  const bookletSheetCount = doc.getNumberOfPages();
  await step();

  const layout = layoutTemplates(templates, opts, bookletSheetCount + 1);
  total = layout.sheets.length + 3;
  for (const sheet of layout.sheets) {
    addSheet(doc, sheet.frame);
    frames.push(sheet.frame);
    for (const placement of sheet.placements) drawPlacement(pen, placement, byId.get(placement.templateId)!);
    headings.push({
      subtitle: `Templates — sections ${sheet.sectionLabels.join(', ')}`,
      sectionIds: [...new Set(sheet.placements.map((p) => byId.get(p.templateId)!.sectionId))],
      sheet,
    });
    await step();
  }

  const pieceWriter = new BookletWriter(pen, portraitSheet);
  drawPieceTemplates(pen, pieceWriter, pieceTemplates, opts.copies === 'single', document.pressingsPerTemplate);
  for (const s of pieceWriter.sheets) headings.push({ subtitle: s.subtitle, sectionIds: s.sectionIds });

  const figures = planCopies(document, document.pressingsPerTemplate, facts.derive);
  const sectionLabels = new Map(document.sections.map((s) => [s.id, s.label]));
  const labelOf = (id: string) => sectionLabels.get(id) ?? id;
  /**
   * The covers (sheets 1 and 2) are drawn last, when the page count is known. What does not fit on them
   * runs on onto continuation sheets at the end of the set: a measuring pass (nothing drawn) finds how
   * many each needs, so the page count and the contents they state include those sheets.
   */
  function drawCovers(): void {
    const before = doc.getNumberOfPages();
    const continuedTitles = ['Cover (continued)', 'How to print (continued)'] as const;
    const headingsWith = (extra: readonly [number, number]) => [
      ...headings,
      ...Array.from({ length: extra[0] }, () => ({ subtitle: continuedTitles[0], sectionIds: [] })),
      ...Array.from({ length: extra[1] }, () => ({ subtitle: continuedTitles[1], sectionIds: [] })),
    ];
    // The finished size is worked out once for the measuring passes and the drawing.
    const finished = finishedBlockSize(document);
    const coverFacts = (extra: readonly [number, number]) => ({
      finished,
      layout,
      copies: figures,
      pieceTemplates,
      contents: contentsOf(headingsWith(extra), labelOf),
    });
    const measure = (extra: readonly [number, number]): [number, number] => {
      const dry = new PdfPen(doc, true);
      const counts: [number, number] = [0, 0];
      const blank = () => sheetFrame(opts.paper, 'portrait', opts.marginIn);
      drawBookletCover({ ...ctx, pen: dry }, coverFrame, coverFacts(extra), () => (counts[0]++, blank()));
      drawCover(dry, frames[1], document, opts, layout, before + extra[0] + extra[1], () => (counts[1]++, blank()));
      return counts;
    };
    let extra: [number, number] = [0, 0];
    for (let i = 0; i < 5; i++) {
      const need = measure(extra);
      if (need[0] === extra[0] && need[1] === extra[1]) break;
      extra = need;
    }
    const continuation: number[][] = [[], []];
    for (const part of [0, 1] as const) {
      for (let k = 0; k < extra[part]; k++) {
        portraitSheet();
        headings.push({ subtitle: continuedTitles[part], sectionIds: [] });
        continuation[part].push(doc.getNumberOfPages());
      }
    }
    const continueOn = (part: 0 | 1) => () => {
      // One more than measured (it should not happen): a new sheet at the end, so still nothing is lost.
      const page = continuation[part].shift() ?? (portraitSheet(), headings.push({ subtitle: continuedTitles[part], sectionIds: [] }), doc.getNumberOfPages());
      doc.setPage(page);
      return frames[page - 1];
    };
    doc.setPage(1);
    // The continuation sheets are in `headings` now: the contents name them once.
    drawBookletCover(ctx, coverFrame, coverFacts([0, 0]), continueOn(0));
    doc.setPage(2);
    drawCover(pen, frames[1], document, opts, layout, before + extra[0] + extra[1], continueOn(1));
  }
  drawCovers();
  const pageCount = doc.getNumberOfPages();
  for (let p = 1; p <= pageCount; p++) {
    doc.setPage(p);
    const frame = frames[p - 1];
    const heading = headings[p - 1];
    const sheet = heading.sheet;
    const notSewable = heading.sectionIds.map((id) => ctx.unsewable.get(id)).filter((u) => u !== undefined);
    drawSheetFrame(pen, frame, {
      title: document.title,
      pageNumber: p,
      pageCount,
      subtitle: heading.subtitle,
      note: sheet ? mirrorNote(opts) : undefined,
      ...(sheet ? { aside: copiesAside(ctx, figures, heading.sectionIds) } : {}),
      ...(notSewable.length > 0
        ? { warning: `NOT SEWABLE AS NUMBERED: section${notSewable.length > 1 ? 's' : ''} ${notSewable.map((u) => u.label).join(', ')} — printed anyway` }
        : {}),
    });
    if (sheet) {
      const maps = drawTileMaps(pen, frame, sheet, byId).filter((m) => m.where === 'content');
      const notes = heading.sectionIds
        .map((id) => document.sections.find((s) => s.id === id))
        .filter((s) => s?.note?.trim())
        .map((s) => ({ label: s!.label, note: s!.note! }));
      drawSheetNotes(pen, frame, sheet, notes, maps.map((m) => m.area));
    }
  }
  await step();

  const pdf = new Uint8Array(doc.output('arraybuffer'));
  return {
    pdf,
    sheetCount: pageCount,
    bookletSheetCount,
    templateSheetCount: layout.templateSheetCount,
    pieceTemplateSheetCount: pieceWriter.sheets.length,
    lowerBoundSheets: layout.lowerBoundSheets,
    layout,
  };
}

/**
 * Pressing of each patch seam of a section, by the patch it adds (toward the patch just added when unset),
 * from the patches and verdict the print set worked out once.
 */
function sectionPressing(section: Section, facts: SectionFacts): SectionPressing {
  const pressing: SectionPressing = new Map();
  for (const seam of sectionSeamPressing(section, facts.patches.get(section.id)!, facts.verdicts.get(section.id)!)) {
    if (seam.addedPatch !== undefined && !pressing.has(seam.addedPatch)) pressing.set(seam.addedPatch, seam.press);
  }
  return pressing;
}

/**
 * The cover's contents: consecutive sheets with the same subtitle are one entry, and so are consecutive
 * sheets of one part about sections ("Piecing — section A", "Piecing — sections B, C" …), named by their
 * first and last section ("Piecing — sections A to GR"): each sheet's own header still names its sections.
 */
function contentsOf(headings: readonly PageHeading[], labelOf: (sectionId: string) => string): ContentsEntry[] {
  const out: Array<ContentsEntry & { part?: string; firstSection?: string }> = [];
  headings.forEach((h, i) => {
    const title = h.sheet ? 'Foundation templates' : h.subtitle;
    const part = !h.sheet && h.sectionIds.length > 0 ? sectionPart(h.subtitle) : undefined;
    const last = out[out.length - 1];
    if (part && last && last.lastSheet === i && last.part === part) {
      last.lastSheet = i + 1;
      const to = labelOf(h.sectionIds[h.sectionIds.length - 1]);
      last.title = last.firstSection === to ? last.title : `${part} — sections ${last.firstSection} to ${to}`;
      return;
    }
    // A part that began below another ("Fabric requirements · Cutting instructions") runs on with its own title.
    const runsOn = last && last.lastSheet === i && (last.title === title || last.title.endsWith(` · ${title}`));
    if (runsOn) last.lastSheet = i + 1;
    else out.push({ title, firstSheet: i + 1, lastSheet: i + 1, ...(part ? { part, firstSection: labelOf(h.sectionIds[0]) } : {}) });
  });
  return out.map(({ title, firstSheet, lastSheet }) => ({ title, firstSheet, lastSheet }));
}

/** "Piecing" of "Piecing — section A" or "Piecing — sections B, C"; undefined for other subtitles. */
function sectionPart(subtitle: string): string | undefined {
  const at = subtitle.indexOf(' — section');
  return at > 0 ? subtitle.slice(0, at) : undefined;
}

/** The copies rule for the sections on a template sheet, in a few words (docs/design-notes.md#copies). */
function copiesAside(ctx: BookletContext, figures: CopyPlan, sectionIds: readonly string[]): string {
  if (ctx.options.foundation === 'paper') return 'Paper foundations: one print per section sewn';
  const parts = sectionIds
    .map((id) => figures.sections.find((s) => s.sectionId === id))
    .filter((s) => s !== undefined)
    .map((s) => `${s.sectionsPerTemplate} ${s.label}`);
  return `Freezer paper: one print per ${parts.join(', ')} (see cover)`;
}

function addSheet(doc: jsPDF, frame: SheetFrame): void {
  const orientation: SheetOrientation = frame.orientation;
  doc.addPage([frame.widthIn * POINTS_PER_INCH, frame.heightIn * POINTS_PER_INCH], orientation);
}

function mirrorNote(opts: PrintOptions): string {
  return opts.mirrored ? 'Mirror image (printed side = back of block)' : 'As seen from the front (not mirrored)';
}
