/**
 * Prony series (generalized Maxwell model): E(t) = E_inf + sum_i E_i exp(-t / tau_i), its fit to a
 * relaxation curve by non-negative least squares, and its exact creep compliance.
 *
 * Fit: tau_i log-spaced (one per decade by default), weights E_inf, E_i >= 0 by non-negative least
 * squares (Lawson and Hanson 1974) with each row divided by the measured modulus, so that the fit is a
 * least-squares fit of the relative error (to first order the error in log modulus).
 *
 * Creep compliance (derived here, closed form): with rho_i = 1/tau_i, the Laplace transform gives
 * s E(s) = H(s) = E_inf + sum_i E_i s / (s + rho_i) and D(s) = 1 / (s H(s)). H(-x) falls monotonically
 * between consecutive rho_i, so it has exactly one root lambda_k in each gap (and one in (0, rho_min)
 * when E_inf > 0): these are the retardation rates. By residues,
 *   E_inf > 0: D(t) = 1/E_inf - sum_k exp(-lambda_k t) / (lambda_k H'(-lambda_k))
 *   E_inf = 0: D(t) = t/eta + sum_i E_i tau_i^2 / eta^2 - sum_k exp(-lambda_k t) / (lambda_k H'(-lambda_k)),
 *              eta = sum_i E_i tau_i,
 * with H'(s) = sum_i E_i rho_i / (s + rho_i)^2. A single Maxwell element gives D = (1 + t/tau)/E0.
 * This is the Prony route to interconversion (Park and Schapery, Int. J. Solids Struct. 36 (1999) 1653,
 * from memory), done here exactly instead of by collocation.
 */
import { InputError, SolverError } from '../base/errors.js';
import { nnls } from '../numeric/nnls.js';
import { brentRoot } from '../numeric/roots.js';
import { maxOf, minOf } from '../numeric/arrays.js';

/** One Maxwell element: modulus E (MPa) and relaxation time tau (s). */
export interface PronyTerm {
  readonly EMPa: number;
  readonly tauS: number;
}

/** A Prony series at its reference temperature. */
export interface PronySeries {
  readonly EinfMPa: number;
  readonly terms: readonly PronyTerm[];
}

/** Relaxation modulus (MPa) of a Prony series at time t (s). */
export function pronyModulusMPa(p: PronySeries, tS: number): number {
  let E = p.EinfMPa;
  for (const term of p.terms) E += term.EMPa * Math.exp(-tS / term.tauS);
  return E;
}

/** Instantaneous (glassy) modulus E_inf + sum E_i, MPa. */
export function pronyGlassyMPa(p: PronySeries): number {
  return p.terms.reduce((s, t) => s + t.EMPa, p.EinfMPa);
}

/** Storage modulus E'(omega) (MPa) of a Prony series at angular frequency omega (rad/s). */
export function pronyStorageMPa(p: PronySeries, omega: number): number {
  let E = p.EinfMPa;
  for (const t of p.terms) {
    const w = (omega * t.tauS) ** 2;
    E += (t.EMPa * w) / (1 + w);
  }
  return E;
}

/** One retardation element of a creep compliance, D_k (1/MPa) with retardation time (s). */
export interface RetardationTerm {
  readonly DPerMPa: number;
  readonly lambdaS: number;
}

/**
 * Creep compliance of a Prony series in the form D(t) = D_inf + t/eta - sum_k D_k exp(-t / lambda_k):
 * D_inf (1/MPa) is the long-time compliance of a solid (or the constant term with flow),
 * eta (MPa s) the viscosity (Infinity for a solid).
 */
export interface CreepCompliance {
  readonly DinfPerMPa: number;
  readonly etaMPaS: number;
  readonly terms: readonly RetardationTerm[];
}

/** Exact creep compliance of a Prony series (see the file comment). Terms with zero weight are dropped. */
export function pronyCreepCompliance(p: PronySeries): CreepCompliance {
  const live = p.terms.filter((t) => t.EMPa > 0).sort((a, b) => b.tauS - a.tauS);
  if (p.EinfMPa < 0 || live.some((t) => !(t.tauS > 0) || !Number.isFinite(t.EMPa))) {
    throw new InputError('prony', 'needs E_inf >= 0, E_i >= 0 and tau_i > 0');
  }
  if (p.EinfMPa === 0 && live.length === 0) throw new InputError('prony', 'has no stiffness at all (E_inf and every E_i are zero)');
  const rho = live.map((t) => 1 / t.tauS); // ascending
  const E = live.map((t) => t.EMPa);
  const H = (x: number): number => {
    let h = p.EinfMPa;
    for (let i = 0; i < rho.length; i++) h -= ((E[i] ?? 0) * x) / ((rho[i] ?? 0) - x);
    return h;
  };
  const dH = (x: number): number => {
    let d = 0;
    for (let i = 0; i < rho.length; i++) d += ((E[i] ?? 0) * (rho[i] ?? 0)) / ((rho[i] ?? 0) - x) ** 2;
    return d;
  };
  const roots: number[] = [];
  const solveIn = (a: number, b: number): void => {
    // Work in log x: the gap spans about a decade and H has poles at both ends.
    const r = brentRoot((u) => H(Math.exp(u)), Math.log(a), Math.log(b), 1e-13);
    if (!r.converged)
      throw new SolverError(`retardation time not found between ${1 / b} and ${1 / a} s (${r.reason})`, r.iterations, r.residual);
    roots.push(Math.exp(r.root));
  };
  const pad = 1e-12;
  if (p.EinfMPa > 0 && rho.length > 0) {
    // H(-x) = E_inf > 0 at x = 0 and tends to -infinity at rho_min: step down until H is positive.
    let a = (rho[0] ?? 1) * 1e-3;
    while (H(a) <= 0 && a > 1e-300) a *= 1e-3;
    solveIn(a, (rho[0] ?? 1) * (1 - pad));
  }
  for (let k = 0; k + 1 < rho.length; k++) solveIn((rho[k] ?? 1) * (1 + pad), (rho[k + 1] ?? 1) * (1 - pad));
  const terms: RetardationTerm[] = roots.map((lam) => ({ DPerMPa: 1 / (lam * dH(lam)), lambdaS: 1 / lam }));
  if (p.EinfMPa > 0) return { DinfPerMPa: 1 / p.EinfMPa, etaMPaS: Infinity, terms };
  const eta = live.reduce((s, t) => s + t.EMPa * t.tauS, 0);
  const c = live.reduce((s, t) => s + t.EMPa * t.tauS ** 2, 0) / eta ** 2;
  return { DinfPerMPa: c, etaMPaS: eta, terms };
}

/** Creep compliance (1/MPa) at time t (s). */
export function complianceAt(d: CreepCompliance, tS: number): number {
  let D = d.DinfPerMPa + (Number.isFinite(d.etaMPaS) ? tS / d.etaMPaS : 0);
  for (const k of d.terms) D -= k.DPerMPa * Math.exp(-tS / k.lambdaS);
  return D;
}

/** Options of a Prony fit. */
export interface PronyFitOptions {
  /** Relaxation times per decade (default 1). */
  readonly termsPerDecade?: number;
  /** Shortest and longest relaxation time, s (default: the decades that enclose the data). */
  readonly tauMinS?: number;
  readonly tauMaxS?: number;
  /** Fit a long-time modulus E_inf (default true). */
  readonly withEinf?: boolean;
}

/** A fitted Prony series with its quality. */
export interface PronyFit {
  readonly prony: PronySeries;
  /** Root mean square of log10(E_fit / E_data), decades. */
  readonly rmsLog10: number;
  /** Largest |log10(E_fit / E_data)|, decades. */
  readonly maxLog10: number;
  readonly points: number;
  readonly quality: FitQuality;
}

export type FitQuality = 'good' | 'fair' | 'poor';

/** Quality of a fit from its RMS error in log10 modulus: good <= 0.02 decades (about 5 %), fair <= 0.05 (12 %). */
export function qualityFromRmsLog10(rms: number): FitQuality {
  return rms <= 0.02 ? 'good' : rms <= 0.05 ? 'fair' : 'poor';
}

/** Fits a Prony series to a relaxation curve (times s, moduli MPa, same length, all positive). */
export function fitProny(timesS: readonly number[], moduliMPa: readonly number[], options: PronyFitOptions = {}): PronyFit {
  const n = timesS.length;
  if (moduliMPa.length !== n) throw new InputError('moduli', `has ${moduliMPa.length} values for ${n} times`);
  if (n < 3) throw new InputError('data', `a Prony fit needs at least 3 points, got ${n}`);
  for (let i = 0; i < n; i++) {
    const t = timesS[i] ?? NaN;
    const e = moduliMPa[i] ?? NaN;
    if (!(t > 0) || !Number.isFinite(t)) throw new InputError('time', `point ${i + 1}: a time must be positive and finite, got ${t}`);
    if (!(e > 0) || !Number.isFinite(e)) throw new InputError('modulus', `point ${i + 1}: a modulus must be positive and finite, got ${e}`);
  }
  const perDecade = options.termsPerDecade ?? 1;
  if (!(perDecade > 0 && perDecade <= 10)) throw new InputError('termsPerDecade', `must be between 0 and 10, got ${perDecade}`);
  const lo = Math.log10(minOf(timesS));
  const hi = Math.log10(maxOf(timesS));
  const a = options.tauMinS !== undefined ? Math.log10(options.tauMinS) : Math.floor(lo);
  const b = options.tauMaxS !== undefined ? Math.log10(options.tauMaxS) : Math.ceil(hi);
  if (!(b >= a)) throw new InputError('tauMax', 'must not be below tauMin');
  const count = Math.max(1, Math.round((b - a) * perDecade) + 1);
  const taus = Array.from({ length: count }, (_, i) => 10 ** (count === 1 ? a : a + ((b - a) * i) / (count - 1)));
  const withEinf = options.withEinf ?? true;
  const A = timesS.map((t, k) => {
    const w = 1 / (moduliMPa[k] ?? 1);
    const row = taus.map((tau) => w * Math.exp(-t / tau));
    return withEinf ? [w, ...row] : row;
  });
  const r = nnls(
    A,
    moduliMPa.map(() => 1),
  );
  const EinfMPa = withEinf ? (r.x[0] ?? 0) : 0;
  const weights = withEinf ? r.x.slice(1) : r.x;
  const prony: PronySeries = { EinfMPa, terms: taus.map((tauS, i) => ({ tauS, EMPa: weights[i] ?? 0 })) };
  let sum = 0;
  let max = 0;
  for (let k = 0; k < n; k++) {
    const e = Math.log10(pronyModulusMPa(prony, timesS[k] ?? 1) / (moduliMPa[k] ?? 1));
    const d = Number.isFinite(e) ? e : Infinity;
    sum += d * d;
    max = Math.max(max, Math.abs(d));
  }
  const rmsLog10 = Math.sqrt(sum / n);
  return { prony, rmsLog10, maxLog10: max, points: n, quality: qualityFromRmsLog10(rmsLog10) };
}
