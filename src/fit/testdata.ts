/**
 * The user's own test data as tables: relaxation or creep curves at several temperatures, and DMA
 * temperature sweeps. One reader for CSV text and for worksheet ranges (rows of cells). Every cell is
 * accounted for: a cell that is not a number, a unit that differs from its column's, a time that does
 * not increase, or a curve that runs the wrong way is an error naming its row; only wholly blank rows
 * and '#' comment rows are skipped.
 *
 * Curve table, one row per point, curves one after another:
 *   temperature_C, time_h, modulus_MPa            (relaxation modulus)
 *   temperature_C, time_s, creep_modulus_MPa      (stress / creep strain)
 *   temperature_C, time_s, compliance_1/MPa       (creep compliance)
 * DMA table: temperature_C, storage_MPa (one frequency, given separately).
 * Units go in the header after the last '_' or in brackets: temperature_[C|degC|K|degF],
 * time_[s|min|h|d|week|y], modulus_[Pa|kPa|MPa|GPa|psi|ksi], compliance_[1/Pa|1/MPa|1/GPa].
 */
import { InputError } from '../base/errors.js';
import { bareDecimal, MODEL_TEMPERATURE_K, parseStressMPa, parseTemperatureK, parseTimeS, unitFor } from '../base/units.js';
import { temperatureValue } from '../base/display.js';

export type CurveKind = 'relaxation' | 'creep';

/** One isothermal curve: times (s, increasing) and moduli (MPa): relaxation modulus, or creep modulus 1/D. */
export interface Curve {
  readonly temperatureK: number;
  readonly timesS: readonly number[];
  readonly moduliMPa: readonly number[];
  /** 1-based rows of the table the points came from. */
  readonly rows: readonly number[];
}

export interface CurveSet {
  readonly kind: CurveKind;
  readonly curves: readonly Curve[];
}

/** Fewest points a curve may have. */
export const MIN_POINTS_PER_CURVE = 5;
/** Largest rise of a relaxation modulus (or fall of a creep modulus... i.e. rise) over the running minimum that is taken as noise (5 %). */
export const MONOTONE_TOLERANCE = 0.05;
/** Fewest points of a DMA sweep. */
export const MIN_DMA_POINTS = 8;

type Quantity = 'temperature' | 'time' | 'modulus' | 'compliance';

interface Column {
  readonly quantity: Quantity;
  readonly role: string;
  readonly unit: string;
  readonly name: string;
}

const COMPLIANCE_PER_MPA: Record<string, number> = { '1/pa': 1e6, '1/mpa': 1, '1/gpa': 1e-3 };

function parseHeader(cell: unknown, index: number): Column {
  const name = String(cell ?? '').trim();
  const bracket = /^(.*?)\s*[[(]\s*([^\])]+)\s*[\])]\s*$/.exec(name);
  let root: string;
  let unit: string;
  if (bracket) {
    root = (bracket[1] ?? '').trim();
    unit = (bracket[2] ?? '').trim();
  } else {
    const cut = name.lastIndexOf('_');
    root = cut > 0 ? name.slice(0, cut) : name;
    unit = cut > 0 ? name.slice(cut + 1) : '';
  }
  const r = root.toLowerCase().replace(/[\s-]+/g, '_');
  const u = unit.toLowerCase();
  const where = `column ${index + 1} '${name}'`;
  /** The header's unit read as the unit parsers read it (SI prefixes case-sensitive, unit words any case). */
  const canonical = (quantity: 'temperature' | 'time' | 'stress', use: string): string => {
    try {
      return unitFor(unit, quantity, 'header');
    } catch (e) {
      if (e instanceof InputError) throw new InputError('header', `${where}: ${e.problem}; use ${use}`);
      throw e;
    }
  };
  const needUnit = (examples: string): never => {
    throw new InputError('header', `${where} needs a unit, such as ${examples}`);
  };
  if (r === 'temperature' || r === 't' || r === 'temp') {
    if (!u) needUnit("'temperature_C' or 'temperature [K]'");
    return { quantity: 'temperature', role: 'temperature', unit: canonical('temperature', 'C, K or degF'), name };
  }
  if (r === 'time') {
    if (!u) needUnit("'time_s' or 'time [h]'");
    return { quantity: 'time', role: 'time', unit: canonical('time', 's, min, h, d, week or y'), name };
  }
  if (r === 'modulus' || r === 'relaxation_modulus' || r === 'creep_modulus' || r === 'storage' || r === 'storage_modulus' || r === 'e') {
    if (!u) needUnit("'modulus_MPa' or 'modulus [GPa]'");
    const canon = canonical('stress', 'Pa, kPa, MPa, GPa, psi or ksi');
    const role = r.startsWith('creep') ? 'creep' : r.startsWith('storage') ? 'storage' : 'relaxation';
    return { quantity: 'modulus', role, unit: canon, name };
  }
  if (r === 'compliance' || r === 'creep_compliance') {
    if (!u) needUnit("'compliance_1/MPa'");
    if (!(u in COMPLIANCE_PER_MPA)) throw new InputError('header', `${where}: unknown compliance unit '${unit}'; use 1/Pa, 1/MPa or 1/GPa`);
    return { quantity: 'compliance', role: 'compliance', unit: u, name };
  }
  throw new InputError(
    'header',
    `${where} is not a known column; use temperature_C, time_h (or time_s), and one of modulus_MPa, creep_modulus_MPa, compliance_1/MPa, storage_MPa`,
  );
}

/** Splits CSV text into rows of cells (RFC 4180 quoting; comma or semicolon separated). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  const firstLine = text.split(/\r?\n/).find((l) => l.trim() !== '' && !l.trim().startsWith('#')) ?? '';
  const sep = firstLine.includes(';') && !firstLine.includes(',') ? ';' : ',';
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = false;
      } else cell += c;
      continue;
    }
    if (c === '"') quoted = true;
    else if (c === sep) {
      row.push(cell);
      cell = '';
    } else if (c === '\n' || c === '\r') {
      if (c === '\r' && text[i + 1] === '\n') i++;
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
    } else cell += c;
  }
  if (cell !== '' || row.length > 0) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}

function isBlank(c: unknown): boolean {
  return c === null || c === undefined || (typeof c === 'string' && c.trim() === '');
}

/** Data rows with their 1-based row numbers, after the header; blank and '#' rows skipped. */
function dataRows(rows: readonly (readonly unknown[])[]): { header: Column[]; body: { row: number; cells: readonly unknown[] }[] } {
  let headerIndex = -1;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i] ?? [];
    if (r.every(isBlank)) continue;
    const first = r[0];
    if (typeof first === 'string' && first.trim().startsWith('#')) continue;
    headerIndex = i;
    break;
  }
  if (headerIndex < 0) throw new InputError('data', 'the table is empty');
  const headerCells = (rows[headerIndex] ?? []).filter((c, i, all) => !isBlank(c) || all.slice(i).some((x) => !isBlank(x)));
  const header = headerCells.map((c, i) => parseHeader(c, i));
  const body: { row: number; cells: readonly unknown[] }[] = [];
  for (let i = headerIndex + 1; i < rows.length; i++) {
    const r = rows[i] ?? [];
    if (r.every(isBlank)) continue;
    const first = r[0];
    if (typeof first === 'string' && first.trim().startsWith('#')) continue;
    const extra = r.slice(header.length).filter((c) => !isBlank(c));
    if (extra.length > 0) throw new InputError('data', `row ${i + 1} has ${r.length} cells but the header has ${header.length} columns`);
    body.push({ row: i + 1, cells: r });
  }
  return { header, body };
}

/** Reads one cell in its column's unit; a unit in the cell must be the column's (no mixed units). */
function readCell(v: unknown, col: Column, row: number): number {
  const where = `row ${row}, ${col.name}`;
  if (isBlank(v)) throw new InputError('data', `${where} is empty; fill it or delete the row (nothing is dropped silently)`);
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) throw new InputError('data', `${where}: ${v} is not a finite number`);
    return convert(v, col, where);
  }
  const text = String(v).trim();
  let bare: number | null;
  try {
    bare = bareDecimal(text, 'data');
  } catch (e) {
    if (e instanceof InputError) throw new InputError('data', `${where}: ${e.problem}`);
    throw e;
  }
  if (bare !== null) return convert(bare, col, where);
  const m = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.+)$/.exec(text);
  if (!m) throw new InputError('data', `${where}: '${text}' is not a number`);
  const unitText = (m[2] ?? '').trim();
  let canon: string | undefined;
  if (col.quantity === 'compliance') canon = unitText.toLowerCase() in COMPLIANCE_PER_MPA ? unitText.toLowerCase() : undefined;
  else {
    try {
      canon = unitFor(unitText, col.quantity === 'modulus' ? 'stress' : col.quantity, 'data');
    } catch {
      canon = undefined;
    }
  }
  if (canon !== col.unit) {
    throw new InputError(
      'data',
      `${where}: '${text}' is in another unit than its column (${col.unit}); mixed units in one column are not accepted`,
    );
  }
  return convert(Number(m[1]), col, where);
}

function convert(x: number, col: Column, where: string): number {
  switch (col.quantity) {
    case 'temperature': {
      const K = parseTemperatureK(`${x} ${col.unit}`, where);
      const [lo, hi] = MODEL_TEMPERATURE_K;
      if (K < lo - 1e-9 || K > hi + 1e-9) {
        throw new InputError(
          'data',
          `${where}: ${x} ${col.unit} is outside the model's range ${lo - 273.15} to ${hi - 273.15} degC; check the unit of the column`,
        );
      }
      return K;
    }
    case 'time':
      return parseTimeS(`${x} ${col.unit}`, where);
    case 'modulus':
      return parseStressMPa(`${x} ${col.unit}`, where);
    case 'compliance': {
      if (!(x > 0)) throw new InputError('data', `${where}: a compliance must be greater than zero, got ${x}`);
      return x * (COMPLIANCE_PER_MPA[col.unit] ?? 1);
    }
  }
}

/** Reads a curve table (rows of cells, header first). */
export function readCurveTable(rows: readonly (readonly unknown[])[]): CurveSet {
  const { header, body } = dataRows(rows);
  const iT = header.findIndex((c) => c.quantity === 'temperature');
  const it = header.findIndex((c) => c.quantity === 'time');
  const iE = header.findIndex((c) => c.quantity === 'modulus' || c.quantity === 'compliance');
  if (iT < 0 || it < 0 || iE < 0 || header.length !== 3) {
    throw new InputError(
      'header',
      `a curve table has three columns: temperature, time and a modulus or compliance; got ${header.map((h) => h.name).join(', ')}`,
    );
  }
  const colE = header[iE]!;
  if (colE.role === 'storage')
    throw new InputError('header', `'${colE.name}' is a DMA storage modulus; a curve table needs a relaxation or creep column`);
  const kind: CurveKind = colE.role === 'relaxation' ? 'relaxation' : 'creep';
  const groups: { T: number; t: number[]; E: number[]; rows: number[] }[] = [];
  for (const { row, cells } of body) {
    const T = readCell(cells[iT], header[iT]!, row);
    const t = readCell(cells[it], header[it]!, row);
    const raw = readCell(cells[iE], colE, row);
    const E = colE.quantity === 'compliance' ? 1 / raw : raw;
    const last = groups[groups.length - 1];
    if (last && Math.abs(last.T - T) < 1e-9) {
      last.t.push(t);
      last.E.push(E);
      last.rows.push(row);
    } else {
      const earlier = groups.find((g) => Math.abs(g.T - T) < 1e-9);
      if (earlier) {
        throw new InputError(
          'data',
          `row ${row}: the curve at ${temperatureValue(T - 273.15)} degC started at row ${earlier.rows[0]} and was interrupted; keep each curve's rows together`,
        );
      }
      groups.push({ T, t: [t], E: [E], rows: [row] });
    }
  }
  if (groups.length === 0) throw new InputError('data', 'the table has a header but no data rows');
  const curves = groups.map((g) => checkCurve(g, kind));
  return { kind, curves };
}

function checkCurve(g: { T: number; t: number[]; E: number[]; rows: number[] }, kind: CurveKind): Curve {
  const label = `the curve at ${temperatureValue(g.T - 273.15)} degC (rows ${g.rows[0]}-${g.rows[g.rows.length - 1]})`;
  if (g.t.length < MIN_POINTS_PER_CURVE) {
    throw new InputError('data', `${label} has ${g.t.length} points; a curve needs at least ${MIN_POINTS_PER_CURVE}`);
  }
  let runningMin = g.E[0] ?? Infinity;
  for (let i = 1; i < g.t.length; i++) {
    if (!((g.t[i] ?? 0) > (g.t[i - 1] ?? 0))) {
      throw new InputError(
        'data',
        `${label}: the time at row ${g.rows[i]} does not increase from row ${g.rows[i - 1]}; sort each curve by time and remove repeated times`,
      );
    }
    const E = g.E[i] ?? 0;
    if (E > runningMin * (1 + MONOTONE_TOLERANCE)) {
      const what =
        kind === 'relaxation'
          ? 'a relaxation modulus cannot rise with time'
          : 'a creep modulus cannot rise with time (the compliance cannot fall)';
      throw new InputError(
        'data',
        `${label}: row ${g.rows[i]} is ${((E / runningMin - 1) * 100).toFixed(1)} % above an earlier point; ${what} beyond noise (${MONOTONE_TOLERANCE * 100} %)`,
      );
    }
    runningMin = Math.min(runningMin, E);
  }
  return { temperatureK: g.T, timesS: g.t, moduliMPa: g.E, rows: g.rows };
}

/** A DMA temperature sweep at one frequency. */
export interface DmaSweep {
  readonly temperaturesK: readonly number[];
  readonly storageMPa: readonly number[];
  readonly rows: readonly number[];
}

/** Reads a DMA table: temperature and storage modulus columns, temperatures increasing. */
export function readDmaTable(rows: readonly (readonly unknown[])[]): DmaSweep {
  const { header, body } = dataRows(rows);
  const iT = header.findIndex((c) => c.quantity === 'temperature');
  const iE = header.findIndex((c) => c.quantity === 'modulus');
  if (iT < 0 || iE < 0 || header.length !== 2) {
    throw new InputError(
      'header',
      `a DMA table has two columns, temperature and storage modulus (temperature_C, storage_MPa); got ${header.map((h) => h.name).join(', ')}`,
    );
  }
  const T: number[] = [];
  const E: number[] = [];
  const rowNums: number[] = [];
  for (const { row, cells } of body) {
    const t = readCell(cells[iT], header[iT]!, row);
    const e = readCell(cells[iE], header[iE]!, row);
    const prev = T[T.length - 1];
    if (prev !== undefined && !(t > prev)) {
      throw new InputError(
        'data',
        `row ${row}: temperatures must increase down the sweep (${temperatureValue(t - 273.15)} degC follows ${temperatureValue(prev - 273.15)} degC)`,
      );
    }
    T.push(t);
    E.push(e);
    rowNums.push(row);
  }
  if (T.length < MIN_DMA_POINTS) throw new InputError('data', `a DMA sweep needs at least ${MIN_DMA_POINTS} points, got ${T.length}`);
  return { temperaturesK: T, storageMPa: E, rows: rowNums };
}
