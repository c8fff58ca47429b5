/** A1-style addresses: zero-based rows and columns inside the pane, A1 text at the sheet boundary. */

export interface Cell {
  readonly row: number;
  readonly col: number;
}

export interface Box {
  readonly top: number;
  readonly left: number;
  readonly bottom: number;
  readonly right: number;
}

/** Excel's limits (16384 columns, 1048576 rows). */
export const MAX_COLS = 16384;
export const MAX_ROWS = 1048576;

/** 0 -> A, 25 -> Z, 26 -> AA. */
export function columnName(col: number): string {
  if (!Number.isInteger(col) || col < 0 || col >= MAX_COLS) throw new RangeError(`column ${col} is outside the sheet`);
  let n = col + 1;
  let s = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

export function cellAddress(c: Cell, absolute: { row?: boolean; col?: boolean } = {}): string {
  return `${absolute.col ? '$' : ''}${columnName(c.col)}${absolute.row ? '$' : ''}${c.row + 1}`;
}

export function boxAddress(b: Box, absolute = false): string {
  const a = { row: absolute, col: absolute };
  const tl = cellAddress({ row: b.top, col: b.left }, a);
  if (b.top === b.bottom && b.left === b.right) return tl;
  return `${tl}:${cellAddress({ row: b.bottom, col: b.right }, a)}`;
}

export function boxOf(topLeft: Cell, rows: number, cols: number): Box {
  return { top: topLeft.row, left: topLeft.col, bottom: topLeft.row + rows - 1, right: topLeft.col + cols - 1 };
}

const CELL_RE = /^\$?([A-Za-z]{1,3})\$?(\d{1,7})$/;

export function parseCell(text: string): Cell {
  const m = CELL_RE.exec(text.trim());
  if (!m || m[1] === undefined || m[2] === undefined) throw new RangeError(`'${text}' is not a cell address such as B3`);
  let col = 0;
  for (const ch of m[1].toUpperCase()) col = col * 26 + (ch.charCodeAt(0) - 64);
  const row = Number(m[2]);
  if (col > MAX_COLS || row < 1 || row > MAX_ROWS) throw new RangeError(`'${text}' is outside the sheet`);
  return { row: row - 1, col: col - 1 };
}

/** A range reference as typed or reported by Excel: optional sheet (quoted or not), one cell or a box. */
export interface ParsedRef {
  readonly sheet: string | null;
  readonly box: Box;
}

export function parseRef(text: string): ParsedRef {
  const t = text.trim();
  let sheet: string | null = null;
  let rest = t;
  const bang = t.lastIndexOf('!');
  if (bang >= 0) {
    const s = t.slice(0, bang);
    rest = t.slice(bang + 1);
    sheet = s.startsWith("'") && s.endsWith("'") && s.length >= 2 ? s.slice(1, -1).replace(/''/g, "'") : s;
    if (sheet === '') throw new RangeError(`'${text}' has an empty sheet name`);
  }
  const [a, b, extra] = rest.split(':');
  if (a === undefined || extra !== undefined) throw new RangeError(`'${text}' is not a range address such as Sheet1!A1:B29`);
  const p = parseCell(a);
  const q = b === undefined ? p : parseCell(b);
  return {
    sheet,
    box: { top: Math.min(p.row, q.row), left: Math.min(p.col, q.col), bottom: Math.max(p.row, q.row), right: Math.max(p.col, q.col) },
  };
}

/** Sheet name as it must appear in a formula: quoted unless it is a plain identifier. */
export function quoteSheet(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(name) && !CELL_RE.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

export function qualified(sheet: string, box: Box, absolute = true): string {
  return `${quoteSheet(sheet)}!${boxAddress(box, absolute)}`;
}
