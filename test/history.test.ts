import { describe, expect, it } from 'vitest';
import {
  compileMaterial,
  equivalentTimeS,
  getFamily,
  modulusAfterHistory,
  modulusMPa,
  parseStrain,
  retainedStressAfterHistoryMPa,
  retainedStressMPa,
  shiftLog10,
} from '../src/index.js';
import { expectClose } from './expect.js';

const pc = compileMaterial(getFamily('PC').params);
const SIMPLE = 'time-temperature superposition, t_eq = sum dt_i aT(Tref)/aT(T_i) (Ferry 1980, ch. 11)';

describe('duty cycles', () => {
  it('equivalent time of a constant history is its duration', () => {
    expectClose(equivalentTimeS(pc, [{ TK: 353.15, dtS: 3600 }], 353.15), 3600, { rel: 1e-12, source: SIMPLE });
  });
  it('sums segments shifted to the reference', () => {
    const seg = [
      { TK: 353.15, dtS: 8 * 3600 },
      { TK: 303.15, dtS: 16 * 3600 },
    ];
    const ref = shiftLog10(pc.shift, 353.15);
    const expected = 8 * 3600 + 16 * 3600 * 10 ** (ref - shiftLog10(pc.shift, 303.15));
    expectClose(equivalentTimeS(pc, seg, 353.15, 1), expected, { rel: 1e-12, source: SIMPLE });
    expectClose(equivalentTimeS(pc, seg, 353.15, 3650), 3650 * expected, { rel: 1e-12, source: `${SIMPLE}; linear in repetitions` });
  });
  it('the modulus after a constant history equals the modulus at that time', () => {
    const after = modulusAfterHistory(pc, [{ TK: 353.15, dtS: 3.6e6 }]);
    expectClose(after.modulusMPa, modulusMPa(pc, 3.6e6, 353.15), { rel: 1e-12, source: 'identity' });
  });
  it('splitting a segment in two changes nothing', () => {
    const whole = modulusAfterHistory(pc, [{ TK: 393.15, dtS: 7200 }]).modulusMPa;
    const split = modulusAfterHistory(pc, [
      { TK: 393.15, dtS: 3600 },
      { TK: 393.15, dtS: 3600 },
    ]).modulusMPa;
    expectClose(split, whole, { rel: 1e-12, source: 'additivity of reduced time' });
  });
  it('rejects empty histories and bad durations, naming the argument', () => {
    expect(() => equivalentTimeS(pc, [], 300)).toThrow(/durations: needs at least one segment/);
    expect(() => equivalentTimeS(pc, [{ TK: 300, dtS: -1 }], 300)).toThrow(/durations: segment 1/);
    expect(() => equivalentTimeS(pc, [{ TK: 300, dtS: 1 }], 300, 0)).toThrow(/cycles/);
  });
});

describe('retained stress at fixed strain', () => {
  it('is E_r(t, T) times the strain', () => {
    const r = retainedStressMPa(pc, 0.005, 3.6e6, 353.15);
    expectClose(r.stressMPa, 0.005 * modulusMPa(pc, 3.6e6, 353.15), {
      rel: 1e-12,
      source: 'sigma = E_r eps0 (definition of the relaxation modulus)',
    });
    expect(r.beyondLinearRange).toBe(false);
    const h = retainedStressAfterHistoryMPa(pc, parseStrain('0.5 %'), [{ TK: 353.15, dtS: 3.6e6 }]);
    expectClose(h.stressMPa, r.stressMPa, { rel: 1e-12, source: 'constant history identity' });
    expect(retainedStressMPa(pc, 0.02, 3600, 300).beyondLinearRange).toBe(true);
  });
  it('rejects strains given as percent numbers or non-positive', () => {
    expect(() => retainedStressMPa(pc, 0.5, 3600, 300)).toThrow(/strain: 0.5 is above 0.1/);
    expect(() => retainedStressMPa(pc, 0, 3600, 300)).toThrow(/strain: must be a positive fraction/);
    expect(() => parseStrain('half')).toThrow(/strain: expected a fraction/);
  });
});
