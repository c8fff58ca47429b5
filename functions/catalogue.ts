/** The bundled family table and the editable parameter block of one family. */
import { displayedParams, familiesAndGrades, GRADE_MODULUS_SOURCE, listedModulusMPa } from '../src/index.js';
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
  spillSize: () => [familiesAndGrades().length + 1, FAMILY_HEADER.length],
  run: () => {
    const rows: OutCell[][] = [[...FAMILY_HEADER]];
    for (const f of familiesAndGrades()) {
      // A humid polyamide lists its wet Tg and modulus; its PARAMS block keeps the dry ones and the humidity.
      const p = displayedParams(f.params);
      const s = f.sources;
      const filled = p.filler !== 'none';
      rows.push([
        p.id,
        p.name,
        p.kind,
        p.Tg_C,
        p.Tm_C,
        filled ? listedModulusMPa(f) : p.E23_MPa,
        p.Eg_MPa,
        s.Tg_C ?? null,
        p.Tm_C === null ? null : (s.Tm_C ?? null),
        filled ? GRADE_MODULUS_SOURCE : ((p.E23_MPa === null ? s.Eg_MPa : s.E23_MPa) ?? null),
        f.note === '' ? null : f.note,
      ]);
    }
    return rows;
  },
});

/**
 * Spills the bundled families, then common filled grades (PBT-GF30...): symbol, name, kind, Tg and Tm (degC), modulus at 23 degC (MPa; filled: estimated along flow), glassy modulus (MPa), sources.
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
 * @param family Family symbol such as "PC" or "PA66-cond", a polyamide at a humidity such as "PA66 at 70 % RH", or a filled grade such as "PBT-GF30" (text; DERATE.FAMILIES lists them).
 * @returns {any[][]} Block of field, value, unit and description rows, with a header row.
 */
export function params(family: unknown) {
  return PARAMS.invoke(family);
}
