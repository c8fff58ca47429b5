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
/**
 * Step of the scan over the temperature range where E(T) is not monotone (a crosslinked network's
 * entropic rise), kelvin. Set here: 1 K resolves every dip of the bundled networks many times over;
 * the lowest scan point is then refined so that a dip narrower than a step is not missed.
 */
export const SCAN_STEP_K = 1;

/**
 * found: the requirement is met from the low end of the range up to `value` and not above it;
 * above-throughout: met over the whole range; below-throughout: met nowhere in the range;
 * below-between: not met only inside `below` (a crosslinked network regains stiffness as it warms:
 * E = 3 rho R T / Mc rises with T), met on the high side of it and, when `value` is not null, below it.
 */
export type InverseStatus = 'found' | 'above-throughout' | 'below-throughout' | 'below-between';

export interface InverseAnswer {
  readonly status: InverseStatus;
  /** The limit in engine units (K or s): the end of the range over which the requirement holds from the low end; null when it holds nowhere from the low end, or everywhere. */
  readonly value: number | null;
  /**
   * Where the modulus is below the requirement inside the search range, in engine units (K or s),
   * [from, to]; null where it is nowhere below ('above-throughout').
   */
  readonly below: readonly [number, number] | null;
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

const NOWHERE: Omit<InverseAnswer, 'status'> = { value: null, below: null, iterations: 0, residual: 0 };

/** Golden-section minimum of f on [a, b] (a dip between two scan points); returns the abscissa. */
function goldenMin(f: (x: number) => number, a0: number, b0: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = a0;
  let b = b0;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let i = 0; i < 60 && b - a > 1e-9 * Math.max(1, Math.abs(b)); i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return fc < fd ? c : d;
}

/**
 * The temperatures (K) where a non-monotone E(T) is below the requirement: a scan of the whole range,
 * its lowest point refined, and the first and last crossings solved by Brent's method.
 */
function belowSetOfNetwork(f: (TK: number) => number, lo: number, hi: number): InverseAnswer {
  const n = Math.max(2, Math.ceil((hi - lo) / SCAN_STEP_K));
  const step = (hi - lo) / n;
  const T = (i: number): number => (i === n ? hi : lo + i * step);
  let first = -1;
  let last = -1;
  let minI = 0;
  let minF = Infinity;
  for (let i = 0; i <= n; i++) {
    const v = f(T(i));
    if (v < 0) {
      if (first < 0) first = i;
      last = i;
    }
    if (v < minF) {
      minF = v;
      minI = i;
    }
  }
  let dipLo = -1;
  let dipHi = -1;
  let dipAt = NaN;
  if (first < 0) {
    // No scan point below: a dip may still hide between the lowest point and its neighbours.
    const a = T(Math.max(0, minI - 1));
    const b = T(Math.min(n, minI + 1));
    dipAt = goldenMin(f, a, b);
    if (!(f(dipAt) < 0)) return { status: 'above-throughout', ...NOWHERE };
    dipLo = a;
    dipHi = b;
  }
  // E falls and then rises, so below at both ends means below in between.
  if (first === 0 && last === n) return { status: 'below-throughout', value: null, below: [lo, hi], iterations: 0, residual: 0 };
  let iterations = 0;
  let residual = 0;
  const solve = (a: number, b: number): number => {
    const r = solveBracket(f, a, b);
    iterations += r.iterations;
    residual = Math.max(residual, r.residual);
    return r.root;
  };
  const from = first < 0 ? solve(dipLo, dipAt) : first === 0 ? null : solve(T(first - 1), T(first));
  const to = first < 0 ? solve(dipAt, dipHi) : last === n ? null : solve(T(last), T(last + 1));
  if (to === null) {
    if (from === null) return { status: 'below-throughout', value: null, below: [lo, hi], iterations: 0, residual: 0 };
    return { status: 'found', value: from, below: [from, hi], iterations, residual };
  }
  return { status: 'below-between', value: from, below: [from ?? lo, to], iterations, residual };
}

/**
 * Highest temperature (K) up to which E(t, T) >= required (MPa) for the time t (s), from the cold end
 * of the range. 'below-throughout': softer everywhere from -150 degC (pure WLF: just above its
 * singularity) to 500 degC; 'above-throughout': stiffer everywhere; 'below-between': a crosslinked
 * network softer only over `below` (it stiffens again as it warms).
 */
export function maxTemperatureK(m: Material, requiredMPa: number, tS: number): InverseAnswer {
  requirePositive(requiredMPa, 'required_modulus');
  requirePositive(tS, 'time');
  const logReq = Math.log10(requiredMPa);
  const f = (TK: number): number => logE(modulusMPa(m, tS, TK)) - logReq;
  const [lo, hi] = searchRangeK(m);
  // A network's E(T) falls through the glass transition and then rises with 3 rho R T / Mc.
  if (m.kind === 'crosslinked') return belowSetOfNetwork(f, lo, hi);
  if (f(hi) >= 0) return { status: 'above-throughout', ...NOWHERE };
  if (f(lo) < 0) return { status: 'below-throughout', value: null, below: [lo, hi], iterations: 0, residual: 0 };
  const r = solveBracket(f, lo, hi);
  return { status: 'found', value: r.root, below: [r.root, hi], iterations: r.iterations, residual: r.residual };
}

/**
 * Longest time (s) for which E(t, T) >= required (MPa) at temperature T (K); E is non-increasing in t
 * for every kind (the network's rise is with T, not t). 'above-throughout': still stiffer after 100
 * years; 'below-throughout': softer already at 1 ms.
 */
export function maxTimeS(m: Material, requiredMPa: number, TK: number): InverseAnswer {
  requirePositive(requiredMPa, 'required_modulus');
  requirePositive(TK, 'temperature');
  const logReq = Math.log10(requiredMPa);
  const f = (logT: number): number => logE(modulusMPa(m, 10 ** logT, TK)) - logReq;
  const [tLo, tHi] = TIME_SEARCH_S;
  const lo = Math.log10(tLo);
  const hi = Math.log10(tHi);
  if (f(hi) >= 0) return { status: 'above-throughout', ...NOWHERE };
  if (f(lo) < 0) return { status: 'below-throughout', value: null, below: [tLo, tHi], iterations: 0, residual: 0 };
  const r = solveBracket(f, lo, hi);
  const t = 10 ** r.root;
  return { status: 'found', value: t, below: [t, tHi], iterations: r.iterations, residual: r.residual };
}

/**
 * Apparent Tg (K) at a time scale t (s): the temperature at which the glass-transition relaxation time
 * equals t, i.e. a_T(T) = t / tauTg. It equals Tg at t = tauTg. Null where the shift law cannot reach
 * it; not limited to the model's range (apparentTg is).
 */
export function apparentTgK(m: Material, tS: number): number | null {
  requirePositive(tS, 'time');
  return temperatureForShiftK(m.shift, Math.log10(tS / m.tauTg));
}

/**
 * found: inside the model's range; above-range / below-range: the shift law puts it above 500 degC
 * (or cannot reach so short a time) or below -150 degC (or cannot reach so long a time).
 */
export type ApparentTgStatus = 'found' | 'above-range' | 'below-range';

export interface ApparentTgAnswer {
  readonly status: ApparentTgStatus;
  /** Apparent Tg, K, inside the model's range; null otherwise. */
  readonly valueK: number | null;
  /** What the shift law gives, K, even outside the range; null where it has no answer. */
  readonly lawK: number | null;
}

/** Apparent Tg at a time scale t (s), inside the model's temperature range or an explicit status. */
export function apparentTg(m: Material, tS: number): ApparentTgAnswer {
  const lawK = apparentTgK(m, tS);
  const [lo, hi] = TEMP_SEARCH_K;
  if (lawK === null) return { status: tS < m.tauTg ? 'above-range' : 'below-range', valueK: null, lawK };
  if (lawK > hi) return { status: 'above-range', valueK: null, lawK };
  if (lawK < lo) return { status: 'below-range', valueK: null, lawK };
  return { status: 'found', valueK: lawK, lawK };
}

/** log10 a_T of the material at T (K), relative to its Tg. */
export function materialShiftLog10(m: Material, TK: number): number {
  return shiftLog10(m.shift, TK);
}
