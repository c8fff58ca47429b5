/** The time-temperature shift of a material and the apparent Tg at a time scale. */
import { apparentTg, kelvinToC, materialShiftLog10, TEMP_SEARCH_K } from '../src/index.js';
import { material } from './core/args/material.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { SheetError } from './core/cells.js';
import { defineScalar } from './core/define.js';

export const SHIFT = defineScalar({
  id: 'SHIFT',
  args: [material('material'), temperature('temperature')],
  run: (m, TK) => materialShiftLog10(m, TK),
});

/**
 * log10 of the shift factor a_T at the temperature, relative to the material's Tg (WLF above Tg, Arrhenius below for the hybrid law). Negative above Tg: the clock runs faster. Screening estimate.
 * @customfunction SHIFT
 * @param material Family symbol such as "PS", or a parameter block range from DERATE.PARAMS.
 * @param temperature Temperature: a number in degC, or text with a unit such as "392 K".
 * @returns {number} log10 a_T (dimensionless).
 */
export function shift(material: unknown[][], temperature: unknown) {
  return SHIFT.invoke(material, temperature);
}

export const TGAT = defineScalar({
  id: 'TGAT',
  args: [material('material'), time('time')],
  run: (m, tS) => {
    const a = apparentTg(m, tS);
    if (a.valueK === null) {
      const edge = kelvinToC(TEMP_SEARCH_K[a.status === 'above-range' ? 1 : 0]);
      return new SheetError(
        '#N/A',
        `outside the model's range: the apparent Tg of ${m.params.id} at ${tS} s is ${a.status === 'above-range' ? 'above' : 'below'} ${edge} degC`,
      );
    }
    return kelvinToC(a.valueK);
  },
});

/**
 * Apparent glass transition temperature at a time scale, in degC: where the glass-transition relaxation time equals the time given. Longer loading moves it down. Screening estimate.
 * @customfunction TGAT
 * @param material Family symbol such as "PC", or a parameter block range from DERATE.PARAMS.
 * @param time Time scale: a number in hours (h), or text with a unit such as "10 s" or "1000 h".
 * @returns {number} Apparent Tg, degC.
 */
export function tgat(material: unknown[][], time: unknown) {
  return TGAT.invoke(material, time);
}
