/**
 * The demo workbook: the review of the invented scenario as DERATE.* formulas, each with the value the
 * engine computed cached beside it (so the numbers show before the add-in loads), a duty-cycle block,
 * a sheet of the sources of every family number used, and a sheet of cautions. Written with exceljs.
 */
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import type { Alignment, CellErrorValue, CellValue, Font, Workbook, Worksheet } from 'exceljs';
import { getGrade, NUMERIC_FIELDS, VERDICT } from '../src/index.js';
import { DEMO_CAUTION, DEMO_FILLED_CAUTION, type DemoReview } from './review.js';
import { DEMO_SCENARIO as S } from './scenario.js';

export const DEMO_WORKBOOK_PATH = 'demo/derating-review.xlsx';
export const REVIEW_SHEET = 'Review';

/** Column letter of a 1-based column number (A..ZZ is plenty here). */
function col(n: number): string {
  return n <= 26
    ? String.fromCharCode(64 + n)
    : String.fromCharCode(64 + Math.floor((n - 1) / 26)) + String.fromCharCode(65 + ((n - 1) % 26));
}

const NOT_REACHED: CellErrorValue = { error: '#N/A' };

/**
 * One font family for every cell, bold or not. Arial is on every Excel machine, and LibreOffice maps it
 * to the metric-compatible Liberation Sans, so column widths hold in both (a cell whose font names no
 * family falls back to a serif face in LibreOffice's PDF export).
 */
const FONT: Partial<Font> = { name: 'Arial', size: 10 };
const BOLD: Partial<Font> = { ...FONT, bold: true };
const WRAP: Partial<Alignment> = { wrapText: true, vertical: 'top' };

/** Number formats by quantity (the same in every block). */
export const FORMATS = {
  modulus: '#,##0',
  stress: '0.00',
  temperature: '0.0',
  hours: '#,##0" h"',
  strain: '0.0%',
  count: '#,##0',
} as const;

function formula(ws: Worksheet, ref: string, text: string, result: number | string | CellErrorValue, numFmt?: string): void {
  const cell = ws.getCell(ref);
  cell.value = { formula: text, result } as CellValue;
  cell.font = FONT;
  if (numFmt) cell.numFmt = numFmt;
}

function put(ws: Worksheet, ref: string, value: string | number, bold = false, numFmt?: string): void {
  const cell = ws.getCell(ref);
  cell.value = value;
  cell.font = bold ? BOLD : FONT;
  if (numFmt) cell.numFmt = numFmt;
}

/** A header cell: bold, wrapped, so that a long header shows whole in a narrow column. */
function header(ws: Worksheet, ref: string, value: string | number): void {
  put(ws, ref, value, true);
  const cell = ws.getCell(ref);
  cell.alignment = { ...WRAP, horizontal: typeof value === 'number' ? 'right' : 'left' };
  // Excel and LibreOffice do not grow a row for wrapped text written by a program: give it the lines it needs.
  const lines = Math.ceil(String(value).length / Math.max(1, 0.8 * ((ws.getColumn(cell.col).width ?? 10) - 1)));
  const row = ws.getRow(Number(cell.row));
  row.height = Math.max(row.height ?? 0, 13.5 * lines);
}

/** A paragraph: merged across the first `cols` columns, wrapped, the row made tall enough for `chars` characters per line. */
function paragraph(ws: Worksheet, row: number, cols: number, text: string, charsPerLine: number, bold = false): void {
  if (cols > 1) ws.mergeCells(row, 1, row, cols);
  const cell = ws.getCell(row, 1);
  cell.value = text;
  cell.font = bold ? BOLD : FONT;
  cell.alignment = WRAP;
  ws.getRow(row).height = 13.5 * Math.max(1, Math.ceil(text.length / charsPerLine));
}

/** Page set-up of a printed sheet: A4, fitted to one page wide, a footer naming the sheet and the page. */
function printable(ws: Worksheet, orientation: 'portrait' | 'landscape', fitToHeight: number): void {
  ws.pageSetup = {
    ...ws.pageSetup,
    paperSize: 9,
    orientation,
    fitToPage: true,
    fitToWidth: 1,
    fitToHeight,
    margins: { left: 0.5, right: 0.5, top: 0.6, bottom: 0.6, header: 0.3, footer: 0.3 },
  };
  ws.headerFooter.oddFooter = `&L&"Arial"&8Resin Derate demo review (invented scenario): ${ws.name}&R&"Arial"&8page &P of &N`;
}

/** Where the blocks of the Review sheet sit; every formula is built from these positions. */
function layout(): {
  inputs: { service: string; required: string; strain: string; peak: string };
  tableHeaderRow: number;
  firstCandidateRow: number;
  cycleHeaderRow: number;
  cycleFirstRow: number;
  cycleLastRow: number;
  cyclesCell: string;
  checkHeaderRow: number;
} {
  const tableHeaderRow = 9;
  const firstCandidateRow = tableHeaderRow + 1;
  const cycleHeaderRow = firstCandidateRow + S.candidates.length + 2;
  const cycleFirstRow = cycleHeaderRow + 1;
  const cycleLastRow = cycleFirstRow + S.cycle.length - 1;
  return {
    inputs: { service: '$B$4', required: '$B$5', strain: '$B$6', peak: '$B$7' },
    tableHeaderRow,
    firstCandidateRow,
    cycleHeaderRow,
    cycleFirstRow,
    cycleLastRow,
    cyclesCell: `$B$${cycleLastRow + 1}`,
    checkHeaderRow: cycleLastRow + 3,
  };
}

function reviewSheet(wb: Workbook, review: DemoReview): void {
  const ws = wb.addWorksheet(REVIEW_SHEET);
  const L = layout();
  const temps = `$A$${L.cycleFirstRow}:$A$${L.cycleLastRow}`;
  const hours = `$B$${L.cycleFirstRow}:$B$${L.cycleLastRow}`;
  const { service, required, strain, peak } = L.inputs;
  const nT = S.temperaturesC.length;
  const lastCol = 3 + nT;
  const widths = [27, ...S.temperaturesC.map(() => 10), 15, 15];
  widths.forEach((w, k) => (ws.getColumn(k + 1).width = w));
  const charsPerLine = Math.floor(widths.reduce((a, b) => a + b, 0) * 1.05);

  paragraph(ws, 1, lastCol, S.title, charsPerLine, true);
  paragraph(ws, 2, lastCol, S.story, charsPerLine);
  paragraph(
    ws,
    3,
    lastCol,
    'Invented scenario for the demo; estimates for screening only (see the Cautions sheet). Formulas need the Resin Derate add-in; the values shown were computed by its engine when this file was written.',
    charsPerLine,
  );
  put(ws, 'A4', 'service time');
  put(ws, 'B4', S.serviceTime);
  put(ws, 'A5', 'required modulus, MPa');
  put(ws, 'B5', S.requiredModulusMPa, false, FORMATS.modulus);
  put(ws, 'A6', 'strain held by the latch');
  put(ws, 'B6', S.heldStrain, false, FORMATS.strain);
  put(ws, 'A7', 'peak cycle temperature, degC');
  formula(ws, 'B7', `MAX(${temps})`, review.peakC, FORMATS.temperature);

  // Derating table: candidates down, service temperatures across.
  const h = L.tableHeaderRow;
  put(ws, `A${h - 1}`, `Relaxation modulus after the service time at constant temperature, MPa`, true);
  header(ws, `A${h}`, 'resin \\ degC');
  S.temperaturesC.forEach((T, j) => header(ws, `${col(2 + j)}${h}`, T));
  const limitCol = col(2 + nT);
  const verdictCol = col(3 + nT);
  header(ws, `${limitCol}${h}`, 'highest degC at the required modulus');
  header(ws, `${verdictCol}${h}`, 'verdict after the duty cycle');
  review.rows.forEach((row, i) => {
    const r = L.firstCandidateRow + i;
    const check = review.checks[i];
    if (!check) throw new Error(`demo: no duty check for ${row.id}`);
    put(ws, `A${r}`, row.id);
    row.cells.forEach((c, j) =>
      formula(ws, `${col(2 + j)}${r}`, `DERATE.MODULUS($A${r},${col(2 + j)}$${h},${service})`, c.modulusMPa, FORMATS.modulus),
    );
    formula(ws, `${limitCol}${r}`, `DERATE.MAXTEMP($A${r},${required},${service})`, check.limitC ?? NOT_REACHED, FORMATS.temperature);
    formula(
      ws,
      `${verdictCol}${r}`,
      `IF(DERATE.DUTY($A${r},${temps},${hours},${L.cyclesCell},${peak})>=${required},"${VERDICT.pass}","${VERDICT.fail}")`,
      check.pass ? VERDICT.pass : VERDICT.fail,
    );
  });

  // Duty-cycle block: the day's segments, the number of days, and each candidate after them.
  put(ws, `A${L.cycleHeaderRow - 1}`, 'Daily duty cycle (invented)', true);
  header(ws, `A${L.cycleHeaderRow}`, 'temperature, degC');
  header(ws, `B${L.cycleHeaderRow}`, 'hours per day');
  S.cycle.forEach(([T, hrs], k) => {
    put(ws, `A${L.cycleFirstRow + k}`, T, false, FORMATS.temperature);
    put(ws, `B${L.cycleFirstRow + k}`, hrs, false, FORMATS.hours);
  });
  put(ws, `A${L.cycleLastRow + 1}`, 'days (cycles)');
  put(ws, `B${L.cycleLastRow + 1}`, S.cycles, false, FORMATS.count);
  const c = L.checkHeaderRow;
  ['resin', 'equivalent time at the peak', 'modulus at end, MPa', 'stress held at the strain, MPa', 'verdict'].forEach((t, j) =>
    header(ws, `${col(1 + j)}${c}`, t),
  );
  review.checks.forEach((k, i) => {
    const r = c + 1 + i;
    put(ws, `A${r}`, k.id);
    formula(ws, `B${r}`, `DERATE.EQTIME($A${r},${temps},${hours},${peak},${L.cyclesCell})`, k.equivalentH, FORMATS.hours);
    formula(ws, `C${r}`, `DERATE.DUTY($A${r},${temps},${hours},${L.cyclesCell},${peak})`, k.afterMPa, FORMATS.modulus);
    formula(ws, `D${r}`, `C${r}*${strain}`, k.heldStressMPa, FORMATS.stress);
    formula(ws, `E${r}`, `IF(C${r}>=${required},"${VERDICT.pass}","${VERDICT.fail}")`, k.pass ? VERDICT.pass : VERDICT.fail);
  });
  const lastRow = c + review.checks.length;
  printable(ws, 'landscape', 1);
  ws.pageSetup.printArea = `A1:${col(lastCol)}${lastRow}`;
  ws.pageSetup.printTitlesRow = '1:1';
}

/** Short labels of the bundled sources, numbered in order of first use. */
function numberSources(texts: readonly string[]): Map<string, number> {
  const numbers = new Map<string, number>();
  for (const t of texts) if (!numbers.has(t)) numbers.set(t, numbers.size + 1);
  return numbers;
}

/**
 * The source of every family number the review uses: one row per field with each candidate's value,
 * the sources as numbers, and the numbered list of sources below (so the sheet prints on one or two pages).
 */
function sourcesSheet(wb: Workbook): void {
  const ws = wb.addWorksheet('Sources');
  const families = S.candidates.map((id) => getGrade(id));
  const lastCol = 3 + families.length;
  const widths = [18, 8, ...families.map(() => 10), 22];
  widths.forEach((w, k) => (ws.getColumn(k + 1).width = w));
  const fields = NUMERIC_FIELDS.filter((spec) => families.some((f) => f.params[spec.key] !== null && f.sources[spec.key] !== undefined));
  const texts = fields.flatMap((spec) => families.map((f) => f.sources[spec.key]).filter((x): x is string => x !== undefined));
  const numbers = numberSources(texts);
  paragraph(ws, 1, lastCol, 'Source of every family number used in the Review sheet (from the bundled family table)', 120, true);
  ['field', 'unit', ...families.map((f) => f.params.id), 'sources (numbered below)'].forEach((t, k) => header(ws, `${col(1 + k)}2`, t));
  fields.forEach((spec, i) => {
    const r = 3 + i;
    put(ws, `A${r}`, spec.key);
    put(ws, `B${r}`, spec.unit);
    const refs = new Map<number, string[]>();
    families.forEach((f, k) => {
      const v = f.params[spec.key];
      const src = f.sources[spec.key];
      if (v === null || src === undefined) {
        put(ws, `${col(3 + k)}${r}`, '-');
        return;
      }
      put(ws, `${col(3 + k)}${r}`, v, false, Number.isInteger(v) ? '#,##0' : '0.###');
      const n = numbers.get(src) ?? 0;
      refs.set(n, [...(refs.get(n) ?? []), f.params.id]);
    });
    const all = refs.size === 1;
    const text = [...refs].map(([n, ids]) => (all ? `[${n}]` : `[${n}] ${ids.join(', ')}`)).join('; ');
    put(ws, `${col(lastCol)}${r}`, text);
    ws.getCell(`${col(lastCol)}${r}`).alignment = WRAP;
  });
  let r = 3 + fields.length + 1;
  put(ws, `A${r}`, 'Sources', true);
  for (const [text, n] of numbers) {
    r++;
    paragraph(ws, r, lastCol, `[${n}] ${text}`, 110);
  }
  printable(ws, 'portrait', 0);
  ws.pageSetup.printArea = `A1:${col(lastCol)}${r}`;
  ws.pageSetup.printTitlesRow = '2:2';
}

function cautionsSheet(wb: Workbook): void {
  const ws = wb.addWorksheet('Cautions');
  const rows: string[] = ['Cautions'];
  for (const line of [
    DEMO_CAUTION,
    DEMO_FILLED_CAUTION,
    'The scenario (product, duty cycle, requirement) is invented for this demo; it is not measured data.',
    'Family values are typical unfilled grades, and a filled grade is its family with the filler added by Halpin-Tsai; a real grade can differ a lot. Replace the symbol by an edited DERATE.PARAMS block to use a grade of your own.',
    'HDT from DERATE.HDT is a simulated ISO 75 test; ISO 75-1 says HDT results are not design data.',
    'Values cached in this file were computed by the Resin Derate engine when it was written; the add-in recalculates them.',
  ]) {
    rows.push(line);
  }
  ws.getColumn(1).width = 85;
  rows.forEach((line, k) => paragraph(ws, k + 1, 1, line, 85, k === 0));
  printable(ws, 'portrait', 0);
  ws.pageSetup.printArea = `A1:A${rows.length}`;
}

/**
 * exceljs (a dev dependency, CommonJS) is loaded from node_modules when the demo runs rather than
 * bundled into dist/cli.js: its Node entry requires built-in modules dynamically, which an ESM bundle
 * cannot do, and no other command needs it.
 */
function loadExcelJS(): typeof import('exceljs') {
  const load = createRequire(import.meta.url);
  return load('exceljs') as typeof import('exceljs');
}

/** Builds the demo workbook in memory. */
export async function buildDemoWorkbook(review: DemoReview): Promise<Workbook> {
  const wb = new (loadExcelJS().Workbook)();
  wb.creator = 'Resin Derate demo';
  reviewSheet(wb, review);
  sourcesSheet(wb);
  cautionsSheet(wb);
  return wb;
}

/** Writes the demo workbook, making its folder first when `makeFolder`; returns the path written. */
export async function writeDemoWorkbook(review: DemoReview, path = DEMO_WORKBOOK_PATH, makeFolder = true): Promise<string> {
  if (makeFolder) mkdirSync(dirname(path), { recursive: true });
  const wb = await buildDemoWorkbook(review);
  await wb.xlsx.writeFile(path);
  return path;
}
