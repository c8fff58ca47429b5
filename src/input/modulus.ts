/** Moduli and stresses: a bare number is MPa, text may carry a unit ("2.4 GPa", "300 ksi"); parsed to MPa. */
import { InputError } from '../base/errors.js';
import { parseStressMPa } from '../base/units.js';
import { refuseOverflow, showRaw, type Quantity, trimmed } from './quantity.js';

/** Upper bound of a modulus or stress input, MPa: above the glassy modulus of any unfilled polymer (common practice: 1 to 4 GPa). */
export const MODULUS_MAX_MPA = 100_000;

/** A positive modulus or stress up to `maxMPa`, described by `what`. */
export function stressUpTo(maxMPa: number, what: string): Quantity<number> {
  return {
    what,
    unit: 'MPa',
    min: 0,
    max: maxMPa,
    parse(input, name) {
      const raw = trimmed(input);
      refuseOverflow(raw, name, 'a modulus or stress');
      const mpa = parseStressMPa(raw, name);
      if (mpa > maxMPa) throw new InputError(name, `${showRaw(raw)} is above ${maxMPa} MPa`);
      return mpa;
    },
  };
}

/** A modulus (a required stiffness, a datasheet or creep modulus): greater than zero, at most 100 000 MPa; parsed to MPa. */
export const modulusInput: Quantity<number> = /* @__PURE__ */ stressUpTo(
  MODULUS_MAX_MPA,
  'a modulus (a number in MPa, or text such as "2.4 GPa" or "300 ksi")',
);
