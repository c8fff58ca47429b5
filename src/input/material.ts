/**
 * Materials as a user names them: a bundled family by symbol, a parameter block or Prony table read
 * from rows of cells (worksheet ranges, the pane's blocks), a parameter or Prony record (CLI JSON), and
 * the names of parameters to fit. Every problem is an InputError naming the input.
 */
import { InputError, ParameterError, UnknownFamilyError } from '../base/errors.js';
import type { Family } from '../material/families.js';
import { getGrade } from '../material/grade.js';
import { compileMaterial, type Material } from '../material/model.js';
import { NUMERIC_FIELDS, type MaterialParams, type NumericField } from '../material/params.js';
import { compilePronyMaterial, isPronyRecord, isPronyTable, pronyFromRecord, pronyFromTable } from '../material/pronymaterial.js';
import type { PronyMaterialSpec } from '../material/pronymaterial.js';
import { blankCommentRows, paramsFromBlockRows, paramsFromRecord, type BlockReadOptions } from '../material/resolve.js';
import { showRaw, type Quantity, type Raw, trimmed } from './quantity.js';

/**
 * A family symbol that is not bundled: the "not found" case (the worksheet answers #N/A). `problem`
 * ends with the closest symbols; each front-end may add where its list of symbols is.
 */
export class UnknownFamilyInput extends InputError {
  constructor(
    argument: string,
    problem: string,
    readonly suggestions: readonly string[],
  ) {
    super(argument, problem);
  }
}

export const FAMILY_WHAT = 'a family symbol such as "PC", "PA66-cond" or "PA66 at 70 % RH", or a filled grade such as "PBT-GF30"';

/**
 * A bundled family by its ISO 1043 symbol, or a filled grade `<family>-<filler code><mass %>` (grade.ts);
 * case and surrounding spaces do not matter.
 */
export const familyInput: Quantity<Family> = {
  what: FAMILY_WHAT,
  unit: 'symbol',
  parse(input, name) {
    const raw = trimmed(input);
    if (typeof raw !== 'string') throw new InputError(name, `expects ${FAMILY_WHAT}, got the number ${raw}`);
    try {
      return getGrade(raw);
    } catch (e) {
      // A humidity clause that does not read, or one given twice or to a material that takes up no water.
      if (e instanceof InputError) throw new InputError(name, e.problem);
      // A filler code that is not supported, or a mass percent outside its range: the words say which.
      if (e instanceof ParameterError) throw new InputError(name, e.problem);
      if (!(e instanceof UnknownFamilyError)) throw e;
      const near = e.suggestions.length > 0 ? `; did you mean ${e.suggestions.map((s) => `"${s}"`).join(', ')}?` : '';
      throw new UnknownFamilyInput(name, `unknown family ${showRaw(raw.trim())}${near}`, e.suggestions);
    }
  },
};

/** The material of a bundled family, by symbol; compiled. */
export function materialFromSymbol(raw: Raw, name: string): Material {
  return compileMaterial(familyInput.parse(raw, name).params);
}

/** Re-labels what the engine's material readers throw: the error names `name`, the words say where. */
function named<T>(name: string, prefix: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof UnknownFamilyInput) throw e;
    if (e instanceof InputError) {
      if (e.argument === name) throw new InputError(name, e.problem);
      // The Prony readers name themselves 'prony' (said by the prefix) or the record key at fault.
      throw new InputError(name, `${prefix}${e.argument === 'prony' ? '' : `${e.argument}: `}${e.problem}`);
    }
    if (e instanceof ParameterError) throw new InputError(name, `${prefix || 'parameter '}${e.field} ${e.problem}`);
    throw e;
  }
}

/**
 * A material from rows of cells: a Prony table (first cell "prony") or a parameter block (field, value
 * rows as DERATE.PARAMS spills them). Comment rows ('#...') are skipped; `options` lets a host refuse
 * its own cell values and say where a complete block is shown.
 */
export function materialFromRows(
  rows: readonly (readonly unknown[])[],
  name: string,
  options: Omit<BlockReadOptions, 'argument'> = {},
): Material {
  const cells = blankCommentRows(rows);
  if (isPronyTable(cells)) return named(name, 'Prony table: ', () => compilePronyMaterial(pronyFromTable(cells)));
  const params = named(name, '', () => paramsFromBlockRows(cells, { ...options, argument: name }));
  return named(name, '', () => compileMaterial(params));
}

/**
 * A material from a JSON value: a parameter record or a Prony record (as `params --json` and the fits
 * print them; a calibration or fit output holds it under "params" or "material"). Checked by compiling it.
 */
export function materialFromRecord(value: unknown, name: string): MaterialParams | PronyMaterialSpec {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new InputError(name, 'must hold one JSON object of parameters');
  }
  const outer = value as Record<string, unknown>;
  const inner = outer['params'] ?? outer['material'] ?? outer;
  if (typeof inner !== 'object' || inner === null || Array.isArray(inner)) {
    throw new InputError(name, 'must hold one JSON object of parameters');
  }
  const r = inner as Record<string, unknown>;
  if (isPronyRecord(r)) {
    const spec = named(name, 'Prony record: ', () => pronyFromRecord(r));
    named(name, 'Prony record: ', () => compilePronyMaterial(spec));
    return spec;
  }
  const params = named(name, '', () => paramsFromRecord(r));
  named(name, '', () => compileMaterial(params));
  return params;
}

const FIELD_BY_LOWER = new Map(NUMERIC_FIELDS.map((f) => [f.key.toLowerCase(), f.key]));

/** What to type for parameter names. */
export const FIELD_NAMES_WHAT = 'parameter names such as "tauTg_s" or "beta" (the field column of a parameter block), as "tauTg_s, beta"';

/** Parameter names separated by commas or semicolons (any case); an empty list is undefined (the automatic choice). */
export const fieldNamesInput: Quantity<NumericField[] | undefined> = {
  what: FIELD_NAMES_WHAT,
  unit: 'names',
  parse(input, name) {
    const raw = trimmed(input);
    if (typeof raw !== 'string') throw new InputError(name, `expects ${FIELD_NAMES_WHAT}, got ${String(raw)}`);
    const texts = raw
      .split(/[,;]/)
      .map((t) => t.trim())
      .filter((t) => t !== '');
    if (texts.length === 0) return undefined;
    return texts.map((t) => {
      const f = FIELD_BY_LOWER.get(t.toLowerCase());
      if (f === undefined) throw new InputError(name, `"${t}" is not a parameter name; expects ${FIELD_NAMES_WHAT}`);
      return f;
    });
  },
};
