/// <reference types="office-js" />
/**
 * The Office adapter of the sheet port: each operation is one Excel.run batch over ranges and charts.
 * The batch runner is injected, so tests drive this code through Microsoft's Excel client with a stub host.
 * Only string literals of the Excel enums are used, so no Excel global is needed until run() is called.
 */
import { boxAddress, cellAddress, parseRef, type Cell } from './a1.js';
import {
  MODULUS_NUMBER_FORMAT,
  type CellValue,
  type CellWrite,
  type ChartSeries,
  type ChartSpec,
  type RangeContent,
  type SheetPort,
  type SheetRange,
  type WriteReceipt,
} from './port.js';

export type ExcelRun = <T>(batch: (context: Excel.RequestContext) => Promise<T>) => Promise<T>;

/** The real runner, for use inside Excel once Office.onReady has reported an Excel host. */
export const excelRun: ExcelRun = (batch) => Excel.run(batch);

type Matrix = (string | number | boolean)[][];

/**
 * A constant that Excel would read as a formula is written as text: Excel reads a value starting with "+",
 * "-" or "=" as a formula (Microsoft Learn, "Excel.Range class", values), and "@" as an implicit intersection.
 */
function constant(v: CellValue): string | number | boolean {
  return typeof v === 'string' && /^[=+\-@]/.test(v) ? `'${v}` : v;
}

export class OfficeSheet implements SheetPort {
  readonly host = 'office' as const;
  constructor(private readonly run: ExcelRun = excelRun) {}

  selection(): Promise<SheetRange> {
    return this.run(async (ctx) => {
      const r = ctx.workbook.getSelectedRange();
      r.load('address');
      await ctx.sync();
      const ref = parseRef(r.address);
      if (ref.sheet === null) throw new Error(`Excel reported the selection '${r.address}' without its sheet`);
      return { sheet: ref.sheet, box: ref.box };
    });
  }

  sheetNames(): Promise<string[]> {
    return this.run(async (ctx) => {
      const sheets = ctx.workbook.worksheets;
      sheets.load('items/name');
      await ctx.sync();
      return sheets.items.map((s) => s.name);
    });
  }

  read(range: SheetRange): Promise<RangeContent> {
    return this.run(async (ctx) => {
      const r = ctx.workbook.worksheets.getItem(range.sheet).getRange(boxAddress(range.box));
      r.load(['values', 'formulas']);
      await ctx.sync();
      return { values: r.values as CellValue[][], formulas: r.formulas as CellValue[][] };
    });
  }

  write(sheet: string, topLeft: Cell, cells: readonly (readonly CellWrite[])[]): Promise<WriteReceipt> {
    const rows = cells.length;
    const cols = Math.max(0, ...cells.map((r) => r.length));
    if (rows === 0 || cols === 0) return Promise.reject(new Error('nothing to write'));
    const box = { top: topLeft.row, left: topLeft.col, bottom: topLeft.row + rows - 1, right: topLeft.col + cols - 1 };
    return this.run(async (ctx) => {
      const range = ctx.workbook.worksheets.getItem(sheet).getRange(boxAddress(box));
      range.load('numberFormat');
      await ctx.sync();
      const previousFormats = (range.numberFormat as string[][]).map((r) => r.map(String));
      const formulas: Matrix = [];
      const formats: string[][] = [];
      for (let r = 0; r < rows; r++) {
        const fr: (string | number | boolean)[] = [];
        const nr: string[] = [];
        for (let c = 0; c < cols; c++) {
          const w = cells[r]?.[c];
          fr.push(w === undefined ? '' : (w.formula ?? constant(w.value)));
          nr.push(w?.format === 'modulus' ? MODULUS_NUMBER_FORMAT : (previousFormats[r]?.[c] ?? 'General'));
        }
        formulas.push(fr);
        formats.push(nr);
      }
      range.formulas = formulas;
      range.numberFormat = formats;
      await ctx.sync();
      return { sheet, box, previousFormats };
    });
  }

  clear(receipt: WriteReceipt): Promise<void> {
    return this.run(async (ctx) => {
      const range = ctx.workbook.worksheets.getItem(receipt.sheet).getRange(boxAddress(receipt.box));
      range.clear('Contents');
      range.numberFormat = receipt.previousFormats;
      await ctx.sync();
    });
  }

  addSheet(name: string): Promise<void> {
    return this.run(async (ctx) => {
      const ws = ctx.workbook.worksheets.add(name);
      ws.activate();
      await ctx.sync();
    });
  }

  removeSheet(name: string): Promise<void> {
    return this.run(async (ctx) => {
      ctx.workbook.worksheets.getItem(name).delete();
      await ctx.sync();
    });
  }

  sheetInUse(name: string): Promise<boolean> {
    return this.run(async (ctx) => {
      const ws = ctx.workbook.worksheets.getItem(name);
      const used = ws.getUsedRangeOrNullObject(true);
      used.load('address');
      const charts = ws.charts.getCount();
      await ctx.sync();
      return !used.isNullObject || charts.value > 0;
    });
  }

  async addChart(spec: ChartSpec): Promise<void> {
    const [first, ...rest] = spec.series;
    if (!first) throw new Error('a chart needs at least one series');
    try {
      await this.run(async (ctx) => {
        const ws = ctx.workbook.worksheets.getItem(spec.sheet);
        const rangeOf = (s: SheetRange): Excel.Range => ctx.workbook.worksheets.getItem(s.sheet).getRange(boxAddress(s.box));
        // A one-column source is one series down the column; 'Rows' would make a series of each cell.
        const by = first.y.box.left === first.y.box.right ? 'Columns' : 'Rows';
        const chart = ws.charts.add('XYScatterLines', rangeOf(first.y), by);
        chart.name = spec.name;
        chart.title.text = spec.title;
        const s0 = chart.series.getItemAt(0);
        s0.name = first.name;
        s0.setXAxisValues(rangeOf(first.x));
        drawAs(s0, first.draw);
        for (const s of rest) {
          const added = chart.series.add(s.name);
          added.setXAxisValues(rangeOf(s.x));
          added.setValues(rangeOf(s.y));
          drawAs(added, s.draw);
        }
        const y = chart.axes.valueAxis;
        if (spec.logY) {
          y.scaleType = 'Logarithmic';
          y.logBase = 10;
        }
        y.minimum = spec.yMin;
        y.title.text = spec.yTitle;
        chart.axes.categoryAxis.title.text = spec.xTitle;
        chart.legend.position = 'Bottom';
        chart.setPosition(
          cellAddress({ row: spec.place.top, col: spec.place.left }),
          cellAddress({ row: spec.place.bottom, col: spec.place.right }),
        );
        await ctx.sync();
      });
    } catch (err) {
      // A failed batch may still have created the chart; take it away before reporting.
      await this.run(async (ctx) => {
        const left = ctx.workbook.worksheets.getItem(spec.sheet).charts.getItemOrNullObject(spec.name);
        await ctx.sync();
        if (!left.isNullObject) {
          left.delete();
          await ctx.sync();
        }
      }).catch(() => undefined);
      throw err;
    }
  }

  watchSelection(listener: () => void): Promise<void> {
    return this.run(async (ctx) => {
      ctx.workbook.onSelectionChanged.add(async () => listener());
      await ctx.sync();
    });
  }

  removeChart(sheet: string, name: string): Promise<void> {
    return this.run(async (ctx) => {
      const chart = ctx.workbook.worksheets.getItem(sheet).charts.getItemOrNullObject(name);
      await ctx.sync();
      if (chart.isNullObject) throw new Error(`no chart named '${name}' on ${sheet}`);
      chart.delete();
      await ctx.sync();
    });
  }
}

/** Line and marker of a series by what it shows: curves as lines, points and limits as markers, the required stiffness dashed. */
function drawAs(series: Excel.ChartSeries, draw: ChartSeries['draw']): void {
  series.format.line.lineStyle = draw === 'curve' ? 'Continuous' : draw === 'reference' ? 'Dash' : 'None';
  series.markerStyle = draw === 'points' ? 'Circle' : draw === 'limits' ? 'Diamond' : 'None';
}
