import { describe, expect, it } from 'vitest';
import {
  arrheniusLog10,
  GAS_CONSTANT,
  rereferenceWlf,
  shiftLog10,
  temperatureForShiftK,
  wlfLog10,
  WLF_UNIVERSAL_C1,
  WLF_UNIVERSAL_C2_K,
} from '../src/material/shift.js';
import { expectClose } from './expect.js';

const WLF55 = 'Williams, Landel, Ferry, J. Am. Chem. Soc. 77 (1955) 3701';

describe('WLF', () => {
  it('uses the universal constants 17.44 and 51.6 K', () => {
    expect(WLF_UNIVERSAL_C1).toBe(17.44);
    expect(WLF_UNIVERSAL_C2_K).toBe(51.6);
  });
  it('gives log10 aT = -174.4 / 61.6 = -2.831 at Tg + 10 K', () => {
    expectClose(wlfLog10(383.15, 373.15, 17.44, 51.6), -2.831, { abs: 5e-4, source: `${WLF55}; worked value -174.4/61.6 (derived)` });
  });
  it('tends to -C1 far above Tg', () => {
    expectClose(wlfLog10(1e7, 300, 17.44, 51.6), -17.44, { rel: 1e-4, source: `${WLF55}: limit of the equation` });
  });
  it('keeps aT when the reference is moved (C2g = C2 + Tg - T0, C1g = C1 C2 / C2g)', () => {
    const moved = rereferenceWlf(17.44, 51.6, 373.15, 393.15);
    for (const T of [380, 400, 430]) {
      const direct = wlfLog10(T, 373.15, 17.44, 51.6) - wlfLog10(393.15, 373.15, 17.44, 51.6);
      expectClose(wlfLog10(T, 393.15, moved.C1, moved.C2K), direct, {
        abs: 1e-9,
        source: 'WLF change of reference (derived, closed form)',
      });
    }
  });
});

describe('Arrhenius', () => {
  it('uses R = 8.314462618 J/(mol K)', () => {
    expect(GAS_CONSTANT).toBe(8.314462618);
  });
  it('matches (Ea / R ln10)(1/T - 1/Tr) for 100 kJ/mol from 300 K to 310 K', () => {
    const expected = (100000 / (8.314462618 * Math.LN10)) * (1 / 300 - 1 / 310);
    expectClose(arrheniusLog10(300, 310, 100), expected, { rel: 1e-12, source: 'CODATA 2018 R; Arrhenius closed form' });
    expectClose(arrheniusLog10(300, 310, 100), 0.56165, { abs: 2e-5, source: 'hand calculation of the closed form (derived)' });
  });
});

describe('hybrid law', () => {
  const c = { law: 'hybrid' as const, TrefK: 400, C1: 17.44, C2K: 51.6, EakJ: 300 };
  it('is continuous at Tg', () => {
    expect(Math.abs(shiftLog10(c, 400 - 1e-9) - shiftLog10(c, 400 + 1e-9))).toBeLessThan(1e-6);
  });
  it('never reaches the WLF singularity below Tg', () => {
    for (let T = 200; T < 400; T += 7) expect(Number.isFinite(shiftLog10(c, T))).toBe(true);
  });
  it('pure WLF refuses temperatures at the singularity', () => {
    expect(() => shiftLog10({ ...c, law: 'wlf' }, 400 - 51.6)).toThrow(/singularity/);
  });
  it('inverts exactly', () => {
    for (const L of [-10, -2.831, -0.5, 0, 0.7, 5]) {
      const T = temperatureForShiftK(c, L);
      expect(T).not.toBeNull();
      expectClose(shiftLog10(c, T ?? 0), L, { abs: 1e-9, source: 'inverse pair (closed form)' });
    }
    expect(temperatureForShiftK(c, -17.44)).toBeNull();
  });
});
