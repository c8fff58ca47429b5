/**
 * Property-based tests over every worksheet function, called the way a host calls them: each
 * definition's `invoke` with the host-neutral cell values of functions/core (what the HyperFormula host
 * passes), and the Office adapter (functions/host/office.ts) with error objects of the runtime's shape (a guard:
 * with our metadata Excel passes no error inputs, see functions/README.md). The list of
 * functions comes from the registry (test/support/functions.ts), so a new function is covered without an
 * edit here; its arguments are drawn from their specs' kinds (a new kind fails the first test until it
 * has a generator below).
 *
 * Inputs come from test/arbitraries.ts: numbers (NaN, +-Infinity, -0, 1e308, denormals), text (empty,
 * unit text with odd spacing and case, unknown units, unicode), booleans, empty cells, error values,
 * ragged, nested and huge ranges, mixed with valid values so that the answers are reached too.
 *
 * Properties: never throws; a finite number, a well-formed spill (rectangular, every cell a finite number,
 * text, empty or an error with a message, of the size spillSize promised) or a worksheet error with a
 * message; monotone in temperature and time for MODULUS / RATIO / STRESS (the entropic rise of a network
 * taken out, as src/material/model.ts defines it); MAXTEMP / MAXTIME round-trip through MODULUS within 1e-6
 * relative or are #N/A with a message; BAND low <= central <= high.
 *
 * Seeded and bounded (RD_PROPERTY_RUNS raises every count, RD_PROPERTY_SEED replays a failure).
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import type { ArgKind, ArgSpec } from '../functions/core/args/spec.js';
import { foreignError, SheetError } from '../functions/core/cells.js';
import { definition, type ArgShape, type FunctionDef } from '../functions/core/define.js';
import { officeFunction, type CustomFunctionsRuntime } from '../functions/host/office.js';
import { excelArgs, FakeError, fakeRuntime } from './support/office-runtime.js';
import { loadsOnFirstCall } from '../scripts/functions-files.mjs';
import { compileMaterial, getFamily } from '../src/index.js';
import {
  anyRange,
  cellScalar,
  emptyCell,
  errorCell,
  FAMILY_IDS,
  familyIdText,
  hugeRange,
  logUniform,
  mostlyValid,
  propertyParameters,
  validStrainText,
  validStressText,
  validTemperatureText,
  validTimeText,
  type Quantity,
} from './arbitraries.js';
import { loadFunctions, type LoadedModule } from './support/functions.js';
import { VALID, VALID_BY_NAME, validArgs } from './support/samples.js';

// ---------------------------------------------------------------------------------------------
// Result checks
// ---------------------------------------------------------------------------------------------

const CODES = ['#VALUE!', '#N/A', '#NUM!'];

function checkError(e: SheetError, label: string): void {
  expect(CODES, `${label}: code ${e.code}`).toContain(e.code);
  expect(typeof e.message === 'string' && e.message.trim().length > 0, `${label}: ${e.code} without a message`).toBe(true);
}

function checkCell(c: unknown, label: string): void {
  if (c === null || typeof c === 'string') return;
  if (c instanceof SheetError) return checkError(c, label);
  expect(typeof c, `${label}: cell ${String(c)}`).toBe('number');
  expect(Number.isFinite(c), `${label}: cell ${String(c)}`).toBe(true);
}

/** The size a host would see for each argument, when every range is rectangular (else undefined). */
function shapesOf(args: readonly unknown[]): ArgShape[] | undefined {
  const out: ArgShape[] = [];
  for (const a of args) {
    if (!Array.isArray(a)) {
      out.push({ rows: 1, cols: 1, literal: a });
      continue;
    }
    if (a.length === 0 || !a.every((r) => Array.isArray(r))) return undefined;
    const cols = (a[0] as unknown[]).length;
    if (cols === 0 || a.some((r: unknown[]) => r.length !== cols || r.some((c) => Array.isArray(c)))) return undefined;
    out.push({ rows: a.length, cols });
  }
  return out;
}

/** The one property every call must hold: no throw, and a well-formed value of the definition's kind. */
function checkCall(def: FunctionDef, args: readonly unknown[]): unknown {
  const label = `DERATE.${def.id}`;
  let out: unknown;
  expect(() => (out = def.invoke(...args)), label).not.toThrow();
  if (out instanceof SheetError) {
    checkError(out, label);
    return out;
  }
  if (def.result === 'scalar') {
    expect(typeof out, `${label}: ${String(out)}`).toBe('number');
    expect(Number.isFinite(out), `${label}: ${String(out)}`).toBe(true);
    return out;
  }
  expect(Array.isArray(out), label).toBe(true);
  const rows = out as unknown[][];
  expect(rows.length, `${label}: empty spill`).toBeGreaterThan(0);
  const width = rows[0]?.length ?? 0;
  expect(width, `${label}: empty first row`).toBeGreaterThan(0);
  for (const row of rows) {
    expect(Array.isArray(row) && row.length === width, `${label}: ragged spill`).toBe(true);
    for (const c of row) checkCell(c, label);
  }
  const shapes = shapesOf(args);
  const size = shapes ? def.spillSize(shapes) : undefined;
  if (size) {
    if (def.spillFits === 'exact') expect([rows.length, width], `${label}: spillSize`).toEqual([...size]);
    else {
      expect(rows.length, `${label}: rows within spillSize`).toBeLessThanOrEqual(size[0]);
      expect(width, `${label}: columns within spillSize`).toBeLessThanOrEqual(size[1]);
    }
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Argument generators, one per kind
// ---------------------------------------------------------------------------------------------

type MakeError = (code: string) => unknown;

const QUANTITY: Partial<Record<ArgKind, Quantity>> = {
  temperature: 'temperature',
  temperatures: 'temperature',
  time: 'time',
  durations: 'time',
  modulus: 'stress',
  stress: 'stress',
};

/** A PARAMS spill of a family (the parameter block any material argument reads back). */
function paramsBlock(id: string): unknown[][] {
  const params = definition('PARAMS');
  if (!params) throw new Error('DERATE.PARAMS is not loaded');
  const out = params.invoke(id);
  if (out instanceof SheetError || !Array.isArray(out)) throw new Error(`PARAMS ${id}: ${String(out)}`);
  return out;
}

/** One cell of a valid value replaced by junk (a damaged table or block). */
function damaged(table: unknown[][], junk: fc.Arbitrary<unknown>): fc.Arbitrary<unknown[][]> {
  const rows = table.length;
  const cols = Math.max(...table.map((r) => r.length));
  return fc
    .tuple(fc.nat(rows - 1), fc.nat(cols - 1), junk)
    .map(([r, c, v]) => table.map((row, i) => (i === r ? row.map((x, j) => (j === c ? v : x)) : row)));
}

/** A list as one column (usually) or one row. */
function asList<T>(items: fc.Arbitrary<T>, maxLength: number): fc.Arbitrary<T[][]> {
  return fc.tuple(fc.array(items, { minLength: 1, maxLength }), fc.boolean()).map(([xs, row]) => (row ? [xs] : xs.map((x) => [x])));
}

function junk(spec: ArgSpec<unknown>, makeError: MakeError): fc.Arbitrary<unknown> {
  const q = QUANTITY[spec.kind];
  const cell = fc.oneof({ weight: 8, arbitrary: cellScalar(q) as fc.Arbitrary<unknown> }, { weight: 1, arbitrary: errorCell(makeError) });
  return fc.oneof(
    { weight: 6, arbitrary: cell },
    { weight: 3, arbitrary: anyRange(cell) as fc.Arbitrary<unknown> },
    { weight: 1, arbitrary: hugeRange(cell, 400, 25) as fc.Arbitrary<unknown> },
    { weight: 1, arbitrary: fc.constantFrom<unknown>({ not: 'a cell' }, [[{}]], Symbol.for('x'), () => 1) },
  );
}

function valid(spec: ArgSpec<unknown>, makeError: MakeError): fc.Arbitrary<unknown> {
  const temperature = fc.oneof(validTemperatureText(), fc.double({ min: -100, max: 400, noNaN: true }));
  const hours = fc.oneof(validTimeText(), logUniform(1e-3, 1e5));
  const family = fc.constantFrom(...FAMILY_IDS);
  const sample: unknown = spec.name in VALID_BY_NAME ? VALID_BY_NAME[spec.name] : VALID[spec.kind];
  const damage = fc.oneof(cellScalar() as fc.Arbitrary<unknown>, errorCell(makeError));
  switch (spec.kind) {
    case 'temperature':
      return spec.name in VALID_BY_NAME ? fc.oneof(fc.constant(sample), temperature) : temperature;
    case 'temperatures':
      return fc.oneof(
        { weight: 8, arbitrary: asList(temperature, 12) },
        { weight: 1, arbitrary: hugeRange(fc.integer({ min: -100, max: 400 }), 1000, 1) },
      );
    case 'time':
      return hours;
    case 'durations':
      return asList(hours, 24);
    case 'modulus':
      return spec.name in VALID_BY_NAME ? fc.oneof(fc.constant(sample), validStressText()) : validStressText();
    case 'stress':
      return fc.oneof(logUniform(0.1, 10), fc.constantFrom('1.8 MPa', '0.45 MPa', '261 psi'));
    case 'strain':
      return validStrainText();
    case 'count':
      return fc.integer({ min: spec.min ?? 1, max: Math.min(spec.max ?? 50, 200) });
    case 'cycles':
      // At least one repeat (history.ts MIN_CYCLES); few enough that 24 segments of the drawn hours mostly stay within 100 years.
      return fc.oneof(fc.integer({ min: 1, max: 1000 }), logUniform(1, 1e4));
    case 'family':
      return familyIdText();
    case 'material':
      return fc.oneof(
        { weight: 4, arbitrary: familyIdText() },
        { weight: 2, arbitrary: family.map((id) => [[id]]) },
        { weight: 2, arbitrary: family.map(paramsBlock) },
        { weight: 1, arbitrary: family.chain((id) => damaged(paramsBlock(id), damage)) },
      );
    case 'materials':
      return fc.oneof(
        { weight: 8, arbitrary: asList(familyIdText(), 8) },
        { weight: 1, arbitrary: hugeRange(family, 100, 1).map((col) => col.slice(0, 40)) },
      );
    case 'curves':
    case 'sweep':
      return fc.oneof(fc.constant(sample), damaged(sample as unknown[][], damage));
    case 'frequency':
      return fc.oneof(logUniform(0.01, 100), fc.constantFrom('1 Hz', '10 hz', '0.1 Hz'));
    case 'fields':
      return fc.constantFrom(null, 'beta', 'C1, C2_K', [['Tg_C'], ['beta']], 'beta C1');
  }
}

/** A value for one argument: valid most of the time, else anything a cell can hold; empty for an optional one. */
function argument(spec: ArgSpec<unknown>, makeError: MakeError, validShare: number): fc.Arbitrary<unknown> {
  const w = Math.round(validShare * 100);
  const parts = [{ weight: w, arbitrary: valid(spec, makeError) }];
  if (w < 100) parts.push({ weight: 100 - w, arbitrary: junk(spec, makeError) });
  if (spec.optional) parts.push({ weight: 15, arbitrary: emptyCell() as fc.Arbitrary<unknown> });
  return fc.oneof(...parts);
}

/**
 * The arguments of one call, in three mixes: each drawn on its own; every one valid (so that functions of
 * many arguments reach answers too); or the baseline call of test/support/samples.ts with one argument
 * replaced by a drawn value (what reaches the fits, whose arguments must agree with each other). Sometimes
 * one argument too many, or trailing ones left out (as a host passes them: undefined).
 */
function callArgs(def: FunctionDef, makeError: MakeError, validShare: number): fc.Arbitrary<unknown[]> {
  const each = def.args.map((a) => argument(a, makeError, validShare));
  const allValid = def.args.map((a) => argument(a, makeError, 1));
  const mixes: fc.WeightedArbitrary<unknown[]>[] = [
    { weight: 3, arbitrary: fc.tuple(...each) },
    { weight: 1, arbitrary: fc.tuple(...allValid) },
  ];
  if (def.args.length > 0) {
    const one = fc.nat(def.args.length - 1).chain((i) => (each[i] as fc.Arbitrary<unknown>).map((v) => ({ i, v })));
    mixes.push({
      weight: 2,
      arbitrary: one.map(({ i, v }) => {
        const args = validArgs(def);
        args[i] = v;
        return args;
      }),
    });
  }
  return fc
    .tuple(
      fc.oneof(...mixes),
      fc.constantFrom<'as-is' | 'extra' | 'short'>('as-is', 'as-is', 'as-is', 'as-is', 'extra', 'short'),
      fc.nat(def.args.length),
    )
    .map(([xs, how, cut]) =>
      how === 'extra' ? [...xs, 'extra'] : how === 'short' ? [...xs.slice(0, cut), ...xs.slice(cut).map(() => undefined)] : xs,
    );
}

// ---------------------------------------------------------------------------------------------
// The tests
// ---------------------------------------------------------------------------------------------

let defs: readonly FunctionDef[] = [];
let lazyIds = new Set<string>();
let modules: LoadedModule[] = [];

beforeAll(async () => {
  const loaded = await loadFunctions();
  defs = loaded.defs;
  modules = loaded.modules;
  lazyIds = new Set(
    modules
      .filter((m) => loadsOnFirstCall(m.file))
      .flatMap((m) => Object.values(m.exports))
      .flatMap((x) => (x !== null && typeof x === 'object' && 'id' in x && 'invoke' in x ? [String((x as FunctionDef).id)] : [])),
  );
});

/** Cases per function: the functions loaded on first call (the fits) are dearer, so they get fewer. */
function runsFor(def: FunctionDef, eager: number, lazy: number): number {
  return lazyIds.has(def.id) ? lazy : eager;
}

describe('every worksheet function, arbitrary input', () => {
  it('finds every definition and a generator for every argument kind', () => {
    expect(defs.length).toBeGreaterThanOrEqual(21);
    expect(lazyIds.size).toBeGreaterThanOrEqual(6);
    for (const def of defs) for (const a of def.args) expect(() => valid(a, (c) => foreignError(c)), `${def.id} ${a.kind}`).not.toThrow();
  });

  it('never throws; a finite number, a well-formed spill or a worksheet error with a message (neutral host values)', () => {
    const makeError = (code: string): SheetError => foreignError(code, code === '#N/A' ? '' : 'from another cell');
    const answered: string[] = [];
    for (const def of defs) {
      let answers = 0;
      fc.assert(
        fc.property(callArgs(def, makeError, 0.6), (args) => {
          if (!(checkCall(def, args) instanceof SheetError)) answers++;
        }),
        // The baseline call of test/support/samples.ts is always among the cases, so that a function whose arguments must
        // agree with each other (EQTIME: as many durations as temperatures, a history inside 1 ms to 100 years) is reached.
        { ...propertyParameters<[unknown[]]>(runsFor(def, 60, 12)), examples: [[validArgs(def)]] },
      );
      if (answers > 0) answered.push(def.id);
    }
    // Not vacuous: every function gave at least one answer (not only errors) in its drawn calls.
    expect(defs.map((d) => d.id).filter((id) => !answered.includes(id))).toEqual([]);
  });

  it('through the Office adapter: numbers and spills come back, errors are CustomFunctions.Error with a message', () => {
    const rt: CustomFunctionsRuntime = fakeRuntime();
    const makeError = (code: string): FakeError => new FakeError(code, code === '#DIV/0!' ? undefined : 'upstream');
    for (const def of defs) {
      const fn = officeFunction(rt, def);
      fc.assert(
        fc.property(callArgs(def, makeError, 0.5), (args) => {
          let out: unknown;
          try {
            // As Excel's runtime calls it: the worksheet values, then the Invocation object.
            out = fn(...excelArgs(def.id, args));
          } catch (e) {
            expect(e, `DERATE.${def.id} threw something else`).toBeInstanceOf(FakeError);
            const err = e as FakeError;
            expect(CODES).toContain(err.code);
            if (err.code !== '#NUM!') expect((err.message ?? '').trim().length, `DERATE.${def.id} ${err.code}`).toBeGreaterThan(0);
            return;
          }
          if (def.result === 'scalar') expect(Number.isFinite(out), `DERATE.${def.id}: ${String(out)}`).toBe(true);
          else {
            const rows = out as unknown[][];
            for (const row of rows) {
              expect(row.length).toBe(rows[0]?.length);
              for (const c of row) {
                if (c instanceof FakeError) expect(CODES).toContain(c.code);
                else if (typeof c === 'number') expect(Number.isFinite(c)).toBe(true);
                else expect(typeof c, `DERATE.${def.id} cell`).toBe('string');
              }
            }
          }
        }),
        propertyParameters(runsFor(def, 15, 3)),
      );
    }
  });
});

// ---------------------------------------------------------------------------------------------
// What the model says, seen through the wrappers
// ---------------------------------------------------------------------------------------------

function def(id: string): FunctionDef {
  const d = definition(id);
  if (!d) throw new Error(`DERATE.${id} is not loaded`);
  return d;
}

/** A bundled family, given as its symbol or as its PARAMS block. */
const familyArg = fc
  .tuple(fc.constantFrom(...FAMILY_IDS), fc.boolean())
  .map(([id, block]) => ({ id, arg: block ? paramsBlock(id) : [[id]] }));
const tempC = fc.double({ min: -100, max: 400, noNaN: true });
const hoursArb = logUniform(1e-3, 5e5);
/** Relative slack for round-off between two evaluations that the model says are ordered. */
const ROUND = 1e-9;
const ROUND_TRIP = 1e-6;

/** The entropic rise of a network's rubbery modulus, MPa at T (src/material/model.ts); zero for other kinds. */
function entropic(id: string, TC: number): number {
  return compileMaterial(getFamily(id).params).networkMPaPerK * (TC + 273.15);
}

function num(x: unknown): number | null {
  return typeof x === 'number' ? x : null;
}

describe('monotone where the model says so', () => {
  const cases: { id: string; call: (arg: unknown, TC: number, h: number) => unknown[]; scale: (x: number) => number }[] = [
    { id: 'MODULUS', call: (m, T, h) => [m, T, h], scale: (x) => x },
    { id: 'RATIO', call: (m, T, h) => [m, T, h, 23, 1], scale: (x) => x },
    { id: 'STRESS', call: (m, T, h) => [m, 0.01, T, h], scale: (x) => x * 0.01 },
  ];
  for (const c of cases) {
    it(`${c.id} is non-increasing in temperature (less the entropic rise of a network) and in time`, () => {
      const d = def(c.id);
      fc.assert(
        fc.property(familyArg, tempC, tempC, hoursArb, hoursArb, ({ id, arg }, T1, T2, h1, h2) => {
          const [Ta, Tb] = T1 <= T2 ? [T1, T2] : [T2, T1];
          const [ha, hb] = h1 <= h2 ? [h1, h2] : [h2, h1];
          const a = num(checkCall(d, c.call(arg, Ta, ha)));
          const bT = num(checkCall(d, c.call(arg, Tb, ha)));
          const bt = num(checkCall(d, c.call(arg, Ta, hb)));
          expect(a !== null && bT !== null && bt !== null, `${c.id} ${id} gave an error inside the model's range`).toBe(true);
          if (a === null || bT === null || bt === null) return;
          expect(bt, `${c.id} ${id} ${Ta} degC, ${ha} h -> ${hb} h`).toBeLessThanOrEqual(a * (1 + ROUND));
          // RATIO divides by the reference modulus; the network's rise is then divided by it too.
          const ref = c.id === 'RATIO' ? num(def('MODULUS').invoke(arg, 23, 1)) : 1;
          const rise = (T: number): number => (c.id === 'RATIO' ? entropic(id, T) / (ref ?? 1) : c.scale(entropic(id, T)));
          expect(bT - rise(Tb), `${c.id} ${id} ${Ta} -> ${Tb} degC at ${ha} h`).toBeLessThanOrEqual(a - rise(Ta) + ROUND * Math.abs(a));
        }),
        propertyParameters(120),
      );
    });
  }
});

describe('inverse answers round-trip through MODULUS', () => {
  const modulus = (): FunctionDef => def('MODULUS');
  it('MAXTEMP: MODULUS at the answer is the required modulus within 1e-6, or #N/A with a message', () => {
    fc.assert(
      fc.property(familyArg, logUniform(1, 20000), hoursArb, ({ id, arg }, req, h) => {
        const out = checkCall(def('MAXTEMP'), [arg, req, h]);
        if (out instanceof SheetError) {
          expect(out.code, `${id} ${req} MPa ${h} h: ${out.message}`).toBe('#N/A');
          return;
        }
        const E = num(checkCall(modulus(), [arg, out, h]));
        expect(E, `${id}: MODULUS at ${String(out)} degC`).not.toBeNull();
        expect(Math.abs((E ?? NaN) / req - 1), `${id} ${req} MPa ${h} h -> ${String(out)} degC`).toBeLessThanOrEqual(ROUND_TRIP);
      }),
      propertyParameters(150),
    );
  });
  it('MAXTIME: MODULUS after the answer is the required modulus within 1e-6, or #N/A with a message', () => {
    fc.assert(
      fc.property(familyArg, logUniform(1, 20000), tempC, ({ id, arg }, req, T) => {
        const out = checkCall(def('MAXTIME'), [arg, req, T]);
        if (out instanceof SheetError) {
          expect(out.code, `${id} ${req} MPa ${T} degC: ${out.message}`).toBe('#N/A');
          return;
        }
        const E = num(checkCall(modulus(), [arg, T, out]));
        expect(E, `${id}: MODULUS after ${String(out)} h`).not.toBeNull();
        expect(Math.abs((E ?? NaN) / req - 1), `${id} ${req} MPa ${T} degC -> ${String(out)} h`).toBeLessThanOrEqual(ROUND_TRIP);
      }),
      propertyParameters(150),
    );
  });
});

describe('BAND', () => {
  it('low <= central <= high, central = MODULUS, region named', () => {
    fc.assert(
      fc.property(familyArg, fc.oneof(tempC, validTemperatureText()), fc.oneof(hoursArb, validTimeText()), ({ id, arg }, T, h) => {
        const out = checkCall(def('BAND'), [arg, T, h]);
        if (out instanceof SheetError) {
          // Valid time text reaches past the model's 100 years (validTimeText: up to 1000 years).
          expect(out.message, `BAND ${id} ${String(T)} ${String(h)}`).toMatch(/^time: .* is outside the model's range/);
          return;
        }
        const [low, central, high, region] = (out as unknown[][])[0] ?? [];
        expect(typeof low === 'number' && typeof central === 'number' && typeof high === 'number').toBe(true);
        expect(low as number).toBeLessThanOrEqual(central as number);
        expect(central as number).toBeLessThanOrEqual(high as number);
        expect(central).toBe(def('MODULUS').invoke(arg, T, h));
        expect(typeof region === 'string' && region.length > 0).toBe(true);
      }),
      propertyParameters(150),
    );
  });
  it('mostly valid text arguments still give a number or an error with a message', () => {
    fc.assert(
      fc.property(familyArg, mostlyValid(validTemperatureText(), 'temperature'), mostlyValid(validTimeText(), 'time'), ({ arg }, T, h) => {
        checkCall(def('BAND'), [arg, T, h]);
      }),
      propertyParameters(100),
    );
  });
});
