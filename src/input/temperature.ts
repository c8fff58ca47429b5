/** Temperatures: a bare number is degC, text may carry a unit ("176 degF", "350 K"); parsed to kelvin. */
import { InputError } from '../base/errors.js';
import { KELVIN_OFFSET, kelvinToC, parseTemperatureK } from '../base/units.js';
import { TEMP_SEARCH_K } from '../answers/inverse.js';
import { refuseOverflow, showRaw, type Quantity, type Raw, trimmed } from './quantity.js';

/**
 * The model's temperature range, degC: where the inverse solvers search (answers/inverse.ts), read from
 * there so that an input is accepted exactly where an answer can be found.
 */
export const TEMPERATURE_RANGE_C: readonly [number, number] = [kelvinToC(TEMP_SEARCH_K[0]), kelvinToC(TEMP_SEARCH_K[1])];

const WHAT = 'a temperature (a number in degC, or text such as "176 degF" or "350 K")';

/** A temperature between `minC` and `maxC` (degC, inclusive), with the words of the out-of-range message. */
function temperatureWithin(minC: number, maxC: number, outside: (raw: Raw) => string): Quantity<number> {
  return {
    what: WHAT,
    unit: 'degC',
    min: minC,
    max: maxC,
    parse(input: Raw, name: string): number {
      const raw = trimmed(input);
      refuseOverflow(raw, name, 'a temperature');
      const K = parseTemperatureK(raw, name);
      const C = K - KELVIN_OFFSET;
      // 1e-9 K: the round trip through kelvin must not refuse a value typed exactly at an edge.
      if (C < minC - 1e-9 || C > maxC + 1e-9) throw new InputError(name, outside(raw));
      return K;
    },
  };
}

/** A temperature in the model's range (-150 to 500 degC); parsed to kelvin. */
export const temperatureInput: Quantity<number> = temperatureWithin(
  TEMPERATURE_RANGE_C[0],
  TEMPERATURE_RANGE_C[1],
  (raw) => `${showRaw(raw)} is outside the model's range ${TEMPERATURE_RANGE_C[0]} to ${TEMPERATURE_RANGE_C[1]} degC`,
);

/** A temperature in an inclusive range of its own (a datasheet Tg or Tm: the range of its parameter field); parsed to kelvin. */
export function temperatureInRange(minC: number, maxC: number): Quantity<number> {
  return temperatureWithin(minC, maxC, (raw) => `${showRaw(raw)} is outside ${minC} to ${maxC} degC`);
}
