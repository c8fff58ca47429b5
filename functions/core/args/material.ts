/**
 * Material arguments: a family symbol, a parameter block range (as DERATE.PARAMS spills it) or a Prony
 * table range (as DERATE.FITCURVES spills it), compiled by the input layer; the start of a fit; a list of
 * family symbols.
 */
import {
  atItem,
  blankCommentRows,
  FAMILY_WHAT,
  familyInput,
  isPronyTable,
  materialFromRows,
  materialFromSymbol,
  type Family,
  type Material,
  type MaterialParams,
} from '../../../src/index.js';
import { isMatrix, SheetError } from '../cells.js';
import { listOf } from './ranges.js';
import { carried, fromInput, problem, scalarOf, quantityArg, type ArgSpec } from './spec.js';

const FAMILY_CELL_WHAT = `${FAMILY_WHAT} (DERATE.FAMILIES() lists them)`;

/** A bundled family by symbol (text). */
export function family(name: string): ArgSpec<Family> {
  return { ...quantityArg({ ...familyInput, what: FAMILY_CELL_WHAT }, name, 'family'), unit: 'symbol' };
}

const MATERIAL_WHAT = `${FAMILY_CELL_WHAT}, a parameter block range (field, value) as spilled by DERATE.PARAMS, or a Prony table range (first cell "prony") as spilled by DERATE.FITCURVES`;

const PARAMS_HINT = 'DERATE.PARAMS("PC") shows a complete block';

/** For the engine's block reader: a worksheet error arriving in a cell keeps its code and names where it came in. */
function carriedCell(name: string): (cell: unknown, where: string) => void {
  return (cell, where) => {
    if (cell instanceof SheetError) throw carried(name, cell, where);
  };
}

/** Worksheet values the Prony reader cannot take, refused here with the row they are in. */
function checkPronyCells(name: string, rows: unknown[][]): void {
  if (!isPronyTable(rows)) return;
  for (const [i, row] of rows.entries()) {
    for (const c of row) {
      if (c instanceof SheetError) throw carried(name, c, `row ${i + 1} of the Prony table: `);
      if (typeof c === 'boolean')
        throw problem(name, `row ${i + 1} of the Prony table: expects a number or text, got ${c ? 'TRUE' : 'FALSE'}`);
    }
  }
}

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
      checkPronyCells(name, cells);
      return fromInput(() => materialFromRows(cells, name, { checkCell: carriedCell(name), hint: PARAMS_HINT }));
    }
    const v = scalarOf(raw, name, MATERIAL_WHAT);
    if (v === null) throw problem(name, `is missing; type ${MATERIAL_WHAT}`);
    if (typeof v !== 'string') throw problem(name, `expects ${MATERIAL_WHAT}, got the number ${v}`);
    return fromInput(() => materialFromSymbol(v, name));
  };
  return { name, kind: 'material', unit: 'symbol', shape: 'matrix', optional: false, parse };
}

const START_WHAT = `${FAMILY_CELL_WHAT}, or a parameter block range (field, value) as spilled by DERATE.PARAMS`;

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

/** Family symbols in one row or column; parsed to their ids. */
export function materials(name: string): ArgSpec<string[]> {
  const parse = (raw: unknown): string[] => {
    const cells = listOf(raw, name, FAMILY_CELL_WHAT);
    return cells.map((v, i) => fromInput(() => atItem(name, 'cell', i, cells.length, () => familyInput.parse(v, name).params.id)));
  };
  return { name, kind: 'materials', unit: 'symbol', shape: 'matrix', optional: false, parse };
}
