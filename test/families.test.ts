import { describe, expect, it } from 'vitest';
import {
  compileMaterial,
  FAMILIES,
  getFamily,
  gordonTaylorTgC,
  modulusMPa,
  NUMERIC_FIELDS,
  suggestFamilies,
  UnknownFamilyError,
  WATER_TG_K,
  wetTgC,
  DATASHEET_TIME_S,
  T23_K,
} from '../src/index.js';

/**
 * Typical ranges in degC from Brandrup, Immergut, Grulke (eds.), Polymer Handbook, 4th ed. 1999, as listed in the
 * project reference sheet (from memory, not checked entry by entry against the book).
 */
const HANDBOOK: Record<string, { Tg?: [number, number]; Tm?: [number, number] }> = {
  'PE-HD': { Tg: [-120, -80], Tm: [130, 137] },
  'PE-LD': { Tm: [105, 115] },
  PP: { Tg: [-20, 0], Tm: [160, 168] },
  PS: { Tg: [95, 105] },
  PMMA: { Tg: [100, 120] },
  PC: { Tg: [145, 150] },
  'PVC-U': { Tg: [75, 85] },
  ABS: { Tg: [100, 110] },
  'PA6-dry': { Tg: [50, 60], Tm: [220, 225] },
  'PA6-cond': { Tg: [0, 20], Tm: [220, 225] },
  'PA66-dry': { Tg: [50, 70], Tm: [255, 265] },
  'PA66-cond': { Tg: [10, 30], Tm: [255, 265] },
  POM: { Tg: [-80, -60], Tm: [162, 168] },
  'POM-H': { Tm: [175, 178] },
  PET: { Tg: [70, 80], Tm: [250, 260] },
  PBT: { Tg: [40, 60], Tm: [220, 225] },
  PPS: { Tg: [85, 95], Tm: [280, 285] },
  PEEK: { Tg: [143, 145], Tm: [335, 343] },
  PSU: { Tg: [185, 190] },
  PESU: { Tg: [220, 225] },
  PEI: { Tg: [215, 217] },
  PTFE: { Tm: [327, 327] },
  PVDF: { Tg: [-40, -35], Tm: [165, 178] },
  NR: { Tg: [-72, -65] },
  EPDM: { Tg: [-55, -45] },
  EP: { Tg: [50, 250] },
};

describe('bundled family table', () => {
  it('holds at least 20 families of all three kinds, with the required ids', () => {
    expect(FAMILIES.length).toBeGreaterThanOrEqual(20);
    for (const kind of ['amorphous', 'semicrystalline', 'crosslinked']) expect(FAMILIES.some((f) => f.params.kind === kind)).toBe(true);
    const ids = FAMILIES.map((f) => f.params.id);
    for (const id of [
      'PE-HD',
      'PE-LD',
      'PP',
      'PS',
      'PMMA',
      'PC',
      'PVC-U',
      'ABS',
      'PA6-dry',
      'PA6-cond',
      'PA66-dry',
      'PA66-cond',
      'POM',
      'PET',
      'PBT',
      'PPS',
      'PEEK',
      'PSU',
      'PEI',
      'PTFE',
      'PVDF',
    ]) {
      expect(ids).toContain(id);
    }
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('gives every number it uses a source label', () => {
    for (const f of FAMILIES) {
      for (const spec of NUMERIC_FIELDS) {
        if (!spec.kinds.includes(f.params.kind) || f.params[spec.key] === null) continue;
        const src = f.sources[spec.key];
        expect(src, `${f.params.id}.${spec.key} has no source`).toBeTruthy();
        expect(src).toMatch(/from memory|common practice|set here|Handbook|\d{4}|derived/);
      }
    }
  });

  it('compiles every family', () => {
    for (const f of FAMILIES) expect(() => compileMaterial(f.params)).not.toThrow();
  });

  for (const [id, ranges] of Object.entries(HANDBOOK)) {
    it(`${id}: Tg and Tm lie in the handbook ranges (Polymer Handbook 4th ed. 1999, from memory)`, () => {
      const p = getFamily(id).params;
      // A conditioned entry's record holds the dry Tg; the wet Tg follows from its humidity (humidity.ts).
      if (ranges.Tg) {
        expect(wetTgC(p)).toBeGreaterThanOrEqual(ranges.Tg[0]);
        expect(wetTgC(p)).toBeLessThanOrEqual(ranges.Tg[1]);
      }
      if (ranges.Tm) {
        expect(p.Tm_C ?? NaN).toBeGreaterThanOrEqual(ranges.Tm[0]);
        expect(p.Tm_C ?? NaN).toBeLessThanOrEqual(ranges.Tm[1]);
      }
    });
  }

  it('keeps the conditioned polyamides softer and lower in Tg than dry (from memory: 40-60 K lower, modulus / 2-3)', () => {
    for (const base of ['PA6', 'PA66']) {
      const dry = getFamily(`${base}-dry`).params;
      const cond = getFamily(`${base}-cond`).params;
      expect(dry.Tg_C - wetTgC(cond)).toBeGreaterThanOrEqual(35);
      expect(dry.Tg_C - wetTgC(cond)).toBeLessThanOrEqual(60);
      const ratio = modulusMPa(compileMaterial(dry), DATASHEET_TIME_S, T23_K) / modulusMPa(compileMaterial(cond), DATASHEET_TIME_S, T23_K);
      expect(ratio).toBeGreaterThanOrEqual(1.8);
      expect(ratio).toBeLessThanOrEqual(3);
    }
  });

  it('never makes a conditioned polyamide stiffer than the dry one, at any time and temperature (water plasticizes only the amorphous phase)', () => {
    // Common practice, from memory: moisture lowers Tg and softens the amorphous phase; the crystals are untouched.
    for (const base of ['PA6', 'PA66']) {
      const dry = compileMaterial(getFamily(`${base}-dry`).params);
      const cond = compileMaterial(getFamily(`${base}-cond`).params);
      expect(cond.EgMPa / dry.EgMPa).toBeCloseTo(1, 9);
      for (let T = 223.15; T <= 573.15; T += 5) {
        for (let lt = -3; lt <= 10; lt += 0.5) {
          const t = 10 ** lt;
          expect(modulusMPa(cond, t, T), `${base} at ${T - 273.15} degC, ${t} s`).toBeLessThanOrEqual(modulusMPa(dry, t, T) * (1 + 1e-9));
        }
      }
    }
  });

  it('gives the conditioned polyamides their Tg by Gordon-Taylor with water in the amorphous phase', () => {
    // Gordon and Taylor, J. Appl. Chem. 2 (1952) 493: Tg = (w1 Tg1 + k w2 Tg2) / (w1 + k w2); k = 1 is the plain mass average.
    expect(gordonTaylorTgC(55, 0, 0.35)).toBeCloseTo(55, 9);
    // 3 % water of the part, all of it in the amorphous polymer: 0.03 / (0.03 + 0.97 x 0.7) of the amorphous phase.
    const w2 = 0.03 / (0.03 + 0.97 * 0.7);
    expect(gordonTaylorTgC(50, 0.03, 0.3, 1)).toBeCloseTo((1 - w2) * 50 + w2 * (WATER_TG_K - 273.15), 9);
  });

  it('follows the Boyer-Beaman rule, Tg/Tm (K) about 1/2 to 2/3, for dry semi-crystalline entries with an undisputed Tg', () => {
    // IUPAC Gold Book 12806 (Boyer-Beaman); Lee and Knight, Br. Polym. J. 2 (1970): means 0.63 and 0.69, sd 0.11.
    // Excluded: PE, POM and PTFE (Tg disputed) and the conditioned polyamides (water-plasticized Tg).
    const checked = FAMILIES.filter((f) => f.params.kind === 'semicrystalline' && !/^(PE-|POM|PTFE)|cond/.test(f.params.id));
    expect(checked.length).toBeGreaterThanOrEqual(7);
    for (const f of checked) {
      const ratio = (f.params.Tg_C + 273.15) / ((f.params.Tm_C ?? NaN) + 273.15);
      expect(ratio, f.params.id).toBeGreaterThanOrEqual(0.5 - 0.05);
      expect(ratio, f.params.id).toBeLessThanOrEqual(2 / 3 + 0.05);
    }
  });

  it('suggests close symbols for an unknown family', () => {
    expect(() => getFamily('PA67')).toThrow(UnknownFamilyError);
    expect(suggestFamilies('PA66')).toEqual(expect.arrayContaining(['PA66-dry', 'PA66-cond']));
    expect(suggestFamilies('PCC')).toContain('PC');
    expect(() => getFamily('pc')).not.toThrow();
  });
});
