/** Modulus and stress arguments (MPa for a bare number), parsed to MPa by the input layer. */
import { hdtStressInput, modulusInput } from '../../../src/index.js';
import { quantityArg, type ArgSpec, type Common } from './spec.js';

/** A modulus (a required stiffness, or an optional datasheet modulus); parsed to MPa. */
export function modulus(name: string, o: Common = {}): ArgSpec<number> {
  return quantityArg(modulusInput, name, 'modulus', o);
}

/** A flexural test stress (MPa), or the ISO 75 method letter A, B or C. */
export function testStress(name: string): ArgSpec<number> {
  return quantityArg(hdtStressInput, name, 'stress');
}
