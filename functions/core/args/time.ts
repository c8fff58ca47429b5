/** Time arguments (hours for a bare number), parsed to seconds by the input layer. */
import { timeInput } from '../../../src/index.js';
import { quantityArg, type ArgSpec, type Common } from './spec.js';

/** A duration in the model's range; parsed to seconds. */
export function time(name: string, o: Common = {}): ArgSpec<number> {
  return quantityArg(timeInput, name, 'time', o);
}
