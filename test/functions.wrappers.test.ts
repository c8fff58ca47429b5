import { beforeAll, describe, expect, it } from 'vitest';
import { SheetError } from '../functions/core/cells.js';
import { formulaRows } from './fixtures/formulas.js';
import { checkRow, type Outcome } from './support/check.js';
import { evaluateFormula } from './support/formula.js';
import { loadFunctions } from './support/functions.js';

function outcome(x: unknown): Outcome {
  if (x instanceof SheetError) return { code: x.code, message: x.message };
  if (typeof x === 'number' || typeof x === 'string') return x;
  throw new Error(`unexpected result ${JSON.stringify(x)}`);
}

beforeAll(async () => {
  await loadFunctions();
});

describe('fixture table through the wrappers', () => {
  for (const row of formulaRows()) {
    it(row.formula, () => {
      checkRow(row, outcome(evaluateFormula(row.formula)));
    });
  }
});

describe('errors carry messages that name the argument', () => {
  it('prefixes every #VALUE! and #N/A message with the argument name', () => {
    for (const row of formulaRows()) {
      const out = evaluateFormula(row.formula);
      if (out instanceof SheetError && out.code !== '#N/A') expect(out.message, row.formula).toMatch(/^[a-z_]+: /);
    }
  });
});

describe('parameter blocks', () => {
  it('reads field names without regard to case and ignores a header row and extra columns', async () => {
    const { definition } = await import('../functions/core/define.js');
    const { paramsBlock } = await import('../functions/core/block.js');
    const { getFamily } = await import('../src/index.js');
    const modulus = definition('MODULUS');
    const block = paramsBlock(getFamily('PBT').params);
    const lower = block.map((r, i) => (i === 0 ? r : [String(r[0]).toLowerCase(), r[1]]));
    expect(modulus?.invoke(lower, 60, 1000)).toBe(modulus?.invoke('PBT', 60, 1000));
    expect(modulus?.invoke(block.slice(1), 60, 1000)).toBe(modulus?.invoke('PBT', 60, 1000));
  });
});
