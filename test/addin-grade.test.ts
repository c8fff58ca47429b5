/** The review's grade builder (addin/jobs/review/grade.ts) and the look-up's card of a filled grade. */
import { describe, expect, it } from 'vitest';
import { InputError } from '../src/base/errors.js';
import { getGrade, GRADE_MODULUS_SOURCE, listedModulusMPa } from '../src/material/grade.js';
import { FILLERS } from '../src/material/filler.js';
import { composeGrade, GRADE_ARGS, takesHumidity } from '../addin/jobs/review/grade.js';
import { summarize } from '../addin/jobs/lookup/plan.js';
import { valueIn } from '../src/base/display.js';

const fields = (base: string, filler: string, mass = '30', humidity = '50') => ({ base, filler, mass, humidity });

function argumentOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e.argument;
    throw e;
  }
  return 'no error';
}

describe('grade builder', () => {
  it('composes the grade text every DERATE function reads (grade syntax of src/material/grade.ts)', () => {
    expect(composeGrade(fields('PA66', 'GF'))).toBe('PA66-GF30 at 50 % RH');
    expect(composeGrade(fields('PBT', 'GF', '30 %'))).toBe('PBT-GF30');
    expect(composeGrade(fields('PA6', 'none', '', '70'))).toBe('PA6 at 70 % RH');
    expect(composeGrade(fields('PC', 'none', 'ignored', 'ignored'))).toBe('PC');
    expect(composeGrade(fields('PA66-dry', 'GF', '30', 'ignored'))).toBe('PA66-dry-GF30');
    // The text resolves to the grade of that name.
    expect(getGrade(composeGrade(fields('PA66', 'GF'))).params.id).toBe('PA66-GF30 at 50 % RH');
  });

  it('takes a humidity for the bare polyamides only (POLYAMIDES, src/material/humidity.ts)', () => {
    expect(['PA6', 'PA66', 'PA66-dry', 'PA66-cond', 'PBT'].map(takesHumidity)).toEqual([true, true, false, false, false]);
  });

  it('names the field at fault', () => {
    // GF is allowed 5 to 60 % by mass (FILLERS.GF.massPct).
    expect(FILLERS.GF.massPct).toEqual([5, 60]);
    expect(argumentOf(() => composeGrade(fields('PBT', 'GF', '80')))).toBe(GRADE_ARGS.mass);
    expect(argumentOf(() => composeGrade(fields('PBT', 'GF', '')))).toBe(GRADE_ARGS.mass);
    expect(argumentOf(() => composeGrade(fields('PBT', 'GF', 'x')))).toBe(GRADE_ARGS.mass);
    // Relative humidity is 0 to 100 % by definition.
    expect(argumentOf(() => composeGrade(fields('PA66', 'GF', '30', '120')))).toBe(GRADE_ARGS.humidity);
    expect(argumentOf(() => composeGrade(fields('PA66', 'none', '', 'wet')))).toBe(GRADE_ARGS.humidity);
    expect(argumentOf(() => composeGrade(fields('PBT', 'XX')))).toBe(GRADE_ARGS.base);
    expect(argumentOf(() => composeGrade(fields('NOPE', 'none')))).toBe(GRADE_ARGS.base);
  });
});

describe('look-up card of a filled grade', () => {
  it('shows the estimated 23 degC modulus along flow with its source, not a datasheet range', () => {
    const f = getGrade('PBT-GF30');
    const E = summarize(f).quantities[2];
    expect(E?.label).toBe('Modulus at 23 degC, along flow');
    expect(E?.text).toBe(`${valueIn(listedModulusMPa(f) ?? NaN, 'MPa')} MPa (estimated)`);
    expect(E?.source).toBe(GRADE_MODULUS_SOURCE);
    // Glass fibre stiffens: the estimate is above the unfilled family's typical value (common practice).
    expect(listedModulusMPa(f) ?? 0).toBeGreaterThan(getGrade('PBT').params.E23_MPa ?? Infinity);
  });
});
