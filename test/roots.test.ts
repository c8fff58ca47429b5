import { describe, expect, it } from 'vitest';
import { brentRoot } from '../src/numeric/roots.js';
import { expectClose } from './expect.js';

describe('Brent root finder', () => {
  it('finds sqrt(2), the Dottie number and a root of a cubic to 1e-9 relative', () => {
    expectClose(brentRoot((x) => x * x - 2, 0, 2).root, Math.SQRT2, { rel: 1e-9, source: 'closed form sqrt(2)' });
    expectClose(brentRoot((x) => Math.cos(x) - x, 0, 1).root, 0.7390851332151607, {
      rel: 1e-9,
      source: 'Dottie number (fixed point of cos), OEIS A003957',
    });
    expectClose(brentRoot((x) => (x - 1) * (x + 2) * (x - 3), 2, 10).root, 3, { rel: 1e-9, source: 'closed form' });
  });
  it('reports an unbracketed interval instead of guessing', () => {
    const r = brentRoot((x) => x * x + 1, -1, 1);
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('not-bracketed');
  });
  it('reports the iteration cap', () => {
    const r = brentRoot((x) => (x < 0.3 ? -1 : 1), 0, 1, 1e-9, 3);
    expect(r.reason).toBe('iteration-cap');
  });
});
