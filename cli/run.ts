/**
 * The CLI as a Node process (the entry of dist/cli.js, started by bin/resin-derate.js): standard
 * output and error, the exit code, and the guards that keep every failure to one stderr line. A
 * reader that stops early (`resin-derate families | head -1`) closes the pipe: the rest of the answer
 * is dropped quietly (EPIPE), and the command still finishes its files (demo --workbook).
 */
import { main, VERSION } from './main.js';
import { describeFault, EXIT, oneLine } from './failure.js';

export { main, VERSION };

function codeOf(e: unknown): string {
  return e instanceof Error && 'code' in e && typeof e.code === 'string' ? e.code : '';
}

/** Runs `resin-derate` with the process's arguments and streams; sets process.exitCode. */
export async function runCli(argv: readonly string[] = process.argv.slice(2)): Promise<void> {
  let stdoutClosed = false;
  let stdoutFailed = false;
  const say = (line: string): void => {
    try {
      process.stderr.write(`${oneLine(line)}\n`);
    } catch {
      // Nowhere left to report to.
    }
  };
  process.stdout.on('error', (e) => {
    if (stdoutClosed) return;
    stdoutClosed = true;
    if (codeOf(e) === 'EPIPE' || codeOf(e) === 'ERR_STREAM_DESTROYED') return;
    stdoutFailed = true;
    say(`resin-derate: cannot write to standard output: ${e.message}`);
  });
  process.stderr.on('error', () => undefined);
  const fault = (e: unknown): void => {
    say(`resin-derate: internal error (please report): ${describeFault(e)}`);
    process.exit(EXIT.internal);
  };
  process.on('uncaughtException', fault);
  process.on('unhandledRejection', fault);
  const out = {
    write(text: string): void {
      if (!stdoutClosed) process.stdout.write(text);
    },
  };
  const err = {
    write(text: string): void {
      process.stderr.write(text);
    },
  };
  const code = await main(argv, out, err);
  process.exitCode = stdoutFailed && code === EXIT.answer ? EXIT.badInput : code;
}
