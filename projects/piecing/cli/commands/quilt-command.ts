import type { PatternDocument, QuiltPlan } from '../../src/public-api';
import { formatInches, formatLength, quiltCliJson, quiltPlan, QuiltPlanError } from '../../src/public-api';
import { EXIT_INVALID_INPUT, EXIT_OK, EXIT_USAGE, type CliCommand, type CliIo } from '../cli-types';
import { readPatternFile } from '../read-pattern-file';

const USAGE = '<pattern.json> [--size NAME] [--colourway ID] [--json]';

/** The quilt plan as text, in the pattern's display unit. */
export function formatQuiltPlan(document: PatternDocument, plan: QuiltPlan): string {
  const unit = document.displayUnit;
  const len = (v: number) => formatLength(v, unit, { style: 'unicode' });
  const bare = (v: number) => formatLength(v, unit, { style: 'unicode', withUnit: false });
  const size = (s: { width: number; height: number }) => `${bare(s.width)} × ${len(s.height)}`;
  const yd = (y: number) => `${formatInches(y, { style: 'unicode', withUnit: false })} yd`;
  const name = new Map(plan.fabrics.map((f) => [f.id, f.name]));
  const fabric = (id: string | null) => (id ? (name.get(id) ?? id) : 'no fabric chosen');
  const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
  const lines: string[] = [];
  const colourway = plan.colourwayId ? document.colourways?.find((c) => c.id === plan.colourwayId)?.name ?? plan.colourwayId : null;
  lines.push(`${plan.title}: quilt${plan.sizeName ? ` "${plan.sizeName}"` : ''}${colourway ? ` in ${colourway}` : ''}`);
  lines.push(`Finished quilt: ${size(plan.finishedSizeIn)}`);
  const setting = plan.setting === 'on-point' ? 'on point' : 'straight';
  lines.push(`Blocks: ${plan.blockCount} of ${size(plan.blockSizeIn)}, ${plan.columns} across × ${plan.rows} down, set ${setting}${plan.alternateBlocks ? `, with ${plural(plan.alternateBlocks.count, 'plain block')}` : ''}`);
  if (plan.settingTriangles) {
    const t = plan.settingTriangles;
    lines.push(`Setting triangles (${fabric(t.fabricId)}): ${plural(t.sideSquares, 'square')} of ${len(t.sideCutSquareIn)} cut twice on the diagonal (${t.sideTriangles} side triangles); ${plural(t.cornerSquares, 'square')} of ${len(t.cornerCutSquareIn)} cut once (4 corners)`);
  }
  if (plan.sashing) {
    const s = plan.sashing;
    lines.push(`Sashing (${fabric(s.fabricId)}): ${s.verticalStrips.count + s.horizontalStrips.count + (s.diagonalStrips?.count ?? 0)} strips, ${plural(s.cornerstones.count, 'cornerstone')} of ${len(s.cornerstones.cutSquareIn)} (${fabric(s.cornerstones.fabricId)})`);
    const cut = (c: { count: number; cutWidthIn: number; cutLengthIn: number }) => `${plural(c.count, 'piece')} ${bare(c.cutWidthIn)} × ${len(c.cutLengthIn)}`;
    if (s.diagonalStrips) lines.push(`  round every block, on point: ${cut(s.diagonalStrips)}`);
    else lines.push(`  between blocks ${cut(s.verticalStrips)}; between rows ${cut(s.horizontalStrips)}`);
  }
  for (const b of plan.borders) {
    lines.push(`Border ${b.index} (${fabric(b.fabricId)}, ${len(b.widthIn)}): ${plural(b.strips, 'strip')} ${len(b.cutWidthIn)} × WOF joined end to end (${plural(b.joins, 'join')}); sides first 2 × ${len(b.sides.cutLengthIn)}, then top and bottom 2 × ${len(b.topAndBottom.cutLengthIn)}`);
  }
  const bi = plan.binding;
  lines.push(`Binding (${fabric(bi.fabricId)}): ${plural(bi.strips, 'strip')} ${len(bi.stripWidthIn)} × WOF, ${len(bi.lengthIn)} joined (perimeter ${len(bi.perimeterIn)} + ${len(bi.extraIn)})`);
  const ba = plan.backing;
  const seams = ba.seams === 'none' ? 'no seam' : ba.seams === 'across' ? 'seamed across' : 'seamed lengthwise';
  lines.push(`Backing (${fabric(ba.fabricId)}): ${size({ width: ba.widthIn, height: ba.heightIn })}, ${plural(ba.widths, 'width')} of ${len(ba.widthLengthIn)}, ${seams}: ${yd(ba.yards)}`);
  lines.push(`Batting: ${size(plan.batting)}`);
  lines.push('');
  lines.push('Fabric for the whole quilt (rounded up to ⅛ yd):');
  for (const f of plan.fabrics) {
    if (f.fabricLengthIn === 0) continue;
    const parts = [
      f.blocksIn > 0 ? `blocks ${len(f.blocksIn)}` : '',
      f.settingIn > 0 ? `setting ${len(f.settingIn)}` : '',
      f.bordersIn > 0 ? `borders ${len(f.bordersIn)}` : '',
      f.bindingIn > 0 ? `binding ${len(f.bindingIn)}` : '',
      f.backingIn > 0 ? `backing ${len(f.backingIn)}` : '',
    ].filter(Boolean);
    lines.push(`  ${f.name} (${f.colour}): ${yd(f.yards)} (${parts.join(', ')})`);
  }
  lines.push(`Total: ${yd(plan.totalYards)}`);
  if (plan.problems.length > 0) {
    lines.push('');
    lines.push('Problems:');
    for (const p of plan.problems) lines.push(`  ${p}`);
  }
  return `${lines.join('\n')}\n`;
}

function parseArgs(args: readonly string[]): { file: string; sizeName: string | null; colourwayId: string | null; json: boolean } | string {
  let file: string | null = null;
  let sizeName: string | null = null;
  let colourwayId: string | null = null;
  let json = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '--json') json = true;
    else if (a === '--size' || a === '--colourway') {
      const value = args[++i];
      if (value === undefined || value.startsWith('--')) return `${a} needs a value`;
      if (a === '--size') sizeName = value;
      else colourwayId = value;
    } else if (a.startsWith('--')) return `unknown option ${a}`;
    else if (file === null) file = a;
    else return `one pattern file only (got ${file} and ${a})`;
  }
  if (file === null) return 'a pattern file is needed';
  return { file, sizeName, colourwayId, json };
}

function fail(io: CliIo, json: boolean, messages: string[], issues: Array<{ path: string; message: string }>): number {
  if (json) io.out(`${JSON.stringify({ valid: false, messages, issues }, null, 2)}\n`);
  else io.err(`${messages.join('\n')}\n`);
  return EXIT_INVALID_INPUT;
}

export const quiltCommand: CliCommand = {
  name: 'quilt',
  usage: USAGE,
  summary: 'print the quilt: finished size, blocks, setting triangles, borders, binding, backing, batting and yardage',
  async run(args, io) {
    const parsed = parseArgs(args);
    if (typeof parsed === 'string') {
      io.err(`usage: seamwright quilt ${USAGE} (${parsed})\n`);
      return EXIT_USAGE;
    }
    const file = await readPatternFile(parsed.file, io.cwd);
    if (!file.ok) return fail(io, parsed.json, file.messages, file.issues ?? []);
    let plan: QuiltPlan;
    try {
      plan = quiltPlan(file.document, { sizeName: parsed.sizeName, colourwayId: parsed.colourwayId });
    } catch (error) {
      if (!(error instanceof QuiltPlanError)) throw error;
      return fail(io, parsed.json, [`${parsed.file}: ${error.field}: ${error.message}`], [{ path: error.field, message: error.message }]);
    }
    if (parsed.json) io.out(`${JSON.stringify(quiltCliJson(plan), null, 2)}\n`);
    else io.out(formatQuiltPlan(file.document, plan));
    return EXIT_OK;
  },
};
