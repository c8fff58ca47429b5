/**
 * Derating ratios, tables and curves: a reference relaxed to nothing is an error, not 7e69, and every
 * error names the argument it came from (issue 11).
 */
import { describe, expect, it } from 'vitest';
import {
  compileMaterial,
  deratingRatio,
  deratingTable,
  getFamily,
  InputError,
  modulusCurve,
  modulusMPa,
  RELAXED_MPA,
  resolveMaterial,
  SECONDS_PER_YEAR,
} from '../src/index.js';
import { RATIO, MODULUS } from '../functions/modulus.js';
import { CURVE, GRID } from '../functions/tables.js';
import { SheetError } from '../functions/core/cells.js';
import { expectClose } from './expect.js';

const C = 273.15;
const H = 3600;

function argumentOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e.argument;
    throw e;
  }
  throw new Error('no error');
}

describe('RATIO to a reference that has relaxed to nothing', () => {
  it('PA66-cond against 500 degC after 100 years is an error naming ref_time, not 7.3e69', () => {
    const m = resolveMaterial('PA66-cond');
    // The reference is far below 1 kPa: a melt has no stiffness to divide by. After 1 ms at 500 degC its broad
    // amorphous transition (model.ts, crystal-fixed polymers) still holds more than 1 kPa, so the time is named.
    expect(modulusMPa(m, 100 * SECONDS_PER_YEAR, 500 + C)).toBeLessThan(RELAXED_MPA);
    expect(modulusMPa(m, 1e-3, 500 + C)).toBeGreaterThan(RELAXED_MPA);
    expect(() => deratingRatio(m, 1000 * H, 60 + C, 500 + C, 100 * SECONDS_PER_YEAR)).toThrow(
      /^ref_time: PA66-cond has relaxed to nothing at the reference \(500 degC after 876600 h/,
    );
    const cell = RATIO.invoke('PA66-cond', 60, '1000 h', 500, '100 years');
    expect(cell).toBeInstanceOf(SheetError);
    expect((cell as SheetError).code).toBe('#VALUE!');
    expect((cell as SheetError).message).toMatch(/^ref_time: /);
  });
  it('PP against 500 degC after 100 years is an error naming ref_temperature: a melt there already after 1 ms', () => {
    const m = resolveMaterial('PP');
    expect(modulusMPa(m, 1e-3, 500 + C)).toBeLessThan(RELAXED_MPA);
    expect(argumentOf(() => deratingRatio(m, 1000 * H, 60 + C, 500 + C, 100 * SECONDS_PER_YEAR))).toBe('ref_temperature');
    const cell = RATIO.invoke('PP', 60, '1000 h', 500, '100 years');
    expect((cell as SheetError).message).toMatch(/^ref_temperature: PP has relaxed to nothing/);
  });
  it('names ref_time when the reference temperature is fine at 1 ms and only the time relaxes it', () => {
    const m = resolveMaterial('PC');
    // PC at 170 degC: still rubbery at 1 ms, a melt after a day (WLF with the universal constants, Tg 147 degC).
    expect(modulusMPa(m, 1e-3, 170 + C)).toBeGreaterThan(RELAXED_MPA);
    expect(modulusMPa(m, 24 * H, 170 + C)).toBeLessThan(RELAXED_MPA);
    expect(argumentOf(() => deratingRatio(m, H, 23 + C, 170 + C, 24 * H))).toBe('ref_time');
  });
  it('a solid reference gives the plain quotient (definition of the ratio)', () => {
    const m = resolveMaterial('PA66-cond');
    expectClose(deratingRatio(m, 1000 * H, 60 + C), modulusMPa(m, 1000 * H, 60 + C) / modulusMPa(m, H, 23 + C), {
      rel: 1e-15,
      source: 'definition: E(t, T) / E(1 h, 23 degC)',
    });
  });
  it('a reference where a pure WLF law is undefined names ref_temperature', () => {
    const p = { ...getFamily('PC').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null };
    expect(argumentOf(() => deratingRatio(compileMaterial(p), H, 150 + C))).toBe('ref_temperature');
  });
});

describe('tables and curves name their own arguments', () => {
  const wlfPc = { ...getFamily('PC').params, shiftLaw: 'wlf' as const, E23_MPa: null, Eg_MPa: 2400, E23_low_MPa: null, E23_high_MPa: null };
  it('CURVE: the WLF singularity at the cold end names from_temperature, not temperature', () => {
    const m = compileMaterial(wlfPc);
    expect(() => modulusCurve(m, 50 + C, 200 + C, 10, H)).toThrow(/^from_temperature: 50.00 degC is at or below the WLF singularity/);
    expect(() => modulusCurve(m, 200 + C, 150 + C, 10, H)).toThrow(
      /^to_temperature: must be above from_temperature \(200 degC\), got 150 degC/,
    );
    expect(() => modulusCurve(resolveMaterial('PP'), 20 + C, 160 + C, 1, H)).toThrow(/^points: must be a whole number of 2 or more/);
    const rows = modulusCurve(resolveMaterial('PP'), 20 + C, 160 + C, 29, 1000 * H);
    expect(rows).toHaveLength(29);
    expectClose(rows[28]?.[1] ?? NaN, modulusMPa(resolveMaterial('PP'), 1000 * H, 160 + C), { rel: 0, source: 'same engine call' });
  });
  it('GRID: a column where the shift law is undefined names temperatures; an undefined 23 degC reference names materials', () => {
    // WLF with C2 = 200 K from Tg 147 degC: undefined at and below -52 degC, defined at the 23 degC reference.
    expect(argumentOf(() => deratingTable([{ ...wlfPc, C2_K: 200 }], [23, -100], H))).toBe('temperatures');
    expect(argumentOf(() => deratingTable([wlfPc], [150], H))).toBe('materials');
  });
  it('the worksheet functions carry those names', () => {
    const block = Object.entries(wlfPc).map(([k, v]) => [k, v]);
    const curve = CURVE.invoke(block, 50, 200, 10, 1);
    expect(curve).toBeInstanceOf(SheetError);
    expect((curve as SheetError).message).toMatch(/^from_temperature: /);
    expect(MODULUS.invoke(block, 50, 1)).toBeInstanceOf(SheetError);
    expect(GRID.invoke([['PC']], [[23, 80]], 1)).not.toBeInstanceOf(SheetError);
  });
});
