import { z } from 'zod';
import { FORMAT_VERSION, patternDocumentSchema } from './pattern-schema';

/**
 * The JSON Schema (draft 2020-12) of the pattern document as written by hand or sent by a client
 * (fields with defaults are optional). Cross-field rules (unique ids, known fabrics, inner radius below
 * outer, one bulge per vertex, outlines that do not cross themselves) are checked by `parsePatternDocument` only; the schema
 * carries the shapes, types and bounds. Committed as docs/pattern-format.schema.json; the `schema`
 * command of the command line rewrites it.
 */
export function patternJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(patternDocumentSchema, { io: 'input', target: 'draft-2020-12' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: `Seamwright pattern document, format version ${FORMAT_VERSION}`,
    description:
      'Lengths in inches, coordinates with x to the right and y down, angles in degrees from +x towards +y. ' +
      'Unique ids and labels, known fabric ids, inner radius below outer radius, one bulge per vertex and outlines ' +
      'that do not cross themselves are checked by the program as well (see docs/pattern-format.md).',
    ...rest,
  };
}

/** {@link patternJsonSchema} as the text of the committed file (two-space indent, final newline). */
export function patternJsonSchemaText(): string {
  return `${JSON.stringify(patternJsonSchema(), null, 2)}\n`;
}
