/**
 * The review's grade builder: a base family, an optional ISO 1043-2 filler with its mass percent and, for a
 * polyamide, a relative humidity, composed into the grade text every DERATE function reads
 * ("PA66-GF30 at 50 % RH") and checked by the input layer's family quantity, so the pane accepts exactly
 * what a worksheet cell would.
 */
import { InputError } from '../../../src/base/errors.js';
import { FILLER_CODES, FILLERS, NO_FILLER, type FillerCode } from '../../../src/material/filler.js';
import { POLYAMIDE_ISOTHERMS, POLYAMIDES } from '../../../src/material/humidity.js';
import { familyInput } from '../../../src/input/material.js';
import { decimalNumber } from '../../../src/input/quantity.js';

/** The input-error arguments of the builder's fields (the pane maps them to its field ids). */
export const GRADE_ARGS = { base: 'candidates', mass: 'filler mass', humidity: 'relative humidity' } as const;

/** What the builder's fields hold, as typed. */
export interface GradeFields {
  /** A family id, or a bare polyamide symbol (PA6, PA66) that takes a humidity. */
  readonly base: string;
  /** An ISO 1043-2 code of FILLER_CODES, or NO_FILLER. */
  readonly filler: string;
  /** Mass percent text, %; read only with a filler. */
  readonly mass: string;
  /** Relative humidity text, %; read only for a polyamide base. */
  readonly humidity: string;
}

/** True when the base takes a humidity (a bare polyamide symbol; "PA66-dry" and "PA66-cond" carry their own). */
export function takesHumidity(base: string): boolean {
  return POLYAMIDES.includes(base);
}

/** The filler choices as the select lists them: value and shown text. */
export function fillerOptions(): { value: string; text: string }[] {
  return [{ value: NO_FILLER, text: 'none (unfilled)' }, ...FILLER_CODES.map((c) => ({ value: c, text: `${c} - ${FILLERS[c].name}` }))];
}

/** The mass percent range a filler code allows, as the hint shows it, %. */
export function massRange(code: FillerCode): readonly [number, number] {
  return FILLERS[code].massPct;
}

/** The bare polyamide bases the base select adds after the families: symbol and shown text. */
export function humidBases(): { value: string; text: string }[] {
  return POLYAMIDES.map((s) => ({ value: s, text: `${s} - ${POLYAMIDE_ISOTHERMS[s]?.name ?? s}, at a relative humidity` }));
}

/** Percent text ("30", "30 %") as a number, or an InputError naming the field. */
function percent(text: string, argument: string, example: string): number {
  const t = text.trim().replace(/\s*%$/, '');
  if (t === '') throw new InputError(argument, `is missing; type a percentage such as ${example}`);
  const n = decimalNumber(t);
  if (n === undefined || !Number.isFinite(n))
    throw new InputError(argument, `expects a percentage such as ${example}, got "${text.trim()}"`);
  return n;
}

/**
 * The grade text of the fields ("PBT-GF30", "PA66-GF30 at 50 % RH", "PA66 at 70 % RH", or the family alone),
 * checked by familyInput; a problem is an InputError naming the field at fault (GRADE_ARGS).
 */
export function composeGrade(f: GradeFields): string {
  const humid = takesHumidity(f.base);
  const base = humid ? `${f.base} at ${percent(f.humidity, GRADE_ARGS.humidity, '50')} % RH` : f.base;
  // The base and its humidity first, so that a refusal there is shown under the humidity field.
  familyInput.parse(base, humid ? GRADE_ARGS.humidity : GRADE_ARGS.base);
  if (f.filler === NO_FILLER) return base;
  if (!(FILLER_CODES as readonly string[]).includes(f.filler)) {
    throw new InputError(GRADE_ARGS.base, `"${f.filler}" is not a supported ISO 1043-2 filler code`);
  }
  const mass = percent(f.mass, GRADE_ARGS.mass, '30');
  // A filled polyamide at a humidity: the filler code follows the symbol, the humidity closes the text (grade.ts).
  const text = humid
    ? `${f.base}-${f.filler}${mass} at ${percent(f.humidity, GRADE_ARGS.humidity, '50')} % RH`
    : `${f.base}-${f.filler}${mass}`;
  // The base read above, so what is left to refuse is the mass percent (outside the filler's range).
  familyInput.parse(text, GRADE_ARGS.mass);
  return text;
}
