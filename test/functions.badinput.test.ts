/**
 * Bad input for every argument of every worksheet function, generated from the argument specs: each
 * must come back as a worksheet error (never a throw, never a number) whose message names the argument.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { ArgKind, ArgSpec } from '../functions/core/args/spec.js';
import { SheetError, type ErrorCode } from '../functions/core/cells.js';
import type { FunctionDef } from '../functions/core/define.js';
import { loadFunctions } from './support/functions.js';
import { validArgs } from './support/samples.js';

interface Bad {
  readonly value: unknown;
  readonly code: ErrorCode;
  readonly says: string;
}

const UPSTREAM = new SheetError('#N/A', 'upstream problem');
const COMMON: readonly Bad[] = [
  { value: true, code: '#VALUE!', says: 'TRUE' },
  { value: UPSTREAM, code: '#N/A', says: 'upstream problem' },
  { value: { not: 'a cell' }, code: '#VALUE!', says: 'unsupported' },
];
const SCALAR_RANGE: Bad = {
  value: [
    [1, 2],
    [3, 4],
  ],
  code: '#VALUE!',
  says: '2 x 2',
};

const CURVE_HEADER = ['temperature_C', 'time_h', 'modulus_MPa'];
/** Six points of a made-up relaxation curve (for the shape of the table only). */
function curve(T: number): (string | number | null)[][] {
  return [1, 2, 5, 10, 20, 50].map((h, i) => [T, h, 1000 - 10 * i]);
}

const BY_KIND: Record<ArgKind, readonly Bad[]> = {
  material: [
    { value: 66, code: '#VALUE!', says: 'family symbol' },
    { value: 'PX', code: '#N/A', says: 'unknown family' },
    { value: [['PC', 'PBT', 'PP']], code: '#VALUE!', says: 'parameter block' },
    {
      value: [
        [1, 2],
        [3, 4],
      ],
      code: '#VALUE!',
      says: 'field names',
    },
    {
      value: [
        ['Tg_Cx', 100],
        ['kind', 'amorphous'],
      ],
      code: '#VALUE!',
      says: 'not a parameter name',
    },
    {
      value: [
        ['kind', 'amorphous'],
        ['Tg_C', 'warm'],
      ],
      code: '#VALUE!',
      says: 'Tg_C',
    },
    {
      value: [
        ['kind', 'glassy'],
        ['Tg_C', 100],
      ],
      code: '#VALUE!',
      says: 'kind',
    },
  ],
  family: [{ value: 66, code: '#VALUE!', says: 'family symbol' }, { value: 'PX', code: '#N/A', says: 'unknown family' }, SCALAR_RANGE],
  materials: [
    {
      value: [
        ['PC', 'PBT'],
        ['PP', 'PS'],
      ],
      code: '#VALUE!',
      says: 'one row or one column',
    },
    { value: [['PC'], [null]], code: '#VALUE!', says: 'cell 2: is empty' },
    { value: [['PC'], ['PX']], code: '#N/A', says: 'unknown family' },
    { value: [[66]], code: '#VALUE!', says: 'family symbol' },
  ],
  temperature: [
    { value: 'hot', code: '#VALUE!', says: 'hot' },
    { value: 9999, code: '#VALUE!', says: 'outside' },
    { value: -400, code: '#VALUE!', says: 'absolute zero' },
    { value: '80 kg', code: '#VALUE!', says: 'temperature unit' },
    SCALAR_RANGE,
  ],
  temperatures: [
    { value: [[70], ['hot']], code: '#VALUE!', says: 'cell 2' },
    {
      value: [
        [70, 30],
        [1, 2],
      ],
      code: '#VALUE!',
      says: 'one row or one column',
    },
    { value: [[9999]], code: '#VALUE!', says: 'outside' },
  ],
  time: [
    { value: 0, code: '#VALUE!', says: 'greater than zero' },
    { value: -1, code: '#VALUE!', says: 'greater than zero' },
    { value: '1000 kg', code: '#VALUE!', says: 'time unit' },
    { value: '1000 years', code: '#VALUE!', says: 'outside' },
    SCALAR_RANGE,
  ],
  durations: [
    { value: [[8], [0]], code: '#VALUE!', says: 'cell 2' },
    {
      value: [
        [8, 16],
        [1, 2],
      ],
      code: '#VALUE!',
      says: 'one row or one column',
    },
  ],
  modulus: [
    { value: 0, code: '#VALUE!', says: 'greater than zero' },
    { value: 'stiff', code: '#VALUE!', says: 'stiff' },
    { value: 1e6, code: '#VALUE!', says: 'above' },
    SCALAR_RANGE,
  ],
  stress: [
    { value: 0, code: '#VALUE!', says: 'greater than zero' },
    { value: 'D', code: '#VALUE!', says: 'D' },
    { value: 100, code: '#VALUE!', says: 'above' },
    SCALAR_RANGE,
  ],
  strain: [
    { value: 0, code: '#VALUE!', says: 'greater than zero' },
    { value: 0.5, code: '#VALUE!', says: 'small strains' },
    { value: 'x%', code: '#VALUE!', says: 'strain' },
    SCALAR_RANGE,
  ],
  count: [
    { value: 0, code: '#VALUE!', says: 'whole number' },
    { value: 2.5, code: '#VALUE!', says: 'whole number' },
    { value: 5000, code: '#VALUE!', says: 'whole number' },
    SCALAR_RANGE,
  ],
  cycles: [
    { value: 0, code: '#VALUE!', says: 'from 1 to' },
    { value: 0.5, code: '#VALUE!', says: 'from 1 to' },
    { value: 'many', code: '#VALUE!', says: 'many' },
    SCALAR_RANGE,
  ],
  curves: [
    { value: 'hot', code: '#VALUE!', says: 'curve table' },
    { value: SCALAR_RANGE.value, code: '#VALUE!', says: 'not a known column' },
    { value: [CURVE_HEADER, [80, 1, 1000], [80, 2, 900]], code: '#VALUE!', says: 'at least 5' },
    {
      value: [CURVE_HEADER, ...curve(80), ...curve(100).map((r, i) => (i === 2 ? [100, '10 min', r[2]] : r))],
      code: '#VALUE!',
      says: 'mixed units',
    },
    {
      value: [CURVE_HEADER, ...curve(80), ...curve(100).map((r, i) => (i === 2 ? [100, r[1], 'n/a'] : r))],
      code: '#VALUE!',
      says: 'not a number',
    },
    { value: [CURVE_HEADER, ...curve(80).map((r, i) => (i === 3 ? [80, r[1], null] : r))], code: '#VALUE!', says: 'is empty' },
    { value: [CURVE_HEADER, ...curve(80).map((r, i) => (i === 3 ? [80, 0.5, r[2]] : r))], code: '#VALUE!', says: 'does not increase' },
    { value: [CURVE_HEADER, [80, 1, UPSTREAM]], code: '#N/A', says: 'row 2, column 3: received the error #N/A' },
  ],
  sweep: [
    { value: 'hot', code: '#VALUE!', says: 'DMA sweep table' },
    {
      value: [['temperature_C', 'storage_MPa'], ...[30, 40, 50, 60, 70, 80, 90, 100].map((T) => [T, 2000])].reverse(),
      code: '#VALUE!',
      says: 'not a known column',
    },
    {
      value: [['temperature_C', 'storage_MPa'], ...[30, 40, 35, 60, 70, 80, 90, 100].map((T) => [T, 2000])],
      code: '#VALUE!',
      says: 'must increase',
    },
    { value: [['temperature_C', 'storage_MPa'], ...[30, 40, 50].map((T) => [T, 2000])], code: '#VALUE!', says: 'at least 8' },
  ],
  frequency: [
    { value: 0, code: '#VALUE!', says: 'greater than zero' },
    { value: '1 GHz', code: '#VALUE!', says: 'frequency' },
    { value: 1e6, code: '#VALUE!', says: 'outside' },
    SCALAR_RANGE,
  ],
  fields: [
    { value: 'Tg_Cx', code: '#VALUE!', says: 'not a parameter name' },
    { value: 'beta, warmth', code: '#VALUE!', says: '"warmth" is not a parameter name' },
    {
      value: [
        ['beta', 'C1'],
        ['C2_K', 'Tg_C'],
      ],
      code: '#VALUE!',
      says: 'one row or one column',
    },
    { value: 66, code: '#VALUE!', says: 'parameter names' },
  ],
};

function badValues(a: ArgSpec<unknown>): Bad[] {
  const list = [...COMMON, ...BY_KIND[a.kind]];
  if (!a.optional) list.push({ value: null, code: '#VALUE!', says: a.shape === 'scalar' || a.kind === 'material' ? 'missing' : 'empty' });
  return list;
}

let defs: readonly FunctionDef[] = [];
beforeAll(async () => {
  defs = (await loadFunctions()).defs;
});

describe('bad input, every argument of every function', () => {
  it('has a valid baseline call for every function', () => {
    expect(defs.length).toBeGreaterThanOrEqual(15);
    for (const def of defs) {
      const out = def.invoke(...validArgs(def));
      expect(out instanceof SheetError, `DERATE.${def.id} baseline: ${String(out)}`).toBe(false);
    }
  });

  it('rejects each bad value with a worksheet error that names the argument', () => {
    let cases = 0;
    for (const def of defs) {
      def.args.forEach((a, i) => {
        for (const bad of badValues(a)) {
          const args = validArgs(def);
          args[i] = bad.value;
          const label = `DERATE.${def.id} ${a.name} = ${JSON.stringify(bad.value)}`;
          let out: unknown;
          expect(() => (out = def.invoke(...args)), label).not.toThrow();
          expect(out instanceof SheetError, `${label}: got ${JSON.stringify(out)}`).toBe(true);
          const err = out as SheetError;
          expect(err.code, `${label}: ${err.message}`).toBe(bad.code);
          expect(err.message.startsWith(`${a.name}: `), `${label}: ${err.message}`).toBe(true);
          expect(err.message, label).toContain(bad.says);
          cases++;
        }
      });
    }
    expect(cases).toBeGreaterThan(200);
  });

  it('uses the default for an empty optional argument', () => {
    for (const def of defs) {
      def.args.forEach((a, i) => {
        if (!a.optional) return;
        for (const empty of [null, undefined, '']) {
          const args = validArgs(def);
          args[i] = empty;
          const withEmpty = def.invoke(...args);
          expect(withEmpty instanceof SheetError, `DERATE.${def.id} ${a.name} empty: ${String(withEmpty)}`).toBe(false);
          if (a.default !== undefined) {
            args[i] = a.default;
            expect(withEmpty, `DERATE.${def.id} ${a.name} default ${a.default}`).toEqual(def.invoke(...args));
          }
        }
      });
    }
  });

  it('accepts a 1 x 1 range wherever it accepts one value', () => {
    for (const def of defs) {
      def.args.forEach((a, i) => {
        const args = validArgs(def);
        const plain = def.invoke(...args);
        const v = args[i];
        args[i] = Array.isArray(v) ? v : [[v]];
        if (Array.isArray(v) && v.length !== 1) return;
        expect(def.invoke(...args), `DERATE.${def.id} ${a.name} as 1 x 1`).toEqual(plain);
      });
    }
  });

  it('rejects extra arguments', () => {
    for (const def of defs) {
      const out = def.invoke(...validArgs(def), 'extra');
      expect(out instanceof SheetError && out.message.includes(`takes at most ${def.args.length}`), `DERATE.${def.id}`).toBe(true);
    }
  });
});
