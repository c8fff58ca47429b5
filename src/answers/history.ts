/**
 * Temperature histories: equivalent time at a reference temperature, t_eq = sum dt_i a_T(Tref) / a_T(T_i)
 * (thermorheologically simple superposition), and the modulus after a history, with both of the model's
 * clocks accumulated segment by segment.
 */
import { InputError } from '../base/errors.js';
import { creepRate, evaluateReduced, type Evaluation, type Material } from '../material/model.js';
import { shiftLog10 } from '../material/shift.js';

/** One segment of a history: a temperature (K) held for a duration (s). */
export interface Segment {
  readonly TK: number;
  readonly dtS: number;
}

/** Accumulated clocks: xi = reduced time at Tg (s), theta = slow-creep clock (1). */
export interface Clocks {
  xi: number;
  theta: number;
}

/** Adds one segment (K, s) to the clocks, in place. */
export function advanceClocks(m: Material, clocks: Clocks, TK: number, dtS: number): Clocks {
  clocks.xi += dtS / 10 ** shiftLog10(m.shift, TK);
  clocks.theta += dtS * creepRate(m, TK);
  return clocks;
}

function checkSegments(segments: readonly Segment[], cycles: number): void {
  if (segments.length === 0) throw new InputError('durations', 'needs at least one segment');
  if (!Number.isFinite(cycles) || cycles <= 0) throw new InputError('cycles', `must be a positive number, got ${cycles}`);
  segments.forEach((s, i) => {
    if (!(s.dtS > 0) || !Number.isFinite(s.dtS))
      throw new InputError('durations', `segment ${i + 1}: a duration must be positive, got ${s.dtS} s`);
    if (!(s.TK > 0) || !Number.isFinite(s.TK))
      throw new InputError('temperatures', `segment ${i + 1}: temperature must be above absolute zero`);
  });
}

/** Equivalent time (s) at Tref (K) of `cycles` repetitions of the segments. */
export function equivalentTimeS(m: Material, segments: readonly Segment[], TrefK: number, cycles = 1): number {
  checkSegments(segments, cycles);
  const ref = shiftLog10(m.shift, TrefK);
  let sum = 0;
  for (const s of segments) sum += s.dtS * 10 ** (ref - shiftLog10(m.shift, s.TK));
  const total = sum * cycles;
  if (!Number.isFinite(total)) {
    throw new InputError(
      'reference_temperature',
      `the equivalent time exceeds 1e308 s: the reference ${(TrefK - 273.15).toFixed(2)} degC is too far below the history's temperatures; choose a higher reference`,
    );
  }
  return total;
}

/** Modulus after `cycles` repetitions of the segments, evaluated at TevalK (default: the last segment's temperature). */
export function modulusAfterHistory(m: Material, segments: readonly Segment[], cycles = 1, TevalK?: number): Evaluation {
  checkSegments(segments, cycles);
  const one: Clocks = { xi: 0, theta: 0 };
  for (const s of segments) advanceClocks(m, one, s.TK, s.dtS);
  const last = segments[segments.length - 1];
  const T = TevalK ?? (last ? last.TK : NaN);
  return evaluateReduced(m, one.xi * cycles, one.theta * cycles, T);
}
