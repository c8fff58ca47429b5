/**
 * The parameter block: the labelled, editable layout that DERATE.PARAMS spills and that every
 * `material` argument accepts back as a range. One definition for both directions.
 */
import { ALL_KEYS, KINDS, NUMERIC_FIELDS, type FieldSpec, type Kind, type MaterialParams } from '../../src/material/params.js';
import { paramsToRecord } from '../../src/material/resolve.js';
import { SHIFT_LAWS } from '../../src/material/shift.js';
import { FILLER_CODES } from '../../src/material/filler.js';
import type { OutCell } from './cells.js';

/** Header row of the block; a range passed back may include it or leave it out. */
export const BLOCK_HEADER = ['field', 'value', 'unit', 'description'] as const;

const TEXT_FIELD_INFO: Record<string, { unit: string; description: string }> = {
  id: { unit: 'text', description: 'short name of the material, shown in results' },
  name: { unit: 'text', description: 'full name of the material' },
  kind: { unit: 'text', description: `one of ${KINDS.join(', ')}` },
  shiftLaw: { unit: 'text', description: `time-temperature shift law: ${SHIFT_LAWS.join(', ')} (hybrid = Arrhenius below Tg, WLF above)` },
  filler: { unit: 'text', description: `none, or an ISO 1043-2 filler code: ${FILLER_CODES.join(', ')}` },
};

const FIELD_BY_KEY = new Map<string, FieldSpec>(NUMERIC_FIELDS.map((f) => [f.key, f]));

/** Field names a block may hold, in block order. */
export const BLOCK_FIELDS: readonly string[] = ALL_KEYS;

function isUsedBy(f: FieldSpec, kind: Kind): boolean {
  return f.kinds.includes(kind);
}

/** The block of one material: header, then one row per field (unused fields left empty). */
export function paramsBlock(p: MaterialParams): OutCell[][] {
  const record = paramsToRecord(p);
  const rows: OutCell[][] = [[...BLOCK_HEADER]];
  for (const key of BLOCK_FIELDS) {
    const text = TEXT_FIELD_INFO[key];
    if (text) {
      rows.push([key, record[key] ?? null, text.unit, text.description]);
      continue;
    }
    const f = FIELD_BY_KEY.get(key);
    if (!f) continue;
    const used = isUsedBy(f, p.kind);
    const value = used ? (record[key] ?? null) : null;
    const description = used ? f.description : `${f.description} (not used by a ${p.kind} material; leave empty)`;
    rows.push([key, value, f.unit, description]);
  }
  return rows;
}

/** Rows in a block, header included: the size PARAMS spills for every family. */
export const BLOCK_ROWS = 1 + BLOCK_FIELDS.length;
export const BLOCK_COLUMNS = BLOCK_HEADER.length;
