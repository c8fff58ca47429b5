/**
 * Non-negative least squares: min ||A x - b||^2 subject to x >= 0, by the active-set method of
 * Lawson and Hanson (Solving Least Squares Problems, 1974, ch. 23, algorithm NNLS), with each
 * passive-set subproblem solved by Householder QR (not the normal equations, whose condition number
 * is the square of A's; Prony bases of a few terms per decade are ill-conditioned).
 *
 * Written here rather than taken from a package: the maintained package (ml-fcnnls) works on the
 * normal equations and pulls in ml-matrix (about 70 KB minified), which would put the worksheet
 * functions that convert relaxation to creep over the add-in's script budget; this file is about 3 KB.
 * Columns are scaled to unit norm and b to unit norm, so the tolerances below are relative.
 */
import { SolverError } from '../base/errors.js';
import { maxOf } from './arrays.js';

/** Optimality tolerance on the scaled gradient A^T (b - A x) (relative). */
export const NNLS_KKT_TOL = 1e-10;
/** Outer iterations allowed, times the number of columns (Lawson and Hanson suggest 3n). */
export const NNLS_ITER_FACTOR = 3;

export interface NnlsResult {
  /** The non-negative solution. */
  readonly x: number[];
  /** ||A x - b|| (Euclidean). */
  readonly residualNorm: number;
  /** Largest relative violation of the optimality conditions at the answer (0 = exact). */
  readonly kktViolation: number;
  readonly iterations: number;
}

/** Least-squares solution of A[:, cols] s = b by Householder QR (columns of A given as arrays). */
function solvePassive(cols: readonly number[][], b: readonly number[]): number[] {
  const m = b.length;
  const p = cols.length;
  const R = cols.map((c) => c.slice());
  const y = b.slice();
  for (let k = 0; k < p; k++) {
    const a = R[k]!;
    let norm = 0;
    for (let i = k; i < m; i++) norm += a[i]! * a[i]!;
    norm = Math.sqrt(norm);
    if (norm === 0) continue;
    const alpha = a[k]! > 0 ? -norm : norm;
    const v = new Array<number>(m).fill(0);
    v[k] = a[k]! - alpha;
    for (let i = k + 1; i < m; i++) v[i] = a[i]!;
    let vv = 0;
    for (let i = k; i < m; i++) vv += v[i]! * v[i]!;
    if (vv === 0) continue;
    const reflect = (c: number[]): void => {
      let d = 0;
      for (let i = k; i < m; i++) d += v[i]! * c[i]!;
      const f = (2 * d) / vv;
      for (let i = k; i < m; i++) c[i] = c[i]! - f * v[i]!;
    };
    for (let j = k; j < p; j++) reflect(R[j]!);
    reflect(y);
  }
  const s = new Array<number>(p).fill(0);
  for (let k = p - 1; k >= 0; k--) {
    let sum = y[k]!;
    for (let j = k + 1; j < p; j++) sum -= R[j]![k]! * s[j]!;
    const d = R[k]![k]!;
    s[k] = d === 0 ? 0 : sum / d;
  }
  return s;
}

/** Solves min ||A x - b|| with x >= 0; A is given row by row. Throws SolverError when the optimum is not reached. */
export function nnls(A: readonly (readonly number[])[], b: readonly number[]): NnlsResult {
  const m = A.length;
  const n = A[0]?.length ?? 0;
  if (m === 0 || n === 0 || b.length !== m) throw new Error(`nnls: A is ${m} x ${n} but b has ${b.length} entries`);
  const cols: number[][] = Array.from({ length: n }, () => new Array<number>(m).fill(0));
  for (let i = 0; i < m; i++) {
    const row = A[i]!;
    if (row.length !== n) throw new Error('nnls: rows of A differ in length');
    for (let j = 0; j < n; j++) cols[j]![i] = row[j]!;
  }
  const scale = cols.map((c) => {
    const norm = Math.sqrt(c.reduce((s, v) => s + v * v, 0));
    return norm > 0 ? 1 / norm : 0;
  });
  cols.forEach((c, j) => c.forEach((v, i) => (c[i] = v * scale[j]!)));
  const bNorm = Math.sqrt(b.reduce((s, v) => s + v * v, 0));
  if (bNorm === 0) return { x: new Array<number>(n).fill(0), residualNorm: 0, kktViolation: 0, iterations: 0 };
  const bs = b.map((v) => v / bNorm);
  const x = new Array<number>(n).fill(0);
  const passive = new Array<boolean>(n).fill(false);
  const residual = (): number[] => {
    const r = bs.slice();
    for (let j = 0; j < n; j++) if (x[j]! !== 0) for (let i = 0; i < m; i++) r[i] = r[i]! - cols[j]![i]! * x[j]!;
    return r;
  };
  const gradient = (r: readonly number[]): number[] => cols.map((c) => c.reduce((s, v, i) => s + v * r[i]!, 0));
  let iterations = 0;
  const maxIter = NNLS_ITER_FACTOR * n + 10;
  // A column whose entry would be dropped again at once (rounding at the optimum) is set aside until x moves.
  const setAside = new Array<boolean>(n).fill(false);
  for (;;) {
    const w = gradient(residual());
    let t = -1;
    let wMax = NNLS_KKT_TOL;
    for (let j = 0; j < n; j++) if (!passive[j] && !setAside[j] && scale[j]! > 0 && w[j]! > wMax) [t, wMax] = [j, w[j]!];
    if (t < 0) break;
    if (++iterations > maxIter) throw new SolverError('non-negative least squares: iteration cap reached', iterations, wMax);
    passive[t] = true;
    const before = x.slice();
    for (let inner = 0; inner <= n; inner++) {
      const idx = passive.flatMap((p, j) => (p ? [j] : []));
      const s = solvePassive(
        idx.map((j) => cols[j]!),
        bs,
      );
      if (s.every((v) => v > 0)) {
        idx.forEach((j, k) => (x[j] = s[k]!));
        break;
      }
      let alpha = 1;
      idx.forEach((j, k) => {
        if (s[k]! <= 0) alpha = Math.min(alpha, x[j]! / (x[j]! - s[k]!));
      });
      idx.forEach((j, k) => {
        x[j] = x[j]! + alpha * (s[k]! - x[j]!);
        if (x[j]! <= 1e-15) {
          x[j] = 0;
          passive[j] = false;
        }
      });
    }
    if (x.every((v, j) => v === before[j])) setAside[t] = true;
    else setAside.fill(false);
  }
  const r = residual();
  const w = gradient(r);
  const kktViolation = Math.max(0, maxOf(w.map((g, j) => (x[j]! > 0 ? Math.abs(g) : Math.max(0, g)))));
  if (!(kktViolation <= 1e-6)) throw new SolverError('non-negative least squares did not reach the optimum', iterations, kktViolation);
  return {
    x: x.map((v, j) => v * scale[j]! * bNorm),
    residualNorm: Math.sqrt(r.reduce((s, v) => s + v * v, 0)) * bNorm,
    kktViolation,
    iterations,
  };
}
