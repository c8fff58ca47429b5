/**
 * The in-memory workbook: a SheetPort with no host, used by the browser preview (drawn by memory-view.ts)
 * and by the tests. It stores what the pane writes, formulas with the values the pane computed for them;
 * it does not evaluate formulas itself.
 */
import { MAX_COLS, MAX_ROWS, type Box, type Cell } from './a1.js';
import type { CellFormat, CellValue, CellWrite, ChartSpec, RangeContent, SheetPort, SheetRange, WriteReceipt } from './port.js';

export interface StoredCell {
  readonly value: CellValue;
  readonly formula?: string;
  readonly format?: CellFormat;
}

interface SheetData {
  readonly cells: Map<string, StoredCell>;
  readonly charts: ChartSpec[];
}

const key = (row: number, col: number): string => `${row},${col}`;

/** Operations a test can make fail, to check that nothing half-written stays. */
export type MemoryOperation = 'write' | 'clear' | 'addSheet' | 'removeSheet' | 'addChart' | 'removeChart';

export class MemoryWorkbook implements SheetPort {
  readonly host = 'memory' as const;
  private readonly sheets = new Map<string, SheetData>();
  private active: SheetRange;
  private readonly listeners = new Set<() => void>();
  /** Set by tests: return true to make that operation throw before it changes anything. */
  failWhen: ((op: MemoryOperation) => boolean) | null = null;

  constructor(sheetNames: readonly string[] = ['Sheet1']) {
    for (const n of sheetNames) this.sheets.set(n, { cells: new Map(), charts: [] });
    const first = sheetNames[0] ?? 'Sheet1';
    if (!this.sheets.has(first)) this.sheets.set(first, { cells: new Map(), charts: [] });
    this.active = { sheet: first, box: { top: 0, left: 0, bottom: 0, right: 0 } };
  }

  onChange(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private changed(): void {
    for (const l of this.listeners) l();
  }

  private maybeFail(op: MemoryOperation): void {
    if (this.failWhen?.(op)) throw new Error(`the in-memory sheet refused ${op} (test failure injection)`);
  }

  private sheet(name: string): SheetData {
    const s = this.sheets.get(name);
    if (!s) throw new Error(`there is no sheet named '${name}'`);
    return s;
  }

  // --- view and test helpers (not part of the port) ---

  get activeSheet(): string {
    return this.active.sheet;
  }

  get activeBox(): Box {
    return this.active.box;
  }

  select(sheet: string, box: Box): void {
    this.sheet(sheet);
    this.active = { sheet, box };
    this.changed();
  }

  cell(sheet: string, row: number, col: number): StoredCell | undefined {
    return this.sheet(sheet).cells.get(key(row, col));
  }

  /** What the user types into a cell of the preview grid; '' empties it. Text starting with = is kept as a formula, unevaluated. */
  typeInto(sheet: string, at: Cell, text: string): void {
    const cells = this.sheet(sheet).cells;
    const t = text.trim();
    if (t === '') cells.delete(key(at.row, at.col));
    else if (t.startsWith('=')) cells.set(key(at.row, at.col), { value: t, formula: t });
    else {
      const n = Number(t);
      cells.set(key(at.row, at.col), { value: Number.isFinite(n) ? n : text });
    }
    this.changed();
  }

  /** Rows and columns in use by cells (charts are drawn apart in the preview). */
  extent(sheet: string): { rows: number; cols: number } {
    let rows = 0;
    let cols = 0;
    for (const k of this.sheet(sheet).cells.keys()) {
      const [r, c] = k.split(',').map(Number);
      rows = Math.max(rows, (r ?? 0) + 1);
      cols = Math.max(cols, (c ?? 0) + 1);
    }
    return { rows, cols };
  }

  charts(sheet: string): readonly ChartSpec[] {
    return this.sheet(sheet).charts;
  }

  filledCount(sheet: string): number {
    return this.sheet(sheet).cells.size;
  }

  // --- the port ---

  async selection(): Promise<SheetRange> {
    return this.active;
  }

  async sheetNames(): Promise<string[]> {
    return [...this.sheets.keys()];
  }

  async read(range: SheetRange): Promise<RangeContent> {
    const s = this.sheet(range.sheet);
    const values: CellValue[][] = [];
    const formulas: CellValue[][] = [];
    for (let r = range.box.top; r <= range.box.bottom; r++) {
      const vr: CellValue[] = [];
      const fr: CellValue[] = [];
      for (let c = range.box.left; c <= range.box.right; c++) {
        const cell = s.cells.get(key(r, c));
        vr.push(cell?.value ?? '');
        fr.push(cell?.formula ?? cell?.value ?? '');
      }
      values.push(vr);
      formulas.push(fr);
    }
    return { values, formulas };
  }

  async write(sheet: string, topLeft: Cell, cells: readonly (readonly CellWrite[])[]): Promise<WriteReceipt> {
    const s = this.sheet(sheet);
    const rows = cells.length;
    const cols = Math.max(0, ...cells.map((r) => r.length));
    if (rows === 0 || cols === 0) throw new Error('nothing to write');
    if (topLeft.row + rows > MAX_ROWS || topLeft.col + cols > MAX_COLS) throw new Error('the block does not fit on the sheet');
    this.maybeFail('write');
    const box = { top: topLeft.row, left: topLeft.col, bottom: topLeft.row + rows - 1, right: topLeft.col + cols - 1 };
    const previousFormats = cells.map(() => Array.from({ length: cols }, () => 'General'));
    cells.forEach((row, r) => {
      for (let c = 0; c < cols; c++) {
        const w = row[c];
        const k = key(topLeft.row + r, topLeft.col + c);
        if (w === undefined || (w.value === '' && w.formula === undefined)) s.cells.delete(k);
        else
          s.cells.set(k, {
            value: w.value,
            ...(w.formula !== undefined ? { formula: w.formula } : {}),
            ...(w.format ? { format: w.format } : {}),
          });
      }
    });
    this.changed();
    return { sheet, box, previousFormats };
  }

  async clear(receipt: WriteReceipt): Promise<void> {
    const s = this.sheet(receipt.sheet);
    this.maybeFail('clear');
    for (let r = receipt.box.top; r <= receipt.box.bottom; r++) {
      for (let c = receipt.box.left; c <= receipt.box.right; c++) s.cells.delete(key(r, c));
    }
    this.changed();
  }

  async addSheet(name: string): Promise<void> {
    if (this.sheets.has(name)) throw new Error(`a sheet named '${name}' already exists`);
    this.maybeFail('addSheet');
    this.sheets.set(name, { cells: new Map(), charts: [] });
    this.active = { sheet: name, box: { top: 0, left: 0, bottom: 0, right: 0 } };
    this.changed();
  }

  async removeSheet(name: string): Promise<void> {
    this.sheet(name);
    if (this.sheets.size === 1) throw new Error('a workbook keeps at least one sheet');
    this.maybeFail('removeSheet');
    this.sheets.delete(name);
    if (this.active.sheet === name) {
      const first = [...this.sheets.keys()][0] ?? '';
      this.active = { sheet: first, box: { top: 0, left: 0, bottom: 0, right: 0 } };
    }
    this.changed();
  }

  async watchSelection(listener: () => void): Promise<void> {
    this.onChange(listener);
  }

  async sheetInUse(name: string): Promise<boolean> {
    const s = this.sheet(name);
    return s.cells.size > 0 || s.charts.length > 0;
  }

  async addChart(spec: ChartSpec): Promise<void> {
    const s = this.sheet(spec.sheet);
    if (s.charts.some((c) => c.name === spec.name)) throw new Error(`a chart named '${spec.name}' already exists on ${spec.sheet}`);
    this.maybeFail('addChart');
    s.charts.push(spec);
    this.changed();
  }

  async removeChart(sheet: string, name: string): Promise<void> {
    const s = this.sheet(sheet);
    const i = s.charts.findIndex((c) => c.name === name);
    if (i < 0) throw new Error(`no chart named '${name}' on ${sheet}`);
    this.maybeFail('removeChart');
    s.charts.splice(i, 1);
    this.changed();
  }
}
