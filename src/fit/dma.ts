/**
 * DMA storage modulus from the relaxation model, and the fit of the four-region parameters to a DMA
 * temperature sweep at one frequency.
 *
 * Storage modulus by the local power law: for E(t) = E1 t^-n, E'(omega) = E1 Gamma(1 - n) cos(n pi / 2)
 * omega^n (Laplace transform of the power law, derived here), so E'(omega) = E(1/omega) F(n) with
 * F(n) = Gamma(1 - n) cos(n pi / 2) = n pi / (2 sin(n pi / 2) Gamma(1 + n)), which is 1 at n = 0 and
 * pi/2 at n = 1, n the local log-log slope of E at t = 1/omega (Schapery and Park 1999, from memory).
 * Slopes are capped at DMA_SLOPE_CAP, where the power law has long stopped describing the curve.
 * A Prony material gives E' exactly: E_inf + sum E_i w^2 tau_i^2 / (1 + w^2 tau_i^2).
 */
import { InputError } from '../base/errors.js';
import { localSlope } from '../answers/creep.js';
import { boundedLeastSquares, type FreeParameter } from '../numeric/lsq.js';
import { maxOf, norm2 } from '../numeric/arrays.js';
import { compileMaterial, modulusMPa, type Material } from '../material/model.js';
import { fieldSpec, type MaterialParams, type NumericField } from '../material/params.js';
import { pronyStorageMPa, qualityFromRmsLog10, type FitQuality } from '../material/prony.js';
import { isPronySpec } from '../material/pronymaterial.js';
import type { MaterialInput } from '../material/resolve.js';
import { getGrade } from '../material/grade.js';
import { shiftLog10 } from '../material/shift.js';
import type { DmaSweep } from './testdata.js';

/** Largest local slope used in F(n) (F stays finite up to n = 2). */
export const DMA_SLOPE_CAP = 1.5;
/** Tolerance of a storage modulus point in the fit, decades (about 5 %). */
export const DMA_TOLERANCE_LOG10 = 0.02;

// Lanczos approximation of Gamma, g = 7, 9 coefficients (Lanczos, SIAM J. Numer. Anal. B 1 (1964) 86;
// coefficients as tabulated by Godfrey, from memory), relative error about 1e-15 for real x > 0.5.
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** Gamma function for x >= 0.5. */
export function gamma(x: number): number {
  if (!(x >= 0.5)) throw new InputError('x', `gamma is implemented for x >= 0.5, got ${x}`);
  const z = x - 1;
  let a = LANCZOS[0] ?? 1;
  const t = z + 7.5;
  for (let i = 1; i < 9; i++) a += (LANCZOS[i] ?? 0) / (z + i);
  return Math.sqrt(2 * Math.PI) * t ** (z + 0.5) * Math.exp(-t) * a;
}

/** F(n) = Gamma(1 - n) cos(n pi / 2), the ratio E'(1/t) / E(t) of a power law (closed form). */
export function storageFactor(n: number): number {
  const m = Math.min(Math.max(n, 0), DMA_SLOPE_CAP);
  if (m < 1e-8) return 1;
  return (m * Math.PI) / (2 * Math.sin((m * Math.PI) / 2) * gamma(1 + m));
}

/** Storage modulus E' (MPa) at frequency f (Hz) and temperature T (K). */
export function storageModulusMPa(m: Material, frequencyHz: number, TK: number): number {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz))
    throw new InputError('frequency', `must be a positive frequency in Hz, got ${frequencyHz}`);
  const omega = 2 * Math.PI * frequencyHz;
  if (m.prony) return pronyStorageMPa(m.prony, omega * 10 ** shiftLog10(m.shift, TK));
  const t = 1 / omega;
  return modulusMPa(m, t, TK) * storageFactor(localSlope(m, t, TK));
}

/**
 * Parameters the DMA fit may free, in order of preference, per kind (set here). With the mechanical alpha
 * time near 1 s at Tg, a 1 Hz sweep crosses the transition within a few kelvin of Tg, where the WLF
 * slope C1 / C2 shapes the step: C2 is freed after the breadth.
 */
export const DMA_CANDIDATES: Record<MaterialParams['kind'], NumericField[]> = {
  amorphous: ['E23_MPa', 'Tg_C', 'beta', 'C2_K', 'plateau_MPa', 'flowDecades'],
  semicrystalline: ['E23_MPa', 'Tg_C', 'crystallinity', 'meltSharpness', 'Tm_C', 'beta'],
  crosslinked: ['E23_MPa', 'Tg_C', 'beta', 'Mc_kgmol'],
};

export interface DmaFitOptions {
  readonly frequencyHz: number;
  /** Parameters to fit instead of the automatic choice. */
  readonly free?: readonly NumericField[];
  readonly id?: string;
  readonly name?: string;
}

export interface DmaFit {
  readonly params: MaterialParams;
  readonly free: readonly { field: NumericField; start: number; value: number; atBound: boolean }[];
  readonly rmsLog10: number;
  readonly maxLog10: number;
  readonly points: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: string;
  readonly quality: FitQuality;
  readonly notes: readonly string[];
}

function bounds(field: NumericField, p: MaterialParams): { min: number; max: number; log: boolean } {
  const s = fieldSpec(field);
  const v = p[field] ?? s.min;
  if (field === 'Tg_C' || field === 'Tm_C') return { min: Math.max(s.min, v - 80), max: Math.min(s.max, v + 80), log: false };
  if (field === 'crystallinity') return { min: s.min, max: Math.min(s.max, p.crystalContinuity), log: false };
  if (field === 'beta' || field === 'flowDecades' || field === 'creepN') return { min: s.min, max: s.max, log: false };
  return { min: s.min, max: s.max, log: s.min > 0 };
}

/** Fits the four-region parameters of a start family or record to a DMA storage-modulus sweep. */
export function fitDma(start: MaterialInput, sweep: DmaSweep, options: DmaFitOptions): DmaFit {
  if (isPronySpec(start)) throw new InputError('start', 'start a DMA fit from a family or a parameter record, not a Prony material');
  if (!(options.frequencyHz > 0) || !Number.isFinite(options.frequencyHz)) {
    throw new InputError('frequency', `must be a positive frequency in Hz, got ${options.frequencyHz}`);
  }
  const p0 = typeof start === 'string' ? getGrade(start).params : start;
  compileMaterial(p0);
  const base: MaterialParams = {
    ...p0,
    id: options.id ?? `${p0.id}-dma`,
    name: options.name ?? `${p0.name} (DMA fit)`,
    Tg_low_C: null,
    Tg_high_C: null,
    Tm_low_C: null,
    Tm_high_C: null,
    E23_low_MPa: null,
    E23_high_MPa: null,
  };
  const notes: string[] = [];
  const residuals = (q: MaterialParams): number[] => {
    const m = compileMaterial(q);
    return sweep.temperaturesK.map(
      (T, i) => Math.log10(storageModulusMPa(m, options.frequencyHz, T) / (sweep.storageMPa[i] ?? 1)) / DMA_TOLERANCE_LOG10,
    );
  };
  const r0 = residuals(base);
  const candidates = (options.free ?? DMA_CANDIDATES[base.kind]).filter((f) => {
    if (base[f] === null) {
      if (options.free) throw new InputError('free', `${f} is empty in the start record and cannot be fitted`);
      return false;
    }
    if (!fieldSpec(f).kinds.includes(base.kind)) throw new InputError('free', `${f} is not used by a ${base.kind} material`);
    return true;
  });
  if (candidates.length > sweep.temperaturesK.length) {
    throw new InputError('free', `${candidates.length} parameters cannot be fitted to ${sweep.temperaturesK.length} points`);
  }
  // Keep the candidates the sweep moves, independently of those kept before (Gram-Schmidt on the
  // Jacobian columns at the start).
  const chosen: { field: NumericField; b: { min: number; max: number; log: boolean } }[] = [];
  const basis: number[][] = [];
  for (const f of candidates) {
    const b = bounds(f, base);
    const v = base[f] ?? b.min;
    const step = b.log ? v * 1.05 : v + 0.02 * (b.max - b.min);
    const probe = Math.min(b.max, step) === v ? (b.log ? v / 1.05 : v - 0.02 * (b.max - b.min)) : Math.min(b.max, step);
    let col: number[];
    try {
      const r1 = residuals({ ...base, [f]: probe });
      col = r1.map((x, i) => x - (r0[i] ?? 0));
    } catch {
      col = [];
    }
    const norm = norm2(col);
    const rest = col.slice();
    for (const q of basis) {
      const d = rest.reduce((s, x, i) => s + x * (q[i] ?? 0), 0);
      for (let i = 0; i < rest.length; i++) rest[i] = (rest[i] ?? 0) - d * (q[i] ?? 0);
    }
    const restNorm = norm2(rest);
    if (norm < 0.05 || restNorm < 0.05 * norm) {
      const why = norm < 0.05 ? 'the sweep does not cover the range where it acts' : 'its effect duplicates the parameters already fitted';
      if (options.free) throw new InputError('free', `${f} cannot be fitted to this sweep: ${why}`);
      notes.push(`${f} kept at ${base[f]}: ${why}`);
      continue;
    }
    basis.push(rest.map((x) => x / restNorm));
    chosen.push({ field: f, b });
  }
  if (chosen.length === 0) throw new InputError('data', 'the sweep moves none of the parameters; check the temperatures and the frequency');
  const fp: FreeParameter[] = chosen.map((c) => ({
    name: c.field,
    start: Math.min(c.b.max, Math.max(c.b.min, base[c.field] ?? c.b.min)),
    ...c.b,
  }));
  const build = (v: readonly number[]): MaterialParams => {
    const q = { ...base };
    chosen.forEach((c, i) => ((q as Record<string, unknown>)[c.field] = v[i]));
    return q;
  };
  const r = boundedLeastSquares(fp, (v) => residuals(build(v)));
  const fitted = build(r.values);
  const res = residuals(fitted).map((x) => x * DMA_TOLERANCE_LOG10);
  const rms = Math.sqrt(res.reduce((s, x) => s + x * x, 0) / res.length);
  const max = maxOf(res.map(Math.abs));
  if (!r.converged) notes.push(`the least-squares fit did not converge (${r.reason}); the record is the best point found`);
  const free = chosen.map((c, i) => ({
    field: c.field,
    start: fp[i]?.start ?? NaN,
    value: r.values[i] ?? NaN,
    atBound: r.atBound.includes(c.field),
  }));
  for (const f of free) if (f.atBound) notes.push(`${f.field} ended on its search bound (${f.value})`);
  let quality = qualityFromRmsLog10(rms);
  if (!r.converged && quality === 'good') quality = 'fair';
  return {
    params: fitted,
    free,
    rmsLog10: rms,
    maxLog10: max,
    points: res.length,
    iterations: r.iterations,
    converged: r.converged,
    reason: r.reason,
    quality,
    notes,
  };
}
