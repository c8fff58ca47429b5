/**
 * Relaxation to creep: the creep compliance D(t) and the apparent creep modulus 1/D(t) of a material
 * whose model gives the relaxation modulus E(t).
 *
 * Two routes, both from Schapery and Park (Int. J. Solids Struct. 36 (1999), Part I 1653 and Part II
 * 1677; from memory):
 *  - Prony route (creepModulusMPa): fit a Prony series to E(t) at the temperature over one window of
 *    times per temperature (from before the glass transition there to beyond 100 years), then convert it
 *    exactly (prony.ts). Valid in every region, including terminal flow where D grows like t / eta.
 *  - Local power law: where E(t) is locally E1 t^-n, E(t) D(t) = sin(n pi) / (n pi)
 *    (= 1 / (Gamma(1 - n) Gamma(1 + n)), exact for a pure power law; derived from the Laplace
 *    transform), with n = -d log E / d log t taken at t. Cheap; accurate where the slope varies slowly.
 * Always E(t) <= 1/D(t): a material creeps more slowly than it relaxes (E(t) D(t) <= 1).
 */
import { InputError } from '../base/errors.js';
import { evaluateReduced, modulusMPa, type Material } from '../material/model.js';
import { complianceAt, fitProny, pronyCreepCompliance, type CreepCompliance } from '../material/prony.js';
import { shiftLog10 } from '../material/shift.js';
import { creepRate } from '../material/model.js';
import { MODEL_TIME_S } from '../base/units.js';

/** E(t) D(t) of a pure power law E = E1 t^-n: sin(n pi) / (n pi) (closed form). */
export function powerLawProduct(n: number): number {
  if (!(n >= 0 && n < 1)) throw new InputError('n', `the power-law exponent must be in [0, 1), got ${n}`);
  if (n < 1e-8) return 1 - (n * Math.PI) ** 2 / 6;
  return Math.sin(n * Math.PI) / (n * Math.PI);
}

/** Relative step of the clocks for the local log-log slope. */
const SLOPE_STEP = 1.02;

/**
 * Local log-log slope n = -d ln E / d ln t of the isothermal relaxation curve, at accumulated clocks
 * (xi, theta) and temperature T (K): both clocks scaled together, as time is at constant temperature.
 */
export function localSlopeAtClocks(m: Material, xi: number, theta: number, TK: number, E0?: number): number {
  if (E0 !== undefined) {
    // Forward difference from a modulus already known at the clocks (one evaluation instead of two).
    const E2 = evaluateReduced(m, xi * SLOPE_STEP, theta * SLOPE_STEP, TK).modulusMPa;
    if (!(E0 > 0) || !(E2 > 0)) return 1;
    return Math.max(0, Math.log(E0 / E2) / Math.log(SLOPE_STEP));
  }
  const E1 = evaluateReduced(m, xi / SLOPE_STEP, theta / SLOPE_STEP, TK).modulusMPa;
  const E2 = evaluateReduced(m, xi * SLOPE_STEP, theta * SLOPE_STEP, TK).modulusMPa;
  if (!(E1 > 0) || !(E2 > 0)) return 1;
  return Math.max(0, Math.log(E1 / E2) / (2 * Math.log(SLOPE_STEP)));
}

/** Local log-log slope of E(t) at time t (s) and temperature T (K). */
export function localSlope(m: Material, tS: number, TK: number): number {
  const xi = tS / 10 ** shiftLog10(m.shift, TK);
  const theta = tS * creepRate(m, TK);
  return localSlopeAtClocks(m, xi, theta, TK);
}

/**
 * Apparent creep modulus (MPa) by the local power law, 1/D = E(t) n pi / sin(n pi). Throws where the
 * local slope reaches 1 (there the approximation has no meaning; use creepModulusMPa).
 */
export function creepModulusPowerLawMPa(m: Material, tS: number, TK: number): number {
  const n = localSlope(m, tS, TK);
  if (n >= 1) {
    throw new InputError(
      'time',
      `the local log-log slope of the relaxation curve is ${n.toFixed(2)} >= 1 here; the power-law route does not apply`,
    );
  }
  return modulusMPa(m, tS, TK) / powerLawProduct(n);
}

/** Decades of time below the shortest time of the model (1 ms) that the Prony route fits at least. */
export const CREEP_WINDOW_DECADES_BELOW = 2;
/** Decades above the longest time asked (at least the model's 100 years) that the fit extends to, so the series is well determined there. */
export const CREEP_WINDOW_DECADES_ABOVE = 1;
/** Decades before the glass transition (and the slow-creep clock) at T that the window starts, so that a hot material's fast relaxation is inside it. */
export const CREEP_WINDOW_DECADES_BEFORE_TRANSITION = 4;
/** Sampling of the relaxation curve, points per decade, and relaxation times per decade of the Prony route. */
export const CREEP_POINTS_PER_DECADE = 6;
export const CREEP_TERMS_PER_DECADE = 2;
/** Creep compliances kept per material (one per temperature asked), so that repeated calls at one temperature fit once. */
const CACHE_PER_MATERIAL = 32;

const complianceCache = new WeakMap<Material, Map<string, CreepCompliance>>();

/** The fitting window at T (K), log10 s: from before the glass transition (and slow creep) to beyond tMax (s) and 100 years. */
function windowLog10(m: Material, tMaxS: number, TK: number, log10aT: number): [number, number] {
  const hi = Math.ceil(Math.log10(Math.max(tMaxS, MODEL_TIME_S[1]))) + CREEP_WINDOW_DECADES_ABOVE;
  const transition = Math.log10(m.tauTg) + log10aT;
  const creepClock = m.creepN > 0 ? -Math.log10(creepRate(m, TK)) : Infinity;
  const early = Math.min(transition, creepClock) - CREEP_WINDOW_DECADES_BEFORE_TRANSITION;
  const lo = Math.floor(Math.max(-300, Math.min(Math.log10(MODEL_TIME_S[0]) - CREEP_WINDOW_DECADES_BELOW, early)));
  return [lo, hi];
}

/**
 * Creep compliance of the material at temperature T (K), valid from the instantaneous response to
 * beyond tMax (s). The window of the fit depends on T only (and on tMax when it exceeds the model's 100
 * years), not on the time asked, so that 1/D from one fitted series is non-increasing in t.
 */
export function creepComplianceAtTemperature(m: Material, tMaxS: number, TK: number): CreepCompliance {
  if (!(tMaxS > 0) || !Number.isFinite(tMaxS)) throw new InputError('time', `must be a positive finite time, got ${tMaxS}`);
  const log10aT = shiftLog10(m.shift, TK);
  if (m.prony) {
    // Exact for a Prony material: its series shifted to T.
    const a = 10 ** log10aT;
    return pronyCreepCompliance({ EinfMPa: m.prony.EinfMPa, terms: m.prony.terms.map((t) => ({ EMPa: t.EMPa, tauS: t.tauS * a })) });
  }
  const [lo, hi] = windowLog10(m, tMaxS, TK, log10aT);
  const key = `${TK}|${hi}`;
  let cache = complianceCache.get(m);
  const hit = cache?.get(key);
  if (hit) return hit;
  // Relaxation before the window's start is taken as instantaneous; the window's first point then carries it.
  const count = Math.round((hi - lo) * CREEP_POINTS_PER_DECADE) + 1;
  const times: number[] = [];
  const moduli: number[] = [];
  for (let i = 0; i < count; i++) {
    const t = 10 ** (lo + ((hi - lo) * i) / (count - 1));
    const E = modulusMPa(m, t, TK);
    // A melt relaxes to nothing; points below 1e-9 of the start carry no information for D(t).
    if (E > 1e-9 * (moduli[0] ?? E) && E > 0) {
      times.push(t);
      moduli.push(E);
    }
  }
  const flowed = moduli.length < count;
  // Once a melt has relaxed to nothing no longer relaxation time is needed; the viscosity sum_i E_i tau_i is set by then.
  const last = times[times.length - 1] ?? 10 ** hi;
  const fit = fitProny(times, moduli, {
    termsPerDecade: CREEP_TERMS_PER_DECADE,
    tauMinS: 10 ** lo,
    tauMaxS: flowed ? Math.min(10 ** hi, last * 10) : 10 ** hi,
    withEinf: !flowed,
  });
  const d = pronyCreepCompliance(fit.prony);
  if (!cache) {
    cache = new Map();
    complianceCache.set(m, cache);
  }
  if (cache.size >= CACHE_PER_MATERIAL) cache.delete(cache.keys().next().value ?? '');
  cache.set(key, d);
  return d;
}

/**
 * Largest local log-log slope of E over the whole window at T for which the cheap power-law route is
 * used at every time at that temperature: with n <= 0.1 everywhere, E D lies between
 * sin(0.1 pi)/(0.1 pi) = 0.984 and 1, and the local rule removes most of that (the two routes agree to
 * 0.1 % in the tests). The route is chosen per temperature, never per time, so that 1/D stays
 * non-increasing in t: there 1/D = E / p(n) falls while dn / d ln t stays below 3 / pi^2.
 */
export const FLAT_SLOPE = 0.1;

/** True when E(t) at T (K) is flat (slope <= FLAT_SLOPE) over the whole fitting window for the time t (s). */
function isFlatAt(m: Material, tS: number, TK: number): boolean {
  const [lo, hi] = windowLog10(m, tS, TK, shiftLog10(m.shift, TK));
  let prev = Math.log10(modulusMPa(m, 10 ** lo, TK));
  for (let u = lo + 0.5; u <= hi + 1e-9; u += 0.5) {
    const cur = Math.log10(modulusMPa(m, 10 ** u, TK));
    if (!Number.isFinite(cur) || (prev - cur) / 0.5 > FLAT_SLOPE) return false;
    prev = cur;
  }
  return true;
}

/**
 * Creep compliance D(t) in 1/MPa at time t (s) and temperature T (K): the local power law where E is
 * flat at T, else the Prony route. For a linear viscoelastic solid E(t) D(t) <= 1, i.e. 1/D(t) >= E(t)
 * (Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 3; Tschoegl, The Phenomenological
 * Theory of Linear Viscoelastic Behavior, 1989): where a fitted series' small error would break that
 * bound, the bound 1/E(t) is used. Both D of one fitted series and 1/E(t) rise with t, so the result does too.
 */
export function creepComplianceMPa(m: Material, tS: number, TK: number): number {
  if (!(tS > 0) || !Number.isFinite(tS)) throw new InputError('time', `must be a positive finite time, got ${tS}`);
  const E = modulusMPa(m, tS, TK);
  if (!m.prony && isFlatAt(m, tS, TK)) return powerLawProduct(localSlope(m, tS, TK)) / E;
  const D = complianceAt(creepComplianceAtTemperature(m, tS, TK), tS);
  return Math.min(D, 1 / E);
}

/**
 * Apparent creep modulus 1/D(t) (MPa) at time t (s) under constant stress applied at t = 0 and
 * constant temperature T (K): the stress divided by the creep strain. At least the relaxation modulus
 * E(t), non-increasing in t.
 */
export function creepModulusMPa(m: Material, tS: number, TK: number): number {
  return 1 / creepComplianceMPa(m, tS, TK);
}
