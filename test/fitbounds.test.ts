/**
 * Fits and Prony tables stay inside the model's bounds (issue 11): a Prony table's shift constants obey
 * the bounds a parameter block has (stiffness never rises with temperature), a fit that ends on a search
 * bound says so, the default reference is never below Tg, test data outside the model's temperature
 * range are refused, huge Prony records are refused clearly, and a Prony material evaluated beyond its
 * data says so with a band of non-zero width.
 */
import { describe, expect, it } from 'vitest';
import {
  bandEstimate,
  compileMaterial,
  fitCurves,
  fitShiftLaw,
  getFamily,
  InputError,
  KELVIN_OFFSET,
  MAX_PRONY_TERMS,
  modulusMPa,
  outsideSpanDecades,
  ParameterError,
  parseCsv,
  pronyFromRecord,
  pronyFromTable,
  pronySpanS,
  pronyToRecord,
  pronyToTable,
  readCurveTable,
  resolveMaterial,
  shiftCurves,
  TEMP_SEARCH_K,
  wlfLog10,
  type Curve,
  type CurveShift,
  type PronyMaterialSpec,
} from '../src/index.js';
import { expectClose } from './expect.js';
import { fourTermProny } from './support/prony.js';

const K = KELVIN_OFFSET;
const MONOTONE =
  'a shift factor that falls with temperature (WLF with C1, C2 > 0: Williams, Landel, Ferry 1955; Arrhenius with Ea > 0): a relaxation modulus never rises with T';

const SPEC = fourTermProny('bounds');

function fieldOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof ParameterError) return e.field;
    if (e instanceof InputError) return e.argument;
    throw e;
  }
  return '(no error)';
}

describe('Prony tables obey the shift-constant bounds of parameter blocks', () => {
  const bad: [Partial<PronyMaterialSpec>, string][] = [
    [{ shiftLaw: 'arrhenius', EakJmol: -100 }, 'Ea_kJmol'],
    [{ shiftLaw: 'arrhenius', EakJmol: 0 }, 'Ea_kJmol'],
    [{ EakJmol: 5 }, 'Ea_kJmol'],
    [{ TgC: 1000 }, 'Tg_C'],
    [{ C1: -5 }, 'C1'],
    [{ C1: 100 }, 'C1'],
    [{ shiftLaw: 'wlf', C2K: 0 }, 'C2_K'],
    [{ C2K: 1000 }, 'C2_K'],
    [{ referenceC: 900 }, 'reference_C'],
  ];
  it.each(bad)('refuses %o, naming %s, from a worksheet table and from a --params JSON record', (change, field) => {
    const spec = { ...SPEC, ...change };
    expect(fieldOf(() => pronyFromTable(pronyToTable(spec)))).toBe(field);
    expect(fieldOf(() => pronyFromRecord(pronyToRecord(spec) as unknown as Record<string, unknown>))).toBe(field);
  });
  it(`every accepted table gives a modulus that never rises with temperature (${MONOTONE})`, () => {
    const laws: Partial<PronyMaterialSpec>[] = [
      {},
      { shiftLaw: 'wlf', TgC: null, EakJmol: null, C1: 0.5, C2K: 500 },
      { shiftLaw: 'wlf', TgC: null, EakJmol: null, C1: 60, C2K: 5, referenceC: 160 },
      { shiftLaw: 'arrhenius', TgC: null, C1: null, C2K: null, EakJmol: 20 },
      { shiftLaw: 'arrhenius', TgC: null, C1: null, C2K: null, EakJmol: 2000 },
      { TgC: -150, referenceC: -100, C1: 60, C2K: 500 },
      { TgC: 400, referenceC: 500, C1: 0.5, C2K: 150, EakJmol: 20 },
    ];
    for (const change of laws) {
      const m = resolveMaterial(pronyFromTable(pronyToTable({ ...SPEC, ...change })));
      for (const t of [1e-3, 1, 3600, 3.6e6, 3e9]) {
        let prev = Infinity;
        for (let T = TEMP_SEARCH_K[0]; T <= TEMP_SEARCH_K[1]; T += 5) {
          let E: number;
          try {
            E = modulusMPa(m, t, T);
          } catch (e) {
            // A pure WLF law is undefined at and below reference - C2 + 1 K: an error, never a number.
            expect(m.shift.law).toBe('wlf');
            expect(e).toBeInstanceOf(InputError);
            continue;
          }
          expect(E, `${JSON.stringify(change)} at ${T - K} degC, ${t} s`).toBeLessThanOrEqual(prev * (1 + 1e-12));
          prev = E;
        }
      }
    }
  });
  it(`a record of 125,000 terms is refused with a clear message (no call-stack overflow); ${MAX_PRONY_TERMS} are fine`, () => {
    const big = {
      ...pronyToRecord(SPEC),
      terms: Array.from({ length: 125_000 }, (_, i) => ({ tau_s: 10 ** (i / 5000 - 3), E_MPa: 0.01 })),
    };
    expect(() => pronyFromRecord(big as unknown as Record<string, unknown>)).toThrow(
      /^parameter tau_s: the series has 125000 terms; at most 1000 are accepted/,
    );
    const ok = {
      ...SPEC,
      prony: { EinfMPa: 1, terms: Array.from({ length: MAX_PRONY_TERMS }, (_, i) => ({ tauS: 10 ** (i / 50 - 3), EMPa: 1 })) },
    };
    const m = resolveMaterial(ok);
    expectClose(modulusMPa(m, 1e-30, 160 + K), 1 + MAX_PRONY_TERMS, { rel: 1e-9, source: 'E(0) = E_inf + sum E_i (Prony series)' });
  });
});

describe('a Prony material beyond the reduced times of its data', () => {
  // Reference: the band's constants are set here (band.ts PRONY_*); the central value is MODULUS itself (same engine).
  it('inside its span the band is the shift uncertainty and no note; far outside it widens and says by how much', () => {
    const m = resolveMaterial(SPEC);
    const span = pronySpanS(m);
    expect(span).not.toBeNull();
    const inside = bandEstimate(m, 3600, 160 + K);
    expect(inside.outsideDataDecades).toBe(0);
    expect(inside.lowMPa).toBeLessThan(inside.highMPa);
    // 23 degC is far below the 160 degC reference: the reduced time is decades shorter than the shortest term.
    const cold = bandEstimate(m, 3600, 23 + K);
    expect(outsideSpanDecades(m, 3600, 23 + K)).toBeGreaterThan(3);
    expect(cold.outsideDataDecades).toBe(outsideSpanDecades(m, 3600, 23 + K));
    expect(cold.lowMPa).toBeLessThan(cold.centralMPa);
    expect(cold.highMPa).toBeGreaterThan(cold.centralMPa);
    expect(cold.centralMPa).toBe(modulusMPa(m, 3600, 23 + K));
  });
  it('a four-region family has no span and never a note', () => {
    const m = resolveMaterial('PC');
    expect(pronySpanS(m)).toBeNull();
    expect(bandEstimate(m, 3600, 23 + K).outsideDataDecades).toBe(0);
  });
});

// Thermorheologically simple truth for synthetic curves: PC without slow creep, WLF C1 15, C2 60 K at Tg.
const TRUTH = { ...getFamily('PC').params, creepN: 0, C1: 15, C2_K: 60 };
function curves(tempsC: readonly number[]): Curve[] {
  const m = compileMaterial(TRUTH);
  return tempsC.map((c) => {
    const t = Array.from({ length: 40 }, (_, i) => 10 ** ((i * 4) / 39));
    return { temperatureK: c + K, timesS: t, moduliMPa: t.map((x) => modulusMPa(m, x, c + K)), rows: t.map((_, i) => i + 2) };
  });
}

describe('master-curve fits stay consistent with the model', () => {
  // Reference: WLF is referred to a temperature at or above Tg (Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 11, from memory).
  it('the default reference is at or above Tg when some curve is, so the fit never refuses its own choice', () => {
    const set = { kind: 'relaxation' as const, curves: curves([127, 132, 137, 142, 147, 152, 157]) };
    const TgK = 147 + K;
    // The median of all seven (142 degC) is below Tg; the median of those at or above it is 152 degC.
    expect(shiftCurves(set).referenceK).toBe(142 + K);
    expect(shiftCurves(set, undefined, TgK).referenceK).toBe(152 + K);
    const fit = fitCurves(set, { TgK });
    expect(fit.referenceK).toBeGreaterThanOrEqual(TgK);
    expect(fit.shiftLaw.law).toBe('hybrid');
    expect(() => resolveMaterial(fit.material)).not.toThrow();
  });
  // Reference: shifts made by the WLF closed form (Williams, Landel, Ferry 1955) with C1 beyond the search bound.
  it('a WLF fit that ends on its search bound carries a note, as calibrate and DMAFIT do', () => {
    // Shifts made by WLF with C1 = 100 (beyond the 60 bound) at a 150 degC reference.
    const ref = 150 + K;
    const shifts: CurveShift[] = [150, 160, 170, 180, 190].map((c) => ({
      temperatureK: c + K,
      log10aT: wlfLog10(c + K, ref, 100, 80),
      overlapPoints: 10,
      rmsLog10: 0,
      againstK: null,
    }));
    const law = fitShiftLaw(shifts, ref, null);
    expectClose(law.C1 ?? NaN, 60, { rel: 1e-9, source: 'search bound of C1 (shift.ts WLF_REF_C1_RANGE, set here)' });
    expect(law.notes.join(' ')).toMatch(/C1 ended on its search bound \(60\)/);
  });
  it('an Arrhenius energy beyond the bounds of a parameter block ends on the bound with a note', () => {
    const ref = 100 + K;
    // Ea = 5 kJ/mol, below the 20 kJ/mol a parameter record accepts.
    const shifts: CurveShift[] = [60, 70, 80, 90, 100].map((c) => ({
      temperatureK: c + K,
      log10aT: ((5000 / (8.314462618 * Math.LN10)) * (1 / (c + K) - 1 / ref)) as number,
      overlapPoints: 10,
      rmsLog10: 0,
      againstK: null,
    }));
    const law = fitShiftLaw(shifts, ref, 147 + K);
    expect(law.EakJmol).toBe(20);
    expect(law.notes.join(' ')).toMatch(/Ea ended on its bound \(20 kJ\/mol; the shifts alone give 5 kJ\/mol\)/);
  });
  it('refuses a Tg outside the bounds a parameter block has, naming tg', () => {
    const set = { kind: 'relaxation' as const, curves: curves([150, 155, 160]) };
    expect(fieldOf(() => fitCurves(set, { TgK: 450 + K }))).toBe('tg');
  });
});

describe('test data outside the model range or in another notation', () => {
  const row = (T: number | string): string => `${T},1,1000\n${T},10,900\n${T},100,800\n${T},1000,700\n${T},10000,600\n`;
  // Reference: the model's range, -150 to 500 degC (units.ts MODEL_TEMPERATURE_K, set here).
  it('refuses curve temperatures outside -150 to 500 degC, naming the row', () => {
    expect(() => readCurveTable(parseCsv(`temperature_C,time_s,modulus_MPa\n${row(900)}`))).toThrow(
      /row 2, temperature_C: 900 degC is outside the model's range -150 to 500 degC/,
    );
    expect(() => readCurveTable(parseCsv(`temperature_K,time_s,modulus_MPa\n${row(80)}`))).toThrow(/outside the model's range/);
  });
  // Reference: common practice, a decimal comma (ISO 80000-1 allows either sign, from memory) is ambiguous in a comma-separated file.
  it('says a decimal comma is a comma, not another unit; refuses hexadecimal cells', () => {
    expect(() =>
      readCurveTable(
        parseCsv(
          `temperature_C;time_s;modulus_MPa\n${row('"80,5"')
            .replace(/,/g, ';')
            .replace(/"80;5"/g, '80,5')}`,
        ),
      ),
    ).toThrow(/row 2, temperature_C: '80,5': a comma in a number is ambiguous/);
    expect(() => readCurveTable(parseCsv(`temperature_C,time_s,modulus_MPa\n${row('0x50')}`))).toThrow(
      /row 2, temperature_C: '0x50' is not a decimal number/,
    );
  });
  it('reads header units with case-sensitive prefixes: modulus_mPa is millipascal, modulus_mpa is refused', () => {
    const mpa = readCurveTable(parseCsv(`temperature_C,time_s,modulus_mPa\n${row(80)}`));
    expectClose(mpa.curves[0]?.moduliMPa[0] ?? NaN, 1e-6, { rel: 1e-12, source: 'SI Brochure 9th ed. 2019, 3.1: m is milli' });
    expect(() => readCurveTable(parseCsv(`temperature_C,time_s,modulus_mpa\n${row(80)}`))).toThrow(
      /is ambiguous: unit prefixes are case-sensitive/,
    );
  });
});
