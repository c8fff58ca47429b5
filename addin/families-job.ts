/** The "look up a family" job: searching the bundled table and the parameter block written for a family. */
import { FAMILIES, NUMERIC_FIELDS, paramsToRecord, type Family, type NumericField } from '../src/index.js';
import { qualified, type Cell } from './a1.js';
import type { CellWrite } from './port.js';
import type { Plan } from './writer.js';

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
  const p = f.params;
  const v = p[key];
  if (v === null) return { label, text: '-', source: 'not used for this kind' };
  const lo = p[low];
  const hi = p[high];
  const range = lo !== null && hi !== null && (lo !== v || hi !== v) ? ` (${lo} to ${hi})` : '';
  return { label, text: `${v} ${unit}${range}`, source: f.sources[key] ?? 'no source recorded' };
}

export function summarize(f: Family): FamilySummary {
  return {
    id: f.params.id,
    name: f.params.name,
    kind: f.params.kind === 'semicrystalline' ? 'semi-crystalline' : f.params.kind,
    note: f.note,
    quantities: [
      quantity(f, 'Tg', 'Tg_C', 'Tg_low_C', 'Tg_high_C', 'degC'),
      quantity(f, 'Tm', 'Tm_C', 'Tm_low_C', 'Tm_high_C', 'degC'),
      quantity(f, 'Modulus at 23 degC', 'E23_MPa', 'E23_low_MPa', 'E23_high_MPa', 'MPa'),
    ],
  };
}

/** Families whose id, name or kind contains every word of the query (case-insensitive); all for an empty query. */
export function searchFamilies(query: string): Family[] {
  const words = query
    .toLowerCase()
    .split(/[\s,]+/)
    .filter(Boolean);
  return FAMILIES.filter((f) => {
    const hay =
      `${f.params.id} ${f.params.name} ${f.params.kind} ${f.params.kind === 'semicrystalline' ? 'semi-crystalline' : ''} ${f.note}`.toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}

/** Field/value rows of a family, the block =DERATE.PARAMS(id) spills and every material argument accepts. */
export function parameterRows(f: Family): [string, string | number][] {
  return Object.entries(paramsToRecord(f.params)).map(([k, v]) => [k, v ?? '']);
}

/** Units of the numeric fields, for the pane's hint beside the block. */
export const FIELD_UNITS: ReadonlyMap<string, string> = new Map(NUMERIC_FIELDS.map((s) => [s.key, s.unit]));

export function familyBlockPlan(f: Family): Plan {
  const rows = parameterRows(f);
  return {
    label: `${f.params.id} parameters`,
    sheetBase: `${f.params.id} parameters`.slice(0, 25),
    rows: rows.length,
    cols: 2,
    build: (_sheet: string, _topLeft: Cell) => ({
      cells: rows.map(([k, v]): CellWrite[] => [{ value: k }, { value: v }]),
      chart: null,
    }),
  };
}

/** The reference a formula uses for a block written at topLeft. */
export function blockReference(sheet: string, topLeft: Cell, rows: number): string {
  return qualified(sheet, { top: topLeft.row, left: topLeft.col, bottom: topLeft.row + rows - 1, right: topLeft.col + 1 });
}
