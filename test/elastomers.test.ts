/**
 * The bundled elastomers (issue 12, step 9): compound-typical moduli that match the Shore A hardness their
 * notes claim, and a small relaxation of the rubbery state instead of none.
 */
import { describe, expect, it } from 'vitest';
import { compileMaterial, FAMILIES, GAS_CONSTANT, getFamily, modulusMPa, type Family } from '../src/index.js';
import { expectClose } from './expect.js';

const C = 273.15;
const H = 3600;

/**
 * Young's modulus (MPa) of a rubber from its Shore A hardness S: A. N. Gent, "On the relation between indentation
 * hardness and Young's modulus", Trans. Inst. Rubber Ind. 34 (1958) 46 (reprinted in Rubber Chem. Technol. 31
 * (1958) 896, as the reference list of Gilbert and Giacomin, J. Test. Eval. 46 (2018) 1995 gives it).
 */
function gentModulusMPa(S: number): number {
  return (0.0981 * (56 + 7.62336 * S)) / (0.137505 * (254 - 2.54 * S));
}

/**
 * Time at which a Shore A reading is taken, s: "the final value of the hardness depends on the depth of the
 * indenter after it has been applied for 15 seconds" (DIN ISO 7619-1, as the Shore durometer article states it).
 */
const SHORE_READING_S = 15;

const ELASTOMERS = ['EPDM', 'NR', 'VMQ'] as const;

function claimedShoreA(f: Family): number {
  const m = /Shore A (\d+)/.exec(f.note);
  if (!m) throw new Error(`${f.params.id}: its note claims no Shore A hardness`);
  return Number(m[1]);
}

describe("Gent's relation between Shore A hardness and Young's modulus", () => {
  it('is the spring force of a type A durometer over its indentation depth (a check of the formula before relying on it)', () => {
    for (const S of [20, 40, 60, 70, 80, 90]) {
      // Numerator: 0.0981 (56 + 7.62336 S) is ten times the type A spring force, 0.55 + 0.075 S newton (ASTM D2240, from memory).
      expectClose((0.0981 * (56 + 7.62336 * S)) / 10, 0.55 + 0.075 * S, {
        rel: 0.003,
        source: 'ASTM D2240 type A spring force (from memory)',
      });
      // Denominator: proportional to the indentation depth, 2.54 mm (0.100 in, the indentor's full travel) at S = 0 and
      // nothing at S = 100 (ASTM D2240; "if the indenter penetrates 2.54 mm (0.100 inch) or more ... the durometer is 0",
      // Shore durometer article).
      expectClose((254 - 2.54 * S) / 100, 2.54 * (1 - S / 100), { rel: 1e-12, source: 'ASTM D2240 indentor travel 0.100 in' });
    }
    // So E = F / (1.37505 mm x depth): the form Gent derived for a rigid truncated cone pressed into an elastic half-space.
    expectClose(gentModulusMPa(70), (0.55 + 0.075 * 70) / (1.37505 * 2.54 * 0.3), {
      rel: 0.003,
      source: 'Gent 1958 rewritten in newtons and millimetres',
    });
  });
});

describe('the bundled elastomers', () => {
  it('covers the crosslinked rubbers; EP, a thermoset, claims no hardness', () => {
    expect(FAMILIES.filter((f) => f.params.kind === 'crosslinked').map((f) => f.params.id)).toEqual(['EP', ...ELASTOMERS]);
    expect(getFamily('EP').note).not.toMatch(/Shore A/);
  });

  for (const id of ELASTOMERS) {
    const f = getFamily(id);
    const m = compileMaterial(f.params);

    it(`${id}: states a compound-typical hardness of Shore A 60 to 80, and its 23 degC modulus matches it within 20 %`, () => {
      expect(f.note).toMatch(/^compound-typical: /);
      const S = claimedShoreA(f);
      expect(S).toBeGreaterThanOrEqual(60);
      expect(S).toBeLessThanOrEqual(80);
      expectClose(modulusMPa(m, SHORE_READING_S, 23 + C), gentModulusMPa(S), {
        rel: 0.2,
        source: `Gent, Trans. Inst. Rubber Ind. 34 (1958) 46: Shore A ${S} claimed in the family note, read after 15 s`,
      });
    });

    it(`${id}: loses a few per cent of stress per decade of time at room temperature, no more`, () => {
      // Gent (ed.), Engineering with Rubber, 3rd ed. 2012, stress relaxation chapter (from memory): filled rubbers relax
      // physically by a few per cent per decade at room temperature; here 1 to 5 % per decade from 1 h to 10 years.
      for (const t of [H, 10 * H, 100 * H, 1000 * H]) {
        const loss = 1 - modulusMPa(m, 10 * t, 23 + C) / modulusMPa(m, t, 23 + C);
        expect(loss, `${id} ${t / H} h`).toBeGreaterThan(0.01);
        expect(loss, `${id} ${t / H} h`).toBeLessThan(0.05);
      }
    });

    it(`${id}: the rubbery state is the network modulus times the bounded power law of the slow-creep clock`, () => {
      // Far above Tg the glass has relaxed: E = (1 + t / tau_c)^-n 3 rho R T / Mc, tau_c = 1 s at 23 degC (model.ts),
      // with E = 3 rho R T / Mc (Flory, Principles of Polymer Chemistry, 1953; Treloar 1975).
      const p = f.params;
      const t = 1000 * H;
      const Er = (3 * (p.density_kgm3 ?? NaN) * GAS_CONSTANT * (23 + C)) / p.Mc_kgmol / 1e6;
      expectClose(modulusMPa(m, t, 23 + C), (1 + t) ** -p.creepN * Er, { rel: 1e-6, source: 'closed form of model.ts' });
    });

    it(`${id}: monotone in time, bounded, continuous, and still stiffening as it warms (entropic, documented)`, () => {
      const times = Array.from({ length: 121 }, (_, i) => 10 ** (-3 + i * 0.1)); // 1 ms to 1e9 s
      let prev = Infinity;
      for (const t of times) {
        const E = modulusMPa(m, t, 23 + C);
        expect(E).toBeLessThanOrEqual(prev);
        expect(E).toBeGreaterThan(0);
        // Continuous: a tenth of a decade moves it by far less than a per cent.
        if (prev !== Infinity) expect(1 - E / prev).toBeLessThan(0.01);
        prev = E;
      }
      expect(modulusMPa(m, 1e-3, -150 + C)).toBeLessThanOrEqual(m.EgMPa);
      // Treloar 1975: the network modulus rises in proportion to T; over 1000 h the relaxation takes only part of it back.
      expect(modulusMPa(m, 1000 * H, 100 + C)).toBeGreaterThan(modulusMPa(m, 1000 * H, 23 + C));
    });
  }
});
