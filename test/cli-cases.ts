/**
 * The CLI contract as data (README "CLI reference": JSON keys per command) and fast-check arbitraries
 * for command lines, shared by the in-process and the spawned CLI property tests.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { ALL_KEYS, blankParams, getFamily, paramsToRecord } from '../src/index.js';
import {
  familyIdText,
  FAMILY_IDS,
  mostlyValid,
  numberText,
  oddString,
  SPACES,
  unitText,
  validStrainText,
  validStressText,
  validTemperatureText,
  validTimeText,
} from './arbitraries.js';

export const COMMANDS = [
  'families',
  'params',
  'modulus',
  'shift',
  'maxtemp',
  'maxtime',
  'tgat',
  'eqtime',
  'stress',
  'hdt',
  'table',
  'demo',
] as const;
export type CommandName = (typeof COMMANDS)[number];

/** JSON keys each command answers with (README), required and optional. */
export const JSON_KEYS: Record<
  Exclude<CommandName, 'demo' | 'table' | 'families'>,
  { required: readonly string[]; optional?: readonly string[] }
> = {
  params: { required: [...ALL_KEYS] },
  modulus: { required: ['modulus_MPa', 'region', 'low_MPa', 'high_MPa', 'temperature_C', 'time_s'] },
  shift: { required: ['log10_aT', 'law'] },
  maxtemp: { required: ['temperature_C', 'status'], optional: ['not_reached'] },
  maxtime: { required: ['time_s', 'time_h', 'status'], optional: ['not_reached'] },
  tgat: { required: ['temperature_C', 'status'] },
  eqtime: { required: ['equivalent_time_s', 'equivalent_time_h', 'ref_temperature_C', 'modulus_MPa', 'region'] },
  stress: { required: ['stress_MPa', 'modulus_MPa', 'region', 'strain', 'beyond_linear_range'] },
  hdt: { required: ['temperature_C', 'status'] },
};

/** Keys that may be null in an answer (documented "null if not reached"); every other number must be finite. */
export const NULLABLE: Readonly<Record<string, readonly string[]>> = {
  maxtemp: ['temperature_C'],
  maxtime: ['time_s', 'time_h'],
  tgat: ['temperature_C'],
  hdt: ['temperature_C'],
  params: ALL_KEYS as readonly string[],
};

/** Parameter files the --params option is pointed at: valid records of each kind and typical mistakes. */
export function writeParamFiles(): readonly string[] {
  const dir = mkdtempSync(join(tmpdir(), 'rd-prop-'));
  const pa = getFamily('PA66-dry').params;
  const files: Record<string, string> = {
    'pc.json': JSON.stringify(paramsToRecord(getFamily('PC').params)),
    'pa66.json': JSON.stringify(paramsToRecord(pa)),
    'ep.json': JSON.stringify(paramsToRecord(getFamily('EP').params)),
    'wlf.json': JSON.stringify({
      ...paramsToRecord(getFamily('PS').params),
      shiftLaw: 'wlf',
      E23_MPa: null,
      Eg_MPa: 3200,
      E23_low_MPa: null,
      E23_high_MPa: null,
    }),
    'wlf-pc.json': JSON.stringify({
      ...paramsToRecord(getFamily('PC').params),
      shiftLaw: 'wlf',
      E23_MPa: null,
      Eg_MPa: 2400,
      E23_low_MPa: null,
      E23_high_MPa: null,
    }),
    'swapped.json': JSON.stringify({
      ...paramsToRecord(pa),
      Tg_C: pa.Tm_C,
      Tm_C: pa.Tg_C,
      Tg_low_C: null,
      Tg_high_C: null,
      Tm_low_C: null,
      Tm_high_C: null,
    }),
    'text-numbers.json': JSON.stringify(
      Object.fromEntries(Object.entries(paramsToRecord(getFamily('PP').params)).map(([k, v]) => [k, v === null ? '' : String(v)])),
    ),
    'soft.json': JSON.stringify({
      ...paramsToRecord(blankParams('soft', 'amorphous')),
      Tg_C: -150,
      Eg_MPa: 50,
      plateau_MPa: 1,
      flowDecades: 0.5,
    }),
    'unknown-key.json': JSON.stringify({ ...paramsToRecord(getFamily('PC').params), colour: 'blue' }),
    'out-of-range.json': JSON.stringify({ ...paramsToRecord(getFamily('PC').params), beta: 7 }),
    'array.json': '[1, 2, 3]',
    'broken.json': '{"Tg_C": 100,',
    'empty.json': '',
    'unicode.json': JSON.stringify({ kind: 'amorphous', id: 'ಠ_ಠ', Tg_C: '１００', E23_MPa: 2000 }),
  };
  const paths = Object.entries(files).map(([name, text]) => {
    const path = join(dir, name);
    writeFileSync(path, text);
    return path;
  });
  return [...paths, join(dir, 'missing.json'), dir];
}

type Opt = readonly [name: string, value: fc.Arbitrary<string>];

const segmentText = fc.oneof(
  { weight: 4, arbitrary: fc.tuple(validTemperatureText(), validTimeText()).map(([T, t]) => `${T}:${t}`) },
  {
    weight: 1,
    arbitrary: fc
      .tuple(unitText('temperature'), fc.constantFrom(':', '::', ';', ''), unitText('time'))
      .map(([T, sep, t]) => `${T}${sep}${t}`),
  },
);
const listText = <T extends string>(item: fc.Arbitrary<T>): fc.Arbitrary<string> =>
  fc.oneof(
    { weight: 6, arbitrary: fc.array(item, { minLength: 1, maxLength: 4 }).map((xs) => xs.join(',')) },
    { weight: 2, arbitrary: fc.array(item, { minLength: 1, maxLength: 3 }).map((xs) => xs.join(' , ')) },
    { weight: 1, arbitrary: fc.constantFrom(',', ',,', '') },
    { weight: 1, arbitrary: oddString() },
  );

function options(paramFiles: readonly string[]): Record<CommandName, readonly Opt[]> {
  const material: Opt[] = [
    ['family', fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...FAMILY_IDS) }, { weight: 1, arbitrary: familyIdText() })],
    ['params', fc.oneof(fc.constantFrom(...paramFiles), oddString())],
  ];
  const temp: Opt = ['temp', mostlyValid(validTemperatureText(), 'temperature')];
  const time: Opt = ['time', mostlyValid(validTimeText(), 'time')];
  const modulus: Opt = ['modulus', mostlyValid(validStressText(), 'stress')];
  return {
    families: [],
    params: material,
    modulus: [...material, temp, time],
    shift: [...material, temp],
    maxtemp: [...material, modulus, time],
    maxtime: [...material, modulus, temp],
    tgat: [...material, time],
    eqtime: [
      ...material,
      ['cycle', listText(segmentText)],
      [
        'cycles',
        fc.oneof(
          { weight: 8, arbitrary: fc.integer({ min: 1, max: 36500 }).map(String) },
          { weight: 1, arbitrary: numberText() },
          { weight: 1, arbitrary: oddString() },
        ),
      ],
      ['ref', mostlyValid(validTemperatureText(), 'temperature')],
    ],
    stress: [
      ...material,
      [
        'strain',
        fc.oneof(
          { weight: 17, arbitrary: validStrainText() },
          { weight: 1, arbitrary: numberText() },
          { weight: 1, arbitrary: fc.tuple(numberText(), fc.constantFrom(...SPACES), fc.constant('%')).map((p) => p.join('')) },
          { weight: 1, arbitrary: oddString() },
        ),
      ],
      temp,
      time,
    ],
    hdt: [...material, ['stress', mostlyValid(fc.constantFrom('1.8', '0.45', '8', '1.8 MPa', '65 psi'), 'stress')]],
    table: [
      ['families', listText(fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...FAMILY_IDS) }, { weight: 1, arbitrary: familyIdText() }))],
      ['temps', listText(mostlyValid(validTemperatureText(), 'temperature', 0.95))],
      time,
      ['format', fc.constantFrom('md', 'csv', 'json', 'xml', 'JSON', '')],
    ],
    demo: [],
  };
}

export interface CliCase {
  readonly command: CommandName;
  readonly args: readonly string[];
}

/**
 * Command lines for one command: each option present (often) or absent, given as `--opt value` or
 * `--opt=value`, sometimes twice; sometimes an unknown option, a stray positional or --help; --json
 * (or --format json for table) most of the time so the answer can be checked key by key.
 */
export function cliCase(command: CommandName, paramFiles: readonly string[]): fc.Arbitrary<CliCase> {
  const opts = options(paramFiles)[command];
  const one = ([name, value]: Opt): fc.Arbitrary<string[]> =>
    fc.oneof(
      // A value is taken as typed after its option, '-40 degC' included (cli/args.ts); only '--...' is never a value.
      { weight: 13, arbitrary: value.map((v) => [`--${name}`, v]) },
      { weight: 6, arbitrary: value.map((v) => [`--${name}=${v}`]) },
      { weight: 1, arbitrary: fc.constant<string[]>([]) },
      { weight: 1, arbitrary: fc.tuple(value, value).map(([a, b]) => [`--${name}=${a}`, `--${name}=${b}`]) },
    );
  // --family is given far more often than --params; both together is an error case of its own.
  const material = opts.length > 0 && opts[0]?.[0] === 'family';
  return fc
    .record({
      parts: fc.tuple(...opts.map(one)),
      useParams: fc.nat(9),
      json: fc.nat(9),
      extra: fc.oneof(
        { weight: 12, arbitrary: fc.constant<string[]>([]) },
        { weight: 1, arbitrary: fc.constantFrom(['--bogus'], ['--bogus=1'], ['stray'], ['-x'], ['--help'], ['--json=1'], ['--'], ['-']) },
      ),
    })
    .map(({ parts, useParams, json, extra }) => {
      let chosen = parts;
      if (material) {
        // 0-5: --family only, 6-8: --params only, 9: both.
        chosen = parts.map((p, i) => (i === 0 && useParams >= 6 && useParams < 9 ? [] : i === 1 && useParams < 6 ? [] : p));
      }
      const args = chosen.flat();
      if (command !== 'demo' && command !== 'table' && json < 8) args.push('--json');
      if (command === 'table' && json < 8) args.push('--format', 'json');
      return { command, args: [...args, ...extra] };
    });
}

export interface Answer {
  readonly code: number;
  readonly out: string;
  readonly err: string;
}

/** Checks one answer against the contract; returns a description of the first breach, or null. */
export function contractBreach(c: CliCase, a: Answer): string | null {
  const prefix = `resin-derate ${c.command}: `;
  if (a.code !== 0) {
    if (!a.err.endsWith('\n')) return 'stderr does not end with a newline';
    const lines = a.err.slice(0, -1).split('\n');
    if (lines.length !== 1) return `stderr has ${lines.length} lines`;
    const line = lines[0] ?? '';
    if (!line.startsWith(prefix)) return `stderr does not start with '${prefix}'`;
    if (/\bat .*\(.*:\d+:\d+\)|^\s+at /m.test(a.err) || /TypeError|RangeError|ReferenceError|SyntaxError:/.test(line))
      return 'stderr holds a stack trace';
    const rest = line.slice(prefix.length);
    // The message names what was wrong: a CLI option (cli/args.ts, cli/failure.ts), a parameter field, or the stray argument.
    const names =
      /^--[a-z][a-z0-9-]*: /.test(rest) ||
      /^-{1,2}[^\s:]+: unknown option; /.test(rest) ||
      /^parameter \w+: /.test(rest) ||
      /^'.*': unexpected argument/.test(rest) ||
      /^no answer: /.test(rest);
    if (!names) return `stderr does not name an argument: ${rest.slice(0, 200)}`;
    return null;
  }
  if (a.err !== '') return `exit 0 with stderr: ${a.err.slice(0, 200)}`;
  if (/\bNaN\b|\bInfinity\b/.test(a.out)) return 'output holds NaN or Infinity';
  if (c.args.includes('--help')) return /Usage: resin-derate/.test(a.out) ? null : 'help without usage';
  const wantsJson = c.command === 'table' ? c.args.includes('json') && /"rows"/.test(a.out) : c.args.includes('--json');
  if (!wantsJson || c.command === 'demo') return a.out.trim() === '' ? 'empty output' : null;
  let data: unknown;
  try {
    data = JSON.parse(a.out);
  } catch {
    return 'output is not valid JSON';
  }
  return jsonBreach(c.command, data);
}

function jsonBreach(command: CommandName, data: unknown): string | null {
  if (command === 'families') {
    if (!Array.isArray(data) || data.length === 0) return 'families: not a non-empty array';
    for (const f of data as Record<string, unknown>[]) {
      for (const k of ['id', 'name', 'kind', 'Tg_C', 'Tm_C', 'E23_MPa', 'sources']) if (!(k in f)) return `families: missing ${k}`;
    }
    return null;
  }
  if (command === 'table') {
    const t = data as { time_s?: unknown; reference?: unknown; rows?: { cells?: Record<string, unknown>[] }[] };
    if (typeof t.time_s !== 'number' || !Number.isFinite(t.time_s) || typeof t.reference !== 'object' || !Array.isArray(t.rows)) {
      return 'table: missing time_s, reference or rows';
    }
    for (const r of t.rows) {
      for (const cell of r.cells ?? []) {
        for (const k of ['temperature_C', 'modulus_MPa', 'ratio']) {
          if (typeof cell[k] !== 'number' || !Number.isFinite(cell[k])) return `table: cell ${k} = ${String(cell[k])}`;
        }
        if (typeof cell['region'] !== 'string') return 'table: cell without region';
      }
    }
    return null;
  }
  if (command === 'demo') return null;
  const spec = JSON_KEYS[command];
  if (typeof data !== 'object' || data === null || Array.isArray(data)) return `${command}: not an object`;
  const rec = data as Record<string, unknown>;
  const keys = Object.keys(rec);
  for (const k of spec.required) if (!keys.includes(k)) return `${command}: missing key ${k}`;
  for (const k of keys) if (!spec.required.includes(k) && !(spec.optional ?? []).includes(k)) return `${command}: undocumented key ${k}`;
  for (const [k, v] of Object.entries(rec)) {
    if (v === null && !(NULLABLE[command] ?? []).includes(k)) return `${command}: ${k} is null (NaN or Infinity in JSON?)`;
    if (typeof v === 'number' && !Number.isFinite(v)) return `${command}: ${k} = ${v}`;
  }
  return null;
}
