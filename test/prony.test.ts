import { describe, expect, it } from 'vitest';
import {
  complianceAt,
  fitProny,
  nnls,
  powerLawProduct,
  pronyCreepCompliance,
  pronyModulusMPa,
  pronyStorageMPa,
  type PronySeries,
} from '../src/index.js';
import { expectClose } from './expect.js';
import { graded } from './quadrature.js';
import { seededRandom } from '../cli/demodata.js';

/** Unconstrained least squares by the normal equations and Gaussian elimination (small, well-posed test problems). */
function leastSquares(A: number[][], b: number[]): number[] {
  const n = A[0]?.length ?? 0;
  if (n === 0) return [];
  const M = Array.from({ length: n }, (_, i) => [
    ...Array.from({ length: n }, (_, j) => A.reduce((s, row) => s + (row[i] ?? 0) * (row[j] ?? 0), 0)),
    A.reduce((s, row, k) => s + (row[i] ?? 0) * (b[k] ?? 0), 0),
  ]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[p]![c]!)) p = r;
    [M[c], M[p]] = [M[p]!, M[c]!];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k <= n; k++) M[r]![k] = M[r]![k]! - f * M[c]![k]!;
    }
  }
  return M.map((row, i) => row[n]! / row[i]!);
}

const MAXWELL = 'single Maxwell element: E = E0 exp(-t/tau), D = (1 + t/tau)/E0 (closed form)';
const SLS = 'standard linear solid: D = 1/E_inf - (1/E_inf - 1/E_g) exp(-t E_inf / (tau E_g)) (closed form)';
const POWER = 'power law E = E1 t^-n: E D = sin(n pi)/(n pi) (closed form, Laplace transform)';

describe('exact creep compliance of a Prony series', () => {
  it('gives D = (1 + t/tau)/E0 for a single Maxwell element', () => {
    const d = pronyCreepCompliance({ EinfMPa: 0, terms: [{ EMPa: 1000, tauS: 10 }] });
    for (const t of [0, 1, 10, 100, 1e4]) expectClose(complianceAt(d, t), (1 + t / 10) / 1000, { rel: 1e-12, source: MAXWELL });
  });
  it('gives the standard linear solid exactly', () => {
    const Einf = 100;
    const Eg = 1000;
    const tau = 10;
    const d = pronyCreepCompliance({ EinfMPa: Einf, terms: [{ EMPa: Eg - Einf, tauS: tau }] });
    const lambda = (tau * Eg) / Einf;
    for (const t of [0, 3, 30, 300, 3000]) {
      const exact = 1 / Einf - (1 / Einf - 1 / Eg) * Math.exp(-t / lambda);
      expectClose(complianceAt(d, t), exact, { rel: 1e-10, source: SLS });
    }
  });
  it('has D(0) = 1/E_g and D(inf) = 1/E_inf for a 12-term series', () => {
    const p: PronySeries = {
      EinfMPa: 3,
      terms: Array.from({ length: 12 }, (_, i) => ({ tauS: 10 ** (i - 4), EMPa: 100 + 50 * Math.sin(i) })),
    };
    const Eg = p.EinfMPa + p.terms.reduce((s, t) => s + t.EMPa, 0);
    const d = pronyCreepCompliance(p);
    expectClose(complianceAt(d, 0), 1 / Eg, { rel: 1e-9, source: 'initial value theorem: D(0) = 1/E(0) (closed form)' });
    expectClose(complianceAt(d, 1e12), 1 / 3, { rel: 1e-9, source: 'final value theorem: D(inf) = 1/E(inf) (closed form)' });
  });
  it('satisfies integral_0^t E(s) D(t - s) ds = t', () => {
    const p: PronySeries = {
      EinfMPa: 2,
      terms: [0.01, 0.1, 1, 10, 100].map((tauS, i) => ({ tauS, EMPa: [800, 500, 300, 100, 20][i] ?? 0 })),
    };
    const d = pronyCreepCompliance(p);
    for (const t of [0.05, 3, 200]) {
      const f = (s: number): number => pronyModulusMPa(p, s) * complianceAt(d, t - s);
      const sum = graded(f, 0, t / 2, 'start') + graded(f, t / 2, t, 'end');
      expectClose(sum, t, {
        rel: 2e-5,
        source: 'convolution identity of linear viscoelasticity, integral E(s) D(t-s) ds = t (closed form)',
      });
    }
  });
  it('keeps E(t) D(t) <= 1 for a broad series', () => {
    const p: PronySeries = { EinfMPa: 1, terms: Array.from({ length: 10 }, (_, i) => ({ tauS: 10 ** i, EMPa: 300 })) };
    const d = pronyCreepCompliance(p);
    for (let u = -2; u < 12; u += 0.5) expect(pronyModulusMPa(p, 10 ** u) * complianceAt(d, 10 ** u)).toBeLessThanOrEqual(1 + 1e-12);
  });
});

describe('power law interconversion', () => {
  it('gives 0.984, 0.858 and 0.637 at n = 0.1, 0.3, 0.5', () => {
    expectClose(powerLawProduct(0.1), 0.984, { abs: 5e-4, source: POWER });
    expectClose(powerLawProduct(0.3), 0.858, { abs: 5e-4, source: POWER });
    expectClose(powerLawProduct(0.5), 0.637, { abs: 5e-4, source: POWER });
    expectClose(powerLawProduct(0.5), 2 / Math.PI, { rel: 1e-12, source: POWER });
  });
  it('is reproduced by a fitted Prony series converted exactly (n = 0.1, 0.3, 0.5)', () => {
    for (const [n, exact] of [
      [0.1, 0.984],
      [0.3, 0.858],
      [0.5, 0.637],
    ] as const) {
      const ts = Array.from({ length: 121 }, (_, i) => 10 ** (-6 + i * 0.1));
      const fit = fitProny(
        ts,
        ts.map((t) => 1000 * t ** -n),
        { termsPerDecade: 2, tauMinS: 1e-8, tauMaxS: 1e8 },
      );
      const d = pronyCreepCompliance(fit.prony);
      for (const t of [1, 10, 100]) {
        expectClose(pronyModulusMPa(fit.prony, t) * complianceAt(d, t), exact, { abs: 3e-3, source: POWER });
      }
    }
  });
  it('refuses exponents outside [0, 1)', () => {
    expect(() => powerLawProduct(1)).toThrow(/exponent/);
    expect(() => powerLawProduct(-0.1)).toThrow(/exponent/);
  });
});

describe('Prony fit by non-negative least squares', () => {
  it('recovers the weights of a series whose times lie on the grid', () => {
    const truth: PronySeries = {
      EinfMPa: 5,
      terms: [0.1, 1, 10, 100, 1000].map((tauS, i) => ({ tauS, EMPa: [400, 0, 250, 120, 30][i] ?? 0 })),
    };
    const ts = Array.from({ length: 60 }, (_, i) => 10 ** (-2 + i * 0.1));
    const fit = fitProny(
      ts,
      ts.map((t) => pronyModulusMPa(truth, t)),
      { tauMinS: 0.1, tauMaxS: 1000 },
    );
    expectClose(fit.prony.EinfMPa, 5, { rel: 1e-6, source: 'synthetic round trip (exact data)' });
    truth.terms.forEach((t, i) =>
      expectClose(fit.prony.terms[i]?.EMPa ?? NaN, t.EMPa, { abs: 1e-4, source: 'synthetic round trip (exact data)' }),
    );
    expect(fit.quality).toBe('good');
  });
  it('gives the storage modulus E_inf + sum E_i w^2 tau^2 / (1 + w^2 tau^2)', () => {
    expectClose(pronyStorageMPa({ EinfMPa: 1, terms: [{ EMPa: 100, tauS: 1 }] }, 1), 51, {
      rel: 1e-12,
      source: "Maxwell element E'(w) (closed form)",
    });
  });
  it('solves a small problem with an active constraint', () => {
    // min |A x - b| with A = I (2x2), b = (1, -1): the unconstrained answer (1, -1) clips to (1, 0) (closed form).
    const r = nnls(
      [
        [1, 0],
        [0, 1],
      ],
      [1, -1],
    );
    expectClose(r.x[0] ?? NaN, 1, { abs: 1e-12, source: 'closed form (orthogonal columns)' });
    expectClose(r.x[1] ?? NaN, 0, { abs: 1e-12, source: 'closed form (orthogonal columns)' });
    expectClose(r.residualNorm, 1, { abs: 1e-12, source: 'closed form (orthogonal columns)' });
  });
  it('matches brute-force enumeration of active sets on random 12 x 4 problems', () => {
    const rand = seededRandom(5);
    for (let trial = 0; trial < 20; trial++) {
      const A = Array.from({ length: 12 }, () => Array.from({ length: 4 }, () => rand() * 2 - 1));
      const b = Array.from({ length: 12 }, () => rand() * 2 - 1);
      const r = nnls(A, b);
      // Oracle: the best feasible least-squares solution over all 16 subsets of free columns.
      let best = Infinity;
      for (let mask = 0; mask < 16; mask++) {
        const idx = [0, 1, 2, 3].filter((j) => mask & (1 << j));
        const x = leastSquares(
          A.map((row) => idx.map((j) => row[j] ?? 0)),
          b,
        );
        if (x.some((v) => v < 0)) continue;
        const res = Math.hypot(...b.map((bi, i) => bi - idx.reduce((s, j, k) => s + (A[i]?.[j] ?? 0) * (x[k] ?? 0), 0)));
        best = Math.min(best, res);
      }
      expectClose(r.residualNorm, best, { rel: 1e-9, source: 'exhaustive search over active sets (exact for 4 columns)' });
      expect(r.x.every((v) => v >= 0)).toBe(true);
    }
  });
  it('refuses bad data with the point named', () => {
    expect(() => fitProny([1, 2], [3, 4])).toThrow(/at least 3 points/);
    expect(() => fitProny([1, 2, 3], [3, NaN, 1])).toThrow(/point 2/);
    expect(() => fitProny([1, -2, 3], [3, 2, 1])).toThrow(/point 2/);
  });
});
