/**
 * Request-thread work of saving the largest document (issue 15, item 3; docs/api.md): 100 sections of
 * 2,000-vertex outlines (tests/fixtures/largest-document.ts), straight and with every edge curved. A
 * save reads the JSON body, checks it with the piecing schema (fields, then geometry: self-crossing
 * on every outline, curved edges flattened first) and writes it back out as JSON for the database;
 * each step is timed here on its own. Target: the whole save under
 * 100 ms of request-thread time. Medians; nothing here fails on a time.
 */
import { parsePatternDocument } from '../projects/piecing/src/public-api';
import { LARGEST_OUTLINE_VERTICES, LARGEST_SECTIONS, largestDocument } from '../tests/fixtures/largest-document';
import { ms, timeRuns, type BenchSection } from './bench-kit';

export default async function saveValidationBench(): Promise<BenchSection> {
  const rows: BenchSection['rows'] = [];
  const notes: string[] = [];
  for (const [name, bulge] of [
    ['straight edges', 0],
    ['every edge curved (bulge 0.02)', 0.02],
  ] as const) {
    const text = JSON.stringify({ baseRevision: 1, document: largestDocument('Largest', bulge) });
    let parsedDocument: unknown;
    const jsonParse = await timeRuns(() => JSON.parse(text), 5);
    const check = await timeRuns(() => {
      const r = parsePatternDocument((JSON.parse(text) as { document: unknown }).document);
      if (!r.ok) throw new Error(`the largest document is refused: ${JSON.stringify(r.issues.slice(0, 3))}`);
      parsedDocument = r.document;
    }, 5);
    const stringify = await timeRuns(() => JSON.stringify(parsedDocument), 5);
    // The check's time includes reading the JSON; then the document is written out for the database.
    const total = check.medianMs + stringify.medianMs;
    rows.push({
      document: `${LARGEST_SECTIONS} × ${LARGEST_OUTLINE_VERTICES} vertices, ${name}`,
      'body MB': (text.length / 1e6).toFixed(2),
      'JSON.parse ms': ms(jsonParse.medianMs),
      'parse + schema + geometry ms': ms(check.medianMs),
      'JSON.stringify ms': ms(stringify.medianMs),
      'request thread ≈ ms': ms(total),
    });
  }
  notes.push('request thread ≈ the body read and checked, then written out again (the database insert of the text is not counted).');
  notes.push('Target: < 100 ms. Reading the 5–6 MB body and the schema and geometry checks take most of it (see the columns).');
  return { title: 'Saving the largest document: request-thread work', rows, notes };
}
