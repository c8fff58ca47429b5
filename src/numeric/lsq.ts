/**
 * Bounded nonlinear least squares over named parameters, by ml-levenberg-marquardt, with the
 * convergence checked here.
 *
 * Each parameter is mapped onto u in [0, 1] (through log10 for scale parameters) and the package's
 * minValues / maxValues clip u to that box. The package stops only when the sum of squares falls
 * below errorTolerance or at maxIterations, and reports neither case, so it is run in rounds of
 * LSQ_ROUND iterations until the sum stops falling; the result then counts as converged only when the
 * sum of squares is below LSQ_COST_TOL or the projected gradient is orthogonal to the residual to
 * within LSQ_GTOL (the cosine test of MINPACK's gtol; More, Garbow, Hillstrom, ANL-80-74, 1980).
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';

/** One free parameter: name, start value, bounds, and whether it varies on a log scale. */
export interface FreeParameter {
  readonly name: string;
  readonly start: number;
  readonly min: number;
  readonly max: number;
  readonly log: boolean;
}

export type LsqReason = 'converged' | 'exact' | 'stalled' | 'iteration-cap';

export interface LsqResult {
  readonly values: number[];
  /** Scaled residuals at the answer. */
  readonly residuals: number[];
  /** Sum of squared scaled residuals. */
  readonly cost: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: LsqReason;
  /** Parameters that ended on a bound. */
  readonly atBound: string[];
  /** |J^T r|_inf / (|J| |r|) at the answer, projected on the bounds (0 at an exact optimum). */
  readonly gradientCosine: number;
}

/** Sum of squares below which a fit counts as exact (default; callers with scaled residuals pass their own). */
export const LSQ_COST_TOL = 1e-12;
/** Cosine between the residual and the Jacobian's range below which a fit counts as converged. */
export const LSQ_GTOL = 1e-3;
/** Iterations per round of the package, and the total cap. */
export const LSQ_ROUND = 8;
export const LSQ_MAX_ITER = 120;
/** Half-width of the box (in u, a fraction of each search range) that one round may move within. */
export const LSQ_BOX = 0.15;
/** Grid of starting points per axis (in u) and the most parameters it is used for. */
export const LSQ_SCAN: readonly number[] = [0.1, 0.3, 0.5, 0.7, 0.9];
export const LSQ_SCAN_MAX_PARAMS = 3;
/** Relative fall of the sum of squares per round below which the iteration has stalled. */
export const LSQ_STALL = 1e-7;
/** Finite-difference step on u in [0, 1]. */
export const LSQ_STEP = 1e-5;
/** Starting damping of successive retries of a round that found no better point. */
export const LSQ_DAMPING: readonly number[] = [1e-2, 1, 100, 1e4];
/** Residual given to a parameter vector that the model rejects, so the package never sees NaN. */
const PENALTY = 1e4;

function toU(p: FreeParameter, v: number): number {
  const f = p.log ? Math.log10 : (x: number) => x;
  return (f(v) - f(p.min)) / (f(p.max) - f(p.min));
}

function fromU(p: FreeParameter, u: number): number {
  const c = Math.min(1, Math.max(0, u));
  const v = p.log ? 10 ** (Math.log10(p.min) + c * (Math.log10(p.max) - Math.log10(p.min))) : p.min + c * (p.max - p.min);
  // Rounding may step just outside the bounds; the model would reject that.
  return Math.min(p.max, Math.max(p.min, v));
}

/**
 * Minimizes sum r_i(values)^2. `residuals` may throw for a parameter set the model rejects; that point
 * is then given a large constant residual. Returns the best point found with an explicit status.
 */
export function boundedLeastSquares(
  params: readonly FreeParameter[],
  residuals: (values: number[]) => number[],
  costTol = LSQ_COST_TOL,
): LsqResult {
  if (params.length === 0) throw new Error('boundedLeastSquares: no free parameters');
  for (const p of params) {
    if (!(p.max > p.min) || (p.log && !(p.min > 0))) throw new Error(`boundedLeastSquares: bad bounds for ${p.name}`);
  }
  let count = -1;
  const safe = (u: readonly number[]): number[] => {
    let r: number[];
    try {
      r = residuals(params.map((p, i) => fromU(p, u[i] ?? 0)));
    } catch {
      r = [];
    }
    if (count < 0) count = r.length;
    if (r.length !== count || r.some((x) => !Number.isFinite(x))) return new Array<number>(Math.max(count, 1)).fill(PENALTY);
    return r;
  };
  const u0 = params.map((p) => toU(p, Math.min(p.max, Math.max(p.min, p.start))));
  const r0 = safe(u0);
  const m = r0.length;
  // The package needs at least two data points; a zero residual is appended when there is one.
  const n = Math.max(m, 2);
  const x = Array.from({ length: n }, (_, i) => i);
  const y = new Array<number>(n).fill(0);
  let cache: { key: string; r: number[] } = { key: '', r: [] };
  const model = (uu: number[]) => {
    const key = uu.join(',');
    if (cache.key !== key) cache = { key, r: safe(uu) };
    const rr = cache.r;
    return (i: number): number => rr[i] ?? 0;
  };
  const sumsq = (rr: readonly number[]): number => rr.reduce((acc, v) => acc + v * v, 0);

  const descend = (
    start: number[],
    startR: number[],
  ): { u: number[]; r: number[]; cost: number; iterations: number; reason: LsqReason } => {
    let u = start;
    let r = startR;
    let cost = sumsq(r);
    let iterations = 0;
    let reason: LsqReason = 'iteration-cap';
    // The package takes every step, good or bad, and keeps the best point seen; a round that finds no
    // better point is retried with heavier damping (shorter, more gradient-like steps).
    let level = 0;
    while (iterations < LSQ_MAX_ITER) {
      if (cost <= costTol) {
        reason = 'exact';
        break;
      }
      const out = levenbergMarquardt({ x, y }, model, {
        initialValues: u,
        // A moving box around the current point keeps one round from wandering far on a bad model step.
        minValues: u.map((v) => Math.max(0, v - LSQ_BOX)),
        maxValues: u.map((v) => Math.min(1, v + LSQ_BOX)),
        gradientDifference: LSQ_STEP,
        maxIterations: LSQ_ROUND,
        errorTolerance: costTol,
        damping: LSQ_DAMPING[level] ?? 1,
      });
      iterations += out.iterations;
      const next = out.parameterValues.map((v) => Math.min(1, Math.max(0, v)));
      const rNext = safe(next);
      const cNext = sumsq(rNext);
      const fall = cost - cNext;
      if (cNext < cost) {
        u = next;
        r = rNext;
        cost = cNext;
      }
      if (cost <= costTol) {
        reason = 'exact';
        break;
      }
      if (fall > LSQ_STALL * cost) {
        level = Math.max(0, level - 1);
        continue;
      }
      if (fall > 0 || level + 1 >= LSQ_DAMPING.length) {
        reason = 'stalled';
        break;
      }
      level++;
    }
    return { u, r, cost, iterations, reason };
  };

  // Models with regime changes (an HDT that moves from the glass transition to the melting range) have
  // more than one basin: a coarse grid of starts (LSQ_SCAN per axis, up to LSQ_SCAN_MAX_PARAMS
  // parameters) picks the most promising one, and the better of the two descents is kept.
  let best = descend(u0, r0);
  let iterations = best.iterations;
  if (best.cost > costTol && params.length <= LSQ_SCAN_MAX_PARAMS) {
    let gridBest: { u: number[]; r: number[]; cost: number } | null = null;
    const total = LSQ_SCAN.length ** params.length;
    for (let k = 0; k < total; k++) {
      let rest = k;
      const uu = params.map(() => {
        const v = LSQ_SCAN[rest % LSQ_SCAN.length] ?? 0.5;
        rest = Math.floor(rest / LSQ_SCAN.length);
        return v;
      });
      const rr = safe(uu);
      const c = sumsq(rr);
      if (!gridBest || c < gridBest.cost) gridBest = { u: uu, r: rr, cost: c };
    }
    if (gridBest) {
      const other = descend(gridBest.u, gridBest.r);
      iterations += other.iterations;
      if (other.cost < best.cost) best = other;
    }
  }
  const u = best.u;
  const r = best.r;
  const cost = best.cost;
  let reason = best.reason;
  // First-order check at the answer: projected gradient J^T r against |J| |r|.
  const J: number[][] = params.map((_, j) => {
    const h = u[j]! >= 1 - LSQ_STEP ? -LSQ_STEP : LSQ_STEP;
    const uu = u.slice();
    uu[j] = u[j]! + h;
    const rr = safe(uu);
    return rr.map((v, i) => (v - (r[i] ?? 0)) / h);
  });
  const rNorm = Math.sqrt(cost);
  let jNorm = 0;
  let gMax = 0;
  const atBound: string[] = [];
  params.forEach((p, j) => {
    const col = J[j] ?? [];
    jNorm += col.reduce((s, v) => s + v * v, 0);
    const g = col.reduce((s, v, i) => s + v * (r[i] ?? 0), 0);
    const uj = u[j] ?? 0.5;
    // At a bound, a gradient that points out of the box is satisfied.
    const lower = uj <= 1e-9;
    const upper = uj >= 1 - 1e-9;
    if (lower || upper) atBound.push(p.name);
    const projected = (lower && g > 0) || (upper && g < 0) ? 0 : g;
    gMax = Math.max(gMax, Math.abs(projected));
  });
  jNorm = Math.sqrt(jNorm);
  const gradientCosine = rNorm === 0 || jNorm === 0 ? 0 : gMax / (jNorm * rNorm);
  let converged = reason === 'exact' || cost <= costTol;
  if (!converged && (reason === 'stalled' || reason === 'iteration-cap') && gradientCosine <= LSQ_GTOL) {
    converged = true;
    reason = 'converged';
  }
  return { values: params.map((p, i) => fromU(p, u[i] ?? 0)), residuals: r, cost, iterations, converged, reason, atBound, gradientCosine };
}
