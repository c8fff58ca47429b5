/**
 * The Office adapter against a recorded-call fake of the Excel JavaScript API (test/office-fake.ts):
 * the calls it makes, how many batches, and that the safe writer keeps its promises through it.
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../src/index.js';
import { blockRows, familyBlockPlan } from '../addin/jobs/lookup/plan.js';
import { OfficeSheet } from '../addin/sheet/office-sheet.js';
import { MODULUS_NUMBER_FORMAT } from '../addin/sheet/port.js';
import { reviewPlan, type ReviewInput } from '../addin/jobs/review/plan.js';
import { commit, undo } from '../addin/shell/writer.js';
import { FakeExcel } from './office-fake.js';

const REVIEW: ReviewInput = {
  candidates: [
    { kind: 'family', id: 'PC' },
    { kind: 'family', id: 'POM' },
    { kind: 'family', id: 'PBT' },
  ],
  temperaturesC: [23, 60, 100],
  load: { kind: 'time', time: '1000 h' },
  requiredMPa: 800,
};

function setup(names = ['Sheet1']): { excel: FakeExcel; port: OfficeSheet } {
  const excel = new FakeExcel(names);
  return { excel, port: new OfficeSheet(excel.run) };
}

describe('Office adapter', () => {
  it('reads the selection with its sheet, quoted names included', async () => {
    const { excel, port } = setup(['Sheet1', 'Q3 review']);
    excel.selection = "'Q3 review'!C4:D9";
    await expect(port.selection()).resolves.toEqual({ sheet: 'Q3 review', box: { top: 3, left: 2, bottom: 8, right: 3 } });
    expect(excel.calls).toEqual(['run', 'selection.load(address)', 'sync']);
  });

  it('reports selection changes through the workbook event', async () => {
    const { excel, port } = setup();
    let seen = 0;
    await port.watchSelection(() => seen++);
    expect(excel.calls).toContain('workbook.onSelectionChanged.add()');
    await excel.select('Sheet1!B2');
    await excel.select('Sheet1!C3');
    expect(seen).toBe(2);
    await expect(port.selection()).resolves.toMatchObject({ box: { top: 2, left: 2 } });
  });

  it('reads values and formulas only after a sync', async () => {
    const { excel, port } = setup();
    excel.put('Sheet1', 'B2', 7);
    const got = await port.read({ sheet: 'Sheet1', box: { top: 0, left: 0, bottom: 1, right: 1 } });
    expect(got.values).toEqual([
      ['', ''],
      ['', 7],
    ]);
  });

  it('writes a block in one batch: formulas and number formats together, after reading the old formats', async () => {
    const { excel, port } = setup();
    const receipt = await port.write('Sheet1', { row: 1, col: 1 }, [
      [{ value: 'E_r' }, { value: 12.5, formula: '=DERATE.MODULUS("PC",80,"1000 h")', format: 'modulus' }],
      [{ value: '=not a formula' }, { value: 3 }],
    ]);
    expect(receipt.box).toEqual({ top: 1, left: 1, bottom: 2, right: 2 });
    expect(excel.calls.filter((c) => c === 'sync')).toHaveLength(2);
    const writes = excel.calls.slice(excel.calls.lastIndexOf('sync', excel.calls.length - 2) + 1);
    expect(writes[0]).toBe('range(Sheet1!B2:C3).formulas = [["E_r","=DERATE.MODULUS(\\"PC\\",80,\\"1000 h\\")"],["\'=not a formula",3]]');
    expect(writes[1]).toBe(`range(Sheet1!B2:C3).numberFormat = [["General","${MODULUS_NUMBER_FORMAT}"],["General","General"]]`);
    expect(writes[2]).toBe('sync');
    expect(excel.at('Sheet1', 'C2')).toMatchObject({ formula: '=DERATE.MODULUS("PC",80,"1000 h")', format: MODULUS_NUMBER_FORMAT });
    expect(excel.at('Sheet1', 'B3')?.value).toBe('=not a formula');
  });

  it('clears contents and puts the old number formats back', async () => {
    const { excel, port } = setup();
    const receipt = await port.write('Sheet1', { row: 0, col: 0 }, [[{ value: 5, formula: '=2+3', format: 'modulus' }]]);
    await port.clear(receipt);
    expect(excel.at('Sheet1', 'A1')).toBeUndefined();
    expect(excel.calls).toContain('range(Sheet1!A1).clear(Contents)');
  });

  it('builds an XY chart with one named series per row, a dashed reference, and a log value axis', async () => {
    const { excel, port } = setup();
    const plan = reviewPlan(REVIEW);
    const spec = plan.build('Sheet1', { row: 0, col: 0 }).chart;
    if (!spec) throw new Error('no chart');
    await port.addChart(spec);
    const [chart] = excel.sheet('Sheet1').charts;
    expect(chart?.type).toBe('XYScatterLines');
    expect(chart?.seriesBy).toBe('Rows');
    expect(chart?.name).toBe('Resin Derate chart A1');
    expect(chart?.series.map((s) => [s.name, s.x, s.y])).toEqual([
      ['PC', 'Sheet1!B6:D6', 'Sheet1!B7:D7'],
      ['POM', 'Sheet1!B6:D6', 'Sheet1!B8:D8'],
      ['PBT', 'Sheet1!B6:D6', 'Sheet1!B9:D9'],
      ['Required 800 MPa', 'Sheet1!B6:D6', 'Sheet1!B10:D10'],
    ]);
    expect(chart?.series[3]?.lineStyle).toBe('Dash');
    expect(chart?.series[0]?.lineStyle).toBe('Continuous');
    expect(chart?.valueAxis).toMatchObject({ scaleType: 'Logarithmic', logBase: 10, minimum: spec.yMin, title: 'E_r, MPa (log scale)' });
    expect(chart?.categoryAxis.title).toBe('Temperature, degC');
    expect(chart?.position).toEqual(['H1', 'O18']);
    expect(excel.calls.filter((c) => c === 'run')).toHaveLength(1);
  });

  it('removes a half-made chart when its batch fails', async () => {
    const { excel, port } = setup();
    const spec = reviewPlan(REVIEW).build('Sheet1', { row: 0, col: 0 }).chart;
    if (!spec) throw new Error('no chart');
    excel.failOn = 'series.setXAxisValues';
    await expect(port.addChart(spec)).rejects.toThrow(/GeneralException/);
    // charts.add and chart.name ran before the failure, as in Excel; the adapter deleted the chart again.
    expect(excel.calls).toContain('Sheet1.charts[Resin Derate chart A1].delete()');
    expect(excel.sheet('Sheet1').charts).toHaveLength(0);
  });

  it('keeps the user data through the safe writer: occupied target, new sheet, undo', async () => {
    const { excel, port } = setup();
    excel.put('Sheet1', 'A3', 'my note');
    await expect(commit(port, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toThrow(/not empty/);
    expect(excel.sheet('Sheet1').cells.size).toBe(1);
    const rec = await commit(port, reviewPlan(REVIEW), { newSheet: 'Review 1' });
    expect(excel.sheets.map((s) => s.name)).toEqual(['Sheet1', 'Review 1']);
    expect(excel.at('Review 1', 'B7')?.formula).toBe('=DERATE.MODULUS($A7,B$6,$B$3)');
    expect(excel.sheet('Review 1').charts).toHaveLength(1);
    expect(await undo(port, rec)).toEqual({ status: 'done' });
    expect(excel.sheets.map((s) => s.name)).toEqual(['Sheet1']);
    expect(excel.at('Sheet1', 'A3')?.value).toBe('my note');
  });

  it('takes a write back when its chart fails, leaving the target empty', async () => {
    const { excel, port } = setup();
    excel.failOn = 'charts.add';
    await expect(commit(port, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 4, col: 2 } })).rejects.toThrow(/GeneralException/);
    const left = [...excel.sheet('Sheet1').cells.values()].filter((c) => c.value !== '' || c.format !== 'General');
    expect(left).toEqual([]);
  });

  it('writes a family block that reads back the same through the adapter', async () => {
    const { excel, port } = setup();
    const f = getFamily('PA66-cond');
    await commit(port, familyBlockPlan(f), { sheet: 'Sheet1', topLeft: { row: 0, col: 5 } });
    const rows = blockRows(f);
    expect(excel.at('Sheet1', 'F1')?.value).toBe('field');
    expect(excel.at('Sheet1', 'F2')?.value).toBe('id');
    expect(excel.at('Sheet1', 'G2')?.value).toBe('PA66-cond');
    expect(excel.at('Sheet1', 'H6')?.value).toBe('degC');
    expect(excel.at('Sheet1', `F${rows.length}`)?.value).toBe(rows[rows.length - 1]?.[0]);
    expect(excel.at('Sheet1', `F${rows.length + 1}`)).toBeUndefined();
  });
});
