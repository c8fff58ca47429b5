// @load on-first-call
/**
 * The user's own curves: master curve by shifting, the shift law fitted to the shifts, and a Prony
 * series that every function accepts as a material. In Excel this file is loaded on the first call of
 * one of its functions (see scripts/build/20-functions.mjs).
 */
import {
  fitCurves,
  fitShiftLaw,
  GAS_CONSTANT,
  KELVIN_OFFSET,
  pronyToTable,
  qualityFromRmsLog10,
  shiftCurves,
  termsPerDecadeInput,
  wlfLog10,
  type CurveFit,
  type CurveSet,
  type FitQuality,
  type PronyMaterialSpec,
  type ShiftLawFit,
} from '../src/index.js';
import { count } from './core/args/count.js';
import { optionalTemperature } from './core/args/temperature.js';
import type { OutCell } from './core/cells.js';
import { defineMatrix, type ArgShape } from './core/define.js';
import { curves } from './core/args/tables.js';
import { commentRows, FIT_CAUTION, notesText, QUALITY_MEANING, sig } from './core/fitout.js';

const RANK: Record<FitQuality, number> = { good: 0, fair: 1, poor: 2 };
function worst(a: FitQuality, b: FitQuality): FitQuality {
  return RANK[b] > RANK[a] ? b : a;
}

/** RMS overlap mismatch of the shifted curves (the reference curve has none), decades; as in fitCurves. */
function overlapRms(shifts: readonly { rmsLog10: number }[]): number {
  return Math.sqrt(shifts.reduce((s, x) => s + x.rmsLog10 ** 2, 0) / Math.max(1, shifts.length - 1));
}

/** Upper bound of the rows of a result that has one row per data point at most, from the data range's shape. */
function dataRows(shape: ArgShape | undefined): number | undefined {
  return shape && shape.rows > 0 ? shape.rows : undefined;
}

/** Key rows of a Prony table (prony, name, reference_C, shiftLaw, Tg_C, C1, C2_K, Ea_kJmol, E_inf_MPa, header). */
const PRONY_KEY_ROWS = 10;
const PRONY_COMMENT_ROWS = 4;

function fitText(f: CurveFit): string {
  const shift = qualityFromRmsLog10(overlapRms(f.shifts));
  return [
    `shifting ${shift} (overlap RMS ${sig(overlapRms(f.shifts))} decades over ${f.shifts.length} curves)`,
    `shift law ${f.shiftLaw.law} ${f.shiftLaw.quality} (RMS ${sig(f.shiftLaw.rmsLog10)} decades of log10 aT; DERATE.SHIFTS lists them)`,
    `Prony ${f.pronyQuality} (RMS ${sig(f.pronyRmsLog10)}, largest ${sig(f.pronyMaxLog10)} decades over ${f.master.length} points, ${f.termsPerDecade} terms per decade)`,
  ].join('; ');
}

export const FITCURVES = defineMatrix({
  id: 'FITCURVES',
  args: [
    curves('data_range'),
    optionalTemperature('tg'),
    optionalTemperature('reference'),
    count('terms_per_decade', termsPerDecadeInput, { optional: true }),
  ],
  spillSize: ([data]) => {
    const n = dataRows(data);
    return n === undefined ? undefined : [PRONY_KEY_ROWS + n + PRONY_COMMENT_ROWS, 2];
  },
  spillFits: 'at-most',
  run: (set, tg, reference, perDecade) => {
    const f = fitCurves(set, {
      ...(tg !== undefined ? { TgK: tg } : {}),
      ...(reference !== undefined ? { referenceK: reference } : {}),
      ...(perDecade !== undefined ? { termsPerDecade: perDecade } : {}),
    });
    // Terms of zero weight change nothing; the table lists the others.
    const spec: PronyMaterialSpec = { ...f.material, prony: { ...f.prony, terms: f.prony.terms.filter((t) => t.EMPa > 0) } };
    const rows: OutCell[][] = pronyToTable(spec);
    rows.push(
      ...commentRows(2, [
        ['quality', QUALITY_MEANING[f.quality]],
        ['fit', fitText(f)],
        ['notes', notesText(f.notes)],
        ['caution', FIT_CAUTION],
      ]),
    );
    return rows;
  },
});

/**
 * Spills a Prony table (relaxation times s, moduli MPa, shift law) fitted to relaxation or creep curves at several temperatures; pass it as the material of any function. Fit quality and notes below. Screening estimate.
 * @customfunction FITCURVES
 * @param data_range Curve table range: header temperature_C, time_h (or time_s), modulus_MPa (or creep_modulus_MPa, compliance_1/MPa); one row per point, each curve's rows together.
 * @param [tg] Glass transition temperature, degC: WLF at and above it, Arrhenius below; without it WLF throughout.
 * @param [reference] Reference temperature of the master curve, degC: one of the curve temperatures; the median one if left empty.
 * @param [terms_per_decade] Prony terms per decade of time, count 1 to 10; if left empty 1, raised up to 4 where 1 cannot follow the curve.
 * @returns {any[][]} Prony table (prony, name, reference_C, shiftLaw, constants, E_inf_MPa, tau_s | E_MPa rows), then rows starting with # for quality, fit, notes and caution.
 */
export function fitcurves(data_range: unknown[][], tg?: unknown, reference?: unknown, terms_per_decade?: unknown) {
  return FITCURVES.invoke(data_range, tg, reference, terms_per_decade);
}

/** log10 aT of the fitted law at T (K), referred to the master curve's reference; the law of fitShiftLaw. */
function lawLog10(law: ShiftLawFit, TK: number): number {
  const arrhenius = (T: number, T0: number): number => ((law.EakJmol ?? 0) * 1000 * (1 / T - 1 / T0)) / (GAS_CONSTANT * Math.LN10);
  if (law.law === 'arrhenius') return arrhenius(TK, law.referenceK);
  const wlf = (T: number): number => wlfLog10(T, law.referenceK, law.C1 ?? 0, law.C2K ?? 1);
  if (law.law === 'hybrid' && law.TgK !== null && TK < law.TgK) return wlf(law.TgK) + arrhenius(TK, law.TgK);
  return wlf(TK);
}

/** Summary rows below the curves: reference, law, Tg, C1, C2, Ea, quality, notes, caution. */
const SHIFT_SUMMARY_ROWS = 9;

export const SHIFTS = defineMatrix({
  id: 'SHIFTS',
  args: [curves('data_range'), optionalTemperature('tg'), optionalTemperature('reference')],
  spillSize: ([data]) => {
    const n = dataRows(data);
    // At most one curve per five data rows (testdata.ts MIN_POINTS_PER_CURVE), one header row.
    return n === undefined ? undefined : [1 + Math.floor(n / 5) + SHIFT_SUMMARY_ROWS, 4];
  },
  spillFits: 'at-most',
  run: (set: CurveSet, tg, reference) => {
    const { referenceK, shifts } = shiftCurves(set, reference, tg ?? null);
    const law = fitShiftLaw(shifts, referenceK, tg ?? null);
    const overlap = overlapRms(shifts);
    const quality = worst(qualityFromRmsLog10(overlap), law.quality);
    const C = (K: number): number => sig(K - KELVIN_OFFSET);
    const out: OutCell[][] = [['temperature_C', 'log10_aT', 'law_log10_aT', 'overlap_rms_decades']];
    for (const s of shifts) out.push([C(s.temperatureK), s.log10aT, lawLog10(law, s.temperatureK), s.rmsLog10]);
    const v = (x: number | null): OutCell => (x === null ? null : x);
    out.push(
      ['reference_C', C(referenceK), null, 'curve temperature the shifts and constants are referred to'],
      ['shiftLaw', law.law, null, 'wlf; arrhenius; hybrid = Arrhenius below Tg, WLF above'],
      ['Tg_C', law.TgK === null ? null : C(law.TgK), null, law.TgK === null ? 'not given' : 'given'],
      ['C1', v(law.C1), null, law.fitted.wlf ? 'WLF, fitted, referred to reference_C' : 'not fitted'],
      ['C2_K', v(law.C2K), null, law.fitted.wlf ? 'WLF, fitted, K, referred to reference_C' : 'not fitted'],
      [
        'Ea_kJmol',
        v(law.EakJmol),
        null,
        law.fitted.arrhenius
          ? 'Arrhenius below Tg, fitted, kJ/mol'
          : law.EakJmol === null
            ? 'not used'
            : 'Arrhenius below Tg, not fitted (no curve below Tg), kJ/mol',
      ],
      [
        'quality',
        QUALITY_MEANING[quality],
        null,
        `shift law RMS ${sig(law.rmsLog10)} decades of log10 aT over ${law.points} curves (good up to 0.1); overlap RMS ${sig(overlap)} decades (good up to 0.02)`,
      ],
      ['notes', notesText(law.notes), null, null],
      ['caution', FIT_CAUTION, null, null],
    );
    return out;
  },
});

/**
 * Spills the shift factor log10 aT of each curve (by overlap, and by the fitted law) and the fitted WLF C1, C2 and Arrhenius Ea, with the quality and notes. Screening estimate.
 * @customfunction SHIFTS
 * @param data_range Curve table range: header temperature_C, time_h (or time_s), modulus_MPa (or creep_modulus_MPa, compliance_1/MPa); one row per point, each curve's rows together.
 * @param [tg] Glass transition temperature, degC: WLF at and above it, Arrhenius below; without it WLF throughout.
 * @param [reference] Reference temperature, degC: one of the curve temperatures; the median one if left empty.
 * @returns {any[][]} Table: temperature_C, log10_aT, law_log10_aT, overlap_rms_decades per curve, then reference_C, shiftLaw, Tg_C, C1, C2_K, Ea_kJmol, quality, notes, caution.
 */
export function shifts(data_range: unknown[][], tg?: unknown, reference?: unknown) {
  return SHIFTS.invoke(data_range, tg, reference);
}
