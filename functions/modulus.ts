/** Stiffness at one service condition: the relaxation modulus, the stress it leaves at a fixed strain, and the derating ratio. */
import { deratingRatio, modulusMPa } from '../src/index.js';
import { material } from './core/args/material.js';
import { strain } from './core/args/strain.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { defineScalar } from './core/define.js';

export const MODULUS = defineScalar({
  id: 'MODULUS',
  args: [material('material'), temperature('temperature'), time('time')],
  run: (m, TK, tS) => modulusMPa(m, tS, TK),
});

/**
 * Relaxation modulus E_r(t, T) in MPa: the stiffness left after the time under load at the temperature. Screening estimate; confirm with supplier data and creep tests.
 * @customfunction MODULUS
 * @param material Family symbol such as "PC" (DERATE.FAMILIES lists them), or a parameter block range from DERATE.PARAMS.
 * @param temperature Service temperature: a number in degC, or text with a unit such as "176 degF" or "350 K".
 * @param time Time under load: a number in hours (h), or text with a unit such as "1000 h" or "10 years".
 * @returns {number} Relaxation modulus, MPa.
 */
export function modulus(material: unknown[][], temperature: unknown, time: unknown) {
  return MODULUS.invoke(material, temperature, time);
}

export const STRESS = defineScalar({
  id: 'STRESS',
  args: [material('material'), strain('strain'), temperature('temperature'), time('time')],
  run: (m, eps, TK, tS) => eps * modulusMPa(m, tS, TK),
});

/**
 * Stress retained at a fixed strain after the time at the temperature, in MPa (strain times the relaxation modulus; linear viscoelastic, small strain). Screening estimate.
 * @customfunction STRESS
 * @param material Family symbol such as "PBT", or a parameter block range from DERATE.PARAMS.
 * @param strain Strain held constant: a fraction such as 0.01, or text such as "1 %" (up to 0.1).
 * @param temperature Service temperature: a number in degC, or text with a unit such as "140 degF".
 * @param time Time held: a number in hours (h), or text with a unit such as "5 years".
 * @returns {number} Retained stress, MPa.
 */
export function stress(material: unknown[][], strain: unknown, temperature: unknown, time: unknown) {
  return STRESS.invoke(material, strain, temperature, time);
}

export const RATIO = defineScalar({
  id: 'RATIO',
  args: [
    material('material'),
    temperature('temperature'),
    time('time'),
    temperature('ref_temperature', { optional: true, default: 23 }),
    time('ref_time', { optional: true, default: '1 h' }),
  ],
  run: (m, TK, tS, refK, refS) => deratingRatio(m, tS, TK, refK, refS),
});

/**
 * Derating factor: the relaxation modulus at the service temperature and time divided by the one at the reference condition (default 23 degC, 1 h). Dimensionless; screening estimate.
 * @customfunction RATIO
 * @param material Family symbol such as "PA66-cond", or a parameter block range from DERATE.PARAMS.
 * @param temperature Service temperature: a number in degC, or text with a unit such as "176 degF".
 * @param time Time under load: a number in hours (h), or text with a unit such as "1000 h".
 * @param [ref_temperature] Reference temperature, degC (or text with a unit); default 23 degC.
 * @param [ref_time] Reference time, hours (h) (or text with a unit); default "1 h".
 * @returns {number} Ratio of the two moduli (dimensionless).
 */
export function ratio(material: unknown[][], temperature: unknown, time: unknown, ref_temperature?: unknown, ref_time?: unknown) {
  return RATIO.invoke(material, temperature, time, ref_temperature, ref_time);
}
