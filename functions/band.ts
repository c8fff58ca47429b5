/** The low / central / high band of an estimate and its region. */
import { bandEstimate } from '../src/index.js';
import { material } from './core/args/material.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { defineMatrix } from './core/define.js';

export const BAND = defineMatrix({
  id: 'BAND',
  args: [material('material'), temperature('temperature'), time('time')],
  spillSize: () => [1, 4],
  run: (m, TK, tS) => {
    const b = bandEstimate(m, tS, TK);
    return [[b.lowMPa, b.centralMPa, b.highMPa, b.region]];
  },
});

/**
 * Spills one row: low, central and high relaxation modulus in MPa (from the family's Tg, Tm and modulus ranges) and the region name (glassy, transition, rubbery, flow, crystalline, melting). Screening estimate.
 * @customfunction BAND
 * @param material Family symbol such as "PBT", or a parameter block range from DERATE.PARAMS.
 * @param temperature Service temperature: a number in degC, or text with a unit such as "176 degF".
 * @param time Time under load: a number in hours (h), or text with a unit such as "1000 h".
 * @returns {any[][]} One row: low MPa, central MPa, high MPa, region.
 */
export function band(material: unknown[][], temperature: unknown, time: unknown) {
  return BAND.invoke(material, temperature, time);
}
