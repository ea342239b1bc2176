import type { PatternDocument } from '../document/index';
import { buildCuttingList, sectionStripSets, stripSetDisplayName, type CuttingList, type PatchStripSet } from '../fabrication/index';
import { derivePatches } from '../geometry/index';
import { PRINT_CAUTIONS } from './cautions';
import type { PdfPen } from './pdf-pen';
import type { PrintOptions } from './print-options';
import { SheetFlow, type TableCell } from './sheet-flow';
import type { SheetFrame } from './sheet-frame';

/**
 * The closing sheets: cutting list, fabric key, strip-set diagrams and the cautions. Starts a new
 * sheet through `newSheet` whenever the current one is full.
 */
export function drawAppendix(pen: PdfPen, document: PatternDocument, _options: PrintOptions, newSheet: () => SheetFrame): void {
  const flow = new SheetFlow(pen, newSheet);
  const fabricName = new Map(document.fabrics.map((f) => [f.id, f.name]));
  const fabricColour = new Map(document.fabrics.map((f) => [f.id, f.colour]));
  drawCuttingList(flow, buildCuttingList(document));
  // Each section's patches, derived once for both the fabric key and the strip sets.
  const patchesBySection = document.sections.map((section) => derivePatches(section).patches);

  flow.heading('Fabric key');
  const usedBy = new Map<string, string[]>();
  document.sections.forEach((section, i) => {
    const uses = (section.ringRepeat?.count ?? 1) * document.blockCount;
    for (const patch of patchesBySection[i]) {
      const ids = patch.stripSet ? patch.stripSet.strips.map((s) => s.fabricId) : patch.fabricId ? [patch.fabricId] : [];
      for (const id of new Set(ids)) {
        const list = usedBy.get(id) ?? [];
        list.push(uses > 1 ? `${patch.label} ×${uses}` : patch.label);
        usedBy.set(id, list);
      }
    }
  });
  flow.table(
    [
      { header: 'Fabric', widthIn: 1.9 },
      { header: 'Colour', widthIn: 0.8 },
      { header: 'Usable WOF', widthIn: 0.9, align: 'right' },
      { header: 'Used in patches', widthIn: flow.width - 3.6 },
    ],
    document.fabrics.map((f): TableCell[] => [
      { text: f.name, swatch: f.colour },
      f.colour,
      `${fmtIn(f.usableWofIn)} in.`,
      (usedBy.get(f.id) ?? ['—']).join(', '),
    ]),
  );

  const sets = uniqueStripSets(
    document.sections.flatMap((section, i) => sectionStripSets(section, document.seamAllowanceIn, document.piecingMarginIn, patchesBySection[i])),
  );
  if (sets.length > 0) {
    flow.heading('Strip sets');
    flow.paragraph(
      'Sew the strips together along their long edges with the seam allowance, press, then sub-cut. ' +
        'Lay each sub-cut on its patch with the strip seams on the printed guide lines. Diagrams are not to scale.',
    );
    for (const set of sets) drawStripSet(pen, flow, set, fabricName, fabricColour);
  }

  flow.heading('Cautions');
  for (const caution of PRINT_CAUTIONS) flow.paragraph(`• ${caution}`, 9);
}

/** The cutting list: yardage per fabric, then every cut (pieces and strip-set strips), then the strip sets. */
function drawCuttingList(flow: SheetFlow, list: CuttingList): void {
  flow.heading('Cutting list');
  flow.paragraph(
    `Rough-cut sizes include the ${fmtIn(list.seamAllowanceIn)} in. seam allowance and a ${fmtIn(list.piecingMarginIn)} in. piecing margin, ` +
      `rounded up to ⅛ in.; counts cover ${list.blockCount === 1 ? 'the whole pattern' : `all ${list.blockCount} blocks`}. Strips are cut across the width of fabric (WOF).`,
    8.5,
  );
  flow.table(
    [
      { header: 'Fabric', widthIn: 1.9 },
      { header: 'Buy', widthIn: 1.0, align: 'right' },
      { header: 'Strips across WOF', widthIn: 1.4, align: 'right' },
      { header: 'Pieces', widthIn: 0.8, align: 'right' },
    ],
    list.fabrics.map((f) => [
      { text: f.name, swatch: f.colour },
      `${yards(f.yardageEighths)} yd`,
      String(f.stripCount),
      String(f.pieceCount),
    ]),
  );
  const rows: TableCell[][] = [];
  for (const f of list.fabrics) {
    for (const g of f.pieces) {
      const strips =
        g.stripWidthIn !== null
          ? `${g.stripCount} × ${fmtIn(g.stripWidthIn)} in. strip${g.stripCount === 1 ? '' : 's'}, ${g.piecesPerStrip} per strip`
          : `${fmtIn(g.lengthwiseIn)} in. along the length`;
      rows.push([{ text: f.name, swatch: f.colour }, `${g.count} × ${fmtIn(g.widthIn)} × ${fmtIn(g.lengthIn)} in.`, strips, g.patchLabels.join(', ')]);
    }
    for (const st of f.stripSetStrips) {
      rows.push([
        { text: f.name, swatch: f.colour },
        `${setName(list, st.stripSetId)}, strip ${st.stripIndex + 1}`,
        `${st.stripCount} × ${fmtIn(st.cutWidthIn)} in. strip${st.stripCount === 1 ? '' : 's'} (finishes ${fmtIn(st.finishedWidthIn)} in.)`,
        '',
      ]);
    }
  }
  flow.table(
    [
      { header: 'Fabric', widthIn: 1.5 },
      { header: 'Cut', widthIn: 1.75 },
      { header: 'From', widthIn: 2.55 },
      { header: 'For patches', widthIn: flow.width - 5.8 },
    ],
    rows,
  );
  if (list.stripSets.length > 0) {
    flow.table(
      [
        { header: 'Strip set', widthIn: 1.5 },
        { header: 'Sewn width', widthIn: 0.95, align: 'right' },
        { header: 'Sub-cut', widthIn: 0.85, align: 'right' },
        { header: 'Sub-cuts', widthIn: 0.75, align: 'right' },
        { header: 'Sets to sew', widthIn: 0.9, align: 'right' },
        { header: 'For patches', widthIn: flow.width - 4.95 },
      ],
      list.stripSets.map((s) => [
        stripSetDisplayName(s.name, s.patchLabels),
        `${fmtIn(s.sewnWidthIn)} in.`,
        `${fmtIn(s.subCutLengthIn)} in.`,
        String(s.subCutCount),
        String(s.setCount),
        s.patchLabels.join(', '),
      ]),
    );
  }
  for (const problem of list.problems) flow.paragraph(`Check: ${problem.message}`, 8);
}

/** What quilters call the cutting list's strip set `listId`: its name, or the patches it fills. */
function setName(list: CuttingList, listId: string): string {
  const set = list.stripSets.find((s) => s.stripSetId === listId);
  return set ? stripSetDisplayName(set.name, set.patchLabels) : 'Strip set';
}

/** Yards from eighths of a yard: 11 → "1⅜". */
function yards(eighths: number): string {
  return fmtIn(eighths / 8);
}

function uniqueStripSets(all: readonly PatchStripSet[]): PatchStripSet[] {
  const seen = new Set<string>();
  return all.filter((s) => {
    const key = `${s.sectionId}/${s.layout.stripSetId}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function drawStripSet(
  pen: PdfPen,
  flow: SheetFlow,
  set: PatchStripSet,
  fabricName: Map<string, string>,
  fabricColour: Map<string, string>,
): void {
  const { layout } = set;
  const stripsIn = layout.strips.length * 0.28 + 0.75;
  const top = flow.block(stripsIn);
  // An unnamed set reads "Strip set for B1" already; a named one says which patch it fills.
  const title = layout.stripSetName?.trim() ? `${layout.stripSetName.trim()} — patch ${set.patchLabel}` : stripSetDisplayName(null, [set.patchLabel]);
  pen.text(title, { x: top.x, y: top.y + 0.15 }, { sizePt: 9, bold: true });
  pen.text(
    `sewn width ${fmtIn(layout.sewnWidthIn)} in. (finishes ${fmtIn(layout.finishedWidthIn)} in.) · sub-cut ${fmtIn(layout.subCutLengthIn)} in. long`,
    { x: top.x, y: top.y + 0.32 },
    { sizePt: 8 },
  );
  const drawW = 2.2;
  const total = layout.strips.reduce((s, st) => s + st.cutWidthIn, 0);
  let y = top.y + 0.45;
  for (const strip of layout.strips) {
    const h = Math.max(0.12, (strip.cutWidthIn / total) * (layout.strips.length * 0.28 - 0.05));
    pen.rect({ x: top.x, y, width: drawW, height: h }, { widthPt: 0.4 }, lighten(fabricColour.get(strip.fabricId) ?? '#cccccc'));
    pen.text(
      `${fabricName.get(strip.fabricId) ?? strip.fabricId}: cut ${fmtIn(strip.cutWidthIn)} in., finishes ${fmtIn(strip.finishedWidthIn)} in.`,
      { x: top.x + drawW + 0.15, y: y + h / 2 },
      { sizePt: 8, baseline: 'middle' },
    );
    y += h;
  }
  for (const problem of set.problems) flow.paragraph(`Check: ${problem}`, 8);
}

/** A paler version of a colour, so black text stays legible on the swatch. */
function lighten(hex: string): string {
  const v = parseInt(hex.slice(1), 16);
  const mix = (c: number) => Math.round(c + (255 - c) * 0.55);
  const r = mix((v >> 16) & 255);
  const g = mix((v >> 8) & 255);
  const b = mix(v & 255);
  return `#${((r << 16) | (g << 8) | b).toString(16).padStart(6, '0')}`;
}

/** Inches with eighths as fractions where exact (1.375 → 1⅜), else up to three decimals. */
export function fmtIn(value: number): string {
  const eighths = Math.round(value * 8);
  if (Math.abs(eighths / 8 - value) < 1e-6) {
    const whole = Math.floor(eighths / 8);
    const rest = eighths % 8;
    const frac = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'][rest];
    return whole === 0 && rest ? frac : `${whole}${frac}`;
  }
  return String(Math.round(value * 1000) / 1000);
}
