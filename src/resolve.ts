/** Turning what a user gives (a family id or a parameter record) into a compiled material. */
import { ParameterError } from './errors.js';
import { getFamily } from './families.js';
import { compileMaterial, type Material } from './model.js';
import { KINDS, NUMERIC_FIELDS, TEXT_FIELDS, type Kind, type MaterialParams } from './params.js';
import { compilePronyMaterial, isPronySpec, isPronyTable, pronyFromTable, type PronyMaterialSpec } from './pronymaterial.js';
import { InputError } from './errors.js';
import { SHIFT_LAWS, type ShiftLaw } from './shift.js';

/** A family id (case-insensitive), a parameter record, or a Prony-series material. */
export type MaterialInput = string | MaterialParams | PronyMaterialSpec;

/** Compiles a family id, a parameter record or a Prony material into a material. */
export function resolveMaterial(input: MaterialInput): Material {
  if (typeof input === 'string') return compileMaterial(getFamily(input).params);
  if (isPronySpec(input)) return compilePronyMaterial(input);
  return compileMaterial(input);
}

const KNOWN_KEYS = new Set<string>([...TEXT_FIELDS, ...NUMERIC_FIELDS.map((f) => f.key)]);

/**
 * Builds a parameter record from loose key/value pairs (a worksheet block or JSON). Every key must be
 * known; numbers may come as numeric text; empty (null, undefined, '') leaves an optional field empty.
 */
export function paramsFromRecord(record: Readonly<Record<string, unknown>>): MaterialParams {
  for (const key of Object.keys(record)) {
    if (!KNOWN_KEYS.has(key)) throw new ParameterError(key, `is not a parameter name; known names are ${[...KNOWN_KEYS].join(', ')}`);
  }
  const text = (key: (typeof TEXT_FIELDS)[number], fallback?: string): string => {
    const v = record[key];
    if (v === undefined || v === null || v === '') {
      if (fallback !== undefined) return fallback;
      throw new ParameterError(key, 'is required');
    }
    if (typeof v !== 'string') throw new ParameterError(key, `must be text, got ${String(v)}`, v);
    return v.trim();
  };
  const kind = text('kind');
  if (!KINDS.includes(kind as Kind)) throw new ParameterError('kind', `must be one of ${KINDS.join(', ')}, got '${kind}'`, kind);
  const shiftLaw = text('shiftLaw', 'hybrid');
  if (!SHIFT_LAWS.includes(shiftLaw as ShiftLaw)) {
    throw new ParameterError('shiftLaw', `must be one of ${SHIFT_LAWS.join(', ')}, got '${shiftLaw}'`, shiftLaw);
  }
  const id = text('id', 'custom');
  const out: Record<string, unknown> = { id, name: text('name', id), kind, shiftLaw };
  for (const f of NUMERIC_FIELDS) {
    const v = record[f.key];
    if (v === undefined || v === null || v === '') {
      out[f.key] = null;
      continue;
    }
    const n = typeof v === 'number' ? v : typeof v === 'string' && v.trim() !== '' ? Number(v.trim()) : NaN;
    if (!Number.isFinite(n)) throw new ParameterError(f.key, `must be a number in ${f.unit}, got '${String(v)}'`, v);
    out[f.key] = n;
  }
  const p = out as unknown as MaterialParams;
  // Fields a kind does not use may be left empty; fill them with neutral values so the record is complete.
  for (const f of NUMERIC_FIELDS) {
    if (p[f.key] === null && !f.optional && !f.kinds.includes(p.kind)) (p as unknown as Record<string, number>)[f.key] = f.min;
  }
  return p;
}

/** The record as plain key/value pairs in block order (empty fields as null). */
export function paramsToRecord(p: MaterialParams): Record<string, string | number | null> {
  const out: Record<string, string | number | null> = {};
  for (const k of TEXT_FIELDS) out[k] = p[k];
  for (const f of NUMERIC_FIELDS) out[f.key] = p[f.key];
  return out;
}

/**
 * A material from a worksheet range (rows of cells): a Prony table (first cell 'prony', see
 * pronymaterial.ts) or a parameter block of key / value rows (paramsToRecord order or any order).
 * Wholly empty rows are skipped; a row that is not a key and a value is an error naming the row.
 */
export function materialInputFromRange(rows: readonly (readonly unknown[])[]): MaterialInput {
  if (isPronyTable(rows)) return pronyFromTable(rows);
  const record: Record<string, unknown> = {};
  rows.forEach((r, i) => {
    const cells = r.map((c) => (typeof c === 'string' ? c.trim() : c));
    if (cells.every((c) => c === null || c === undefined || c === '')) return;
    const [key, value, ...extra] = cells;
    if (typeof key !== 'string' || key === '' || extra.some((c) => !(c === null || c === undefined || c === ''))) {
      throw new InputError('material', `row ${i + 1} of the parameter block must be a name and a value`);
    }
    if (key in record) throw new InputError('material', `row ${i + 1}: '${key}' appears twice in the parameter block`);
    record[key] = value;
  });
  return paramsFromRecord(record);
}
