/**
 * The demo workbook: the review of the invented scenario as DERATE.* formulas, each with the value the
 * engine computed cached beside it (so the numbers show before the add-in loads), a duty-cycle block,
 * a sheet of the sources of every family number used, and a sheet of cautions. Written with exceljs.
 */
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import type { CellErrorValue, CellValue, Workbook, Worksheet } from 'exceljs';
import { getFamily, NUMERIC_FIELDS } from '../src/index.js';
import { DEMO_CAUTION, type DemoReview } from './review.js';
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

function formula(ws: Worksheet, ref: string, text: string, result: number | string | CellErrorValue, numFmt?: string): void {
  const cell = ws.getCell(ref);
  cell.value = { formula: text, result } as CellValue;
  if (numFmt) cell.numFmt = numFmt;
}

function put(ws: Worksheet, ref: string, value: string | number, bold = false): void {
  const cell = ws.getCell(ref);
  cell.value = value;
  if (bold) cell.font = { bold: true };
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

  put(ws, 'A1', S.title, true);
  put(ws, 'A2', S.story);
  put(
    ws,
    'A3',
    'Invented scenario for the demo; estimates for screening only (see the Cautions sheet). Formulas need the Resin Derate add-in; the values shown were computed by its engine when this file was written.',
  );
  put(ws, 'A4', 'service time');
  put(ws, 'B4', S.serviceTime);
  put(ws, 'A5', 'required modulus, MPa');
  put(ws, 'B5', S.requiredModulusMPa);
  put(ws, 'A6', 'strain held by the latch (fraction)');
  put(ws, 'B6', S.heldStrain);
  put(ws, 'A7', 'peak cycle temperature, degC');
  formula(ws, 'B7', `MAX(${temps})`, review.peakC);

  // Derating table: candidates down, service temperatures across.
  const h = L.tableHeaderRow;
  put(ws, `A${h - 1}`, `Relaxation modulus after the service time at constant temperature, MPa`, true);
  put(ws, `A${h}`, 'resin \\ degC', true);
  S.temperaturesC.forEach((T, j) => put(ws, `${col(2 + j)}${h}`, T, true));
  const limitCol = col(2 + S.temperaturesC.length);
  const verdictCol = col(3 + S.temperaturesC.length);
  put(ws, `${limitCol}${h}`, `max degC for the required modulus over the service time`, true);
  put(ws, `${verdictCol}${h}`, 'verdict after the duty cycle', true);
  review.rows.forEach((row, i) => {
    const r = L.firstCandidateRow + i;
    const check = review.checks[i];
    if (!check) throw new Error(`demo: no duty check for ${row.id}`);
    put(ws, `A${r}`, row.id);
    row.cells.forEach((c, j) =>
      formula(ws, `${col(2 + j)}${r}`, `DERATE.MODULUS($A${r},${col(2 + j)}$${h},${service})`, c.modulusMPa, '0'),
    );
    formula(ws, `${limitCol}${r}`, `DERATE.MAXTEMP($A${r},${required},${service})`, check.limitC ?? NOT_REACHED, '0.0');
    formula(
      ws,
      `${verdictCol}${r}`,
      `IF(DERATE.DUTY($A${r},${temps},${hours},${L.cyclesCell},${peak})>=${required},"pass","FAIL")`,
      check.pass ? 'pass' : 'FAIL',
    );
  });

  // Duty-cycle block: the day's segments, the number of days, and each candidate after them.
  put(ws, `A${L.cycleHeaderRow - 1}`, 'Daily duty cycle (invented)', true);
  put(ws, `A${L.cycleHeaderRow}`, 'temperature, degC', true);
  put(ws, `B${L.cycleHeaderRow}`, 'hours per day', true);
  S.cycle.forEach(([T, hrs], k) => {
    put(ws, `A${L.cycleFirstRow + k}`, T);
    put(ws, `B${L.cycleFirstRow + k}`, hrs);
  });
  put(ws, `A${L.cycleLastRow + 1}`, 'days (cycles)');
  put(ws, `B${L.cycleLastRow + 1}`, S.cycles);
  const c = L.checkHeaderRow;
  ['resin', 'equivalent h at the peak temperature', 'modulus at end, MPa', 'stress held at the strain, MPa', 'verdict'].forEach((t, j) =>
    put(ws, `${col(1 + j)}${c}`, t, true),
  );
  review.checks.forEach((k, i) => {
    const r = c + 1 + i;
    put(ws, `A${r}`, k.id);
    formula(ws, `B${r}`, `DERATE.EQTIME($A${r},${temps},${hours},${peak},${L.cyclesCell})`, k.equivalentH, '#,##0');
    formula(ws, `C${r}`, `DERATE.DUTY($A${r},${temps},${hours},${L.cyclesCell},${peak})`, k.afterMPa, '0');
    formula(ws, `D${r}`, `C${r}*${strain}`, k.heldStressMPa, '0.00');
    formula(ws, `E${r}`, `IF(C${r}>=${required},"pass","FAIL")`, k.pass ? 'pass' : 'FAIL');
  });
  ws.getColumn(1).width = 34;
  for (let j = 2; j <= 3 + S.temperaturesC.length; j++) ws.getColumn(j).width = 14;
}

function sourcesSheet(wb: Workbook): void {
  const ws = wb.addWorksheet('Sources');
  ws.addRow(['Source of every family number used in the Review sheet (from the bundled family table)']).font = { bold: true };
  ws.addRow(['family', 'field', 'value', 'unit', 'source']).font = { bold: true };
  for (const id of S.candidates) {
    const f = getFamily(id);
    for (const spec of NUMERIC_FIELDS) {
      const value = f.params[spec.key];
      const source = f.sources[spec.key];
      if (value === null || source === undefined) continue;
      ws.addRow([f.params.id, spec.key, value, spec.unit, source]);
    }
  }
  ws.getColumn(1).width = 12;
  ws.getColumn(2).width = 18;
  ws.getColumn(5).width = 120;
}

function cautionsSheet(wb: Workbook): void {
  const ws = wb.addWorksheet('Cautions');
  ws.addRow(['Cautions']).font = { bold: true };
  for (const line of [
    DEMO_CAUTION,
    'The scenario (product, duty cycle, requirement) is invented for this demo; it is not measured data.',
    'Family values are typical unfilled grades; a real grade can differ a lot. Replace the symbol by an edited DERATE.PARAMS block to use a grade of your own.',
    'HDT from DERATE.HDT is a simulated ISO 75 test; ISO 75-1 says HDT results are not design data.',
    'Values cached in this file were computed by the Resin Derate engine when it was written; the add-in recalculates them.',
  ]) {
    ws.addRow([line]);
  }
  ws.getColumn(1).width = 140;
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
