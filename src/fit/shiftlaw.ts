/**
 * The shift law fitted to the shifts of a master curve (mastercurve.ts): WLF (Williams, Landel, Ferry,
 * J. Am. Chem. Soc. 77 (1955) 3701) at and above Tg with the master curve's reference as reference,
 * Arrhenius below Tg, joined continuously at Tg. Constants stay inside the bounds a Prony table is
 * checked against (shift.ts WLF_REF_*, params.ts Ea_kJmol); one that ends on its bound carries a note.
 */
import { InputError } from '../base/errors.js';
import { boundedLeastSquares } from '../numeric/lsq.js';
import { minOf } from '../numeric/arrays.js';
import type { FitQuality } from '../material/prony.js';
import { fieldSpec } from '../material/params.js';
import { GAS_CONSTANT, WLF_REF_C1_RANGE, WLF_REF_C2_RANGE_K, wlfLog10, type ShiftLaw } from '../material/shift.js';

/** Tolerance of a fitted log10 a_T, decades, for scaling and the quality flag. */
export const SHIFT_TOLERANCE = 0.05;

export interface CurveShift {
  readonly temperatureK: number;
  /** log10 a_T relative to the reference temperature. */
  readonly log10aT: number;
  /** Points overlapping the neighbour it was shifted against (0 for the reference curve). */
  readonly overlapPoints: number;
  /** RMS log10 modulus mismatch over the overlap, decades. */
  readonly rmsLog10: number;
  /** Temperature (K) of the curve it was shifted against (null for the reference). */
  readonly againstK: number | null;
}

/** Shift law fitted to log10 a_T values; WLF constants are with the master curve's reference as reference. */
export interface ShiftLawFit {
  readonly law: ShiftLaw;
  readonly referenceK: number;
  readonly TgK: number | null;
  readonly C1: number | null;
  readonly C2K: number | null;
  readonly EakJmol: number | null;
  /** How each number was obtained. */
  readonly fitted: { readonly wlf: boolean; readonly arrhenius: boolean };
  /** RMS of log10 a_T (law - shifts) over the curves other than the reference, decades. */
  readonly rmsLog10: number;
  readonly points: number;
  readonly quality: FitQuality;
  readonly notes: readonly string[];
}

/** Default Arrhenius energy below Tg when no curve lies below Tg (the families' value; see families.ts SRC.eaGlass). */
export const DEFAULT_EA_KJMOL = 600;

/**
 * Fits the shift law to the shifts: WLF (C1, C2 at the reference) to the curves at or above Tg (all
 * curves when Tg is not given) and, when Tg is given, Arrhenius Ea to those below it, continuous at Tg.
 */
export function fitShiftLaw(shifts: readonly CurveShift[], referenceK: number, TgK: number | null = null): ShiftLawFit {
  const notes: string[] = [];
  const above = shifts.filter((s) => TgK === null || s.temperatureK >= TgK);
  const below = shifts.filter((s) => TgK !== null && s.temperatureK < TgK);
  const aboveData = above.filter((s) => Math.abs(s.temperatureK - referenceK) > 1e-9);
  let C1: number | null = null;
  let C2: number | null = null;
  let wlfFitted = false;
  if (TgK !== null && referenceK < TgK && above.length > 0) {
    throw new InputError(
      'reference',
      'with curves above Tg, choose a reference temperature at or above Tg (the WLF part is referred to it)',
    );
  }
  if (aboveData.length >= 2) {
    const fit = fitWlf(aboveData, referenceK);
    C1 = fit.C1;
    C2 = fit.C2K;
    wlfFitted = true;
    for (const name of fit.atBound) {
      const v = name === 'C1' ? C1 : C2;
      notes.push(
        `${name} ended on its search bound (${Number(v.toPrecision(4))}${name === 'C1' ? '' : ' K'}); the shifts pull it further than a WLF law allows: check the curve temperatures, or give Tg so that the curves below it follow Arrhenius`,
      );
    }
    if (aboveData.length === 2)
      notes.push('WLF C1 and C2 rest on exactly two shifts: they fit them exactly and are not checked by a third');
  } else if (above.length > 0 && TgK !== null) {
    throw new InputError(
      'data',
      `WLF needs curves at three or more temperatures at or above Tg (the reference and two others); got ${above.length}`,
    );
  } else if (TgK === null) {
    throw new InputError('data', 'WLF needs curves at three or more temperatures; give Tg to fit Arrhenius below it instead');
  }
  let Ea: number | null = null;
  let arrFitted = false;
  let law: ShiftLaw = 'wlf';
  if (TgK !== null) {
    if (C1 === null) {
      // Every curve below Tg: Arrhenius through the reference.
      law = 'arrhenius';
      const pts = below.filter((s) => Math.abs(s.temperatureK - referenceK) > 1e-9);
      if (pts.length < 1) throw new InputError('data', 'Arrhenius needs curves at two or more temperatures');
      Ea = boundedEa(arrheniusSlope(pts, referenceK, 0), notes);
      arrFitted = true;
      notes.push('every curve is below Tg: the shift law is Arrhenius throughout (it extrapolates above Tg as Arrhenius)');
    } else {
      law = 'hybrid';
      const anchor = wlfLog10(TgK, referenceK, C1, C2 ?? 1);
      if (below.length > 0) {
        Ea = boundedEa(arrheniusSlope(below, TgK, anchor), notes);
        arrFitted = true;
      } else {
        Ea = DEFAULT_EA_KJMOL;
        notes.push(
          `no curve below Tg: the Arrhenius energy below Tg is not fitted; ${DEFAULT_EA_KJMOL} kJ/mol (the families' default) is used`,
        );
      }
    }
  } else {
    notes.push('no Tg given: WLF is used at every temperature; give Tg to switch to Arrhenius below it');
  }
  const predict = (T: number): number => {
    if (law === 'arrhenius') return ((Ea ?? 0) * 1000 * (1 / T - 1 / referenceK)) / (GAS_CONSTANT * Math.LN10);
    if (law === 'hybrid' && TgK !== null && T < TgK) {
      return wlfLog10(TgK, referenceK, C1 ?? 0, C2 ?? 1) + ((Ea ?? 0) * 1000 * (1 / T - 1 / TgK)) / (GAS_CONSTANT * Math.LN10);
    }
    return wlfLog10(T, referenceK, C1 ?? 0, C2 ?? 1);
  };
  const data = shifts.filter((s) => Math.abs(s.temperatureK - referenceK) > 1e-9);
  const rms = Math.sqrt(data.reduce((sum, s) => sum + (predict(s.temperatureK) - s.log10aT) ** 2, 0) / Math.max(1, data.length));
  const quality: FitQuality = rms <= 2 * SHIFT_TOLERANCE ? 'good' : rms <= 6 * SHIFT_TOLERANCE ? 'fair' : 'poor';
  const exact = (wlfFitted && aboveData.length === 2) || (arrFitted && !wlfFitted && data.length === 1);
  return {
    law,
    referenceK,
    TgK,
    C1,
    C2K: C2,
    EakJmol: Ea,
    fitted: { wlf: wlfFitted, arrhenius: arrFitted },
    rmsLog10: rms,
    points: data.length,
    quality: exact && quality === 'good' ? 'fair' : quality,
    notes,
  };
}

/**
 * The fitted Ea kept inside the bounds a parameter record has (so the Prony table written from the fit
 * reads back): the one-parameter least-squares optimum under a bound is the bound itself. A note says so.
 */
function boundedEa(Ea: number, notes: string[]): number {
  const { min, max } = fieldSpec('Ea_kJmol');
  if (Ea >= min && Ea <= max) return Ea;
  const b = Ea < min ? min : max;
  notes.push(
    `Ea ended on its bound (${b} kJ/mol; the shifts alone give ${Number(Ea.toPrecision(3))} kJ/mol); check the curve temperatures and Tg`,
  );
  return b;
}

/** Least-squares slope k of log a = anchor + k (1/T - 1/T0), returned as Ea in kJ/mol. */
function arrheniusSlope(pts: readonly CurveShift[], T0: number, anchor: number): number {
  let num = 0;
  let den = 0;
  for (const s of pts) {
    const u = 1 / s.temperatureK - 1 / T0;
    num += u * (s.log10aT - anchor);
    den += u * u;
  }
  const Ea = ((num / den) * GAS_CONSTANT * Math.LN10) / 1000;
  if (!(Ea > 0))
    throw new InputError(
      'data',
      `the shifts below Tg run the wrong way for Arrhenius (fitted Ea ${Ea.toFixed(1)} kJ/mol); check the curve temperatures`,
    );
  return Ea;
}

function fitWlf(pts: readonly CurveShift[], Tr: number): { C1: number; C2K: number; atBound: readonly string[] } {
  // Start from the linearized form (T - Tr) / log a = -C2/C1 - (T - Tr)/C1.
  const use = pts.filter((s) => Math.abs(s.log10aT) > 1e-6);
  let C1s = 17.44;
  let C2s = 51.6;
  if (use.length >= 2) {
    const xs = use.map((s) => s.temperatureK - Tr);
    const ys = use.map((s, i) => (xs[i] ?? 0) / s.log10aT);
    const n = xs.length;
    const mx = xs.reduce((a, b) => a + b, 0) / n;
    const my = ys.reduce((a, b) => a + b, 0) / n;
    const sxx = xs.reduce((a, x) => a + (x - mx) ** 2, 0);
    const sxy = xs.reduce((a, x, i) => a + (x - mx) * ((ys[i] ?? 0) - my), 0);
    const slope = sxx > 0 ? sxy / sxx : 0;
    const c1 = -1 / slope;
    const c2 = -(my - slope * mx) * c1;
    if (c1 > WLF_REF_C1_RANGE[0] && c1 < WLF_REF_C1_RANGE[1] && c2 > WLF_REF_C2_RANGE_K[0] && c2 < WLF_REF_C2_RANGE_K[1]) {
      C1s = c1;
      C2s = c2;
    }
  }
  const minDT = minOf(pts.map((s) => s.temperatureK - Tr));
  const c2Min = Math.max(WLF_REF_C2_RANGE_K[0], -minDT + 1);
  const r = boundedLeastSquares(
    [
      { name: 'C1', start: C1s, min: WLF_REF_C1_RANGE[0], max: WLF_REF_C1_RANGE[1], log: true },
      { name: 'C2_K', start: Math.max(C2s, c2Min + 1), min: c2Min, max: WLF_REF_C2_RANGE_K[1], log: true },
    ],
    ([c1, c2]) => pts.map((s) => (wlfLog10(s.temperatureK, Tr, c1 ?? 1, c2 ?? 1) - s.log10aT) / SHIFT_TOLERANCE),
    1e-10,
  );
  return { C1: r.values[0] ?? NaN, C2K: r.values[1] ?? NaN, atBound: r.atBound };
}
