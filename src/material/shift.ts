/**
 * Time-temperature shift laws. All return log10 a_T relative to the reference temperature (Tg for the
 * material's main law), so that the reduced time is t / a_T.
 */
import { InputError } from '../base/errors.js';

/** Molar gas constant, J/(mol K) (CODATA 2018, exact since the 2019 SI redefinition). */
export const GAS_CONSTANT = 8.314462618;
/** "Universal" WLF constants with Tg as reference (Williams, Landel, Ferry, J. Am. Chem. Soc. 77 (1955) 3701). */
export const WLF_UNIVERSAL_C1 = 17.44;
/** "Universal" WLF C2 in kelvin (Williams, Landel, Ferry 1955). */
export const WLF_UNIVERSAL_C2_K = 51.6;

export type ShiftLaw = 'hybrid' | 'wlf' | 'arrhenius';
export const SHIFT_LAWS: readonly ShiftLaw[] = ['hybrid', 'wlf', 'arrhenius'];

/** Constants of one material's shift law; temperatures in kelvin, Ea in kJ/mol. */
export interface ShiftConstants {
  readonly law: ShiftLaw;
  readonly TrefK: number;
  readonly C1: number;
  readonly C2K: number;
  readonly EakJ: number;
}

/**
 * Bounds of WLF C1 and C2 (K) referred to a master curve's reference temperature: the search box of the
 * master-curve fit and the check on a Prony table's constants. Set here, wide: the published constants
 * at Tg run from about 5 to 35 for C1 and 25 to 240 K for C2 (Ferry, Viscoelastic Properties of Polymers,
 * 3rd ed. 1980, Table 11-II, from memory), and referring them to a higher reference lowers C1 and raises C2.
 */
export const WLF_REF_C1_RANGE: readonly [number, number] = [0.5, 60];
export const WLF_REF_C2_RANGE_K: readonly [number, number] = [5, 500];

/** Closest approach to the WLF singularity T - Tr = -C2 that pure WLF accepts, kelvin. */
export const WLF_SINGULARITY_MARGIN_K = 1;

/** WLF: log10 a_T = -C1 (T - Tr) / (C2 + T - Tr); T and Tr in kelvin (or both degC), C2 in kelvin. */
export function wlfLog10(T: number, Tr: number, C1: number, C2K: number): number {
  const dT = T - Tr;
  return (-C1 * dT) / (C2K + dT);
}

/** Arrhenius: log10 a_T = (Ea / (R ln 10)) (1/T - 1/Tr); T, Tr in kelvin, Ea in kJ/mol. */
export function arrheniusLog10(TK: number, TrK: number, EakJ: number): number {
  return ((EakJ * 1000) / (GAS_CONSTANT * Math.LN10)) * (1 / TK - 1 / TrK);
}

/** log10 a_T of a material's law at T (kelvin); hybrid = Arrhenius below Tr, WLF above, continuous at Tr. */
export function shiftLog10(c: ShiftConstants, TK: number): number {
  if (c.law === 'arrhenius' || (c.law === 'hybrid' && TK < c.TrefK)) return arrheniusLog10(TK, c.TrefK, c.EakJ);
  if (c.law === 'wlf' && TK - c.TrefK <= -c.C2K + WLF_SINGULARITY_MARGIN_K) {
    throw new InputError(
      'temperature',
      `${(TK - 273.15).toFixed(2)} degC is at or below the WLF singularity Tg - C2 + ${WLF_SINGULARITY_MARGIN_K} K; use the hybrid law below Tg`,
    );
  }
  return wlfLog10(TK, c.TrefK, c.C1, c.C2K);
}

/**
 * Temperature (kelvin) at which the law gives the requested log10 a_T, or null where none exists
 * (WLF tends to -C1 as T rises, so log10 a_T <= -C1 is never reached above Tr).
 */
export function temperatureForShiftK(c: ShiftConstants, log10aT: number): number | null {
  const useArrhenius = c.law === 'arrhenius' || (c.law === 'hybrid' && log10aT > 0);
  if (useArrhenius) {
    const invT = 1 / c.TrefK + (log10aT * GAS_CONSTANT * Math.LN10) / (c.EakJ * 1000);
    return invT > 0 ? 1 / invT : null;
  }
  if (log10aT <= -c.C1) return null;
  const dT = (-log10aT * c.C2K) / (log10aT + c.C1);
  if (c.law === 'wlf' && dT <= -c.C2K + WLF_SINGULARITY_MARGIN_K) return null;
  // With C2 larger than Tg in kelvin, WLF would answer at or below absolute zero.
  const T = c.TrefK + dT;
  return T > 0 ? T : null;
}

/** WLF constants moved from reference T0 to a new reference T1 (kelvin): C2' = C2 + T1 - T0, C1' = C1 C2 / C2'. */
export function rereferenceWlf(C1: number, C2K: number, T0: number, T1: number): { C1: number; C2K: number } {
  const C2new = C2K + T1 - T0;
  return { C1: (C1 * C2K) / C2new, C2K: C2new };
}
