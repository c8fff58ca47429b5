/**
 * Reusable fast-check arbitraries for what a person can put in a cell or on a command line, and the
 * seeded run settings every property test shares. Written for the engine and CLI property tests and
 * meant to be reused unchanged against the worksheet wrappers (functions/): nothing here depends on
 * Office or on a wrapper's types; worksheet error values are built by a constructor the caller passes.
 *
 * Runs: RD_PROPERTY_RUNS sets the number of cases of every in-process property (default per property,
 * a few hundred at most, so CI stays quick); RD_PROPERTY_SEED replaces the fixed seed. fast-check
 * prints the seed and the shrunk counterexample path on failure, so a failure replays exactly with
 * RD_PROPERTY_SEED=<seed>.
 */
import fc from 'fast-check';
import {
  ALL_KEYS,
  FAMILIES,
  FILLER_CODES,
  FILLERS,
  KINDS,
  NUMERIC_FIELDS,
  type FieldSpec,
  type Kind,
  type MaterialParams,
  type NumericField,
} from '../src/index.js';

// ---------------------------------------------------------------------------------------------
// Run settings
// ---------------------------------------------------------------------------------------------

/** The fixed seed of every property run unless RD_PROPERTY_SEED is set. */
export const DEFAULT_PROPERTY_SEED = 20_251_202;

function envInt(name: string): number | undefined {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === '') return undefined;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer, got '${raw}'`);
  return n;
}

/** The seed in use (RD_PROPERTY_SEED or the fixed default). */
export function propertySeed(): number {
  const raw = process.env['RD_PROPERTY_SEED'];
  if (raw === undefined || raw.trim() === '') return DEFAULT_PROPERTY_SEED;
  const n = Number(raw);
  if (!Number.isInteger(n)) throw new Error(`RD_PROPERTY_SEED must be an integer, got '${raw}'`);
  return n;
}

/** Number of cases for an in-process property: RD_PROPERTY_RUNS, else `ciRuns`. */
export function propertyRuns(ciRuns: number): number {
  return envInt('RD_PROPERTY_RUNS') ?? ciRuns;
}

/** Number of spawned CLI cases per command: RD_CLI_SPAWN_RUNS, else `ciRuns` (spawning costs ~0.25 s each). */
export function spawnRuns(ciRuns: number): number {
  return envInt('RD_CLI_SPAWN_RUNS') ?? ciRuns;
}

/** Parameters for fc.assert: seeded, bounded, reproducible. */
export function propertyParameters<T>(ciRuns: number): fc.Parameters<T> {
  return { seed: propertySeed(), numRuns: propertyRuns(ciRuns) };
}

// ---------------------------------------------------------------------------------------------
// Numbers
// ---------------------------------------------------------------------------------------------

/** Smallest positive normal double (IEEE 754 binary64). */
export const MIN_NORMAL = 2.2250738585072014e-308;

/** Numbers that break naive code: non-finite, signed zero, the extremes, denormals, the precision edge. */
export const SPECIAL_NUMBERS: readonly number[] = [
  NaN,
  Infinity,
  -Infinity,
  0,
  -0,
  1e308,
  -1e308,
  Number.MAX_VALUE,
  -Number.MAX_VALUE,
  Number.MIN_VALUE,
  -Number.MIN_VALUE,
  MIN_NORMAL,
  1e-310,
  -1e-310,
  Number.EPSILON,
  1,
  -1,
  2 ** 53,
  -(2 ** 53),
  1e-300,
  1e300,
  -273.15,
  -273.16,
];

/** One of SPECIAL_NUMBERS. */
export function specialNumber(): fc.Arbitrary<number> {
  return fc.constantFrom(...SPECIAL_NUMBERS);
}

/** A subnormal (denormal) double, positive or negative. */
export function denormal(): fc.Arbitrary<number> {
  return fc
    .tuple(fc.double({ min: Number.MIN_VALUE, max: MIN_NORMAL, noNaN: true, noDefaultInfinity: true }), fc.boolean())
    .map(([x, neg]) => (x >= MIN_NORMAL ? Number.MIN_VALUE : neg ? -x : x));
}

/** Log-uniform positive numbers between lo and hi (both > 0). */
export function logUniform(lo: number, hi: number): fc.Arbitrary<number> {
  return fc
    .double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true, noDefaultInfinity: true })
    .map((x) => Math.min(hi, Math.max(lo, 10 ** x)));
}

/** Any double at all, biased towards the special values and towards magnitudes a sheet holds. */
export function anyNumber(): fc.Arbitrary<number> {
  return fc.oneof(
    { weight: 3, arbitrary: specialNumber() },
    { weight: 1, arbitrary: denormal() },
    { weight: 3, arbitrary: fc.double() },
    { weight: 3, arbitrary: fc.double({ min: -1e4, max: 1e4, noNaN: true }) },
    { weight: 2, arbitrary: fc.integer({ min: -1000, max: 100_000 }) },
  );
}

// ---------------------------------------------------------------------------------------------
// Text
// ---------------------------------------------------------------------------------------------

export type Quantity = 'temperature' | 'time' | 'stress';

/** Unit spellings the parsers are documented to accept (DESIGN.md, units.ts), in odd cases too. */
export const KNOWN_UNITS: Readonly<Record<Quantity, readonly string[]>> = {
  temperature: [
    'degC',
    'DEGC',
    'degc',
    'DegC',
    '°C',
    '°c',
    '℃',
    'C',
    'c',
    'degF',
    'DEGF',
    '°F',
    '℉',
    'F',
    'f',
    'K',
    'k',
    'kelvin',
    'KELVIN',
  ],
  time: [
    's',
    'S',
    'sec',
    'secs',
    'ms',
    'min',
    'MIN',
    'mins',
    'h',
    'H',
    'hr',
    'hrs',
    'hour',
    'Hours',
    'd',
    'day',
    'DAYS',
    'wk',
    'week',
    'Weeks',
    'y',
    'yr',
    'yrs',
    'year',
    'YEARS',
  ],
  stress: ['Pa', 'kPa', 'MPa', 'mpa', 'MPA', 'GPa', 'GPA', 'gpa', 'psi', 'PSI', 'ksi', 'KSI', 'N/mm2', 'n/mm^2', 'N/mm²'],
};

/** Unit text that is wrong for every quantity, or not a unit at all. */
export const UNKNOWN_UNITS: readonly string[] = [
  'furlong',
  'kg',
  'm',
  'mm',
  'parsec',
  'degZ',
  '°X',
  'hz',
  'Hz',
  'µs',
  'J',
  'mol',
  '%',
  'MPa/s',
  'K^2',
  'K K',
  '1/s',
  '°',
  '—',
  '(',
  'e3',
  'e',
  'NaN',
  'Infinity',
  '🙂',
  'ಠ_ಠ',
  'градус',
  'ケルビン',
  '\u200b',
];

/** Spacing a person or a paste produces: none, several, tabs, non-breaking and ideographic spaces. */
export const SPACES: readonly string[] = ['', ' ', '  ', '   ', '\t', '\u00a0', '\u2009', '\u3000', ' \t '];

/** Number text: plain, signed, exponent, overflow, hex, separators, decimal comma, non-ASCII digits. */
export function numberText(): fc.Arbitrary<string> {
  return fc.oneof(
    fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((x) => String(x)),
    fc.integer({ min: -400, max: 2000 }).map((x) => String(x)),
    fc.constantFrom(
      '0',
      '-0',
      '+80',
      '.5',
      '5.',
      '1e3',
      '1E-3',
      '1e308',
      '1e400',
      '-1e400',
      '1e-400',
      '4.9e-324',
      '0x10',
      '1_000',
      '1,5',
      '1.000,5',
      '١٢',
      '８０',
      '1/2',
      '--5',
      '+-5',
      '5e',
      'e5',
    ),
  );
}

/** "number unit" text with odd spacing; unit drawn from the known spellings of `quantity` (or any) and unknown ones. */
export function unitText(quantity?: Quantity): fc.Arbitrary<string> {
  const known = quantity === undefined ? [...KNOWN_UNITS.temperature, ...KNOWN_UNITS.time, ...KNOWN_UNITS.stress] : KNOWN_UNITS[quantity];
  const unit = fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...known) }, { weight: 1, arbitrary: fc.constantFrom(...UNKNOWN_UNITS) });
  const space = fc.constantFrom(...SPACES);
  return fc.tuple(space, numberText(), space, unit, space).map((parts) => parts.join(''));
}

/** Text a worksheet shows for its error values. */
export const ERROR_TEXTS: readonly string[] = [
  '#N/A',
  '#VALUE!',
  '#REF!',
  '#DIV/0!',
  '#NUM!',
  '#NAME?',
  '#NULL!',
  '#SPILL!',
  '#CALC!',
  '#BUSY!',
];

/** Strings with no meaning as a quantity: empty, blank, keywords, formulas, error text, unicode of every kind. */
export function oddString(): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constantFrom(
      '',
      ' ',
      '\t',
      '\n',
      '\u00a0',
      'NaN',
      'Infinity',
      '-Infinity',
      'TRUE',
      'false',
      'null',
      'undefined',
      '=1+1',
      '=A1',
      "'80",
      '80 degC 10 h',
      '\u202e08', // right-to-left override
      'e\u0301', // combining accent
      '\ud83d', // lone surrogate
      '\u0000',
      'x'.repeat(5000),
      ...ERROR_TEXTS,
    ),
    fc.string({ maxLength: 12 }),
    fc.string({ unit: 'grapheme', maxLength: 8 }),
    fc.string({ unit: 'binary', maxLength: 8 }),
  );
}

/** Any text a cell or an option may hold: unit text, bare number text, or odd strings. */
export function anyText(quantity?: Quantity): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 4, arbitrary: unitText(quantity) },
    { weight: 2, arbitrary: numberText() },
    { weight: 3, arbitrary: oddString() },
  );
}

/** A number as a person types it: a few significant figures, sometimes in exponent form. */
function typed(x: number, digits: number): string {
  return Number(x.toPrecision(digits)).toString();
}

/** Valid temperature text: bare degC, or degC / K / degF with a unit, over -100 to 400 degC. */
export function validTemperatureText(): fc.Arbitrary<string> {
  const c = fc.double({ min: -100, max: 400, noNaN: true });
  return fc.oneof(
    fc.tuple(c, fc.integer({ min: 2, max: 5 })).map(([x, d]) => typed(x, d)),
    fc.tuple(c, fc.constantFrom(' degC', ' °C', '°C', ' C', ' degc')).map(([x, u]) => `${typed(x, 4)}${u}`),
    c.map((x) => `${typed(x + 273.15, 5)} K`),
    c.map((x) => `${typed(x * 1.8 + 32, 4)} degF`),
  );
}

/** Valid duration text: bare hours or a number with a time unit, from about 10 ms to 1000 years. */
export function validTimeText(): fc.Arbitrary<string> {
  return fc.oneof(
    logUniform(1e-5, 1e6).map((h) => typed(h, 3)),
    fc
      .tuple(logUniform(0.01, 1000), fc.constantFrom(' s', ' min', ' h', 'h', ' hours', ' d', ' days', ' week', ' y', ' years'))
      .map(([x, u]) => `${typed(x, 3)}${u}`),
  );
}

/** Valid modulus or stress text: bare MPa, MPa, GPa, psi or ksi, from 0.01 to 20000 MPa. */
export function validStressText(): fc.Arbitrary<string> {
  const mpa = logUniform(0.01, 20000);
  return fc.oneof(
    mpa.map((x) => typed(x, 3)),
    mpa.map((x) => `${typed(x, 3)} MPa`),
    mpa.map((x) => `${typed(x / 1000, 3)} GPa`),
    mpa.map((x) => `${typed(x * 145.038, 3)} psi`),
    mpa.map((x) => `${typed(x * 0.145038, 3)} ksi`),
  );
}

/** Valid strain text: a fraction up to 0.1 or a percentage up to 10 %. */
export function validStrainText(): fc.Arbitrary<string> {
  const eps = logUniform(1e-5, 0.1);
  return fc.oneof(
    eps.map((x) => typed(x, 3)),
    eps.map((x) => `${typed(x * 100, 3)} %`),
  );
}

/** Valid text of a quantity with probability `share`, else anything (anyText). */
export function mostlyValid(valid: fc.Arbitrary<string>, quantity?: Quantity, share = 0.85): fc.Arbitrary<string> {
  const w = Math.round(share * 100);
  return fc.oneof({ weight: w, arbitrary: valid }, { weight: 100 - w, arbitrary: anyText(quantity) });
}

// ---------------------------------------------------------------------------------------------
// Cells and ranges
// ---------------------------------------------------------------------------------------------

/** What a custom function receives for one cell (Excel gives null or '' for an empty one). */
export type CellScalar = number | string | boolean | null | undefined;

/** An empty cell in each form a host may give it. */
export function emptyCell(): fc.Arbitrary<null | undefined | string> {
  return fc.constantFrom(null, undefined, '');
}

/** A worksheet error value built by the caller's constructor from one of ERROR_TEXTS. */
export function errorCell<E>(make: (code: string) => E): fc.Arbitrary<E> {
  return fc.constantFrom(...ERROR_TEXTS).map(make);
}

/** Any scalar cell: numbers (specials included), text of the given quantity, booleans, empties. */
export function cellScalar(quantity?: Quantity): fc.Arbitrary<CellScalar> {
  return fc.oneof(
    { weight: 4, arbitrary: anyNumber() },
    { weight: 4, arbitrary: anyText(quantity) },
    { weight: 1, arbitrary: fc.boolean() },
    { weight: 1, arbitrary: emptyCell() },
  );
}

/** Cell input the engine's parsers take (number | string): everything but booleans and empties. */
export function parserInput(quantity?: Quantity): fc.Arbitrary<number | string> {
  return fc.oneof({ weight: 1, arbitrary: anyNumber() }, { weight: 2, arbitrary: anyText(quantity) });
}

export interface RangeShape {
  readonly maxRows?: number;
  readonly maxCols?: number;
}

/** A rectangular range (rows of equal length), at least 1 x 1. */
export function rectRange<T>(cell: fc.Arbitrary<T>, shape: RangeShape = {}): fc.Arbitrary<T[][]> {
  const rows = shape.maxRows ?? 6;
  const cols = shape.maxCols ?? 6;
  return fc
    .tuple(fc.integer({ min: 1, max: rows }), fc.integer({ min: 1, max: cols }))
    .chain(([r, c]) => fc.array(fc.array(cell, { minLength: c, maxLength: c }), { minLength: r, maxLength: r }));
}

/** A ragged range: rows of different lengths, empty rows and the empty range included. */
export function raggedRange<T>(cell: fc.Arbitrary<T>, shape: RangeShape = {}): fc.Arbitrary<T[][]> {
  return fc.array(fc.array(cell, { maxLength: shape.maxCols ?? 6 }), { maxLength: shape.maxRows ?? 6 });
}

/** Nested input: cells that are themselves arrays, to any small depth (what a careless caller or JSON gives). */
export type Nested<T> = T | Nested<T>[];
export function nestedRange<T>(cell: fc.Arbitrary<T>, maxDepth = 3): fc.Arbitrary<Nested<T>[]> {
  const { tree } = fc.letrec<{ tree: Nested<T> }>((tie) => ({
    tree: fc.oneof({ depthSize: 'small', maxDepth }, cell, fc.array(tie('tree'), { maxLength: 4 })),
  }));
  return fc.array(tree, { maxLength: 4 });
}

/** Any range shape: rectangular, ragged, nested, empty ([] and [[]]). */
export function anyRange<T>(cell: fc.Arbitrary<T>, shape: RangeShape = {}): fc.Arbitrary<unknown[]> {
  return fc.oneof(
    { weight: 4, arbitrary: rectRange(cell, shape) as fc.Arbitrary<unknown[]> },
    { weight: 2, arbitrary: raggedRange(cell, shape) as fc.Arbitrary<unknown[]> },
    { weight: 1, arbitrary: nestedRange(cell) as fc.Arbitrary<unknown[]> },
    { weight: 1, arbitrary: fc.constantFrom<unknown[]>([], [[]]) },
  );
}

/**
 * A huge rectangular range (rows x cols, e.g. 1000 x 10) whose cells cycle through a small drawn sample,
 * so that size is tested without fast-check generating (and shrinking) every cell.
 */
export function hugeRange<T>(cell: fc.Arbitrary<T>, rows: number, cols: number): fc.Arbitrary<T[][]> {
  return fc
    .array(cell, { minLength: 1, maxLength: 16 })
    .map((sample) =>
      Array.from({ length: rows }, (_, r) => Array.from({ length: cols }, (_, c) => sample[(r * cols + c) % sample.length] as T)),
    );
}

// ---------------------------------------------------------------------------------------------
// Engine-domain values (kelvin, seconds, MPa)
// ---------------------------------------------------------------------------------------------

/** Julian year in seconds (IAU), as units.ts uses. */
const YEAR_S = 31_557_600;

/** Temperatures in kelvin across the engine's working span (-150 to 500 degC by default), edges included. */
export function temperatureK(minC = -150, maxC = 500): fc.Arbitrary<number> {
  return fc.oneof(
    { weight: 6, arbitrary: fc.double({ min: minC + 273.15, max: maxC + 273.15, noNaN: true }) },
    { weight: 1, arbitrary: fc.constantFrom(minC + 273.15, maxC + 273.15, 296.15) },
  );
}

/** Times in seconds, log-uniform from 1 ms to 1000 years, edges included. */
export function timeS(min = 1e-3, max = 1000 * YEAR_S): fc.Arbitrary<number> {
  return fc.oneof({ weight: 6, arbitrary: logUniform(min, max) }, { weight: 1, arbitrary: fc.constantFrom(min, max, 10, 3600) });
}

/** Moduli in MPa, log-uniform from 1e-3 to 1e5 MPa. */
export function modulusMPaArb(min = 1e-3, max = 1e5): fc.Arbitrary<number> {
  return logUniform(min, max);
}

// ---------------------------------------------------------------------------------------------
// Families and parameter records
// ---------------------------------------------------------------------------------------------

export const FAMILY_IDS: readonly string[] = FAMILIES.map((f) => f.params.id);

/** A family id as typed: exact, odd case, padded, misspelt, unknown or junk. */
export function familyIdText(): fc.Arbitrary<string> {
  const id = fc.constantFrom(...FAMILY_IDS);
  return fc.oneof(
    { weight: 4, arbitrary: id },
    { weight: 2, arbitrary: id.map((s) => s.toLowerCase()) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...SPACES), id, fc.constantFrom(...SPACES)).map((p) => p.join('')) },
    { weight: 1, arbitrary: id.map((s) => s.slice(0, Math.max(1, s.length - 1))) },
    { weight: 1, arbitrary: fc.constantFrom('PA66', 'PEHD', 'polycarbonate', 'PC ', 'NYLON', 'X', '') },
    { weight: 1, arbitrary: oddString() },
  );
}

/** A numeric field value drawn over its whole range, with the two edges drawn often. */
export function fieldValue(f: FieldSpec, min = f.min, max = f.max): fc.Arbitrary<number> {
  const lo = Math.max(min, f.min);
  const hi = Math.min(max, f.max);
  const inside =
    lo > 0 && hi / lo > 100
      ? logUniform(lo, hi)
      : fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true }).map((x) => Math.min(hi, Math.max(lo, x)));
  return fc.oneof({ weight: 1, arbitrary: fc.constantFrom(lo, hi) }, { weight: 4, arbitrary: inside });
}

const SPEC = new Map(NUMERIC_FIELDS.map((f) => [f.key, f]));
function spec(key: NumericField): FieldSpec {
  const f = SPEC.get(key);
  if (!f) throw new Error(`no field ${key}`);
  return f;
}

/**
 * A parameter record that passes validateParams by construction: every field in its range (edges often),
 * Tm at least 10 K above Tg, continuity at least the crystallinity, exactly one of E23 and Eg, and
 * low <= value <= high. compileMaterial may still refuse it with a ParameterError (an E23 no glassy
 * modulus reaches, or a glassy modulus under ten times the rubbery one).
 */
export function paramRecord(
  kind?: Kind,
  shiftLaws: readonly MaterialParams['shiftLaw'][] = ['hybrid', 'wlf', 'arrhenius'],
): fc.Arbitrary<MaterialParams> {
  const kindArb = kind === undefined ? fc.constantFrom(...KINDS) : fc.constant(kind);
  return kindArb.chain((k) => {
    const sc = k === 'semicrystalline';
    const free: Record<string, fc.Arbitrary<number>> = {};
    for (const f of NUMERIC_FIELDS) {
      if (['Tg_C', 'Tm_C', 'E23_MPa', 'Eg_MPa', 'crystalContinuity', 'fillerMass_pct'].includes(f.key) || f.optional) continue;
      free[f.key] = f.kinds.includes(k) ? fieldValue(f) : fc.constant(f.min);
    }
    const tg = fieldValue(spec('Tg_C'), -150, sc ? 440 : 400);
    return fc
      .record({
        free: fc.record(free),
        Tg: tg,
        shiftLaw: fc.constantFrom(...shiftLaws),
        useE23: fc.boolean(),
        E: fc.oneof(fieldValue(spec('E23_MPa'), 50, 20000), fieldValue(spec('E23_MPa'))),
        Eg: fieldValue(spec('Eg_MPa')),
        density: fieldValue(spec('density_kgm3')),
        crystalSlope: fc.option(fieldValue(spec('crystalSlope_perK')), { nil: null }),
        u: fc.tuple(
          fc.double({ min: 0, max: 1, noNaN: true }),
          fc.double({ min: 0, max: 1, noNaN: true }),
          fc.double({ min: 0, max: 1, noNaN: true }),
        ),
        ranges: fc.tuple(fc.boolean(), fc.boolean(), fc.boolean()),
        spread: fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })),
      })
      .map(({ free, Tg, shiftLaw, useE23, E, Eg, density, crystalSlope, u, ranges, spread }) => {
        const p: MaterialParams = {
          id: 'prop',
          name: 'property-test record',
          kind: k,
          shiftLaw,
          // Unfilled: filledRecord (below) draws the filler fields.
          filler: 'none',
          fillerMass_pct: 0,
          fillerAspect: null,
          fillerAlign: null,
          density_kgm3: density,
          Tg_C: Tg,
          Tm_C: null,
          E23_MPa: useE23 ? E : null,
          Eg_MPa: useE23 ? null : Eg,
          crystalContinuity: 1,
          // Optional: empty means the glassy slope (params.ts); only a semi-crystalline record uses it.
          crystalSlope_perK: sc ? crystalSlope : null,
          Tg_low_C: null,
          Tg_high_C: null,
          Tm_low_C: null,
          Tm_high_C: null,
          E23_low_MPa: null,
          E23_high_MPa: null,
          ...(free as Record<string, number>),
        } as MaterialParams;
        if (sc) {
          const tmLo = Math.max(Tg + 10, -100);
          p.Tm_C = tmLo + u[0] * (450 - tmLo);
          p.crystalContinuity = p.crystallinity + u[1] * (1 - p.crystallinity);
        }
        const between = (a: number, b: number, t: number): number => Math.min(b, Math.max(a, a + t * (b - a)));
        if (ranges[0]) {
          p.Tg_low_C = between(-150, p.Tg_C, 1 - spread[0] * 0.1);
          p.Tg_high_C = between(p.Tg_C, sc && p.Tm_C !== null ? Math.min(400, p.Tm_C) : 400, spread[1] * 0.1);
        }
        if (ranges[1] && sc && p.Tm_C !== null) {
          p.Tm_low_C = between(-100, p.Tm_C, 1 - spread[0] * 0.1);
          p.Tm_high_C = between(p.Tm_C, 450, spread[1] * 0.1);
        }
        // A humidity needs a material that takes up water (validateParams refuses humidity_pct > 0 with waterSat 0).
        if (p.waterSat === 0) p.humidity_pct = 0;
        if (ranges[2] && p.E23_MPa !== null) {
          p.E23_low_MPa = between(0.1, p.E23_MPa, 1 - u[2] * 0.2);
          p.E23_high_MPa = between(p.E23_MPa, 20000, u[2] * 0.2);
        }
        return p;
      });
  });
}

/**
 * A valid record with a filler: any supported code, a mass percent up to its maximum, the default or a drawn
 * aspect ratio and orientation (matrix drawn by paramRecord).
 */
export function filledRecord(
  kind?: Kind,
  shiftLaws: readonly MaterialParams['shiftLaw'][] = ['hybrid', 'arrhenius'],
): fc.Arbitrary<MaterialParams> {
  return fc
    .record({
      p: paramRecord(kind, shiftLaws),
      code: fc.constantFrom(...FILLER_CODES),
      u: fc.double({ min: 0, max: 1, noNaN: true }),
      aspect: fc.option(fieldValue(spec('fillerAspect')), { nil: null }),
      align: fc.option(fieldValue(spec('fillerAlign')), { nil: null }),
    })
    .map(({ p, code, u, aspect, align }) => ({
      ...p,
      filler: code,
      fillerMass_pct: Math.min(FILLERS[code].massPct[1], u * FILLERS[code].massPct[1]),
      fillerAspect: aspect,
      fillerAlign: align,
    }));
}

/** Values a loose record (a worksheet block, a JSON file) may hold for one key. */
export function looseValue(): fc.Arbitrary<unknown> {
  return fc.oneof(
    { weight: 4, arbitrary: anyNumber() },
    { weight: 3, arbitrary: anyText() },
    {
      weight: 1,
      arbitrary: fc.constantFrom('amorphous', 'semicrystalline', 'crosslinked', 'hybrid', 'wlf', 'arrhenius', 'Amorphous', ' wlf '),
    },
    { weight: 1, arbitrary: fc.boolean() },
    { weight: 1, arbitrary: emptyCell() },
    { weight: 1, arbitrary: fc.constantFrom<unknown>([], {}, [1], { x: 1 }) },
  );
}

/**
 * A loose record for paramsFromRecord: either a valid record with some fields replaced by loose values
 * (numbers as text, empties, junk, unknown keys), or a record of arbitrary known and unknown keys.
 */
export function looseRecord(): fc.Arbitrary<Record<string, unknown>> {
  const damaged = fc
    .tuple(
      paramRecord(),
      fc.array(fc.tuple(fc.constantFrom<string>(...ALL_KEYS, 'tg_C', 'Tg', 'colour', '__proto__', ''), looseValue()), { maxLength: 3 }),
      fc.boolean(),
    )
    .map(([p, edits, asText]) => {
      const r: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(p)) r[k] = asText && typeof v === 'number' ? String(v) : v;
      for (const [k, v] of edits) Object.defineProperty(r, k, { value: v, enumerable: true, writable: true, configurable: true });
      return r;
    });
  const arbitrary = fc.dictionary(fc.oneof(fc.constantFrom<string>(...ALL_KEYS), fc.string({ maxLength: 6 })), looseValue(), {
    maxKeys: 8,
  });
  return fc.oneof({ weight: 3, arbitrary: damaged }, { weight: 1, arbitrary: arbitrary });
}
