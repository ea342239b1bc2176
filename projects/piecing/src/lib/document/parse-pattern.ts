import { FORMAT_VERSION, patternDocumentSchema, type PatternDocument } from './pattern-schema';

/** One problem found in a pattern document: where (a JSON path such as `sections.2.geometry.sweepDeg`) and what. */
export interface DocumentIssue {
  path: string;
  message: string;
}

/** The outcome of reading a pattern document. */
export type ParseResult =
  | { ok: true; document: PatternDocument }
  | { ok: false; issues: DocumentIssue[] };

/** Thrown by {@link readPatternDocument} when a document is invalid. */
export class PatternValidationError extends Error {
  constructor(readonly issues: DocumentIssue[]) {
    super(`Invalid pattern document: ${issues.map((i) => `${i.path || '(document)'}: ${i.message}`).join('; ')}`);
    this.name = 'PatternValidationError';
  }
}

/**
 * Upgrades an older document, step by step, to the current format version. Each step takes a document
 * of version n and returns one of version n + 1 (a new object; the input is untouched).
 */
const migrations: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = {
  // 1 → 2: straight sections may have curved edges (`bulges`). Every version 1 edge is straight, which
  // version 2 says by leaving `bulges` out, so only the version changes.
  1: (doc) => ({ ...doc, formatVersion: 2 }),
  // Fields added later within version 2 are optional and absent from older documents (notes, joiningPlan,
  // seam press, patch roughCut and pieceTemplate, strip-set subCutLengthIn, quilt, colourways), so they need
  // no step here: a document without `quilt` is one block, as it always was.
};

/** Brings a raw document up to {@link FORMAT_VERSION}, or returns an issue when it cannot. */
export function migratePatternDocument(raw: unknown): { ok: true; value: unknown } | { ok: false; issues: DocumentIssue[] } {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return { ok: false, issues: [{ path: '', message: 'a pattern document must be a JSON object' }] };
  }
  let doc = raw as Record<string, unknown>;
  const rawVersion = doc['formatVersion'];
  if (typeof rawVersion !== 'number' || !Number.isInteger(rawVersion) || rawVersion < 1) {
    return { ok: false, issues: [{ path: 'formatVersion', message: 'must be a whole number, 1 or more' }] };
  }
  let version: number = rawVersion;
  if (version > FORMAT_VERSION) {
    return {
      ok: false,
      issues: [{ path: 'formatVersion', message: `version ${version} is newer than this program reads (${FORMAT_VERSION})` }],
    };
  }
  while (version < FORMAT_VERSION) {
    const step = migrations[version];
    if (!step) return { ok: false, issues: [{ path: 'formatVersion', message: `no upgrade from version ${version}` }] };
    doc = step(doc);
    version = doc['formatVersion'] as number;
  }
  return { ok: true, value: doc };
}

/** Validates (and migrates) a pattern document. Never throws. */
export function parsePatternDocument(raw: unknown): ParseResult {
  const migrated = migratePatternDocument(raw);
  if (!migrated.ok) return migrated;
  const result = patternDocumentSchema.safeParse(migrated.value);
  if (result.success) return { ok: true, document: result.data };
  return {
    ok: false,
    issues: result.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message })),
  };
}

/** Validates a pattern document and throws {@link PatternValidationError} when it is invalid. */
export function readPatternDocument(raw: unknown): PatternDocument {
  const result = parsePatternDocument(raw);
  if (!result.ok) throw new PatternValidationError(result.issues);
  return result.document;
}
