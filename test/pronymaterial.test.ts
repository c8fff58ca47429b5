import { describe, expect, it } from 'vitest';
import {
  apparentTgK,
  bandEstimate,
  deratingTable,
  fitDma,
  gamma,
  getFamily,
  compileMaterial,
  isPronyTable,
  materialInputFromRange,
  paramsToRecord,
  KELVIN_OFFSET,
  maxTemperatureK,
  modulusMPa,
  pronyFromRecord,
  pronyFromTable,
  pronyModulusMPa,
  pronyToRecord,
  pronyToTable,
  resolveMaterial,
  shiftLog10,
  simulateHdt,
  storageFactor,
  storageModulusMPa,
  wlfLog10,
  type PronyMaterialSpec,
} from '../src/index.js';
import { expectClose } from './expect.js';
import { fourTermProny } from './support/prony.js';

const K = KELVIN_OFFSET;
const SPEC = fourTermProny('test-prony');

describe('Prony material', () => {
  it('is the series itself at the reference temperature', () => {
    const m = resolveMaterial(SPEC);
    for (const t of [0.001, 0.5, 50, 5000]) {
      expectClose(modulusMPa(m, t, 160 + K), pronyModulusMPa(SPEC.prony, t), {
        rel: 1e-9,
        source: 'definition of the Prony material (a_T = 1 at the reference)',
      });
    }
  });
  it('shifts by WLF above Tg with the constants at the reference, and continues by Arrhenius below', () => {
    const m = resolveMaterial(SPEC);
    const at = (T: number): number => shiftLog10(m.shift, T) - shiftLog10(m.shift, 160 + K);
    expectClose(at(170 + K), wlfLog10(170, 160, 12.3, 73), {
      abs: 1e-9,
      source: 'WLF (Williams, Landel, Ferry 1955), re-referenced to Tg and back (derived)',
    });
    expect(Math.abs(shiftLog10(m.shift, 147 + K - 1e-9) - shiftLog10(m.shift, 147 + K + 1e-9))).toBeLessThan(1e-6);
    // The modulus at T equals the series at t / a_T.
    const aT = 10 ** at(150 + K);
    expectClose(modulusMPa(m, 100, 150 + K), pronyModulusMPa(SPEC.prony, 100 / aT), {
      rel: 1e-9,
      source: 'time-temperature superposition (definition)',
    });
  });
  it('works with the inverse solvers, the band, the derating table and the HDT', () => {
    const m = resolveMaterial(SPEC);
    expect(maxTemperatureK(m, 100, 3600).status).toBe('found');
    const b = bandEstimate(m, 3600, 150 + K);
    // No ranges to vary: the band is the uncertainty of the shift (band.ts PRONY_BAND_DECADES).
    expect(b.lowMPa).toBeLessThan(b.centralMPa);
    expect(b.highMPa).toBeGreaterThan(b.centralMPa);
    expect(deratingTable([SPEC], [23, 150], 3600)[0]?.id).toBe('test-prony');
    expect(apparentTgK(m, 100)).not.toBeNull();
    expect(simulateHdt(m, 1.8).temperatureC).not.toBeNull();
  });
  it('round-trips through the plain table and the JSON record', () => {
    const table = pronyToTable(SPEC);
    expect(isPronyTable(table)).toBe(true);
    expect(pronyFromTable(table)).toEqual(SPEC);
    expect(pronyFromRecord(pronyToRecord(SPEC) as unknown as Record<string, unknown>)).toEqual(SPEC);
  });
  it('is read from a worksheet range, as is a parameter block', () => {
    expect(materialInputFromRange(pronyToTable(SPEC))).toEqual(SPEC);
    const block = Object.entries(paramsToRecord(getFamily('PC').params)).map(([k, v]) => [k, v]);
    const m = resolveMaterial(materialInputFromRange([...block, [null, null]]));
    expectClose(modulusMPa(m, 10, 23 + K), 2350, { rel: 1e-9, source: 'PC family E23 anchor (families.ts, common practice)' });
    expect(() => materialInputFromRange([['Tg_C', 100, 5]])).toThrow(/row 1 of the parameter block must be a name and a value/);
  });
  it('reads a block from a range as the worksheet material arguments do (header, any case, comments, suggestions)', () => {
    const block = Object.entries(paramsToRecord(getFamily('PC').params)).map(([k, v]) => [k.toLowerCase(), v]);
    const m = resolveMaterial(materialInputFromRange([['field', 'value'], ...block, ['# fit quality: invented note', null]]));
    expectClose(modulusMPa(m, 10, 23 + K), 2350, { rel: 1e-9, source: 'PC family E23 anchor (families.ts, common practice)' });
    const typo = [
      ['kind', 'amorphous'],
      ['Tg_Cx', 100],
    ];
    expect(() => materialInputFromRange(typo, { argument: 'block' })).toThrow(
      /block: row 2: "Tg_Cx" is not a parameter name; did you mean "Tg_C"/,
    );
  });
  it('refuses bad tables with the row named', () => {
    const table = pronyToTable(SPEC);
    const bad = table.map((r) => [...r]);
    bad[bad.length - 1] = [100, 'x'];
    expect(() => pronyFromTable(bad)).toThrow(/row 14: E_MPa must be a number/);
    expect(() =>
      pronyFromTable([
        ['prony', 'a'],
        ['reference_C', 100],
        ['shiftLaw', 'wlf'],
        ['tau_s', 'E_MPa'],
        [1, 10],
      ]),
    ).toThrow(/C1: is required for the wlf shift law/);
    expect(() =>
      pronyFromTable([
        ['prony', 'a'],
        ['colour', 'red'],
      ]),
    ).toThrow(/row 2: unknown key 'colour'/);
    expect(() =>
      pronyFromTable([
        ['prony', 'a'],
        ['reference_C', 100],
        ['shiftLaw', 'arrhenius'],
        ['Ea_kJmol', 100],
        ['tau_s', 'E_MPa'],
        [-1, 10],
      ]),
    ).toThrow(/tau_s: term 1/);
  });
});

describe('storage modulus and DMA fit', () => {
  it('uses Gamma: Gamma(1/2)^2 = pi, Gamma(5) = 24', () => {
    expectClose(gamma(0.5) ** 2, Math.PI, { rel: 1e-13, source: 'Gamma(1/2) = sqrt(pi) (closed form)' });
    expectClose(gamma(5), 24, { rel: 1e-13, source: 'Gamma(n) = (n - 1)! (closed form)' });
  });
  it('has F(n) = Gamma(1 - n) cos(n pi / 2): 1 at 0, sqrt(pi)/sqrt(2) at 1/2, pi/2 at 1', () => {
    expectClose(storageFactor(0), 1, { abs: 1e-12, source: "power law E'(w) / E(1/w) (closed form)" });
    expectClose(storageFactor(0.5), Math.sqrt(Math.PI) * Math.cos(Math.PI / 4), {
      rel: 1e-12,
      source: 'Gamma(1/2) cos(pi/4) (closed form)',
    });
    expectClose(storageFactor(1), Math.PI / 2, { rel: 1e-9, source: 'limit n -> 1 (closed form)' });
  });
  it("matches the exact E' of a broad Prony material within 5 % (local power law)", () => {
    const broad: PronyMaterialSpec = {
      ...SPEC,
      prony: { EinfMPa: 1, terms: Array.from({ length: 16 }, (_, i) => ({ tauS: 10 ** (i - 6), EMPa: 200 * 10 ** (-0.1 * i) })) },
    };
    const exact = resolveMaterial(broad);
    for (const f of [0.01, 1, 100]) {
      const w = 2 * Math.PI * f;
      const t = 1 / w;
      const n =
        -(Math.log(pronyModulusMPa(broad.prony, t * 1.02)) - Math.log(pronyModulusMPa(broad.prony, t / 1.02))) / (2 * Math.log(1.02));
      const rule = pronyModulusMPa(broad.prony, t) * storageFactor(n);
      expectClose(rule, storageModulusMPa(exact, f, 160 + K), {
        rel: 0.05,
        source: "exact E'(w) of a Prony series (closed form); local power law, Schapery and Park 1999 (from memory)",
      });
    }
  });
  it('recovers Tg, beta and E23 from a synthetic DMA sweep', () => {
    const truth = compileMaterial({ ...getFamily('PC').params, Tg_C: 150, Tg_low_C: null, Tg_high_C: null, beta: 0.3, E23_MPa: 2300 });
    const T = Array.from({ length: 50 }, (_, i) => 30 + i * 3.5 + K);
    const fit = fitDma('PC', { temperaturesK: T, storageMPa: T.map((x) => storageModulusMPa(truth, 1, x)), rows: [] }, { frequencyHz: 1 });
    expect(fit.quality).toBe('good');
    expectClose(fit.params.Tg_C, 150, { abs: 0.2, source: 'synthetic round trip (exact data)' });
    expectClose(fit.params.beta, 0.3, { abs: 0.005, source: 'synthetic round trip (exact data)' });
    expectClose(fit.params.E23_MPa ?? NaN, 2300, { rel: 0.005, source: 'synthetic round trip (exact data)' });
  });
  it('refuses a non-positive frequency and a parameter the sweep cannot see', () => {
    const T = Array.from({ length: 10 }, (_, i) => 300 + i);
    const sweep = { temperaturesK: T, storageMPa: T.map(() => 2000), rows: [] };
    expect(() => fitDma('PC', sweep, { frequencyHz: 0 })).toThrow(/frequency/);
    expect(() => fitDma('PC', sweep, { frequencyHz: 1, free: ['flowDecades'] })).toThrow(/flowDecades cannot be fitted to this sweep/);
  });
});
