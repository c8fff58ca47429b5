/** Duty cycles: the equivalent time of a repeated temperature history and the modulus after it. */
import { checkHistory, equivalentTimeS, modulusAfterHistory, pairSegments, SECONDS_PER_HOUR, type Segment } from '../src/index.js';
import { cycles } from './core/args/count.js';
import { material } from './core/args/material.js';
import { durations, temperatures } from './core/args/ranges.js';
import { fromInput } from './core/args/spec.js';
import { optionalTemperature } from './core/args/temperature.js';
import { defineScalar } from './core/define.js';

/** The segments of a history repeated n times, checked by the input layer (same lengths, whole history in the model's time range). */
function segmentsOf(temperaturesK: readonly number[], durationsS: readonly number[], n: number): Segment[] {
  return fromInput(() => {
    const segments = pairSegments(temperaturesK, durationsS, 'durations');
    checkHistory(segments, n, { cycles: 'cycles', durations: 'durations' });
    return segments;
  });
}

export const EQTIME = defineScalar({
  id: 'EQTIME',
  args: [
    material('material'),
    temperatures('temperatures'),
    durations('durations'),
    optionalTemperature('ref_temperature'),
    cycles('cycles', { optional: true, default: 1 }),
  ],
  run: (m, TK, dt, refK, n) => {
    const segments = segmentsOf(TK, dt, n);
    return equivalentTimeS(m, segments, refK, n) / SECONDS_PER_HOUR;
  },
});

/**
 * Equivalent time, in hours, at the reference temperature of a temperature history repeated a number of times: the sum of each duration divided by its shift factor (time-temperature superposition). Screening estimate.
 * @customfunction EQTIME
 * @param material Family symbol such as "PBT", or a parameter block range from DERATE.PARAMS; the shift law depends on it.
 * @param temperatures Temperatures of the cycle's segments, degC (numbers, or text with units), in one row or column.
 * @param durations Duration of each segment, hours (h) (numbers, or text such as "8 h"), in one row or column of the same length.
 * @param [ref_temperature] Reference temperature, degC (or text with a unit); default the highest temperature of the cycle.
 * @param [cycles] How many times the cycle repeats (count); default 1.
 * @returns {number} Equivalent time at the reference temperature, hours (h).
 */
export function eqtime(
  material: unknown[][],
  temperatures: unknown[][],
  durations: unknown[][],
  ref_temperature?: unknown,
  cycles?: unknown,
) {
  return EQTIME.invoke(material, temperatures, durations, ref_temperature, cycles);
}

export const DUTY = defineScalar({
  id: 'DUTY',
  args: [
    material('material'),
    temperatures('temperatures'),
    durations('durations'),
    cycles('cycles', { optional: true, default: 1 }),
    optionalTemperature('at_temperature'),
  ],
  run: (m, TK, dt, n, atK) => {
    const segments = segmentsOf(TK, dt, n);
    return modulusAfterHistory(m, segments, n, atK).modulusMPa;
  },
});

/**
 * Relaxation modulus, in MPa, after a temperature history repeated a number of times, read at one temperature (default the hottest of the cycle, the worst case). Screening estimate.
 * @customfunction DUTY
 * @param material Family symbol such as "PBT", or a parameter block range from DERATE.PARAMS.
 * @param temperatures Temperatures of the cycle's segments, degC (numbers, or text with units), in one row or column.
 * @param durations Duration of each segment, hours (h) (numbers, or text such as "16 h"), in one row or column of the same length.
 * @param [cycles] How many times the cycle repeats (count); default 1.
 * @param [at_temperature] Temperature at which the modulus is read, degC (or text with a unit); default the highest temperature of the cycle.
 * @returns {number} Relaxation modulus after the history, MPa.
 */
export function duty(material: unknown[][], temperatures: unknown[][], durations: unknown[][], cycles?: unknown, at_temperature?: unknown) {
  return DUTY.invoke(material, temperatures, durations, cycles, at_temperature);
}
