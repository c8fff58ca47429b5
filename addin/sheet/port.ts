/**
 * The sheet port: every read and write the pane makes goes through this one small interface, so that the
 * same pane logic drives Excel (office-sheet.ts) and the in-page grid (memory-sheet.ts).
 */
import type { Box, Cell } from './a1.js';

export type CellValue = string | number | boolean;

/** How a written number is shown. 'modulus': whole MPa from 100 up, one decimal from 1, else scientific. */
export type CellFormat = 'modulus';

/** One cell to write: a constant, or a formula with the value the pane expects it to show. */
export interface CellWrite {
  readonly value: CellValue;
  readonly formula?: string;
  readonly format?: CellFormat;
}

/** Cells as read back: '' for empty; formulas hold the constant itself where a cell has no formula. */
export interface RangeContent {
  readonly values: CellValue[][];
  readonly formulas: CellValue[][];
}

export interface SheetRange {
  readonly sheet: string;
  readonly box: Box;
}

export interface ChartSeries {
  readonly name: string;
  readonly x: SheetRange;
  readonly y: SheetRange;
  /** The numbers the cells are expected to show, for the in-page chart. */
  readonly xValues: readonly number[];
  readonly yValues: readonly (number | null)[];
  /**
   * How it is drawn: 'curve' a line without markers (a candidate's modelled curve), 'points' markers only
   * (the service temperatures on the curves), 'limits' markers only (each MAXTEMP on the required line),
   * 'reference' a dashed line without markers (the required stiffness).
   */
  readonly draw: 'curve' | 'points' | 'limits' | 'reference';
}

export interface ChartSpec {
  /** Unique name of the chart on its sheet; removal goes by this name. */
  readonly name: string;
  readonly sheet: string;
  readonly title: string;
  readonly xTitle: string;
  readonly yTitle: string;
  readonly logY: boolean;
  /** Lower end of the value axis (MPa). */
  readonly yMin: number;
  readonly series: readonly ChartSeries[];
  /** Cells the chart is drawn over (it floats; cell contents are untouched). */
  readonly place: Box;
}

/** What a write replaced, so that clearing it restores the cells exactly (contents were empty before). */
export interface WriteReceipt {
  readonly sheet: string;
  readonly box: Box;
  /** Number formats the cells had before, restored on clear. */
  readonly previousFormats: string[][];
}

export interface SheetPort {
  readonly host: 'office' | 'memory';
  /** The active cell or range. */
  selection(): Promise<SheetRange>;
  sheetNames(): Promise<string[]>;
  read(range: SheetRange): Promise<RangeContent>;
  /** Writes a rectangular block in one batch and returns what is needed to take it back. */
  write(sheet: string, topLeft: Cell, cells: readonly (readonly CellWrite[])[]): Promise<WriteReceipt>;
  /** Removes the contents of a write and restores the previous number formats. */
  clear(receipt: WriteReceipt): Promise<void>;
  addSheet(name: string): Promise<void>;
  removeSheet(name: string): Promise<void>;
  /** True while any cell of the sheet holds something or any chart is on it. */
  sheetInUse(name: string): Promise<boolean>;
  addChart(spec: ChartSpec): Promise<void>;
  removeChart(sheet: string, name: string): Promise<void>;
  /** Calls the listener whenever the user selects other cells. */
  watchSelection(listener: () => void): Promise<void>;
}

/** True where a cell read back holds nothing. */
export function isBlank(v: CellValue | null | undefined): boolean {
  return v === '' || v === null || v === undefined;
}

/** Cells of a range that hold something, as [row, col] offsets inside the range. */
export function filledCells(content: RangeContent): Cell[] {
  const out: Cell[] = [];
  content.formulas.forEach((row, r) =>
    row.forEach((f, c) => {
      if (!isBlank(f) || !isBlank(content.values[r]?.[c])) out.push({ row: r, col: c });
    }),
  );
  return out;
}

/** Shows a number the way the 'modulus' format does (the Office adapter writes the matching number format). */
export function formatModulus(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  if (a >= 100) return Math.round(v).toString();
  if (a >= 1) return v.toFixed(1);
  if (v === 0) return '0.00E+00';
  const [mant = '', exp = '0'] = v.toExponential(2).split('e');
  const e = Number(exp);
  return `${mant}E${e < 0 ? '-' : '+'}${String(Math.abs(e)).padStart(2, '0')}`;
}

/** Excel number format equivalent of formatModulus. */
export const MODULUS_NUMBER_FORMAT = '[>=100]0;[>=1]0.0;0.00E+00';
