/**
 * Declarative argument specs: each worksheet argument is a small record (kind, unit of a bare number,
 * bounds, default, optional) with one shared parser. Parsing raises ArgumentProblem naming the
 * argument and saying what to type; the error mapper turns it into a worksheet error.
 */
import {
  compileMaterial,
  getFamily,
  InputError,
  kelvinToC,
  KELVIN_OFFSET,
  ParameterError,
  blankCommentRows,
  isPronyTable,
  paramsFromBlockRows,
  pronyFromTable,
  parseStressMPa,
  parseTemperatureK,
  parseTimeS,
  SECONDS_PER_HOUR,
  SECONDS_PER_YEAR,
  TEMP_SEARCH_K,
  TIME_SEARCH_S,
  resolveMaterial,
  UnknownFamilyError,
  type Family,
  type Material,
  type MaterialParams,
} from '../../src/index.js';
import { isEmpty, isMatrix, SheetError } from './cells.js';
import { ArgumentProblem } from './errors.js';

export type ArgKind =
  | 'material'
  | 'materials'
  | 'family'
  | 'temperature'
  | 'temperatures'
  | 'time'
  | 'durations'
  | 'modulus'
  | 'stress'
  | 'strain'
  | 'count'
  | 'cycles'
  | 'curves'
  | 'sweep'
  | 'frequency'
  | 'fields';

/** One worksheet argument. `unit` is the unit of a bare number (or what the argument holds). */
export interface ArgSpec<T> {
  readonly name: string;
  readonly kind: ArgKind;
  readonly unit: string;
  /** 'matrix' arguments accept a range (and a single value); 'scalar' ones one value (or a 1 x 1 range). */
  readonly shape: 'scalar' | 'matrix';
  readonly optional: boolean;
  /** Used for an empty or left-out optional argument; written as the user would type it. */
  readonly default?: number | string;
  /** Bounds in `unit`, inclusive, for the help text and the check. */
  readonly min?: number;
  readonly max?: number;
  parse(raw: unknown): T;
}

const TEMP_MIN_C = kelvinToC(TEMP_SEARCH_K[0]);
const TEMP_MAX_C = kelvinToC(TEMP_SEARCH_K[1]);
const TIME_MIN_S = TIME_SEARCH_S[0];
const TIME_MAX_S = TIME_SEARCH_S[1];
/** Upper bound of a modulus or stress input: above the glassy modulus of any unfilled polymer (common practice: 1 to 4 GPa). */
const MODULUS_MAX_MPA = 100_000;
/** Upper bound of a strain: the model is linear viscoelastic (small strain); 10 % is far beyond its range already. */
const STRAIN_MAX = 0.1;
/** Upper bound of a cycle count: 100 years of one cycle a day is 36 525. */
const CYCLES_MAX = 1e7;

export function problem(argument: string, text: string): ArgumentProblem {
  return new ArgumentProblem('#VALUE!', argument, text);
}

/** An error value arriving as input keeps its code and says which argument it came through. */
export function carried(argument: string, e: SheetError, where = ''): ArgumentProblem {
  return new ArgumentProblem(e.code, argument, `${where}received the error ${e.code}${e.message ? ` (${e.message})` : ''}`);
}

function shapeText(m: unknown[][]): string {
  return `${m.length} x ${(m[0] ?? []).length}`;
}

/** One value from a scalar argument: unwraps a 1 x 1 range, rejects booleans, errors and bigger ranges. */
export function scalarOf(raw: unknown, name: string, what: string): number | string | null {
  let v = raw;
  if (isMatrix(v)) {
    if (v.length === 1 && v[0]?.length === 1) v = v[0][0];
    else throw problem(name, `expects one ${what}, got a range of ${shapeText(v)} cells`);
  }
  if (v instanceof SheetError) throw carried(name, v);
  if (isEmpty(v)) return null;
  if (typeof v === 'boolean') throw problem(name, `expects ${what}, got ${v ? 'TRUE' : 'FALSE'}`);
  if (typeof v === 'number' || typeof v === 'string') return v;
  throw problem(name, `expects ${what}, got an unsupported value`);
}

/** Cells of a one-row or one-column range (a single value counts as one cell). */
export function listOf(raw: unknown, name: string, what: string): (number | string)[] {
  const cells: unknown[] = [];
  if (isMatrix(raw)) {
    const rows = raw.length;
    const cols = (raw[0] ?? []).length;
    if (rows === 0 || cols === 0) throw problem(name, `expects ${what} in one row or one column, got an empty range`);
    if (rows > 1 && cols > 1) throw problem(name, `expects ${what} in one row or one column, got a range of ${shapeText(raw)} cells`);
    for (const row of raw) cells.push(...row);
  } else {
    cells.push(raw);
  }
  return cells.map((c, i) => {
    const where = cells.length > 1 ? `cell ${i + 1}: ` : '';
    if (c instanceof SheetError) throw carried(name, c, where);
    if (isEmpty(c)) throw problem(name, `${where}is empty; expects ${what}`);
    if (typeof c === 'boolean') throw problem(name, `${where}expects ${what}, got ${c ? 'TRUE' : 'FALSE'}`);
    if (typeof c !== 'number' && typeof c !== 'string') throw problem(name, `${where}expects ${what}, got an unsupported value`);
    return c;
  });
}

/** Re-labels an engine InputError with the worksheet argument name. */
function engine<T>(name: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError) throw problem(name, e.problem);
    throw e;
  }
}

export interface Common {
  optional?: boolean;
  default?: number | string;
}

export function spec<T>(s: Omit<ArgSpec<T>, 'parse' | 'optional'> & Common, parseOne: (v: number | string) => T, what: string): ArgSpec<T> {
  const optional = s.optional ?? false;
  const parse = (raw: unknown): T => {
    const v = scalarOf(raw, s.name, what);
    if (v === null) {
      if (!optional) throw problem(s.name, `is missing; type ${what}`);
      if (s.default === undefined) return undefined as T;
      return parseOne(s.default);
    }
    return parseOne(v);
  };
  return { ...s, optional, parse };
}

function checkTemperatureK(name: string, K: number, input: number | string): number {
  const C = K - KELVIN_OFFSET;
  if (C < TEMP_MIN_C - 1e-9 || C > TEMP_MAX_C + 1e-9) {
    throw problem(name, `${show(input)} is outside the model's range ${TEMP_MIN_C} to ${TEMP_MAX_C} degC`);
  }
  return K;
}

function checkTimeS(name: string, s: number, input: number | string): number {
  if (s < TIME_MIN_S * (1 - 1e-12) || s > TIME_MAX_S * (1 + 1e-12)) {
    throw problem(name, `${show(input)} is outside the model's range 1 ms to ${TIME_MAX_S / SECONDS_PER_YEAR} years`);
  }
  return s;
}

export function show(input: number | string): string {
  return typeof input === 'number' ? String(input) : `"${input}"`;
}

const TEMPERATURE_WHAT = 'a temperature (a number in degC, or text such as "176 degF" or "350 K")';
const TIME_WHAT = 'a time (a number in hours, or text such as "1000 h", "2 weeks" or "10 years")';
const MODULUS_WHAT = 'a modulus (a number in MPa, or text such as "2.4 GPa" or "300 ksi")';
const STRESS_WHAT = 'a stress (a number in MPa, or text such as "1.8 MPa" or "260 psi")';
const STRAIN_WHAT = 'a strain (a fraction such as 0.005, or text such as "0.5 %")';

/** A temperature; parsed to kelvin. */
export function temperature(name: string, o: Common = {}): ArgSpec<number> {
  return spec(
    { name, kind: 'temperature', unit: 'degC', shape: 'scalar', min: TEMP_MIN_C, max: TEMP_MAX_C, ...o },
    (v) =>
      checkTemperatureK(
        name,
        engine(name, () => parseTemperatureK(v, name)),
        v,
      ),
    TEMPERATURE_WHAT,
  );
}

/** An optional temperature without a fixed default (the wrapper picks one); parsed to kelvin or undefined. */
export function optionalTemperature(name: string): ArgSpec<number | undefined> {
  return temperature(name, { optional: true }) as ArgSpec<number | undefined>;
}

/** A duration; parsed to seconds. */
export function time(name: string, o: Common = {}): ArgSpec<number> {
  return spec(
    {
      name,
      kind: 'time',
      unit: 'h',
      shape: 'scalar',
      min: TIME_MIN_S / SECONDS_PER_HOUR,
      max: TIME_MAX_S / SECONDS_PER_HOUR,
      ...o,
    },
    (v) =>
      checkTimeS(
        name,
        engine(name, () => parseTimeS(v, name)),
        v,
      ),
    TIME_WHAT,
  );
}

function positiveMPa(name: string, v: number | string, max: number): number {
  const mpa = engine(name, () => parseStressMPa(v, name));
  if (mpa > max) throw problem(name, `${show(v)} is above ${max} MPa`);
  return mpa;
}

/** A modulus (a required stiffness, or an optional datasheet modulus); parsed to MPa. */
export function modulus(name: string, o: Common = {}): ArgSpec<number> {
  return spec(
    { name, kind: 'modulus', unit: 'MPa', shape: 'scalar', min: 0, max: MODULUS_MAX_MPA, ...o },
    (v) => positiveMPa(name, v, MODULUS_MAX_MPA),
    MODULUS_WHAT,
  );
}

/** ISO 75-2 methods by letter: A 1.80, B 0.45, C 8.00 MPa. */
const ISO75_METHODS: Record<string, number> = { A: 1.8, B: 0.45, C: 8.0 };
/** Upper bound of a heat-deflection test stress: above ISO 75 method C (8.00 MPa) by a wide margin. */
const HDT_STRESS_MAX_MPA = 50;

/** A flexural test stress (MPa), or the ISO 75 method letter A, B or C. */
export function testStress(name: string): ArgSpec<number> {
  return spec(
    { name, kind: 'stress', unit: 'MPa', shape: 'scalar', min: 0, max: HDT_STRESS_MAX_MPA },
    (v) => {
      if (typeof v === 'string') {
        const letter = ISO75_METHODS[v.trim().toUpperCase()];
        if (letter !== undefined) return letter;
      }
      return positiveMPa(name, v, HDT_STRESS_MAX_MPA);
    },
    `${STRESS_WHAT}, or the ISO 75 method letter "A" (1.80 MPa), "B" (0.45 MPa) or "C" (8.00 MPa)`,
  );
}

/** A strain as a fraction; text may end in '%'. */
export function strain(name: string): ArgSpec<number> {
  return spec(
    { name, kind: 'strain', unit: 'fraction', shape: 'scalar', min: 0, max: STRAIN_MAX },
    (v) => {
      let x: number;
      if (typeof v === 'number') x = v;
      else {
        const t = v.trim();
        const percent = t.endsWith('%');
        const n = Number((percent ? t.slice(0, -1) : t).trim());
        if (!Number.isFinite(n) || (percent ? t.slice(0, -1) : t).trim() === '') throw problem(name, `expects ${STRAIN_WHAT}, got "${v}"`);
        x = percent ? n / 100 : n;
      }
      if (!Number.isFinite(x) || x <= 0) throw problem(name, `must be greater than zero, got ${show(v)}`);
      if (x > STRAIN_MAX) {
        throw problem(
          name,
          `${show(v)} is above ${STRAIN_MAX} (${STRAIN_MAX * 100} %); the model is linear viscoelastic, for small strains only`,
        );
      }
      return x;
    },
    STRAIN_WHAT,
  );
}

function numberOf(name: string, v: number | string, what: string): number {
  const n = typeof v === 'number' ? v : v.trim() === '' ? NaN : Number(v.trim());
  if (!Number.isFinite(n)) throw problem(name, `expects ${what}, got ${show(v)}`);
  return n;
}

/** A whole number of points within bounds. */
export function count(name: string, min: number, max: number, o: Common = {}): ArgSpec<number> {
  const what = `a whole number from ${min} to ${max}`;
  return spec(
    { name, kind: 'count', unit: 'count', shape: 'scalar', min, max, ...o },
    (v) => {
      const n = numberOf(name, v, what);
      if (!Number.isInteger(n) || n < min || n > max) throw problem(name, `expects ${what}, got ${show(v)}`);
      return n;
    },
    what,
  );
}

/** How many times a duty cycle repeats: a positive number (fractions allowed). */
export function cycles(name: string, o: Common = {}): ArgSpec<number> {
  const what = `a number of repeats greater than zero, up to ${CYCLES_MAX}`;
  return spec(
    { name, kind: 'cycles', unit: 'count', shape: 'scalar', min: 0, max: CYCLES_MAX, ...o },
    (v) => {
      const n = numberOf(name, v, what);
      if (n <= 0 || n > CYCLES_MAX) throw problem(name, `expects ${what}, got ${show(v)}`);
      return n;
    },
    what,
  );
}

function familyOf(name: string, id: string): Family {
  try {
    return getFamily(id);
  } catch (e) {
    if (e instanceof UnknownFamilyError) {
      const hint = e.suggestions.length > 0 ? `; did you mean ${e.suggestions.map((s) => `"${s}"`).join(', ')}?` : '';
      throw new ArgumentProblem('#N/A', name, `unknown family "${id}"${hint} DERATE.FAMILIES() lists the symbols`);
    }
    throw e;
  }
}

const FAMILY_WHAT = 'a family symbol such as "PC" or "PA66-cond" (DERATE.FAMILIES() lists them)';

/** A bundled family by symbol (text). */
export function family(name: string): ArgSpec<Family> {
  return spec(
    { name, kind: 'family', unit: 'symbol', shape: 'scalar' },
    (v) => {
      if (typeof v !== 'string') throw problem(name, `expects ${FAMILY_WHAT}, got the number ${v}`);
      return familyOf(name, v);
    },
    FAMILY_WHAT,
  );
}

const MATERIAL_WHAT = `${FAMILY_WHAT}, a parameter block range (field, value) as spilled by DERATE.PARAMS, or a Prony table range (first cell "prony") as spilled by DERATE.FITCURVES`;

/** A family symbol, a parameter block or a Prony table; compiled to a material. */
export function material(name: string): ArgSpec<Material> {
  const parse = (raw: unknown): Material => {
    if (isMatrix(raw) && !(raw.length === 1 && raw[0]?.length === 1)) {
      const rows = raw.length;
      const cols = (raw[0] ?? []).length;
      if (rows < 2 || cols < 2) {
        throw problem(
          name,
          `a range must be a parameter block or a Prony table of at least 2 columns (field, value) and several rows, got ${rows} x ${cols} cells`,
        );
      }
      const cells = blankCommentRows(raw);
      if (isPronyTable(cells)) return pronyMaterial(name, cells);
      try {
        const params = engine(name, () => paramsFromBlockRows(cells, { argument: name, checkCell: carriedCell(name), hint: PARAMS_HINT }));
        return compileMaterial(params);
      } catch (e) {
        if (e instanceof ParameterError) throw problem(name, `parameter ${e.field} ${e.problem}`);
        throw e;
      }
    }
    const v = scalarOf(raw, name, MATERIAL_WHAT);
    if (v === null) throw problem(name, `is missing; type ${MATERIAL_WHAT}`);
    if (typeof v !== 'string') throw problem(name, `expects ${MATERIAL_WHAT}, got the number ${v}`);
    return compileMaterial(familyOf(name, v).params);
  };
  return { name, kind: 'material', unit: 'symbol', shape: 'matrix', optional: false, parse };
}

const PARAMS_HINT = 'DERATE.PARAMS("PC") shows a complete block';

/** For the engine's block reader: a worksheet error arriving in a cell keeps its code and names where it came in. */
function carriedCell(name: string): (cell: unknown, where: string) => void {
  return (cell, where) => {
    if (cell instanceof SheetError) throw carried(name, cell, where);
  };
}

function pronyMaterial(name: string, rows: unknown[][]): Material {
  for (const [i, row] of rows.entries()) {
    for (const c of row) {
      if (c instanceof SheetError) throw carried(name, c, `row ${i + 1} of the Prony table: `);
      if (typeof c === 'boolean')
        throw problem(name, `row ${i + 1} of the Prony table: expects a number or text, got ${c ? 'TRUE' : 'FALSE'}`);
    }
  }
  try {
    return resolveMaterial(pronyFromTable(rows));
  } catch (e) {
    if (e instanceof InputError) throw problem(name, `Prony table: ${e.problem}`);
    if (e instanceof ParameterError) throw problem(name, `Prony table: ${e.field} ${e.problem}`);
    throw e;
  }
}

const START_WHAT = `${FAMILY_WHAT}, or a parameter block range (field, value) as spilled by DERATE.PARAMS`;

/**
 * The starting point of a fit: a family symbol or a parameter block (not a Prony table, which has no
 * four-region parameters to adjust); parsed to the parameter record.
 */
export function start(name: string): ArgSpec<MaterialParams> {
  const any = material(name);
  const parse = (raw: unknown): MaterialParams => {
    const m = any.parse(raw);
    if (m.prony) {
      throw problem(name, `a Prony table cannot be the start of a fit (it has no four-region parameters to adjust); give ${START_WHAT}`);
    }
    return m.params;
  };
  return { ...any, parse };
}

/** Family symbols in one row or column. */
export function materials(name: string): ArgSpec<string[]> {
  const parse = (raw: unknown): string[] =>
    listOf(raw, name, FAMILY_WHAT).map((v, i, all) => {
      if (typeof v !== 'string')
        throw problem(name, `${all.length > 1 ? `cell ${i + 1}: ` : ''}expects ${FAMILY_WHAT}, got the number ${v}`);
      return familyOf(name, v).params.id;
    });
  return { name, kind: 'materials', unit: 'symbol', shape: 'matrix', optional: false, parse };
}

/** Temperatures in one row or column; parsed to kelvin. */
export function temperatures(name: string): ArgSpec<number[]> {
  const one = temperature(name);
  const parse = (raw: unknown): number[] =>
    listOf(raw, name, TEMPERATURE_WHAT).map((v, i, all) => withCell(name, i, all.length, () => one.parse(v)));
  return { name, kind: 'temperatures', unit: 'degC', shape: 'matrix', optional: false, min: one.min, max: one.max, parse };
}

/** Durations in one row or column; parsed to seconds. */
export function durations(name: string): ArgSpec<number[]> {
  const one = time(name);
  const parse = (raw: unknown): number[] =>
    listOf(raw, name, TIME_WHAT).map((v, i, all) => withCell(name, i, all.length, () => one.parse(v)));
  return { name, kind: 'durations', unit: 'h', shape: 'matrix', optional: false, min: one.min, max: one.max, parse };
}

function withCell<T>(name: string, i: number, n: number, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (n > 1 && e instanceof ArgumentProblem && e.argument === name)
      throw new ArgumentProblem(e.code, name, `cell ${i + 1}: ${e.problem}`);
    throw e;
  }
}
