/**
 * A simulated ISO 75 heat-deflection test through the model: constant flexural stress, 5 min at the
 * start temperature, deflection zeroed, then heating at 120 K/h until the flexural strain has grown by
 * 0.2 %. ISO 75-1:2020 clauses on heating rate, preload time and standard deflection; ISO 75-2 methods
 * A 1.80 MPa, B 0.45 MPa, C 8.00 MPa (stresses confirmed; rate, wait and strain from memory).
 * ISO 75-1 says HDT results are not design data.
 *
 * Strain under the constant stress is sigma D, with the creep compliance D from the relaxation state by
 * the local power law, E D = sin(n pi) / (n pi), n = local log-log slope of the isothermal relaxation
 * curve (Schapery and Park, Int. J. Solids Struct. 36 (1999) 1677, from memory). The slope is capped at
 * HDT_SLOPE_CAP: beyond it (the steep late part of a stretched-exponential decay) the local rule
 * overstates how far creep lags relaxation. With the cap, the simulated HDT of thermorheologically
 * simple amorphous families stays within 1.5 K of the exact Boltzmann answer sigma D(xi(t)) computed
 * from an exactly converted Prony series (test/hdt.test.ts); the quasi-elastic sigma / E_r errs low
 * by up to 2 K, because a material creeps more slowly than it relaxes (E D <= 1).
 *
 * The two clocks are integrated over each temperature step with the logarithmic mean of their rates
 * (exact where log rate is linear in T); the step that crosses the end point is re-run in fine steps.
 *
 * The test bar is an as-moulded glass, younger than the aged part the service answers describe (PC's
 * HDT moves by some 20 K with physical ageing: Li and Mason, Macromol. Mater. Eng. 2009, from memory).
 * Its clock follows the Tool-Narayanaswamy-Moynihan form log a = x log a_eq(T) + (1 - x) log a_eq(Tf),
 * with a_eq the material's own shift law (so Tf = T gives back the service clock), starting from
 * Tf = Tg + fictiveExcess_K, x = tnmX (Narayanaswamy, J. Am. Ceram. Soc. 54 (1971) 491; Moynihan et al.,
 * Ann. N.Y. Acad. Sci. 279 (1976) 15; Hodge, J. Non-Cryst. Solids 169 (1994) 211 for x and beta values).
 * Tf relaxes towards T during the test by Narayanaswamy's superposition of stretched-exponential
 * responses (the material's beta) on a structural clock of STRUCTURAL_TAU_TG_S at Tg, the calorimetric
 * time scale of the DSC Tg. Only this simulation integrates the state; every service
 * answer uses the equilibrium shift law and stays O(1).
 */
import { InputError, ParameterError } from '../base/errors.js';
import { compileMaterial, creepRate, evaluateReduced, type Material, type Region } from '../material/model.js';
import { dryRecord, isHumid } from '../material/humidity.js';
import { powerLawProduct, localSlopeAtClocks } from './creep.js';
import { shiftLog10, WLF_SINGULARITY_MARGIN_K } from '../material/shift.js';
import { KELVIN_OFFSET } from '../base/units.js';

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
/** Coarse temperature step of the simulation, K. */
export const HDT_STEP_K = 2;
/** Fine steps into which the step that crosses the end point is divided. */
export const HDT_REFINE_STEPS = 40;
/** Highest temperature the simulation heats to, degC. */
export const HDT_MAX_C = 500;
/** Cap on the local log-log slope in the creep-compliance rule (set here against the exact solution, see above). */
export const HDT_SLOPE_CAP = 0.55;

/**
 * reached: the strain grew by 0.2 % at temperatureC; at-start: the material relaxed fully during the
 * preload (a melt at 23 degC); rubbery-throughout: not reached, and the material is already rubbery at
 * the start (a network's 3 rho R T / Mc rises with T, so it never softens: HDT does not apply, it is
 * not heat-proof); not-reached: not reached by HDT_MAX_C for another reason (endRegion says which state).
 */
export type HdtStatus = 'reached' | 'at-start' | 'rubbery-throughout' | 'not-reached';

/**
 * Relaxation time of the structural (fictive-temperature) relaxation at the DSC Tg, s: the DSC Tg at 10 to
 * 20 K/min marks a structural time of the order of 100 s (common practice, from memory; Moynihan et al. 1976).
 */
export const STRUCTURAL_TAU_TG_S = 100;

/** Which glass the simulated bar is: as moulded (its fictive-temperature state, the default) or the aged service state. */
export type HdtGlass = 'as-moulded' | 'service';

export interface HdtOptions {
  /** Heating rate, K/h (ISO 75: 120). */
  readonly heatingKPerH?: number;
  readonly glass?: HdtGlass;
  /** Coarse temperature step, K (HDT_STEP_K); smaller only to check convergence. */
  readonly stepK?: number;
}

export interface HdtResult {
  readonly status: HdtStatus;
  /** degC, or null when the strain criterion is not reached by HDT_MAX_C. */
  readonly temperatureC: number | null;
  /** Region at the start (after the preload) and where the simulation ended. */
  readonly startRegion: Region;
  readonly endRegion: Region;
  /** Apparent creep modulus sigma / strain at the end point, MPa. */
  readonly endModulusMPa: number;
  /** Apparent creep modulus sigma / strain when the deflection is zeroed (after the preload), MPa. */
  readonly startModulusMPa: number;
}

/** Creep compliance (1/MPa) at the accumulated clocks, by the capped local power law. */
export function hdtCompliance(m: Material, xi: number, theta: number, TK: number): number {
  const E = evaluateReduced(m, xi, theta, TK).modulusMPa;
  const n = Math.min(localSlopeAtClocks(m, xi, theta, TK, E), HDT_SLOPE_CAP);
  return powerLawProduct(n) / E;
}

/** Below this share of a temperature step left unrelaxed, the step counts as fully relaxed in Tf (set here). */
const RELAXED = 1e-9;

/**
 * Clocks and structural state of the bar. The fictive temperature follows Narayanaswamy's superposition:
 * Tf = Tf0 + sum_k dT_k [1 - exp(-((z - z_k) / tau)^beta)] over the temperature steps dT_k made at
 * structural reduced time z_k (the first step, at z = 0, takes Tf0 to the start temperature).
 */
interface State {
  xi: number;
  theta: number;
  /** Structural reduced time z (units of the structural time at Tg). */
  z: number;
  /** Steps still relaxing: z_k, dT_k interleaved. */
  steps: number[];
  /** Index in steps of the oldest step still relaxing. */
  first: number;
  /** Tf0 plus the steps that have fully relaxed, K. */
  settled: number;
}

/** The bar's clock model: the material and its TNM constants (x = 1: the service clock, no structural state). */
interface Bar {
  readonly m: Material;
  readonly x: number;
  readonly beta: number;
}

function fictive(bar: Bar, s: State): number {
  let tf = s.settled;
  for (let i = s.first; i < s.steps.length; i += 2) {
    const dz = s.z - (s.steps[i] ?? 0);
    const left = Math.exp(-(dz ** bar.beta));
    const dT = s.steps[i + 1] ?? 0;
    // Steps are in z order: once the oldest has relaxed it leaves the sum for good.
    if (i === s.first && left < RELAXED) {
      s.settled += dT;
      s.first += 2;
    }
    tf += dT * (1 - left);
  }
  return tf;
}

/** log10 of the bar's shift factor at T with fictive temperature Tf (K): TNM, or the equilibrium law for x = 1. */
function barLog10(bar: Bar, TK: number, TfK: number): number {
  const eq = shiftLog10(bar.m.shift, TK);
  return bar.x === 1 ? eq : bar.x * eq + (1 - bar.x) * shiftLog10(bar.m.shift, TfK);
}

/** Advances the state by dt (s) while T goes from T0 to T1 (K): fictive temperature first, then the clocks. */
function advance(bar: Bar, s: State, T0: number, T1: number, dt: number): void {
  const tf0 = fictive(bar, s);
  const r0 = 10 ** -barLog10(bar, T0, tf0);
  let tf1 = tf0;
  if (bar.x < 1) {
    // The temperature step is taken at its middle in structural time (midpoint rule for the ramp).
    const dz = (dt * r0) / STRUCTURAL_TAU_TG_S;
    s.steps.push(s.z + dz / 2, T1 - T0);
    s.z += dz;
    tf1 = fictive(bar, s);
  }
  const r1 = 10 ** -barLog10(bar, T1, tf1);
  s.xi += dt * logMean(r0, r1);
  s.theta += dt * logMean(creepRate(bar.m, T0), creepRate(bar.m, T1));
}

function copyState(s: State): State {
  return { xi: s.xi, theta: s.theta, z: s.z, steps: s.steps.slice(), first: s.first, settled: s.settled };
}

function logMean(a: number, b: number): number {
  if (a === b || !(a > 0) || !(b > 0)) return (a + b) / 2;
  const r = b / a;
  return Math.abs(r - 1) < 1e-9 ? a : (b - a) / Math.log(r);
}

/**
 * Simulated HDT (degC) at a flexural stress (MPa); heating in K/h (default ISO 75) or options.
 *
 * A humid polyamide (humidity.ts) reports the lower of its wet bar's and its dry bar's HDT. Zeroing the
 * deflection after the 5 min preload credits a wet bar, already in its glass transition at 23 degC, with
 * the creep it did under the preload: its end point is measured from a softer start, so it comes out
 * 60 to 90 K above the dry bar's although its modulus is at or below the dry one's at every time and
 * temperature (water plasticizes only the amorphous phase). That number reports the protocol, not the
 * stiffness; datasheets give polyamide HDT dry as moulded (common practice, from memory), and a bar heated
 * past 100 degC loses water anyway. The optimistic direction is the unsafe one, so humidity never raises it.
 */
export function simulateHdt(m: Material, stressMPa: number, heating: number | HdtOptions = {}): HdtResult {
  const wet = simulateBar(m, stressMPa, heating);
  if (m.prony || !isHumid(m.params)) return wet;
  const dry = simulateBar(compileMaterial(dryRecord(m.params)), stressMPa, heating);
  return (dry.temperatureC ?? Infinity) < (wet.temperatureC ?? Infinity) ? dry : wet;
}

/** The ISO 75 simulation of one bar as it is (degC; stress MPa). */
function simulateBar(m: Material, stressMPa: number, heating: number | HdtOptions): HdtResult {
  const o: HdtOptions = typeof heating === 'number' ? { heatingKPerH: heating } : heating;
  const heatingKPerH = o.heatingKPerH ?? HDT_HEATING_K_PER_H;
  const stepK = o.stepK ?? HDT_STEP_K;
  if (!(stressMPa > 0) || !Number.isFinite(stressMPa)) throw new InputError('stress', `must be a positive stress in MPa, got ${stressMPa}`);
  if (!(heatingKPerH > 0) || !Number.isFinite(heatingKPerH))
    throw new InputError('heating', `must be a positive rate in K/h, got ${heatingKPerH}`);
  if (!(stepK > 0)) throw new InputError('stepK', 'must be positive');
  const T0 = HDT_START_C + KELVIN_OFFSET;
  const c = m.shift;
  if (c.law === 'wlf' && T0 - c.TrefK <= -c.C2K + WLF_SINGULARITY_MARGIN_K) {
    throw new ParameterError(
      'shiftLaw',
      `the pure WLF law is undefined at the ${HDT_START_C} degC start of the HDT test (at or below Tg - C2 + ${WLF_SINGULARITY_MARGIN_K} K); use the hybrid law`,
      c.law,
    );
  }
  const p = m.params;
  const moulded = (o.glass ?? 'as-moulded') === 'as-moulded' && !m.prony && p.tnmX < 1;
  const bar: Bar = { m, x: moulded ? p.tnmX : 1, beta: m.beta };
  const Tf0 = c.TrefK + p.fictiveExcess_K;
  const Tmax = HDT_MAX_C + KELVIN_OFFSET;
  const secondsPerK = 3600 / heatingKPerH;
  // The bar arrives at the start temperature from its fictive temperature: the first step of its history.
  let s: State = { xi: 0, theta: 0, z: 0, steps: moulded ? [0, T0 - Tf0] : [], first: 0, settled: Tf0 };
  advance(bar, s, T0, T0, HDT_PRELOAD_S);
  const D0 = hdtCompliance(m, s.xi, s.theta, T0);
  const startRegion = evaluateReduced(m, s.xi, s.theta, T0).region;
  // Fully relaxed during the preload (a melt or rubber at 23 degC): the strain criterion is met at the start.
  if (!Number.isFinite(D0)) {
    return {
      status: 'at-start',
      temperatureC: HDT_START_C,
      startRegion,
      endRegion: startRegion,
      endModulusMPa: 0,
      startModulusMPa: 1 / D0,
    };
  }
  const Dend = D0 + HDT_STRAIN_INCREASE / stressMPa;
  const startModulusMPa = 1 / D0;
  const endModulusMPa = 1 / Dend;
  let T = T0;
  let Dprev = D0;
  while (T < Tmax) {
    const step = Math.min(stepK, Tmax - T);
    const next = copyState(s);
    advance(bar, next, T, T + step, secondsPerK * step);
    const D = hdtCompliance(m, next.xi, next.theta, T + step);
    if (D >= Dend) {
      // Re-run this step finely from the saved state and interpolate linearly within the fine step.
      const h = step / HDT_REFINE_STEPS;
      let Tf = T;
      let Df = Dprev;
      const f = copyState(s);
      for (let i = 0; i < HDT_REFINE_STEPS; i++) {
        advance(bar, f, Tf, Tf + h, secondsPerK * h);
        const Dn = hdtCompliance(m, f.xi, f.theta, Tf + h);
        if (Dn >= Dend || i === HDT_REFINE_STEPS - 1) {
          const frac = Dn > Df ? Math.min(1, Math.max(0, (Dend - Df) / (Dn - Df))) : 1;
          const endRegion = evaluateReduced(m, f.xi, f.theta, Tf + h).region;
          return { status: 'reached', temperatureC: Tf + frac * h - KELVIN_OFFSET, startRegion, endRegion, endModulusMPa, startModulusMPa };
        }
        Tf += h;
        Df = Dn;
      }
    }
    s = next;
    T += step;
    Dprev = D;
  }
  const endRegion = evaluateReduced(m, s.xi, s.theta, T).region;
  const status: HdtStatus = startRegion === 'rubbery' ? 'rubbery-throughout' : 'not-reached';
  return { status, temperatureC: null, startRegion, endRegion, endModulusMPa, startModulusMPa };
}
