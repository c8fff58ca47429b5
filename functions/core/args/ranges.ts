/**
 * Ranges as 2-D arrays: the cells of a one-row or one-column range, each read as one value of a
 * quantity (temperatures, durations); errors say which cell.
 */
import { atItem, temperatureInput, timeInput, type Quantity } from '../../../src/index.js';
import { isEmpty, isMatrix, SheetError } from '../cells.js';
import { carried, fromInput, problem, type ArgKind, type ArgSpec } from './spec.js';

function shapeText(m: unknown[][]): string {
  return `${m.length} x ${(m[0] ?? []).length}`;
}

/** Cells of a one-row or one-column range (a single value counts as one cell); worksheet values only. */
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

/** A one-row or one-column range of a quantity. */
export function rangeOf<T>(q: Quantity<T>, name: string, kind: ArgKind): ArgSpec<T[]> {
  const parse = (raw: unknown): T[] => {
    const cells = listOf(raw, name, q.what);
    return cells.map((v, i) => fromInput(() => atItem(name, 'cell', i, cells.length, () => q.parse(v, name))));
  };
  return { name, kind, unit: q.unit, shape: 'matrix', optional: false, min: q.min, max: q.max, parse };
}

/** Temperatures in one row or column; parsed to kelvin. */
export function temperatures(name: string): ArgSpec<number[]> {
  return rangeOf(temperatureInput, name, 'temperatures');
}

/** Durations in one row or column; parsed to seconds. */
export function durations(name: string): ArgSpec<number[]> {
  return rangeOf(timeInput, name, 'durations');
}
