/**
 * The demo workbook as a reviewer prints it: rendered to PDF by LibreOffice (headless, Debian's
 * libreoffice-calc-nogui, installed by .ci/run), then read back with poppler's pdftotext and pdffonts.
 * The Review sheet must print on one page, Sources and Cautions on two pages or fewer, every header of
 * the Review sheet must appear whole, and one font family must be used throughout.
 *
 * What this cannot show: Excel's own page breaks. LibreOffice lays out from the same column widths,
 * page set-up and fonts (Arial -> Liberation Sans, and Calibri -> Carlito, both metric-compatible), so a
 * page count that holds here should hold in Excel, but nothing here runs Excel.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { computeDemo } from '../cli/review.js';
import { REVIEW_SHEET, writeDemoWorkbook } from '../cli/workbook.js';

const ExcelJS = createRequire(import.meta.url)('exceljs') as typeof import('exceljs');
const DIR = 'test-output/print';
const XLSX = join(DIR, 'derating-review.xlsx');
const PDF = join(DIR, 'derating-review.pdf');

function need(command: string, pkg: string): void {
  const found = spawnSync('sh', ['-c', `command -v ${command}`]).status === 0;
  if (!found) throw new Error(`${command} is missing: install the Debian package ${pkg} (.ci/run does)`);
}

/** Text of each page, raw order (a wrapped cell's lines stay together), whitespace collapsed. */
function pages(count: number): string[] {
  return Array.from({ length: count }, (_, i) =>
    execFileSync('pdftotext', ['-raw', '-f', String(i + 1), '-l', String(i + 1), PDF, '-'], { encoding: 'utf8' })
      .replace(/\s+/g, ' ')
      .trim(),
  );
}

let pageCount = 0;
let text: string[] = [];
beforeAll(async () => {
  need('soffice', 'libreoffice-calc-nogui');
  need('pdftotext', 'poppler-utils');
  mkdirSync(DIR, { recursive: true });
  rmSync(PDF, { force: true });
  await writeDemoWorkbook(computeDemo(), XLSX);
  execFileSync('soffice', ['--headless', '--norestore', '--convert-to', 'pdf', '--outdir', DIR, XLSX], {
    stdio: 'ignore',
    timeout: 120_000,
    env: { ...process.env, HOME: join(process.cwd(), DIR) },
  });
  if (!existsSync(PDF)) throw new Error('LibreOffice wrote no PDF');
  const info = execFileSync('pdfinfo', [PDF], { encoding: 'utf8' });
  pageCount = Number(/Pages:\s+(\d+)/.exec(info)?.[1] ?? 0);
  text = pages(pageCount);
}, 180_000);

describe('the demo workbook printed (LibreOffice headless -> PDF)', () => {
  it('prints the Review on one landscape page, Sources and Cautions on two pages or fewer each', () => {
    const of = (sheet: string): number => text.filter((t) => t.includes(`(invented scenario): ${sheet} page`)).length;
    expect(of(REVIEW_SHEET)).toBe(1);
    expect(of('Sources')).toBeGreaterThanOrEqual(1);
    expect(of('Sources')).toBeLessThanOrEqual(2);
    expect(of('Cautions')).toBeGreaterThanOrEqual(1);
    expect(of('Cautions')).toBeLessThanOrEqual(2);
    expect(of(REVIEW_SHEET) + of('Sources') + of('Cautions')).toBe(pageCount);
    const size = execFileSync('pdfinfo', ['-f', '1', '-l', '1', PDF], { encoding: 'utf8' });
    const [w, h] = (/Page\s+1 size:\s+([\d.]+) x ([\d.]+)/.exec(size) ?? []).slice(1).map(Number);
    expect(w, 'page 1 is landscape').toBeGreaterThan(h ?? Infinity);
  });

  it('shows every header of the Review sheet whole (none cut by a narrow column)', async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(XLSX);
    const ws = wb.getWorksheet(REVIEW_SHEET);
    const headers: string[] = [];
    ws?.eachRow((row) =>
      row.eachCell((cell) => {
        if (cell.font?.bold && typeof cell.value === 'string') headers.push(cell.value.replace(/\s+/g, ' '));
      }),
    );
    expect(headers.length).toBeGreaterThan(8);
    const page1 = text[0] ?? '';
    for (const h of headers) expect(page1, `header "${h}"`).toContain(h);
  });

  it('prints the whole text of every caution', async () => {
    const all = text.join(' ');
    expect(all).toContain('defer to local codes and licensed engineering review.');
    expect(all).toContain('ISO 75-1 says HDT results are not design data.');
    // The filled candidate's caution (cli/review.ts), whole: datasheet moduli of filled grades are along flow (common practice).
    expect(all).toContain('carries no weld line.');
    expect(all).toContain('Filled grades (PBT-GF30 here) are estimated along the flow direction');
  });

  it('uses one font family, bold and regular (no fallback to a serif face)', () => {
    const fonts = execFileSync('pdffonts', [PDF], { encoding: 'utf8' })
      .split('\n')
      .slice(2)
      .map((l) => l.split(/\s+/)[0] ?? '')
      .filter((n) => n.length > 0)
      .map((n) => n.replace(/^[A-Z]{6}\+/, '').replace(/-(Bold|Italic|BoldItalic)$/, ''));
    expect(new Set(fonts).size, fonts.join(', ')).toBe(1);
  });
});
