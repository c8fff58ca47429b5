/** Turning what a user gives (a family id or a parameter record) into a compiled material. */
import { InputError, ParameterError } from '../base/errors.js';
import { editDistance } from './families.js';
import { getGrade } from './grade.js';
import { compileMaterial, type Material } from './model.js';
import { FILLER_VALUES, KINDS, NUMERIC_FIELDS, TEXT_FIELDS, type Kind, type MaterialParams } from './params.js';
import { fillerList, NO_FILLER, type FillerField } from './filler.js';
import { compilePronyMaterial, isPronySpec, isPronyTable, pronyFromTable, type PronyMaterialSpec } from './pronymaterial.js';
import { SHIFT_LAWS, type ShiftLaw } from './shift.js';

/** A family id or filled grade (case-insensitive), a parameter record, or a Prony-series material. */
export type MaterialInput = string | MaterialParams | PronyMaterialSpec;

/** Compiles a family id, a parameter record or a Prony material into a material. */
export function resolveMaterial(input: MaterialInput): Material {
  if (typeof input === 'string') return compileMaterial(getGrade(input).params);
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
  // Codes in any case; empty is unfilled, so blocks written before fillers existed keep working.
  const fillerText = text('filler', NO_FILLER);
  const filler = fillerText.toLowerCase() === NO_FILLER ? NO_FILLER : fillerText.toUpperCase();
  if (!FILLER_VALUES.includes(filler as FillerField)) {
    throw new ParameterError(
      'filler',
      `must be ${NO_FILLER} or one of the ISO 1043-2 codes ${fillerList()}, got '${fillerText}'`,
      fillerText,
    );
  }
  const id = text('id', 'custom');
  const out: Record<string, unknown> = { id, name: text('name', id), kind, shiftLaw, filler };
  for (const f of NUMERIC_FIELDS) {
    const v = record[f.key];
    if (v === undefined || v === null || v === '') {
      out[f.key] = f.neutral ?? null;
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

/** True for an empty cell as hosts pass it: null, undefined or blank text. */
function isBlankCell(c: unknown): boolean {
  return c === null || c === undefined || (typeof c === 'string' && c.trim() === '');
}

/**
 * True for a comment row: its first cell is text starting with '#'. The fitting functions and the task
 * pane write fit quality, notes and cautions in such rows below a block or Prony table; reading the
 * range back as a material skips them, so the whole spill can be passed on.
 */
export function isCommentRow(row: readonly unknown[]): boolean {
  const first = row[0];
  return typeof first === 'string' && first.trim().startsWith('#');
}

/** The range with comment rows blanked (kept in place, so row numbers in messages stay the user's). */
export function blankCommentRows(rows: readonly (readonly unknown[])[]): unknown[][] {
  return rows.map((r) => (isCommentRow(r) ? r.map(() => null) : [...r]));
}

/** How a host reads a parameter block from its cells (see paramsFromBlockRows). */
export interface BlockReadOptions {
  /** The input named in errors (a worksheet argument, a range address); default 'material'. */
  readonly argument?: string;
  /**
   * Called for each field-name cell (where = 'row N: ') and each value cell (where = 'field F: ') before
   * the cell is read, so that a host can refuse its own values (a worksheet error arriving as input).
   */
  readonly checkCell?: (cell: unknown, where: string) => void;
  /** Appended, in parentheses, to the message for a name that is not a parameter (where to find a complete block). */
  readonly hint?: string;
}

const KEY_BY_LOWER = new Map([...KNOWN_KEYS].map((k) => [k.toLowerCase(), k]));

/** Up to three parameter names close to a mistyped one. */
function closestKeys(typed: string): string[] {
  const k = typed.toLowerCase();
  return [...KNOWN_KEYS]
    .map((f) => ({ f, d: editDistance(k, f.toLowerCase()) }))
    .filter((x) => x.d <= Math.max(2, Math.floor(k.length / 3)))
    .sort((a, b) => a.d - b.d)
    .slice(0, 3)
    .map((x) => x.f);
}

/**
 * Parameters from a parameter block read back from cells, as DERATE.PARAMS spills it: field names (any
 * case) in the first column, values in the second, further columns (unit, description) ignored, an
 * optional 'field' header row, comment rows ('#...') and empty rows skipped. Layout problems throw
 * InputError naming the argument and the row (row numbers are the range's own); values are checked by
 * paramsFromRecord (ParameterError).
 */
export function paramsFromBlockRows(rows: readonly (readonly unknown[])[], options: BlockReadOptions = {}): MaterialParams {
  const argument = options.argument ?? 'material';
  const fail = (problem: string): never => {
    throw new InputError(argument, problem);
  };
  const record: Record<string, unknown> = {};
  rows.forEach((row, i) => {
    if (isCommentRow(row)) return;
    const key = row[0];
    if (isBlankCell(key)) {
      if (row.slice(1).some((c) => !isBlankCell(c))) fail(`row ${i + 1} of the parameter block has a value but no field name`);
      return;
    }
    options.checkCell?.(key, `row ${i + 1}: `);
    if (typeof key !== 'string') return fail(`row ${i + 1}: the first column must hold field names, got ${String(key)}`);
    const typed = key.trim();
    if (i === 0 && typed.toLowerCase() === 'field') return;
    const field = KEY_BY_LOWER.get(typed.toLowerCase());
    if (field === undefined) {
      const near = closestKeys(typed);
      const hint = near.length > 0 ? `; did you mean ${near.map((f) => `"${f}"`).join(', ')}?` : '';
      return fail(`row ${i + 1}: "${typed}" is not a parameter name${hint}${options.hint ? ` (${options.hint})` : ''}`);
    }
    if (field in record) fail(`row ${i + 1}: the field "${field}" appears twice`);
    const value = row[1];
    options.checkCell?.(value, `field ${field}: `);
    if (typeof value === 'boolean') fail(`field ${field}: expects a number or text, got ${value ? 'TRUE' : 'FALSE'}`);
    record[field] = isBlankCell(value) ? null : value;
  });
  return paramsFromRecord(record);
}

/**
 * A material from a worksheet range (rows of cells, comment rows skipped): a Prony table (first cell
 * 'prony', see pronymaterial.ts) or a parameter block of name / value rows, read by paramsFromBlockRows; here a row
 * may hold only the name and the value (no unit or description columns).
 */
export function materialInputFromRange(rows: readonly (readonly unknown[])[], options: BlockReadOptions = {}): MaterialInput {
  const cells = blankCommentRows(rows);
  if (isPronyTable(cells)) return pronyFromTable(cells);
  cells.forEach((r, i) => {
    if (r.slice(2).some((c) => !isBlankCell(c))) {
      throw new InputError(options.argument ?? 'material', `row ${i + 1} of the parameter block must be a name and a value`);
    }
  });
  return paramsFromBlockRows(cells, options);
}
