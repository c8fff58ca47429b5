/**
 * Fillers and the composite modulus (src/material/filler.ts), the filled grade text (grade.ts) and the filler
 * fields of the parameter record: closed forms, datasheet densities, and round trips.
 */
import { describe, expect, it } from 'vitest';
import {
  buildComposite,
  compileMaterial,
  compositeModulusMPa,
  DATASHEET_TIME_S,
  familyInput,
  FILLERS,
  getFamily,
  getGrade,
  halpinTsai,
  hillBounds,
  InputError,
  materialFromRecord,
  modulusMPa,
  orientationMoments,
  ParameterError,
  paramsFromBlockRows,
  paramsFromRecord,
  paramsToRecord,
  resolveMaterial,
  T23_K,
  UnknownFamilyError,
  volumeFraction,
  type MaterialParams,
} from '../src/index.js';
import { paramsBlock } from '../functions/core/block.js';
import { expectClose } from './expect.js';

const HT = 'Halpin and Kardos, Polym. Eng. Sci. 16 (1976) 344: the Halpin-Tsai equation';

describe('Halpin-Tsai', () => {
  it('gives the Reuss bound at zeta = 0 and tends to the Voigt bound as zeta grows', () => {
    // Halpin and Kardos 1976: zeta = 0 is the series (Reuss) and zeta -> infinity the parallel (Voigt) rule.
    const Ef = 70000;
    const Em = 3000;
    const phi = 0.6;
    expectClose(halpinTsai(Ef, Em, 0, phi), 1 / (phi / Ef + (1 - phi) / Em), { rel: 1e-12, source: `${HT}, zeta = 0 (series)` });
    expectClose(halpinTsai(Ef, Em, 1e9, phi), phi * Ef + (1 - phi) * Em, { rel: 1e-6, source: `${HT}, zeta -> infinity (parallel)` });
  });

  it('matches a hand calculation with zeta = 2 (transverse modulus of round fibres)', () => {
    // Ef = 70 GPa, Em = 3 GPa, phi = 0.6: eta = 67 / 76 = 0.881579; E / Em = (1 + 2 eta phi) / (1 - eta phi)
    // = 2.057895 / 0.471053 = 4.36872, so E = 13.106 GPa (closed form evaluated by hand).
    expectClose(halpinTsai(70000, 3000, 2, 0.6), 13106.2, { rel: 1e-4, source: `${HT}, evaluated by hand` });
  });

  it('is the matrix at zero filler and the filler at full filler', () => {
    expectClose(halpinTsai(72000, 2500, 40, 0), 2500, { rel: 1e-15, source: `${HT}: phi = 0` });
    expectClose(halpinTsai(72000, 2500, 40, 1), 72000, { rel: 1e-12, source: `${HT}: phi = 1` });
  });
});

describe('orientation', () => {
  it('has the fourth moments of aligned, random-in-plane and transverse distributions', () => {
    // <cos^4> = 3/8, <sin^2 cos^2> = 1/8 for a uniform planar distribution (closed form).
    expect(orientationMoments(1)).toEqual({ c4: 1, s2c2: 0, s4: 0 });
    expect(orientationMoments(0.5)).toEqual({ c4: 3 / 8, s2c2: 1 / 8, s4: 3 / 8 });
    expect(orientationMoments(0)).toEqual({ c4: 0, s2c2: 0, s4: 1 });
    for (const a of [0, 0.2, 0.5, 0.75, 1]) {
      const m = orientationMoments(a);
      // <(cos^2 + sin^2)^2> = 1 and <cos^2> = a11 (closed form of the mixture).
      expectClose(m.c4 + 2 * m.s2c2 + m.s4, 1, { abs: 1e-15, source: 'closed form: <(cos^2 + sin^2)^2> = 1' });
      expectClose(m.c4 + m.s2c2, a, { abs: 1e-15, source: 'closed form: a11 = <cos^2> = <cos^4> + <sin^2 cos^2>' });
    }
  });

  it('gives the aligned ply E11 at a11 = 1 and E22 at a11 = 0 (laminate analogy reduces to the ply)', () => {
    const along = buildComposite('GF', 30, 1140, 25, 1);
    const across = buildComposite('GF', 30, 1140, 25, 0);
    const Em = 3000;
    expectClose(compositeModulusMPa(along, Em), halpinTsai(72000, Em, 50, along.phi), { rel: 1e-12, source: `${HT}: E11, zeta = 2 l/d` });
    expectClose(compositeModulusMPa(across, Em), halpinTsai(72000, Em, 2, across.phi), { rel: 1e-12, source: `${HT}: E22, zeta = 2` });
  });

  it('is stiffer along flow than across it, with random in between', () => {
    const Em = 3000;
    const E = (a: number): number => compositeModulusMPa(buildComposite('GF', 30, 1140, 25, a), Em);
    expect(E(0.75)).toBeGreaterThan(E(0.5));
    expect(E(0.5)).toBeGreaterThan(E(0.25));
  });
});

describe('mass to volume fraction', () => {
  const DENSITY = 'common practice, from memory: typical datasheet density (ISO 1183) of the filled grade';
  // The grade's density from the filler and matrix densities: 1 / (w / rho_f + (1 - w) / rho_m).
  const density = (id: string): number => {
    const p = getGrade(id).params;
    const f = FILLERS[p.filler as keyof typeof FILLERS];
    const w = p.fillerMass_pct / 100;
    const phi = volumeFraction(p.fillerMass_pct, f.density_kgm3, p.density_kgm3 ?? NaN);
    expectClose(phi * f.density_kgm3 + (1 - phi) * (p.density_kgm3 ?? NaN), 1 / (w / f.density_kgm3 + (1 - w) / (p.density_kgm3 ?? NaN)), {
      rel: 1e-12,
      source: 'closed form: the volume-weighted density equals the mass-weighted specific volume inverted',
    });
    return phi * f.density_kgm3 + (1 - phi) * (p.density_kgm3 ?? NaN);
  };
  it.each([
    ['PA66-dry-GF30', 1370],
    ['PBT-GF30', 1530],
    ['PP-GF30', 1130],
    ['PEEK-CF30', 1410],
    ['PP-TD20', 1050],
  ])('puts %s at its datasheet density %i kg/m3 within 2 percent', (id, rho) => {
    expectClose(density(id), rho, { rel: 0.02, source: DENSITY });
  });

  it('puts 30 % glass by mass in PA66 at about 17 % by volume', () => {
    expectClose(volumeFraction(30, 2550, 1140), 0.161, { rel: 0.01, source: 'closed form: (0.3 / 2550) / (0.3 / 2550 + 0.7 / 1140)' });
  });
});

describe('filled materials in the model', () => {
  it('is the matrix at zero filler at every entry point', () => {
    const base = getFamily('PBT').params;
    const zero = compileMaterial({ ...base, filler: 'GF', fillerMass_pct: 0 });
    const m = compileMaterial(base);
    for (const [t, T] of [
      [10, T23_K],
      [3.6e6, 373],
      [1, 480],
    ] as const) {
      expect(modulusMPa(zero, t, T)).toBe(modulusMPa(m, t, T));
    }
  });

  it('keeps the matrix anchored at its own E23_MPa and lies between the Hill bounds', () => {
    const f = getGrade('PA66-dry-GF30');
    const m = compileMaterial(f.params);
    const matrix = compileMaterial(getFamily('PA66-dry').params);
    const Em = modulusMPa(matrix, DATASHEET_TIME_S, T23_K);
    expectClose(Em, 3100, { rel: 1e-9, source: 'families.ts: PA66-dry E23 (the anchor is the matrix datasheet modulus)' });
    const E = modulusMPa(m, DATASHEET_TIME_S, T23_K);
    const c = m.composite;
    if (!c) throw new Error('no composite');
    const b = hillBounds(c, Em);
    expect(E).toBeGreaterThan(b.reuss);
    expect(E).toBeLessThan(b.voigt);
  });
});

describe('grade text', () => {
  it('accepts <family>-<code><mass %> in any case and gives a canonical id and name', () => {
    const g = getGrade(' pbt-gf30 ');
    expect(g.params.id).toBe('PBT-GF30');
    expect(g.params.name).toBe('poly(butylene terephthalate), 30 % glass fibre');
    expect(g.params.filler).toBe('GF');
    expect(g.params.fillerMass_pct).toBe(30);
    expect(getGrade('PA66-dry-GF30').params.id).toBe('PA66-dry-GF30');
    expect(getGrade('pp-td20')).toBe(getGrade('PP-TD20'));
    expect(getGrade('PC')).toBe(getFamily('PC'));
  });

  it('refuses an unsupported code with the supported list, and a mass percent outside the code range', () => {
    expect(() => getGrade('PA66-dry-XF30')).toThrow(
      /"XF".*supported: GF \(glass fibre\), CF \(carbon fibre\), GB \(glass beads\), MD \(mineral powder\), TD \(talc powder\)/,
    );
    expect(() => getGrade('PBT-GF70')).toThrow(ParameterError);
    expect(() => getGrade('PBT-GF70')).toThrow(/70 % of GF .* outside 5 to 60 %/);
    expect(() => getGrade('PBT-GF3')).toThrow(/outside 5 to 60 %/);
  });

  it('suggests filled grades on close bases for an unknown base', () => {
    try {
      getGrade('PA66-cnd-GF30');
      throw new Error('accepted');
    } catch (e) {
      expect(e).toBeInstanceOf(UnknownFamilyError);
      expect((e as UnknownFamilyError).suggestions).toContain('PA66-dry-GF30');
    }
  });

  it('goes through the input layer, naming the argument', () => {
    expect(familyInput.parse('PEEK-CF30', 'material').params.id).toBe('PEEK-CF30');
    expect(() => familyInput.parse('PEEK-ZZ30', 'material')).toThrow(InputError);
    expect(() => familyInput.parse('PEEK-ZZ30', 'material')).toThrow(/^material: .*supported: GF/);
    expect(() => familyInput.parse('PEEK-CF90', 'material')).toThrow(/^material: 90 % of CF/);
    expect(resolveMaterial('PC-GF10').composite?.code).toBe('GF');
  });
});

describe('filler fields of the parameter record', () => {
  const filled = (): MaterialParams => ({ ...getGrade('PA66-dry-GF30').params, fillerAspect: 30, fillerAlign: 0.25 });

  it('round-trips through paramsToRecord, the worksheet block and JSON', () => {
    const p = filled();
    const back = paramsFromRecord(paramsToRecord(p));
    expect(back).toEqual(p);
    const block = paramsBlock(p)
      .slice(1)
      .map((r) => [r[0], r[1]]);
    // The block leaves fields the kind does not use (Mc_kgmol here) empty; they come back at their minimum.
    expect({ ...paramsFromBlockRows(block), Mc_kgmol: p.Mc_kgmol }).toEqual(p);
    expect(materialFromRecord(JSON.parse(JSON.stringify({ params: paramsToRecord(p) })), '--params')).toEqual(p);
    expect(modulusMPa(compileMaterial(back), 10, 300)).toBe(modulusMPa(compileMaterial(p), 10, 300));
  });

  it('reads a block written before fillers existed as unfilled', () => {
    const p = getFamily('PC').params;
    const rec = paramsToRecord(p);
    for (const k of ['filler', 'fillerMass_pct', 'fillerAspect', 'fillerAlign', 'density_kgm3']) delete rec[k];
    const back = paramsFromRecord(rec);
    expect(back.filler).toBe('none');
    expect(back.fillerMass_pct).toBe(0);
    expect(modulusMPa(compileMaterial(back), 3600, 350)).toBe(modulusMPa(compileMaterial(p), 3600, 350));
  });

  it('accepts a lower-case code and refuses others, a mass without a code, and a filled record without density', () => {
    expect(paramsFromRecord({ ...paramsToRecord(filled()), filler: 'gf' }).filler).toBe('GF');
    expect(() => paramsFromRecord({ ...paramsToRecord(filled()), filler: 'kevlar' })).toThrow(
      /filler.*must be none or one of the ISO 1043-2 codes GF/,
    );
    expect(() => compileMaterial({ ...getFamily('PC').params, fillerMass_pct: 20 })).toThrow(/fillerMass_pct: 20 % needs a filler code/);
    expect(() => compileMaterial({ ...filled(), density_kgm3: null })).toThrow(/density_kgm3: is required for a filled material/);
    expect(() => compileMaterial({ ...filled(), fillerMass_pct: 65 })).toThrow(/above the 60 % supported for GF/);
  });

  it('uses the transverse orientation when given: lower than along flow', () => {
    const along = modulusMPa(compileMaterial(getGrade('PA66-dry-GF30').params), DATASHEET_TIME_S, T23_K);
    const across = modulusMPa(compileMaterial(filled()), DATASHEET_TIME_S, T23_K);
    expect(across).toBeLessThan(0.8 * along);
  });
});
