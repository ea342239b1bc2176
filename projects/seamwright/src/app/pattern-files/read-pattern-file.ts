import { parsePatternDocument, type PatternDocument } from '@seamwright/piecing';
import type { FieldIssue } from '../core/api-error';

/** One problem in a pattern file: where (a path from the document root) and what. */
export interface PatternFileProblem {
  path: string;
  message: string;
}

/** What reading a pattern file found: a document ready to save, or every problem in it. */
export type PatternFileReading =
  | {
      ok: true;
      document: PatternDocument;
      /** Whether the file named a traced image, which stays with the pattern it was uploaded to. */
      droppedTraceImage: boolean;
    }
  | { ok: false; problems: PatternFileProblem[] };

/** Largest pattern file taken: the server takes request bodies up to 5 MB. */
export const MAX_PATTERN_FILE_BYTES = 4 * 1024 * 1024;

/**
 * Checks the text of a pattern file with the piecing library's parser (which upgrades older format
 * versions, see docs/pattern-format.md). A valid document comes back with its defaults filled in and
 * without a traced image: an image belongs to the pattern it was uploaded to, and a new pattern has none.
 */
export function checkPatternText(text: string): PatternFileReading {
  let raw: unknown;
  try {
    raw = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    return { ok: false, problems: [{ path: '', message: `not a JSON file (${err instanceof Error ? err.message : 'unreadable'})` }] };
  }
  const result = parsePatternDocument(raw);
  if (!result.ok) return { ok: false, problems: result.issues };
  const { referenceImage, ...document } = result.document;
  return { ok: true, document, droppedTraceImage: referenceImage !== undefined };
}

/** Reads a file the user chose and checks it ({@link checkPatternText}). */
export async function readPatternFile(file: Blob): Promise<PatternFileReading> {
  if (file.size > MAX_PATTERN_FILE_BYTES) {
    return { ok: false, problems: [{ path: '', message: `the file is larger than ${MAX_PATTERN_FILE_BYTES / 1024 / 1024} MB` }] };
  }
  return checkPatternText(await readText(file));
}

/** The text of a file, as UTF-8 (FileReader: every browser, and the test DOM, which lacks `Blob.text`). */
function readText(file: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(reader.result as string);
    reader.onerror = () => reject(reader.error ?? new Error('The file could not be read'));
    reader.readAsText(file, 'utf-8');
  });
}

/**
 * A problem path as people write it in JSON tools: `sections[2].geometry.vertices[1].x`; the whole
 * document is `(file)`.
 */
export function displayPath(path: string): string {
  if (!path) return '(file)';
  return path
    .split('.')
    .map((part, i) => (/^\d+$/.test(part) ? `[${part}]` : i === 0 ? part : `.${part}`))
    .join('');
}

/** The server's problems with a posted document (`document.sections.0…`), as paths in the file. */
export function problemsFromServer(issues: readonly FieldIssue[]): PatternFileProblem[] {
  return issues.map((i) => ({ path: (i.path ?? '').replace(/^document\.?/, ''), message: i.message }));
}
