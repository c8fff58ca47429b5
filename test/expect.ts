/** Named-reference assertions: every numeric check says where its expected value comes from. */
import { expect } from 'vitest';

export interface Tolerance {
  readonly rel?: number;
  readonly abs?: number;
  /** Paper and table, standard clause, closed form, or "common practice" / "from memory". */
  readonly source: string;
}

/** Asserts |actual - expected| <= max(abs, rel * |expected|), reporting the source on failure. */
export function expectClose(actual: number, expected: number, tol: Tolerance): void {
  const allowed = Math.max(tol.abs ?? 0, (tol.rel ?? 0) * Math.abs(expected));
  const diff = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${actual} is not finite (${tol.source})`).toBe(true);
  expect(diff, `expected ${expected} +- ${allowed}, got ${actual} (source: ${tol.source})`).toBeLessThanOrEqual(allowed);
}
