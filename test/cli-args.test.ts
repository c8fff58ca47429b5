/**
 * The CLI's argument reader, file reading and failure reporting, in process (cli/args.ts, files.ts,
 * failure.ts, through main() where the whole path matters). The spawned checks are in cli-failures.test.ts.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readArgs, type Options } from '../cli/args.js';
import { jsonSyntaxError, lineColumn, readJsonFile } from '../cli/files.js';
import { EXIT, failure } from '../cli/failure.js';
import { main } from '../cli/main.js';
import type { Command } from '../cli/command.js';
import { getFamily, InputError, paramsToRecord, ParameterError, SolverError } from '../src/index.js';
import { propertyParameters } from './arbitraries.js';
import type { Answer } from './cli-cases.js';
import { runMain } from './support/cli-run.js';

const OPTIONS: Options = { family: { type: 'string' }, temp: { type: 'string' }, time: { type: 'string' }, json: { type: 'boolean' } };

function problem(args: readonly string[]): string {
  try {
    readArgs(args, OPTIONS, 'modulus');
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
  return '';
}

function run(...argv: string[]): Promise<Answer> {
  return runMain(argv);
}

describe('readArgs', () => {
  it('takes the argument after a value option as typed, and the same after =', () => {
    // Any text not starting with '--' is a value, negative numbers and unit text included (issue 11).
    fc.assert(
      fc.property(
        fc.string().filter((v) => !v.startsWith('--')),
        (v) => {
          expect(readArgs(['--temp', v], OPTIONS, 'modulus').values['temp']).toBe(v);
          expect(readArgs([`--temp=${v}`], OPTIONS, 'modulus').values['temp']).toBe(v);
        },
      ),
      propertyParameters(200),
    );
    expect({ ...readArgs(['--temp', '-40 degC', '--time', '-1', '--json'], OPTIONS, 'modulus').values }).toEqual({
      temp: '-40 degC',
      time: '-1',
      json: true,
    });
  });

  it('names the option in every refusal', () => {
    const cases: [string[], string][] = [
      [['--temp'], '--temp: needs a value: --temp VALUE or --temp=VALUE'],
      [['--temp', '--time', '1'], '--temp: needs a value: --temp VALUE or --temp=VALUE'],
      [['--bogus', '1'], '--bogus: unknown option; modulus takes --family, --temp, --time, --json, --help'],
      [['-x'], '-x: unknown option; modulus takes --family, --temp, --time, --json, --help'],
      [['--json=yes'], "--json: takes no value, got 'yes'"],
      [['--temp', '80', 'stray'], "'stray': unexpected argument; a value follows its option, such as --family VALUE"],
      [['\u2014temp', '80'], "'\u2014temp': unexpected argument; options start with two plain hyphens (--), not a typographic dash"],
      // POSIX.1-2017 XBD 12.2, Utility Syntax Guideline 10: '--' ends the options; these commands take no operands.
      [['--', '80'], "'80': unexpected argument; a value follows its option, such as --family VALUE"],
      [['--constructor'], '--constructor: unknown option; modulus takes --family, --temp, --time, --json, --help'],
      [['--__proto__=1'], '--__proto__: unknown option; modulus takes --family, --temp, --time, --json, --help'],
    ];
    for (const [args, message] of cases) expect(problem(args), args.join(' ')).toBe(message);
  });

  it('--help anywhere wins over a refusal; a repeated option keeps its last value (common practice)', () => {
    expect(readArgs(['--bogus', '--temp', '--help'], OPTIONS, 'modulus').help).toBe(true);
    expect(readArgs(['-h'], OPTIONS, 'modulus').help).toBe(true);
    expect(readArgs(['--temp', '1', '--temp=2'], OPTIONS, 'modulus').values['temp']).toBe('2');
    expect(problem(['--', ''])).toMatch(/^'': unexpected argument/);
    expect(problem(['--'])).toBe('');
  });
});

describe('JSON syntax errors', () => {
  it('agree with JSON.parse on what is valid, for JSON texts and texts one edit away', () => {
    // Reference: JSON.parse (ECMA-262 JSON.parse over the ECMA-404 / RFC 8259 grammar).
    const damaged = fc
      .tuple(fc.json(), fc.nat(), fc.constantFrom('', ',', '}', ']', '"', ':', "'", '\n', '0', '-', 'x', '\\', '\u0001', '{', '['))
      .map(([text, at, insert]) => {
        const i = text.length === 0 ? 0 : at % text.length;
        return at % 2 === 0 ? text.slice(0, i) + insert + text.slice(i) : text.slice(0, i) + insert + text.slice(i + 1);
      });
    fc.assert(
      fc.property(fc.oneof(fc.json(), damaged), (text) => {
        let valid = true;
        try {
          JSON.parse(text);
        } catch {
          valid = false;
        }
        expect(jsonSyntaxError(text) === null, JSON.stringify(text)).toBe(valid);
      }),
      propertyParameters(500),
    );
  });

  it('points at the first offending character', () => {
    const at = (text: string): [number, number, string] => {
      const e = jsonSyntaxError(text);
      if (e === null) throw new Error(`valid: ${text}`);
      const { line, column } = lineColumn(text, e.offset);
      return [line, column, e.problem];
    };
    expect(at('{"a":1,}')).toEqual([1, 8, 'expected a property name in double quotes (JSON allows no comma before a closing brace)']);
    expect(at('[1,\n 2\n 3]')).toEqual([3, 2, "expected ',' or ']'"]);
    expect(at("{'a': 1}")).toEqual([1, 2, 'expected a property name in double quotes']);
    expect(at('{"a": \'x\'}')).toEqual([1, 7, "unexpected ''' where a value is expected (JSON strings use double quotes)"]);
    expect(at('{"a": 1')).toEqual([1, 8, "the text ends inside an object (a '}' is missing)"]);
    expect(at(' \n ')).toEqual([1, 1, 'the file is empty']);
  });

  it('a --params file: the byte-order mark is dropped, and a syntax error names --params, the file, the line and the column', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rd-json-'));
    writeFileSync(join(dir, 'bom.json'), '\uFEFF{"a": 1}');
    writeFileSync(join(dir, 'bad.json'), '{\n  "a": 1\n  "b": 2\n}');
    expect(readJsonFile(join(dir, 'bom.json'), '--params')).toEqual({ a: 1 });
    expect(() => readJsonFile(join(dir, 'bad.json'), '--params')).toThrow(
      /^--params: '.*bad\.json' is not valid JSON at line 3, column 3: expected ',' or '}'$/,
    );
  });
});

describe('failure reports', () => {
  const command: Command = {
    summary: '',
    usage: '',
    options: { params: { type: 'string' }, tm: { type: 'string' }, temp: { type: 'string' } },
    names: { Tm: '--tm' },
    run: () => undefined,
  };

  it('exit 1 for no answer, 2 for bad input, 70 for a fault of the program; engine names become options', () => {
    expect(failure(new SolverError('bracket lost', 12, 0.5), command, {})).toEqual({
      code: EXIT.noAnswer,
      message: 'no answer: solver did not converge: bracket lost (after 12 iterations, residual 0.5)',
    });
    expect(failure(new InputError('Tm', 'is only used for semi-crystalline materials'), command, {})).toEqual({
      code: EXIT.badInput,
      message: '--tm: is only used for semi-crystalline materials',
    });
    expect(failure(new InputError('temperature', 'too hot'), command, {}).message).toBe('--temp: too hot');
    expect(failure(new InputError('cycles', 'too many'), command, {}).message).toBe('cycles: too many');
    expect(failure(new ParameterError('Tg_C', 'is out of range'), command, { params: 'a.json' }).message).toBe(
      "--params: in 'a.json', parameter Tg_C: is out of range",
    );
    expect(failure(new TypeError("Cannot read properties of undefined (reading 'x')"), command, {})).toEqual({
      code: EXIT.internal,
      message: "internal error (please report): TypeError: Cannot read properties of undefined (reading 'x')",
    });
    expect([EXIT.answer, EXIT.noAnswer, EXIT.badInput, EXIT.internal]).toEqual([0, 1, 2, 70]);
  });

  it('main never throws: an unexpected error while answering is one line and exit 70', async () => {
    let err = '';
    const broken = {
      write: () => {
        throw new RangeError('Maximum call stack size exceeded');
      },
    };
    const code = await main(['families'], broken, { write: (s: string) => (err += s) });
    expect(code).toBe(70);
    expect(err).toBe('resin-derate families: internal error (please report): RangeError: Maximum call stack size exceeded\n');
    err = '';
    expect(await main(['--help'], broken, { write: (s: string) => (err += s) })).toBe(70);
    expect(err).toBe('resin-derate: internal error (please report): RangeError: Maximum call stack size exceeded\n');
  });

  it('names the --params file with the field, and --free names that are not parameter names', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rd-fields-'));
    const file = join(dir, 'hot.json');
    writeFileSync(file, JSON.stringify({ ...paramsToRecord(getFamily('PC').params), Tg_C: 999 }));
    const r = await run('modulus', '--params', file, '--temp', '80', '--time', '1 h');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^resin-derate modulus: --params: in '.*hot\.json', parameter Tg_C: 999 degC is outside /);
    const free = [
      await run('calibrate', '--family', 'PC', '--hdt-a', '132', '--free', 'Tg_C,foo'),
      await run('dmafit', '--family', 'PC', '--data', 'demo/latch-pc-dma-invented.csv', '--frequency', '1', '--free', 'foo'),
    ];
    for (const f of free) expect(f.err).toMatch(/^resin-derate \w+: --free: 'foo' is not a parameter name; the names are Tg_C, Tm_C, /);
    const f = await run('calibrate', '--family', 'PC', '--tg', '150', '--free', 'foo');
    expect(f.err).toMatch(/^resin-derate calibrate: --free: 'foo' is not a parameter name; the names are Tg_C, /);
  });

  it('calibrate names its options, not the engine words for its inputs', async () => {
    const none = await run('calibrate', '--family', 'PC');
    expect(none.err).toMatch(
      /^resin-derate calibrate: --modulus23, --hdt-a, --hdt-b, --hdt, --tg, --tm, --creep, --relax: give at least one/,
    );
    const twice = await run('calibrate', '--family', 'PBT', '--hdt-a', '60', '--hdt', '1.8:70');
    expect(twice.err).toMatch(/^resin-derate calibrate: --hdt-a, --hdt: two HDT values are given for 1.8 MPa/);
    const prony = join(mkdtempSync(join(tmpdir(), 'rd-prony-')), 'p.json');
    writeFileSync(
      prony,
      JSON.stringify({
        prony: 'p',
        reference_C: 100,
        shiftLaw: 'arrhenius',
        Tg_C: 100,
        Ea_kJmol: 200,
        E_inf_MPa: 1,
        terms: [{ tau_s: 1, E_MPa: 1000 }],
      }),
    );
    const start = await run('calibrate', '--params', prony, '--tg', '150');
    expect(start.err).toMatch(/^resin-derate calibrate: --params: a Prony material cannot be calibrated/);
    // dmafit's engine words (start, free, frequency) go through the same tables: the Prony start came from --params.
    const dma = await run('dmafit', '--params', prony, '--data', 'demo/latch-pc-dma-invented.csv', '--frequency', '1');
    expect(dma.err).toMatch(/^resin-derate dmafit: --params: start a DMA fit from a family or a parameter record/);
  });

  it("eqtime and table name their options for the engine's words (one table per command, cli/failure.ts)", async () => {
    // A reference far colder than the history: the engine's ref_temperature is the option --ref.
    const cold = await run('eqtime', '--family', 'PC', '--cycle', '70:8,30:16', '--cycles', '3650', '--ref', '-100');
    expect(cold.code).toBe(2);
    expect(cold.err).toMatch(/^resin-derate eqtime: --ref: the equivalent time at -100 degC is .* use its hottest segment, 70 degC/);
    const table: Command = {
      summary: '',
      usage: '',
      options: { families: { type: 'string' }, temps: { type: 'string' } },
      run: () => undefined,
    };
    const withNames: Command = { ...table, names: { materials: '--families' } };
    expect(failure(new InputError('materials', 'x'), withNames, {}).message).toBe('--families: x');
    expect(failure(new InputError('ref_temperature', 'x'), { ...table, options: { ref: { type: 'string' } } }, {}).message).toBe(
      '--ref: x',
    );
  });

  it('an unknown command, including Object.prototype member names, is one line and exit 2', async () => {
    for (const name of ['toString', 'hasOwnProperty', 'valueOf', '__proto__', 'constructor']) {
      const r = await run(name);
      expect(r).toEqual({
        code: 2,
        out: '',
        err: expect.stringMatching(new RegExp(`^resin-derate: unknown command '${name}'; commands: families, [^\\n]*\\n$`)),
      });
    }
  });
});
