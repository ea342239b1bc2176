import type { CliIo } from '../cli-types';
import { runCli } from '../main';

/** Runs the command line with `cwd` as its directory and collects what it writes (for the specs). */
export async function runCliCollecting(cwd: string, argv: readonly string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { out: (t) => (out += t), err: (t) => (err += t), cwd };
  const code = await runCli(argv, io);
  return { code, out, err };
}
