/**
 * Retained stress at a fixed strain (a press-fit, or a snap-fit held closed): sigma(t) = E_r(t, T) eps0,
 * at constant temperature or after a temperature history (linear viscoelastic, small strain).
 */
import { InputError } from '../base/errors.js';
import { modulusAfterHistory, type Segment } from './history.js';
import { evaluateClocks, type Material, type Region } from '../material/model.js';

/**
 * Largest strain accepted, as a fraction. Set here: beyond 10 % a linear viscoelastic estimate has no meaning;
 * common practice puts the linear range of glassy thermoplastics at roughly 0.5 to 1 % strain.
 */
export const MAX_STRAIN = 0.1;
/** Strain above which results carry a linearity warning (common practice, see MAX_STRAIN). */
export const LINEAR_STRAIN_LIMIT = 0.01;

export interface StressAnswer {
  readonly stressMPa: number;
  readonly modulusMPa: number;
  readonly region: Region;
  /** True where the strain is above the usual linear range, so the estimate is likely high. */
  readonly beyondLinearRange: boolean;
}

/** Checks a strain given as a fraction (0 < eps <= MAX_STRAIN). */
export function checkStrain(strain: number, argument = 'strain'): number {
  if (!Number.isFinite(strain) || strain <= 0)
    throw new InputError(argument, `must be a positive fraction such as 0.005 (or '0.5 %'), got ${strain}`);
  if (strain > MAX_STRAIN) {
    throw new InputError(
      argument,
      `${strain} is above ${MAX_STRAIN} (${MAX_STRAIN * 100} %); give the strain as a fraction (0.005 = 0.5 %), the model is for small strains`,
    );
  }
  return strain;
}

/** Stress (MPa) retained at a fixed strain (fraction) after time t (s) at temperature T (K). */
export function retainedStressMPa(m: Material, strain: number, tS: number, TK: number): StressAnswer {
  checkStrain(strain);
  const e = evaluateClocks(m, tS, TK);
  return { stressMPa: e.modulusMPa * strain, modulusMPa: e.modulusMPa, region: e.region, beyondLinearRange: strain > LINEAR_STRAIN_LIMIT };
}

/** Stress (MPa) retained at a fixed strain after `cycles` repetitions of a history, at TevalK (default: the hottest segment). */
export function retainedStressAfterHistoryMPa(
  m: Material,
  strain: number,
  segments: readonly Segment[],
  cycles = 1,
  TevalK?: number,
): StressAnswer {
  checkStrain(strain);
  const e = modulusAfterHistory(m, segments, cycles, TevalK);
  return { stressMPa: e.modulusMPa * strain, modulusMPa: e.modulusMPa, region: e.region, beyondLinearRange: strain > LINEAR_STRAIN_LIMIT };
}
