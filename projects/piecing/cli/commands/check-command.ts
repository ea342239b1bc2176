import type { PatternDocument, Section } from '../../src/public-api';
import { checkSewability, derivePatches, findSewableOrder, ringRepeatTransforms } from '../../src/public-api';
import { EXIT_INVALID_INPUT, EXIT_OK, EXIT_USAGE, type CliCommand } from '../cli-types';
import { readPatternFile, splitArgs } from '../read-pattern-file';

/** The verdict on one section, as printed with --json. */
export interface SectionVerdict {
  id: string;
  label: string;
  kind: Section['geometry']['kind'];
  patchCount: number;
  /** Copies around the ring (1 without a ring repeat). */
  ringCopies: number;
  /** Whether the patches can be sewn in their numbered order. */
  sewableAsNumbered: boolean;
  /** Why not, naming the first failing patch. */
  failure?: { label: string; reason: string; message: string };
  /** A sewable order (patch labels) when the numbered one fails, if one exists. */
  sewableOrder?: string[];
  /** When no order exists: what the search says, and the suggested cut. */
  cannotBeSewn?: { message: string; cut?: { from: { x: number; y: number }; to: { x: number; y: number } } };
  /** Seams that do not cross their patch, stray anchors. */
  problems: string[];
}

/** Checks every section of a pattern (design.md §5.3). */
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
      sewableAsNumbered: verdict.sewable,
      problems: problems.map((p) => p.message),
    };
    if (!verdict.sewable && verdict.failure) {
      result.failure = { label: verdict.failure.label, reason: verdict.failure.reason, message: verdict.failure.message };
      const search = findSewableOrder(patches);
      if (search.found) result.sewableOrder = search.labels;
      else result.cannotBeSewn = { message: search.message, ...(search.suggestion ? { cut: { from: search.suggestion.from, to: search.suggestion.to } } : {}) };
    }
    return result;
  });
}

function describe(v: SectionVerdict): string[] {
  const copies = v.ringCopies > 1 ? `, ring repeat ×${v.ringCopies}` : '';
  const head = `Section ${v.label} (${v.kind}, ${v.patchCount} patch${v.patchCount === 1 ? '' : 'es'}${copies}): `;
  const lines: string[] = [];
  if (v.sewableAsNumbered) lines.push(`${head}sewable in its numbered order`);
  else {
    lines.push(`${head}not sewable as numbered: ${v.failure?.message ?? 'unknown reason'}`);
    if (v.sewableOrder) lines.push(`  a sewable order: ${v.sewableOrder.join(', ')}`);
    if (v.cannotBeSewn) lines.push(`  ${v.cannotBeSewn.message}`);
  }
  for (const p of v.problems) lines.push(`  problem: ${p}`);
  return lines;
}

export const checkCommand: CliCommand = {
  name: 'check',
  usage: '<pattern.json> [--json]',
  summary: 'validate a pattern and give the sewability verdict of each section',
  async run(args, io) {
    const { flags, positional } = splitArgs(args);
    const unknown = [...flags].filter((f) => f !== '--json');
    if (positional.length !== 1 || unknown.length > 0) {
      io.err(`usage: seamwright check <pattern.json> [--json]${unknown.length ? ` (unknown option ${unknown.join(', ')})` : ''}\n`);
      return EXIT_USAGE;
    }
    const file = await readPatternFile(positional[0], io.cwd);
    if (!file.ok) {
      if (flags.has('--json')) io.out(`${JSON.stringify({ valid: false, messages: file.messages, issues: file.issues ?? [] }, null, 2)}\n`);
      else io.err(`${file.messages.join('\n')}\n`);
      return EXIT_INVALID_INPUT;
    }
    const verdicts = checkPattern(file.document);
    if (flags.has('--json')) {
      io.out(`${JSON.stringify({ valid: true, title: file.document.title, sections: verdicts }, null, 2)}\n`);
    } else {
      const sewable = verdicts.filter((v) => v.sewableAsNumbered).length;
      io.out(`${file.document.title}: ${verdicts.length} section${verdicts.length === 1 ? '' : 's'}, ${sewable} sewable as numbered\n`);
      for (const v of verdicts) io.out(`${describe(v).join('\n')}\n`);
    }
    return EXIT_OK;
  },
};
