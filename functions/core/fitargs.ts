/**
 * Argument specs of the fitting functions (test-data ranges, a DMA frequency, a list of parameter
 * names). Kept apart from args.ts because they pull in the engine's table readers, which only the
 * fitting functions (loaded on first call in Excel) need.
 */
import {
  InputError,
  NUMERIC_FIELDS,
  readCurveTable,
  readDmaTable,
  type CurveSet,
  type DmaSweep,
  type NumericField,
} from '../../src/index.js';
import { carried, problem, scalarOf, show, spec, type ArgSpec, type Common } from './args.js';
import { isEmpty, isMatrix, SheetError } from './cells.js';

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

function fromEngine<T>(name: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError) throw problem(name, e.problem);
    throw e;
  }
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

/** Range of a DMA test frequency, Hz (instruments run from about 0.01 to 100 Hz; common practice). */
const FREQUENCY_MIN_HZ = 1e-4;
const FREQUENCY_MAX_HZ = 1e4;
const FREQUENCY_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e-3 };
const FREQUENCY_WHAT = 'a frequency (a number in Hz, or text such as "1 Hz" or "10 Hz")';

/** A test frequency; parsed to Hz. "mHz" is millihertz (the SI symbol; megahertz is not a DMA frequency). */
export function frequency(name: string, o: Common = {}): ArgSpec<number> {
  return spec(
    { name, kind: 'frequency', unit: 'Hz', shape: 'scalar', min: FREQUENCY_MIN_HZ, max: FREQUENCY_MAX_HZ, ...o },
    (v) => {
      let hz: number;
      if (typeof v === 'number') hz = v;
      else {
        const m = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*([a-zA-Z]*)\s*$/.exec(v);
        const factor = m ? (m[2] === '' ? 1 : m[2] === 'mHz' ? 1e-3 : FREQUENCY_UNITS[(m[2] ?? '').toLowerCase()]) : undefined;
        if (!m || factor === undefined) throw problem(name, `expects ${FREQUENCY_WHAT}, got ${show(v)}`);
        hz = Number(m[1]) * factor;
      }
      if (!Number.isFinite(hz) || hz <= 0) throw problem(name, `must be greater than zero, got ${show(v)}`);
      if (hz < FREQUENCY_MIN_HZ || hz > FREQUENCY_MAX_HZ) {
        throw problem(name, `${show(v)} is outside ${FREQUENCY_MIN_HZ} to ${FREQUENCY_MAX_HZ} Hz`);
      }
      return hz;
    },
    FREQUENCY_WHAT,
  );
}

const FIELD_BY_LOWER = new Map(NUMERIC_FIELDS.map((f) => [f.key.toLowerCase(), f.key]));
const FIELDS_WHAT = 'parameter names such as "tauTg_s" or "beta" (the field column of DERATE.PARAMS), in cells or as "tauTg_s, beta"';

/** Optional parameter names to fit instead of the automatic choice: cells of a row or column, or one comma-separated text. */
export function fields(name: string): ArgSpec<NumericField[] | undefined> {
  const parse = (raw: unknown): NumericField[] | undefined => {
    const texts: string[] = [];
    const take = (c: unknown, where: string): void => {
      if (c instanceof SheetError) throw carried(name, c, where);
      if (isEmpty(c)) return;
      if (typeof c !== 'string')
        throw problem(name, `${where}expects ${FIELDS_WHAT}, got ${typeof c === 'boolean' ? (c ? 'TRUE' : 'FALSE') : String(c)}`);
      texts.push(
        ...c
          .split(/[,;]/)
          .map((t) => t.trim())
          .filter((t) => t !== ''),
      );
    };
    if (isMatrix(raw) && !(raw.length === 1 && raw[0]?.length === 1)) {
      const cols = (raw[0] ?? []).length;
      if (raw.length > 1 && cols > 1)
        throw problem(name, `expects ${FIELDS_WHAT} in one row or one column, got a range of ${raw.length} x ${cols} cells`);
      raw.flat().forEach((c, i) => take(c, `cell ${i + 1}: `));
    } else {
      const v = scalarOf(raw, name, FIELDS_WHAT);
      if (v === null) return undefined;
      take(v, '');
    }
    if (texts.length === 0) return undefined;
    return texts.map((t) => {
      const f = FIELD_BY_LOWER.get(t.toLowerCase());
      if (f === undefined) throw problem(name, `"${t}" is not a parameter name; expects ${FIELDS_WHAT}`);
      return f;
    });
  };
  return { name, kind: 'fields', unit: 'names', shape: 'matrix', optional: true, parse };
}
