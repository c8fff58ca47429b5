/**
 * The built CLI, spawned as a user runs it (npm test builds dist/ first), on the classes of issue 11:
 * negative values after an option, --version, and failures that must stay one stderr line with a
 * documented exit code (README "Command-line tool"): command names that are Object.prototype members,
 * output files in a missing folder or onto a folder, a reader that closes the pipe early, --params
 * files with a byte-order mark or broken JSON, and a fault of the program itself.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { getFamily, paramsToRecord } from '../src/index.js';
import { expectClose } from './expect.js';

const BIN = 'bin/resin-derate.js';
const DEMO_CSV = 'demo/latch-pc-relaxation-invented.csv';

function cli(...args: string[]): { code: number; out: string; err: string } {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8' });
  return { code: r.status ?? -1, out: r.stdout, err: r.stderr };
}

/** One stderr line starting with `prefix`, no stack trace, exit `code`. */
function expectOneLine(r: { code: number; err: string }, code: number, pattern: RegExp): void {
  expect(r.err, r.err).toMatch(/^[^\n]*\n$/);
  expect(r.err).not.toMatch(/\s+at .*:\d+:\d+|node:internal|\^\n/);
  expect(r.err).toMatch(pattern);
  expect(r.code).toBe(code);
}

describe('CLI values as typed', () => {
  it('takes a negative temperature after its option, bare, with a unit, or after =', () => {
    const answers = [['--temp', '-40'], ['--temp', '-40 degC'], ['--temp=-40']].map((t) => {
      const r = cli('modulus', '--family', 'PP', ...t, '--time', '1000 h', '--json');
      expect(r.err).toBe('');
      expect(r.code).toBe(0);
      return JSON.parse(r.out) as { modulus_MPa: number; temperature_C: number };
    });
    for (const a of answers) {
      expect(a.temperature_C).toBe(-40);
      expect(a.modulus_MPa).toBe(answers[0]?.modulus_MPa);
    }
  });

  it('takes a duty cycle whose first segment is below zero', () => {
    const r = cli('eqtime', '--family', 'PP', '--cycle', '-30 degC:8 h,-30:16', '--cycles', '2', '--json');
    expect(r.err).toBe('');
    const a = JSON.parse(r.out) as { equivalent_time_h: number; ref_temperature_C: number };
    expect(a.ref_temperature_C).toBe(-30);
    expectClose(a.equivalent_time_h, 48, { rel: 1e-12, source: 'constant history: equivalent time = duration (2 x 24 h)' });
  });

  it('--version prints the version of package.json', () => {
    const version = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;
    const r = cli('--version');
    expect(r).toEqual({ code: 0, out: `resin-derate ${version}\n`, err: '' });
  });
});

describe('CLI failures: one stderr line and a documented exit code', () => {
  it('a command named like an Object.prototype member is an unknown command (exit 2)', () => {
    // toString, __proto__ and the other member names: in process, in cli-args.test.ts.
    expectOneLine(cli('constructor'), 2, /^resin-derate: unknown command 'constructor'; commands: families,/);
  });

  it('--out and --workbook into a missing folder or onto a folder name the option and the problem (exit 2), before any work', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rd-out-'));
    const missing = join(dir, 'no-such-folder', 'x.json');
    expectOneLine(
      cli('calibrate', '--family', 'PC', '--hdt-a', '132', '--out', missing),
      2,
      /^resin-derate calibrate: --out: cannot write '.*x\.json': the folder '.*no-such-folder' does not exist\n/,
    );
    expectOneLine(
      cli('fit', '--data', DEMO_CSV, '--out', dir),
      2,
      /^resin-derate fit: --out: '.*' is a folder; give a file name, such as '.*record\.json'\n/,
    );
    expectOneLine(cli('demo', '--workbook', dir), 2, /^resin-derate demo: --workbook: '.*' is a folder; give a file name/);
    expectOneLine(
      cli('demo', '--workbook', join(dir, 'gone', 'r.xlsx')),
      2,
      /^resin-derate demo: --workbook: cannot write .* does not exist/,
    );
    expect(existsSync(join(dir, 'gone'))).toBe(false);
  });

  it('a reader that closes the pipe before the answer: no message, exit 0, and the workbook still written whole', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rd-pipe-'));
    const book = join(dir, 'review.xlsx');
    for (const args of [['families'], ['demo', '--workbook', book]]) {
      const child = spawn(process.execPath, [BIN, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
      // Closing our end at once makes the CLI's first write fail with EPIPE, as `| head -1` does after a line.
      child.stdout.destroy();
      let err = '';
      child.stderr.on('data', (d: Buffer) => (err += d.toString()));
      const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
      expect({ args, code, err }).toEqual({ args, code: 0, err: '' });
    }
    // An .xlsx is a zip archive: 'PK' first (APPNOTE.TXT, PKWARE, local file header signature).
    expect(readFileSync(book).subarray(0, 2).toString('latin1')).toBe('PK');
    expect(statSync(book).size).toBeGreaterThan(5000);
  });

  it('--params with a byte-order mark is read; broken JSON names --params, the line and the column (exit 2)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rd-params-'));
    const record = JSON.stringify(paramsToRecord(getFamily('PC').params), null, 2);
    writeFileSync(join(dir, 'bom.json'), `\uFEFF${record}`);
    writeFileSync(join(dir, 'broken.json'), '{\n  "kind": "amorphous",\n  "Tg_C": 150,\n}\n');
    const withBom = cli('modulus', '--params', join(dir, 'bom.json'), '--temp', '80', '--time', '1000 h', '--json');
    const plain = cli('modulus', '--family', 'PC', '--temp', '80', '--time', '1000 h', '--json');
    expect(withBom.err).toBe('');
    expect(JSON.parse(withBom.out)).toEqual(JSON.parse(plain.out));
    expectOneLine(
      cli('modulus', '--params', join(dir, 'broken.json'), '--temp', '80', '--time', '1000 h'),
      2,
      /^resin-derate modulus: --params: '.*broken\.json' is not valid JSON at line 4, column 1: /,
    );
  });

  it('a fault of the program is one line "internal error (please report)" and exit 70', () => {
    // The process guards of cli/run.ts, met by an error no command handles (thrown outside any command).
    const script = `import { runCli } from './dist/cli.js'; setTimeout(() => { throw new TypeError('boom'); }, 0); await runCli(['families']);`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' });
    expectOneLine({ code: r.status ?? -1, err: r.stderr }, 70, /^resin-derate: internal error \(please report\): TypeError: boom\n$/);
  });
});
