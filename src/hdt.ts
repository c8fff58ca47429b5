/**
 * A simulated ISO 75 heat-deflection test through the model: constant flexural stress, 5 min at the
 * start temperature, then heating at 120 K/h until the flexural strain has grown by 0.2 %.
 * ISO 75-1:2020 clauses on heating rate, preload time and standard deflection; ISO 75-2 methods
 * A 1.80 MPa, B 0.45 MPa, C 8.00 MPa (stresses confirmed; rate, wait and strain from memory).
 * Strain under constant stress is taken as sigma / E_r (quasi-elastic); creep compliance is somewhat
 * larger, so the simulated HDT errs slightly high. ISO 75-1 says HDT results are not design data.
 */
import { InputError, ParameterError } from './errors.js';
import { WLF_SINGULARITY_MARGIN_K } from './shift.js';
import { advanceClocks, type Clocks } from './history.js';
import { evaluateReduced, type Material } from './model.js';
import { KELVIN_OFFSET } from './units.js';

/** ISO 75-2 flexural stresses, MPa. */
export const HDT_METHODS = { A: 1.8, B: 0.45, C: 8.0 } as const;
/** ISO 75-1 heating rate, K/h. */
export const HDT_HEATING_K_PER_H = 120;
/** ISO 75-1 standard deflection as a flexural strain increase (0.2 %). */
export const HDT_STRAIN_INCREASE = 0.002;
/** ISO 75-1 time under load before heating starts, s. */
export const HDT_PRELOAD_S = 300;
/** Start temperature of the bath, degC (ISO 75-1 asks for 20 to 23 degC). */
export const HDT_START_C = 23;
/** Temperature step of the simulation, K. */
export const HDT_STEP_K = 0.25;
/** Highest temperature the simulation heats to, degC. */
export const HDT_MAX_C = 500;

export interface HdtResult {
  /** degC, or null when the strain criterion is not reached by HDT_MAX_C. */
  readonly temperatureC: number | null;
  /** Modulus at which the criterion is met, MPa. */
  readonly endModulusMPa: number;
  readonly startModulusMPa: number;
}

/** Simulated HDT (degC) at a flexural stress (MPa). */
export function simulateHdt(m: Material, stressMPa: number, heatingKPerH = HDT_HEATING_K_PER_H): HdtResult {
  if (!(stressMPa > 0) || !Number.isFinite(stressMPa)) throw new InputError('stress', `must be a positive stress in MPa, got ${stressMPa}`);
  if (!(heatingKPerH > 0) || !Number.isFinite(heatingKPerH))
    throw new InputError('heating', `must be a positive rate in K/h, got ${heatingKPerH}`);
  const T0 = HDT_START_C + KELVIN_OFFSET;
  const c = m.shift;
  if (c.law === 'wlf' && T0 - c.TrefK <= -c.C2K + WLF_SINGULARITY_MARGIN_K) {
    throw new ParameterError(
      'shiftLaw',
      `the pure WLF law is undefined at the ${HDT_START_C} degC start of the HDT test (at or below Tg - C2 + ${WLF_SINGULARITY_MARGIN_K} K); use the hybrid law`,
      c.law,
    );
  }
  const clocks: Clocks = { xi: 0, theta: 0 };
  advanceClocks(m, clocks, T0, HDT_PRELOAD_S);
  const E0 = evaluateReduced(m, clocks.xi, clocks.theta, T0).modulusMPa;
  // Fully relaxed during the preload (a melt or rubber at 23 degC): the strain criterion is met at the start.
  if (!(E0 > 0)) return { temperatureC: HDT_START_C, endModulusMPa: 0, startModulusMPa: E0 };
  const Eend = stressMPa / (stressMPa / E0 + HDT_STRAIN_INCREASE);
  const dt = (HDT_STEP_K / heatingKPerH) * 3600;
  let Tprev = T0;
  let Eprev = E0;
  for (let T = T0 + HDT_STEP_K; T <= HDT_MAX_C + KELVIN_OFFSET; T += HDT_STEP_K) {
    advanceClocks(m, clocks, T - HDT_STEP_K / 2, dt);
    const E = evaluateReduced(m, clocks.xi, clocks.theta, T).modulusMPa;
    if (E <= Eend) {
      // Log-linear interpolation; where E did not change over the step (or fell to 0) take the step's start.
      const span = Math.log(Eprev) - Math.log(E);
      const f = span > 0 && Number.isFinite(span) ? Math.min(1, Math.max(0, (Math.log(Eprev) - Math.log(Eend)) / span)) : 0;
      return { temperatureC: Tprev + f * (T - Tprev) - KELVIN_OFFSET, endModulusMPa: Eend, startModulusMPa: E0 };
    }
    Tprev = T;
    Eprev = E;
  }
  return { temperatureC: null, endModulusMPa: Eend, startModulusMPa: E0 };
}
