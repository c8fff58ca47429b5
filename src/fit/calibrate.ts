/**
 * Kept whole at about 630 lines: the calibration is one algorithm (inputs, choice of free parameters, rounds of
 * least squares, the check of what moved) whose steps share private state and read best in order.
 *
 * Datasheet calibration: from a few datasheet numbers (short-term modulus at 23 degC, HDT at one or
 * more ISO 75 stresses, Tg, Tm, creep or relaxation moduli at a time and temperature) and a starting
 * family or parameter record, a parameter record that reproduces them, with the reproduction of every
 * input shown beside it.
 *
 * Tg, Tm and (for records anchored on E23) the 23 degC modulus set their own parameter directly. Every
 * other input is reproduced by freeing one parameter for it, chosen in a fixed order of preference per
 * input and kind (FREE_PREFERENCE), skipping parameters the input does not move or that duplicate one
 * already freed. The free parameters are then fitted by bounded least squares (lsq.ts) on residuals
 * scaled by each input's tolerance. Inputs that cannot determine the parameters asked for are refused
 * with a message naming them.
 */
import { InputError, ParameterError } from '../base/errors.js';
import { creepModulusMPa } from '../answers/creep.js';
import { simulateHdt, HDT_MAX_C } from '../answers/hdt.js';
import { boundedLeastSquares, type FreeParameter } from '../numeric/lsq.js';
import { norm2 } from '../numeric/arrays.js';
import { compileMaterial, DATASHEET_TIME_S, modulusMPa, T23_K, type Material } from '../material/model.js';
import { fieldSpec, NUMERIC_FIELDS, type Kind, type MaterialParams, type NumericField } from '../material/params.js';
import { isPronySpec } from '../material/pronymaterial.js';
import type { MaterialInput } from '../material/resolve.js';
import { isHumid } from '../material/humidity.js';
import { getGrade } from '../material/grade.js';
import { FILLERS, FLOW_ALIGN } from '../material/filler.js';
import { KELVIN_OFFSET } from '../base/units.js';
import { longTermChanges, LONG_TERM_S, type LongTermChange } from './longterm.js';

/** An HDT datum: the temperature (K) at which the ISO 75 end point is reached under a flexural stress (MPa). */
export interface HdtDatum {
  readonly stressMPa: number;
  readonly temperatureK: number;
}

/** A creep modulus (stress / creep strain) or relaxation modulus at a time (s) and temperature (K). */
export interface ModulusDatum {
  readonly kind: 'creep' | 'relaxation';
  readonly timeS: number;
  readonly temperatureK: number;
  readonly modulusMPa: number;
}

/** The datasheet numbers a calibration may use; give any subset. */
export interface DatasheetInputs {
  /** Short-term modulus at 23 degC (ISO 527 tensile, about 10 s), MPa. */
  readonly modulus23MPa?: number;
  /** HDT values, e.g. method A (1.80 MPa) and B (0.45 MPa). */
  readonly hdt?: readonly HdtDatum[];
  /** Glass transition temperature (DSC), K. */
  readonly TgK?: number;
  /** Melting peak temperature (DSC), K; semi-crystalline only. */
  readonly TmK?: number;
  /** Creep or relaxation moduli. */
  readonly moduli?: readonly ModulusDatum[];
}

export interface CalibrateOptions {
  /** Parameters to fit instead of the automatic choice; at most one per fitted input. */
  readonly free?: readonly NumericField[];
  /** id and name of the calibrated record (default: the start id with '-cal'). */
  readonly id?: string;
  readonly name?: string;
}

/** Tolerance of an HDT datum, K: datasheets quote HDT to 1 K and laboratories agree within about 2 K (common practice, from memory). */
export const HDT_TOLERANCE_K = 2;
/** Tolerance of a modulus datum, relative (5 %; common practice for repeat tensile and creep tests, from memory). */
export const MODULUS_TOLERANCE = 0.05;
/** Tolerance of Tg and Tm, K (set directly, so reproduced exactly). */
export const TRANSITION_TOLERANCE_K = 0.5;

/** Sum of squared scaled residuals at which a calibration counts as exact (every input within 1/1000 of its tolerance). */
export const CALIBRATION_COST_TOL = 1e-6;

/** How one input is reproduced by the calibrated record. */
export interface InputResidual {
  /** The input, in words: 'modulus at 23 degC', 'HDT 1.8 MPa', 'Tg', 'creep modulus 1000 h 23 degC'. */
  readonly input: string;
  readonly unit: 'MPa' | 'degC';
  readonly given: number;
  /** null: the model does not reach an HDT end point below 500 degC. */
  readonly reproduced: number | null;
  /** reproduced - given (degC or MPa). */
  readonly difference: number | null;
  /** Difference in units of the input's tolerance (log ratio / 5 % for moduli). */
  readonly scaled: number | null;
  readonly tolerance: string;
  readonly within: boolean;
  /** The parameter this input was set or fitted through ('' when fitted by the others). */
  readonly via: string;
}

export interface FreeResult {
  readonly field: NumericField;
  readonly start: number;
  readonly value: number;
  readonly atBound: boolean;
  /** The value of the bundled family the record comes from (null: not a bundled family's record). */
  readonly familyDefault: number | null;
  /** The family's typical range of this parameter, where the record carries one (Tg_C, Tm_C, E23_MPa); else null. */
  readonly familyLow: number | null;
  readonly familyHigh: number | null;
}

export type CalibrationQuality = 'good' | 'fair' | 'poor';

export interface CalibrationResult {
  /** The calibrated record: pass it to any engine function. */
  readonly params: MaterialParams;
  readonly free: readonly FreeResult[];
  readonly residuals: readonly InputResidual[];
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: string;
  /**
   * good: every input within its tolerance; fair: within three tolerances, or good but with long-term answers
   * moved more than the inputs justify or a fitted parameter far from its family (farFromFamily); poor: otherwise
   * or not converged.
   */
  readonly quality: CalibrationQuality;
  readonly notes: readonly string[];
  /** The bundled family whose defaults stand beside the fitted values (null: the start is not a family's record). */
  readonly family: string | null;
  /** Long-term answers before and after (empty when a long-term modulus was an input or nothing was fitted). */
  readonly longTerm: readonly LongTermChange[];
}

/**
 * Order in which parameters are freed for each kind of input. HDT at the highest stress first, then
 * lower stresses, then moduli; each takes the first candidate that moves it and is not taken.
 * Choices (set here, from the model's sensitivities): an amorphous or crosslinked HDT is where the
 * as-moulded bar's clock reaches its time scale, so it moves first with the state of the bar (its excess
 * fictive temperature at high stress, the TNM nonlinearity x at low stress, which sets the gap between
 * HDT/A and HDT/B), which no service answer depends on; then with the glassy slope, and only then with
 * the relaxation spectrum (tauTg, beta) and Tg, which move the long-term answers too. A semi-crystalline HDT
 * at high stress moves with the crystal plateau (crystallinity), at low stress with the melting law;
 * where both HDTs lie in the melting range those two move them alike, and the breadth or time scale of
 * the amorphous phase's transition (beta, tauTg) separates them.
 * A long-time modulus below Tg moves with the slow-creep exponent, then with its activation energy; a hot modulus of
 * a crystal-mobile polymer then with the exponent's rise with temperature (creepRise_perK; never freed for a
 * crystal-fixed one, whose slow creep is no alpha_c process).
 */
export const FREE_PREFERENCE: Record<Kind, { hdtHigh: NumericField[]; hdtLow: NumericField[]; modulus: NumericField[] }> = {
  amorphous: {
    hdtHigh: ['fictiveExcess_K', 'glassySlope_perK', 'tauTg_s', 'beta', 'Tg_C', 'creepN'],
    hdtLow: ['tnmX', 'beta', 'tauTg_s', 'Tg_C', 'C1'],
    modulus: ['creepN', 'creepEa_kJmol', 'beta', 'plateau_MPa'],
  },
  semicrystalline: {
    hdtHigh: ['crystallinity', 'meltSharpness', 'creepN', 'beta', 'tauTg_s'],
    hdtLow: ['meltSharpness', 'crystallinity', 'creepN', 'creepEa_kJmol', 'beta', 'tauTg_s'],
    modulus: ['creepN', 'creepEa_kJmol', 'creepRise_perK', 'crystallinity', 'beta'],
  },
  crosslinked: {
    hdtHigh: ['fictiveExcess_K', 'glassySlope_perK', 'tauTg_s', 'beta', 'Tg_C', 'creepN'],
    hdtLow: ['tnmX', 'beta', 'tauTg_s', 'Tg_C'],
    modulus: ['creepN', 'creepEa_kJmol', 'Mc_kgmol', 'beta'],
  },
};

/**
 * A filled grade's datasheet modulus and HDT move first with the filler (set here: the matrix is the bundled
 * family's, known better than how a given grade's fibres are oriented and broken): the 23 degC modulus with the
 * orientation, then the aspect ratio; an HDT with the aspect ratio (it sets how much the fibres stiffen the
 * softened matrix), then the orientation; only then with the matrix parameters.
 */
export const FILLER_FREE_PREFERENCE: { modulus: NumericField[]; hdt: NumericField[] } = {
  modulus: ['fillerAlign', 'fillerAspect'],
  hdt: ['fillerAspect', 'fillerAlign'],
};

/** Search bounds of a free parameter (tighter than the record's validity range where noted). */
function boundsOf(field: NumericField, p: MaterialParams): { min: number; max: number; log: boolean } {
  const spec = fieldSpec(field);
  const v = p[field];
  switch (field) {
    case 'Tg_C':
      return { min: Math.max(spec.min, (v ?? 0) - 80), max: Math.min(spec.max, (v ?? 0) + 80), log: false };
    case 'Tm_C':
      return { min: Math.max(spec.min, (v ?? 0) - 60), max: Math.min(spec.max, (v ?? 0) + 60), log: false };
    case 'crystallinity':
      return { min: spec.min, max: Math.min(spec.max, p.crystalContinuity), log: false };
    case 'creepN':
    case 'beta':
    case 'tnmX':
    case 'fictiveExcess_K':
    case 'glassySlope_perK':
    case 'flowBeta':
    case 'crystalContinuity':
      return { min: spec.min, max: spec.max, log: false };
    case 'C1':
    case 'C2_K':
      return { min: spec.min, max: spec.max, log: false };
    // A datasheet modulus is along flow: from random in the plane to fully aligned (set here).
    case 'fillerAlign':
      return { min: 0.5, max: 1, log: false };
    // Aspect ratios after moulding (set here: 3 to 100 spans short-glass, carbon and platelet fillers, from memory).
    case 'fillerAspect':
      return { min: 3, max: 100, log: true };
    default:
      return { min: spec.min, max: spec.max, log: spec.min > 0 };
  }
}

interface FitInput {
  readonly label: string;
  readonly unit: 'MPa' | 'degC';
  readonly given: number;
  readonly tolerance: string;
  /** Reproduced value on the given material (null: HDT not reached). */
  readonly evaluate: (m: Material) => number | null;
  /** Scaled residual. */
  readonly scale: (reproduced: number | null) => number;
  readonly candidates: readonly NumericField[];
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

function timeLabel(tS: number): string {
  const h = tS / 3600;
  return h >= 1 ? `${fmt(h)} h` : `${fmt(tS)} s`;
}

function checkPositive(v: number | undefined, argument: string): void {
  if (v !== undefined && (!(v > 0) || !Number.isFinite(v))) throw new InputError(argument, `must be a positive finite number, got ${v}`);
}

function startParams(start: MaterialInput): MaterialParams {
  if (isPronySpec(start)) {
    throw new InputError('start', 'a Prony material cannot be calibrated from datasheet points; start from a family or a parameter record');
  }
  const p = typeof start === 'string' ? getGrade(start).params : start;
  compileMaterial(p);
  return { ...p };
}

/** Removes the band ranges (they are re-attached, moved with their centre, at the end). */
function withoutRanges(p: MaterialParams): MaterialParams {
  return { ...p, Tg_low_C: null, Tg_high_C: null, Tm_low_C: null, Tm_high_C: null, E23_low_MPa: null, E23_high_MPa: null };
}

function clampField(field: NumericField, v: number): number {
  const s = fieldSpec(field);
  return Math.min(s.max, Math.max(s.min, v));
}

/** The start record's ranges moved with their centre (Tg, Tm shifted; E23 scaled), clipped to validity. */
function reattachRanges(fitted: MaterialParams, start: MaterialParams): MaterialParams {
  const out = { ...fitted };
  const shift = (lo: NumericField, mid: NumericField, hi: NumericField, mode: 'add' | 'mul'): void => {
    const s0 = start[mid];
    const s1 = out[mid];
    const l = start[lo];
    const h = start[hi];
    if (s0 === null || s1 === null) {
      (out as Record<string, unknown>)[lo] = null;
      (out as Record<string, unknown>)[hi] = null;
      return;
    }
    const move = (x: number | null): number | null => (x === null ? null : clampField(lo, mode === 'add' ? x + (s1 - s0) : x * (s1 / s0)));
    (out as Record<string, unknown>)[lo] = l === null ? null : Math.min(move(l) ?? s1, s1);
    (out as Record<string, unknown>)[hi] = h === null ? null : Math.max(move(h) ?? s1, s1);
  };
  shift('Tg_low_C', 'Tg_C', 'Tg_high_C', 'add');
  shift('Tm_low_C', 'Tm_C', 'Tm_high_C', 'add');
  shift('E23_low_MPa', 'E23_MPa', 'E23_high_MPa', 'mul');
  return out;
}

/** Calibrates a parameter record to datasheet inputs. Throws InputError when the inputs cannot do it. */
export function calibrateDatasheet(start: MaterialInput, inputs: DatasheetInputs, options: CalibrateOptions = {}): CalibrationResult {
  const p0 = startParams(start);
  const kind = p0.kind;
  const pref = FREE_PREFERENCE[kind];
  const notes: string[] = [];
  checkPositive(inputs.modulus23MPa, 'modulus23');
  checkPositive(inputs.TgK, 'Tg');
  checkPositive(inputs.TmK, 'Tm');
  const base: MaterialParams = withoutRanges(p0);
  const filled = p0.filler !== 'none' && p0.fillerMass_pct > 0;
  if (p0.filler !== 'none' && filled) {
    // The filler's defaults written out, so the fit starts from them and the record shows what it used.
    base.fillerAspect = p0.fillerAspect ?? FILLERS[p0.filler].aspect;
    base.fillerAlign = p0.fillerAlign ?? FLOW_ALIGN;
  }
  base.id = options.id ?? `${p0.id}-cal`;
  base.name = options.name ?? `${p0.name} (calibrated)`;
  const direct = new Map<NumericField, string>();
  const fits: FitInput[] = [];
  const residualRows: { input: string; unit: 'MPa' | 'degC'; given: number; via: NumericField; evaluate: (m: Material) => number }[] = [];

  // A humid start (a conditioned polyamide) holds the dry Tg_C and E23_MPa; the datasheet gives the grade in
  // its humid state, so its Tg and 23 degC modulus are met by fitting those dry values, not by setting them.
  const humid = isHumid(p0);
  if (inputs.TgK !== undefined && humid) {
    const given = inputs.TgK - KELVIN_OFFSET;
    fits.push({
      label: 'Tg',
      unit: 'degC',
      given,
      tolerance: `${HDT_TOLERANCE_K} K`,
      evaluate: (m) => m.shift.TrefK - KELVIN_OFFSET,
      scale: (r) => ((r ?? NaN) - given) / HDT_TOLERANCE_K,
      candidates: ['Tg_C'],
    });
  } else if (inputs.TgK !== undefined) {
    base.Tg_C = inputs.TgK - KELVIN_OFFSET;
    direct.set('Tg_C', 'Tg');
    residualRows.push({ input: 'Tg', unit: 'degC', given: base.Tg_C, via: 'Tg_C', evaluate: (m) => m.params.Tg_C });
  }
  if (inputs.TmK !== undefined) {
    if (kind !== 'semicrystalline') throw new InputError('Tm', `is only used for semi-crystalline materials; '${p0.id}' is ${kind}`);
    base.Tm_C = inputs.TmK - KELVIN_OFFSET;
    direct.set('Tm_C', 'Tm');
    residualRows.push({ input: 'Tm', unit: 'degC', given: base.Tm_C, via: 'Tm_C', evaluate: (m) => m.params.Tm_C ?? NaN });
  }
  const modulusAt23 = (m: Material): number => modulusMPa(m, DATASHEET_TIME_S, T23_K);
  if (inputs.modulus23MPa !== undefined) {
    const E = inputs.modulus23MPa;
    if (!filled && p0.E23_MPa !== null && !humid) {
      base.E23_MPa = E;
      direct.set('E23_MPa', 'modulus at 23 degC');
      residualRows.push({ input: 'modulus at 23 degC', unit: 'MPa', given: E, via: 'E23_MPa', evaluate: modulusAt23 });
    } else {
      // E23_MPa of a filled record is the matrix's: the grade's modulus is fitted, through the filler first.
      const anchor: NumericField = p0.E23_MPa !== null ? 'E23_MPa' : 'Eg_MPa';
      fits.push({
        label: 'modulus at 23 degC',
        unit: 'MPa',
        given: E,
        tolerance: `${MODULUS_TOLERANCE * 100} %`,
        evaluate: modulusAt23,
        scale: (r) => Math.log((r ?? 0) / E) / MODULUS_TOLERANCE,
        candidates: filled ? [...FILLER_FREE_PREFERENCE.modulus, anchor] : kind === 'crosslinked' ? ['Mc_kgmol', 'Eg_MPa'] : [anchor],
      });
    }
  }
  const hdts = [...(inputs.hdt ?? [])].sort((a, b) => b.stressMPa - a.stressMPa);
  const seenStress = new Set<number>();
  hdts.forEach((h, i) => {
    checkPositive(h.stressMPa, 'hdt stress');
    checkPositive(h.temperatureK, 'hdt temperature');
    if (seenStress.has(h.stressMPa)) throw new InputError('hdt', `two HDT values are given for ${h.stressMPa} MPa; give one per stress`);
    seenStress.add(h.stressMPa);
    const given = h.temperatureK - KELVIN_OFFSET;
    fits.push({
      label: `HDT ${fmt(h.stressMPa)} MPa`,
      unit: 'degC',
      given,
      tolerance: `${HDT_TOLERANCE_K} K`,
      evaluate: (m) => simulateHdt(m, h.stressMPa).temperatureC,
      scale: (r) => ((r ?? HDT_MAX_C) - given) / HDT_TOLERANCE_K,
      candidates: [...(filled ? FILLER_FREE_PREFERENCE.hdt : []), ...(i === 0 ? pref.hdtHigh : pref.hdtLow)],
    });
  });
  for (const d of inputs.moduli ?? []) {
    checkPositive(d.timeS, `${d.kind} time`);
    checkPositive(d.temperatureK, `${d.kind} temperature`);
    checkPositive(d.modulusMPa, `${d.kind} modulus`);
    const label = `${d.kind} modulus ${timeLabel(d.timeS)} ${fmt(d.temperatureK - KELVIN_OFFSET)} degC`;
    const E = d.modulusMPa;
    fits.push({
      label,
      unit: 'MPa',
      given: E,
      tolerance: `${MODULUS_TOLERANCE * 100} %`,
      evaluate: (m) => (d.kind === 'creep' ? creepModulusMPa(m, d.timeS, d.temperatureK) : modulusMPa(m, d.timeS, d.temperatureK)),
      scale: (r) => Math.log((r ?? 0) / E) / MODULUS_TOLERANCE,
      candidates:
        p0.kind === 'semicrystalline' && p0.crystalMobility === 0 ? pref.modulus.filter((f) => f !== 'creepRise_perK') : pref.modulus,
    });
  }
  if (fits.length === 0 && direct.size === 0) {
    throw new InputError('inputs', 'give at least one datasheet input (modulus at 23 degC, HDT, Tg, Tm, or a creep or relaxation modulus)');
  }
  // The start with the direct inputs applied must itself be a valid material.
  try {
    compileMaterial(base);
  } catch (e) {
    if (e instanceof ParameterError) {
      throw new InputError('inputs', `the directly set inputs (${[...direct.values()].join(', ')}) give an invalid record: ${e.message}`);
    }
    throw e;
  }

  const build = (fields: readonly NumericField[], values: readonly number[]): MaterialParams => {
    const q = { ...base };
    fields.forEach((f, i) => ((q as Record<string, unknown>)[f] = values[i]));
    return q;
  };
  const scaledResiduals = (fields: readonly NumericField[], values: readonly number[]): number[] => {
    const m = compileMaterial(build(fields, values));
    return fits.map((f) => f.scale(f.evaluate(m)));
  };

  const free = chooseFree(fits, base, direct, options.free, notes);
  let fitted = base;
  let iterations = 0;
  let converged = true;
  let reason = 'exact';
  const freeResults: FreeResult[] = [];
  const defaults = familyDefaults(p0);
  if (free.length > 0) {
    const fp: FreeParameter[] = free.map((f) => {
      const b = boundsOf(f.field, base);
      return { name: f.field, start: Math.min(b.max, Math.max(b.min, base[f.field] ?? b.min)), ...b };
    });
    const fields = free.map((f) => f.field);
    const r = boundedLeastSquares(fp, (v) => scaledResiduals(fields, v), CALIBRATION_COST_TOL);
    fitted = build(fields, r.values);
    iterations = r.iterations;
    converged = r.converged;
    reason = r.reason;
    fp.forEach((p, i) => {
      const field = fields[i]!;
      freeResults.push({
        field,
        start: p.start,
        value: r.values[i]!,
        atBound: r.atBound.includes(p.name),
        ...familyColumns(defaults, field),
      });
    });
    for (const f of freeResults) {
      if (f.atBound) notes.push(`${f.field} ended on its search bound (${fmt(f.value)}); the inputs pull it further than the model allows`);
    }
  } else if (fits.length > 0) {
    reason = 'no free parameter';
  }
  const m = compileMaterial(fitted);
  const residuals: InputResidual[] = [];
  for (const row of residualRows) {
    const rep = row.evaluate(m);
    const diff = rep - row.given;
    const scaled = row.unit === 'MPa' ? Math.log(rep / row.given) / MODULUS_TOLERANCE : diff / TRANSITION_TOLERANCE_K;
    residuals.push({
      input: row.input,
      unit: row.unit,
      given: row.given,
      reproduced: rep,
      difference: diff,
      scaled,
      tolerance: row.unit === 'MPa' ? `${MODULUS_TOLERANCE * 100} %` : `${TRANSITION_TOLERANCE_K} K`,
      within: Math.abs(scaled) <= 1,
      via: row.via,
    });
  }
  for (const f of fits) {
    const rep = f.evaluate(m);
    const scaled = f.scale(rep);
    residuals.push({
      input: f.label,
      unit: f.unit,
      given: f.given,
      reproduced: rep,
      difference: rep === null ? null : rep - f.given,
      scaled,
      tolerance: f.tolerance,
      within: Math.abs(scaled) <= 1,
      via: free.find((x) => x.input === f.label)?.field ?? '',
    });
  }
  const worst = Math.max(0, ...residuals.map((r) => Math.abs(r.scaled ?? Infinity)));
  let quality: CalibrationQuality = worst <= 1 ? 'good' : worst <= 3 ? 'fair' : 'poor';
  if (!converged && quality !== 'good') quality = 'poor';
  if (!converged) notes.push(`the least-squares fit did not converge (${reason}); the record is the best point found`);
  // Long-term answers the inputs do not inform (no creep or relaxation datum at 100 h or more) must not move far.
  const informed = (inputs.moduli ?? []).some((d) => d.timeS >= LONG_TERM_S / 10);
  const longTerm = informed || freeResults.length === 0 ? [] : longTermChanges(base, fitted);
  const moved = longTerm.filter((c) => c.tooFar);
  if (moved.length > 0) {
    if (quality === 'good') quality = 'fair';
    notes.push(
      `the inputs do not inform the long term, but the calibration moved it: ${moved
        .map(
          (c) =>
            `${c.answer} ${fmt(c.before)} -> ${fmt(c.after)} ${c.unit} (${c.unit === 'MPa' ? `${fmt(c.unjustified * 100)} %` : `${fmt(c.unjustified)} K`} beyond what the inputs justify)`,
        )
        .join('; ')}; give a creep modulus, or fit other parameters`,
    );
  }
  const far = freeResults.filter((f) => farFromFamily(f));
  if (far.length > 0) {
    if (quality === 'good') quality = 'fair';
    notes.push(
      `the calibration moved ${far.map((f) => `${f.field} far from the ${defaults?.id ?? 'family'} value (${fmt(f.familyDefault ?? NaN)} -> ${fmt(f.value)})`).join('; ')}: a grade this far from its family is better described by its own test data, and answers the inputs do not cover may have moved with it`,
    );
  }
  if (quality === 'poor' && fits.some((f) => f.label.startsWith('HDT') && !residuals.find((x) => x.input === f.label)?.within)) {
    notes.push(
      'an HDT is a threshold crossing: where the modulus runs close to the end-point modulus over a range of temperature, the simulated HDT jumps between regimes and some datasheet pairs cannot be met together; calibrate to fewer inputs, or choose other parameters to fit',
    );
  }
  return {
    params: reattachRanges(fitted, p0),
    free: freeResults,
    residuals,
    iterations,
    converged,
    reason,
    quality,
    notes,
    family: defaults?.id ?? null,
    longTerm,
  };
}

/** The fields whose family range the record carries, and the fields of that range. */
const RANGE_OF: Partial<Record<NumericField, readonly [NumericField, NumericField]>> = {
  Tg_C: ['Tg_low_C', 'Tg_high_C'],
  Tm_C: ['Tm_low_C', 'Tm_high_C'],
  E23_MPa: ['E23_low_MPa', 'E23_high_MPa'],
};

/** The family's default of a fitted field and its range where the family has one. */
function familyColumns(family: MaterialParams | null, field: NumericField): Pick<FreeResult, 'familyDefault' | 'familyLow' | 'familyHigh'> {
  const range = RANGE_OF[field];
  const value = (f: NumericField | undefined): number | null => (family && f ? family[f] : null) ?? null;
  return { familyDefault: value(field), familyLow: value(range?.[0]), familyHigh: value(range?.[1]) };
}

/**
 * Whether a fitted parameter ended far from its family (set here, a screening rule): outside the family's range
 * widened by its own width (at least 10 K for a temperature, 20 % for a modulus) where the family has a range;
 * otherwise more than a factor 10 away for a field whose bounds span two decades or more (a time scale), or more
 * than a quarter of the field's bounds away for any other. The calibration is then at best "fair".
 */
function farFromFamily(f: FreeResult): boolean {
  const d = f.familyDefault;
  if (d === null) return false;
  if (f.familyLow !== null && f.familyHigh !== null) {
    const w = Math.max(f.familyHigh - f.familyLow, f.field === 'E23_MPa' ? 0.2 * Math.abs(d) : 10);
    return f.value < f.familyLow - w || f.value > f.familyHigh + w;
  }
  const spec = fieldSpec(f.field);
  if (spec.min > 0 && spec.max / spec.min >= 100 && d > 0) return Math.abs(Math.log10(f.value / d)) > 1;
  return Math.abs(f.value - d) > 0.25 * (spec.max - spec.min);
}

/** The bundled family a record comes from (its id, or its id before '-cal'), or null. */
function familyDefaults(p: MaterialParams): MaterialParams | null {
  for (const id of [p.id, p.id.replace(/-cal$/i, '')]) {
    try {
      const f = getGrade(id).params;
      if (f.kind === p.kind) return f;
    } catch {
      // not a bundled family
    }
  }
  return null;
}

interface Chosen {
  readonly field: NumericField;
  readonly input: string;
}

/** Step in u (fraction of the search range) of the identifiability probe. */
const PROBE = 0.02;
/** Smallest change of a scaled residual over the whole search range that counts as "moves the input". */
const MIN_EFFECT = 0.2;
/** Smallest share of a new column that must lie outside the span of the columns already chosen. */
const MIN_INDEPENDENCE = 0.02;

function chooseFree(
  fits: readonly FitInput[],
  base: MaterialParams,
  direct: ReadonlyMap<NumericField, string>,
  requested: readonly NumericField[] | undefined,
  notes: string[],
): Chosen[] {
  if (fits.length === 0) {
    if (requested && requested.length > 0) {
      throw new InputError(
        'free',
        `${requested.join(', ')} cannot be fitted: the inputs given are all set directly (${[...direct.values()].join(', ')})`,
      );
    }
    return [];
  }
  const r0 = fitResiduals(fits, base);
  const column = (field: NumericField): number[] | null => {
    const b = boundsOf(field, base);
    const v0 = base[field];
    if (v0 === null) return null;
    const toU = (v: number): number =>
      b.log ? (Math.log10(v) - Math.log10(b.min)) / (Math.log10(b.max) - Math.log10(b.min)) : (v - b.min) / (b.max - b.min);
    const fromU = (u: number): number =>
      b.log ? 10 ** (Math.log10(b.min) + u * (Math.log10(b.max) - Math.log10(b.min))) : b.min + u * (b.max - b.min);
    const u0 = Math.min(1, Math.max(0, toU(v0)));
    const h = u0 + PROBE <= 1 ? PROBE : -PROBE;
    try {
      const r1 = fitResiduals(fits, { ...base, [field]: fromU(u0 + h) });
      return r1.map((x, i) => (x - (r0[i] ?? 0)) / h);
    } catch {
      return null;
    }
  };
  const chosen: Chosen[] = [];
  const basis: number[][] = [];
  const tryAdd = (field: NumericField, input: string): 'ok' | 'no-effect' | 'dependent' => {
    const col = column(field);
    if (!col) return 'no-effect';
    const norm = norm2(col);
    if (!(norm >= MIN_EFFECT)) return 'no-effect';
    const rest = col.slice();
    for (const q of basis) {
      const d = rest.reduce((s, v, i) => s + v * (q[i] ?? 0), 0);
      for (let i = 0; i < rest.length; i++) rest[i] = (rest[i] ?? 0) - d * (q[i] ?? 0);
    }
    const restNorm = norm2(rest);
    if (!(restNorm >= MIN_INDEPENDENCE * norm)) return 'dependent';
    basis.push(rest.map((v) => v / restNorm));
    chosen.push({ field, input });
    return 'ok';
  };
  const labels = fits.map((f) => f.label);
  if (requested && requested.length > 0) {
    const seen = new Set<string>();
    for (const f of requested) {
      const spec = NUMERIC_FIELDS.find((s) => s.key === f);
      if (!spec) throw new InputError('free', `'${f}' is not a parameter name`);
      if (!spec.kinds.includes(base.kind)) throw new InputError('free', `${f} is not used by a ${base.kind} material`);
      if (seen.has(f)) throw new InputError('free', `${f} is listed twice`);
      seen.add(f);
      if (direct.has(f)) throw new InputError('free', `${f} is set directly by the input ${direct.get(f)}; it cannot also be fitted`);
      if (f === 'E23_MPa' || f === 'Eg_MPa') {
        if (base[f] === null)
          throw new InputError('free', `${f} is empty in the start record; the record is anchored on the other of E23_MPa and Eg_MPa`);
      }
    }
    if (requested.length > fits.length) {
      throw new InputError(
        'free',
        `${requested.length} parameters (${requested.join(', ')}) cannot be determined by ${fits.length} fitted input${fits.length === 1 ? '' : 's'} (${labels.join(', ')}); free at most ${fits.length}`,
      );
    }
    for (const f of requested) {
      const res = tryAdd(f, '');
      if (res === 'no-effect') {
        throw new InputError(
          'free',
          `the inputs ${labels.join(', ')} do not move ${f} (changing it over its range changes them by less than a fifth of their tolerance); they cannot determine it`,
        );
      }
      if (res === 'dependent') {
        throw new InputError(
          'free',
          `the inputs ${labels.join(', ')} cannot determine ${chosen.map((c) => c.field).join(', ')} and ${f} together: their effects on the inputs are nearly proportional`,
        );
      }
    }
    return chosen;
  }
  for (const f of fits) {
    let placed = false;
    for (const field of f.candidates) {
      if (direct.has(field) || chosen.some((c) => c.field === field) || base[field] === null) continue;
      if (tryAdd(field, f.label) === 'ok') {
        placed = true;
        break;
      }
    }
    if (!placed)
      notes.push(`no further parameter moves '${f.label}' independently of the others; it is fitted in the least-squares sense with them`);
  }
  if (chosen.length === 0) {
    throw new InputError(
      'inputs',
      `${labels.join(', ')} cannot be reproduced: none of the parameters that could carry ${fits.length === 1 ? 'it' : 'them'} (${[...new Set(fits.flatMap((f) => f.candidates))].join(', ')}) moves ${fits.length === 1 ? 'it' : 'them'} for this material`,
    );
  }
  return chosen;
}

function fitResiduals(fits: readonly FitInput[], p: MaterialParams): number[] {
  const m = compileMaterial(p);
  return fits.map((f) => f.scale(f.evaluate(m)));
}

/**
 * The check table of a calibration as worksheet rows: a header, then one row per input (input, given,
 * reproduced, unit, tolerance, within, set through). For a wrapper that spills it beside the record.
 */
export function calibrationCheckRows(r: CalibrationResult): (string | number)[][] {
  return [
    ['input', 'given', 'reproduced', 'unit', 'tolerance', 'within', 'set through'],
    ...r.residuals.map((x) => [x.input, x.given, x.reproduced ?? 'not reached', x.unit, x.tolerance, x.within ? 'yes' : 'no', x.via]),
  ];
}

/** Column heads of the fitted-parameter table, the same words in the worksheet, the CLI and the pane. */
export const FITTED_HEADER = [
  'fitted parameter',
  'start',
  'calibrated',
  'family default',
  'family low',
  'family high',
  'on search bound',
] as const;

/**
 * The fitted parameters of a calibration as rows under FITTED_HEADER: the start value, the calibrated one,
 * the bundled family's default and range beside them (null where there is none), whether it ended on a bound.
 */
export function calibrationFittedRows(r: CalibrationResult): (string | number | null)[][] {
  return r.free.map((f) => [f.field, f.start, f.value, f.familyDefault, f.familyLow, f.familyHigh, f.atBound ? 'yes' : 'no']);
}
