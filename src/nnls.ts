/**
 * Non-negative least squares: min ||A x - b||^2 subject to x >= 0.
 *
 * Solved by ml-fcnnls (Van Benthem and Keenan, J. Chemometrics 18 (2004) 441, a fast combinatorial form
 * of the Lawson-Hanson active-set method; Lawson and Hanson, Solving Least Squares Problems, 1974,
 * ch. 23). That package works on the normal equations with an absolute gradient tolerance and stops
 * with an exception at its iteration cap, so the columns are scaled to unit norm first, and the answer
 * is checked here against the Karush-Kuhn-Tucker conditions before it is returned.
 */
import { fcnnlsVector } from 'ml-fcnnls';
import { SolverError } from './errors.js';

/** Largest KKT violation accepted, relative to ||A|| ||b|| after column scaling. */
export const NNLS_KKT_TOL = 1e-6;

export interface NnlsResult {
  /** The non-negative solution. */
  readonly x: number[];
  /** ||A x - b|| (Euclidean). */
  readonly residualNorm: number;
  /** Largest relative violation of the optimality conditions (0 = exact). */
  readonly kktViolation: number;
}

/** Solves min ||A x - b|| with x >= 0; A is given row by row. Throws SolverError when the optimum is not reached. */
export function nnls(A: readonly (readonly number[])[], b: readonly number[]): NnlsResult {
  const rows = A.length;
  const cols = A[0]?.length ?? 0;
  if (rows === 0 || cols === 0 || b.length !== rows) throw new Error(`nnls: A is ${rows} x ${cols} but b has ${b.length} entries`);
  const norms = new Array<number>(cols).fill(0);
  for (const row of A) {
    if (row.length !== cols) throw new Error('nnls: rows of A differ in length');
    for (let j = 0; j < cols; j++) norms[j] = (norms[j] ?? 0) + (row[j] ?? 0) ** 2;
  }
  const scale = norms.map((n) => (n > 0 ? 1 / Math.sqrt(n) : 0));
  const bNorm = Math.sqrt(b.reduce((s, v) => s + v * v, 0));
  if (bNorm === 0) return { x: new Array<number>(cols).fill(0), residualNorm: 0, kktViolation: 0 };
  const As = A.map((row) => row.map((v, j) => v * (scale[j] ?? 0)));
  const bs = b.map((v) => v / bNorm);
  let y: number[];
  try {
    y = fcnnlsVector(As, bs, { maxIterations: 10 * cols + 20, gradientTolerance: NNLS_KKT_TOL / 10 }).K.to1DArray();
  } catch (e) {
    throw new SolverError(`non-negative least squares: ${(e as Error).message}`, 10 * cols + 20, NaN);
  }
  const ys = y.map((v) => Math.max(0, v));
  // KKT: w = A^T (b - A y); w_j <= tol where y_j = 0, |w_j| <= tol where y_j > 0 (scaled problem, ||b|| = 1).
  const r = bs.map((bi, i) => bi - (As[i] ?? []).reduce((s, a, j) => s + a * (ys[j] ?? 0), 0));
  let violation = 0;
  for (let j = 0; j < cols; j++) {
    let w = 0;
    for (let i = 0; i < rows; i++) w += (As[i]?.[j] ?? 0) * (r[i] ?? 0);
    violation = Math.max(violation, (ys[j] ?? 0) > 0 ? Math.abs(w) : Math.max(0, w));
  }
  if (!(violation <= NNLS_KKT_TOL * 100)) {
    throw new SolverError('non-negative least squares did not reach the optimum (KKT conditions violated)', 0, violation);
  }
  const x = ys.map((v, j) => v * (scale[j] ?? 0) * bNorm);
  const residualNorm = Math.sqrt(r.reduce((s, v) => s + v * v, 0)) * bNorm;
  return { x, residualNorm, kktViolation: violation };
}
