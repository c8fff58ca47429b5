/**
 * Inverse answers on the monotone model, by Brent's bracketed root finding in log modulus.
 * Each answer says explicitly when the target is outside what the model can reach.
 */
import { InputError, SolverError } from '../base/errors.js';
import { modulusMPa, type Material } from '../material/model.js';
import { brentRoot, ROOT_REL_TOL } from '../numeric/roots.js';
import { shiftLog10, temperatureForShiftK, WLF_SINGULARITY_MARGIN_K } from '../material/shift.js';
import { MODEL_TEMPERATURE_K, MODEL_TIME_S } from '../base/units.js';

/** Temperature search range of MAXTEMP, kelvin: the model's range, -150 degC to 500 degC. */
export const TEMP_SEARCH_K: readonly [number, number] = MODEL_TEMPERATURE_K;
/** Time search range of MAXTIME, seconds: the model's range, 1 ms to 100 Julian years. */
export const TIME_SEARCH_S: readonly [number, number] = MODEL_TIME_S;
/** Points of the coarse scan used where E(T) is not monotone (a crosslinked rubber's entropic rise). */
const SCAN_POINTS = 64;

export type InverseStatus = 'found' | 'above-throughout' | 'below-throughout';

export interface InverseAnswer {
  readonly status: InverseStatus;
  /** The answer in engine units (K or s), or null when status is not 'found'. */
  readonly value: number | null;
  readonly iterations: number;
  /** |log10 E(answer) - log10 E_required| */
  readonly residual: number;
}

/** log10 of a modulus, floored at the smallest double so that a fully relaxed melt stays finite. */
function logE(E: number): number {
  return Math.log10(Math.max(E, Number.MIN_VALUE));
}

function requirePositive(value: number, argument: string): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new InputError(argument, `must be a positive finite number, got ${value}`);
}

function solveBracket(f: (x: number) => number, a: number, b: number): { root: number; iterations: number; residual: number } {
  const r = brentRoot(f, a, b, ROOT_REL_TOL);
  if (!r.converged) throw new SolverError(r.reason, r.iterations, r.residual);
  return { root: r.root, iterations: r.iterations, residual: r.residual };
}

/** A pure WLF law is undefined at and below Tg - C2 + margin: start the search just above that. */
function searchRangeK(m: Material): readonly [number, number] {
  const [lo, hi] = TEMP_SEARCH_K;
  const c = m.shift;
  if (c.law !== 'wlf') return [lo, hi];
  return [Math.max(lo, c.TrefK - c.C2K + WLF_SINGULARITY_MARGIN_K + 1e-6), hi];
}

/**
 * Highest temperature (K) at which E(t, T) >= required (MPa) for the time t (s).
 * 'below-throughout': even at -150 degC (pure WLF: just above its singularity) the material is softer;
 * 'above-throughout': stiffer up to 500 degC.
 */
export function maxTemperatureK(m: Material, requiredMPa: number, tS: number): InverseAnswer {
  requirePositive(requiredMPa, 'required_modulus');
  requirePositive(tS, 'time');
  const logReq = Math.log10(requiredMPa);
  const f = (TK: number): number => logE(modulusMPa(m, tS, TK)) - logReq;
  const [lo, hi] = searchRangeK(m);
  if (f(hi) >= 0) return { status: 'above-throughout', value: null, iterations: 0, residual: 0 };
  let a = lo;
  let b = hi;
  if (m.kind === 'crosslinked') {
    // The rubbery plateau rises with T, so scan down from the top for the last crossing.
    const step = (hi - lo) / SCAN_POINTS;
    let found = false;
    for (let T = hi - step; T >= lo - 1e-9; T -= step) {
      if (f(T) >= 0) {
        a = T;
        b = T + step;
        found = true;
        break;
      }
    }
    if (!found) return { status: 'below-throughout', value: null, iterations: 0, residual: 0 };
  } else if (f(lo) < 0) {
    return { status: 'below-throughout', value: null, iterations: 0, residual: 0 };
  }
  const r = solveBracket(f, a, b);
  return { status: 'found', value: r.root, iterations: r.iterations, residual: r.residual };
}

/**
 * Longest time (s) for which E(t, T) >= required (MPa) at temperature T (K).
 * 'above-throughout': still stiffer after 100 years; 'below-throughout': softer already at 1 ms.
 */
export function maxTimeS(m: Material, requiredMPa: number, TK: number): InverseAnswer {
  requirePositive(requiredMPa, 'required_modulus');
  requirePositive(TK, 'temperature');
  const logReq = Math.log10(requiredMPa);
  const f = (logT: number): number => logE(modulusMPa(m, 10 ** logT, TK)) - logReq;
  const lo = Math.log10(TIME_SEARCH_S[0]);
  const hi = Math.log10(TIME_SEARCH_S[1]);
  if (f(hi) >= 0) return { status: 'above-throughout', value: null, iterations: 0, residual: 0 };
  if (f(lo) < 0) return { status: 'below-throughout', value: null, iterations: 0, residual: 0 };
  const r = solveBracket(f, lo, hi);
  return { status: 'found', value: 10 ** r.root, iterations: r.iterations, residual: r.residual };
}

/**
 * Apparent Tg (K) at a time scale t (s): the temperature at which the glass-transition relaxation time
 * equals t, i.e. a_T(T) = t / tauTg. It equals Tg at t = tauTg. Null where the shift law cannot reach it.
 */
export function apparentTgK(m: Material, tS: number): number | null {
  requirePositive(tS, 'time');
  return temperatureForShiftK(m.shift, Math.log10(tS / m.tauTg));
}

/** log10 a_T of the material at T (K), relative to its Tg. */
export function materialShiftLog10(m: Material, TK: number): number {
  return shiftLog10(m.shift, TK);
}
