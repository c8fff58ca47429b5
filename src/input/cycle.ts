/**
 * Duty cycles: segments of a temperature and a duration, repeated a number of times. The whole history
 * must lie in the model's time range, like any single time.
 */
import { InputError } from '../base/errors.js';
import { SECONDS_PER_HOUR, SECONDS_PER_YEAR } from '../base/units.js';
import type { Segment } from '../answers/history.js';
import { atItem, splitList } from './list.js';
import { showRaw, type Quantity } from './quantity.js';
import { temperatureInput } from './temperature.js';
import { TIME_RANGE_S, TIME_RANGE_TEXT, timeInput } from './time.js';

const SEGMENT_WHAT = 'segments TEMPERATURE:DURATION such as "70 degC:8 h, 30 degC:16 h"';

/** Segments typed as text, "70 degC:8 h, 30:16" (bare numbers degC and hours); parsed to kelvin and seconds. */
export function segmentsFromText(text: string, name: string): Segment[] {
  const items = splitList(text, name, SEGMENT_WHAT);
  return items.map((item, i) =>
    atItem(name, 'item', i, items.length, () => {
      const [T, t, extra] = item.split(':');
      if (T === undefined || t === undefined || extra !== undefined || T.trim() === '' || t.trim() === '') {
        throw new InputError(name, `${showRaw(item)} must be TEMPERATURE:DURATION, such as "70 degC:8 h"`);
      }
      return { TK: temperatureInput.parse(T.trim(), name), dtS: timeInput.parse(t.trim(), name) };
    }),
  );
}

/** Duty-cycle segments typed as text (a CLI option); parsed to kelvin and seconds. */
export const segmentsInput: Quantity<Segment[]> = {
  what: SEGMENT_WHAT,
  unit: 'degC:h',
  parse(raw, name) {
    return segmentsFromText(String(raw), name);
  },
};

/** Segments from a list of temperatures and a list of durations of the same length; the error names the durations. */
export function pairSegments(temperaturesK: readonly number[], durationsS: readonly number[], durationsName: string): Segment[] {
  if (temperaturesK.length !== durationsS.length) {
    throw new InputError(
      durationsName,
      `needs one duration per temperature: got ${durationsS.length} durations for ${temperaturesK.length} temperatures`,
    );
  }
  return temperaturesK.map((TK, i) => ({ TK, dtS: durationsS[i] ?? 0 }));
}

function durationText(s: number): string {
  const p = (x: number): string => String(Number(x.toPrecision(3)));
  if (s >= SECONDS_PER_YEAR) return `${p(s / SECONDS_PER_YEAR)} years`;
  if (s >= SECONDS_PER_HOUR) return `${p(s / SECONDS_PER_HOUR)} h`;
  return `${p(s)} s`;
}

/**
 * Checks that `cycles` repetitions of the segments last no longer (and no shorter) than the model's time
 * range; the error names the cycles input, or the durations when there is one cycle.
 */
export function checkHistory(
  segments: readonly Segment[],
  cycles: number,
  names: { readonly cycles: string; readonly durations: string },
): void {
  const period = segments.reduce((s, x) => s + x.dtS, 0);
  const total = period * cycles;
  if (total >= TIME_RANGE_S[0] * (1 - 1e-12) && total <= TIME_RANGE_S[1] * (1 + 1e-12)) return;
  const what =
    cycles === 1 ? `the cycle lasts ${durationText(total)}` : `${cycles} cycles of ${durationText(period)} last ${durationText(total)}`;
  throw new InputError(cycles === 1 ? names.durations : names.cycles, `${what}, outside the model's range ${TIME_RANGE_TEXT}`);
}
