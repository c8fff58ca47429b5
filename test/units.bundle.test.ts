/**
 * The unit system as the functions start-up script carries it: src/base/units.ts bundled by esbuild for the
 * browser (the start-up script's platform, target and minification; ESM here so the test can import it),
 * checked for every unit spelling it reads against the published conversion factors, and against mathjs's
 * own full unit system (its all-type arithmetic, `unitDependencies`) for those and other mathjs units.
 */
import { build, type Metafile } from 'esbuild';
import { create, createUnitDependencies, unitDependencies, type FactoryFunctionMap } from 'mathjs';
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import type * as UnitsModule from '../src/base/units.js';
import type * as UnitSystemModule from '../src/base/unit-system.js';
import { expectClose } from './expect.js';

type Bundled = typeof UnitsModule & typeof UnitSystemModule;
let bundled: Bundled;
/** Bytes each source file puts in the bundle (esbuild lists tree-shaken files with 0). */
let inputs: Metafile['outputs'][string]['inputs'];

beforeAll(async () => {
  const r = await build({
    stdin: {
      contents: "export * from './src/base/units.ts'; export { math } from './src/base/unit-system.ts';",
      resolveDir: process.cwd(),
      sourcefile: 'units-bundle.ts',
      loader: 'ts',
    },
    bundle: true,
    platform: 'browser',
    target: 'es2020',
    format: 'esm',
    minify: true,
    legalComments: 'none',
    write: false,
    metafile: true,
    logLevel: 'warning',
  });
  mkdirSync('test-output', { recursive: true });
  const file = resolve('test-output/units-bundle.mjs');
  const out = r.outputFiles[0];
  if (!out) throw new Error('esbuild wrote no unit bundle');
  writeFileSync(file, out.text);
  bundled = (await import(pathToFileURL(file).href)) as Bundled;
  const meta = Object.values(r.metafile.outputs)[0];
  if (!meta) throw new Error('esbuild gave no metafile output for the unit bundle');
  inputs = meta.inputs;
});

const SI = 'SI Brochure 9th ed. (2019)';
const NIST = 'NIST SP 811 (2008), appendix B.8';
/** 1 lbf/in^2 from the exact definitions: 0.45359237 kg x 9.80665 m/s^2 / (0.0254 m)^2 (NIST SP 811 (2008), B.8 and its footnotes). */
const PSI_EXACT_PA = (0.45359237 * 9.80665) / 0.0254 ** 2;

type Row =
  | { quantity: 'temperature'; toK: (t: number) => number; at: readonly number[]; source: string }
  | { quantity: 'time'; seconds: number; source: string }
  | { quantity: 'stress'; pascals: number; rel: number; source: string };

const celsius: Row = {
  quantity: 'temperature',
  toK: (t) => t + 273.15,
  at: [-40, 23, 80, 176],
  source: `${SI}, 2.3.1: t/degC = T/K - 273.15`,
};
const fahrenheit: Row = {
  quantity: 'temperature',
  toK: (t) => (t + 459.67) / 1.8,
  at: [-40, 32, 176, 212],
  source: `${NIST}: T/K = (t/degF + 459.67)/1.8`,
};
const kelvin: Row = { quantity: 'temperature', toK: (t) => t, at: [4.2, 273.15, 350, 1000], source: `${SI}: the kelvin, base unit` };
const time = (seconds: number, source: string): Row => ({ quantity: 'time', seconds, source });
const stress = (pascals: number, source: string, rel = 1e-15): Row => ({ quantity: 'stress', pascals, rel, source });
const second = time(1, `${SI}: the second, base unit`);
const minute = time(60, `${SI}, table 8: 1 min = 60 s`);
const hour = time(3600, `${SI}, table 8: 1 h = 3600 s`);
const day = time(86400, `${SI}, table 8: 1 d = 86 400 s`);
const week = time(7 * 86400, 'common practice: 1 week = 7 d');
const year = time(365.25 * 86400, 'the Julian year, 365.25 d of 86 400 s (IAU; from memory)');
const megapascal = stress(1e6, `${SI}, table 7: mega = 1e6; 1 N/mm^2 = 1e6 N/m^2 = 1 MPa`);
const psi = stress(6894.757, `${NIST}: pound-force per square inch, 6.894 757 E+03 Pa`, 1e-7);
const ksi = stress(6894.757e3, `${NIST}: kip per square inch, 6.894 757 E+06 Pa`, 1e-7);

/** Expected meaning of every spelling in UNIT_SPELLINGS, from the sources named in each row. */
const EXPECTED: Record<string, Row> = {
  '°c': celsius,
  '℃': celsius,
  degc: celsius,
  'deg c': celsius,
  c: celsius,
  celsius,
  'degree celsius': celsius,
  'degrees celsius': celsius,
  '°f': fahrenheit,
  '℉': fahrenheit,
  degf: fahrenheit,
  'deg f': fahrenheit,
  f: fahrenheit,
  fahrenheit,
  'degree fahrenheit': fahrenheit,
  'degrees fahrenheit': fahrenheit,
  k: kelvin,
  kelvin,
  kelvins: kelvin,
  h: hour,
  hr: hour,
  hrs: hour,
  hour,
  hours: hour,
  s: second,
  sec: second,
  secs: second,
  second,
  seconds: second,
  min: minute,
  mins: minute,
  minute,
  minutes: minute,
  d: day,
  day,
  days: day,
  wk: week,
  week,
  weeks: week,
  y: year,
  yr: year,
  yrs: year,
  year,
  years: year,
  pa: stress(1, `${SI}: the pascal, 1 N/m^2`),
  kpa: stress(1e3, `${SI}, table 7: kilo = 1e3`),
  gpa: stress(1e9, `${SI}, table 7: giga = 1e9`),
  psi,
  ksi,
  'n/mm2': megapascal,
  'n/mm^2': megapascal,
  'n/mm²': megapascal,
  MPa: megapascal,
  mPa: stress(1e-3, `${SI}, table 7: milli = 1e-3`),
  ms: time(1e-3, `${SI}, table 7: milli = 1e-3`),
  Ms: time(1e6, `${SI}, table 7: mega = 1e6`),
};

/** The SI symbols read only as written (SI Brochure 9th ed. (2019), 3.1: prefix symbols are case-sensitive). */
const CASE_EXACT = ['MPa', 'mPa', 'ms', 'Ms'];

/** The engine value of `text` read as the row's quantity: kelvin, seconds or pascals. */
function read(text: string, row: Row): number {
  if (row.quantity === 'temperature') return bundled.parseTemperatureK(text, 'probe');
  if (row.quantity === 'time') return bundled.parseTimeS(text, 'probe');
  return bundled.parseStressMPa(text, 'probe') * 1e6;
}

describe('the start-up bundle unit system', () => {
  it('carries no decimal.js, complex.js or mathjs matrix code', () => {
    const files = Object.keys(inputs).filter((f) => (inputs[f]?.bytesInOutput ?? 0) > 0);
    expect(files.some((f) => f.includes('node_modules/mathjs/'))).toBe(true);
    expect(files.filter((f) => /node_modules\/(decimal\.js|complex\.js)\/|mathjs\/lib\/esm\/type\/matrix\//.test(f))).toEqual([]);
  });

  it('has an expected value for every spelling it reads, and none for a spelling it does not', () => {
    expect([...bundled.UNIT_SPELLINGS].sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  it('converts every spelling, as written and in upper case where case is folded, to the published value', () => {
    for (const spelling of bundled.UNIT_SPELLINGS) {
      const row = EXPECTED[spelling];
      if (!row) throw new Error(`no expected value for '${spelling}'`);
      const written = CASE_EXACT.includes(spelling) ? [spelling] : [spelling, spelling.toUpperCase()];
      for (const unit of written) {
        if (row.quantity === 'temperature') {
          for (const t of row.at) expectClose(read(`${t} ${unit}`, row), row.toK(t), { abs: 1e-9, source: row.source });
        } else if (row.quantity === 'time') {
          for (const x of [1, 2.5, 1000]) expectClose(read(`${x} ${unit}`, row), x * row.seconds, { rel: 1e-15, source: row.source });
        } else {
          for (const x of [1, 2.5, 300]) expectClose(read(`${x} ${unit}`, row), x * row.pascals, { rel: row.rel, source: row.source });
        }
      }
    }
    for (const text of ['1 MS', '1 mS', '1 mpa', '1 MPA'])
      expect(() => read(text, second), text).toThrow(/ambiguous: unit prefixes are case-sensitive/);
  });

  it('gives psi and ksi from the exact pound-force and inch, and converts MPa back to each stress unit', () => {
    const exact = 'closed form: 0.45359237 kg x 9.80665 m/s^2 / (0.0254 m)^2 (NIST SP 811 (2008), B.8)';
    // PA_PER_PSI is written to 13 significant digits.
    expectClose(bundled.PA_PER_PSI, PSI_EXACT_PA, { rel: 1e-13, source: exact });
    // mathjs's own psi is 6894.75729276459 Pa, 6e-11 below the exact value.
    expectClose(bundled.parseStressMPa('1 psi') * 1e6, PSI_EXACT_PA, { rel: 1e-10, source: exact });
    expectClose(bundled.parseStressMPa('1 ksi') * 1e6, 1000 * PSI_EXACT_PA, { rel: 1e-13, source: exact });
    for (const [unit, pascals, source] of [
      ['Pa', 1, SI],
      ['kPa', 1e3, SI],
      ['MPa', 1e6, SI],
      ['GPa', 1e9, SI],
      ['psi', 6894.757, NIST],
      ['ksi', 6894.757e3, NIST],
    ] as const) {
      expectClose(bundled.convertStressFromMPa(2400, unit), 2400e6 / pascals, { rel: 1e-7, source });
    }
  });
});

describe('the start-up bundle unit system agrees with mathjs built with all its types', () => {
  const full = create({ unitDependencies, createUnitDependencies } as FactoryFunctionMap);
  full.createUnit('ksi', { definition: `${6894.757293168 * 1000} Pa` });
  full.createUnit('y', { definition: '1 year' });
  full.createUnit('yr', { definition: '1 year' });
  full.createUnit('d', { definition: '1 day' });
  const units = [
    ...['degC', 'degF', 'degR', 'rankine', 'K', 'mK', 'kelvin', 'celsius', 'fahrenheit'].map((u) => [u, 'K']),
    ...['s', 'ms', 'Ms', 'us', 'ns', 'min', 'h', 'hour', 'd', 'day', 'week', 'y', 'yr', 'year', 'decade', 'century'].map((u) => [u, 's']),
    ...[
      'Pa',
      'mPa',
      'kPa',
      'MPa',
      'GPa',
      'hPa',
      'bar',
      'atm',
      'torr',
      'mmHg',
      'psi',
      'ksi',
      'N/mm^2',
      'N/m^2',
      'kg/(m s^2)',
      'lbf/in^2',
    ].map((u) => [u, 'MPa']),
  ] as const;

  it('reads every unit to the same number, to the last bit', () => {
    for (const [unit, to] of units) {
      for (const x of [-40, 0, 1e-3, 1, 80, 176, 1e300]) {
        const text = `${x} ${unit}`;
        expect(bundled.math.unit(text).toNumber(to), `${text} in ${to} (mathjs 15 all-type arithmetic)`).toBe(full.unit(text).toNumber(to));
      }
    }
  });

  it('refuses the same unknown units and wrong conversions', () => {
    for (const text of ['1 furlongs', '1 __proto__', '1 constructor', '1 m/', '1 degC^']) {
      expect(() => full.unit(text), text).toThrow();
      expect(() => bundled.math.unit(text), text).toThrow();
    }
    expect(() => full.unit('1 degC').toNumber('s')).toThrow(/Units do not match/);
    expect(() => bundled.math.unit('1 degC').toNumber('s')).toThrow(/Units do not match/);
  });

  it('refuses text in VAR, whose value in mathjs is a complex number, as an unknown unit, and makes no BigNumber or Complex', () => {
    // mathjs with all types reads it (a reactive power); the project never needed it and the bundle has no Complex.
    expect(full.unit('1 VAR').equalBase(full.unit('1 W'))).toBe(true);
    expect(() => bundled.math.unit('1 VAR')).toThrow(/Unexpected type of argument/);
    const classes = bundled.math as unknown as Record<'BigNumber' | 'Complex', new (x: number) => unknown>;
    expect(() => new classes.BigNumber(1)).toThrow('BigNumber values are not available: unit text is read with plain numbers');
    expect(() => new classes.Complex(1)).toThrow('Complex values are not available: unit text is read with plain numbers');
    expect(() => bundled.parseStressMPa('1 VAR', 'modulus')).toThrow(
      "modulus: unknown unit 'VAR' in '1 VAR'; use '2400 MPa', '2.4 GPa' or '300 ksi'",
    );
  });
});
