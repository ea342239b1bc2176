import { readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { findUnsewableSections, loadPrintFonts, PAPER_NAMES, printOptionsSchema, quiltPrintIssues, renderPrintSet, sheetCountStatement, unsewableStatement } from '../../src/public-api';
import { EXIT_INVALID_INPUT, EXIT_OK, EXIT_USAGE, type CliCommand } from '../cli-types';
import { readPatternFile } from '../read-pattern-file';

/** The shipped fonts folder (repository root `fonts/`), relative to this file. */
const SHIPPED_FONTS = fileURLToPath(new URL('../../../../fonts/', import.meta.url));

const USAGE =
  `usage: seamwright print <pattern.json> --out <file.pdf> [--paper ${PAPER_NAMES.join('|')}] [--margin 0.5] [--front]\n` +
  '                       [--freezer-paper] [--single] [--created <ISO time>] [--fonts <folder>] [--print-unsewable]\n' +
  '                       [--quilt-size NAME] [--colourway ID]\n';

export const printCommand: CliCommand = {
  name: 'print',
  usage: `<pattern.json> --out <file.pdf> [--paper ${PAPER_NAMES.join('|')}] [--margin 0.5] [--front]`,
  summary: 'write the print set (booklet, then true-scale, tiled, mirrored template sheets) as a PDF; refuses a section not sewable as numbered unless --print-unsewable',
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
          'print-unsewable': { type: 'boolean', default: false },
          'quilt-size': { type: 'string' },
          colourway: { type: 'string' },
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
      printUnsewable: values['print-unsewable'],
      ...(values.created ? { createdAt: values.created } : {}),
      ...(values['quilt-size'] !== undefined ? { quiltSize: values['quilt-size'] } : {}),
      ...(values.colourway !== undefined ? { colourwayId: values.colourway } : {}),
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
    const quiltIssues = quiltPrintIssues(file.document, options.data);
    if (quiltIssues.length > 0) {
      io.err(`${quiltIssues.map((i) => `${i.path}: ${i.message}`).join('\n')}\n`);
      return EXIT_INVALID_INPUT;
    }
    const unsewable = findUnsewableSections(file.document);
    if (unsewable.length > 0 && !options.data.printUnsewable) {
      io.err(`${unsewableStatement(unsewable)}\nNo print set written: renumber or split the section, or pass --print-unsewable to print anyway (its pages will say so).\n`);
      return EXIT_INVALID_INPUT;
    }
    if (unsewable.length > 0) io.err(`warning: ${unsewableStatement(unsewable)} Printing anyway (--print-unsewable); every page of ${unsewable.length === 1 ? 'that section' : 'those sections'} says so.\n`);
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
