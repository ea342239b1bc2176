import type { CliCommand } from '../cli-types';
import { checkCommand } from './check-command';
import { cuttingListCommand } from './cutting-list-command';
import { printCommand } from './print-command';
import { quiltCommand } from './quilt-command';
import { schemaCommand } from './schema-command';

/*
 * The command registry. To add a command:
 *   1. write commands/<name>-command.ts exporting a `CliCommand` (see cli-types.ts and check-command.ts;
 *      read-pattern-file.ts reads and validates a pattern file);
 *   2. import it here and add ONE line to the list below, e.g.
 *        import { cuttingListCommand } from './cutting-list-command';
 *        …
 *        cuttingListCommand,
 *   3. add a spec next to it (commands/<name>-command.spec.ts) that calls `runCli` from ../main.
 * Help lists the commands in this order.
 */
export const commands: readonly CliCommand[] = [
  checkCommand,
  cuttingListCommand,
  printCommand,
  quiltCommand,
  schemaCommand,
];
