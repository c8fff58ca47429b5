/**
 * The review's grade builder and the look-up's filled grades in Chromium (playwright-core, the preview page
 * with the in-memory sheet, as taskpane.test.ts): a grade built from fields, the error under the field at
 * fault, the humidity field only for polyamides, the grade text in the written formulas, and the look-up's
 * cards and blocks of filled grades.
 */
import { mkdirSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import buildAddin from '../../scripts/build/30-addin.mjs';
import { CHROMIUM_ARGS, ensureChromium } from '../../scripts/ensure-chromium.mjs';
import { PREVIEW_PAGE, startPreview, type Preview } from '../../scripts/preview-server.mjs';
import { compileMaterial, cToKelvin, getGrade, modulusMPa, parseTimeS } from '../../src/index.js';
import { FILLED_GRADE_IDS } from '../../src/material/grade.js';
import { paramsBlockRows } from '../../addin/jobs/lookup/plan.js';
import { expectClose } from '../expect.js';

let preview: Preview;
let browser: Browser;
let page: Page;

const ENGINE = 'engine modulusMPa, the call DERATE.MODULUS makes (consistency of pane and functions)';

async function cell(sheet: string, row: number, col: number): Promise<{ value: string | number | boolean; formula?: string } | null> {
  return page.evaluate(([s, r, c]) => window.resinDeratePreview?.workbook.cell(s as string, r as number, c as number) ?? null, [
    sheet,
    row,
    col,
  ] as const);
}

async function candidates(): Promise<string[]> {
  return (await page.locator('#candidate-list li').allTextContents()).map((t) => t.replace(/Remove$/, ''));
}

beforeAll(async () => {
  const executablePath = ensureChromium();
  await buildAddin();
  mkdirSync('test-output', { recursive: true });
  preview = await startPreview({ root: 'dist', port: 0 });
  browser = await chromium.launch({ executablePath, args: CHROMIUM_ARGS });
  const context = await browser.newContext({ viewport: { width: 320, height: 800 } });
  await context.route('**/*', async (route) => {
    const url = new URL(route.request().url());
    if (url.hostname === 'localhost' || url.hostname === '127.0.0.1') await route.continue();
    else await route.abort('blockedbyclient');
  });
  page = await context.newPage();
  page.setDefaultTimeout(10_000);
  await page.goto(`${preview.url}${PREVIEW_PAGE}`);
  await page.waitForSelector('body[data-ready=true]', { timeout: 20_000 });
}, 600_000);

afterAll(async () => {
  await browser?.close();
  await preview?.close();
});

describe('building a filled grade in the review (320 px wide)', () => {
  it('labels every builder field and shows the humidity field for polyamides only', async () => {
    await page.click('#tab-review');
    for (const id of ['add-family', 'add-filler', 'add-mass', 'add-rh']) {
      await expect(page.locator(`label[for=${id}]`).count(), id).resolves.toBe(1);
    }
    await page.selectOption('#add-family', 'PBT');
    expect(await page.isVisible('#add-rh')).toBe(false);
    await page.selectOption('#add-family', 'PA66');
    expect(await page.isVisible('#add-rh')).toBe(true);
    // A family that carries its own moisture state takes no humidity field either.
    await page.selectOption('#add-family', 'PA66-cond');
    expect(await page.isVisible('#add-rh')).toBe(false);
    expect(await page.isVisible('#add-mass')).toBe(false);
    await page.selectOption('#add-filler', 'GF');
    expect(await page.isVisible('#add-mass')).toBe(true);
    // Nothing sticks out of the 320 px pane (WCAG 2.1, success criterion 1.4.10 Reflow: 320 CSS px without horizontal scrolling).
    const wide = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(wide).toBeLessThanOrEqual(320);
  });

  it('adds "PA66-GF30 at 50 % RH" and "PBT-GF30" from the fields, by keyboard', async () => {
    await page.focus('#add-family');
    await page.selectOption('#add-family', 'PA66');
    await page.selectOption('#add-filler', 'GF');
    await page.fill('#add-mass', '30');
    await page.fill('#add-rh', '50');
    await expect(page.textContent('#add-grade-text')).resolves.toBe('Adds PA66-GF30 at 50 % RH');
    await page.focus('#add-rh');
    await page.keyboard.press('Enter');
    await page.selectOption('#add-family', 'PBT');
    await page.fill('#add-mass', '30 %');
    await page.focus('#add-family-btn');
    await page.keyboard.press('Enter');
    await page.locator('#review-form fieldset').first().screenshot({ path: 'test-output/grade-builder-320.png' });
    expect(await candidates()).toEqual([
      'PC (family)',
      'PBT (family)',
      'POM (family)',
      'PA66-GF30 at 50 % RH (filled grade)',
      'PBT-GF30 (filled grade)',
    ]);
  });

  it('puts a mass percent outside the filler range under the mass field and adds nothing', async () => {
    await page.selectOption('#add-family', 'PBT');
    await page.selectOption('#add-filler', 'GF');
    await page.fill('#add-mass', '80');
    await page.click('#add-family-btn');
    // GF mass range 5 to 60 % (FILLERS.GF.massPct, src/material/filler.ts).
    await expect(page.textContent('#add-mass-error')).resolves.toMatch(/^Filler mass: .*80 % of GF .* outside 5 to 60 %/);
    await expect(page.getAttribute('#add-mass', 'aria-invalid')).resolves.toBe('true');
    await expect(page.getAttribute('#add-mass', 'aria-describedby')).resolves.toMatch(/(^| )add-mass-error( |$)/);
    expect(await candidates()).toHaveLength(5);
    await page.fill('#add-mass', 'thirty');
    await page.click('#add-family-btn');
    await expect(page.textContent('#add-mass-error')).resolves.toMatch(/^Filler mass: expects a percentage such as 30, got "thirty"/);
  });

  it('puts a humidity outside 0 to 100 % under the humidity field', async () => {
    await page.selectOption('#add-family', 'PA6');
    await page.selectOption('#add-filler', 'none');
    await page.fill('#add-rh', '120');
    await page.click('#add-family-btn');
    await expect(page.textContent('#add-rh-error')).resolves.toMatch(/^Relative humidity: relative humidity must be 0 to 100 %/);
    await expect(page.locator('#add-mass-error').count()).resolves.toBe(0);
    await page.fill('#add-rh', '50');
  });

  it('writes the grade text as the material of its formulas, with the engine values', async () => {
    await page.getByRole('button', { name: 'Remove POM (family)' }).click();
    await page.getByRole('button', { name: 'Remove PC (family)' }).click();
    await page.fill('#target', 'Sheet1!A1');
    await page.click('#write-review');
    await page.waitForSelector('.status.ok');
    const t = parseTimeS('1000 h');
    const header = 5;
    for (const [i, id] of ['PBT', 'PA66-GF30 at 50 % RH', 'PBT-GF30'].entries()) {
      const r = header + 1 + i;
      // The material argument is the row's label cell, which holds the grade text the worksheet reads.
      expect(await cell('Sheet1', r, 0)).toMatchObject({ value: id });
      const m = compileMaterial(getGrade(id).params);
      for (const [j, T] of [23, 40, 60, 80, 100].entries()) {
        const c = await cell('Sheet1', r, 1 + j);
        expect(c?.formula).toBe(`=DERATE.MODULUS($A${r + 1},${String.fromCharCode(66 + j)}$6,$B$3)`);
        expectClose(Number(c?.value), modulusMPa(m, t, cToKelvin(T)), { rel: 1e-12, source: ENGINE });
      }
    }
    const notes: string[] = [];
    for (let r = 9; r < 20; r++) notes.push(String((await cell('Sheet1', r, 0))?.value ?? ''));
    expect(notes.join(' ')).toMatch(/Filled grades .* along the flow direction/);
    await expect(page.locator('#review-summary tbody th').allTextContents()).resolves.toEqual(['PBT', 'PA66-GF30 at 50 % RH', 'PBT-GF30']);
    // The chart names each curve by its label cell, the long grade text whole.
    await page.waitForSelector('#charts figure canvas');
    const charts = await page.evaluate(() => window.resinDeratePreview?.view.chartData() ?? []);
    expect(
      charts
        .at(-1)
        ?.series.slice(0, 3)
        .map((s) => s.label),
    ).toEqual(['PBT', 'PA66-GF30 at 50 % RH', 'PBT-GF30']);
    await page.screenshot({ path: 'test-output/taskpane-grade-320.png', fullPage: true });
  });
});

describe('filled grades in the look-up', () => {
  it('lists the common filled grades after the families, and search finds them and typed humidity text', async () => {
    await page.click('#tab-families');
    const ids = await page.locator('#family-list li.card').evaluateAll((els) => els.map((e) => e.getAttribute('data-family')));
    expect(ids.slice(-FILLED_GRADE_IDS.length)).toEqual([...FILLED_GRADE_IDS]);
    await page.fill('#family-search', 'glass fibre');
    const glass = await page.locator('#family-list li.card').evaluateAll((els) => els.map((e) => e.getAttribute('data-family')));
    expect(glass).toContain('PBT-GF30');
    expect(glass).not.toContain('PBT');
    await page.fill('#family-search', 'PA66-GF30 at 70 % RH');
    await expect(page.locator('#family-list li.card').evaluateAll((els) => els.map((e) => e.getAttribute('data-family')))).resolves.toEqual(
      ['PA66-GF30 at 70 % RH'],
    );
    await page.fill('#family-search', 'PA66 at 70 % RH');
    await expect(page.locator('#family-list li.card').evaluateAll((els) => els.map((e) => e.getAttribute('data-family')))).resolves.toEqual(
      ['PA66 at 70 % RH'],
    );
  });

  it("shows a filled grade's estimated modulus along flow with its source, and writes its block", async () => {
    await page.fill('#family-search', 'PBT-GF30');
    const card = page.locator('li.card[data-family="PBT-GF30"]');
    await expect(card.locator('dl.facts').textContent()).resolves.toMatch(/Modulus at 23 degC, along flow/);
    await expect(card.locator('details.sources').textContent()).resolves.toMatch(/Halpin-Tsai/);
    // A1 holds the review written above: the pane asks, and the block goes to a new sheet.
    await page.click('#cell-0-0');
    await card.getByRole('button', { name: /Write parameters/ }).click();
    await page.waitForSelector('#ask:not([hidden])');
    await page.click('#ask-new-sheet');
    await page.waitForSelector('.status.ok');
    const names = await page.evaluate(() => window.resinDeratePreview?.workbook.sheetNames() ?? Promise.resolve([]));
    const sheet = names.find((n) => n.startsWith('PBT-GF30'));
    expect(sheet, names.join(', ')).toBeDefined();
    const rows = paramsBlockRows(getGrade('PBT-GF30').params);
    for (const [i, row] of rows.entries()) expect(await cell(sheet ?? '', i, 0)).toMatchObject({ value: row[0] });
    const filler = rows.findIndex((r) => r[0] === 'filler');
    expect(filler).toBeGreaterThan(0);
    expect(await cell(sheet ?? '', filler, 1)).toMatchObject({ value: 'GF' });
  });
});
