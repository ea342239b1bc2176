/**
 * Seamwright's command line: `npm run seamwright -- <command> …` (see commands/index.ts for the list).
 * Exit codes: 0 done, 1 the input file is invalid, 2 the command line is wrong.
 */
import { pathToFileURL } from 'node:url';
import { EXIT_USAGE, type CliIo } from './cli-types';
import { commands } from './commands/index';

/** Help text listing every registered command. */
export function helpText(): string {
  const width = Math.max(...commands.map((c) => `${c.name} ${c.usage}`.length));
  return [
    'usage: npm run seamwright -- <command> [arguments]',
    '',
    'commands:',
    ...commands.map((c) => `  ${`${c.name} ${c.usage}`.padEnd(width)}  ${c.summary}`),
    '',
    'exit codes: 0 done (whatever the verdicts), 1 invalid input file, 2 wrong command line',
    '',
  ].join('\n');
}

/** Runs one command line (the arguments after the program name) and resolves to the exit code. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const [name, ...args] = argv;
  if (!name || name === 'help' || name === '--help' || name === '-h') {
    io.out(helpText());
    return name ? 0 : EXIT_USAGE;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.err(`unknown command "${name}"\n\n${helpText()}`);
    return EXIT_USAGE;
  }
  return command.run(args, io);
}

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (isMain) {
  const io: CliIo = { out: (t) => process.stdout.write(t), err: (t) => process.stderr.write(t), cwd: process.cwd() };
  runCli(process.argv.slice(2), io).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      process.stderr.write(`seamwright: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
