/**
 * Temperature histories: equivalent time at a reference temperature, t_eq = sum dt_i a_T(Tref) / a_T(T_i)
 * (thermorheologically simple superposition), and the modulus after a history, with both of the model's
 * clocks accumulated segment by segment. A history stays inside the model's range: at least one cycle,
 * at most MAX_CYCLES, lasting 1 ms to 100 years, and an equivalent time inside that range too. Loops
 * only (no spreading of the segments into a call), so hourly logger data over decades is fine.
 */
import { InputError } from '../base/errors.js';
import { creepRate, evaluateReduced, type Evaluation, type Material } from '../material/model.js';
import { shiftLog10 } from '../material/shift.js';
import { kelvinToC, MODEL_TIME_S, SECONDS_PER_HOUR, SECONDS_PER_YEAR } from '../base/units.js';

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

/**
 * Most repeats of a cycle. Set here: 100 years of one cycle every five minutes is about 1.05e7; a
 * history must also last no longer than the model's 100 years (checked separately).
 */
export const MAX_CYCLES = 1e7;
/** Fewest repeats: a cycle is repeated a whole number of times or more, never a fraction of once. */
export const MIN_CYCLES = 1;

/** Adds one segment (K, s) to the clocks, in place. */
export function advanceClocks(m: Material, clocks: Clocks, TK: number, dtS: number): Clocks {
  clocks.xi += dtS / 10 ** shiftLog10(m.shift, TK);
  clocks.theta += dtS * creepRate(m, TK);
  return clocks;
}

/** The hottest temperature (K) of the segments: the default reference of EQTIME and reading temperature of DUTY. */
export function hottestK(segments: readonly Segment[]): number {
  let hot = -Infinity;
  for (const s of segments) if (s.TK > hot) hot = s.TK;
  return hot;
}

/** A duration in words for messages: seconds, hours or years. */
function span(s: number): string {
  if (s >= SECONDS_PER_YEAR) return `${Number((s / SECONDS_PER_YEAR).toPrecision(3))} years`;
  if (s >= SECONDS_PER_HOUR) return `${Number((s / SECONDS_PER_HOUR).toPrecision(3))} h`;
  return `${Number(s.toPrecision(3))} s`;
}

const RANGE_TEXT = `the model's range of 1 ms to ${MODEL_TIME_S[1] / SECONDS_PER_YEAR} years`;

function checkSegments(segments: readonly Segment[], cycles: number): void {
  if (segments.length === 0) throw new InputError('durations', 'needs at least one segment');
  if (!Number.isFinite(cycles) || cycles < MIN_CYCLES || cycles > MAX_CYCLES) {
    throw new InputError('cycles', `must be a number of repeats from ${MIN_CYCLES} to ${MAX_CYCLES}, got ${cycles}`);
  }
  let sum = 0;
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i]!;
    if (!(s.dtS > 0) || !Number.isFinite(s.dtS))
      throw new InputError('durations', `segment ${i + 1}: a duration must be positive, got ${s.dtS} s`);
    if (!(s.TK > 0) || !Number.isFinite(s.TK))
      throw new InputError('temperatures', `segment ${i + 1}: temperature must be above absolute zero`);
    sum += s.dtS;
  }
  const total = sum * cycles;
  const [lo, hi] = MODEL_TIME_S;
  if (total > hi || total < lo) {
    // The repeat count is what usually takes a history out of range; a single pass is the durations' doing.
    const argument = cycles > 1 ? 'cycles' : 'durations';
    throw new InputError(argument, `the history lasts ${span(total)} (cycles x the sum of the durations), outside ${RANGE_TEXT}`);
  }
}

/** log10 a_T of each segment; a shift law undefined at a segment's temperature is reported against `temperatures`. */
function segmentShift(m: Material, s: Segment, i: number): number {
  try {
    return shiftLog10(m.shift, s.TK);
  } catch (e) {
    if (e instanceof InputError) throw new InputError('temperatures', `segment ${i + 1}: ${e.problem}`);
    throw e;
  }
}

/** log10 a_T at a temperature given by the named argument (a reference, a reading temperature). */
function namedShift(m: Material, TK: number, argument: string): number {
  try {
    return shiftLog10(m.shift, TK);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(argument, e.problem);
    throw e;
  }
}

/**
 * Equivalent time (s) at Tref (K; default the hottest segment) of `cycles` repetitions of the
 * segments. An equivalent time outside the model's range (1 ms to 100 years) is refused, naming
 * `ref_temperature`: a reference far colder than the history stretches its time beyond any meaning.
 */
export function equivalentTimeS(m: Material, segments: readonly Segment[], TrefK?: number, cycles = 1): number {
  checkSegments(segments, cycles);
  const hot = hottestK(segments);
  const Tref = TrefK ?? hot;
  const ref = namedShift(m, Tref, 'ref_temperature');
  let sum = 0;
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i]!;
    sum += s.dtS * 10 ** (ref - segmentShift(m, s, i));
  }
  const total = sum * cycles;
  const [lo, hi] = MODEL_TIME_S;
  if (!(total <= hi)) {
    const hotText =
      TrefK === undefined || TrefK === hot ? '' : `; use its hottest segment, ${Number(kelvinToC(hot).toPrecision(4))} degC (the default)`;
    throw new InputError(
      'ref_temperature',
      `the equivalent time at ${Number(kelvinToC(Tref).toPrecision(4))} degC is ${Number.isFinite(total) ? span(total) : 'beyond 1e308 s'}, far beyond ${RANGE_TEXT}: the reference is too cold for this history${hotText}`,
    );
  }
  if (total < lo) {
    throw new InputError(
      'ref_temperature',
      `the equivalent time at ${Number(kelvinToC(Tref).toPrecision(4))} degC is ${span(total)}, below ${RANGE_TEXT}: the reference is too hot for this history; choose a colder one`,
    );
  }
  return total;
}

/**
 * Modulus after `cycles` repetitions of the segments, evaluated at TevalK (default: the hottest
 * segment, the worst case).
 */
export function modulusAfterHistory(m: Material, segments: readonly Segment[], cycles = 1, TevalK?: number): Evaluation {
  checkSegments(segments, cycles);
  const one: Clocks = { xi: 0, theta: 0 };
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i]!;
    one.xi += s.dtS / 10 ** segmentShift(m, s, i);
    one.theta += s.dtS * creepRate(m, s.TK);
  }
  return evaluateReduced(m, one.xi * cycles, one.theta * cycles, TevalK ?? hottestK(segments));
}
