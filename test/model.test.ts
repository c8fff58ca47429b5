import { describe, expect, it } from 'vitest';
import {
  upperBoundMPa,
  apparentTgK,
  bandEstimate,
  blankParams,
  compileMaterial,
  DATASHEET_TIME_S,
  dryRecord,
  evaluateClocks,
  FAMILIES,
  getFamily,
  maxTemperatureK,
  maxTimeS,
  modulusMPa,
  shiftLog10,
  T23_K,
  type MaterialParams,
} from '../src/index.js';
import { expectClose } from './expect.js';

const temps = Array.from({ length: 60 }, (_, i) => 173.15 + i * 8); // -100 to 372 degC
const times = Array.from({ length: 25 }, (_, i) => 10 ** (-2 + i * 0.5)); // 10 ms to 1e10 s

/** An ideal network (creepN 0: no physical relaxation of the rubbery state), for the closed forms of rubber elasticity. */
function rubber(overrides: Partial<MaterialParams> = {}): MaterialParams {
  return {
    ...blankParams('test-rubber', 'crosslinked'),
    Tg_C: -60,
    Eg_MPa: 2000,
    density_kgm3: 1000,
    Mc_kgmol: 5,
    creepN: 0,
    ...overrides,
  };
}

describe('the four-region model over every bundled family', () => {
  for (const f of FAMILIES) {
    const m = compileMaterial(f.params);
    it(`${f.params.id}: finite, positive or zero, bounded by the larger of the glassy and crystal-phase moduli`, () => {
      for (const T of temps) {
        for (const t of times) {
          const E = modulusMPa(m, t, T);
          expect(Number.isFinite(E)).toBe(true);
          expect(E).toBeGreaterThanOrEqual(0);
          expect(E).toBeLessThanOrEqual(upperBoundMPa(m) * (1 + 1e-12));
        }
      }
    });
    it(`${f.params.id}: non-increasing in time at every temperature`, () => {
      for (const T of temps) {
        let prev = Infinity;
        for (const t of times) {
          const E = modulusMPa(m, t, T);
          expect(E).toBeLessThanOrEqual(prev * (1 + 1e-12));
          prev = E;
        }
      }
    });
    it(`${f.params.id}: non-increasing in temperature (except a rubber network's entropic rise)`, () => {
      for (const t of times) {
        let prev = Infinity;
        for (const T of temps) {
          const e = evaluateClocks(m, t, T);
          if (!(m.kind === 'crosslinked' && e.region === 'rubbery')) expect(e.modulusMPa).toBeLessThanOrEqual(prev * (1 + 1e-12));
          prev = e.modulusMPa;
        }
      }
    });
    it(`${f.params.id}: continuous across Tg`, () => {
      // The Tg the clock uses: the wet Tg of a conditioned polyamide.
      const Tg = m.shift.TrefK;
      for (const t of [1, 3600, 3.6e6]) {
        const below = modulusMPa(m, t, Tg - 1e-7);
        const above = modulusMPa(m, t, Tg + 1e-7);
        expect(Math.abs(below - above)).toBeLessThanOrEqual(1e-5 * Math.max(below, 1e-9));
      }
    });
    if (f.params.E23_MPa !== null) {
      it(`${f.params.id}: reproduces its datasheet modulus at 23 degC over the datasheet loading time`, () => {
        // A conditioned polyamide's E23_MPa is its dry grade's (humidity.ts): the anchor holds at 0 % RH.
        const anchored = compileMaterial(dryRecord(f.params));
        expectClose(modulusMPa(anchored, DATASHEET_TIME_S, T23_K), f.params.E23_MPa ?? NaN, {
          rel: 1e-9,
          source: 'anchor definition (model.ts)',
        });
      });
    }
  }
});

describe('time-temperature superposition', () => {
  it('is exact for an amorphous material without slow creep: E(t, T) = E(t / aT, Tg)', () => {
    // Without slow creep and without the glassy modulus's own fall with temperature (vertical factor).
    const p = { ...getFamily('PS').params, creepN: 0, glassySlope_perK: 0 };
    const m = compileMaterial(p);
    const Tg = p.Tg_C + 273.15;
    for (const T of [300, 350, Tg, 380, 400]) {
      for (const t of [1, 100, 1e4, 1e6]) {
        const reduced = t / 10 ** shiftLog10(m.shift, T);
        expectClose(modulusMPa(m, t, T), modulusMPa(m, reduced, Tg), {
          rel: 1e-9,
          abs: 1e-300,
          source: 'thermorheological simplicity (Ferry 1980, ch. 11), identity',
        });
      }
    }
  });
});

describe('rubber elasticity', () => {
  it('gives E = 3 rho R T / Mc = 1.49 MPa for Mc 5 kg/mol, rho 1000 kg/m3, 298 K', () => {
    const m = compileMaterial(rubber());
    const E = modulusMPa(m, 3.6e6, 298);
    expectClose(E, (3 * 1000 * 8.314462618 * 298) / 5 / 1e6, {
      rel: 1e-6,
      source: 'affine network, Flory 1953; Treloar 1975 (closed form)',
    });
    expectClose(E, 1.5, { rel: 0.01, source: 'worked value E ~ 1.5 MPa (G 0.50 MPa), REFERENCES.md (derived)' });
  });
  it('rises in proportion to absolute temperature on the plateau (documented entropic rise)', () => {
    const m = compileMaterial(rubber());
    expectClose(modulusMPa(m, 3.6e6, 373.15) / modulusMPa(m, 3.6e6, 298.15), 373.15 / 298.15, {
      rel: 1e-6,
      source: 'E proportional to T (Treloar 1975)',
    });
  });
});

describe('regions', () => {
  it('walks an amorphous polymer from glassy through transition and plateau to flow', () => {
    const m = compileMaterial(getFamily('PS').params);
    const regions = [20, 100, 110, 125, 160].map((T) => evaluateClocks(m, 10, T + 273.15).region);
    expect(regions[0]).toBe('glassy');
    expect(regions).toContain('transition');
    expect(regions[regions.length - 1]).toBe('flow');
  });
  it('puts a semi-crystalline polymer on a crystal plateau between Tg and the melting range', () => {
    const pa = compileMaterial(getFamily('PA66-dry').params);
    const mid = evaluateClocks(pa, 3600, 150 + 273.15);
    expect(mid.region).toBe('crystalline');
    // Tobolsky 1960 (from memory): semi-crystalline between Tg and Tm 10^7.5 to 10^9 Pa, far above a rubber plateau.
    expect(mid.modulusMPa).toBeGreaterThan(10 ** 1.5);
    expect(mid.modulusMPa).toBeLessThan(1000);
    expect(evaluateClocks(pa, 3600, 262 + 273.15).region).toBe('melting');
    expect(modulusMPa(pa, 3600, 300 + 273.15)).toBeLessThan(1);
  });
});

describe('band', () => {
  it('orders low <= central <= high and widens with the family ranges', () => {
    for (const f of FAMILIES) {
      const m = compileMaterial(f.params);
      for (const T of [253.15, 296.15, 353.15, 393.15]) {
        const b = bandEstimate(m, 3.6e6, T);
        expect(b.lowMPa).toBeLessThanOrEqual(b.centralMPa);
        expect(b.centralMPa).toBeLessThanOrEqual(b.highMPa);
      }
    }
    const pc = bandEstimate(compileMaterial(getFamily('PC').params), 3600, 296.15);
    expect(pc.highMPa / pc.lowMPa).toBeGreaterThan(1.05);
  });
});

describe('inverse answers', () => {
  it('MAXTEMP round-trips within 1e-6 for every family that reaches the target', () => {
    for (const f of FAMILIES) {
      const m = compileMaterial(f.params);
      const target = 0.3 * modulusMPa(m, 3600, T23_K);
      const a = maxTemperatureK(m, target, 3.6e6);
      if (a.status !== 'found' || a.value === null) continue;
      expectClose(modulusMPa(m, 3.6e6, a.value), target, { rel: 1e-6, source: 'inverse pair (round trip)' });
    }
  });
  it('MAXTIME round-trips within 1e-6', () => {
    const m = compileMaterial(getFamily('PBT').params);
    const a = maxTimeS(m, 1000, 333.15);
    expect(a.status).toBe('found');
    expectClose(modulusMPa(m, a.value ?? NaN, 333.15), 1000, { rel: 1e-6, source: 'inverse pair (round trip)' });
  });
  it('says so explicitly when the target is out of reach', () => {
    const pc = compileMaterial(getFamily('PC').params);
    expect(maxTimeS(pc, 100, 296.15).status).toBe('above-throughout');
    expect(maxTimeS(pc, 5000, 296.15).status).toBe('below-throughout');
    expect(maxTemperatureK(pc, 5000, 3600).status).toBe('below-throughout');
    const epdm = compileMaterial(getFamily('EPDM').params);
    expect(maxTemperatureK(epdm, 1, 3600).status).toBe('above-throughout');
  });
  it('finds the last crossing of a crosslinked rubber despite the entropic rise', () => {
    const ep = compileMaterial(getFamily('EP').params);
    const a = maxTemperatureK(ep, 500, 3600);
    expect(a.status).toBe('found');
    expectClose(modulusMPa(ep, 3600, a.value ?? NaN), 500, { rel: 1e-6, source: 'inverse pair (round trip)' });
  });
  it('apparent Tg equals Tg at the glass-transition time and falls for longer times', () => {
    const pc = compileMaterial(getFamily('PC').params);
    expectClose(apparentTgK(pc, pc.tauTg) ?? NaN, 147 + 273.15, { abs: 1e-9, source: 'definition of Tg at tauTg (model.ts)' });
    expect(apparentTgK(pc, 3.6e6) ?? Infinity).toBeLessThan(147 + 273.15);
    expect(apparentTgK(pc, pc.tauTg / 100) ?? 0).toBeGreaterThan(147 + 273.15);
  });
});

describe('parameter validation names the field', () => {
  const base = getFamily('PA6-dry').params;
  const cases: [Partial<MaterialParams>, RegExp][] = [
    [{ Tg_C: 900 }, /parameter Tg_C: 900 degC is outside/],
    [{ Tm_C: 40 }, /parameter Tm_C: 40 degC must be at least 10 K above Tg_C .* swapped/],
    [{ beta: 0 }, /parameter beta/],
    [{ crystallinity: 0.99 }, /parameter crystallinity/],
    [{ crystalContinuity: 0.2 }, /parameter crystalContinuity: 0.2 must be at least the crystallinity/],
    [{ Eg_MPa: 3000 }, /give exactly one of E23_MPa/],
    [{ E23_MPa: null }, /give exactly one of E23_MPa/],
    [{ C2_K: NaN }, /parameter C2_K: must be a finite number/],
    [{ Tg_low_C: 70 }, /parameter Tg_low_C: 70 must not exceed Tg_C/],
    [{ kind: 'amorphous' }, /parameter Tm_C: is only used for semicrystalline/],
    [{ E23_MPa: 19900, E23_high_MPa: null }, /parameter E23_MPa: 19900 MPa cannot be reached/],
  ];
  for (const [change, message] of cases) {
    it(`rejects ${JSON.stringify(change)}`, () => {
      expect(() => compileMaterial({ ...base, ...change } as MaterialParams)).toThrow(message);
    });
  }
});

describe('glassy modulus falling with temperature below Tg (vertical factor)', () => {
  const DMA =
    'from memory: DMA storage-modulus slopes of unfilled glassy polymers below Tg, about 0.1 to 0.4 % per K, PMMA steeper (beta process)';
  it('loses 0.1 to 0.8 % per K between 23 degC and 30 K below Tg at 10 s, for every amorphous family', () => {
    for (const f of FAMILIES.filter((x) => x.params.kind === 'amorphous')) {
      const m = compileMaterial(f.params);
      const hot = f.params.Tg_C - 30 + 273.15;
      const perK = -Math.log(modulusMPa(m, 10, hot) / modulusMPa(m, 10, T23_K)) / (hot - T23_K);
      expect(perK, `${f.params.id}: ${DMA}`).toBeGreaterThan(0.001);
      expect(perK, `${f.params.id}: ${DMA}`).toBeLessThan(0.008);
    }
  });
  it('makes PMMA fall faster than PC and PSU', () => {
    const slope = (id: string): number => {
      const m = compileMaterial(getFamily(id).params);
      return -Math.log(modulusMPa(m, 10, 343.15) / modulusMPa(m, 10, T23_K)) / 50;
    };
    expect(slope('PMMA'), DMA).toBeGreaterThan(2 * slope('PC'));
    expect(slope('PMMA'), DMA).toBeGreaterThan(2 * slope('PSU'));
  });
  it('is exp(-s dT) on the glassy modulus alone (closed form of the factor, creep and transition off)', () => {
    const p = { ...getFamily('PC').params, creepN: 0, tauTg_s: 1e6 };
    const m = compileMaterial(p);
    const s = p.glassySlope_perK;
    // At 1 ms and 60 K below Tg nothing has relaxed (G and F are 1 to 1e-8), so E is the glassy modulus itself.
    const E = (T: number): number => modulusMPa(m, 1e-3, T);
    expectClose(E(360) / E(300), Math.exp(-s * 60), {
      rel: 1e-7,
      source: 'definition of the vertical factor exp(-s (T - T0)) (Ferry 1980, ch. 11), closed form',
    });
  });
  it('is continuous at Tg and never rises with temperature there', () => {
    for (const id of ['PC', 'PMMA', 'PA66-dry', 'EP']) {
      const m = compileMaterial(getFamily(id).params);
      const Tg = getFamily(id).params.Tg_C + 273.15;
      for (const t of [1e-3, 10, 3.6e6]) {
        const below = modulusMPa(m, t, Tg - 1e-7);
        const above = modulusMPa(m, t, Tg + 1e-7);
        expectClose(above, below, { rel: 1e-5, source: 'continuity of the model at Tg (identity)' });
        // A network's plateau rises with T (entropic, model.ts); the thermoplastics must not.
        if (id !== 'EP') expect(above).toBeLessThanOrEqual(below * (1 + 1e-12));
      }
    }
  });
});

describe('region labels of semi-crystalline families', () => {
  const SRC = 'common practice, from memory: the DSC melting endotherm of a moulded grade begins some 20 to 30 K below its peak';
  it('says crystalline, not melting, 40 K and more below the melting peak (crystals intact)', () => {
    for (const [id, C] of [
      ['POM', 100],
      ['PP', 100],
      ['PE-HD', 80],
      ['PA66-dry', 200],
    ] as const) {
      const m = compileMaterial(getFamily(id).params);
      for (const t of [10, 3600, 3.6e6]) expect(evaluateClocks(m, t, C + 273.15).region, `${id} at ${C} degC: ${SRC}`).toBe('crystalline');
    }
  });
  it('says melting within the melting range below the peak', () => {
    for (const id of ['POM', 'PP', 'PE-HD', 'PA66-dry', 'PEEK']) {
      const p = getFamily(id).params;
      const m = compileMaterial(p);
      expect(evaluateClocks(m, 10, (p.Tm_C ?? 0) - 5 + 273.15).region, `${id}: ${SRC}`).toBe('melting');
    }
  });
});
