/** Where a command writes. Tests pass collecting functions; main.ts passes the process streams. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  /** Directory relative paths are read from and written to. */
  cwd: string;
}

/** One command of `npm run seamwright -- <name> …`. */
export interface CliCommand {
  /** The word typed after `seamwright`. */
  name: string;
  /** Arguments as shown in the help, e.g. `<pattern.json> [--json]`. */
  usage: string;
  /** One line for the help. */
  summary: string;
  /** Runs with the arguments after the command name; resolves to the exit code. */
  run(args: string[], io: CliIo): Promise<number> | number;
}

/** Exit codes: 0 done (whatever the verdicts), 1 the input is invalid, 2 the command line is wrong. */
export const EXIT_OK = 0;
export const EXIT_INVALID_INPUT = 1;
export const EXIT_USAGE = 2;
