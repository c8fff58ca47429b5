/** The bundled family table and the editable parameter block of one family. */
import { displayedParams, FAMILIES } from '../src/index.js';
import { family } from './core/args/material.js';
import { BLOCK_COLUMNS, BLOCK_ROWS, paramsBlock } from './core/block.js';
import type { OutCell } from './core/cells.js';
import { defineMatrix } from './core/define.js';

const FAMILY_HEADER = [
  'symbol',
  'name',
  'kind',
  'Tg degC',
  'Tm degC',
  'E 23 degC MPa',
  'Eg MPa',
  'source of Tg',
  'source of Tm',
  'source of the modulus',
  'note',
] as const;

export const FAMILIES_DEF = defineMatrix({
  id: 'FAMILIES',
  args: [],
  spillSize: () => [FAMILIES.length + 1, FAMILY_HEADER.length],
  run: () => {
    const rows: OutCell[][] = [[...FAMILY_HEADER]];
    for (const f of FAMILIES) {
      // A conditioned polyamide lists its wet Tg and modulus; its PARAMS block keeps the dry ones and the humidity.
      const p = displayedParams(f.params);
      const s = f.sources;
      rows.push([
        p.id,
        p.name,
        p.kind,
        p.Tg_C,
        p.Tm_C,
        p.E23_MPa,
        p.Eg_MPa,
        s.Tg_C ?? null,
        p.Tm_C === null ? null : (s.Tm_C ?? null),
        (p.E23_MPa === null ? s.Eg_MPa : s.E23_MPa) ?? null,
        f.note === '' ? null : f.note,
      ]);
    }
    return rows;
  },
});

/**
 * Spills the bundled polymer families with a header row: symbol, name, kind, Tg (degC), Tm (degC), typical modulus at 23 degC (MPa), glassy modulus (MPa) where no 23 degC value is given, and the source of each number.
 * @customfunction FAMILIES
 * @returns {any[][]} Table of families, one per row.
 */
export function families() {
  return FAMILIES_DEF.invoke();
}

export const PARAMS = defineMatrix({
  id: 'PARAMS',
  args: [family('family')],
  spillSize: () => [BLOCK_ROWS, BLOCK_COLUMNS],
  run: (f) => paramsBlock(f.params),
});

/**
 * Spills the model parameters of a family as a labelled block (field, value, unit, description). Copy it, paste values, edit them, and pass the range as the material of any DERATE function.
 * @customfunction PARAMS
 * @param family Family symbol such as "PC" or "PA66-cond", or a polyamide at a humidity such as "PA66 at 70 % RH" (text; DERATE.FAMILIES lists them).
 * @returns {any[][]} Block of field, value, unit and description rows, with a header row.
 */
export function params(family: unknown) {
  return PARAMS.invoke(family);
}
