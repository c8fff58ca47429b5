/**
 * The pane's formulas evaluated by the real worksheet functions in a spreadsheet engine (HyperFormula,
 * dev only): every formula cell of a review must show the value the pane computed for it. The functions
 * live on their own branch; until they are merged here this file is skipped (the modules are imported by
 * computed path so that the type check does not need them).
 */
import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileMaterial, cToKelvin, getFamily, modulusMPa, simulateHdt } from '../src/index.js';
import { readCalibration } from '../addin/jobs/calibrate/request.js';
import { calibrationPlan, runCalibration } from '../addin/jobs/calibrate/plan.js';
import { cellAddress } from '../addin/sheet/a1.js';
import { blockRows } from '../addin/jobs/lookup/plan.js';
import { reviewPlan, type Load } from '../addin/jobs/review/plan.js';
import { expectClose } from './expect.js';

const HOST = '../functions/host/hyperformula.js';
const LOADER = './support/functions.js';
const present =
  existsSync(new URL(HOST.replace(/\.js$/, '.ts'), import.meta.url)) &&
  existsSync(new URL(LOADER.replace(/\.js$/, '.ts'), import.meta.url));

interface Engine {
  getSheetId(name: string): number | undefined;
  getCellValue(a: { sheet: number; row: number; col: number }): unknown;
}

const LOADS: Load[] = [
  { kind: 'time', time: '1000 h' },
  {
    kind: 'cycle',
    steps: [
      { temperatureC: 70, hours: 8 },
      { temperatureC: 30, hours: 16 },
    ],
    cycles: 3650,
  },
];

describe.skipIf(!present)('review formulas in HyperFormula with the DERATE functions', () => {
  for (const load of LOADS) {
    it(`evaluate to the values the pane shows (${load.kind})`, async () => {
      const { loadFunctions } = (await import(LOADER)) as { loadFunctions: () => Promise<unknown> };
      const { derateWorkbook } = (await import(HOST)) as { derateWorkbook: (s: Record<string, unknown[][]>) => Engine };
      await loadFunctions();
      const pp = getFamily('PP');
      const block = blockRows(pp);
      const sheet1: unknown[][] = block.map((r) => [null, null, null, ...r]);
      const plan = reviewPlan({
        candidates: [
          { kind: 'family', id: 'PC' },
          { kind: 'family', id: 'PBT' },
          { kind: 'block', range: { sheet: 'Sheet1', box: { top: 0, left: 3, bottom: block.length - 1, right: 6 } }, params: pp.params },
        ],
        temperaturesC: [23, 40, 60, 80, 100],
        load,
        requiredMPa: 800,
      });
      const { cells } = plan.build('Review', { row: 1, col: 1 });
      const grid: unknown[][] = [[]];
      cells.forEach((row, r) => (grid[r + 1] = [null, ...row.map((c) => c.formula ?? (c.value === '' ? null : c.value))]));
      const hf = derateWorkbook({ Sheet1: sheet1, Review: grid });
      const sheet = hf.getSheetId('Review') ?? -1;
      let checked = 0;
      cells.forEach((row, r) =>
        row.forEach((c, j) => {
          if (!c.formula) return;
          const where = `Review!${cellAddress({ row: r + 1, col: j + 1 })} ${c.formula}`;
          const v = hf.getCellValue({ sheet, row: r + 1, col: j + 1 });
          if (typeof c.value === 'number') {
            expect(typeof v, `${where} gave ${JSON.stringify(v)}`).toBe('number');
            expectClose(v as number, c.value, {
              rel: 1e-9,
              source: `${where}: the worksheet function against the pane's engine call (consistency)`,
            });
          } else expect(v, where).toBe(c.value);
          checked++;
        }),
      );
      // The table (3 x 5 moduli, 3 lowest and verdicts, 5 required), then the chart data: 51 temperatures x
      // (3 curves + required), 3 x 5 service points of two cells, and under a time 3 MAXTEMP rows of three.
      expect(checked).toBe(3 * 5 + 3 * 2 + 5 + 51 * 4 + 15 * 2 + (load.kind === 'time' ? 3 * 3 : 0));
    });
  }

  it('read a calibrated block the pane writes as the material it is', async () => {
    const { loadFunctions } = (await import(LOADER)) as { loadFunctions: () => Promise<unknown> };
    const { derateWorkbook } = (await import(HOST)) as { derateWorkbook: (s: Record<string, unknown[][]>) => Engine };
    await loadFunctions();
    // INVENTED datasheet numbers of a made-up PBT grade.
    const req = readCalibration({
      start: 'PBT',
      modulus23: '2600',
      hdtA: '62',
      hdtB: '160',
      tg: '',
      tm: '',
      creepModulus: '',
      creepTime: '',
      creepTemperature: '',
      id: 'PBT-invented',
    });
    const result = runCalibration(req);
    const { cells } = calibrationPlan(req, result).build('Sheet1', { row: 0, col: 0 });
    const grid: unknown[][] = cells.map((r) => r.map((c) => (c.value === '' ? null : c.value)));
    const formulas = ['=DERATE.MODULUS(Sheet1!A1:D30,80,"1000 h")', '=DERATE.HDT(Sheet1!A1:D30,"A")', '=DERATE.HDT(Sheet1!A1:D30,"B")'];
    const hf = derateWorkbook({ Sheet1: grid, Check: [formulas] });
    const sheet = hf.getSheetId('Check') ?? -1;
    const m = compileMaterial(result.params);
    const expected = [modulusMPa(m, 3.6e6, cToKelvin(80)), simulateHdt(m, 1.8).temperatureC, simulateHdt(m, 0.45).temperatureC];
    expected.forEach((x, col) => {
      const v = hf.getCellValue({ sheet, row: 0, col });
      expect(typeof v, `${formulas[col]} gave ${JSON.stringify(v)}`).toBe('number');
      expectClose(v as number, x ?? NaN, {
        rel: 1e-12,
        source: `${formulas[col]}: the worksheet function on the written block against the engine on the calibrated record (identity)`,
      });
    });
  });
});
