/** The "look up a family" job: searching the bundled table and the parameter block written for a family. */
import { FAMILIES, KINDS, NUMERIC_FIELDS, paramsToRecord, SHIFT_LAWS, TEXT_FIELDS, type Family, type NumericField } from '../src/index.js';
import type { Cell } from './a1.js';
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

/**
 * The block of a family as =DERATE.PARAMS(id) spills it (the layout of functions/core/block.ts on the
 * functions branch): a header row, then field, value, unit and description per field, with the fields
 * the kind does not use left empty. Every material argument reads it back (header optional, field names
 * in the first column, values in the second, further columns ignored).
 */
export const BLOCK_HEADER = ['field', 'value', 'unit', 'description'] as const;

const TEXT_FIELD_INFO: Record<(typeof TEXT_FIELDS)[number], { unit: string; description: string }> = {
  id: { unit: 'text', description: 'short name of the material, shown in results' },
  name: { unit: 'text', description: 'full name of the material' },
  kind: { unit: 'text', description: `one of ${KINDS.join(', ')}` },
  shiftLaw: { unit: 'text', description: `time-temperature shift law: ${SHIFT_LAWS.join(', ')} (hybrid = Arrhenius below Tg, WLF above)` },
};

export type BlockRow = [string, string | number, string, string];

export function parameterRows(f: Family): BlockRow[] {
  const p = f.params;
  const record = paramsToRecord(p);
  const rows: BlockRow[] = TEXT_FIELDS.map((k) => [k, record[k] ?? '', TEXT_FIELD_INFO[k].unit, TEXT_FIELD_INFO[k].description]);
  for (const spec of NUMERIC_FIELDS) {
    const used = spec.kinds.includes(p.kind);
    rows.push([
      spec.key,
      used ? (record[spec.key] ?? '') : '',
      spec.unit,
      used ? spec.description : `${spec.description} (not used by a ${p.kind} material; leave empty)`,
    ]);
  }
  return rows;
}

/** The whole block, header first, as written into the sheet. */
export function blockRows(f: Family): (string | number)[][] {
  return [[...BLOCK_HEADER], ...parameterRows(f)];
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
