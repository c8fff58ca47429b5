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
import { DUTY, EQTIME } from '../functions/dutycycle.js';
import { main } from '../cli/main.js';

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

describe('histories stay inside the model range (issue 11)', () => {
  const pbt = compileMaterial(getFamily('PBT').params);
  const H = 3600;
  const YEAR = 31557600;
  it('a cycle count that makes the history last beyond 100 years is refused, naming cycles (1e7 h is 1141 years)', () => {
    expect(() => modulusAfterHistory(pbt, [{ TK: 343.15, dtS: H }], 1e7, 343.15)).toThrow(
      /^cycles: the history lasts 1140 years \(cycles x the sum of the durations\), outside the model's range of 1 ms to 100 years/,
    );
    expect(() => equivalentTimeS(pbt, [{ TK: 343.15, dtS: 101 * YEAR }])).toThrow(/^durations: the history lasts 101 years/);
    expect(() => equivalentTimeS(pbt, [{ TK: 343.15, dtS: H }], undefined, 2e7)).toThrow(
      /^cycles: must be a number of repeats from 1 to 10000000/,
    );
  });
  it('a tiny or fractional cycle count is refused: never the glassy modulus above the 23 degC one', () => {
    // 1e-300 cycles of 1 h is 3.6e-297 s: the model would read the unrelaxed glass, above the datasheet 23 degC modulus.
    expect(() => modulusAfterHistory(pbt, [{ TK: 343.15, dtS: H }], 1e-300)).toThrow(/^cycles: must be a number of repeats from 1/);
    expect(() => modulusAfterHistory(pbt, [{ TK: 343.15, dtS: H }], 0.5)).toThrow(/^cycles:/);
    // At one cycle and more the answer is the constant-temperature modulus at the total time (identity), below E23.
    const one = modulusAfterHistory(pbt, [{ TK: 296.15, dtS: H }], 1).modulusMPa;
    expectClose(one, modulusMPa(pbt, H, 296.15), { rel: 1e-12, source: 'constant history identity' });
    expect(one).toBeLessThanOrEqual(getFamily('PBT').params.E23_MPa ?? 0);
  });
  it('the WLF singularity check of MODULUS applies to every segment and names temperatures and the segment', () => {
    const p = { ...getFamily('PC').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null };
    const wlf = compileMaterial(p);
    const segs = [
      { TK: 150 + 273.15, dtS: H },
      { TK: 50 + 273.15, dtS: H },
    ];
    expect(() => modulusAfterHistory(wlf, segs)).toThrow(/^temperatures: segment 2: 50.00 degC is at or below the WLF singularity/);
    expect(() => equivalentTimeS(wlf, segs, 150 + 273.15)).toThrow(/^temperatures: segment 2: .* WLF singularity/);
    expect(() => equivalentTimeS(wlf, [segs[0]!], 50 + 273.15)).toThrow(/^ref_temperature: 50.00 degC is at or below the WLF singularity/);
  });
  it('a cold reference that stretches the equivalent time beyond 100 years says so and suggests the hottest segment', () => {
    const segs = [
      { TK: 120 + 273.15, dtS: 8 * H },
      { TK: 23 + 273.15, dtS: 16 * H },
    ];
    expect(() => equivalentTimeS(pbt, segs, -40 + 273.15, 3650)).toThrow(
      /^ref_temperature: the equivalent time at -40 degC is .* far beyond the model's range of 1 ms to 100 years: the reference is too cold for this history; use its hottest segment, 120 degC \(the default\)/,
    );
    // The default reference is the hottest segment, where the equivalent time never exceeds the real duration.
    const teq = equivalentTimeS(pbt, segs, undefined, 3650);
    expect(teq).toBeLessThanOrEqual(3650 * 24 * H);
    expectClose(teq, equivalentTimeS(pbt, segs, 120 + 273.15, 3650), { rel: 0, source: 'default reference = hottest segment (README)' });
  });
  it('fifteen years of hourly logger data (131,490 segments) with the default reference: no stack overflow, linear in repeats', () => {
    // One day of hourly temperatures, 20 to 70 degC, repeated for 15 Julian years: 5478.75 days, 131,490 hours.
    const day = Array.from({ length: 24 }, (_, h) => ({ TK: 273.15 + 45 - 25 * Math.cos((2 * Math.PI * h) / 24), dtS: H }));
    const hours = 131_490;
    const logger = Array.from({ length: hours }, (_, i) => day[i % 24]!);
    // 5478 whole days and the first 18 hours of one more.
    const days = Math.floor(hours / 24);
    const rest = day.slice(0, hours - days * 24);
    const hot = 70 + 273.15;
    const teq = equivalentTimeS(pbt, logger);
    const expected = days * equivalentTimeS(pbt, day, hot) + equivalentTimeS(pbt, rest, hot);
    expectClose(teq, expected, { rel: 1e-9, source: `${SIMPLE}; additive over segments, linear in repetitions` });
    const after = modulusAfterHistory(pbt, logger);
    // The same history as one segment per temperature of the day, each held for its whole share of the 15 years.
    const lumped = day.map((s, h) => ({ TK: s.TK, dtS: (days + (h < rest.length ? 1 : 0)) * H }));
    expectClose(after.modulusMPa, modulusAfterHistory(pbt, lumped).modulusMPa, {
      rel: 1e-9,
      source: 'additivity of both clocks over segments (history.ts)',
    });
  });
});

describe('fifteen years of hourly data through the worksheet wrappers and the CLI (no call-stack overflow)', () => {
  const hours = 131_490;
  const temps = Array.from({ length: hours }, (_, i) => [45 - 25 * Math.cos((2 * Math.PI * (i % 24)) / 24)]);
  const durs = Array.from({ length: hours }, () => [1]);
  const pbt = compileMaterial(getFamily('PBT').params);
  const segs = temps.map(([T]) => ({ TK: (T ?? 0) + 273.15, dtS: 3600 }));
  // A generous timeout only guards against a hang on a loaded machine; nothing here is timed.
  it('EQTIME and DUTY answer with the default reference, as the engine does', { timeout: 60_000 }, () => {
    expectClose(EQTIME.invoke('PBT', temps, durs) as number, equivalentTimeS(pbt, segs) / 3600, {
      rel: 1e-12,
      source: 'engine equivalentTimeS',
    });
    expectClose(DUTY.invoke('PBT', temps, durs) as number, modulusAfterHistory(pbt, segs).modulusMPa, {
      rel: 1e-12,
      source: 'engine modulusAfterHistory',
    });
  });
  it('resin-derate eqtime takes the same history as --cycle text', { timeout: 60_000 }, () => {
    let out = '';
    let err = '';
    const cycle = temps.map(([T]) => `${T}:1`).join(',');
    return main(
      ['eqtime', '--family', 'PBT', '--cycle', cycle, '--json'],
      { write: (x: string) => (out += x) },
      { write: (x: string) => (err += x) },
    ).then((code) => {
      expect(err).toBe('');
      expect(code).toBe(0);
      const j = JSON.parse(out) as { equivalent_time_h: number };
      expectClose(j.equivalent_time_h, equivalentTimeS(pbt, segs) / 3600, { rel: 1e-9, source: 'engine equivalentTimeS' });
    });
  });
});
