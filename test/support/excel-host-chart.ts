/** The charts of the test host (test/support/excel-host.ts): collection, chart, series, axes, legend. */
import type { ExcelHost } from './excel-host.js';
import {
  a1,
  HostError,
  HostNode,
  parseBox,
  RangeNode,
  SheetBound,
  type HostChart,
  type HostSeries,
  type HostSheet,
} from './excel-host-sheet.js';

/** worksheet.charts: add, count, items by name or id. */
export class ChartsNode extends SheetBound {
  readonly kind = 'ChartCollection';
  private find(name: unknown): HostChart | undefined {
    return this.live().charts.find((c) => c.name === name || c.id === name);
  }
  override call(name: string, args: unknown[]): unknown {
    switch (name) {
      case 'Add': {
        const type = this.host.checkEnum('ChartType', args[0]);
        const by = args[2] === undefined || args[2] === null ? 'Auto' : this.host.checkEnum('ChartSeriesBy', args[2]);
        return new ChartNode(this.host, this.live(), newChart(this.host, this.live(), type, args[1] as HostNode, by));
      }
      case 'GetCount':
        return this.live().charts.length;
      case 'GetItem':
      case 'GetItemOrNullObject': {
        const c = this.find(args[0]);
        if (c) return new ChartNode(this.host, this.ws, c);
        if (name === 'GetItem') throw new HostError('ItemNotFound', `The requested resource doesn't exist: chart '${String(args[0])}'`);
        return null;
      }
      default:
        return super.call(name, args);
    }
  }
  override item(args: unknown[]): HostNode | null {
    return this.call('GetItem', args) as HostNode;
  }
}

/** A chart and the parts of it the adapter reaches (title, series, axes, legend, line format). */
class ChartNode extends SheetBound {
  readonly kind = 'Chart';
  protected override readonly scalars = ['Name', 'Id'];
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    readonly chart: HostChart,
  ) {
    super(host, ws);
  }
  private alive(): HostChart {
    if (!this.live().charts.includes(this.chart)) throw new HostError('ItemNotFound', `chart '${this.chart.name}' was deleted`);
    return this.chart;
  }
  override identity(): object {
    return { Id: this.alive().id };
  }
  override read(name: string): unknown {
    if (name === 'Name') return this.alive().name;
    if (name === 'Id') return this.alive().id;
    return super.read(name);
  }
  override assign(name: string, v: unknown): void {
    if (name === 'Name') this.alive().name = String(v);
    else super.assign(name, v);
  }
  override property(name: string): HostNode {
    const c = this.alive();
    switch (name) {
      case 'Title':
        return new Part(this.host, 'ChartTitle', { Text: (v) => (c.title = String(v)) });
      case 'Legend':
        return new Part(this.host, 'ChartLegend', { Position: (v) => (c.legend = this.host.checkEnum('ChartLegendPosition', v)) });
      case 'Series':
        return new SeriesCollectionNode(this.host, this.ws, c);
      case 'Axes':
        return new Part(this.host, 'ChartAxes', {}, { ValueAxis: () => this.axis('value'), CategoryAxis: () => this.axis('category') });
      default:
        return super.property(name);
    }
  }
  private axis(which: 'value' | 'category'): HostNode {
    const c = this.chart;
    const title = (): HostNode =>
      new Part(this.host, 'ChartAxisTitle', {
        Text: (v) => (which === 'value' ? (c.valueAxis.title = String(v)) : (c.categoryAxis.title = String(v))),
      });
    if (which === 'category') return new Part(this.host, 'ChartAxis', {}, { Title: title });
    return new Part(
      this.host,
      'ChartAxis',
      {
        ScaleType: (v) => (c.valueAxis.scaleType = this.host.checkEnum('ChartAxisScaleType', v)),
        LogBase: (v) => {
          // Microsoft Learn, "Excel.ChartAxis class", logBase: from 2 to 1000.
          if (typeof v !== 'number' || v < 2 || v > 1000)
            throw new HostError('InvalidArgument', `logBase ${String(v)} is outside 2 to 1000`);
          c.valueAxis.logBase = v;
        },
        Minimum: (v) => {
          if (typeof v !== 'number') throw new HostError('InvalidArgument', `minimum must be a number, not ${JSON.stringify(v)}`);
          c.valueAxis.minimum = v;
        },
      },
      { Title: title },
    );
  }
  override call(name: string, args: unknown[]): unknown {
    const c = this.alive();
    if (name === 'SetPosition') {
      const cellOf = (v: unknown): string => (v instanceof RangeNode ? a1(v.box) : a1(parseBox(String(v))));
      c.position = [cellOf(args[0]), args[1] === undefined || args[1] === null ? cellOf(args[0]) : cellOf(args[1])];
      return null;
    }
    if (name === 'Delete') {
      this.live().charts.splice(this.live().charts.indexOf(c), 1);
      return null;
    }
    return super.call(name, args);
  }
}

class SeriesCollectionNode extends SheetBound {
  readonly kind = 'ChartSeriesCollection';
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    private readonly chart: HostChart,
  ) {
    super(host, ws);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === 'GetItemAt') {
      const s = this.chart.series[Number(args[0])];
      if (!s) throw new HostError('ItemNotFound', `no series at index ${String(args[0])}`);
      return seriesNode(this.host, s);
    }
    if (name === 'Add') {
      const s: HostSeries = {
        name: typeof args[0] === 'string' ? args[0] : `Series${this.chart.series.length + 1}`,
        x: null,
        y: null,
        lineStyle: 'Continuous',
        markerStyle: 'Automatic',
      };
      this.chart.series.push(s);
      return seriesNode(this.host, s);
    }
    if (name === 'GetCount') return this.chart.series.length;
    return super.call(name, args);
  }
}

function seriesNode(host: ExcelHost, s: HostSeries): HostNode {
  const rangeArg = (v: unknown): string => {
    if (!(v instanceof RangeNode)) throw new HostError('InvalidArgument', 'a series takes its data from a range');
    return v.qualified();
  };
  const line = (): HostNode => new Part(host, 'ChartLineFormat', { LineStyle: (v) => (s.lineStyle = host.checkEnum('ChartLineStyle', v)) });
  return new Part(
    host,
    'ChartSeries',
    { Name: (v) => (s.name = String(v)), MarkerStyle: (v) => (s.markerStyle = host.checkEnum('ChartMarkerStyle', v)) },
    { Format: () => new Part(host, 'ChartSeriesFormat', {}, { Line: line }) },
    { SetXAxisValues: (a) => (s.x = rangeArg(a[0])), SetValues: (a) => (s.y = rangeArg(a[0])) },
  );
}

/** A small chart part: settable scalars, navigation properties and methods given as tables. */
class Part extends HostNode {
  constructor(
    host: ExcelHost,
    readonly kind: string,
    private readonly setters: Record<string, (v: unknown) => unknown>,
    private readonly children: Record<string, () => HostNode> = {},
    private readonly methods: Record<string, (args: unknown[]) => unknown> = {},
  ) {
    super(host);
  }
  override assign(name: string, v: unknown): void {
    const set = this.setters[name];
    if (set) set(v);
    else super.assign(name, v);
  }
  override property(name: string): HostNode {
    const child = this.children[name];
    return child ? child() : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    const m = this.methods[name];
    if (!m) return super.call(name, args);
    m(args);
    return null;
  }
}

/** What charts.add makes: one series from the source range, and the defaults of a new chart ("Chart n", "Series1", from memory). */
function newChart(host: ExcelHost, sheet: HostSheet, type: string, source: HostNode, seriesBy: string): HostChart {
  if (!(source instanceof RangeNode)) throw new HostError('InvalidArgument', 'charts.add needs a range as its source');
  const chart: HostChart = {
    id: `{chart-${host.newId()}}`,
    name: `Chart ${sheet.charts.length + 1}`,
    type,
    source: source.qualified(),
    seriesBy,
    title: '',
    series: sourceSeries(source, seriesBy),
    valueAxis: { scaleType: 'Linear', logBase: 10, minimum: null, title: '' },
    categoryAxis: { title: '' },
    legend: 'Right',
    position: null,
  };
  sheet.charts.push(chart);
  return chart;
}

/**
 * The series charts.add makes from its source: one per row ('Rows') or per column ('Columns'); 'Auto' runs
 * the series along the longer side (from memory of Excel's "Select Data" behaviour; Microsoft Learn,
 * "Excel.ChartCollection class", add: seriesBy "Specifies the way columns or rows are used as data series").
 * So a one-column range added 'Rows' gives a one-point series per cell, the mistake this rule catches.
 */
function sourceSeries(source: RangeNode, seriesBy: string): HostSeries[] {
  const { top, left, bottom, right } = source.box;
  const rows = bottom - top + 1;
  const cols = right - left + 1;
  const byRows = seriesBy === 'Rows' || (seriesBy === 'Auto' && cols >= rows);
  const count = byRows ? rows : cols;
  return Array.from({ length: count }, (_, i) => ({
    name: `Series${i + 1}`,
    x: null,
    y: source.qualifiedBox(byRows ? { top: top + i, left, bottom: top + i, right } : { top, left: left + i, bottom, right: left + i }),
    lineStyle: 'Continuous',
    markerStyle: 'Automatic',
  }));
}
