/** Parameter names to fit: cells of a row or column, or one comma-separated text; each read by the input layer. */
import { fieldNamesInput, type NumericField } from '../../../src/index.js';
import { isEmpty, isMatrix, SheetError } from '../cells.js';
import { carried, fromInput, problem, scalarOf, type ArgSpec } from './spec.js';

const FIELDS_WHAT = 'parameter names such as "tauTg_s" or "beta" (the field column of DERATE.PARAMS), in cells or as "tauTg_s, beta"';

/** Optional parameter names to fit instead of the automatic choice; undefined when none is given. */
export function fields(name: string): ArgSpec<NumericField[] | undefined> {
  const parse = (raw: unknown): NumericField[] | undefined => {
    const out: NumericField[] = [];
    const take = (c: unknown, where: string): void => {
      if (c instanceof SheetError) throw carried(name, c, where);
      if (isEmpty(c)) return;
      if (typeof c !== 'string')
        throw problem(name, `${where}expects ${FIELDS_WHAT}, got ${typeof c === 'boolean' ? (c ? 'TRUE' : 'FALSE') : String(c)}`);
      out.push(...(fromInput(() => fieldNamesInput.parse(c, name)) ?? []));
    };
    if (isMatrix(raw) && !(raw.length === 1 && raw[0]?.length === 1)) {
      const cols = (raw[0] ?? []).length;
      if (raw.length > 1 && cols > 1)
        throw problem(name, `expects ${FIELDS_WHAT} in one row or one column, got a range of ${raw.length} x ${cols} cells`);
      raw.flat().forEach((c, i) => take(c, `cell ${i + 1}: `));
    } else {
      const v = scalarOf(raw, name, FIELDS_WHAT);
      if (v === null) return undefined;
      take(v, '');
    }
    return out.length === 0 ? undefined : out;
  };
  return { name, kind: 'fields', unit: 'names', shape: 'matrix', optional: true, parse };
}
