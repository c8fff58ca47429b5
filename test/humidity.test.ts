/**
 * Polyamide moisture as a value (src/material/humidity.ts): the sorption isotherm, the wet Tg, families at
 * a humidity, the parameter-block round trip, the HDT rule, and the equilibrium-time note.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  calibrateDatasheet,
  compileMaterial,
  DATASHEET_TIME_S,
  displayedParams,
  equilibriumDays,
  FAMILIES,
  getFamily,
  gordonTaylorTgC,
  InputError,
  modulusMPa,
  ParameterError,
  paramsFromBlockRows,
  paramsFromRecord,
  paramsToRecord,
  POLYAMIDE_ISOTHERMS,
  simulateHdt,
  splitHumidity,
  T23_K,
  UnknownFamilyError,
  uptakeFraction,
  uptakeTimeS,
  waterContent,
  wetTgC,
  withHumidity,
} from '../src/index.js';
import { paramsBlock } from '../functions/core/block.js';
import { expectClose } from './expect.js';
import { propertyParameters } from './arbitraries.js';

const C = 273.15;
const BASES = ['PA6', 'PA66'] as const;

function isothermOf(base: string): { waterSat: number; sorptionN: number } {
  const iso = POLYAMIDE_ISOTHERMS[base];
  if (!iso) throw new Error(base);
  return iso;
}

describe('sorption isotherm', () => {
  it('passes through the datasheet water contents it is built from (from memory: 50 % RH and saturation at 23 degC)', () => {
    const src = 'humidity.ts: typical datasheet water contents at 23 degC, from memory';
    for (const [base, w50, wsat] of [
      ['PA6', 0.026, 0.095],
      ['PA66', 0.026, 0.085],
    ] as const) {
      const iso = isothermOf(base);
      expectClose(waterContent(50, iso.waterSat, iso.sorptionN), w50, { rel: 1e-12, source: src });
      expectClose(waterContent(100, iso.waterSat, iso.sorptionN), wsat, { rel: 1e-12, source: src });
      expect(waterContent(0, iso.waterSat, iso.sorptionN)).toBe(0);
    }
  });

  it('meets a PA6 sorption measurement: 8.3 % at 95 % RH (Mettler-Toledo application page "TGA sorption", polyamide 6)', () => {
    const iso = isothermOf('PA6');
    expectClose(waterContent(95, iso.waterSat, iso.sorptionN), 0.083, {
      rel: 0.1,
      source: 'Mettler-Toledo TGA sorption page, PA6 at 95 % RH',
    });
  });

  it('errs wet against a PA66 sorption measurement: up to 5 % at 90 % RH (Broudin et al., Eur. Polym. J. 67 (2015) 326, abstract)', () => {
    // More water is the softer, cautious side; within a factor 1.5 of the measurement.
    const w = waterContent(90, isothermOf('PA66').waterSat, isothermOf('PA66').sorptionN);
    expect(w).toBeGreaterThanOrEqual(0.05);
    expect(w).toBeLessThanOrEqual(0.05 * 1.5);
  });

  it('rises with humidity and lowers the wet Tg with it (Gordon-Taylor with water Tg 136 K below any polyamide Tg)', () => {
    for (const base of BASES) {
      const dry = getFamily(`${base}-dry`).params;
      let lastW = -1;
      let lastTg = Infinity;
      for (let rh = 0; rh <= 100; rh += 5) {
        const p = withHumidity(dry, rh);
        const w = waterContent(rh, p.waterSat, p.sorptionN);
        expect(w).toBeGreaterThan(lastW);
        expect(wetTgC(p)).toBeLessThan(lastTg);
        lastW = w;
        lastTg = wetTgC(p);
      }
    }
  });

  it('puts water in the amorphous phase only: more crystals, lower wet Tg at the same water content', () => {
    // Gordon and Taylor, J. Appl. Chem. 2 (1952) 493; crystals take no water (Broudin et al. 2015, abstract).
    expect(gordonTaylorTgC(60, 0.026, 0.5)).toBeLessThan(gordonTaylorTgC(60, 0.026, 0.3));
    expect(gordonTaylorTgC(60, 0.026, 0)).toBeLessThan(60);
  });
});

describe('families at a humidity', () => {
  it('makes PA6-dry / PA66-dry 0 % RH and PA6-cond / PA66-cond 50 % RH through the same code', () => {
    for (const base of BASES) {
      const dry = getFamily(`${base}-dry`).params;
      const cond = getFamily(`${base}-cond`).params;
      expect(dry.humidity_pct).toBe(0);
      expect(cond.humidity_pct).toBe(50);
      expect({ ...cond, id: '', name: '', humidity_pct: 0 }).toEqual({ ...dry, id: '', name: '' });
      for (const [text, same] of [
        [`${base} at 50 % RH`, cond],
        [base, cond],
        [`${base} at 0 % RH`, dry],
      ] as const) {
        const m = compileMaterial(getFamily(text).params);
        const ref = compileMaterial(same);
        for (const T of [0, 23, 60, 120]) {
          expect(modulusMPa(m, 3600, T + C), `${text} at ${T} degC`).toBe(modulusMPa(ref, 3600, T + C));
        }
      }
    }
  });

  it('reads the humidity clause in the forms a person types, and caches the derived family by canonical id', () => {
    expect(splitHumidity('PA66 at 70 % RH')).toEqual({ symbol: 'PA66', rhPct: 70 });
    expect(splitHumidity(' pa6 @ 0%rh ')).toEqual({ symbol: 'pa6', rhPct: 0 });
    expect(splitHumidity('PA66-GF30 at 50 % RH')).toEqual({ symbol: 'PA66-GF30', rhPct: 50 });
    expect(splitHumidity('PA66 AT 12.5% R.H.')).toEqual({ symbol: 'PA66', rhPct: 12.5 });
    expect(splitHumidity('PC')).toEqual({ symbol: 'PC', rhPct: null });
    expect(getFamily('PA66 at 70 % RH')).toBe(getFamily('pa66 @ 70%RH'));
    expect(getFamily('PA66').params.id).toBe('PA66 at 50 % RH');
    expect(getFamily('PA66').note).toMatch(/50 % RH.*cautious default/);
  });

  it('refuses a humidity given twice, on a material that takes up no water, or outside 0 to 100 %', () => {
    const fails = (text: string, pattern: RegExp): void => {
      let err: unknown;
      try {
        getFamily(text);
      } catch (e) {
        err = e;
      }
      expect(err, text).toBeInstanceOf(InputError);
      expect((err as InputError).argument).toBe('family');
      expect((err as Error).message, text).toMatch(pattern);
    };
    fails('PA6-dry @ 0%RH', /either PA6-dry or a humidity/);
    fails('PA66-cond at 70 % RH', /either PA66-cond or a humidity/);
    fails('PC at 50 % RH', /polyamides only \(PA6, PA66\); PC takes up no water/);
    fails('PA66 at 120 % RH', /0 to 100 %/);
    fails('PA66 at seventy', /cannot read the humidity/);
    expect(() => getFamily('PX at 50 % RH')).toThrow(UnknownFamilyError);
    expect(() => withHumidity(getFamily('PC').params, 50)).toThrow(/polyamides only/);
  });

  it('lists a conditioned family with its wet Tg and modulus; its record keeps the dry ones', () => {
    const cond = getFamily('PA66-cond').params;
    const shown = displayedParams(cond);
    expect(shown.Tg_C).toBeCloseTo(wetTgC(cond), 1);
    expect(shown.E23_MPa).toBeCloseTo(modulusMPa(compileMaterial(cond), DATASHEET_TIME_S, T23_K), -1);
    expect(cond.Tg_C).toBe(getFamily('PA66-dry').params.Tg_C);
    for (const f of FAMILIES.filter((x) => x.params.humidity_pct === 0)) expect(displayedParams(f.params)).toBe(f.params);
  });
});

describe('never stiffer wet than dry', () => {
  it('modulus is non-increasing in humidity at every time and temperature (water plasticizes only the amorphous phase)', () => {
    // Common practice, from memory: moisture lowers Tg and softens the amorphous phase; the crystals are untouched.
    fc.assert(
      fc.property(
        fc.constantFrom(...BASES),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: -3, max: 9, noNaN: true }),
        fc.double({ min: -60, max: 300, noNaN: true }),
        (base, a, b, logT, TC) => {
          const dry = getFamily(`${base}-dry`).params;
          const lo = compileMaterial(withHumidity(dry, Math.min(a, b)));
          const hi = compileMaterial(withHumidity(dry, Math.max(a, b)));
          const t = 10 ** logT;
          expect(modulusMPa(hi, t, TC + C)).toBeLessThanOrEqual(modulusMPa(lo, t, TC + C) * (1 + 1e-9));
        },
      ),
      propertyParameters(200),
    );
  });

  it("gives a conditioned grade an HDT at most the dry grade's (the wet bar's preload creep is not stiffness)", () => {
    for (const base of BASES) {
      const dry = compileMaterial(getFamily(`${base}-dry`).params);
      for (const text of [`${base}-cond`, `${base} at 90 % RH`]) {
        const wet = compileMaterial(getFamily(text).params);
        for (const stress of [1.8, 0.45]) {
          const w = simulateHdt(wet, stress).temperatureC ?? Infinity;
          const d = simulateHdt(dry, stress).temperatureC ?? Infinity;
          expect(w, `${text} at ${stress} MPa`).toBeLessThanOrEqual(d);
        }
      }
    }
  });
});

describe('parameter block with a humidity', () => {
  it('round-trips through the PARAMS block and the JSON record, and an edited humidity gives the wet Tg', () => {
    const cond = getFamily('PA66-cond').params;
    const rows = paramsBlock(cond);
    // Fields the kind does not use come back at neutral values; the ones it uses come back exactly.
    const json = paramsFromRecord(JSON.parse(JSON.stringify(paramsToRecord(cond))) as Record<string, unknown>);
    for (const back of [paramsFromBlockRows(rows), json]) {
      for (const key of ['Tg_C', 'E23_MPa', 'crystallinity', 'humidity_pct', 'waterSat', 'sorptionN'] as const)
        expect(back[key]).toBe(cond[key]);
      expect(modulusMPa(compileMaterial(back), 3600, 40 + C)).toBe(modulusMPa(compileMaterial(cond), 3600, 40 + C));
    }
    const edited = rows.map((r) => (r[0] === 'humidity_pct' ? ['humidity_pct', 70, ...r.slice(2)] : r));
    const at70 = compileMaterial(paramsFromBlockRows(edited));
    const ref = compileMaterial(getFamily('PA66 at 70 % RH').params);
    expect(at70.shift.TrefK).toBe(ref.shift.TrefK);
    expect(modulusMPa(at70, 3600, 40 + C)).toBe(modulusMPa(ref, 3600, 40 + C));
  });

  it('keeps a block written before the humidity fields existed: no water, Tg_C as given', () => {
    const old = paramsToRecord(getFamily('PA66-dry').params);
    delete old['humidity_pct'];
    delete old['waterSat'];
    delete old['sorptionN'];
    const p = paramsFromRecord({ ...old, Tg_C: 18, Tg_low_C: null, Tg_high_C: null });
    expect(p.humidity_pct).toBe(0);
    expect(compileMaterial(p).shift.TrefK).toBe(18 + C);
  });

  it('calibrates a conditioned start to conditioned datasheet values by fitting its dry Tg_C and E23_MPa', () => {
    const r = calibrateDatasheet('PA66-cond', { modulus23MPa: 1500, TgK: 15 + C });
    const m = compileMaterial(r.params);
    expect(r.params.humidity_pct).toBe(50);
    expectClose(modulusMPa(m, DATASHEET_TIME_S, T23_K), 1500, {
      rel: 0.05,
      source: 'round trip: the datasheet value given (checks.ts PA66-cond)',
    });
    expectClose(m.shift.TrefK - C, 15, { abs: 2, source: 'round trip: the wet Tg given' });
  });

  it('refuses a humidity on a block that takes up no water, naming the field', () => {
    const pc = { ...getFamily('PC').params, humidity_pct: 50 };
    expect(() => compileMaterial(pc)).toThrow(ParameterError);
    expect(() => compileMaterial(pc)).toThrow(/humidity_pct.*waterSat is 0/);
  });
});

describe('time to equilibrium in a wall (a note, not a model)', () => {
  it('half uptake of a plane sheet at t = 0.049 l^2 / D (Crank, The Mathematics of Diffusion, 2nd ed. 1975, sec. 4.3, from memory)', () => {
    const l = 3e-3;
    const D = 1e-12;
    expectClose(uptakeTimeS(0.5, l, D), (0.049 * l * l) / D, { rel: 0.005, source: 'Crank 1975, half-time of sorption by a plane sheet' });
    expectClose(uptakeFraction((0.049 * l * l) / D, l, D), 0.5, { abs: 0.002, source: 'Crank 1975' });
    // Early times: M_t / M_inf = (4 / l) sqrt(D t / pi) (Crank 1975 eq. 4.20, from memory).
    const t = 1e-3 * ((l * l) / D);
    expectClose(uptakeFraction(t, l, D), (4 / l) * Math.sqrt((D * t) / Math.PI), { rel: 1e-6, source: 'Crank 1975, short-time form' });
  });

  it('says months for a 3 mm wall at 23 degC (D of water in polyamides 1e-13 to 1e-12 m2/s, from memory)', () => {
    expect(equilibriumDays(3)).toBeGreaterThan(30);
    expect(equilibriumDays(3, 1e-12)).toBeGreaterThan(14);
    expect(getFamily('PA6-cond').note).toMatch(/3 mm wall takes some \d+ months/);
  });
});
