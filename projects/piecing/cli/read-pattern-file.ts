import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parsePatternDocument, type DocumentIssue, type PatternDocument } from '../src/public-api';
import { EXIT_INVALID_INPUT, EXIT_USAGE, type CliIo } from './cli-types';

/** A pattern file read and validated, or the reasons it could not be. */
export type PatternFileResult = { ok: true; document: PatternDocument } | { ok: false; messages: string[]; issues?: DocumentIssue[] };

/** Reads a pattern JSON file and validates it with `parsePatternDocument`. Never throws. */
export async function readPatternFile(path: string, cwd: string): Promise<PatternFileResult> {
  let text: string;
  try {
    text = await readFile(resolve(cwd, path), 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    return { ok: false, messages: [code === 'ENOENT' ? `${path}: no such file` : `${path}: cannot be read (${code ?? String(error)})`] };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    return { ok: false, messages: [`${path}: not valid JSON (${(error as Error).message})`] };
  }
  const parsed = parsePatternDocument(raw);
  if (parsed.ok) return { ok: true, document: parsed.document };
  return {
    ok: false,
    issues: parsed.issues,
    messages: [`${path} is not a valid pattern document:`, ...parsed.issues.map((i) => `  ${i.path || '(document)'}: ${i.message}`)],
  };
}

/** Splits arguments into flags (`--json`) and positional arguments. */
export function splitArgs(args: readonly string[]): { flags: Set<string>; positional: string[] } {
  const flags = new Set<string>();
  const positional: string[] = [];
  for (const a of args) {
    if (a.startsWith('--')) flags.add(a);
    else positional.push(a);
  }
  return { flags, positional };
}

/**
 * The common start of a `<pattern.json> [--json]` command: checks the command line and reads the
 * pattern, writing the usage or the reasons the file is invalid (as JSON with `--json`). Resolves to
 * the pattern and whether JSON was asked for, or to the exit code to stop with.
 */
export async function readPatternCommand(
  commandName: string,
  args: readonly string[],
  io: CliIo,
): Promise<{ document: PatternDocument; json: boolean } | number> {
  const { flags, positional } = splitArgs(args);
  const unknown = [...flags].filter((f) => f !== '--json');
  if (positional.length !== 1 || unknown.length > 0) {
    io.err(`usage: seamwright ${commandName} <pattern.json> [--json]${unknown.length ? ` (unknown option ${unknown.join(', ')})` : ''}\n`);
    return EXIT_USAGE;
  }
  const json = flags.has('--json');
  const file = await readPatternFile(positional[0], io.cwd);
  if (!file.ok) {
    if (json) io.out(`${JSON.stringify({ valid: false, messages: file.messages, issues: file.issues ?? [] }, null, 2)}\n`);
    else io.err(`${file.messages.join('\n')}\n`);
    return EXIT_INVALID_INPUT;
  }
  return { document: file.document, json };
}
