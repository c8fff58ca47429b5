/** Counts: whole numbers of points or terms, and the (possibly fractional) number of times a duty cycle repeats. */
import { InputError } from '../base/errors.js';
import { decimalNumber, showRaw, type Quantity, type Raw, trimmed } from './quantity.js';

function numberOf(raw: Raw, name: string, what: string): number {
  const n = typeof raw === 'number' ? raw : decimalNumber(raw);
  if (n === undefined || !Number.isFinite(n)) throw new InputError(name, `expects ${what}, got ${showRaw(raw)}`);
  return n;
}

/** A whole number from `min` to `max` (inclusive). */
export function wholeNumber(min: number, max: number): Quantity<number> {
  const what = `a whole number from ${min} to ${max}`;
  return {
    what,
    unit: 'count',
    min,
    max,
    parse(input, name) {
      const raw = trimmed(input);
      const n = numberOf(raw, name, what);
      if (!Number.isInteger(n) || n < min || n > max) throw new InputError(name, `expects ${what}, got ${showRaw(raw)}`);
      return n;
    },
  };
}

/** Points of a modulus-temperature curve (DERATE.CURVE): 2 to 1000, set here to keep a chart's series readable and a spill small. */
const CURVE_POINTS_MIN = 2;
const CURVE_POINTS_MAX = 1000;
export const CURVE_POINTS: readonly [number, number] = [CURVE_POINTS_MIN, CURVE_POINTS_MAX];
export const curvePointsInput: Quantity<number> = /* @__PURE__ */ wholeNumber(CURVE_POINTS_MIN, CURVE_POINTS_MAX);

/** Prony terms per decade of a fitted master curve: 1 to 10 (set here; more only follows noise). */
export const termsPerDecadeInput: Quantity<number> = /* @__PURE__ */ wholeNumber(1, 10);

// wholeNumber is called with plain constants and marked pure, so a bundle that does not use a count drops it.

/** Upper bound of a cycle count: 100 years of one cycle a day is 36 525; set here with a wide margin. */
export const CYCLES_MAX = 1e7;
/** Fewest repeats of a duty cycle: one whole cycle (the engine's histories refuse fewer; src/answers/history.ts). */
export const CYCLES_MIN = 1;

const CYCLES_WHAT = `a number of repeats from ${CYCLES_MIN} to ${CYCLES_MAX}`;

/** How many times a duty cycle repeats: CYCLES_MIN to CYCLES_MAX (fractions above one allowed: a part of the last cycle). */
export const cyclesInput: Quantity<number> = {
  what: CYCLES_WHAT,
  unit: 'count',
  min: CYCLES_MIN,
  max: CYCLES_MAX,
  parse(input, name) {
    const raw = trimmed(input);
    const n = numberOf(raw, name, CYCLES_WHAT);
    if (!(n >= CYCLES_MIN) || n > CYCLES_MAX) throw new InputError(name, `expects ${CYCLES_WHAT}, got ${showRaw(raw)}`);
    return n;
  },
};
