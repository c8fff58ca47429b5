import { describe, expect, it } from 'vitest';
import {
  complianceAt,
  compileMaterial,
  creepComplianceAtTemperature,
  creepModulusMPa,
  creepModulusPowerLawMPa,
  FAMILIES,
  getFamily,
  KELVIN_OFFSET,
  localSlope,
  modulusMPa,
  resolveMaterial,
  type PronyMaterialSpec,
} from '../src/index.js';
import { expectClose } from './expect.js';
import { graded } from './quadrature.js';

const K = KELVIN_OFFSET;
const IDENTITY = 'convolution identity of linear viscoelasticity, integral_0^t E(s) D(t-s) ds = t (closed form)';

describe('apparent creep modulus of the four-region model', () => {
  const cases: [string, number, number][] = [
    ['PC', 140, 3600],
    ['PC', 150, 3600],
    ['PBT', 80, 3.6e6],
    ['PA66-cond', 60, 1e5],
    ['EPDM', 23, 3600],
  ];
  it.each(cases)('%s at %s degC after %s s satisfies the convolution identity', (id, T, t) => {
    const m = resolveMaterial(id);
    const TK = T + K;
    const d = creepComplianceAtTemperature(m, t, TK);
    const f = (s: number): number => modulusMPa(m, Math.max(s, 1e-300), TK) * complianceAt(d, t - s);
    const integral = graded(f, 0, t / 2, 'start') + graded(f, t / 2, t, 'end');
    expectClose(integral, t, { rel: 0.02, source: IDENTITY });
  });
  it.each(cases)('%s at %s degC after %s s creeps no faster than it relaxes (E <= 1/D)', (id, T, t) => {
    const m = resolveMaterial(id);
    // E(t) D(t) <= 1 (closed-form bound); 1e-3 allows for the accuracy of the fitted series.
    expect(creepModulusMPa(m, t, T + K)).toBeGreaterThanOrEqual(modulusMPa(m, t, T + K) * (1 - 1e-3));
  });
  it('matches the local power law where the curve is flat (PC at 23 degC, 1000 h)', () => {
    const m = resolveMaterial('PC');
    const a = creepModulusMPa(m, 3.6e6, 23 + K);
    const b = creepModulusPowerLawMPa(m, 3.6e6, 23 + K);
    expectClose(a, b, { rel: 1e-3, source: 'Schapery and Park 1999 local power law (from memory); routes agree where n <= 0.1' });
    expect(localSlope(m, 3.6e6, 23 + K)).toBeLessThan(0.1);
  });
  it('shows the lag of creep behind relaxation after the glass transition (PC at 150 degC, 1 min)', () => {
    const m = resolveMaterial('PC');
    // 1/D well above E_r: the compliance still reflects the slower part of the spectrum.
    expect(creepModulusMPa(m, 60, 150 + K) / modulusMPa(m, 60, 150 + K)).toBeGreaterThan(3);
  });
  it('is exact for a Prony material (single Maxwell element, D = (1 + t/tau)/E0)', () => {
    const spec: PronyMaterialSpec = {
      id: 'maxwell',
      name: 'one Maxwell element',
      referenceC: 100,
      prony: { EinfMPa: 0, terms: [{ EMPa: 1000, tauS: 50 }] },
      shiftLaw: 'arrhenius',
      TgC: null,
      C1: null,
      C2K: null,
      EakJmol: 100,
    };
    const m = resolveMaterial(spec);
    for (const t of [1, 50, 500]) {
      expectClose(creepModulusMPa(m, t, 100 + K), 1000 / (1 + t / 50), { rel: 1e-10, source: 'single Maxwell element (closed form)' });
    }
  });
  it('refuses a non-positive time', () => {
    const m = compileMaterial(getFamily('PC').params);
    expect(() => creepModulusMPa(m, 0, 300)).toThrow(/time/);
  });
});

describe('creep modulus over the whole model range (issue 11)', () => {
  const BOUND =
    'E(t) D(t) <= 1 for a linear viscoelastic solid (Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 3; Tschoegl, The Phenomenological Theory of Linear Viscoelastic Behavior, 1989)';
  it('answers where the material has flowed long ago (PC at 500 degC after 100 years) instead of "a Prony fit needs 3 points"', () => {
    const m = resolveMaterial('PC');
    const t = 100 * 31557600;
    const Ec = creepModulusMPa(m, t, 500 + K);
    expect(Number.isFinite(Ec)).toBe(true);
    expect(Ec).toBeGreaterThan(0);
    expect(Ec).toBeGreaterThanOrEqual(modulusMPa(m, t, 500 + K));
    // A melt: far below anything a part could carry.
    expect(Ec).toBeLessThan(1e-3);
  });
  it(`never below the relaxation modulus and never rising with time, for every family from -100 to 500 degC (${BOUND})`, () => {
    for (const f of FAMILIES) {
      const m = compileMaterial(f.params);
      for (const T of [-100, -40, 23, 80, 150, 260, 500]) {
        let prev = Infinity;
        for (let lt = -3; lt <= 9.5; lt += 0.5) {
          const t = 10 ** lt;
          const Ec = creepModulusMPa(m, t, T + K);
          const label = `${f.params.id} ${T} degC ${t} s`;
          expect(Number.isFinite(Ec), label).toBe(true);
          // 1/(1/E) may differ from E in the last bit.
          expect(Ec, `${label}: 1/D >= E`).toBeGreaterThanOrEqual(modulusMPa(m, t, T + K) * (1 - 1e-15));
          expect(Ec, `${label}: non-increasing in t`).toBeLessThanOrEqual(prev);
          prev = Ec;
        }
      }
    }
  });
});
