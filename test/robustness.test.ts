/**
 * Numerical robustness: parameter records at the edges of every NUMERIC_FIELDS range for each kind,
 * temperatures at the WLF singularity, times from 1 ms to 1000 years, Tg/Tm typos, shifts that over-
 * or underflow. Each case has defined behaviour: a finite answer, an explicit status, or a clear error
 * naming the field or argument. The regression cases at the end pin bugs the property tests found.
 */
import { describe, expect, it } from 'vitest';
import {
  MELT_REMAINING_AT_TM,
  upperBoundMPa,
  apparentTgK,
  bandEstimate,
  blankParams,
  checkTemperatureInDomain,
  compileMaterial,
  deratingRatio,
  deratingTable,
  equivalentTimeS,
  evaluateClocks,
  FAMILIES,
  getFamily,
  KINDS,
  maxTemperatureK,
  maxTimeS,
  MAX_TEMPERATURE_C,
  modulusAfterHistory,
  modulusMPa,
  NUMERIC_FIELDS,
  ParameterError,
  paramsFromRecord,
  parseTemperatureK,
  parseTimeS,
  shiftLog10,
  simulateHdt,
  T23_K,
  temperatureForShiftK,
  type Kind,
  type Material,
  type MaterialParams,
} from '../src/index.js';
import { expectClose } from './expect.js';

const C = 273.15;
const TEMPS_K = Array.from({ length: 33 }, (_, i) => -150 + C + i * 20); // -150 to 490 degC
const TIMES_S = Array.from({ length: 15 }, (_, i) => 10 ** (-3 + i * 0.75)); // 1 ms to ~3e7 s (about 1 year)

/** A central record of each kind with no ranges, so that every edge of one field can be tried on its own. */
function baseRecord(kind: Kind): MaterialParams {
  const id = { amorphous: 'PC', semicrystalline: 'PA66-dry', crosslinked: 'EP' }[kind];
  const p = { ...getFamily(id).params };
  p.Tg_low_C = p.Tg_high_C = p.Tm_low_C = p.Tm_high_C = p.E23_low_MPa = p.E23_high_MPa = null;
  return p;
}

/** Checks a compiled material over the grid: finite, within [0, Eg], non-increasing in time; inverse answers defined. */
function checkMaterial(m: Material, label: string): void {
  for (const T of TEMPS_K) {
    let prev = Infinity;
    for (const t of TIMES_S) {
      let E: number;
      try {
        E = modulusMPa(m, t, T);
      } catch (e) {
        // The one evaluation error: a pure WLF law below Tg - C2 + 1 K, with the message saying so.
        expect(m.shift.law, label).toBe('wlf');
        expect((e as Error).message).toMatch(/^temperature: .* WLF singularity/);
        continue;
      }
      expect(Number.isFinite(E), `${label}: E(${t} s, ${T - C} degC) = ${E}`).toBe(true);
      expect(E).toBeGreaterThanOrEqual(0);
      expect(E).toBeLessThanOrEqual(upperBoundMPa(m) * (1 + 1e-12));
      expect(E, `${label}: non-increasing in time`).toBeLessThanOrEqual(prev * (1 + 1e-12));
      prev = E;
    }
  }
  for (const req of [1, 100, 1000]) {
    for (const t of [1, 3.6e6]) {
      const a = maxTemperatureK(m, req, t);
      expect(['found', 'above-throughout', 'below-throughout', 'below-between'], label).toContain(a.status);
      if (a.value !== null) expect(Number.isFinite(a.value)).toBe(true);
    }
  }
  const h = simulateHdt(m, 1.8);
  if (h.temperatureC !== null) expect(Number.isFinite(h.temperatureC), `${label}: HDT`).toBe(true);
}

/** Fields whose values another field constrains, so that an edge may be refused for a cross-field rule. */
const PARTNERS: Record<string, readonly string[]> = {
  Tg_C: ['Tm_C', 'E23_MPa', 'Eg_MPa'],
  Tm_C: ['Tm_C', 'E23_MPa'],
  crystallinity: ['crystalContinuity', 'E23_MPa'],
  crystalContinuity: ['crystalContinuity'],
};

describe('edges of every numeric field, for each kind', () => {
  for (const kind of KINDS) {
    for (const f of NUMERIC_FIELDS) {
      if (!f.kinds.includes(kind)) continue;
      for (const [edge, value] of [
        ['min', f.min],
        ['max', f.max],
      ] as const) {
        it(`${kind} ${f.key} = ${value} (${edge}): a material that evaluates finitely, or a ParameterError naming the rule`, () => {
          const p: MaterialParams = { ...baseRecord(kind), [f.key]: value };
          // E23 and Eg are alternatives: setting one edge clears the other.
          if (f.key === 'Eg_MPa') p.E23_MPa = null;
          if (f.key === 'E23_MPa') p.Eg_MPa = null;
          // Range fields need their central value on the right side; put it at the edge too.
          if (f.key.endsWith('_low_C') || f.key.endsWith('_high_C') || f.key.endsWith('_low_MPa') || f.key.endsWith('_high_MPa')) {
            const mid = f.key.replace(/_(low|high)/, '') as keyof MaterialParams;
            if (p[mid] === null) (p as unknown as Record<string, number>)[mid] = value;
          }
          let m: Material;
          try {
            m = compileMaterial(p);
          } catch (e) {
            expect(e).toBeInstanceOf(ParameterError);
            const field = (e as ParameterError).field;
            expect([f.key, ...(PARTNERS[f.key] ?? []), 'E23_MPa', 'Eg_MPa'], (e as Error).message).toContain(field);
            expect((e as Error).message).toMatch(/^parameter \w+: .{20,}/);
            return;
          }
          checkMaterial(m, `${kind} ${f.key}=${value}`);
          let b;
          try {
            b = bandEstimate(m, 3600, 353.15);
          } catch (e) {
            // A range edge the model cannot reach is refused when the band is formed, naming that range field.
            expect(e).toBeInstanceOf(ParameterError);
            expect((e as ParameterError).field).toBe(f.key);
            expect((e as Error).message).toMatch(/the band corner .* cannot be evaluated \(parameter E23_MPa: .*\); narrow the range/);
            return;
          }
          expect(b.lowMPa).toBeLessThanOrEqual(b.centralMPa);
          expect(b.centralMPa).toBeLessThanOrEqual(b.highMPa);
        });
      }
      it(`${kind} ${f.key} just outside ${f.min} to ${f.max}: refused, naming the field and its range`, () => {
        const step = (x: number): number => Math.max(Math.abs(x) * 1e-9, 1e-9);
        for (const value of [f.min - step(f.min), f.max + step(f.max)]) {
          const p: MaterialParams = { ...baseRecord(kind), [f.key]: value };
          expect(() => compileMaterial(p)).toThrow(new RegExp(`^parameter ${f.key}: .* is outside ${f.min} to ${f.max}`));
        }
      });
    }
  }
});

describe('every corner of the ranges at once (all fields at min, then all at max, where the kind allows)', () => {
  for (const kind of KINDS) {
    for (const edge of ['min', 'max'] as const) {
      it(`${kind}, every core field at its ${edge}`, () => {
        const p = blankParams(`edge-${edge}`, kind);
        for (const f of NUMERIC_FIELDS) {
          if (f.optional || !f.kinds.includes(kind)) continue;
          (p as unknown as Record<string, number>)[f.key] = f[edge];
        }
        p.Tg_C = edge === 'min' ? -150 : kind === 'semicrystalline' ? 440 : 400;
        if (kind === 'semicrystalline') {
          p.Tm_C = edge === 'min' ? -100 : 450;
          p.crystalContinuity = Math.max(p.crystalContinuity, p.crystallinity);
        }
        p.Eg_MPa = 20000;
        let m: Material;
        try {
          m = compileMaterial(p);
        } catch (e) {
          expect(e).toBeInstanceOf(ParameterError);
          expect((e as Error).message).toMatch(/^parameter \w+: /);
          return;
        }
        checkMaterial(m, `${kind} all-${edge}`);
      });
    }
  }
});

describe('the WLF singularity', () => {
  const pc = getFamily('PC').params;
  const wlf = compileMaterial({ ...pc, shiftLaw: 'wlf', E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null });
  const hybrid = compileMaterial(pc);
  const singular = pc.Tg_C + C - pc.C2_K; // Tg - C2, kelvin

  it('pure WLF: a clear error at and below Tg - C2 + 1 K, naming the temperature and the remedy', () => {
    for (const T of [singular - 10, singular, singular + 0.5, singular + 1]) {
      expect(() => modulusMPa(wlf, 3600, T)).toThrow(
        /^temperature: -?\d+\.\d\d degC is at or below the WLF singularity Tg - C2 \+ 1 K; use the hybrid law/,
      );
    }
  });
  it('pure WLF: finite just above the margin, and log10 aT large but finite there', () => {
    const T = singular + 1 + 1e-9;
    expect(Number.isFinite(modulusMPa(wlf, 3600, T))).toBe(true);
    const L = shiftLog10(wlf.shift, T);
    expectClose(L, (-pc.C1 * (1 + 1e-9 - pc.C2_K)) / (1 + 1e-9), {
      rel: 1e-6,
      source: 'WLF, Williams, Landel, Ferry 1955, at T - Tg = 1 K - C2 (closed form)',
    });
  });
  it('hybrid: finite and non-increasing through the place where WLF would be singular', () => {
    let prev = Infinity;
    for (let T = singular - 5; T <= singular + 5; T += 0.25) {
      const E = modulusMPa(hybrid, 3600, T);
      expect(Number.isFinite(E)).toBe(true);
      expect(E).toBeLessThanOrEqual(prev * (1 + 1e-12));
      prev = E;
    }
  });
  it('pure WLF: MAXTEMP searches only above the singularity; apparent Tg is null where WLF cannot reach', () => {
    const a = maxTemperatureK(wlf, 1500, 3600);
    expect(a.status).toBe('found');
    expectClose(modulusMPa(wlf, 3600, a.value ?? NaN), 1500, { rel: 1e-6, source: 'round trip of the inverse answer' });
    expect(maxTemperatureK(wlf, 19_000, 3600).status).toBe('below-throughout');
    expect(apparentTgK(wlf, 1e-30)).toBeNull();
  });
});

describe('times from 1 ms to 1000 years, for every family', () => {
  const tMin = parseTimeS('1 ms');
  const tMax = parseTimeS('1000 years');
  it('parses the ends of the span', () => {
    expect(tMin).toBe(1e-3);
    expectClose(tMax, 1000 * 365.25 * 86400, { rel: 1e-15, source: 'IAU Julian year, 365.25 d' });
  });
  for (const f of FAMILIES) {
    it(`${f.params.id}: finite and non-increasing from 1 ms to 1000 years at -40, 23, 80 and 150 degC`, () => {
      const m = compileMaterial(f.params);
      for (const Tc of [-40, 23, 80, 150]) {
        let prev = Infinity;
        for (let lt = Math.log10(tMin); lt <= Math.log10(tMax) + 1e-9; lt += 0.25) {
          const E = modulusMPa(m, 10 ** lt, Tc + C);
          expect(Number.isFinite(E)).toBe(true);
          expect(E).toBeLessThanOrEqual(prev * (1 + 1e-12));
          prev = E;
        }
        const a = maxTimeS(m, 0.5 * modulusMPa(m, tMin, Tc + C), Tc + C);
        expect(['found', 'above-throughout']).toContain(a.status);
      }
    });
  }
});

describe('Tg above Tm (a swapped pair typed into a block)', () => {
  it('is refused with a message that suggests the swap, from a record and from loose cells', () => {
    const pa = getFamily('PA66-dry').params;
    const swapped = { ...pa, Tg_C: pa.Tm_C ?? 260, Tm_C: pa.Tg_C, Tg_low_C: null, Tg_high_C: null, Tm_low_C: null, Tm_high_C: null };
    expect(() => compileMaterial(swapped)).toThrow(/^parameter Tm_C: .* must be at least 10 K above Tg_C .*; are Tg and Tm swapped\?/);
    const cells: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(swapped)) cells[k] = v === null ? '' : String(v);
    expect(() => compileMaterial(paramsFromRecord(cells))).toThrow(/are Tg and Tm swapped\?/);
  });
  it('Tm only 10 K above Tg is accepted and evaluates finitely', () => {
    const p = { ...baseRecord('semicrystalline'), Tg_C: 100, Tm_C: 110 };
    checkMaterial(compileMaterial(p), 'Tm = Tg + 10 K');
  });
});

describe('extreme shifts: 10 ** x over- and underflow never give NaN', () => {
  // Pure Arrhenius with Ea 2000 kJ/mol and Tg -150 degC: log10 aT reaches about -714 at 500 degC
  // (Ea / (R ln 10) (1/T - 1/Tg), closed form), so 10 ** log10 aT underflows to 0 and xi = t / 0 = Infinity.
  const p = { ...blankParams('steep', 'amorphous'), shiftLaw: 'arrhenius' as const, Tg_C: -150, Ea_kJmol: 2000, Eg_MPa: 3000 };
  const m = compileMaterial(p);
  it('log10 aT is finite and the modulus is 0 (fully relaxed) rather than NaN at 500 degC; glassy far below Tg', () => {
    const L = shiftLog10(m.shift, 500 + C);
    expectClose(L, ((2000e3 / (8.314462618 * Math.LN10)) * (1 / (500 + C) - 1 / (-150 + C))) as number, {
      rel: 1e-12,
      source: 'Arrhenius closed form, R from CODATA 2018',
    });
    expect(L).toBeLessThan(-323);
    expect(modulusMPa(m, 3600, 500 + C)).toBe(0);
    const cold = evaluateClocks(m, 1e-3, 1);
    expect(Number.isFinite(cold.modulusMPa)).toBe(true);
    expect(cold.region).toBe('glassy');
  });
  it('a history through such temperatures gives a finite modulus; an equivalent time beyond 100 years is a clear error', () => {
    const segs = [
      { TK: 500 + C, dtS: 3600 },
      { TK: -100 + C, dtS: 3600 },
    ];
    expect(Number.isFinite(modulusAfterHistory(m, segs, 1e4, -150 + C).modulusMPa)).toBe(true);
    expect(() => equivalentTimeS(m, segs, -150 + C)).toThrow(
      /^ref_temperature: the equivalent time at -150 degC is beyond 1e308 s, far beyond the model's range .* use its hottest segment, 500 degC/,
    );
    expect(equivalentTimeS(m, segs, 500 + C)).toBeGreaterThan(0);
  });
  it('the temperature parser refuses absurd temperatures instead of passing them to the model', () => {
    expect(parseTemperatureK(MAX_TEMPERATURE_C)).toBe(MAX_TEMPERATURE_C + C);
    expect(() => parseTemperatureK('1e308 K', 'temp')).toThrow(/^temp: '1e308 K' is outside the accepted range \(above 2000 degC/);
    expect(() => parseTemperatureK(1e308)).toThrow(/above 2000 degC/);
    expect(parseTemperatureK('4.2 K')).toBe(4.2);
    expect(() => parseTemperatureK('5e-324 kelvin', 'temp')).toThrow(/^temp: '5e-324 kelvin' is below 1 K, too close to absolute zero/);
    expect(() => parseTemperatureK(-273.149)).toThrow(/below 1 K/);
  });
});

describe('regressions found by the property tests', () => {
  it('a pure-WLF record with E23 and Tg more than C2 above 23 degC is refused as a parameter, not as a temperature', () => {
    const p = { ...getFamily('PC').params, shiftLaw: 'wlf' as const };
    expect(() => compileMaterial(p)).toThrow(
      /^parameter E23_MPa: cannot anchor the 23 degC modulus: the pure WLF law is undefined at 23 degC/,
    );
  });
  it('a semi-crystalline record with Tm below 23 degC melts at Tm: continuous at 23 degC, crystals gone above Tm', () => {
    const p = { ...blankParams('low-Tm', 'semicrystalline'), Tg_C: 0, Tm_C: 10, Eg_MPa: 2000, crystallinity: 0.5 };
    const m = compileMaterial(p);
    const below = evaluateClocks(m, 3600, T23_K - 1e-6);
    const above = evaluateClocks(m, 3600, T23_K + 1e-6);
    expect(Math.abs(below.modulusMPa - above.modulusMPa)).toBeLessThanOrEqual(1e-4 * above.modulusMPa);
    // The melting law (model.ts): 5 % of the crystals left at Tm, then the tail exp(-(T - Tm) / 2 K); 13 K above Tm leaves 0.05 exp(-6.5).
    expectClose(below.crystalRemaining, MELT_REMAINING_AT_TM * Math.exp(-6.5), {
      rel: 1e-5,
      source: 'melting law: 5 % at Tm times the tail exp(-(T - Tm)/2 K), closed form',
    });
  });
  it('a pure-WLF MAXTEMP no longer fails at the -150 degC end of its bracket', () => {
    const p = { ...blankParams('wlf', 'amorphous'), shiftLaw: 'wlf' as const, Tg_C: 100, Eg_MPa: 2500 };
    const m = compileMaterial(p);
    const a = maxTemperatureK(m, 1000, 3600);
    expect(a.status).toBe('found');
    expectClose(modulusMPa(m, 3600, a.value ?? NaN), 1000, { rel: 1e-6, source: 'round trip of the inverse answer' });
  });
  it('band corners that cannot be compiled are reported against the range field', () => {
    const p = { ...getFamily('PC').params, E23_high_MPa: 19_900 };
    const m = compileMaterial(p);
    expect(() => bandEstimate(m, 3600, 300)).toThrow(/^parameter E23_high_MPa: the band corner .*E23_high_MPa = 19900 cannot be evaluated/);
  });
  it('HDT of a material fully relaxed during the preload is the start temperature, not NaN', () => {
    const p = { ...blankParams('melt', 'amorphous'), Tg_C: -150, Eg_MPa: 50, plateau_MPa: 1, flowDecades: 0.5 };
    const r = simulateHdt(compileMaterial(p), 0.45);
    expect(r.temperatureC).toBe(23);
  });
  it('HDT where E stops changing between steps stays finite', () => {
    const p = {
      ...blankParams('flat', 'amorphous'),
      shiftLaw: 'arrhenius' as const,
      Tg_C: 0,
      Eg_MPa: 50,
      plateau_MPa: 1,
      Ea_kJmol: 2000,
      tauTg_s: 1,
      beta: 1,
      flowDecades: 3.457419576792694,
      flowBeta: 0.1,
      creepN: 0,
      creepEa_kJmol: 10,
      C1: 1,
      C2_K: 10,
    };
    const r = simulateHdt(compileMaterial(p), 0.45);
    expect(r.temperatureC === null || Number.isFinite(r.temperatureC)).toBe(true);
  });
  it('apparent Tg is null, not below absolute zero, when WLF C2 exceeds Tg in kelvin', () => {
    const c = { law: 'wlf' as const, TrefK: 123.15, C1: 1, C2K: 300, EakJ: 20 };
    expect(temperatureForShiftK(c, Math.log10(3600))).toBeNull();
  });
  it('a derating ratio to a fully relaxed reference is a clear error, not NaN', () => {
    const p = { ...blankParams('soft', 'amorphous'), Tg_C: -150, Eg_MPa: 50, plateau_MPa: 1, flowDecades: 0.5 };
    expect(() => deratingRatio(compileMaterial(p), 3600, 353.15)).toThrow(
      /^ref_temperature: soft has relaxed to nothing at the reference \(23 degC after 1 h: 0 MPa, a melt\)/,
    );
    // The table still gives the moduli; only the ratio is absent.
    expect(deratingTable([p], [23, 80], 3600)[0]?.cells.map((c) => c.ratio)).toEqual([null, null]);
  });
  it('inverse answers round-trip to 1e-6 where log E falls steeply (C1 / C2 at the edges of their ranges)', () => {
    const p = {
      ...blankParams('steep', 'amorphous'),
      Tg_C: -150,
      Eg_MPa: 50,
      C1: 44.67,
      C2_K: 10,
      beta: 1,
      flowDecades: 0.5,
      flowBeta: 0.69,
    };
    const m = compileMaterial(p);
    const a = maxTemperatureK(m, 1, 1);
    expect(a.status).toBe('found');
    expectClose(modulusMPa(m, 1, a.value ?? NaN), 1, { rel: 1e-6, source: 'round trip of the inverse answer' });
  });
  it('HDT of a pure-WLF record undefined at the 23 degC start is a ParameterError on shiftLaw, not a temperature error', () => {
    const p = { ...getFamily('PC').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null };
    expect(() => simulateHdt(compileMaterial(p), 1.8)).toThrow(
      /^parameter shiftLaw: the pure WLF law is undefined at the 23 degC start of the HDT test/,
    );
  });
  it('a ratio whose 23 degC reference a pure-WLF law cannot reach names ref_temperature', () => {
    const p = { ...getFamily('PC').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null };
    const m = compileMaterial(p);
    expect(() => deratingRatio(m, 3600, 150 + C)).toThrow(/^ref_temperature: .* WLF singularity/);
    expect(() => checkTemperatureInDomain(m, 50 + C, 'service_temp')).toThrow(
      /^service_temp: 50.00 degC is at or below the WLF singularity/,
    );
    expect(checkTemperatureInDomain(m, 150 + C, 'service_temp')).toBe(150 + C);
  });
});
