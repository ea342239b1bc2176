import type { PatternDocument, Section } from '../../src/public-api';
import { checkSewability, derivePatches, findSewableOrder, ringRepeatTransforms, sectionEdges } from '../../src/public-api';
import { EXIT_OK, type CliCommand } from '../cli-types';
import { readPatternCommand } from '../read-pattern-file';

/** The verdict on one section, as printed with --json. */
export interface SectionVerdict {
  id: string;
  label: string;
  kind: Section['geometry']['kind'];
  patchCount: number;
  /** Copies around the ring (1 without a ring repeat). */
  ringCopies: number;
  /** Curved edges of a straight section's outline (0 for arc and wedge sections, whose curves are their kind). */
  curvedEdges: number;
  /** Whether the patches can be sewn in their numbered order. */
  sewableAsNumbered: boolean;
  /** Why not, naming the first failing patch. */
  failure?: { label: string; reason: string; message: string };
  /** A sewable order (patch labels) when the numbered one fails, if one exists. */
  sewableOrder?: string[];
  /** When no order exists: what the search says, and the suggested cut. */
  cannotBeSewn?: { message: string; cut?: { from: { x: number; y: number }; to: { x: number; y: number } } };
  /** When the search could not tell in time whether an order exists: what it says, and a cut into two sewable sections if it found one. */
  undecided?: { message: string; cut?: { from: { x: number; y: number }; to: { x: number; y: number } } };
  /** Seams that do not cross their patch, stray anchors. */
  problems: string[];
}

/** Checks every section of a pattern (docs/design-notes.md#sewability). */
export function checkPattern(document: PatternDocument): SectionVerdict[] {
  return document.sections.map((section) => {
    const { patches, problems } = derivePatches(section);
    const verdict = checkSewability(patches);
    const result: SectionVerdict = {
      id: section.id,
      label: section.label,
      kind: section.geometry.kind,
      patchCount: patches.length,
      ringCopies: ringRepeatTransforms(section).length,
      curvedEdges: section.geometry.kind === 'straight' ? sectionEdges(section.geometry).filter((e) => e.arc).length : 0,
      sewableAsNumbered: verdict.sewable,
      problems: problems.map((p) => p.message),
    };
    if (!verdict.sewable && verdict.failure) {
      result.failure = { label: verdict.failure.label, reason: verdict.failure.reason, message: verdict.failure.message };
      const search = findSewableOrder(patches);
      if (search.found) result.sewableOrder = search.labels;
      else {
        const said = { message: search.message, ...(search.suggestion ? { cut: { from: search.suggestion.from, to: search.suggestion.to } } : {}) };
        if (search.status === 'undecided') result.undecided = said;
        else result.cannotBeSewn = said;
      }
    }
    return result;
  });
}

function describe(v: SectionVerdict): string[] {
  const copies = v.ringCopies > 1 ? `, ring repeat ×${v.ringCopies}` : '';
  const curves = v.curvedEdges > 0 ? `, ${v.curvedEdges} curved edge${v.curvedEdges === 1 ? '' : 's'}` : '';
  const head = `Section ${v.label} (${v.kind}${curves}, ${v.patchCount} patch${v.patchCount === 1 ? '' : 'es'}${copies}): `;
  const lines: string[] = [];
  if (v.sewableAsNumbered) lines.push(`${head}sewable in its numbered order`);
  else {
    lines.push(`${head}not sewable as numbered: ${v.failure?.message ?? 'unknown reason'}`);
    if (v.sewableOrder) lines.push(`  a sewable order: ${v.sewableOrder.join(', ')}`);
    if (v.cannotBeSewn) lines.push(`  ${v.cannotBeSewn.message}`);
    if (v.undecided) lines.push(`  ${v.undecided.message}`);
  }
  for (const p of v.problems) lines.push(`  problem: ${p}`);
  return lines;
}

export const checkCommand: CliCommand = {
  name: 'check',
  usage: '<pattern.json> [--json]',
  summary: 'validate a pattern and give the sewability verdict of each section',
  async run(args, io) {
    const read = await readPatternCommand('check', args, io);
    if (typeof read === 'number') return read;
    const { document, json } = read;
    const verdicts = checkPattern(document);
    if (json) {
      io.out(`${JSON.stringify({ valid: true, title: document.title, sections: verdicts }, null, 2)}\n`);
    } else {
      const sewable = verdicts.filter((v) => v.sewableAsNumbered).length;
      io.out(`${document.title}: ${verdicts.length} section${verdicts.length === 1 ? '' : 's'}, ${sewable} sewable as numbered\n`);
      for (const v of verdicts) io.out(`${describe(v).join('\n')}\n`);
    }
    return EXIT_OK;
  },
};
