/**
 * Master curve from curves at several temperatures (time-temperature superposition), the shift law
 * fitted to the shifts, and a Prony series fitted to the master curve: a material every function takes.
 *
 * Shifting: each curve is moved along log t against its nearest already-placed neighbour in
 * temperature; its log a_T minimizes the mean square difference in log modulus over the points that
 * overlap the neighbour after the shift (the neighbour interpolated linearly in log-log). A coarse scan
 * of log a_T (SHIFT_SCAN_STEP) finds the basin, golden-section search refines it. Horizontal shifts
 * only (the small vertical factor rho T / rho0 T0 is neglected). Master-curve construction by overlap
 * is common practice (Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 11, from memory).
 * WLF (Williams, Landel, Ferry 1955) is fitted to the shifts at and above Tg, Arrhenius below, joined
 * continuously at Tg.
 */
import { InputError, ParameterError } from '../base/errors.js';
import { fitProny, pronyCreepCompliance, complianceAt, qualityFromRmsLog10, type FitQuality, type PronySeries } from '../material/prony.js';
import { nnls } from '../numeric/nnls.js';
import { maxOf, minOf } from '../numeric/arrays.js';
import { brentRoot } from '../numeric/roots.js';
import { compilePronyMaterial, type PronyMaterialSpec } from '../material/pronymaterial.js';
import { fieldSpec } from '../material/params.js';
import type { Curve, CurveSet } from './testdata.js';
import { fitShiftLaw, type CurveShift, type ShiftLawFit } from './shiftlaw.js';
import { KELVIN_OFFSET } from '../base/units.js';
import { temperatureValue } from '../base/display.js';

/** Step of the coarse scan of log10 a_T, decades. */
export const SHIFT_SCAN_STEP = 0.02;
/** Fewest points of a curve that must overlap its neighbour, and the smallest overlapping share of the curve. */
export const MIN_OVERLAP_POINTS = 3;
export const MIN_OVERLAP_SHARE = 0.2;
/** Fewest curves for a master curve. */
export const MIN_CURVES = 2;
/** Most Prony terms per decade tried when one per decade is not enough. */
export const AUTO_MAX_TERMS_PER_DECADE = 4;
export interface MasterPoint {
  /** Reduced time t / a_T at the reference temperature, s. */
  readonly reducedTimeS: number;
  readonly modulusMPa: number;
  readonly temperatureK: number;
}

function interp(xs: readonly number[], ys: readonly number[], x: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((xs[mid] ?? 0) <= x) lo = mid;
    else hi = mid;
  }
  const x0 = xs[lo] ?? 0;
  const x1 = xs[hi] ?? 0;
  const f = x1 === x0 ? 0 : (x - x0) / (x1 - x0);
  return (ys[lo] ?? 0) + f * ((ys[hi] ?? 0) - (ys[lo] ?? 0));
}

/** Shift s (log10) of curve `cur` against `ref`: cur(t) = ref(t / 10^s). */
function pairShift(cur: Curve, ref: Curve): { s: number; overlap: number; rms: number } {
  const x = cur.timesS.map(Math.log10);
  const y = cur.moduliMPa.map(Math.log10);
  const X = ref.timesS.map(Math.log10);
  const Y = ref.moduliMPa.map(Math.log10);
  const Xmin = X[0] ?? 0;
  const Xmax = X[X.length - 1] ?? 0;
  const need = Math.max(MIN_OVERLAP_POINTS, Math.ceil(MIN_OVERLAP_SHARE * x.length));
  // A horizontal shift leaves the moduli where they are: the curves must share a range of modulus.
  const Ylo = minOf(Y) - 0.02;
  const Yhi = maxOf(Y) + 0.02;
  const inRange = y.filter((v) => v >= Ylo && v <= Yhi).length;
  if (inRange < need) {
    throw new InputError(
      'data',
      `the curves at ${temperatureValue(cur.temperatureK - KELVIN_OFFSET)} and ${temperatureValue(ref.temperatureK - KELVIN_OFFSET)} degC cannot be overlapped: only ${inRange} points of the first lie in the modulus range of the second (${need} needed); add a curve between them or extend the times`,
    );
  }
  const objective = (s: number): { f: number; n: number } => {
    let sum = 0;
    let n = 0;
    for (let k = 0; k < x.length; k++) {
      const u = (x[k] ?? 0) - s;
      if (u < Xmin || u > Xmax) continue;
      const d = (y[k] ?? 0) - interp(X, Y, u);
      sum += d * d;
      n++;
    }
    return { f: n >= need ? sum / n : Infinity, n };
  };
  const lo = (x[0] ?? 0) - Xmax;
  const hi = (x[x.length - 1] ?? 0) - Xmin;
  let best = NaN;
  let bestF = Infinity;
  for (let s = lo; s <= hi; s += SHIFT_SCAN_STEP) {
    const { f } = objective(s);
    if (f < bestF) {
      bestF = f;
      best = s;
    }
  }
  if (!Number.isFinite(bestF)) {
    throw new InputError(
      'data',
      `the curves at ${temperatureValue(cur.temperatureK - KELVIN_OFFSET)} and ${temperatureValue(ref.temperatureK - KELVIN_OFFSET)} degC cannot be overlapped on ${need} points or more in log-log; they need a common range of modulus (add a curve between them or extend the times)`,
    );
  }
  // Golden-section refinement in [best - step, best + step].
  let a = best - SHIFT_SCAN_STEP;
  let b = best + SHIFT_SCAN_STEP;
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = objective(c).f;
  let fd = objective(d).f;
  for (let i = 0; i < 40; i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = objective(c).f;
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = objective(d).f;
    }
  }
  const sMid = (a + b) / 2;
  const fin = objective(sMid);
  const use = fin.f <= bestF ? sMid : best;
  const o = objective(use);
  return { s: use, overlap: o.n, rms: Math.sqrt(o.f) };
}

/**
 * Shifts every curve to the temperature of one of them. Default: the median temperature of the curves
 * at or above Tg when Tg (K) is given and some curve is (the WLF part is referred to the reference, so
 * it must not lie below Tg), else the median of all.
 */
export function shiftCurves(set: CurveSet, referenceK?: number, TgK: number | null = null): { referenceK: number; shifts: CurveShift[] } {
  const curves = [...set.curves].sort((p, q) => p.temperatureK - q.temperatureK);
  if (curves.length < MIN_CURVES)
    throw new InputError('data', `a master curve needs curves at ${MIN_CURVES} or more temperatures, got ${curves.length}`);
  for (let i = 1; i < curves.length; i++) {
    if (Math.abs((curves[i]?.temperatureK ?? 0) - (curves[i - 1]?.temperatureK ?? 0)) < 1e-6) {
      throw new InputError(
        'data',
        `two curves have the same temperature ${temperatureValue((curves[i]?.temperatureK ?? 0) - KELVIN_OFFSET)} degC`,
      );
    }
  }
  const firstAbove = TgK === null ? 0 : curves.findIndex((c) => c.temperatureK >= TgK);
  const from = firstAbove < 0 ? 0 : firstAbove;
  let refIndex = from + Math.floor((curves.length - 1 - from) / 2);
  if (referenceK !== undefined) {
    refIndex = curves.findIndex((c) => Math.abs(c.temperatureK - referenceK) < 1e-6);
    if (refIndex < 0) {
      throw new InputError(
        'reference',
        `${temperatureValue(referenceK - KELVIN_OFFSET)} degC is not one of the curve temperatures (${curves.map((c) => temperatureValue(c.temperatureK - KELVIN_OFFSET)).join(', ')} degC)`,
      );
    }
  }
  const ref = curves[refIndex]!;
  const out = new Map<number, CurveShift>();
  out.set(refIndex, { temperatureK: ref.temperatureK, log10aT: 0, overlapPoints: 0, rmsLog10: 0, againstK: null });
  for (let i = refIndex + 1; i < curves.length; i++) place(i, i - 1);
  for (let i = refIndex - 1; i >= 0; i--) place(i, i + 1);
  function place(i: number, j: number): void {
    const cur = curves[i]!;
    const nb = curves[j]!;
    const r = pairShift(cur, nb);
    const base = out.get(j)?.log10aT ?? 0;
    out.set(i, {
      temperatureK: cur.temperatureK,
      log10aT: base + r.s,
      overlapPoints: r.overlap,
      rmsLog10: r.rms,
      againstK: nb.temperatureK,
    });
  }
  const shifts = curves.map((_, i) => out.get(i)!);
  return { referenceK: ref.temperatureK, shifts };
}

/** The master curve's points, sorted by reduced time. */
export function masterPoints(set: CurveSet, shifts: readonly CurveShift[]): MasterPoint[] {
  const pts: MasterPoint[] = [];
  for (const c of set.curves) {
    const s = shifts.find((x) => Math.abs(x.temperatureK - c.temperatureK) < 1e-9);
    if (!s) throw new Error('masterPoints: a curve has no shift');
    c.timesS.forEach((t, k) =>
      pts.push({ reducedTimeS: t / 10 ** s.log10aT, modulusMPa: c.moduliMPa[k] ?? NaN, temperatureK: c.temperatureK }),
    );
  }
  return pts.sort((a, b) => a.reducedTimeS - b.reducedTimeS);
}

/** Everything fitted from a set of curves. */
export interface CurveFit {
  readonly kind: CurveSet['kind'];
  readonly referenceK: number;
  readonly shifts: readonly CurveShift[];
  readonly master: readonly MasterPoint[];
  readonly shiftLaw: ShiftLawFit;
  readonly prony: PronySeries;
  /** RMS and largest |log10(model / data)| of the Prony series on the master curve, decades. */
  readonly pronyRmsLog10: number;
  readonly pronyMaxLog10: number;
  readonly pronyQuality: FitQuality;
  readonly termsPerDecade: number;
  /** The fitted material: pass it to any engine function. */
  readonly material: PronyMaterialSpec;
  /** Overall flag: the worst of the shifting, the shift law and the Prony fit. */
  readonly quality: FitQuality;
  readonly notes: readonly string[];
}

export interface CurveFitOptions {
  /** Reference temperature, K; must be one of the curve temperatures (default: the median one). */
  readonly referenceK?: number;
  /** Glass transition temperature, K: WLF at and above it, Arrhenius below. */
  readonly TgK?: number | null;
  /** Prony terms per decade (default 1). */
  readonly termsPerDecade?: number;
  readonly id?: string;
  readonly name?: string;
}

const RANK: Record<FitQuality, number> = { good: 0, fair: 1, poor: 2 };
function worst(...q: FitQuality[]): FitQuality {
  return q.reduce((a, b) => (RANK[b] > RANK[a] ? b : a), 'good' as FitQuality);
}

/** Master curve, shift law and Prony series from relaxation or creep curves. */
export function fitCurves(set: CurveSet, options: CurveFitOptions = {}): CurveFit {
  const tgSpec = fieldSpec('Tg_C');
  const TgK = options.TgK ?? null;
  if (TgK !== null && (!(TgK - KELVIN_OFFSET >= tgSpec.min) || !(TgK - KELVIN_OFFSET <= tgSpec.max))) {
    throw new InputError(
      'tg',
      `${Number((TgK - KELVIN_OFFSET).toPrecision(6))} degC is outside ${tgSpec.min} to ${tgSpec.max} degC (${tgSpec.description})`,
    );
  }
  const { referenceK, shifts } = shiftCurves(set, options.referenceK, TgK);
  const shiftLaw = fitShiftLaw(shifts, referenceK, TgK);
  const master = masterPoints(set, shifts);
  const notes = [...shiftLaw.notes];
  const times = master.map((p) => p.reducedTimeS);
  const moduli = master.map((p) => p.modulusMPa);
  // One term per decade unless asked otherwise; where that cannot follow a steep master curve
  // (RMS above the 'good' limit), up to AUTO_MAX_TERMS_PER_DECADE are tried and the first good one kept.
  const tries =
    options.termsPerDecade !== undefined ? [options.termsPerDecade] : Array.from({ length: AUTO_MAX_TERMS_PER_DECADE }, (_, i) => i + 1);
  let perDecade = tries[0] ?? 1;
  let best: { prony: PronySeries; rmsLog10: number; maxLog10: number } | null = null;
  for (const k of tries) {
    const fit = set.kind === 'relaxation' ? fitProny(times, moduli, { termsPerDecade: k }) : fitCreepToProny(times, moduli, k);
    if (!best || fit.rmsLog10 < best.rmsLog10) {
      best = fit;
      perDecade = k;
    }
    if (qualityFromRmsLog10(fit.rmsLog10) === 'good') break;
  }
  if (!best) throw new Error('fitCurves: no Prony fit');
  const prony = best.prony;
  const rms = best.rmsLog10;
  const max = best.maxLog10;
  if (options.termsPerDecade === undefined && perDecade > 1) {
    notes.push(`one Prony term per decade could not follow the master curve; ${perDecade} per decade were used`);
  }
  if (set.kind === 'creep') {
    notes.push('creep data: a retardation series was fitted to the compliance and converted exactly to the relaxation Prony series');
  }
  const shiftRms = Math.sqrt(shifts.reduce((s, x) => s + x.rmsLog10 ** 2, 0) / Math.max(1, shifts.length - 1));
  const shiftQuality = qualityFromRmsLog10(shiftRms);
  if (shiftQuality !== 'good')
    notes.push(
      `the curves overlap with an RMS mismatch of ${shiftRms.toFixed(3)} decades after shifting: check that the material is thermorheologically simple`,
    );
  const pronyQuality = qualityFromRmsLog10(rms);
  const material: PronyMaterialSpec = {
    id: options.id ?? 'fitted',
    name: options.name ?? `Prony fit of ${set.curves.length} ${set.kind} curves`,
    referenceC: referenceK - KELVIN_OFFSET,
    prony,
    shiftLaw: shiftLaw.law,
    TgC: shiftLaw.TgK === null ? null : shiftLaw.TgK - KELVIN_OFFSET,
    C1: shiftLaw.C1,
    C2K: shiftLaw.C2K,
    EakJmol: shiftLaw.EakJmol,
  };
  try {
    // What the fit writes must read back as a material (the same checks as a typed Prony table).
    compilePronyMaterial(material);
  } catch (e) {
    if (e instanceof ParameterError) throw new InputError('data', `the fitted Prony table is not a valid material: ${e.message}`);
    throw e;
  }
  return {
    kind: set.kind,
    referenceK,
    shifts,
    master,
    shiftLaw,
    prony,
    pronyRmsLog10: rms,
    pronyMaxLog10: max,
    pronyQuality,
    termsPerDecade: perDecade,
    material,
    quality: worst(shiftQuality, shiftLaw.quality, pronyQuality),
    notes,
  };
}

/**
 * Creep master curve (creep modulus 1/D, MPa) to a relaxation Prony series: a retardation series
 * D(t) = D_0 + sum_j D_j (1 - exp(-t / lambda_j)) with D >= 0 by NNLS (rows weighted by 1/D, i.e. the
 * relative error), then converted exactly. With C(s) = s D(s) = D_0 + sum_j D_j sigma_j / (s + sigma_j),
 * sigma_j = 1/lambda_j, the relaxation transform is E(s) = 1 / (s C(s)); C(-x) has one root rho_i in
 * each gap between consecutive sigma_j (and none beyond), the relaxation rates, and by residues
 * E(t) = 1 / C(0) + sum_i exp(-rho_i t) / (rho_i |C'(-rho_i)|) (derived here, the mirror of prony.ts).
 */
export function fitCreepToProny(
  timesS: readonly number[],
  creepModuliMPa: readonly number[],
  termsPerDecade = 1,
): { prony: PronySeries; rmsLog10: number; maxLog10: number } {
  const n = timesS.length;
  if (n < 3) throw new InputError('data', `a creep fit needs at least 3 points, got ${n}`);
  const D = creepModuliMPa.map((e) => 1 / e);
  const lo = Math.floor(Math.log10(minOf(timesS)));
  const hi = Math.ceil(Math.log10(maxOf(timesS)));
  const count = Math.max(1, Math.round((hi - lo) * termsPerDecade) + 1);
  const lams = Array.from({ length: count }, (_, i) => 10 ** (count === 1 ? lo : lo + ((hi - lo) * i) / (count - 1)));
  const A = timesS.map((t, k) => {
    const w = 1 / (D[k] ?? 1);
    return [w, ...lams.map((l) => w * (1 - Math.exp(-t / l)))];
  });
  const sol = nnls(
    A,
    D.map(() => 1),
  );
  const D0 = sol.x[0] ?? 0;
  if (!(D0 > 0)) throw new InputError('data', 'the creep data do not determine an instantaneous compliance; add shorter times');
  const live = lams
    .map((l, j) => ({ sigma: 1 / l, Dj: sol.x[j + 1] ?? 0 }))
    .filter((x) => x.Dj > 0)
    .sort((a, b) => a.sigma - b.sigma);
  const C = (x: number): number => live.reduce((s, k) => s + (k.Dj * k.sigma) / (k.sigma - x), D0);
  const dC = (x: number): number => live.reduce((s, k) => s + (k.Dj * k.sigma) / (k.sigma - x) ** 2, 0);
  const Dinf = live.reduce((s, k) => s + k.Dj, D0);
  const terms: { EMPa: number; tauS: number }[] = [];
  for (let i = 0; i + 1 < live.length; i++) {
    const a = (live[i]?.sigma ?? 1) * (1 + 1e-12);
    const b = (live[i + 1]?.sigma ?? 1) * (1 - 1e-12);
    const r = brentRoot((u) => C(Math.exp(u)), Math.log(a), Math.log(b), 1e-13);
    if (!r.converged)
      throw new InputError('data', 'the creep series could not be converted to relaxation (no root between retardation rates)');
    const rho = Math.exp(r.root);
    terms.push({ EMPa: 1 / (rho * dC(rho)), tauS: 1 / rho });
  }
  // C(-x) between the largest sigma and infinity runs from -infinity to D0 > 0: one more root there.
  if (live.length > 0) {
    const a = (live[live.length - 1]?.sigma ?? 1) * (1 + 1e-12);
    let b = a * 10;
    while (C(b) < 0 && b < 1e300) b *= 10;
    const r = brentRoot((u) => C(Math.exp(u)), Math.log(a), Math.log(b), 1e-13);
    if (r.converged) {
      const rho = Math.exp(r.root);
      terms.push({ EMPa: 1 / (rho * dC(rho)), tauS: 1 / rho });
    }
  }
  const prony: PronySeries = { EinfMPa: 1 / Dinf, terms };
  const cc = pronyCreepCompliance(prony);
  let sum = 0;
  let max = 0;
  timesS.forEach((t, k) => {
    const e = Math.log10(complianceAt(cc, t) / (D[k] ?? 1));
    sum += e * e;
    max = Math.max(max, Math.abs(e));
  });
  return { prony, rmsLog10: Math.sqrt(sum / n), maxLog10: max };
}
