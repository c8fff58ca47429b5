/// <reference types="office-js" />
/**
 * A recorded-call fake of the parts of the Excel JavaScript API the Office adapter uses. Like the real
 * API it queues work until context.sync(): property writes and method calls run in order at sync, loaded
 * properties can be read only after a sync, and a failing operation stops the rest of its batch (what ran
 * before it stays, as in Excel). Every call is recorded in `calls` for the tests to check.
 */
import { boxAddress, parseRef, type Box } from '../addin/sheet/a1.js';

type Value = string | number | boolean;

interface FakeSeries {
  name: string;
  x: string | null;
  y: string | null;
  lineStyle: string;
  markerStyle: string;
}

export interface FakeChart {
  name: string;
  type: string;
  source: string;
  seriesBy: string;
  title: string;
  series: FakeSeries[];
  valueAxis: { scaleType: string; logBase: number; minimum: number | null; title: string };
  categoryAxis: { title: string };
  legend: string;
  position: [string, string] | null;
}

export interface FakeSheet {
  name: string;
  cells: Map<string, { value: Value; formula: Value; format: string }>;
  charts: FakeChart[];
}

const k = (r: number, c: number): string => `${r},${c}`;

export class FakeExcel {
  readonly calls: string[] = [];
  readonly sheets: FakeSheet[] = [];
  selection = 'Sheet1!A1';
  syncs = 0;
  readonly selectionHandlers: (() => Promise<void>)[] = [];
  /** What the user does in Excel: select other cells, and Excel raises the event. */
  async select(address: string): Promise<void> {
    this.selection = address;
    for (const h of this.selectionHandlers) await h();
  }
  /** Makes the named operation (as recorded, without arguments, e.g. 'series.setXAxisValues') throw during sync. */
  failOn: string | null = null;

  constructor(names: string[] = ['Sheet1']) {
    for (const n of names) this.sheets.push({ name: n, cells: new Map(), charts: [] });
  }

  sheet(name: string): FakeSheet {
    const s = this.sheets.find((x) => x.name.toLowerCase() === name.toLowerCase());
    if (!s) throw Object.assign(new Error(`ItemNotFound: worksheet ${name}`), { code: 'ItemNotFound' });
    return s;
  }

  /** Cell content for the tests: formula (or constant) and format. */
  at(sheet: string, address: string): { value: Value; formula: Value; format: string } | undefined {
    const c = parseRef(address).box;
    return this.sheet(sheet).cells.get(k(c.top, c.left));
  }

  put(sheet: string, address: string, value: Value): void {
    const c = parseRef(address).box;
    this.sheet(sheet).cells.set(k(c.top, c.left), { value, formula: value, format: 'General' });
  }

  /** The runner to hand to OfficeSheet: a fresh context per batch, like Excel.run. */
  readonly run = async <T>(batch: (context: Excel.RequestContext) => Promise<T>): Promise<T> => {
    const ctx = new FakeContext(this);
    this.calls.push('run');
    return batch(ctx as unknown as Excel.RequestContext);
  };
}

class FakeContext {
  readonly queue: { op: string; run: () => void }[] = [];
  readonly workbook: FakeWorkbook;
  constructor(readonly excel: FakeExcel) {
    this.workbook = new FakeWorkbook(this);
  }
  record(op: string, detail: string, run: () => void = () => undefined): void {
    this.excel.calls.push(detail);
    this.queue.push({ op, run });
  }
  async sync(): Promise<void> {
    this.excel.calls.push('sync');
    this.excel.syncs++;
    const work = this.queue.splice(0);
    for (const w of work) {
      if (this.excel.failOn === w.op)
        throw Object.assign(new Error(`GeneralException: ${w.op} failed (fake)`), { code: 'GeneralException' });
      w.run();
    }
  }
}

/** A loaded property is readable only after the sync that follows its load. */
class Loadable {
  private readonly loaded = new Set<string>();
  constructor(protected readonly ctx: FakeContext) {}
  protected markLoaded(names: string[]): void {
    for (const n of names) this.loaded.add(n);
  }
  protected need(name: string): void {
    if (!this.loaded.has(name)) throw new Error(`PropertyNotLoaded: ${name} was read before load() and sync()`);
  }
  protected loadNames(names: string | string[] | undefined): string[] {
    return (Array.isArray(names) ? names : (names ?? '').split(',')).map((s) => s.trim()).filter(Boolean);
  }
}

class FakeWorkbook {
  readonly worksheets: FakeWorksheets;
  readonly onSelectionChanged: { add(handler: () => Promise<void>): void };
  constructor(private readonly ctx: FakeContext) {
    this.worksheets = new FakeWorksheets(ctx);
    this.onSelectionChanged = {
      add: (handler) =>
        ctx.record('onSelectionChanged.add', 'workbook.onSelectionChanged.add()', () => ctx.excel.selectionHandlers.push(handler)),
    };
  }
  getSelectedRange(): FakeRange {
    const ref = parseRef(this.ctx.excel.selection);
    return new FakeRange(this.ctx, ref.sheet ?? 'Sheet1', ref.box, true);
  }
}

class FakeWorksheets extends Loadable {
  private names: string[] = [];
  get items(): { name: string }[] {
    this.need('items/name');
    return this.names.map((name) => ({ name }));
  }
  load(names: string): this {
    const list = this.loadNames(names);
    this.ctx.record('worksheets.load', `worksheets.load(${list.join(',')})`, () => {
      this.names = this.ctx.excel.sheets.map((s) => s.name);
      this.markLoaded(list);
    });
    return this;
  }
  getItem(name: string): FakeWorksheet {
    this.ctx.excel.calls.push(`worksheets.getItem(${name})`);
    return new FakeWorksheet(this.ctx, name);
  }
  add(name: string): FakeWorksheet {
    this.ctx.record('worksheets.add', `worksheets.add(${name})`, () => {
      if (this.ctx.excel.sheets.some((s) => s.name.toLowerCase() === name.toLowerCase())) throw new Error(`ItemAlreadyExists: ${name}`);
      this.ctx.excel.sheets.push({ name, cells: new Map(), charts: [] });
    });
    return new FakeWorksheet(this.ctx, name);
  }
}

class FakeWorksheet {
  readonly charts: FakeCharts;
  constructor(
    private readonly ctx: FakeContext,
    readonly name: string,
  ) {
    this.charts = new FakeCharts(ctx, name);
  }
  getRange(address: string): FakeRange {
    this.ctx.excel.calls.push(`${this.name}.getRange(${address})`);
    return new FakeRange(this.ctx, this.name, parseRef(address).box, false);
  }
  getUsedRangeOrNullObject(valuesOnly?: boolean): FakeRange {
    this.ctx.excel.calls.push(`${this.name}.getUsedRangeOrNullObject(${String(valuesOnly)})`);
    const r = new FakeRange(this.ctx, this.name, { top: 0, left: 0, bottom: 0, right: 0 }, false);
    r.usedRange = true;
    return r;
  }
  activate(): void {
    this.ctx.record('worksheet.activate', `${this.name}.activate()`);
  }
  delete(): void {
    this.ctx.record('worksheet.delete', `${this.name}.delete()`, () => {
      const ex = this.ctx.excel;
      ex.sheet(this.name);
      ex.sheets.splice(
        ex.sheets.findIndex((s) => s.name === this.name),
        1,
      );
    });
  }
}

class FakeRange extends Loadable {
  usedRange = false;
  isNullObject = false;
  private data: { values: Value[][]; formulas: Value[][]; numberFormat: string[][]; address: string } | null = null;
  constructor(
    ctx: FakeContext,
    private readonly sheetName: string,
    private readonly box: Box,
    private readonly selected: boolean,
  ) {
    super(ctx);
  }
  private label(): string {
    return this.selected ? 'selection' : `range(${this.sheetName}!${boxAddress(this.box)})`;
  }
  load(names: string | string[]): this {
    const list = this.loadNames(names);
    this.ctx.record('range.load', `${this.label()}.load(${list.join(',')})`, () => {
      const sheet = this.ctx.excel.sheet(this.sheetName);
      if (this.usedRange) {
        this.isNullObject = sheet.cells.size === 0;
        this.markLoaded(list);
        return;
      }
      const rows = (f: (c: { value: Value; formula: Value; format: string } | undefined) => Value): Value[][] => {
        const out: Value[][] = [];
        for (let r = this.box.top; r <= this.box.bottom; r++) {
          const row: Value[] = [];
          for (let c = this.box.left; c <= this.box.right; c++) row.push(f(sheet.cells.get(k(r, c))));
          out.push(row);
        }
        return out;
      };
      this.data = {
        values: rows((c) => c?.value ?? ''),
        formulas: rows((c) => c?.formula ?? ''),
        numberFormat: rows((c) => c?.format ?? 'General') as string[][],
        address: `${this.sheetName}!${boxAddress(this.box)}`,
      };
      this.markLoaded(list);
    });
    return this;
  }
  get address(): string {
    this.need('address');
    return this.data?.address ?? `${this.sheetName}!${boxAddress(this.box)}`;
  }
  get values(): Value[][] {
    this.need('values');
    return this.data?.values ?? [];
  }
  get formulas(): Value[][] {
    this.need('formulas');
    return this.data?.formulas ?? [];
  }
  set formulas(m: Value[][]) {
    this.ctx.record('range.formulas', `${this.label()}.formulas = ${JSON.stringify(m)}`, () => {
      const sheet = this.ctx.excel.sheet(this.sheetName);
      this.each(m, (r, c, v) => {
        const old = sheet.cells.get(k(r, c));
        const format = old?.format ?? 'General';
        if (v === '') {
          if (format === 'General') sheet.cells.delete(k(r, c));
          else sheet.cells.set(k(r, c), { value: '', formula: '', format });
          return;
        }
        // The fake does not evaluate formulas; it stores their text as the value too. A leading
        // apostrophe marks text and is not part of the value (Excel reads back formulas without it too).
        const text = typeof v === 'string' && v.startsWith("'") ? v.slice(1) : v;
        sheet.cells.set(k(r, c), { value: text, formula: text, format });
      });
    });
  }
  get numberFormat(): string[][] {
    this.need('numberFormat');
    return this.data?.numberFormat ?? [];
  }
  set numberFormat(m: string[][]) {
    this.ctx.record('range.numberFormat', `${this.label()}.numberFormat = ${JSON.stringify(m)}`, () => {
      const sheet = this.ctx.excel.sheet(this.sheetName);
      this.each(m, (r, c, f) => {
        const old = sheet.cells.get(k(r, c));
        const value = old?.value ?? '';
        if (value === '' && f === 'General') sheet.cells.delete(k(r, c));
        else sheet.cells.set(k(r, c), { value, formula: old?.formula ?? '', format: String(f) });
      });
    });
  }
  clear(applyTo?: string): void {
    this.ctx.record('range.clear', `${this.label()}.clear(${applyTo ?? ''})`, () => {
      const sheet = this.ctx.excel.sheet(this.sheetName);
      for (let r = this.box.top; r <= this.box.bottom; r++) {
        for (let c = this.box.left; c <= this.box.right; c++) {
          const old = sheet.cells.get(k(r, c));
          if (!old) continue;
          if (applyTo === 'Contents') sheet.cells.set(k(r, c), { value: '', formula: '', format: old.format });
          else sheet.cells.delete(k(r, c));
        }
      }
    });
  }
  /** Ranges handed to charts are identified by their address. */
  addressForChart(): string {
    return `${this.sheetName}!${boxAddress(this.box)}`;
  }
  private each<V>(m: V[][], f: (r: number, c: number, v: V) => void): void {
    const rows = this.box.bottom - this.box.top + 1;
    const cols = this.box.right - this.box.left + 1;
    if (m.length !== rows || m.some((row) => row.length !== cols)) {
      throw new Error(`InvalidArgument: a ${m.length}-row matrix does not fit ${boxAddress(this.box)}`);
    }
    m.forEach((row, r) => row.forEach((v, c) => f(this.box.top + r, this.box.left + c, v)));
  }
}

class FakeCharts {
  constructor(
    private readonly ctx: FakeContext,
    private readonly sheetName: string,
  ) {}
  add(type: string, source: FakeRange, seriesBy: string): FakeChartProxy {
    const chart: FakeChart = {
      name: '',
      type,
      source: source.addressForChart(),
      seriesBy,
      title: '',
      series: [],
      valueAxis: { scaleType: 'Linear', logBase: 10, minimum: null, title: '' },
      categoryAxis: { title: '' },
      legend: 'Right',
      position: null,
    };
    this.ctx.record('charts.add', `${this.sheetName}.charts.add(${type}, ${chart.source}, ${seriesBy})`, () => {
      chart.series.push({ name: 'Series1', x: null, y: chart.source, lineStyle: 'Continuous', markerStyle: 'Automatic' });
      this.ctx.excel.sheet(this.sheetName).charts.push(chart);
    });
    return new FakeChartProxy(this.ctx, chart, this.sheetName);
  }
  getCount(): { value: number } {
    const result = { value: NaN };
    this.ctx.record('charts.getCount', `${this.sheetName}.charts.getCount()`, () => {
      result.value = this.ctx.excel.sheet(this.sheetName).charts.length;
    });
    return result;
  }
  getItemOrNullObject(name: string): { isNullObject: boolean; delete(): void } {
    const result = {
      isNullObject: true,
      delete: (): void => {
        this.ctx.record('chart.delete', `${this.sheetName}.charts[${name}].delete()`, () => {
          const list = this.ctx.excel.sheet(this.sheetName).charts;
          const i = list.findIndex((c) => c.name === name);
          if (i < 0) throw new Error(`ItemNotFound: chart ${name}`);
          list.splice(i, 1);
        });
      },
    };
    this.ctx.record('charts.getItemOrNullObject', `${this.sheetName}.charts.getItemOrNullObject(${name})`, () => {
      result.isNullObject = !this.ctx.excel.sheet(this.sheetName).charts.some((c) => c.name === name);
    });
    return result;
  }
}

class FakeChartProxy {
  readonly title: { text: string };
  readonly axes: { valueAxis: Record<string, unknown>; categoryAxis: { title: { text: string } } };
  readonly legend: { position: string };
  readonly series: { getItemAt(i: number): FakeSeriesProxy; add(name?: string): FakeSeriesProxy };
  constructor(
    private readonly ctx: FakeContext,
    private readonly chart: FakeChart,
    sheetName: string,
  ) {
    const rec = (op: string, detail: string, run: () => void): void => ctx.record(op, `chart.${detail}`, run);
    this.title = setter({ text: '' }, (p, v) => rec('chart.title', `title.${p} = ${String(v)}`, () => (chart.title = String(v))));
    const axisTitle = setter({ text: '' }, (_p, v) =>
      rec('axis.title', `valueAxis.title.text = ${String(v)}`, () => (chart.valueAxis.title = String(v))),
    );
    const valueAxis = setter({ scaleType: '', logBase: 0, minimum: 0 } as Record<string, unknown>, (p, v) =>
      rec(`valueAxis.${p}`, `valueAxis.${p} = ${String(v)}`, () => {
        (chart.valueAxis as Record<string, unknown>)[p] = v;
      }),
    );
    Object.defineProperty(valueAxis, 'title', { value: axisTitle });
    this.axes = {
      valueAxis,
      categoryAxis: {
        title: setter({ text: '' }, (_p, v) =>
          rec('axis.title', `categoryAxis.title.text = ${String(v)}`, () => (chart.categoryAxis.title = String(v))),
        ),
      },
    };
    this.legend = setter({ position: '' }, (_p, v) => rec('legend', `legend.position = ${String(v)}`, () => (chart.legend = String(v))));
    this.series = {
      getItemAt: (i: number) => new FakeSeriesProxy(ctx, chart, () => chart.series[i], `series[${i}]`),
      add: (name?: string) => {
        let made: FakeSeries | undefined;
        rec('series.add', `series.add(${name ?? ''})`, () => {
          made = { name: name ?? '', x: null, y: null, lineStyle: 'Continuous', markerStyle: 'Automatic' };
          chart.series.push(made);
        });
        return new FakeSeriesProxy(ctx, chart, () => made, `series(${name ?? ''})`);
      },
    };
    void sheetName;
  }
  set name(v: string) {
    this.ctx.record('chart.name', `chart.name = ${v}`, () => (this.chart.name = v));
  }
  setPosition(start: string, end?: string): void {
    this.ctx.record('chart.setPosition', `chart.setPosition(${start}, ${end ?? ''})`, () => (this.chart.position = [start, end ?? start]));
  }
}

class FakeSeriesProxy {
  readonly format: { line: { lineStyle: string } };
  constructor(
    private readonly ctx: FakeContext,
    _chart: FakeChart,
    private readonly target: () => FakeSeries | undefined,
    private readonly label: string,
  ) {
    this.format = {
      line: setter({ lineStyle: '' }, (_p, v) =>
        ctx.record('series.lineStyle', `${label}.format.line.lineStyle = ${String(v)}`, () => (this.get().lineStyle = String(v))),
      ),
    };
  }
  private get(): FakeSeries {
    const s = this.target();
    if (!s) throw new Error(`ItemNotFound: ${this.label}`);
    return s;
  }
  set name(v: string) {
    this.ctx.record('series.name', `${this.label}.name = ${v}`, () => (this.get().name = v));
  }
  set markerStyle(v: string) {
    this.ctx.record('series.markerStyle', `${this.label}.markerStyle = ${v}`, () => (this.get().markerStyle = v));
  }
  setXAxisValues(r: FakeRange): void {
    const a = r.addressForChart();
    this.ctx.record('series.setXAxisValues', `${this.label}.setXAxisValues(${a})`, () => (this.get().x = a));
  }
  setValues(r: FakeRange): void {
    const a = r.addressForChart();
    this.ctx.record('series.setValues', `${this.label}.setValues(${a})`, () => (this.get().y = a));
  }
}

/** An object whose property writes are reported (and not stored: like a proxy object in Office.js). */
function setter<T extends Record<string, unknown>>(shape: T, onSet: (prop: string, value: unknown) => void): T {
  const o = {} as T;
  for (const p of Object.keys(shape)) {
    Object.defineProperty(o, p, { set: (v: unknown) => onSet(p, v), get: () => undefined, enumerable: true });
  }
  return o;
}
