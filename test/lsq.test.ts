import { describe, expect, it } from 'vitest';
import { boundedLeastSquares } from '../src/index.js';
import { expectClose } from './expect.js';

describe('bounded least squares', () => {
  it('fits a straight line exactly', () => {
    const xs = [0, 1, 2, 3, 4, 5, 6];
    const r = boundedLeastSquares(
      [
        { name: 'slope', start: 1, min: -10, max: 10, log: false },
        { name: 'intercept', start: 0, min: -10, max: 10, log: false },
      ],
      ([a, b]) => xs.map((x) => (a ?? 0) * x + (b ?? 0) - (2 * x - 2)),
    );
    expect(r.converged).toBe(true);
    expectClose(r.values[0] ?? NaN, 2, { abs: 1e-5, source: 'exact data y = 2x - 2 (closed form)' });
    expectClose(r.values[1] ?? NaN, -2, { abs: 1e-5, source: 'exact data y = 2x - 2 (closed form)' });
  });
  it('fits an exponential decay on a log-scaled parameter', () => {
    const ts = [0.1, 0.3, 1, 3, 10, 30];
    const r = boundedLeastSquares([{ name: 'tau', start: 100, min: 0.01, max: 1e4, log: true }], ([tau]) =>
      ts.map((t) => Math.exp(-t / (tau ?? 1)) - Math.exp(-t / 4)),
    );
    expectClose(r.values[0] ?? NaN, 4, { rel: 1e-4, source: 'exact data exp(-t/4) (closed form)' });
  });
  it('reports a bound that stops the fit and does not call it converged to the target', () => {
    const r = boundedLeastSquares([{ name: 'a', start: 1, min: 0, max: 2, log: false }], ([a]) => [(a ?? 0) - 5, (a ?? 0) - 5]);
    expect(r.atBound).toEqual(['a']);
    expectClose(r.values[0] ?? NaN, 2, { abs: 1e-9, source: 'minimum of (a - 5)^2 on [0, 2] is at a = 2 (closed form)' });
    expect(r.cost).toBeGreaterThan(1);
  });
  it('leaves a local minimum for a better basin found by the grid of starts', () => {
    // Local minimum at v = 0.2 (residual 0.5), global one at v = 0.85 (residual 0).
    const f = (v: number): number => Math.min((v - 0.2) ** 2 + 0.5, 10 * (v - 0.85) ** 2);
    const r = boundedLeastSquares([{ name: 'v', start: 0.2, min: 0, max: 1, log: false }], ([v]) => [f(v ?? 0)]);
    expectClose(r.values[0] ?? NaN, 0.85, { abs: 1e-3, source: 'global minimum of the constructed residual (closed form)' });
  });
  it('never hands the package a NaN: a rejected point gets a large residual', () => {
    const r = boundedLeastSquares([{ name: 'a', start: 0.5, min: 0, max: 1, log: false }], ([a]) => {
      if ((a ?? 0) > 0.9) throw new Error('model rejects');
      return [(a ?? 0) - 0.3, 0];
    });
    expectClose(r.values[0] ?? NaN, 0.3, { abs: 1e-5, source: 'minimum at a = 0.3 (closed form)' });
  });
});
