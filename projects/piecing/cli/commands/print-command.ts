import { readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { loadPrintFonts, PAPER_NAMES, printOptionsSchema, renderPrintSet, sheetCountStatement } from '../../src/public-api';
import { EXIT_INVALID_INPUT, EXIT_OK, EXIT_USAGE, type CliCommand } from '../cli-types';
import { readPatternFile } from '../read-pattern-file';

/** The shipped fonts folder (repository root `fonts/`), relative to this file. */
const SHIPPED_FONTS = fileURLToPath(new URL('../../../../fonts/', import.meta.url));

const USAGE =
  `usage: seamwright print <pattern.json> --out <file.pdf> [--paper ${PAPER_NAMES.join('|')}] [--margin 0.5] [--front]\n` +
  '                       [--freezer-paper] [--single] [--created <ISO time>] [--fonts <folder>]\n';

export const printCommand: CliCommand = {
  name: 'print',
  usage: `<pattern.json> --out <file.pdf> [--paper ${PAPER_NAMES.join('|')}] [--margin 0.5] [--front]`,
  summary: 'write the print set (true-scale, tiled, mirrored template sheets with cutting list) as a PDF',
  async run(args, io) {
    let parsed;
    try {
      parsed = parseArgs({
        args,
        allowPositionals: true,
        strict: true,
        options: {
          out: { type: 'string' },
          paper: { type: 'string', default: 'letter' },
          margin: { type: 'string', default: '0.5' },
          front: { type: 'boolean', default: false },
          'freezer-paper': { type: 'boolean', default: false },
          single: { type: 'boolean', default: false },
          created: { type: 'string' },
          fonts: { type: 'string' },
        },
      });
    } catch (error) {
      io.err(`${(error as Error).message}\n${USAGE}`);
      return EXIT_USAGE;
    }
    const { values, positionals } = parsed;
    if (positionals.length !== 1 || !values.out) {
      io.err(USAGE);
      return EXIT_USAGE;
    }
    const options = printOptionsSchema.safeParse({
      paper: values.paper,
      marginIn: Number(values.margin),
      mirrored: !values.front,
      foundation: values['freezer-paper'] ? 'freezer-paper' : 'paper',
      copies: values.single ? 'single' : 'plan',
      ...(values.created ? { createdAt: values.created } : {}),
    });
    if (!options.success) {
      const lines = options.error.issues.map((i) => `  ${i.path.join('.') || '(options)'}: ${i.message}`);
      io.err(`invalid print options:\n${lines.join('\n')}\n${USAGE}`);
      return EXIT_USAGE;
    }
    const file = await readPatternFile(positionals[0], io.cwd);
    if (!file.ok) {
      io.err(`${file.messages.join('\n')}\n`);
      return EXIT_INVALID_INPUT;
    }
    const fontDir = values.fonts ? resolve(io.cwd, values.fonts) : SHIPPED_FONTS;
    const fonts = await loadPrintFonts((name) => readFile(join(fontDir, name)));
    const result = await renderPrintSet(file.document, { ...options.data, fonts });
    const outPath = resolve(io.cwd, values.out);
    await writeFile(outPath, result.pdf);
    io.out(
      `${file.document.title}: ${result.sheetCount} sheets written to ${values.out} ` +
        `(templates: ${sheetCountStatement(result)}; ${options.data.mirrored ? 'mirrored' : 'as seen from the front'}, ${options.data.paper})\n`,
    );
    return EXIT_OK;
  },
};
