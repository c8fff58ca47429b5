import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { compileMaterial, getFamily, modulusMPa } from '../src/index.js';
import { expectClose } from './expect.js';

/** Runs the built CLI (npm test builds dist/ first). */
function cli(...args: string[]): { code: number; out: string; err: string } {
  const r = spawnSync(process.execPath, ['bin/resin-derate.js', ...args], { encoding: 'utf8' });
  return { code: r.status ?? -1, out: r.stdout, err: r.stderr };
}

function json(...args: string[]): unknown {
  const r = cli(...args, '--json');
  expect(r.err).toBe('');
  expect(r.code).toBe(0);
  return JSON.parse(r.out);
}

describe('resin-derate CLI contract', () => {
  it('families --json lists id, name, kind, Tg_C, Tm_C and sources', () => {
    const list = json('families') as Record<string, unknown>[];
    expect(list.length).toBeGreaterThanOrEqual(20);
    for (const f of list) expect(Object.keys(f)).toEqual(expect.arrayContaining(['id', 'name', 'kind', 'Tg_C', 'Tm_C', 'sources']));
    const pc = list.find((f) => f['id'] === 'PC');
    expect(pc?.['Tm_C']).toBeNull();
  });

  it('params --json round-trips through --params FILE', () => {
    const rec = json('params', '--family', 'PBT') as Record<string, unknown>;
    expect(rec['Tg_C']).toBe(50);
    const dir = mkdtempSync(join(tmpdir(), 'rd-'));
    const file = join(dir, 'pbt.json');
    writeFileSync(file, JSON.stringify({ ...rec, E23_MPa: 2600, E23_high_MPa: 2700 }));
    const a = json('modulus', '--params', file, '--temp', '80 degC', '--time', '1000 h') as Record<string, number>;
    const b = json('modulus', '--family', 'PBT', '--temp', '80 degC', '--time', '1000 h') as Record<string, number>;
    expect(a['modulus_MPa']).toBeGreaterThan(b['modulus_MPa'] ?? Infinity);
  });

  it('takes a polyamide at a humidity, and a params file whose edited humidity_pct gives the wet Tg', () => {
    const at70 = json('modulus', '--family', 'PA66 at 70 % RH', '--temp', '40', '--time', '1000 h') as Record<string, number>;
    const engine = modulusMPa(compileMaterial(getFamily('PA66 at 70 % RH').params), 3.6e6, 313.15);
    expectClose(at70['modulus_MPa'] ?? NaN, engine, { rel: 1e-12, source: 'engine value (same code path)' });
    const rec = json('params', '--family', 'PA66-dry') as Record<string, unknown>;
    const dir = mkdtempSync(join(tmpdir(), 'rd-'));
    const file = join(dir, 'pa66.json');
    writeFileSync(file, JSON.stringify({ ...rec, humidity_pct: 70 }));
    const edited = json('modulus', '--params', file, '--temp', '40', '--time', '1000 h') as Record<string, number>;
    expectClose(edited['modulus_MPa'] ?? NaN, engine, { rel: 1e-12, source: 'same record at 70 % RH (humidity.ts)' });
  });

  it('modulus --json answers with the engine value and the contract keys', () => {
    const r = json('modulus', '--family', 'PC', '--temp', '176 degF', '--time', '1000 h') as Record<string, unknown>;
    expect(Object.keys(r).sort()).toEqual(['high_MPa', 'low_MPa', 'modulus_MPa', 'region', 'temperature_C', 'time_s']);
    const engine = modulusMPa(compileMaterial(getFamily('PC').params), 3.6e6, 353.15);
    expectClose(r['modulus_MPa'] as number, engine, { rel: 1e-12, source: 'engine value (same code path)' });
    expectClose(r['temperature_C'] as number, 80, { abs: 1e-9, source: 'NIST SP 811: 176 degF = 80 degC' });
    expect(r['time_s']).toBe(3.6e6);
    expect(r['region']).toBe('glassy');
  });

  it('shift --json gives the WLF worked value at Tg + 10 K', () => {
    const r = json('shift', '--family', 'PC', '--temp', '157') as Record<string, unknown>;
    expect(r['law']).toBe('wlf');
    expectClose(r['log10_aT'] as number, -2.831, { abs: 5e-4, source: 'Williams, Landel, Ferry 1955; -174.4/61.6 (derived)' });
  });

  it('maxtemp --json answers found and not-reached cases explicitly', () => {
    const found = json('maxtemp', '--family', 'PBT', '--modulus', '1000', '--time', '1000 h') as Record<string, unknown>;
    expect(found['status']).toBe('found');
    expect(typeof found['temperature_C']).toBe('number');
    const never = json('maxtemp', '--family', 'PP', '--modulus', '20 GPa', '--time', '1 h') as Record<string, unknown>;
    expect(never['temperature_C']).toBeNull();
    expect(never['not_reached']).toMatch(/below the required modulus/);
  });

  it('table prints markdown, csv and json', () => {
    const md = cli('table', '--families', 'PC,PA66-cond', '--temps', '23,60,80', '--time', '1000 h');
    expect(md.code).toBe(0);
    expect(md.out).toMatch(/\| family +\| 23 degC MPa/);
    expect(md.out).toMatch(/Screening estimates only/);
    const csv = cli('table', '--families', 'PC', '--temps', '23,80', '--time', '1 h', '--format', 'csv');
    expect(csv.out.split('\n')[0]).toBe('family,23 degC MPa,80 degC MPa,ratio 23,ratio 80');
    const js = JSON.parse(cli('table', '--families', 'PC', '--temps', '23', '--time', '1 h', '--format', 'json').out);
    expectClose(js.rows[0].cells[0].ratio, 1, { rel: 1e-12, source: 'ratio to its own reference (23 degC, 1 h)' });
  });

  it('eqtime, maxtime, tgat and hdt answer', () => {
    const eq = json('eqtime', '--family', 'PC', '--cycle', '80 degC:8 h,80 degC:16 h', '--cycles', '2') as Record<string, number>;
    expectClose(eq['equivalent_time_h'] ?? NaN, 48, { rel: 1e-12, source: 'constant history: equivalent time = duration' });
    expect((json('maxtime', '--family', 'PC', '--modulus', '100', '--temp', '23') as Record<string, unknown>)['not_reached']).toBe(
      'beyond 100 years',
    );
    expect((json('tgat', '--family', 'PC', '--time', '1 s') as Record<string, number>)['temperature_C']).toBeCloseTo(147, 9);
    const st = json('stress', '--family', 'PC', '--strain', '0.5 %', '--temp', '80', '--time', '1000 h') as Record<string, number>;
    expectClose(st['stress_MPa'] ?? NaN, 0.005 * modulusMPa(compileMaterial(getFamily('PC').params), 3.6e6, 353.15), {
      rel: 1e-12,
      source: 'sigma = E_r eps0',
    });
    expect(typeof (json('hdt', '--family', 'PC', '--stress', '1.8') as Record<string, unknown>)['temperature_C']).toBe('number');
  });

  it('fails with one line on stderr naming the bad argument', () => {
    const cases: [string[], RegExp][] = [
      [['modulus', '--family', 'PC', '--temp', '5 kg', '--time', '1 h'], /--temp: temperature needs a temperature unit, got '5 kg'/],
      // Words of the shared input layer (src/input/), the same as the worksheet's with the option's name.
      [['modulus', '--family', 'PC', '--temp', '80'], /--time: is missing; type a time \(a number in hours/],
      [
        ['modulus', '--family', 'PA66-wet', '--temp', '80', '--time', '1'],
        /--family: unknown family "PA66-wet"; did you mean "PA66-cond", "PA66-dry".*\? \(resin-derate families lists the symbols\)/,
      ],
      [
        ['modulus', '--family', 'PC at 50 % RH', '--temp', '80', '--time', '1'],
        /--family: a humidity applies to polyamides only \(PA6, PA66\)/,
      ],
      [['modulus', '--family', 'PA66-dry @ 0%RH', '--temp', '80', '--time', '1'], /--family: .*either PA66-dry or a humidity/],
      [['modulus', '--family', 'PC', '--temp', '80', '--time=-1 h'], /--time: a time must be greater than zero/],
      [['modulus', '--family', 'PC', '--temp', '80', '--time', '-1 h'], /--time: a time must be greater than zero/],
      [['maxtemp', '--family', 'PC', '--modulus', 'lots', '--time', '1 h'], /--modulus: expected a number/],
      [['table', '--families', 'PC', '--temps', '23', '--time', '1', '--format', 'xml'], /--format: must be md, csv or json/],
      [['modulus', '--family', 'PC', '--bogus', '1'], /modulus: --bogus: unknown option; modulus takes --family, --params, --temp, --time/],
      [['modulus', '--family', 'PC', '--temp', '--time', '1 h'], /modulus: --temp: needs a value/],
      [['frobnicate'], /unknown command 'frobnicate'/],
    ];
    for (const [args, message] of cases) {
      const r = cli(...args);
      expect(r.code, args.join(' ')).not.toBe(0);
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(message);
    }
  });

  it('has --help on every command', () => {
    for (const c of ['families', 'params', 'modulus', 'shift', 'maxtemp', 'maxtime', 'tgat', 'eqtime', 'stress', 'hdt', 'table', 'demo']) {
      const r = cli(c, '--help');
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/Usage: resin-derate/);
    }
  });

  it('the demo prints the scenario, the derating table and the cautions', () => {
    const r = cli('demo');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/invented/);
    expect(r.out).toMatch(/\| PC /);
    expect(r.out).toMatch(/licensed engineering review/);
  });
});
