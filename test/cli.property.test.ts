/**
 * Property tests over every CLI command, run in-process through main() (the same code the bundle
 * holds; test/cli.spawn.property.test.ts spawns the built CLI for a smaller sample). A rejected
 * main() would be an uncaught exception, i.e. a stack trace on the terminal.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { propertyParameters } from './arbitraries.js';
import { cliCase, COMMANDS, contractBreach, writeParamFiles, type Answer, type CliCase } from './cli-cases.js';
import { runMain } from './support/cli-run.js';

const paramFiles = writeParamFiles();

function run(c: CliCase): Promise<Answer> {
  return runMain([c.command, ...c.args]);
}

describe('CLI contract, in-process: exit 0 with the documented JSON, or one stderr line naming the argument', () => {
  for (const command of COMMANDS) {
    it(command, async () => {
      await fc.assert(
        fc.asyncProperty(cliCase(command, paramFiles), async (c) => {
          const a = await run(c);
          const breach = contractBreach(c, a);
          expect(breach, `${JSON.stringify(c)}\n-> code ${a.code}\nstdout: ${a.out.slice(0, 400)}\nstderr: ${a.err}`).toBeNull();
        }),
        propertyParameters(command === 'demo' ? 3 : 150),
      );
    });
  }
  it('no command: the help on stdout, one line on stderr, non-zero exit', async () => {
    const { code, out, err } = await runMain([]);
    expect(code).not.toBe(0);
    expect(out).toMatch(/Usage: resin-derate COMMAND/);
    expect(err).toBe('resin-derate: a command is required; the commands are listed above\n');
  });
  it('an unknown command answers on stderr in one line', async () => {
    for (const name of ['frobnicate', 'MODULUS', '', '--json', 'ಠ_ಠ']) {
      const a = await run({ command: name as never, args: [] });
      expect(a.code).not.toBe(0);
      expect(a.err.trim().split('\n')).toHaveLength(1);
      expect(a.err).toMatch(/^resin-derate: unknown command '.*'; commands: families, /);
    }
  });
});
