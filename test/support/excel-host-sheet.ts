/**
 * The workbook side of the test host (test/support/excel-host.ts): sheets, cells and ranges as the Excel
 * client addresses them, with the rule of Excel each follows and where that rule comes from.
 */
import type { ExcelHost } from './excel-host.js';

export type Value = string | number | boolean;

export interface HostCell {
  /** What was entered: a constant, or formula text starting with '='. */
  formula: Value;
  format: string;
}

export interface HostSeries {
  name: string;
  x: string | null;
  y: string | null;
  lineStyle: string;
  markerStyle: string;
}

export interface HostChart {
  readonly id: string;
  name: string;
  readonly type: string;
  readonly source: string;
  readonly seriesBy: string;
  title: string;
  readonly series: HostSeries[];
  readonly valueAxis: { scaleType: string; logBase: number; minimum: number | null; title: string };
  readonly categoryAxis: { title: string };
  legend: string;
  position: [string, string] | null;
}

export interface HostSheet {
  readonly id: string;
  name: string;
  readonly cells: Map<string, HostCell>;
  readonly charts: HostChart[];
}

export interface Box {
  top: number;
  left: number;
  bottom: number;
  right: number;
}

/** An error Excel would report for one action: code (Excel.ErrorCodes) and message. */
export class HostError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

/** Map key of a cell, zero-based row and column. */
export const key = (r: number, c: number): string => `${r},${c}`;

/** Column letters of a zero-based column index (0 -> A, 26 -> AA). */
function column(c: number): string {
  let s = '';
  for (let n = c + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}

/** A1 text of a box, one cell as "B2" (Excel's Range.address form, without the sheet). */
export function a1(b: Box): string {
  const tl = `${column(b.left)}${b.top + 1}`;
  return b.top === b.bottom && b.left === b.right ? tl : `${tl}:${column(b.right)}${b.bottom + 1}`;
}

/** Sheet name as Excel writes it in an address: quoted unless letters, digits and underscores only. */
export function sheetPrefix(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

/** Parses "B2", "$B$2", "B2:C9" (no sheet): our own reader, independent of addin/sheet/a1.ts. */
export function parseBox(address: string): Box {
  const m = /^\$?([A-Z]{1,3})\$?(\d+)(?::\$?([A-Z]{1,3})\$?(\d+))?$/i.exec(address.trim());
  if (!m) throw new HostError('InvalidArgument', `The argument is invalid or missing or has an incorrect format: '${address}'`);
  const col = (s: string): number => [...s.toUpperCase()].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0) - 1;
  const r1 = Number(m[2]) - 1;
  const c1 = col(m[1] ?? 'A');
  const r2 = m[4] === undefined ? r1 : Number(m[4]) - 1;
  const c2 = m[3] === undefined ? c1 : col(m[3]);
  return { top: Math.min(r1, r2), left: Math.min(c1, c2), bottom: Math.max(r1, r2), right: Math.max(c1, c2) };
}

/**
 * What a cell holds after text is entered through Range.formulas or values. A leading "=", "+" or "-" makes
 * a formula (Microsoft Learn, "Excel.Range class", values: "If the returned value starts with a plus, minus,
 * or equal sign, Excel interprets this value as a formula"); a leading apostrophe keeps text as text and is
 * not part of the value (from memory: Excel's prefix character); number and TRUE/FALSE text is read as a
 * number or boolean, as typing it would be (from memory: the lost leading zero of "007").
 */
export function entered(v: Value): Value {
  if (typeof v !== 'string') return v;
  if (v.startsWith("'")) return v;
  if (/^[=+-]/.test(v) && !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(v)) return v.startsWith('=') ? v : `=${v}`;
  const t = v.trim();
  if (/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return Number(t);
  if (/^(true|false)$/i.test(t)) return t.toLowerCase() === 'true';
  return v;
}

/** A host object: navigation properties, methods, indexers, scalar properties (PascalCase, as on the wire). */
export abstract class HostNode {
  abstract readonly kind: string;
  /** Scalar properties a load without a select returns. */
  protected readonly scalars: readonly string[] = [];
  constructor(protected readonly host: ExcelHost) {}
  private refuse(member: string): never {
    throw new HostError('NotImplemented', `the test host does not model ${this.kind}.${member}`);
  }
  property(name: string): HostNode {
    return this.refuse(name);
  }
  call(name: string, _args: unknown[]): unknown {
    return this.refuse(`${name}()`);
  }
  item(_args: unknown[]): HostNode | null {
    return this.refuse('[]');
  }
  assign(name: string, _v: unknown): void {
    this.refuse(`${name} =`);
  }
  read(name: string): unknown {
    return this.refuse(name);
  }
  /** What an Instantiate action answers: {} for a plain object (the client keeps its path). */
  identity(): object {
    return {};
  }
  query(select: string[] | undefined): unknown {
    const names = select && select.length > 0 ? select : this.scalars;
    const out: Record<string, unknown> = {};
    for (const n of names) {
      if (n.includes('/')) this.refuse(`load('${n}')`);
      const pascal = n.charAt(0).toUpperCase() + n.slice(1);
      out[pascal] = this.read(pascal);
    }
    return out;
  }
}

/** The root object of every request: the workbook. */
export class WorkbookNode extends HostNode {
  readonly kind = 'Workbook';
  override property(name: string): HostNode {
    return name === 'Worksheets' ? new WorksheetsNode(this.host) : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === '_RemoveReference') {
      this.host.references.delete(String(args[0]));
      return null;
    }
    if (name !== 'GetSelectedRange') return super.call(name, args);
    const s = this.host.selection;
    return new RangeNode(this.host, this.host.sheet(s.sheet), s.box);
  }
}

/** workbook.worksheets: items by name or id, add, load of items. */
export class WorksheetsNode extends HostNode {
  readonly kind = 'WorksheetCollection';
  override item(args: unknown[]): HostNode {
    return new WorksheetNode(this.host, this.host.sheet(String(args[0])));
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === 'Add') return new WorksheetNode(this.host, this.host.addSheet(args[0]));
    if (name === 'GetItem') return this.item(args);
    return super.call(name, args);
  }
  override query(select: string[] | undefined): unknown {
    return { _Items: this.host.sheets.map((s) => new WorksheetNode(this.host, s).query(select)) };
  }
}

/** An object that lives on one sheet and fails once the sheet is deleted. */
export abstract class SheetBound extends HostNode {
  constructor(
    host: ExcelHost,
    readonly ws: HostSheet,
  ) {
    super(host);
  }
  /** A deleted sheet's objects fail, as Excel's do. */
  protected live(): HostSheet {
    if (!this.host.sheets.includes(this.ws)) throw new HostError('ItemNotFound', `worksheet '${this.ws.name}' was deleted`);
    return this.ws;
  }
}

/** One worksheet: ranges, used range, charts, activate, delete. */
export class WorksheetNode extends SheetBound {
  readonly kind = 'Worksheet';
  protected override readonly scalars = ['Name', 'Id', 'Position'];
  override identity(): object {
    return { Id: this.live().id };
  }
  override read(name: string): unknown {
    const ws = this.live();
    if (name === 'Name') return ws.name;
    if (name === 'Id') return ws.id;
    if (name === 'Position') return this.host.sheets.indexOf(ws);
    return super.read(name);
  }
  override property(name: string): HostNode {
    return name === 'Charts' ? this.host.chartsOf(this.live()) : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    const ws = this.live();
    switch (name) {
      case 'GetRange':
        return new RangeNode(this.host, ws, parseBox(String(args[0])));
      case 'GetUsedRangeOrNullObject':
      case 'GetUsedRange': {
        const valuesOnly = args[0] === true;
        let box: Box | null = null;
        for (const [k, c] of ws.cells) {
          if (valuesOnly && c.formula === '') continue;
          const [r = 0, col = 0] = k.split(',').map(Number);
          box = box
            ? { top: Math.min(box.top, r), left: Math.min(box.left, col), bottom: Math.max(box.bottom, r), right: Math.max(box.right, col) }
            : { top: r, left: col, bottom: r, right: col };
        }
        // An empty sheet's used range is A1 (from memory); the OrNullObject form gives null instead.
        if (box === null) return name === 'GetUsedRange' ? new RangeNode(this.host, ws, { top: 0, left: 0, bottom: 0, right: 0 }) : null;
        return new RangeNode(this.host, ws, box);
      }
      case 'Activate':
        this.host.active = ws.name;
        return null;
      case 'Delete':
        // Excel keeps at least one sheet (from memory: a workbook must contain at least one visible worksheet).
        if (this.host.sheets.length === 1) throw new HostError('InvalidOperation', 'a workbook must keep one worksheet');
        this.host.sheets.splice(this.host.sheets.indexOf(ws), 1);
        if (this.host.active === ws.name) this.host.active = this.host.sheets[0]?.name ?? '';
        return null;
      default:
        return super.call(name, args);
    }
  }
}

/** A rectangular range: address, values, formulas, number formats, clear. */
export class RangeNode extends SheetBound {
  readonly kind = 'Range';
  protected override readonly scalars = ['Address', 'Values', 'Formulas', 'NumberFormat', 'RowCount', 'ColumnCount'];
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    readonly box: Box,
  ) {
    super(host, ws);
  }
  qualified(): string {
    return this.qualifiedBox(this.box);
  }
  /** Another box on this range's sheet, with the sheet's name. */
  qualifiedBox(box: Box): string {
    return `${sheetPrefix(this.live().name)}!${a1(box)}`;
  }
  private grid<V>(f: (c: HostCell | undefined) => V): V[][] {
    const ws = this.live();
    const out: V[][] = [];
    for (let r = this.box.top; r <= this.box.bottom; r++) {
      const row: V[] = [];
      for (let c = this.box.left; c <= this.box.right; c++) row.push(f(ws.cells.get(key(r, c))));
      out.push(row);
    }
    return out;
  }
  override read(name: string): unknown {
    switch (name) {
      case 'Address':
        return this.qualified();
      case 'Values':
        return this.grid((c) => (c ? this.host.valueOf(c) : ''));
      case 'Formulas':
        return this.grid((c) =>
          c === undefined ? '' : typeof c.formula === 'string' && c.formula.startsWith("'") ? c.formula.slice(1) : c.formula,
        );
      case 'NumberFormat':
        return this.grid((c) => c?.format ?? 'General');
      case 'RowCount':
        return this.box.bottom - this.box.top + 1;
      case 'ColumnCount':
        return this.box.right - this.box.left + 1;
      default:
        return super.read(name);
    }
  }
  /** Each cell of a matrix the size of the range, or of a single value (Excel applies it to every cell). */
  private each(m: unknown, f: (cell: HostCell | undefined, v: unknown, k: string) => HostCell | undefined): void {
    const rows = this.box.bottom - this.box.top + 1;
    const cols = this.box.right - this.box.left + 1;
    const isMatrix = Array.isArray(m);
    if (isMatrix && (m.length !== rows || m.some((row) => !Array.isArray(row) || row.length !== cols)))
      throw new HostError('InvalidArgument', `The number of rows or columns in the input array doesn't match the size of ${a1(this.box)}`);
    const ws = this.live();
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const k = key(this.box.top + r, this.box.left + c);
        const v: unknown = isMatrix ? (m[r] as unknown[])[c] : m;
        const next = f(ws.cells.get(k), v, k);
        if (next === undefined || (next.formula === '' && next.format === 'General')) ws.cells.delete(k);
        else ws.cells.set(k, next);
      }
    }
  }
  override assign(name: string, m: unknown): void {
    if (name === 'Formulas' || name === 'Values') {
      this.each(m, (cell, v) => {
        if (!['string', 'number', 'boolean'].includes(typeof v))
          throw new HostError('InvalidArgument', `a cell cannot hold ${JSON.stringify(v)}`);
        return { formula: entered(v as Value), format: cell?.format ?? 'General' };
      });
    } else if (name === 'NumberFormat') {
      this.each(m, (cell, v) => ({ formula: cell?.formula ?? '', format: String(v) }));
    } else super.assign(name, m);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name !== 'Clear') return super.call(name, args);
    const applyTo = args[0] === undefined || args[0] === null ? 'All' : this.host.checkEnum('ClearApplyTo', args[0]);
    this.each(undefined, (cell) => {
      if (!cell) return undefined;
      if (applyTo === 'Contents') return { formula: '', format: cell.format };
      if (applyTo === 'Formats') return { formula: cell.formula, format: 'General' };
      return undefined;
    });
    return null;
  }
}
