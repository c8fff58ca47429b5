/** Count arguments: whole numbers of points or terms, and how many times a duty cycle repeats. */
import { cyclesInput, type Quantity } from '../../../src/index.js';
import { quantityArg, type ArgSpec, type Common } from './spec.js';

/** A whole number within the bounds of one of the input layer's counts (curvePointsInput, termsPerDecadeInput). */
export function count(name: string, q: Quantity<number>, o: Common = {}): ArgSpec<number> {
  return quantityArg(q, name, 'count', o);
}

/** How many times a duty cycle repeats: a positive number (fractions allowed). */
export function cycles(name: string, o: Common = {}): ArgSpec<number> {
  return quantityArg(cyclesInput, name, 'cycles', o);
}
