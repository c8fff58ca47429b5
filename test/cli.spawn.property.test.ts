/**
 * The CLI contract over the built bundle, spawned as a user runs it (`node bin/resin-derate.js ...`;
 * npm test builds dist/ first). Spawning costs about 0.25 s a case, so each command gets a small
 * seeded sample (RD_CLI_SPAWN_RUNS, default below) run two at a time; the in-process property test
 * (cli.property.test.ts) covers many more cases and shrinks them. A failure prints the seed and the case.
 */
import { execFile } from 'node:child_process';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { propertySeed, spawnRuns } from './arbitraries.js';
import { cliCase, COMMANDS, contractBreach, writeParamFiles, type Answer, type CliCase } from './cli-cases.js';

const paramFiles = writeParamFiles();
const SPAWN_CI_RUNS = 6;
const CONCURRENCY = 2;

function spawnArgs(args: readonly string[]): Promise<Answer> {
  return new Promise((resolve) => {
    execFile(process.execPath, ['bin/resin-derate.js', ...args], { encoding: 'utf8', timeout: 30_000 }, (error, stdout, stderr) => {
      const code = error === null ? 0 : typeof error.code === 'number' ? error.code : -1;
      resolve({ code, out: stdout, err: stderr });
    });
  });
}

/** A process argument cannot hold a NUL byte (the OS passes C strings), so those are dropped here. */
function spawnCli(c: CliCase): Promise<Answer> {
  return spawnArgs([c.command, ...c.args].map((a) => a.replaceAll('\0', '')));
}

async function runAll(cases: readonly CliCase[]): Promise<Answer[]> {
  const answers: Answer[] = new Array(cases.length);
  let next = 0;
  const worker = async (): Promise<void> => {
    while (next < cases.length) {
      const i = next++;
      const c = cases[i];
      if (c !== undefined) answers[i] = await spawnCli(c);
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
  return answers;
}

describe('CLI contract, spawned: exit 0 with the documented JSON, or one stderr line naming the argument, never a stack trace', () => {
  COMMANDS.forEach((command, k) => {
    it(command, async () => {
      const seed = propertySeed() + k;
      const n = command === 'demo' ? Math.min(2, spawnRuns(SPAWN_CI_RUNS)) : spawnRuns(SPAWN_CI_RUNS);
      const cases = fc.sample(cliCase(command, paramFiles), { seed, numRuns: n });
      const answers = await runAll(cases);
      cases.forEach((c, i) => {
        const a = answers[i] ?? { code: -1, out: '', err: 'not run' };
        const breach = contractBreach(c, a);
        expect(
          breach,
          `seed ${seed} (RD_PROPERTY_SEED=${propertySeed()}), case ${i}: ${JSON.stringify(c)}\n-> code ${a.code}\nstdout: ${a.out.slice(0, 400)}\nstderr: ${a.err}`,
        ).toBeNull();
      });
    });
  });
  it('no command at all: help on stdout, one line on stderr, non-zero exit', async () => {
    const a = await spawnArgs([]);
    expect(a.code).toBe(2);
    expect(a.out).toMatch(/Usage: resin-derate COMMAND/);
    expect(a.err.trim().split('\n')).toHaveLength(1);
  });
});
