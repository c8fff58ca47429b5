/** The strain argument: a fraction, or text ending in '%'. */
import { strainInput } from '../../../src/index.js';
import { quantityArg, type ArgSpec } from './spec.js';

/** A strain as a fraction; text may end in '%'. */
export function strain(name: string): ArgSpec<number> {
  return quantityArg(strainInput, name, 'strain');
}
