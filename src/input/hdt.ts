/**
 * Heat deflection (ISO 75): the test stress, by method letter or as a stress, and a datasheet HDT
 * temperature with the checks every front-end makes before a calibration: inside the simulated test's
 * span, and a higher stress never deflecting at a higher temperature.
 */
import { InputError } from '../base/errors.js';
import { kelvinToC } from '../base/units.js';
import { HDT_MAX_C, HDT_METHODS, HDT_START_C } from '../answers/hdt.js';
import { type Quantity, type Raw } from './quantity.js';
import { stressUpTo } from './modulus.js';
import { temperatureInput } from './temperature.js';

/** Upper bound of a heat-deflection test stress, MPa: above ISO 75 method C (8.00 MPa) by a wide margin (set here). */
export const HDT_STRESS_MAX_MPA = 50;

const STRESS_WHAT =
  'a stress (a number in MPa, or text such as "1.8 MPa" or "260 psi"), or the ISO 75 method letter "A" (1.80 MPa), "B" (0.45 MPa) or "C" (8.00 MPa)';
const testStress = /* @__PURE__ */ stressUpTo(HDT_STRESS_MAX_MPA, STRESS_WHAT);

/** The flexural stress of a heat deflection test, MPa, or the ISO 75 method letter A, B or C (any case). */
export const hdtStressInput: Quantity<number> = {
  ...testStress,
  parse(raw, name) {
    if (typeof raw === 'string') {
      const letter = raw.trim().toUpperCase();
      if (letter === 'A' || letter === 'B' || letter === 'C') return HDT_METHODS[letter];
    }
    return testStress.parse(raw, name);
  },
};

/**
 * A datasheet HDT, parsed to kelvin: above the start of the simulated test (23 degC) and at most where
 * it gives up (500 degC); an HDT outside cannot be met by a calibration.
 */
export const hdtTemperatureInput: Quantity<number> = {
  what: 'an HDT (a number in degC, or text such as "260 degF")',
  unit: 'degC',
  min: HDT_START_C,
  max: HDT_MAX_C,
  parse(raw, name) {
    const K = temperatureInput.parse(raw, name);
    const C = kelvinToC(K);
    const typed = typeof raw === 'string' ? raw.trim() : String(raw);
    if (!(C > HDT_START_C)) throw new InputError(name, `must be above ${HDT_START_C} degC, where the ISO 75 test starts; got ${typed}`);
    if (C > HDT_MAX_C) throw new InputError(name, `must be at most ${HDT_MAX_C} degC, got ${typed}`);
    return K;
  },
};

/** One datasheet HDT as the order check sees it: stress (MPa), temperature (K), what was typed and its input's name. */
export interface HdtPoint {
  readonly stressMPa: number;
  readonly temperatureK: number;
  readonly raw: Raw;
  readonly name: string;
}

function methodLetter(stressMPa: number): string | undefined {
  return (Object.keys(HDT_METHODS) as (keyof typeof HDT_METHODS)[]).find((k) => HDT_METHODS[k] === stressMPa);
}

/**
 * Refuses datasheet HDTs in the wrong order: a higher stress always deflects at a lower temperature,
 * so an HDT above the HDT of a lower stress is a typing slip (swapped columns); the error names the
 * input of the higher stress.
 */
export function checkHdtOrder(points: readonly HdtPoint[]): void {
  const label = (s: number): string => (methodLetter(s) ? `HDT/${methodLetter(s)}` : `the HDT at ${s} MPa`);
  const method = (s: number): string => (methodLetter(s) ? `method ${methodLetter(s)}` : `${s} MPa`);
  for (const p of points) {
    for (const q of points) {
      if (p.stressMPa > q.stressMPa && p.temperatureK > q.temperatureK) {
        const typed = (r: Raw): string => (typeof r === 'string' ? r.trim() : String(r));
        throw new InputError(
          p.name,
          `${typed(p.raw)} is above ${label(q.stressMPa)} (${typed(q.raw)}); the higher stress of ${method(p.stressMPa)} always deflects at a lower temperature, so check the two values`,
        );
      }
    }
  }
}
