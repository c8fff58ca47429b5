/**
 * Relaxation to creep: the creep compliance D(t) and the apparent creep modulus 1/D(t) of a material
 * whose model gives the relaxation modulus E(t).
 *
 * Two routes, both from Schapery and Park (Int. J. Solids Struct. 36 (1999), Part I 1653 and Part II
 * 1677; from memory):
 *  - Prony route (the default of creepModulusMPa): fit a Prony series to E(t) at the temperature over
 *    the times that matter (all t' <= t), then convert it exactly (prony.ts). Valid in every region,
 *    including terminal flow where D grows like t / eta.
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

/** Decades of time below t that the Prony route fits (relaxation faster than this counts as instantaneous). */
export const CREEP_WINDOW_DECADES_BELOW = 10;
/** Decades above t that the fit extends to, so that the series is well determined at t itself. */
export const CREEP_WINDOW_DECADES_ABOVE = 1;
/** Sampling of the relaxation curve, points per decade, and relaxation times per decade of the Prony route. */
export const CREEP_POINTS_PER_DECADE = 6;
export const CREEP_TERMS_PER_DECADE = 2;

/** Creep compliance of the material at temperature T (K), valid for times up to about tMax (s). */
export function creepComplianceAtTemperature(m: Material, tMaxS: number, TK: number): CreepCompliance {
  if (!(tMaxS > 0) || !Number.isFinite(tMaxS)) throw new InputError('time', `must be a positive finite time, got ${tMaxS}`);
  if (m.prony) {
    // Exact for a Prony material: its series shifted to T.
    const a = 10 ** shiftLog10(m.shift, TK);
    return pronyCreepCompliance({ EinfMPa: m.prony.EinfMPa, terms: m.prony.terms.map((t) => ({ EMPa: t.EMPa, tauS: t.tauS * a })) });
  }
  const lo = Math.log10(tMaxS) - CREEP_WINDOW_DECADES_BELOW;
  const hi = Math.log10(tMaxS) + CREEP_WINDOW_DECADES_ABOVE;
  const count = Math.round((hi - lo) * CREEP_POINTS_PER_DECADE) + 1;
  const times: number[] = [];
  const moduli: number[] = [];
  for (let i = 0; i < count; i++) {
    const t = 10 ** (lo + ((hi - lo) * i) / (count - 1));
    const E = modulusMPa(m, t, TK);
    // A melt relaxes to nothing; points below 1e-9 of the start carry no information for D(t).
    if (E > 1e-9 * (moduli[0] ?? E)) {
      times.push(t);
      moduli.push(E);
    }
  }
  const fit = fitProny(times, moduli, {
    termsPerDecade: CREEP_TERMS_PER_DECADE,
    tauMinS: 10 ** lo,
    tauMaxS: 10 ** hi,
    withEinf: moduli.length === count,
  });
  return pronyCreepCompliance(fit.prony);
}

/**
 * Largest local log-log slope of E at which the cheap power-law route is used instead of the Prony
 * route: with n <= 0.1 everywhere up to t, E D lies between sin(0.1 pi)/(0.1 pi) = 0.984 and 1, so even
 * 1/E is within 1.6 %, and the local rule removes most of that (the two routes agree to 0.1 % in the tests).
 */
export const FLAT_SLOPE = 0.1;

/** Creep compliance D(t) in 1/MPa at time t (s) and temperature T (K). */
export function creepComplianceMPa(m: Material, tS: number, TK: number): number {
  if (!(tS > 0) || !Number.isFinite(tS)) throw new InputError('time', `must be a positive finite time, got ${tS}`);
  if (!m.prony && isFlatUpTo(m, tS, TK)) return powerLawProduct(localSlope(m, tS, TK)) / modulusMPa(m, tS, TK);
  return complianceAt(creepComplianceAtTemperature(m, tS, TK), tS);
}

function isFlatUpTo(m: Material, tS: number, TK: number): boolean {
  const lo = Math.log10(tS) - CREEP_WINDOW_DECADES_BELOW;
  const steps = CREEP_WINDOW_DECADES_BELOW * 2;
  let prev = Math.log10(modulusMPa(m, 10 ** lo, TK));
  for (let i = 1; i <= steps; i++) {
    const cur = Math.log10(modulusMPa(m, 10 ** (lo + i / 2), TK));
    if (!Number.isFinite(cur) || (prev - cur) / 0.5 > FLAT_SLOPE) return false;
    prev = cur;
  }
  return localSlope(m, tS, TK) <= FLAT_SLOPE;
}

/**
 * Apparent creep modulus 1/D(t) (MPa) at time t (s) under constant stress applied at t = 0 and
 * constant temperature T (K): the stress divided by the creep strain. Prony route.
 */
export function creepModulusMPa(m: Material, tS: number, TK: number): number {
  return 1 / creepComplianceMPa(m, tS, TK);
}
