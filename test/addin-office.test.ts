/**
 * The Office adapter through Microsoft's real Excel JavaScript client (@microsoft/office-js 1.1.110, the
 * bundle Excel on the web loads), with only the transport stubbed: test/support/excel-host.ts answers the
 * JSON requests the client sends on context.sync() from an in-memory workbook. Object paths, load/sync,
 * property and method serialisation, _KeepReference tracking, result parsing, null objects, event
 * registration and error objects are the client's own code.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { getFamily } from '../src/index.js';
import { blockRows, familyBlockPlan } from '../addin/jobs/lookup/plan.js';
import { OfficeSheet } from '../addin/sheet/office-sheet.js';
import { MODULUS_NUMBER_FORMAT } from '../addin/sheet/port.js';
import { reviewPlan, type ReviewInput } from '../addin/jobs/review/plan.js';
import { commit, undo } from '../addin/shell/writer.js';
import { ExcelHost } from './support/excel-host.js';
import { loadOfficeJs, type OfficeJs } from './support/office-js.js';

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

let client: OfficeJs;
beforeAll(() => {
  client = loadOfficeJs();
});

function setup(names = ['Sheet1']): { host: ExcelHost; port: OfficeSheet } {
  const host = new ExcelHost(client, names);
  return { host, port: new OfficeSheet(host.run) };
}

/** Names of the method calls and property sets ("set X") of one sync's request, as the client serialised it. */
function members(host: ExcelHost, sync: number): string[] {
  const r = host.syncs.at(sync);
  if (!r) throw new Error(`no request ${sync}`);
  return r.Actions.filter((a) => (a.ActionType === 3 || a.ActionType === 4) && a.Name !== '_KeepReference').map(
    (a) => `${a.ActionType === 4 ? 'set ' : ''}${a.Name}`,
  );
}

const chartSpec = (sheet = 'Sheet1') => {
  const spec = reviewPlan(REVIEW).build(sheet, { row: 0, col: 0 }).chart;
  if (!spec) throw new Error('the review plan has no chart');
  return spec;
};

describe('Office adapter through the real Excel client', () => {
  it('reads the selection with its sheet, quoted names included, in one request', async () => {
    const { host, port } = setup(['Sheet1', 'Q3 review']);
    host.select('Q3 review', 'C4:D9');
    await expect(port.selection()).resolves.toEqual({ sheet: 'Q3 review', box: { top: 3, left: 2, bottom: 8, right: 3 } });
    // Excel quotes a sheet name with a space in an address (Microsoft Learn, "Excel.Range class", address: "Sheet1!A1:B4"; quoting from memory).
    host.select('Sheet1', 'B2');
    await expect(port.selection()).resolves.toEqual({ sheet: 'Sheet1', box: { top: 1, left: 1, bottom: 1, right: 1 } });
    expect(host.syncs).toHaveLength(2);
    expect(Object.values(host.syncs[0]?.ObjectPaths ?? {}).map((p) => p.Name)).toContain('GetSelectedRange');
  });

  it('calls the listener when the user selects other cells (Workbook.onSelectionChanged through the client)', async () => {
    const { host, port } = setup();
    let seen = 0;
    await port.watchSelection(() => seen++);
    host.select('Sheet1', 'B2');
    host.select('Sheet1', 'C3');
    await new Promise((r) => setTimeout(r, 0));
    expect(seen).toBe(2);
    await expect(port.selection()).resolves.toMatchObject({ box: { top: 2, left: 2 } });
  });

  it('lists the sheets and reads values and formulas, empty cells as ""', async () => {
    const { host, port } = setup(['Sheet1', 'Data']);
    host.put('Sheet1', 'B2', 7);
    host.put('Sheet1', 'A2', '=B2*2');
    await expect(port.sheetNames()).resolves.toEqual(['Sheet1', 'Data']);
    const got = await port.read({ sheet: 'Sheet1', box: { top: 0, left: 0, bottom: 1, right: 1 } });
    expect(got.formulas).toEqual([
      ['', ''],
      ['=B2*2', 7],
    ]);
    // The host does not calculate: a formula shows the text Excel gives an unknown name.
    expect(got.values).toEqual([
      ['', ''],
      ['#NAME?', 7],
    ]);
  });

  it('refuses a sheet that does not exist with the client error ItemNotFound', async () => {
    const { port } = setup();
    // Microsoft Learn, "Error handling with the application-specific JavaScript APIs": errors carry a code from Excel.ErrorCodes.
    await expect(port.read({ sheet: 'Nope', box: { top: 0, left: 0, bottom: 0, right: 0 } })).rejects.toMatchObject({
      code: 'ItemNotFound',
      name: 'RichApi.Error',
    });
  });

  it('writes a block in two requests: the old number formats, then formulas and formats together', async () => {
    const { host, port } = setup();
    const receipt = await port.write('Sheet1', { row: 1, col: 1 }, [
      [{ value: 'E_r' }, { value: 12.5, formula: '=DERATE.MODULUS("PC",80,"1000 h")', format: 'modulus' }],
      [{ value: '=not a formula' }, { value: 3 }],
    ]);
    expect(receipt).toEqual({
      sheet: 'Sheet1',
      box: { top: 1, left: 1, bottom: 2, right: 2 },
      previousFormats: [
        ['General', 'General'],
        ['General', 'General'],
      ],
    });
    expect(host.syncs).toHaveLength(2);
    expect(members(host, 1).filter((m) => m.startsWith('set '))).toEqual(['set Formulas', 'set NumberFormat']);
    expect(host.at('Sheet1', 'C2')).toMatchObject({ formula: '=DERATE.MODULUS("PC",80,"1000 h")', format: MODULUS_NUMBER_FORMAT });
    expect(host.at('Sheet1', 'B3')?.value).toBe('=not a formula');
    expect(host.references.size).toBe(0); // Excel.run released every range it kept
  });

  it('writes text that starts with a sign as text, not as a formula', async () => {
    const { port } = setup();
    // Microsoft Learn, "Excel.Range class", values: a value starting with "+", "-" or "=" is read as a formula.
    const texts = ['-40 degC is outside the data', '+ margin', '@ risk', '=A1'];
    await port.write('Sheet1', { row: 0, col: 0 }, [texts.map((value) => ({ value }))]);
    const got = await port.read({ sheet: 'Sheet1', box: { top: 0, left: 0, bottom: 0, right: 3 } });
    expect(got.values).toEqual([texts]);
  });

  it('clears contents and puts the old number formats back', async () => {
    const { host, port } = setup();
    const receipt = await port.write('Sheet1', { row: 0, col: 0 }, [[{ value: 5, formula: '=2+3', format: 'modulus' }]]);
    await port.clear(receipt);
    expect(host.at('Sheet1', 'A1')).toBeUndefined();
    expect(members(host, -1)).toEqual(['Clear', 'set NumberFormat']);
    await expect(port.sheetInUse('Sheet1')).resolves.toBe(false);
  });

  it('adds, activates, reports in use and removes a sheet', async () => {
    const { host, port } = setup();
    await port.addSheet('Review 1');
    expect(host.sheets.map((s) => s.name)).toEqual(['Sheet1', 'Review 1']);
    expect(host.active).toBe('Review 1');
    await expect(port.addSheet('review 1')).rejects.toMatchObject({ code: 'ItemAlreadyExists' });
    await expect(port.sheetInUse('Review 1')).resolves.toBe(false);
    host.put('Review 1', 'D4', 'x');
    await expect(port.sheetInUse('Review 1')).resolves.toBe(true);
    await port.removeSheet('Review 1');
    expect(host.sheets.map((s) => s.name)).toEqual(['Sheet1']);
  });

  it('builds an XY chart in one request: a curve per column of chart data, markers, a dashed reference, a log value axis', async () => {
    const { host, port } = setup();
    const spec = chartSpec();
    await port.addChart(spec);
    expect(host.syncs).toHaveLength(1);
    const [chart] = host.sheet('Sheet1').charts;
    // A one-column source added by 'Columns' gives one series (the stub's rule in excel-host-chart.ts, sourceSeries).
    expect(chart).toMatchObject({ type: 'XYScatterLines', seriesBy: 'Columns', name: 'Resin Derate chart A1', legend: 'Bottom' });
    // Block of 3 candidates x 3 temperatures at A1: chart data header on row 21, 51 curve rows 22-72, MAXTEMP rows 75-77.
    expect(chart?.series.map((s) => [s.name, s.x, s.y])).toEqual([
      ['PC', 'Sheet1!A22:A72', 'Sheet1!B22:B72'],
      ['POM', 'Sheet1!A22:A72', 'Sheet1!C22:C72'],
      ['PBT', 'Sheet1!A22:A72', 'Sheet1!D22:D72'],
      ['At the service temperatures', 'Sheet1!G22:G30', 'Sheet1!H22:H30'],
      ['MAXTEMP (required met up to)', 'Sheet1!C75:C77', 'Sheet1!D75:D77'],
      ['Required 800 MPa', 'Sheet1!A22:A72', 'Sheet1!E22:E72'],
    ]);
    expect(chart?.series.map((s) => s.lineStyle)).toEqual(['Continuous', 'Continuous', 'Continuous', 'None', 'None', 'Dash']);
    expect(chart?.series.map((s) => s.markerStyle)).toEqual(['None', 'None', 'None', 'Circle', 'Diamond', 'None']);
    expect(chart?.valueAxis).toEqual({ scaleType: 'Logarithmic', logBase: 10, minimum: spec.yMin, title: 'E_r, MPa (log scale)' });
    expect(chart?.categoryAxis.title).toBe('Temperature, degC');
    expect(chart?.position).toEqual(['J1', 'Q18']);
    await port.removeChart('Sheet1', spec.name);
    expect(host.sheet('Sheet1').charts).toEqual([]);
    await expect(port.removeChart('Sheet1', spec.name)).rejects.toThrow(/no chart named/);
  });

  it('removes a half-made chart when its request fails part-way', async () => {
    const { host, port } = setup();
    host.failOn = 'ChartSeries.SetXAxisValues';
    await expect(port.addChart(chartSpec())).rejects.toMatchObject({ code: 'GeneralException' });
    // charts.add and chart.name ran before the failing action; the adapter deleted the chart in a new batch.
    expect(host.syncs.length).toBeGreaterThanOrEqual(2);
    expect(members(host, -1)).toEqual(['Delete']);
    expect(host.sheet('Sheet1').charts).toHaveLength(0);
  });

  it('keeps the user data through the safe writer: occupied target, new sheet, undo', async () => {
    const { host, port } = setup();
    host.put('Sheet1', 'A3', 'my note');
    await expect(commit(port, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toThrow(/not empty/);
    expect(host.sheet('Sheet1').cells.size).toBe(1);
    const rec = await commit(port, reviewPlan(REVIEW), { newSheet: 'Review 1' });
    expect(host.sheets.map((s) => s.name)).toEqual(['Sheet1', 'Review 1']);
    expect(host.at('Review 1', 'B7')?.formula).toBe('=DERATE.MODULUS($A7,B$6,$B$3)');
    expect(host.sheet('Review 1').charts).toHaveLength(1);
    expect(await undo(port, rec)).toEqual({ status: 'done' });
    expect(host.sheets.map((s) => s.name)).toEqual(['Sheet1']);
    expect(host.at('Sheet1', 'A3')?.value).toBe('my note');
    expect(host.references.size).toBe(0);
  });

  it('asks before undoing a write whose cells the user has edited since', async () => {
    const { host, port } = setup();
    const rec = await commit(port, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } });
    host.put('Sheet1', 'B7', 1234);
    await expect(undo(port, rec)).resolves.toMatchObject({ status: 'changed', cells: 1 });
    expect(host.sheet('Sheet1').charts).toHaveLength(1);
    await expect(undo(port, rec, true)).resolves.toEqual({ status: 'done' });
    expect(host.sheet('Sheet1').cells.size).toBe(0);
    expect(host.sheet('Sheet1').charts).toHaveLength(0);
  });

  it('takes a write back when its chart fails, leaving the target empty', async () => {
    const { host, port } = setup();
    host.failOn = 'ChartCollection.Add';
    await expect(commit(port, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 4, col: 2 } })).rejects.toMatchObject({
      code: 'GeneralException',
    });
    expect([...host.sheet('Sheet1').cells.values()]).toEqual([]);
    expect(host.sheet('Sheet1').charts).toEqual([]);
  });

  it('writes a family block that reads back the same through the adapter', async () => {
    const { host, port } = setup();
    const f = getFamily('PA66-cond');
    await commit(port, familyBlockPlan(f), { sheet: 'Sheet1', topLeft: { row: 0, col: 5 } });
    const rows = blockRows(f);
    expect(host.at('Sheet1', 'F1')?.value).toBe('field');
    expect(host.at('Sheet1', 'G2')?.value).toBe('PA66-cond');
    // Tg_C's unit, below the text fields id, name, kind, shiftLaw and filler.
    expect(host.at('Sheet1', 'H7')?.value).toBe('degC');
    const back = await port.read({ sheet: 'Sheet1', box: { top: 1, left: 5, bottom: rows.length - 1, right: 5 } });
    expect(back.values.map((r) => r[0])).toEqual(rows.slice(1).map((r) => r[0]));
    expect(host.at('Sheet1', `F${rows.length + 1}`)).toBeUndefined();
  });
});

describe('Excel API requirement sets the adapter needs', () => {
  async function everything(port: OfficeSheet): Promise<void> {
    await port.watchSelection(() => undefined);
    await port.selection();
    const rec = await commit(port, reviewPlan(REVIEW), { newSheet: 'Review 1' });
    await undo(port, rec);
  }

  it('runs every operation on a host of ExcelApi 1.7', async () => {
    const host = new ExcelHost(client, ['Sheet1'], { excelApi: '1.7' });
    await expect(everything(new OfficeSheet(host.run))).resolves.toBeUndefined();
  });

  it('fails on a host of ExcelApi 1.6, and the writer takes its sheet back', async () => {
    // @types/office-js 1.0.612 (Microsoft's API reference): ChartSeriesCollection.add, ChartSeries.setXAxisValues,
    // ChartAxis.scaleType and logBase are [Api set: ExcelApi 1.7].
    const host = new ExcelHost(client, ['Sheet1'], { excelApi: '1.6' });
    await expect(everything(new OfficeSheet(host.run))).rejects.toMatchObject({
      code: 'ApiNotFound',
      message: expect.stringMatching(/1\.7/),
    });
    expect(host.sheets.map((s) => s.name)).toEqual(['Sheet1']);
    expect(host.sheet('Sheet1').charts).toEqual([]);
  });

  it('reads and writes cells on a host of ExcelApi 1.4 (charts aside)', async () => {
    const host = new ExcelHost(client, ['Sheet1'], { excelApi: '1.4' });
    const port = new OfficeSheet(host.run);
    const rec = await commit(port, familyBlockPlan(getFamily('PC')), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } });
    await expect(undo(port, rec)).resolves.toEqual({ status: 'done' });
    // Worksheet.getUsedRangeOrNullObject and ChartCollection.getCount are ExcelApi 1.4 (same source).
    await expect(new OfficeSheet(new ExcelHost(client, ['Sheet1'], { excelApi: '1.3' }).run).sheetInUse('Sheet1')).rejects.toMatchObject({
      code: 'ApiNotFound',
    });
  });
});
