/**
 * Filled polyamides at a humidity: the grade text joins the filler clause (ISO 1043-1 / 1043-2 style,
 * "PA66-GF30") and the humidity clause ("at 50 % RH"). Water acts only on the matrix (humidity.ts), so a humid
 * filled grade is the dry filled grade with the wet matrix Tg, and never stiffer than it (water plasticizes
 * the amorphous phase of a polyamide: common practice). A bare polyamide base is taken at 50 % RH.
 */
import { describe, expect, it } from 'vitest';
import { getGrade } from '../src/material/grade.js';
import { compileMaterial, modulusMPa } from '../src/material/model.js';
import { KELVIN_OFFSET as C } from '../src/base/units.js';

const H = 3600;

const E = (text: string, tS: number, TK: number): number => modulusMPa(compileMaterial(getGrade(text).params), tS, TK);

describe('filled polyamides at a humidity', () => {
  it.each([
    ['PA66-GF30', 'PA66-GF30 at 50 % RH', 50],
    ['pa66-gf30 @ 70%rh', 'PA66-GF30 at 70 % RH', 70],
    ['PA6-GF30 at 0 % RH', 'PA6-GF30 at 0 % RH', 0],
    ['PA66-cond-GF30', 'PA66-cond-GF30', 50],
  ] as const)('%s reads as %s, %s % RH', (text, id, rh) => {
    const f = getGrade(text);
    expect(f.params.id).toBe(id);
    expect(f.params.humidity_pct).toBe(rh);
    expect(f.params.filler).toBe('GF');
    expect(f.params.fillerMass_pct).toBe(30);
  });

  it('a bare PA66 base is the conditioned one (50 % RH), the same answers as PA66-cond-GF30', () => {
    for (const [t, T] of [
      [10, 23],
      [1000 * H, 80],
      [1000 * H, 120],
    ] as const) {
      expect(E('PA66-GF30', t, T + C)).toBe(E('PA66-cond-GF30', t, T + C));
    }
  });

  it('never stiffer with more water, at any time and temperature (water plasticizes the matrix only)', () => {
    for (const T of [-20, 23, 50, 80, 120, 200]) {
      for (const t of [1, 10, 3600, 1000 * H, 1e5 * H]) {
        const dry = E('PA66-dry-GF30', t, T + C);
        const at50 = E('PA66-GF30 at 50 % RH', t, T + C);
        const at90 = E('PA66-GF30 at 90 % RH', t, T + C);
        expect(at50, `${T} degC, ${t} s`).toBeLessThanOrEqual(dry * (1 + 1e-12));
        expect(at90, `${T} degC, ${t} s`).toBeLessThanOrEqual(at50 * (1 + 1e-12));
      }
    }
  });

  it('stays stiffer than its own matrix at the same humidity (glass fibre, Halpin-Tsai)', () => {
    for (const T of [23, 80, 150]) expect(E('PA66-GF30 at 70 % RH', 10, T + C)).toBeGreaterThan(E('PA66 at 70 % RH', 10, T + C));
  });

  it('refuses moisture given twice and a humidity on a resin that takes up none, naming what to write', () => {
    expect(() => getGrade('PA66-dry-GF30 at 50 % RH')).toThrow(/twice/);
    expect(() => getGrade('PC-GF10 at 50 % RH')).toThrow(/polyamides only/);
    expect(() => getGrade('PA66-GF30 at 150 % RH')).toThrow(/0 to 100 %/);
  });
});
