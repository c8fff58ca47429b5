// @load on-first-call
/**
 * Datasheet calibration: a parameter block that reproduces the user's numbers, and the table that
 * shows how well. In Excel this file is loaded on the first call of one of its functions (the
 * least-squares engine is too big for the start-up script; see scripts/build/20-functions.mjs).
 */
import {
  calibrateDatasheet,
  calibrationCheckRows,
  calibrationFittedRows,
  checkHdtOrder,
  FITTED_HEADER,
  checkMelting,
  HDT_METHODS,
  InputError,
  KELVIN_OFFSET,
  kelvinToC,
  type CalibrationResult,
  type DatasheetInputs,
  type HdtPoint,
  type MaterialParams,
  type NumericField,
} from '../src/index.js';
import { fields } from './core/args/fields.js';
import { start } from './core/args/material.js';
import { modulus } from './core/args/modulus.js';
import { fromInput, problem } from './core/args/spec.js';
import { glassTransition, hdtTemperature, melting, optionalTemperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { BLOCK_COLUMNS, BLOCK_ROWS } from './core/block.js';
import type { OutCell } from './core/cells.js';
import { defineMatrix } from './core/define.js';
import { fittedBlock, FIT_CAUTION, BLOCK_COMMENT_ROWS, freeText, notesText, QUALITY_MEANING, sig } from './core/fitout.js';
/** Time and temperature of a creep modulus when only the modulus is given: the 1000 h, 23 degC creep modulus of ISO 899-1 data sheets (common practice). */
const CREEP_DEFAULT_TIME_S = 1000 * 3600;
const CREEP_DEFAULT_TEMP_K = 23 + KELVIN_OFFSET;

/** Engine argument names to the worksheet's. */
const ARGUMENT: Record<string, string> = {
  Tg: 'tg',
  Tm: 'tm',
  'hdt stress': 'hdt_a',
  'hdt temperature': 'hdt_a',
  'creep time': 'creep_time',
  'creep temperature': 'creep_temp',
  'creep modulus': 'creep_modulus',
};

const CALIBRATE_ARGS = [
  start('start'),
  modulus('modulus23', { optional: true }),
  hdtTemperature('hdt_a'),
  hdtTemperature('hdt_b'),
  glassTransition('tg'),
  melting('tm'),
  time('creep_time', { optional: true }),
  optionalTemperature('creep_temp'),
  modulus('creep_modulus', { optional: true }),
  fields('free'),
] as const;

type Parsed = [
  MaterialParams,
  number | undefined,
  number | undefined,
  number | undefined,
  number | undefined,
  number | undefined,
  number | undefined,
  number | undefined,
  number | undefined,
  NumericField[] | undefined,
];

/** The last few calibrations, so that CALIBRATE and CALCHECK with the same arguments fit once. */
const RECENT = new Map<string, CalibrationResult>();
const RECENT_MAX = 8;

function runCalibration(...[p, m23, hdtA, hdtB, tg, tm, creepT, creepK, creepE, free]: Parsed): CalibrationResult {
  if (creepE === undefined && (creepT !== undefined || creepK !== undefined)) {
    throw problem(
      'creep_modulus',
      `is missing: ${creepT !== undefined ? 'creep_time' : 'creep_temp'} is given, so give the creep modulus measured there (or clear it)`,
    );
  }
  // The same checks as the CLI and the pane make (src/input/); a value is shown in degC as the sheet holds it.
  const typed = (K: number): number => Math.round(kelvinToC(K) * 1e9) / 1e9;
  const hdt: HdtPoint[] = [
    ...(hdtA !== undefined ? [{ stressMPa: HDT_METHODS.A, temperatureK: hdtA, raw: typed(hdtA), name: 'hdt_a' }] : []),
    ...(hdtB !== undefined ? [{ stressMPa: HDT_METHODS.B, temperatureK: hdtB, raw: typed(hdtB), name: 'hdt_b' }] : []),
  ];
  fromInput(() => {
    checkHdtOrder(hdt);
    if (tm !== undefined) checkMelting(tm, typed(tm), tg, p, 'tm');
  });
  const inputs: DatasheetInputs = {
    ...(m23 !== undefined ? { modulus23MPa: m23 } : {}),
    ...(tg !== undefined ? { TgK: tg } : {}),
    ...(tm !== undefined ? { TmK: tm } : {}),
    hdt: hdt.map((h) => ({ stressMPa: h.stressMPa, temperatureK: h.temperatureK })),
    moduli:
      creepE === undefined
        ? []
        : [{ kind: 'creep', timeS: creepT ?? CREEP_DEFAULT_TIME_S, temperatureK: creepK ?? CREEP_DEFAULT_TEMP_K, modulusMPa: creepE }],
  };
  const key = JSON.stringify([p, inputs, free ?? null]);
  const cached = RECENT.get(key);
  if (cached) return cached;
  let r: CalibrationResult;
  try {
    r = calibrateDatasheet(p, inputs, free ? { free } : {});
  } catch (e) {
    if (e instanceof InputError && e.argument in ARGUMENT) throw problem(ARGUMENT[e.argument] ?? e.argument, e.problem);
    throw e;
  }
  if (RECENT.size >= RECENT_MAX) RECENT.delete(RECENT.keys().next().value ?? '');
  RECENT.set(key, r);
  return r;
}

const QUALITY_RULE =
  'good: every input within its tolerance; fair: within three tolerances, or the long-term answers moved more than the inputs justify; poor: otherwise, or not converged';

function how(r: CalibrationResult): string {
  const within = r.residuals.filter((x) => x.within).length;
  return `${within} of ${r.residuals.length} inputs reproduced within tolerance (DERATE.CALCHECK lists them); fitted ${freeText(r.free)}; ${r.iterations} iterations, ${r.converged ? 'converged' : `not converged (${r.reason})`}`;
}

export const CALIBRATE = defineMatrix({
  id: 'CALIBRATE',
  args: CALIBRATE_ARGS,
  spillSize: () => [BLOCK_ROWS + BLOCK_COMMENT_ROWS, BLOCK_COLUMNS],
  run: (...v) => {
    const r = runCalibration(...(v as unknown as Parsed));
    return fittedBlock(r.params, r.free, r.quality, how(r), r.notes);
  },
});

/**
 * Spills a parameter block calibrated to datasheet numbers (PARAMS layout; pass it as the material of any function), with fit quality and notes below. Screening estimate: reproduces the given points, not the grade elsewhere.
 * @customfunction CALIBRATE
 * @param start Starting point: family symbol such as "PC", or a parameter block range from DERATE.PARAMS.
 * @param [modulus23] Short-term (tensile) modulus at 23 degC, MPa (or text with a unit such as "2.4 GPa").
 * @param [hdt_a] HDT at 1.80 MPa (ISO 75 method A), degC (or text with a unit).
 * @param [hdt_b] HDT at 0.45 MPa (ISO 75 method B), degC (or text with a unit).
 * @param [tg] Glass transition temperature (DSC), degC (or text with a unit).
 * @param [tm] Melting peak temperature (DSC), degC; semi-crystalline families only.
 * @param [creep_time] Time of the creep modulus, hours (h) (or text such as "1000 h"); 1000 h if left empty.
 * @param [creep_temp] Temperature of the creep modulus, degC (or text with a unit); 23 degC if left empty.
 * @param [creep_modulus] Creep modulus (stress / creep strain) at creep_time and creep_temp, MPa (or text with a unit).
 * @param [free] Parameter names to fit instead of the automatic choice, such as "tauTg_s, beta" (or a range of names); at most one per fitted input.
 * @returns {any[][]} Parameter block (field, value, unit, description), then rows starting with # for quality, fit, notes and caution.
 */
export function calibrate(
  start: unknown[][],
  modulus23?: unknown,
  hdt_a?: unknown,
  hdt_b?: unknown,
  tg?: unknown,
  tm?: unknown,
  creep_time?: unknown,
  creep_temp?: unknown,
  creep_modulus?: unknown,
  free?: unknown[][],
) {
  return CALIBRATE.invoke(start, modulus23, hdt_a, hdt_b, tg, tm, creep_time, creep_temp, creep_modulus, free);
}

/** Inputs a calibration can have (modulus, two HDTs, Tg, Tm, one creep modulus) under their header. */
const CHECK_INPUT_ROWS = 1 + 6;
/** Fitted parameters under their header: at most one per fitted input (an Eg-anchored modulus, two HDTs, a creep modulus). */
const CHECK_FITTED_ROWS = 1 + 4;
/** Quality, notes and caution. */
const CHECK_SUMMARY_ROWS = 3;

export const CALCHECK = defineMatrix({
  id: 'CALCHECK',
  args: CALIBRATE_ARGS,
  spillSize: () => [CHECK_INPUT_ROWS + CHECK_FITTED_ROWS + CHECK_SUMMARY_ROWS, FITTED_HEADER.length],
  spillFits: 'at-most',
  run: (...v) => {
    const r = runCalibration(...(v as unknown as Parsed));
    const cells = (row: readonly (string | number | null)[]): OutCell[] => row.map((c) => (typeof c === 'number' ? sig(c) : c));
    const table: OutCell[][] = [...calibrationCheckRows(r).map(cells), [...FITTED_HEADER], ...calibrationFittedRows(r).map(cells)];
    const line = (label: string, text: string): OutCell[] => [label, text, null, null, null, null, null];
    table.push(
      line(
        'quality',
        `${QUALITY_MEANING[r.quality]} (${QUALITY_RULE}); ${r.iterations} iterations, ${r.converged ? 'converged' : `not converged (${r.reason})`}`,
      ),
      line('notes', notesText(r.notes)),
      line('caution', FIT_CAUTION),
    );
    return table;
  },
});

/**
 * Spills how a calibration reproduces each datasheet number, then each fitted parameter beside its family default and range, the quality and notes. Screening estimate; same arguments as DERATE.CALIBRATE.
 * @customfunction CALCHECK
 * @param start Starting point: family symbol such as "PC", or a parameter block range from DERATE.PARAMS.
 * @param [modulus23] Short-term (tensile) modulus at 23 degC, MPa (or text with a unit such as "2.4 GPa").
 * @param [hdt_a] HDT at 1.80 MPa (ISO 75 method A), degC (or text with a unit).
 * @param [hdt_b] HDT at 0.45 MPa (ISO 75 method B), degC (or text with a unit).
 * @param [tg] Glass transition temperature (DSC), degC (or text with a unit).
 * @param [tm] Melting peak temperature (DSC), degC; semi-crystalline families only.
 * @param [creep_time] Time of the creep modulus, hours (h) (or text such as "1000 h"); 1000 h if left empty.
 * @param [creep_temp] Temperature of the creep modulus, degC (or text with a unit); 23 degC if left empty.
 * @param [creep_modulus] Creep modulus (stress / creep strain) at creep_time and creep_temp, MPa (or text with a unit).
 * @param [free] Parameter names to fit instead of the automatic choice, such as "tauTg_s, beta" (or a range of names).
 * @returns {any[][]} Table: header, one row per input given (degC or MPa); header, one row per fitted parameter (start, calibrated, family default, family low, family high, on search bound); then quality, notes and caution rows.
 */
export function calcheck(
  start: unknown[][],
  modulus23?: unknown,
  hdt_a?: unknown,
  hdt_b?: unknown,
  tg?: unknown,
  tm?: unknown,
  creep_time?: unknown,
  creep_temp?: unknown,
  creep_modulus?: unknown,
  free?: unknown[][],
) {
  return CALCHECK.invoke(start, modulus23, hdt_a, hdt_b, tg, tm, creep_time, creep_temp, creep_modulus, free);
}
