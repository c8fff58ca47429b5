/** Compares a worksheet result with a fixture row's expectation. */
import { expect } from 'vitest';
import type { FormulaRow } from '../fixtures/formulas.js';
import { expectClose } from '../expect.js';

/** A result normalized across hosts: a number, or an error code with its message. */
export type Outcome = number | { readonly code: string; readonly message: string } | string;

export function checkRow(row: FormulaRow, got: Outcome): void {
  const e = row.expected;
  if ('error' in e) {
    expect(typeof got, `${row.formula} should be ${e.error}, got ${JSON.stringify(got)}`).toBe('object');
    const err = got as { code: string; message: string };
    expect(err.code, row.formula).toBe(e.error);
    expect(err.message, row.formula).toContain(e.includes);
    return;
  }
  expect(typeof got, `${row.formula} should be a number, got ${JSON.stringify(got)}`).toBe('number');
  expectClose(got as number, e.value, { rel: e.rel, abs: e.abs, source: `${row.formula}: ${row.source}` });
}
