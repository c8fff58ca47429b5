/**
 * The same wrappers registered in a real spreadsheet engine (HyperFormula, GPL-v3 licence key, dev
 * only) as DERATE.*: the fixture table from cells, then a sheet with references, ranges, spills,
 * errors propagating and recalculation after a cell changes.
 */
import { DetailedCellError, type HyperFormula } from 'hyperformula';
import { beforeAll, describe, expect, it } from 'vitest';
import { cToKelvin, FAMILIES, getFamily, compileMaterial, modulusMPa, deratingTable } from '../src/index.js';
import { BLOCK_ROWS } from '../functions/core/block.js';
import { derateWorkbook } from '../functions/host/hyperformula.js';
import { expectClose } from './expect.js';
import { formulaRows } from './fixtures/formulas.js';
import { checkRow, type Outcome } from './support/check.js';
import { loadFunctions } from './support/functions.js';

const H = 3600;
const ENGINE = 'engine: src/material/model.ts modulusMPa';

function outcome(v: unknown): Outcome {
  if (v instanceof DetailedCellError) return { code: v.value, message: v.message };
  if (typeof v === 'number' || typeof v === 'string') return v;
  throw new Error(`unexpected cell value ${JSON.stringify(v)}`);
}

function at(hf: HyperFormula, ref: string): unknown {
  const address = hf.simpleCellAddressFromString(ref, 0);
  if (!address) throw new Error(`bad address ${ref}`);
  return hf.getCellValue(address);
}

function pcAt(C: number, h: number): number {
  return modulusMPa(compileMaterial(getFamily('PC').params), h * H, cToKelvin(C));
}

beforeAll(async () => {
  await loadFunctions();
});

describe('fixture table in HyperFormula', () => {
  const rows = formulaRows();
  it('evaluates every row from a cell', () => {
    const hf = derateWorkbook({ S: rows.map((r) => [r.formula]) });
    rows.forEach((row, i) => checkRow(row, outcome(hf.getCellValue({ sheet: 0, col: 0, row: i }))));
    hf.destroy();
  });
});

describe('a DERATE sheet in HyperFormula', () => {
  it('follows references and recalculates when an input cell changes', () => {
    const hf = derateWorkbook({
      S: [
        ['PC', 80, '1000 h', '=DERATE.MODULUS(A1, B1, C1)', '=D1/2', '=DERATE.RATIO(A1, B1, C1)'],
        ['PBT', '=B1-20', 1000, '=DERATE.MODULUS(A2, B2, C2)'],
      ],
    });
    expectClose(at(hf, 'D1') as number, pcAt(80, 1000), { rel: 1e-12, source: ENGINE });
    expectClose(at(hf, 'E1') as number, pcAt(80, 1000) / 2, { rel: 1e-12, source: 'spreadsheet arithmetic on the result' });
    const pbt = (C: number): number => modulusMPa(compileMaterial(getFamily('PBT').params), 1000 * H, cToKelvin(C));
    expectClose(at(hf, 'D2') as number, pbt(60), { rel: 1e-12, source: ENGINE });

    hf.setCellContents({ sheet: 0, col: 1, row: 0 }, 120);
    expectClose(at(hf, 'D1') as number, pcAt(120, 1000), { rel: 1e-12, source: `${ENGINE}, after B1 changed to 120` });
    expectClose(at(hf, 'D2') as number, pbt(100), { rel: 1e-12, source: `${ENGINE}, through B2 = B1 - 20` });
    expect(at(hf, 'D1')).toBeLessThan(pcAt(80, 1000));

    hf.setCellContents({ sheet: 0, col: 0, row: 0 }, 'PPX');
    const err = outcome(at(hf, 'D1'));
    expect(err).toMatchObject({ code: '#N/A' });
    expect((err as { message: string }).message).toContain('unknown family "PPX"');
    expect(outcome(at(hf, 'E1'))).toMatchObject({ code: '#N/A' });
    expect(outcome(at(hf, 'F1'))).toMatchObject({ code: '#N/A' });
    hf.destroy();
  });

  it('spills GRID, BAND, CURVE, FAMILIES and PARAMS, and reads a spilled block back as a material', () => {
    const n = BLOCK_ROWS;
    const hf = derateWorkbook({
      S: [
        ['PC', 23, 60, 80, null, '=DERATE.GRID(A1:A3, B1:D1, "1000 h")'],
        ['PBT'],
        ['PA66-cond'],
        ['=DERATE.BAND("PBT", 60, 1000)'],
        ['=DERATE.CURVE("PC", 20, 200, 10, 1000)'],
        ...Array.from({ length: 11 }, () => []),
        [
          `=DERATE.PARAMS("PC")`,
          null,
          null,
          null,
          null,
          `=DERATE.MODULUS(A17:D${16 + n}, 80, 1000)`,
          `=DERATE.MODULUS(A17:B${16 + n}, 80, 1000)`,
        ],
      ],
    });
    // GRID at F1: header row of temperatures, materials down.
    expect(at(hf, 'F1')).toBe('E_r MPa');
    expect([at(hf, 'G1'), at(hf, 'H1'), at(hf, 'I1')]).toEqual([23, 60, 80]);
    expect([at(hf, 'F2'), at(hf, 'F3'), at(hf, 'F4')]).toEqual(['PC', 'PBT', 'PA66-cond']);
    const table = deratingTable(['PC', 'PBT', 'PA66-cond'], [23, 60, 80], 1000 * H);
    ['G', 'H', 'I'].forEach((col, j) =>
      table.forEach((r, i) =>
        expectClose(at(hf, `${col}${i + 2}`) as number, r.cells[j]?.modulusMPa ?? NaN, {
          rel: 1e-12,
          source: 'engine: src/answers/table.ts deratingTable',
        }),
      ),
    );
    // BAND at A4: low <= central <= high, region text.
    const [lo, mid, hi, region] = ['A4', 'B4', 'C4', 'D4'].map((r) => at(hf, r));
    expect(lo as number).toBeLessThanOrEqual(mid as number);
    expect(mid as number).toBeLessThanOrEqual(hi as number);
    expect(typeof region).toBe('string');
    // CURVE at A5: header + 10 points from 20 to 200 degC.
    expect([at(hf, 'A5'), at(hf, 'B5')]).toEqual(['temperature degC', 'E_r MPa']);
    expect(at(hf, 'A6')).toBe(20);
    expect(at(hf, 'A15')).toBe(200);
    expectClose(at(hf, 'B15') as number, pcAt(200, 1000), { rel: 1e-12, source: ENGINE });
    // PARAMS at A17 read back, with and without the unit/description columns.
    expect(at(hf, 'A17')).toBe('field');
    expectClose(at(hf, 'F17') as number, pcAt(80, 1000), { rel: 1e-9, source: 'round trip: PARAMS("PC") block gives the family' });
    expectClose(at(hf, 'G17') as number, pcAt(80, 1000), { rel: 1e-9, source: 'round trip: 2-column block' });
    hf.destroy();
  });

  it('takes an edited parameter block and reports a bad edit naming the field', () => {
    const n = BLOCK_ROWS;
    const hf = derateWorkbook({
      S: [[`=DERATE.PARAMS("PC")`, null, null, null, null, `=DERATE.MODULUS(A1:B${n}, 160, 1)`]],
    });
    const tgRow = Array.from({ length: n }, (_, i) => i).find((i) => hf.getCellValue({ sheet: 0, col: 0, row: i }) === 'Tg_C');
    expect(tgRow).toBeDefined();
    const before = at(hf, 'F1') as number;
    // Paste the spilled values as constants (what a user does before editing), then raise Tg.
    const values = hf
      .getSheetValues(0)
      .slice(0, n)
      .map((r) => r.slice(0, 4).map((c) => (c === null ? null : c)));
    const hf2 = derateWorkbook({ S: values });
    hf2.setCellContents({ sheet: 0, col: 5, row: 0 }, `=DERATE.MODULUS(A1:D${n}, 160, 1)`);
    expect(outcome(at(hf2, 'F1')), JSON.stringify(values)).toBeTypeOf('number');
    expectClose(at(hf2, 'F1') as number, before, { rel: 1e-9, source: 'pasted block equals the family' });
    hf2.setCellContents({ sheet: 0, col: 1, row: tgRow ?? 0 }, 150);
    const edited = compileMaterial({ ...getFamily('PC').params, Tg_C: 150 });
    expectClose(at(hf2, 'F1') as number, modulusMPa(edited, H, cToKelvin(160)), { rel: 1e-9, source: `${ENGINE} with Tg_C edited to 150` });
    expect(at(hf2, 'F1') as number).toBeGreaterThan(before);
    hf2.setCellContents({ sheet: 0, col: 1, row: tgRow ?? 0 }, 180);
    const outside = outcome(at(hf2, 'F1'));
    expect(outside).toMatchObject({ code: '#VALUE!' });
    expect((outside as { message: string }).message).toMatch(/^material: parameter Tg_high_C/);
    hf2.setCellContents({ sheet: 0, col: 1, row: tgRow ?? 0 }, 'hot');
    const bad = outcome(at(hf2, 'F1'));
    expect(bad).toMatchObject({ code: '#VALUE!' });
    expect((bad as { message: string }).message).toMatch(/^material: parameter Tg_C/);
    hf.destroy();
    hf2.destroy();
  });

  it('propagates error values through ranges and scalar arguments with their code', () => {
    const hf = derateWorkbook({
      S: [
        ['=DERATE.MODULUS("PX", 80, 1)', 70, 16, '=DERATE.GRID(A1:A2, B1, 1)', null, '=DERATE.EQTIME("PBT", B1:B2, C1:C2)', '=1/0'],
        ['PC', '=NA()', 8],
        ['=DERATE.MODULUS("PC", G1, 1)', '=DERATE.MODULUS("PC", 80, TRUE())'],
        [],
        ['=DERATE.FAMILIES()'],
      ],
    });
    expect(outcome(at(hf, 'F1'))).toMatchObject({ code: '#N/A' });
    expect((outcome(at(hf, 'F1')) as { message: string }).message).toContain('temperatures: cell 2: received the error #N/A');
    const grid = outcome(at(hf, 'D1'));
    expect(grid).toMatchObject({ code: '#N/A' });
    expect(outcome(at(hf, 'A3'))).toMatchObject({ code: '#DIV/0!' });
    const b = outcome(at(hf, 'B3'));
    expect(b).toMatchObject({ code: '#VALUE!' });
    expect((b as { message: string }).message).toContain('time: expects a time');
    expect(at(hf, 'A5')).toBe('symbol');
    expect(at(hf, `A${5 + FAMILIES.length}`)).toBe(FAMILIES[FAMILIES.length - 1]?.params.id);
    hf.destroy();
  });
});
