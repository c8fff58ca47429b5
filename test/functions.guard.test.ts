/** The central guard and error mapper, and a property test: no input makes a wrapper throw or put NaN or Infinity in a cell. */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { InputError, ParameterError, SolverError, UnknownFamilyError } from '../src/index.js';
import { SheetError } from '../functions/core/cells.js';
import type { FunctionDef } from '../functions/core/define.js';
import { guardMatrix, guardScalar, toSheetError } from '../functions/core/errors.js';
import { loadFunctions } from './support/functions.js';
import { validArgs } from './support/samples.js';

let defs: readonly FunctionDef[] = [];
beforeAll(async () => {
  defs = (await loadFunctions()).defs;
});

describe('error mapper', () => {
  it('maps each engine error to its worksheet error', () => {
    expect(toSheetError(new InputError('time', 'must be positive'))).toEqual(new SheetError('#VALUE!', 'time: must be positive'));
    expect(toSheetError(new ParameterError('beta', 'too big')).code).toBe('#VALUE!');
    const unknown = toSheetError(new UnknownFamilyError('PX', ['PC']));
    expect(unknown.code).toBe('#N/A');
    expect(unknown.message).toContain("did you mean 'PC'");
    expect(toSheetError(new SolverError('iteration-cap', 200, 1e-3)).code).toBe('#NUM!');
    expect(toSheetError(new RangeError('Maximum call stack')).code).toBe('#NUM!');
    expect(toSheetError(new Error('boom')).message).toContain('internal error');
  });
});

describe('result guard', () => {
  it('turns NaN and Infinity into #NUM! and keeps finite numbers', () => {
    expect(guardScalar(NaN)).toMatchObject({ code: '#NUM!' });
    expect(guardScalar(Infinity)).toMatchObject({ code: '#NUM!' });
    expect(guardScalar(-Infinity)).toMatchObject({ code: '#NUM!' });
    expect(guardScalar(1.5)).toBe(1.5);
    expect(guardScalar(undefined)).toMatchObject({ code: '#VALUE!' });
  });
  it('checks every cell of a spill and rejects ragged or empty tables', () => {
    const out = guardMatrix([
      [1, NaN],
      ['a', undefined],
    ]) as unknown[][];
    expect(out[0]?.[0]).toBe(1);
    expect(out[0]?.[1]).toMatchObject({ code: '#NUM!' });
    expect(out[1]?.[1]).toBeNull();
    expect(guardMatrix([[1], [1, 2]])).toMatchObject({ code: '#VALUE!' });
    expect(guardMatrix([])).toMatchObject({ code: '#VALUE!' });
  });
});

const cell = fc.oneof(
  fc.double(),
  fc.integer({ min: -1000, max: 1000 }),
  fc.constantFrom('', ' ', 'PC', 'pbt', 'PX', '80 degC', '1000 h', '-300 degC', '1e400', 'NaN', 'Infinity', '5 %', 'A', '1e-9 s'),
  fc.string({ maxLength: 8 }),
  fc.boolean(),
  fc.constant(null),
  fc.constant(undefined),
  fc.constant(new SheetError('#N/A', 'upstream')),
);
const value = fc.oneof(cell, fc.array(fc.array(cell, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 3 }));

function safe(x: unknown): boolean {
  if (x instanceof SheetError) return x.message.length > 0 || x.code === '#NUM!';
  if (typeof x === 'number') return Number.isFinite(x);
  if (Array.isArray(x)) return x.every((r) => Array.isArray(r) && r.every((c) => c === null || typeof c === 'string' || safe(c)));
  return false;
}

describe('property: any input gives a finite number, a table of safe cells, or a worksheet error', () => {
  it('never throws, never returns NaN or Infinity', () => {
    for (const def of defs) {
      fc.assert(
        fc.property(fc.integer({ min: 0, max: Math.max(0, def.args.length - 1) }), value, (i, v) => {
          const args = validArgs(def);
          if (def.args.length > 0) args[i] = v;
          let out: unknown;
          expect(() => (out = def.invoke(...args))).not.toThrow();
          return safe(out);
        }),
        { numRuns: 60, seed: 20240601 },
      );
    }
  });
});
