/**
 * Brent's bracketed root finder (Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4),
 * in the form of the classic zeroin. Hand-written: no small, maintained npm package offers a bracketed
 * solver with an explicit status, and this one is exercised against closed-form roots in the tests.
 */

/**
 * Relative tolerance on the root that every solver in the engine uses. 1e-12 (not 1e-9) so that the
 * modulus at an inverse answer matches its target to 1e-6 even where log E falls by several decades
 * per kelvin (WLF C1 / C2 at the edges of their ranges); it costs about half an iteration on average.
 */
export const ROOT_REL_TOL = 1e-12;
/** Iteration cap for one bracketed solve. */
export const ROOT_MAX_ITER = 200;

export interface RootResult {
  readonly root: number;
  readonly converged: boolean;
  readonly iterations: number;
  /** |f(root)| */
  readonly residual: number;
  readonly reason: 'converged' | 'not-bracketed' | 'iteration-cap' | 'non-finite';
}

/** Finds x in [a, b] with f(x) = 0 given f(a), f(b) of opposite sign (or zero). */
export function brentRoot(f: (x: number) => number, a0: number, b0: number, relTol = ROOT_REL_TOL, maxIter = ROOT_MAX_ITER): RootResult {
  let a = a0;
  let b = b0;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) {
    return { root: NaN, converged: false, iterations: 0, residual: NaN, reason: 'non-finite' };
  }
  if (fa === 0) return { root: a, converged: true, iterations: 0, residual: 0, reason: 'converged' };
  if (fb === 0) return { root: b, converged: true, iterations: 0, residual: 0, reason: 'converged' };
  if (fa > 0 === fb > 0) {
    return { root: NaN, converged: false, iterations: 0, residual: Math.min(Math.abs(fa), Math.abs(fb)), reason: 'not-bracketed' };
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 1; iter <= maxIter; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * relTol * Math.max(Math.abs(b), 1e-300);
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) {
      return { root: b, converged: true, iterations: iter, residual: Math.abs(fb), reason: 'converged' };
    }
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) return { root: NaN, converged: false, iterations: iter, residual: NaN, reason: 'non-finite' };
  }
  return { root: b, converged: false, iterations: maxIter, residual: Math.abs(fb), reason: 'iteration-cap' };
}
