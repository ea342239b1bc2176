import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { patternJsonSchemaText } from '../../src/public-api';
import { EXIT_OK, EXIT_USAGE, type CliCommand } from '../cli-types';
import { splitArgs } from '../read-pattern-file';

/** Where the committed JSON Schema lives, relative to the repository root. */
export const SCHEMA_FILE = 'docs/pattern-format.schema.json';

export const schemaCommand: CliCommand = {
  name: 'schema',
  usage: '[--write]',
  summary: `print the pattern document's JSON Schema, or write it to ${SCHEMA_FILE}`,
  async run(args, io) {
    const { flags, positional } = splitArgs(args);
    if (positional.length > 0 || [...flags].some((f) => f !== '--write')) {
      io.err('usage: seamwright schema [--write]\n');
      return EXIT_USAGE;
    }
    const text = patternJsonSchemaText();
    if (flags.has('--write')) {
      await writeFile(resolve(io.cwd, SCHEMA_FILE), text, 'utf8');
      io.out(`wrote ${SCHEMA_FILE}\n`);
    } else io.out(text);
    return EXIT_OK;
  },
};
