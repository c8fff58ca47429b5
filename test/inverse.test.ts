/**
 * Inverse answers over the whole model range (issue 11, wrong answers): MAXTEMP of a crosslinked
 * network looks at the whole range, not one end; MAXTIME's statuses hold; the apparent Tg stays inside
 * the model's range or says it is outside.
 */
import { describe, expect, it } from 'vitest';
import {
  apparentTg,
  blankParams,
  compileMaterial,
  FAMILIES,
  getFamily,
  kelvinToC,
  maxTemperatureK,
  maxTimeS,
  modulusMPa,
  resolveMaterial,
  shiftLog10,
  TEMP_SEARCH_K,
  TIME_SEARCH_S,
  type InverseAnswer,
  type Material,
} from '../src/index.js';
import { expectClose } from './expect.js';

const C = 273.15;
const H = 3600;
const ROUND_TRIP = 'inverse pair: MODULUS at the answer equals the requirement (definition of the answer)';
const NETWORK = 'entropic rise of a network, E = 3 rho R T / Mc (Flory, Principles of Polymer Chemistry, 1953; Treloar 1975)';

/** Checks a MAXTEMP answer against the modulus on a 2 K grid over the whole range: the statuses must hold. */
function checkTemperatureAnswer(m: Material, req: number, tS: number, a: InverseAnswer, label: string): void {
  const [lo, hi] = TEMP_SEARCH_K;
  for (const x of [a.value, ...(a.below ?? [])]) {
    if (x !== null && x > lo + 1e-6 && x < hi - 1e-6) {
      expectClose(modulusMPa(m, tS, x), req, { rel: 1e-6, source: `${ROUND_TRIP}; ${label}` });
    }
  }
  for (let T = lo; T <= hi; T += 2) {
    const E = modulusMPa(m, tS, T);
    const inside = a.below !== null && T > a.below[0] + 1e-6 && T < a.below[1] - 1e-6;
    const outside = a.below === null || T < a.below[0] - 1e-6 || T > a.below[1] + 1e-6;
    if (inside) expect(E, `${label}: E(${kelvinToC(T)} degC) must be below ${req} MPa`).toBeLessThan(req * (1 + 1e-9));
    if (outside) expect(E, `${label}: E(${kelvinToC(T)} degC) must be at least ${req} MPa`).toBeGreaterThanOrEqual(req * (1 - 1e-9));
  }
  if (a.status === 'found') expect(a.below?.[1]).toBe(hi);
  if (a.status === 'below-between') expect(a.below?.[1]).toBeLessThan(hi);
}

describe('MAXTEMP of crosslinked networks (modulus rises with T above the glass transition)', () => {
  const networks = FAMILIES.filter((f) => f.params.kind === 'crosslinked');
  it('covers every bundled crosslinked family', () => {
    expect(networks.map((f) => f.params.id).sort()).toEqual(['EP', 'EPDM', 'NR', 'VMQ']);
  });
  for (const f of networks) {
    it(`${f.params.id}: every status holds on a 2 K grid from -150 to 500 degC`, () => {
      const m = compileMaterial(f.params);
      for (const tS of [1, H, 1000 * H, 10 * 8766 * H]) {
        const E23 = modulusMPa(m, tS, 23 + C);
        for (const req of [0.5, 2, 5, E23 * 1.2, E23 * 0.8, 30, 500, 1e4]) {
          const a = maxTemperatureK(m, req, tS);
          checkTemperatureAnswer(m, req, tS, a, `${f.params.id} ${req} MPa ${tS} s`);
        }
      }
    });
  }
  it('EPDM, 5 MPa, 1000 h: says where the modulus is below the requirement (23 degC is inside), not "not limiting"', () => {
    const m = resolveMaterial('EPDM');
    const a = maxTemperatureK(m, 5, 1000 * H);
    expect(modulusMPa(m, 1000 * H, 23 + C)).toBeLessThan(5);
    expect(a.status).toBe('below-between');
    const [from, to] = a.below ?? [NaN, NaN];
    expect(from).toBeLessThan(23 + C);
    expect(to).toBeGreaterThan(23 + C);
    // Above `to` the network's 3 rho R T / Mc alone exceeds 5 MPa.
    expectClose(modulusMPa(m, 1000 * H, to), 5, { rel: 1e-6, source: `${ROUND_TRIP}; ${NETWORK}` });
  });
  it('a network whose modulus never reaches the requirement says below-throughout', () => {
    const a = maxTemperatureK(resolveMaterial('VMQ'), 5000, H);
    expect(a.status).toBe('below-throughout');
    expect(a.value).toBeNull();
    expect(a.below).toEqual(TEMP_SEARCH_K);
  });
  it('a network below the requirement at the cold end, above it when hot, gives the interval with no cold limit', () => {
    // Tg at the bottom of the range and 100 years: fully relaxed at -150 degC, so E = 3 rho R T / Mc throughout.
    // An ideal network (creepN 0): its rubbery modulus is 3 rho R T / Mc at every time.
    const p = { ...blankParams('cold-net', 'crosslinked'), Tg_C: -150, Eg_MPa: 2000, density_kgm3: 1000, Mc_kgmol: 1, creepN: 0 };
    const m = compileMaterial(p);
    const t = 100 * 8766 * H;
    const Er = (TK: number): number => (3 * 1000 * 8.314462618 * TK) / 1 / 1e6;
    const req = Er(300 + C);
    const a = maxTemperatureK(m, req, t);
    expect(a.status).toBe('below-between');
    expect(a.value).toBeNull();
    expectClose(a.below?.[1] ?? NaN, 300 + C, { rel: 1e-6, source: NETWORK });
  });
});

describe('MAXTIME over every kind', () => {
  it('statuses hold against the modulus at 1 ms and 100 years, answers round-trip', () => {
    const [tLo, tHi] = TIME_SEARCH_S;
    for (const f of FAMILIES) {
      const m = compileMaterial(f.params);
      for (const T of [-40, 23, 80, 150]) {
        const TK = T + C;
        for (const req of [1, 5, 50, 500, 2000]) {
          const a = maxTimeS(m, req, TK);
          const label = `${f.params.id} ${req} MPa ${T} degC`;
          if (a.status === 'found') {
            expectClose(modulusMPa(m, a.value ?? NaN, TK), req, { rel: 1e-6, source: `${ROUND_TRIP}; ${label}` });
            expect(a.below).toEqual([a.value, tHi]);
          } else if (a.status === 'above-throughout') {
            expect(modulusMPa(m, tHi, TK), label).toBeGreaterThanOrEqual(req * (1 - 1e-9));
          } else {
            expect(a.status).toBe('below-throughout');
            expect(modulusMPa(m, tLo, TK), label).toBeLessThan(req);
          }
        }
      }
    }
  });
});

describe('apparent Tg inside the model range or an explicit status', () => {
  const TG = 'definition: a_T(T) = t / tauTg at the apparent Tg (model.ts), WLF 1955 / Arrhenius';
  it('bundled families at everyday time scales are found, with a_T matching', () => {
    for (const f of FAMILIES) {
      const m = compileMaterial(f.params);
      for (const t of [1, H, 1000 * H]) {
        const a = apparentTg(m, t);
        if (a.status !== 'found') continue;
        const T = a.valueK ?? NaN;
        expect(T).toBeGreaterThanOrEqual(TEMP_SEARCH_K[0]);
        expect(T).toBeLessThanOrEqual(TEMP_SEARCH_K[1]);
        expectClose(shiftLog10(m.shift, T), Math.log10(t / m.tauTg), { abs: 1e-6, source: TG });
      }
    }
  });
  it('an edited block with Tg at the top of its range and a 1 ms time scale is above the range, not thousands of degC', () => {
    const p = {
      ...getFamily('PEEK').params,
      Tg_C: 400,
      Tm_C: 450,
      C1: 10,
      C2_K: 300,
      tauTg_s: 1e6,
      Tg_low_C: null,
      Tg_high_C: null,
      Tm_low_C: null,
      Tm_high_C: null,
    };
    const m = compileMaterial(p);
    const a = apparentTg(m, 1e-3);
    expect(a.lawK ?? 0).toBeGreaterThan(TEMP_SEARCH_K[1]);
    expect(a.status).toBe('above-range');
    expect(a.valueK).toBeNull();
  });
  it('an edited block with Tg at the bottom of its range and 100 years is below the range', () => {
    const p = { ...getFamily('VMQ').params, Tg_C: -150, Tg_low_C: null, Tg_high_C: null };
    const a = apparentTg(compileMaterial(p), 100 * 8766 * H);
    expect(a.status).toBe('below-range');
    expect(a.valueK).toBeNull();
  });
  it('a pure WLF law that cannot reach so short a time says above the range', () => {
    const p = { ...getFamily('PS').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 3000, E23_low_MPa: null, E23_high_MPa: null };
    const m = compileMaterial(p);
    // WLF tends to -C1 as T rises: log10(t / tauTg) <= -C1 is never reached.
    const t = m.tauTg * 10 ** (-m.shift.C1 - 1);
    const a = apparentTg(m, Math.max(t, 1e-300));
    expect(a.lawK).toBeNull();
    expect(a.status).toBe('above-range');
  });
});
