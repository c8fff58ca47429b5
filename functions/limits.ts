/** Inverse answers: the highest temperature and the longest time for which a required stiffness holds. */
import { kelvinToC, maxTemperatureK, maxTimeS, SECONDS_PER_HOUR, SECONDS_PER_YEAR, TEMP_SEARCH_K, TIME_SEARCH_S } from '../src/index.js';
import { material } from './core/args/material.js';
import { modulus } from './core/args/modulus.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { SheetError } from './core/cells.js';
import { defineScalar } from './core/define.js';

const T_LOW_C = kelvinToC(TEMP_SEARCH_K[0]);
const T_HIGH_C = kelvinToC(TEMP_SEARCH_K[1]);
const YEARS_MAX = TIME_SEARCH_S[1] / SECONDS_PER_YEAR;

export const MAXTEMP = defineScalar({
  id: 'MAXTEMP',
  args: [material('material'), modulus('required_modulus'), time('time')],
  run: (m, req, tS) => {
    const a = maxTemperatureK(m, req, tS);
    if (a.status === 'above-throughout') {
      return new SheetError(
        '#N/A',
        `not limiting: ${m.params.id} stays above ${req} MPa up to ${T_HIGH_C} degC, the top of the model's range`,
      );
    }
    if (a.status === 'below-between' && a.below !== null) {
      const [from, to] = a.below.map((K) => Number(kelvinToC(K).toPrecision(4)));
      const cold = a.value === null ? '' : `below ${from} degC and `;
      return new SheetError(
        '#N/A',
        `below ${req} MPa from ${from} to ${to} degC: ${m.params.id} is stiff enough only ${cold}above ${to} degC (its network stiffens as it warms)`,
      );
    }
    if (a.status === 'below-throughout' || a.value === null) {
      return new SheetError('#N/A', `never reached: ${m.params.id} is below ${req} MPa at every temperature down to ${T_LOW_C} degC`);
    }
    return kelvinToC(a.value);
  },
});

/**
 * Highest temperature, in degC, at which the relaxation modulus stays at or above the required modulus for the whole time. #N/A with a message outside -150 to 500 degC. Screening estimate.
 * @customfunction MAXTEMP
 * @param material Family symbol such as "POM", or a parameter block range from DERATE.PARAMS.
 * @param required_modulus Required stiffness: a number in MPa, or text with a unit such as "0.8 GPa".
 * @param time Time under load: a number in hours (h), or text with a unit such as "10 years".
 * @returns {number} Temperature limit, degC.
 */
export function maxtemp(material: unknown[][], required_modulus: unknown, time: unknown) {
  return MAXTEMP.invoke(material, required_modulus, time);
}

export const MAXTIME = defineScalar({
  id: 'MAXTIME',
  args: [material('material'), modulus('required_modulus'), temperature('temperature')],
  run: (m, req, TK) => {
    const a = maxTimeS(m, req, TK);
    if (a.status === 'above-throughout') {
      return new SheetError('#N/A', `beyond ${YEARS_MAX} years: ${m.params.id} stays above ${req} MPa for the whole range of the model`);
    }
    if (a.status === 'below-throughout' || a.value === null) {
      return new SheetError('#N/A', `never reached: ${m.params.id} is below ${req} MPa already after 1 ms at this temperature`);
    }
    return a.value / SECONDS_PER_HOUR;
  },
});

/**
 * Longest time, in hours, for which the relaxation modulus stays at or above the required modulus at the temperature. #N/A with a message beyond 100 years or when never reached. Screening estimate.
 * @customfunction MAXTIME
 * @param material Family symbol such as "PA66-cond", or a parameter block range from DERATE.PARAMS.
 * @param required_modulus Required stiffness: a number in MPa, or text with a unit such as "1.2 GPa".
 * @param temperature Service temperature: a number in degC, or text with a unit such as "176 degF".
 * @returns {number} Time limit, hours (h).
 */
export function maxtime(material: unknown[][], required_modulus: unknown, temperature: unknown) {
  return MAXTIME.invoke(material, required_modulus, temperature);
}
