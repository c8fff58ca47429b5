/**
 * Test-data table arguments of the fitting functions: curve tables and DMA sweeps, read by the
 * engine's table readers (src/fit/testdata.ts) after the cells are checked here.
 */
import { readCurveTable, readDmaTable, renamedInput, type CurveSet, type DmaSweep } from '../../../src/index.js';
import { isEmpty, isMatrix, SheetError } from '../cells.js';
import { carried, fromInput, problem, scalarOf, type ArgSpec } from './spec.js';

/** Cells of a data range as the engine's reader takes them; error values and booleans are refused by row and column. */
function tableCells(name: string, raw: unknown, what: string): unknown[][] {
  if (!isMatrix(raw) || raw.length < 2) {
    const one = isMatrix(raw) ? raw[0]?.[0] : raw;
    if (isMatrix(raw) && (raw[0]?.length ?? 0) > 1)
      throw problem(name, `expects ${what}: a range with a header row and data rows, got one row`);
    if (isEmpty(one)) throw problem(name, `is empty; expects ${what}`);
    scalarOf(one, name, what);
    throw problem(name, `expects ${what}: a range with a header row and data rows, got one value`);
  }
  raw.forEach((row, i) =>
    row.forEach((c, j) => {
      if (c instanceof SheetError) throw carried(name, c, `row ${i + 1}, column ${j + 1}: `);
      if (typeof c === 'boolean')
        throw problem(name, `row ${i + 1}, column ${j + 1}: expects a number or a header, got ${c ? 'TRUE' : 'FALSE'}`);
      if (!(c === null || c === undefined || typeof c === 'number' || typeof c === 'string')) {
        throw problem(name, `row ${i + 1}, column ${j + 1}: an unsupported value`);
      }
    }),
  );
  return raw;
}

/** The engine's reader names its own words; the error names the argument. */
function fromEngine<T>(name: string, f: () => T): T {
  return fromInput(() => renamedInput(name, f));
}

const CURVES_WHAT =
  "a curve table (columns temperature_C, time_h or time_s, and modulus_MPa, creep_modulus_MPa or compliance_1/MPa; one row per point, each curve's rows together)";

/** Relaxation or creep curves at several temperatures, as a table range; read by the engine's reader. */
export function curves(name: string): ArgSpec<CurveSet> {
  const parse = (raw: unknown): CurveSet => fromEngine(name, () => readCurveTable(tableCells(name, raw, CURVES_WHAT)));
  return { name, kind: 'curves', unit: 'table', shape: 'matrix', optional: false, parse };
}

const SWEEP_WHAT = 'a DMA sweep table (columns temperature_C and storage_MPa, temperatures increasing)';

/** A DMA storage-modulus temperature sweep, as a table range. */
export function sweep(name: string): ArgSpec<DmaSweep> {
  const parse = (raw: unknown): DmaSweep => fromEngine(name, () => readDmaTable(tableCells(name, raw, SWEEP_WHAT)));
  return { name, kind: 'sweep', unit: 'table', shape: 'matrix', optional: false, parse };
}
