/**
 * The CLI's text output writes its numbers through the engine's display rules (src/base/display.ts),
 * while --json keeps the raw numbers: each text answer is checked against the display function applied
 * to the same command's JSON answer, in-process (main) and once through the built bin/ (spawned).
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { durationText, modulusRangeText, modulusText, stressText, temperatureText } from '../src/base/display.js';
import type { Answer } from './cli-cases.js';
import { runMain } from './support/cli-run.js';

function run(...argv: string[]): Promise<Answer> {
  return runMain(argv);
}

async function text(...argv: string[]): Promise<string> {
  const r = await run(...argv);
  expect(r.err, argv.join(' ')).toBe('');
  return r.out;
}

async function json(...argv: string[]): Promise<Record<string, number>> {
  return JSON.parse(await text(...argv, '--json')) as Record<string, number>;
}

/** A raw JavaScript number leaking into text: 4 or more decimals, or e-notation. */
const RAW_NUMBER = /\d\.\d{4,}|\de[-+]?\d/;

describe('CLI text output uses the display rules; JSON stays raw', () => {
  it('maxtime prints a duration in the unit that fits, from the same seconds --json gives', async () => {
    const args = ['maxtime', '--family', 'PC', '--modulus', '800', '--temp', '120'];
    const j = await json(...args);
    expect(typeof j['time_s']).toBe('number');
    expect(await text(...args)).toBe(`${durationText(j['time_s'] ?? NaN)}\n`);
    expect(await text(...args)).toMatch(/^\d+(\.\d+)? (s|min|h|days|years)\n$/);
  });

  it('modulus: "below 0.001 MPa" for a modulus that has relaxed to nothing, never e-notation', async () => {
    const args = ['modulus', '--family', 'PP', '--temp', '200', '--time', '100 years'];
    const j = await json(...args);
    expect(j['modulus_MPa']).toBeLessThan(1e-3);
    const t = await text(...args);
    expect(t).toBe('PP: below 0.001 MPa (flow; band below 0.001 MPa)\n');
    const pc = ['modulus', '--family', 'PC', '--temp', '80', '--time', '1000 h'];
    const b = await json(...pc);
    expect(await text(...pc)).toBe(
      `PC: ${modulusText(b['modulus_MPa'] ?? NaN)} (glassy; band ${modulusRangeText(b['low_MPa'] ?? NaN, b['high_MPa'] ?? NaN)})\n`,
    );
  });

  it('temperatures to 0.1 degC: maxtemp, tgat and hdt', async () => {
    for (const args of [
      ['maxtemp', '--family', 'PC', '--modulus', '800', '--time', '1000'],
      ['tgat', '--family', 'PC', '--time', '1000'],
      ['hdt', '--family', 'PC', '--stress', 'A'],
    ]) {
      const j = await json(...args);
      expect(await text(...args), args.join(' ')).toBe(`${temperatureText(j['temperature_C'] ?? NaN)}\n`);
    }
  });

  it('eqtime and stress: durations, moduli and stresses with their units', async () => {
    const eq = ['eqtime', '--family', 'PC', '--cycle', '70 degC:8 h,30 degC:16 h', '--cycles', '3650'];
    const e = await json(...eq);
    expect(await text(...eq)).toBe(
      `${durationText(e['equivalent_time_s'] ?? NaN)} at 70 degC; modulus after the history ${modulusText(e['modulus_MPa'] ?? NaN)} (glassy)\n`,
    );
    // 29 200 h of equivalent time reads as years, not hours (issue 14 item 4).
    expect(await text(...eq)).toMatch(/^3\.33 years at 70 degC/);
    const st = ['stress', '--family', 'PC', '--strain', '0.5 %', '--temp', '80', '--time', '1000'];
    const s = await json(...st);
    expect(await text(...st)).toBe(
      `${stressText(s['stress_MPa'] ?? NaN)} retained (modulus ${modulusText(s['modulus_MPa'] ?? NaN)}, glassy)\n`,
    );
  });

  it('table: words in the markdown for people, numbers in the CSV for spreadsheets, raw numbers in JSON', async () => {
    const args = ['table', '--families', 'PC,PP', '--temps', '23,200', '--time', '1000'];
    const md = await text(...args);
    expect(md).toMatch(/\| PC +\| \d+ +\| below 0\.001 +\| 0\.\d\d +\| below 0\.01 +\|/);
    expect(md.split('\n\n')[0]).not.toMatch(RAW_NUMBER);
    const csv = (await text(...args, '--format', 'csv')).trim().split('\n');
    for (const line of csv.slice(1)) for (const cell of line.split(',').slice(1)) expect(Number.isFinite(Number(cell)), cell).toBe(true);
    const raw = JSON.parse(await text(...args, '--format', 'json')) as { rows: { cells: { modulus_MPa: number }[] }[] };
    expect(raw.rows[1]?.cells[0]?.modulus_MPa).not.toBe(Math.round(raw.rows[1]?.cells[0]?.modulus_MPa ?? 0));
  });

  it('the demo prints no raw number and the shared verdict words', async () => {
    // Made here: on a clean clone no other test may have created the folder yet.
    mkdirSync('test-output', { recursive: true });
    const r = await run('demo', '--workbook', 'test-output/cli-text-demo.xlsx');
    expect(r.code).toBe(0);
    expect(r.out).not.toMatch(RAW_NUMBER);
    expect(r.out).toMatch(/\| PC +\| 3\.33 years +\| \d{4} +\|/);
    expect(r.out).not.toMatch(/FAIL/);
  });

  it('the built command line (bin/resin-derate.js) prints the same text as main', async () => {
    const args = ['maxtime', '--family', 'PC', '--modulus', '800', '--temp', '120'];
    const spawned = execFileSync(process.execPath, ['bin/resin-derate.js', ...args], { encoding: 'utf8' });
    expect(spawned).toBe(await text(...args));
    expect(spawned).toMatch(/ days\n$/);
  });
});
