/** The CLI run in-process through main(), the code the bundle holds, with what it writes captured instead of printed. */
import { main } from '../../cli/main.js';
import type { Answer } from '../cli-cases.js';

/** Runs `resin-derate ARGV...` in-process; the exit code and the whole of stdout and stderr as text. */
export async function runMain(argv: readonly string[]): Promise<Answer> {
  let out = '';
  let err = '';
  const code = await main(argv, { write: (s: string) => (out += s) }, { write: (s: string) => (err += s) });
  return { code, out, err };
}
