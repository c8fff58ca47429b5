/** The test frequency of a DMA sweep (Hz for a bare number). */
import { frequencyInput } from '../../../src/index.js';
import { quantityArg, type ArgSpec, type Common } from './spec.js';

/** A test frequency; parsed to Hz. */
export function frequency(name: string, o: Common = {}): ArgSpec<number> {
  return quantityArg(frequencyInput, name, 'frequency', o);
}
