/**
 * The demo workbook: written from the engine's review, opened again, and every formula re-evaluated in a
 * real spreadsheet engine with DERATE.* registered; each must give back the value cached in the file.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { DetailedCellError } from 'hyperformula';
import { beforeAll, describe, expect, it } from 'vitest';
import { printDemo } from '../cli/demo.js';
import { computeDemo, type DemoReview } from '../cli/review.js';
import { durationText, mpaValue, VERDICT } from '../src/index.js';
import { DEMO_SCENARIO } from '../cli/scenario.js';
import { REVIEW_SHEET, writeDemoWorkbook } from '../cli/workbook.js';
import { derateWorkbook } from '../functions/host/hyperformula.js';
import { expectClose } from './expect.js';
import { loadFunctions } from './support/functions.js';

const ExcelJS = createRequire(import.meta.url)('exceljs') as typeof import('exceljs');
const OUT = 'test-output/derating-review.xlsx';

interface Cached {
  readonly ref: string;
  readonly row: number;
  readonly col: number;
  readonly formula: string;
  readonly result: unknown;
}

async function readBack(path: string): Promise<{ data: unknown[][]; cached: Cached[]; wb: import('exceljs').Workbook }> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  const ws = wb.getWorksheet(REVIEW_SHEET);
  if (!ws) throw new Error('no Review sheet');
  const data: unknown[][] = [];
  const cached: Cached[] = [];
  ws.eachRow({ includeEmpty: true }, (row, r) => {
    row.eachCell({ includeEmpty: true }, (cell, c) => {
      const line = (data[r - 1] ??= []);
      const v = cell.value as unknown;
      if (v !== null && typeof v === 'object' && 'formula' in v) {
        const f = v as { formula: string; result?: unknown };
        line[c - 1] = `=${f.formula}`;
        cached.push({ ref: cell.address, row: r - 1, col: c - 1, formula: f.formula, result: f.result });
      } else {
        line[c - 1] = v ?? null;
      }
    });
  });
  for (let r = 0; r < data.length; r++) data[r] ??= [];
  return { data, cached, wb };
}

let review: DemoReview;
beforeAll(async () => {
  await loadFunctions();
  review = computeDemo();
  mkdirSync('test-output', { recursive: true });
  rmSync(OUT, { force: true });
  await writeDemoWorkbook(review, OUT);
});

describe('demo workbook', () => {
  it('re-evaluates to its cached values in a spreadsheet engine with DERATE.* registered', async () => {
    const { data, cached } = await readBack(OUT);
    const derate = cached.filter((c) => c.formula.includes('DERATE.'));
    // candidates x temperatures, a limit and a verdict per candidate, and three duty-cycle formulas each.
    const n = DEMO_SCENARIO.candidates.length;
    expect(derate.length).toBe(n * DEMO_SCENARIO.temperaturesC.length + 2 * n + 2 * n);
    const hf = derateWorkbook({ [REVIEW_SHEET]: data });
    for (const c of cached) {
      const got = hf.getCellValue({ sheet: 0, row: c.row, col: c.col });
      const label = `${c.ref} =${c.formula}`;
      if (c.result !== null && typeof c.result === 'object' && 'error' in c.result) {
        expect(got, label).toBeInstanceOf(DetailedCellError);
        expect((got as DetailedCellError).value, label).toBe((c.result as { error: string }).error);
      } else if (typeof c.result === 'number') {
        expect(typeof got, `${label}: ${String(got)}`).toBe('number');
        expectClose(got as number, c.result, { rel: 1e-9, source: `${label}: value cached by the engine (cli/review.ts computeDemo)` });
      } else {
        expect(got, label).toBe(c.result);
      }
    }
    hf.destroy();
  });

  it('has a required-stiffness verdict per candidate, a duty-cycle block, sources and cautions', async () => {
    const { data, wb } = await readBack(OUT);
    const flat = data.flat().map(String);
    expect(flat.filter((x) => x === 'pass' || x.includes('>=')).length).toBeGreaterThan(0);
    expect(flat).toContain('Daily duty cycle (invented)');
    expect(flat.some((x) => x.startsWith('=DERATE.EQTIME('))).toBe(true);
    const sources = wb.getWorksheet('Sources');
    const cautions = wb.getWorksheet('Cautions');
    expect(sources && cautions).toBeTruthy();
    // Sources: a header row naming every candidate, one row per field whose source column cites numbered
    // sources, and each cited number resolved in the list below the table.
    const headerRow = sources?.getRow(2).values as unknown[];
    expect(headerRow.filter((v) => DEMO_SCENARIO.candidates.includes(String(v) as never)).sort()).toEqual(
      [...DEMO_SCENARIO.candidates].sort(),
    );
    const cited = new Set<string>();
    const listed = new Map<string, string>();
    sources?.eachRow((row, r) => {
      if (r <= 2) return;
      const first = String(row.getCell(1).value ?? '');
      const m = /^\[(\d+)\] (.+)$/.exec(first);
      if (m) listed.set(m[1] ?? '', m[2] ?? '');
      else for (const c of row.values as unknown[]) for (const n of String(c ?? '').matchAll(/\[(\d+)\]/g)) cited.add(n[1] ?? '');
    });
    expect(cited.size).toBeGreaterThan(5);
    for (const n of cited) expect(listed.get(n)?.length ?? 0, `source [${n}]`).toBeGreaterThan(10);
    const cautionText: string[] = [];
    cautions?.eachRow((row) => cautionText.push(String(row.getCell(1).value)));
    expect(cautionText.join(' ')).toMatch(/licensed engineering review/);
    expect(cautionText.join(' ')).toMatch(/invented/);
    // The scenario has a filled candidate, and its caution says the estimate is along flow (common practice:
    // datasheet moduli of fibre-filled grades are measured on bars filled along their length).
    expect(DEMO_SCENARIO.candidates.some((id) => /-GF\d/.test(id))).toBe(true);
    expect(cautionText.join(' ')).toMatch(/along the flow direction.*weld line/);
    // Its sources include the filler's (Halpin-Tsai inputs, src/material/filler.ts).
    expect([...listed.values()].join(' ')).toMatch(/E-glass/);
  });

  it('caches the same numbers the terminal prints (one computation for both)', async () => {
    let printed = '';
    printDemo(review, { write: (t: string) => (printed += t) });
    const { cached } = await readBack(OUT);
    const duty = cached.filter((c) => c.formula.startsWith('DERATE.DUTY('));
    expect(duty.length).toBe(review.checks.length);
    review.checks.forEach((check, i) => {
      expect(duty[i]?.result, check.id).toBe(check.afterMPa);
      // The terminal and the pane share the verdict words (src/answers/verdict.ts) and the display rules (src/base/display.ts).
      const line = printed.split('\n').find((l) => l.startsWith(`| ${check.id} `) && l.includes(check.pass ? VERDICT.pass : VERDICT.fail));
      expect(line, `${check.id} in the printed duty-cycle table`).toContain(` ${mpaValue(check.afterMPa)} `);
      expect(line, `${check.id}: equivalent time in the unit that fits`).toContain(` ${durationText(check.equivalentH * 3600)} `);
    });
  });

  it('is written by `resin-derate demo` (the bundled CLI), which also prints the table', () => {
    if (!existsSync('dist/cli.js')) throw new Error('dist/cli.js is missing: run npm run build first (npm test does)');
    const path = 'test-output/cli-demo.xlsx';
    rmSync(path, { force: true });
    const run = spawnSync(process.execPath, ['bin/resin-derate.js', 'demo', '--workbook', path], { encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    expect(run.stdout).toContain('| resin');
    expect(run.stdout).toContain(`Wrote ${path}`);
    expect(existsSync(path)).toBe(true);
  });
});
