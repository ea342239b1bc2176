/**
 * The server's check of a pattern document (the piecing library's schema and geometry, then the API
 * edge's text rule), shared by the request thread (small bodies) and the validation pool's worker
 * (large ones). Nothing here touches the database, so a worker thread can import it.
 */
import { multiLineText, singleLineText } from '@seamwright/api';
import { parsePatternDocument, type PatternDocument } from '@seamwright/piecing';
import { HttpError } from '../http/errors';

/** Validates a pattern document with the piecing library's schema; 400 with the bad paths otherwise. */
export function validDocument(raw: unknown): PatternDocument {
  const result = parsePatternDocument(raw);
  if (!result.ok) {
    throw new HttpError(
      400,
      'The pattern document is not valid',
      result.issues.map((i) => ({ path: i.path ? `document.${i.path}` : 'document', message: i.message })),
    );
  }
  return withoutControlCharacters(result.document);
}

/**
 * The document's text without control characters (the API edge's rule, docs/api.md): title, fabric
 * and strip-set names, section notes and the designer's notes. A title left empty is refused.
 */
function withoutControlCharacters(doc: PatternDocument): PatternDocument {
  const title = singleLineText(doc.title).trim();
  if (!title) throw new HttpError(400, 'The pattern document is not valid', [{ path: 'document.title', message: 'must not be empty' }]);
  doc.title = title;
  for (const f of doc.fabrics ?? []) f.name = singleLineText(f.name).trim() || 'Fabric';
  for (const section of doc.sections as { name?: string; note?: string }[]) {
    if (typeof section.name === 'string') section.name = singleLineText(section.name);
    if (typeof section.note === 'string') section.note = multiLineText(section.note);
  }
  const withNotes = doc as { notes?: string };
  if (typeof withNotes.notes === 'string') withNotes.notes = multiLineText(withNotes.notes);
  return doc;
}

/**
 * A validated document as the database stores it: its JSON text (what `JSON.stringify` gives of the
 * checked document) and its title. The validation pool hands this back, so the request thread neither
 * parses nor writes out a large document.
 */
export class DocumentText {
  constructor(
    readonly title: string,
    readonly json: string,
  ) {}

  static of(document: PatternDocument): DocumentText {
    return new DocumentText(document.title, JSON.stringify(document));
  }

  /**
   * A stored revision's text, to store again as it is (a restore): it was written by JSON.stringify of
   * a checked document, so parsing and writing it out again would give the same text. Only its title is
   * read, by a scan that stops at the top-level `"title"` key (the second key as written).
   */
  static stored(json: string): DocumentText {
    return new DocumentText(topLevelTitle(json) ?? (JSON.parse(json) as { title: string }).title, json);
  }
}

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const COLON = 0x3a;

/** The end (index of the closing quote) of the JSON string starting at `start`. */
function stringEnd(json: string, start: number): number {
  let i = start + 1;
  for (; i < json.length && json.charCodeAt(i) !== QUOTE; i++) if (json.charCodeAt(i) === BACKSLASH) i++;
  return i;
}

/** The value of the top-level `"title"` key of a JSON object text written without spaces; undefined if not found so. */
function topLevelTitle(json: string): string | undefined {
  let depth = 0;
  for (let i = 0; i < json.length; i++) {
    const c = json[i];
    if (c === '"') {
      const start = i;
      i = stringEnd(json, i);
      // A key of the top-level object: a string followed by a colon at depth 1 (values are followed by `,` or `}`).
      if (depth === 1 && json.charCodeAt(i + 1) === COLON && json.slice(start, i + 1) === '"title"') {
        if (json[i + 2] !== '"') return undefined;
        return JSON.parse(json.slice(i + 2, stringEnd(json, i + 2) + 1)) as string;
      }
    } else if (c === '{' || c === '[') depth++;
    else if (c === '}' || c === ']') depth--;
  }
  return undefined;
}
