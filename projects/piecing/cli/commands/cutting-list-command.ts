import type { CopyPlan, CuttingList, PatternDocument } from '../../src/public-api';
import { buildCuttingList, CM_PER_INCH, formatInches, formatLength, INCHES_PER_YARD, planCopies, stripSetDisplayName } from '../../src/public-api';
import { EXIT_OK, type CliCommand } from '../cli-types';
import { readPatternCommand } from '../read-pattern-file';

/** Shown with every printed cutting list (docs/design-notes.md#cautions). */
export const CUTTING_CAUTION = 'Caution: rotary cutters are very sharp. Close the blade after every cut and cut away from your body.';

/** The cutting list as text, in the pattern's display unit. */
export function formatCuttingList(document: PatternDocument, list: CuttingList, copies: CopyPlan): string {
  const unit = document.displayUnit;
  const len = (v: number) => formatLength(v, unit, { style: 'unicode' });
  const bare = (v: number) => formatLength(v, unit, { style: 'unicode', withUnit: false });
  const yards = (inches: number) => {
    const yd = `${formatInches(inches / INCHES_PER_YARD, { style: 'unicode', withUnit: false })} yd`;
    return unit === 'cm' ? `${((inches * CM_PER_INCH) / 100).toFixed(2)} m (${yd})` : `${yd} (${len(inches)})`;
  };
  const fabricName = new Map(document.fabrics.map((f) => [f.id, f.name]));
  // A strip set is shown by its name, or by the patches it fills: never by its id.
  const setName = (listId: string) => {
    const set = list.stripSets.find((x) => x.stripSetId === listId);
    return set ? stripSetDisplayName(set.name, set.patchLabels) : 'Strip set';
  };
  const lines: string[] = [];
  const blocks = list.blockCount === 1 ? '1 block' : `${list.blockCount} blocks`;
  lines.push(`${list.title}: cutting list for ${blocks}, ${len(list.seamAllowanceIn)} seam allowance, ${len(list.piecingMarginIn)} piecing margin`);
  lines.push('');
  for (const f of list.fabrics) {
    if (f.pieceCount === 0 && f.stripSetStrips.length === 0) continue;
    lines.push(`${f.name} (${f.colour}), usable WOF ${len(f.usableWofIn)}: buy ${yards(f.yardageIn)}`);
    for (const g of f.pieces) {
      const labels = [...new Set(g.patchLabels)].join(', ');
      const size = `${bare(g.widthIn)} × ${len(g.lengthIn)}`;
      if (g.stripWidthIn !== null && g.piecesPerStrip !== null && g.pieceLengthIn !== null) {
        lines.push(`  ${g.count} × ${size} (${labels}): ${g.stripCount} strip${g.stripCount === 1 ? '' : 's'} ${len(g.stripWidthIn)} × WOF, ${g.piecesPerStrip} per strip, cross-cut at ${len(g.pieceLengthIn)}`);
      } else {
        lines.push(`  ${g.count} × ${size} (${labels}): wider than the WOF, cut along the length (${len(g.lengthwiseIn)})`);
      }
    }
    for (const s of f.stripSetStrips) {
      lines.push(`  ${setName(s.stripSetId)}, strip ${s.stripIndex + 1}: ${s.stripCount} strip${s.stripCount === 1 ? '' : 's'} ${len(s.cutWidthIn)} × WOF (${len(s.finishedWidthIn)} finished)`);
    }
    lines.push(`  ${f.stripCount} strip${f.stripCount === 1 ? '' : 's'} in all, ${len(f.totalStripLengthIn)} of strip`);
  }
  if (list.stripSets.length > 0) {
    lines.push('');
    lines.push('Strip sets:');
    for (const s of list.stripSets) {
      const recipe = s.strips.map((st) => `${fabricName.get(st.fabricId) ?? st.fabricId} ${bare(st.finishedWidthIn)}`).join(' + ');
      lines.push(`  ${stripSetDisplayName(s.name, s.patchLabels)}: ${recipe} finished (cut ${s.strips.map((st) => bare(st.cutWidthIn)).join(', ')}), sewn set ${len(s.sewnWidthIn)} wide`);
      lines.push(`    sew ${s.setCount} set${s.setCount === 1 ? '' : 's'} across the WOF, sub-cut ${s.subCutCount} × ${len(s.subCutLengthIn)} (${s.subCutsPerSet} per set) for ${[...new Set(s.patchLabels)].join(', ')}`);
    }
  }
  lines.push('');
  lines.push(`Templates (freezer paper lasts ${copies.pressingsPerTemplate} pressings):`);
  for (const s of copies.sections) {
    lines.push(`  ${s.label}: sewn ${s.templatesNeeded} time${s.templatesNeeded === 1 ? '' : 's'}; print ${s.templatesNeeded} on paper or ${s.printedCopies} on freezer paper`);
  }
  lines.push(`Total yardage: ${yards(list.totalYardageIn)}`);
  if (list.problems.length > 0) {
    lines.push('');
    lines.push('Problems:');
    for (const p of list.problems) lines.push(`  ${p.message}`);
  }
  lines.push('');
  lines.push(CUTTING_CAUTION);
  return `${lines.join('\n')}\n`;
}

export const cuttingListCommand: CliCommand = {
  name: 'cutting-list',
  usage: '<pattern.json> [--json]',
  summary: 'print the cutting list: pieces, WOF strips, strip sets, yardage and template copies',
  async run(args, io) {
    const read = await readPatternCommand('cutting-list', args, io);
    if (typeof read === 'number') return read;
    const { document, json } = read;
    const list = buildCuttingList(document);
    const copies = planCopies(document);
    if (json) io.out(`${JSON.stringify({ valid: true, cuttingList: list, copies }, null, 2)}\n`);
    else io.out(formatCuttingList(document, list, copies));
    return EXIT_OK;
  },
};
