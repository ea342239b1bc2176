import { fmtIn } from '../format-inches';
import type { TableCell } from '../sheet-flow';
import { sectionUses, type BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';

/** Yards from eighths of a yard: 11 → "1⅜". */
export function yardsText(eighths: number): string {
  return fmtIn(eighths / 8);
}

/**
 * The fabric requirements: what to buy of each fabric (from the cutting list, rounded up to ⅛ yd) and
 * which patches each fabric goes into.
 */
export function drawFabricRequirements(ctx: BookletContext, writer: BookletWriter): void {
  const list = ctx.cuttingList;
  const flow = writer.part('Fabric requirements');
  flow.heading('Fabric requirements');
  flow.paragraph(
    `For ${list.blockCount === 1 ? 'one block' : `${list.blockCount} blocks`}. Yardage is rounded up to ⅛ yd (4½ in.) and assumes the usable width of fabric (WOF) listed, ` +
      'selvages trimmed (common practice: 40–42 in.). Buy a little extra if you fussy-cut or are new to foundation piecing.',
    8.5,
  );
  flow.table(
    [
      { header: 'Fabric', widthIn: 2.0 },
      { header: 'Buy', widthIn: 0.9, align: 'right' },
      { header: 'Usable WOF', widthIn: 1.0, align: 'right' },
      { header: 'Strips', widthIn: 0.7, align: 'right' },
      { header: 'Pieces', widthIn: 0.7, align: 'right' },
    ],
    list.fabrics.map((f): TableCell[] => [
      { text: f.name, swatch: f.colour },
      `${yardsText(f.yardageEighths)} yd`,
      `${fmtIn(f.usableWofIn)} in.`,
      String(f.stripCount),
      String(f.pieceCount),
    ]),
  );
  flow.paragraph(`In all: ${fmtIn(list.totalYardageIn / 36)} yd.`, 9, true);

  flow.heading('Where each fabric goes', 11);
  const usedBy = new Map<string, string[]>();
  for (const section of ctx.document.sections) {
    const uses = sectionUses(ctx.document, section);
    for (const patch of ctx.patches.get(section.id) ?? []) {
      const ids = patch.stripSet ? patch.stripSet.strips.map((s) => s.fabricId) : patch.fabricId ? [patch.fabricId] : [];
      for (const id of new Set(ids)) {
        const labels = usedBy.get(id) ?? [];
        labels.push(uses > 1 ? `${patch.label} ×${uses}` : patch.label);
        usedBy.set(id, labels);
      }
    }
  }
  flow.table(
    [
      { header: 'Fabric', widthIn: 2.0 },
      { header: 'Colour', widthIn: 0.8 },
      { header: 'Used in patches', widthIn: flow.width - 2.8 },
    ],
    ctx.document.fabrics.map((f): TableCell[] => [{ text: f.name, swatch: f.colour }, f.colour, (usedBy.get(f.id) ?? ['—']).join(', ')]),
  );
}
