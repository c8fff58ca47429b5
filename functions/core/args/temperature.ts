/** Temperature arguments (degC for a bare number), parsed to kelvin by the input layer. */
import { glassTransitionInput, hdtTemperatureInput, meltingInput, temperatureInput } from '../../../src/index.js';
import { quantityArg, type ArgSpec, type Common } from './spec.js';

/** A temperature in the model's range; parsed to kelvin. */
export function temperature(name: string, o: Common = {}): ArgSpec<number> {
  return quantityArg(temperatureInput, name, 'temperature', o);
}

/** An optional temperature without a fixed default (the wrapper picks one); parsed to kelvin or undefined. */
export function optionalTemperature(name: string): ArgSpec<number | undefined> {
  return temperature(name, { optional: true }) as ArgSpec<number | undefined>;
}

/** An optional datasheet HDT (above the ISO 75 start, 23 degC, at most 500 degC); parsed to kelvin or undefined. */
export function hdtTemperature(name: string): ArgSpec<number | undefined> {
  return quantityArg(hdtTemperatureInput, name, 'temperature', { optional: true }) as ArgSpec<number | undefined>;
}

/** An optional datasheet Tg (the range of the Tg_C field); parsed to kelvin or undefined. */
export function glassTransition(name: string): ArgSpec<number | undefined> {
  return quantityArg(glassTransitionInput, name, 'temperature', { optional: true }) as ArgSpec<number | undefined>;
}

/** An optional datasheet Tm (the range of the Tm_C field); parsed to kelvin or undefined. */
export function melting(name: string): ArgSpec<number | undefined> {
  return quantityArg(meltingInput, name, 'temperature', { optional: true }) as ArgSpec<number | undefined>;
}
