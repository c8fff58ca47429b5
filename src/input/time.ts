/** Durations: a bare number is hours, text may carry a unit ("10 s", "2 weeks", "10 years"); parsed to seconds. */
import { InputError } from '../base/errors.js';
import { parseTimeS, SECONDS_PER_HOUR, SECONDS_PER_YEAR } from '../base/units.js';
import { TIME_SEARCH_S } from '../answers/inverse.js';
import { refuseOverflow, showRaw, type Quantity, trimmed } from './quantity.js';

/** The model's time range, seconds (1 ms to 100 years): where the inverse solvers search (answers/inverse.ts). */
export const TIME_RANGE_S: readonly [number, number] = TIME_SEARCH_S;

/** The range as words, for messages. */
export const TIME_RANGE_TEXT = `1 ms to ${TIME_RANGE_S[1] / SECONDS_PER_YEAR} years`;

/** A duration in the model's range (1 ms to 100 years); parsed to seconds. */
export const timeInput: Quantity<number> = {
  what: 'a time (a number in hours, or text such as "1000 h", "2 weeks" or "10 years")',
  unit: 'h',
  min: TIME_RANGE_S[0] / SECONDS_PER_HOUR,
  max: TIME_RANGE_S[1] / SECONDS_PER_HOUR,
  parse(input, name) {
    const raw = trimmed(input);
    refuseOverflow(raw, name, 'a time');
    const s = parseTimeS(raw, name);
    // Relative slack of 1e-12: "100 years" and "1 ms" typed exactly are inside.
    if (s < TIME_RANGE_S[0] * (1 - 1e-12) || s > TIME_RANGE_S[1] * (1 + 1e-12)) {
      throw new InputError(name, `${showRaw(raw)} is outside the model's range ${TIME_RANGE_TEXT}`);
    }
    return s;
  },
};
