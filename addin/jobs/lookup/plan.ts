/** The "look up a family" job: searching the bundled table and the parameter block written for a family. */
import { BLOCK_HEADER, paramsBlock } from '../../../functions/core/block.js';
import { valueIn } from '../../../src/base/display.js';
import { displayedParams, type Family } from '../../../src/material/families.js';
import { familiesAndGrades, getGrade, GRADE_MODULUS_SOURCE, listedModulusMPa } from '../../../src/material/grade.js';
import { splitHumidity } from '../../../src/material/humidity.js';
import type { MaterialParams, NumericField } from '../../../src/material/params.js';
import type { Cell } from '../../sheet/a1.js';
import type { CellWrite } from '../../sheet/port.js';
import type { Plan } from '../../shell/writer.js';

export interface Quantity {
  readonly label: string;
  /** Typical value with its range, as shown ("147 degC (145 to 150)"), or '-' when the kind has none. */
  readonly text: string;
  readonly source: string;
}

export interface FamilySummary {
  readonly id: string;
  readonly name: string;
  readonly kind: string;
  readonly note: string;
  readonly quantities: readonly Quantity[];
}

function quantity(f: Family, label: string, key: NumericField, low: NumericField, high: NumericField, unit: string): Quantity {
  // A conditioned polyamide shows its wet Tg and modulus; its block keeps the dry ones and the humidity.
  const p = displayedParams(f.params);
  const v = p[key];
  if (v === null) return { label, text: '-', source: 'not used for this kind' };
  const lo = p[low];
  const hi = p[high];
  const range = lo !== null && hi !== null && (lo !== v || hi !== v) ? ` (${valueIn(lo, unit)} to ${valueIn(hi, unit)})` : '';
  return { label, text: `${valueIn(v, unit)} ${unit}${range}`, source: f.sources[key] ?? 'no source recorded' };
}

/** A filled grade's 23 degC modulus: the model's estimate along flow (no datasheet range: it is not a datasheet value). */
function gradeModulus(f: Family): Quantity {
  const E = listedModulusMPa(f);
  return {
    label: 'Modulus at 23 degC, along flow',
    text: E === null ? '-' : `${valueIn(E, 'MPa')} MPa (estimated)`,
    source: GRADE_MODULUS_SOURCE,
  };
}

/** A family's or filled grade's card: id, name, kind, note and its Tg, Tm and 23 degC modulus with sources. */
export function summarize(f: Family): FamilySummary {
  return {
    id: f.params.id,
    name: f.params.name,
    kind: f.params.kind === 'semicrystalline' ? 'semi-crystalline' : f.params.kind,
    note: f.note,
    quantities: [
      quantity(f, 'Tg', 'Tg_C', 'Tg_low_C', 'Tg_high_C', 'degC'),
      quantity(f, 'Tm', 'Tm_C', 'Tm_low_C', 'Tm_high_C', 'degC'),
      f.params.filler === 'none' ? quantity(f, 'Modulus at 23 degC', 'E23_MPa', 'E23_low_MPa', 'E23_high_MPa', 'MPa') : gradeModulus(f),
    ],
  };
}

/**
 * Families and listed filled grades whose id, name or kind contains every word of the query (case-insensitive);
 * all for an empty query. A polyamide with a humidity clause ("PA66 at 70 % RH", "PA66-GF30 at 70 % RH") finds
 * that one derived family or grade, so its block can be written.
 */
export function searchFamilies(query: string): Family[] {
  const atHumidity = familyAtHumidity(query);
  if (atHumidity) return [atHumidity];
  const words = query
    .toLowerCase()
    .split(/[\s,]+/)
    .filter(Boolean);
  return familiesAndGrades().filter((f) => {
    const hay =
      `${f.params.id} ${f.params.name} ${f.params.kind} ${f.params.kind === 'semicrystalline' ? 'semi-crystalline' : ''} ${f.note}`.toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}

/** The family a query names with a humidity clause, or null (no clause, or one that does not resolve). */
function familyAtHumidity(query: string): Family | null {
  try {
    return splitHumidity(query).rhPct === null ? null : getGrade(query);
  } catch {
    // Half-typed or refused text: the ordinary word search answers (with no match), the pane stays quiet while typing.
    return null;
  }
}

/**
 * The parameter block exactly as =DERATE.PARAMS spills it: one definition (functions/core/block.ts)
 * serves the worksheet function, the pane's writes and every material argument that reads a block back.
 * Empty slots (fields the kind does not use) become '' here, the sheet port's empty cell.
 */
export { BLOCK_HEADER };

export type BlockRow = [string, string | number, string, string];

/** The whole block of a parameter record, header first, as written into the sheet. */
export function paramsBlockRows(p: MaterialParams): (string | number)[][] {
  return paramsBlock(p).map((row) =>
    row.map((c) => {
      if (c === null) return '';
      if (typeof c === 'string' || typeof c === 'number') return c;
      throw new Error(`the parameter block of '${p.id}' holds an error value: ${c.toString()}`);
    }),
  );
}

/** The block of a family, header first. */
export function blockRows(f: Family): (string | number)[][] {
  return paramsBlockRows(f.params);
}

/** The block of a family without its header row. */
export function parameterRows(f: Family): BlockRow[] {
  return blockRows(f)
    .slice(1)
    .map(([k = '', v = '', u = '', d = '']) => [String(k), v, String(u), String(d)]);
}

export function familyBlockPlan(f: Family): Plan {
  const rows = blockRows(f);
  return {
    label: `${f.params.id} parameters`,
    sheetBase: `${f.params.id} parameters`.slice(0, 25),
    rows: rows.length,
    cols: BLOCK_HEADER.length,
    build: (_sheet: string, _topLeft: Cell) => ({
      cells: rows.map((r): CellWrite[] => r.map((value) => ({ value }))),
      chart: null,
    }),
  };
}
