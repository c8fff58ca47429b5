/**
 * The "calibrate a grade" job: reading the datasheet numbers the user typed, running the engine's
 * datasheet calibration in the page, and the block written from it: the calibrated parameter block
 * (the DERATE.PARAMS layout, so any material argument takes it back), its datasheet check below, the
 * fitted parameters, the engine's notes and the cautions.
 */
import {
  calibrateDatasheet,
  calibrationCheckRows,
  cToKelvin,
  getFamily,
  HDT_MAX_C,
  HDT_METHODS,
  HDT_START_C,
  InputError,
  kelvinToC,
  parseStressMPa,
  parseTemperatureK,
  parseTimeS,
  type CalibrationResult,
  type DatasheetInputs,
  type Family,
  type HdtDatum,
  type ModulusDatum,
} from '../src/index.js';
import type { Box, Cell } from './a1.js';
import { paramsBlockRows } from './families-job.js';
import { CALIBRATION_NOTE, CAUTION } from './notes.js';
import type { CellValue, CellWrite } from './port.js';
import type { Plan } from './writer.js';

/** What the user typed, as text; empty text means "not on my datasheet". */
export interface CalibrationFields {
  readonly start: string;
  readonly modulus23: string;
  readonly hdtA: string;
  readonly hdtB: string;
  readonly tg: string;
  readonly tm: string;
  readonly creepModulus: string;
  readonly creepTime: string;
  readonly creepTemperature: string;
  readonly id: string;
}

/** The name each field goes by in messages (and the argument of the InputError it raises). */
export const CALIBRATION_FIELD_NAMES: Record<keyof CalibrationFields, string> = {
  start: 'starting family',
  modulus23: 'modulus at 23 degC',
  hdtA: 'HDT/A (1.80 MPa)',
  hdtB: 'HDT/B (0.45 MPa)',
  tg: 'Tg',
  tm: 'Tm',
  creepModulus: 'creep modulus',
  creepTime: 'creep time',
  creepTemperature: 'creep temperature',
  id: 'grade name',
};

/** A checked request: the starting family and the datasheet numbers in engine units. */
export interface CalibrationRequest {
  readonly start: Family;
  readonly inputs: DatasheetInputs;
  /** Short name of the calibrated record; null for the engine's default (start id + '-cal'). */
  readonly id: string | null;
}

const N = CALIBRATION_FIELD_NAMES;

function given(text: string): string | null {
  const t = text.trim();
  return t === '' ? null : t;
}

function hdtK(text: string, argument: string): number {
  const K = parseTemperatureK(text, argument);
  const C = kelvinToC(K);
  // The simulated test starts at 23 degC and gives up at 500 degC (hdt.ts); an HDT outside cannot be met.
  if (!(C > HDT_START_C))
    throw new InputError(argument, `must be above ${HDT_START_C} degC, where the ISO 75 test starts; got ${text.trim()}`);
  if (C > HDT_MAX_C) throw new InputError(argument, `must be at most ${HDT_MAX_C} degC, got ${text.trim()}`);
  return K;
}

/** Reads the form; throws InputError naming the field (by CALIBRATION_FIELD_NAMES) for anything wrong. */
export function readCalibration(fields: CalibrationFields): CalibrationRequest {
  let start: Family;
  try {
    start = getFamily(fields.start.trim());
  } catch (e) {
    throw new InputError(N.start, e instanceof Error ? e.message : String(e));
  }
  const kind = start.params.kind;
  const e23 = given(fields.modulus23);
  const a = given(fields.hdtA);
  const b = given(fields.hdtB);
  const tg = given(fields.tg);
  const tm = given(fields.tm);
  const creep = given(fields.creepModulus);
  const hdt: HdtDatum[] = [];
  if (a !== null) hdt.push({ stressMPa: HDT_METHODS.A, temperatureK: hdtK(a, N.hdtA) });
  if (b !== null) hdt.push({ stressMPa: HDT_METHODS.B, temperatureK: hdtK(b, N.hdtB) });
  const [hA, hB] = hdt;
  if (a !== null && b !== null && hA && hB && hA.temperatureK > hB.temperatureK) {
    throw new InputError(
      N.hdtA,
      `${a} is above HDT/B (${b}); the higher stress of method A always deflects at a lower temperature, so check the two values`,
    );
  }
  const TgK = tg === null ? undefined : parseTemperatureK(tg, N.tg);
  let TmK: number | undefined;
  if (tm !== null) {
    if (kind !== 'semicrystalline') {
      throw new InputError(N.tm, `is only used for semi-crystalline materials and ${start.params.id} is ${kind}; leave it empty`);
    }
    TmK = parseTemperatureK(tm, N.tm);
    const TgRef = TgK ?? cToKelvin(start.params.Tg_C);
    if (!(TmK > TgRef)) {
      throw new InputError(
        N.tm,
        `must be above Tg (${TgK === undefined ? `${start.params.id}'s ` : ''}${round(kelvinToC(TgRef))} degC), got ${tm}`,
      );
    }
  }
  const moduli: ModulusDatum[] = [];
  if (creep !== null) {
    const modulusMPa = parseStressMPa(creep, N.creepModulus);
    const t = given(fields.creepTime);
    const T = given(fields.creepTemperature);
    if (t === null) throw new InputError(N.creepTime, 'give the loading time of the creep modulus, for example 1000 h');
    if (T === null) throw new InputError(N.creepTemperature, 'give the temperature of the creep modulus, for example 23');
    moduli.push({ kind: 'creep', modulusMPa, timeS: parseTimeS(t, N.creepTime), temperatureK: parseTemperatureK(T, N.creepTemperature) });
  }
  const inputs: DatasheetInputs = {
    ...(e23 === null ? {} : { modulus23MPa: parseStressMPa(e23, N.modulus23) }),
    ...(TgK === undefined ? {} : { TgK }),
    ...(TmK === undefined ? {} : { TmK }),
    hdt,
    moduli,
  };
  if (inputs.modulus23MPa === undefined && TgK === undefined && TmK === undefined && hdt.length === 0 && moduli.length === 0) {
    throw new InputError('datasheet numbers', 'type at least one: the modulus at 23 degC, an HDT, Tg, Tm or a creep modulus');
  }
  const id = given(fields.id);
  if (id !== null && id.length > 40) throw new InputError(N.id, `use at most 40 characters, got ${id.length}`);
  return { start, inputs, id };
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}

/** The engine's argument names, as the pane's fields. */
const ENGINE_ARGUMENT: Record<string, string> = {
  modulus23: N.modulus23,
  Tg: N.tg,
  Tm: N.tm,
  'creep modulus': N.creepModulus,
  'creep time': N.creepTime,
  'creep temperature': N.creepTemperature,
  inputs: 'datasheet numbers',
  start: N.start,
};

/** Runs the engine's calibration; its input errors come back naming the pane's field. */
export function runCalibration(req: CalibrationRequest): CalibrationResult {
  try {
    return calibrateDatasheet(req.start.params.id, req.inputs, req.id === null ? {} : { id: req.id });
  } catch (e) {
    if (e instanceof InputError) throw new InputError(ENGINE_ARGUMENT[e.argument] ?? e.argument, e.problem);
    throw e;
  }
}

export const QUALITY_TEXT: Record<CalibrationResult['quality'], string> = {
  good: 'every datasheet number is reproduced within its tolerance',
  fair: 'every datasheet number is reproduced within three tolerances, not all within one',
  poor: 'some datasheet numbers are not reproduced (or the fit did not converge); read the notes before using the block',
};

// ---- the layout ----

export interface CalibrationLayout {
  readonly rows: number;
  readonly cols: number;
  /** Rows of the parameter block (header included), from the top. */
  readonly blockRows: number;
  readonly checkTitleRow: number;
  readonly checkHeaderRow: number;
  readonly fittedRow: number | null;
  readonly notesRow: number | null;
  readonly cautionRow: number;
}

const FITTED_HEADER = ['fitted parameter', 'start value', 'calibrated', 'on search bound'] as const;

export function calibrationLayout(result: CalibrationResult): CalibrationLayout {
  const block = paramsBlockRows(result.params).length;
  const check = calibrationCheckRows(result);
  const cols = Math.max(check[0]?.length ?? 0, 4);
  const checkTitleRow = block + 1;
  const checkHeaderRow = checkTitleRow + 1;
  let next = checkHeaderRow + check.length + 1;
  let fittedRow: number | null = null;
  if (result.free.length > 0) {
    fittedRow = next;
    next += 1 + result.free.length + 1;
  }
  let notesRow: number | null = null;
  if (result.notes.length > 0) {
    notesRow = next;
    next += 1 + result.notes.length + 1;
  }
  const cautionRow = next;
  return { rows: cautionRow + 3, cols, blockRows: block, checkTitleRow, checkHeaderRow, fittedRow, notesRow, cautionRow };
}

/** Where the parameter block of a calibration written at topLeft sits: the range to pass as a material. */
export function calibratedBlockBox(result: CalibrationResult, topLeft: Cell): Box {
  const L = calibrationLayout(result);
  return { top: topLeft.row, left: topLeft.col, bottom: topLeft.row + L.blockRows - 1, right: topLeft.col + 3 };
}

function sheetSafe(s: string): string {
  return s.replace(/[[\]:*?/\\']/g, '-');
}

export function calibrationPlan(req: CalibrationRequest, result: CalibrationResult): Plan {
  const L = calibrationLayout(result);
  const id = result.params.id;
  return {
    label: `calibrated ${id} block`,
    sheetBase: sheetSafe(`Calibrated ${id}`).slice(0, 25),
    rows: L.rows,
    cols: L.cols,
    build() {
      const cells: CellWrite[][] = Array.from({ length: L.rows }, () => Array.from({ length: L.cols }, () => ({ value: '' })));
      const put = (r: number, c: number, w: CellWrite): void => {
        const row = cells[r];
        if (!row || c >= row.length) throw new Error(`layout error at row ${r}, column ${c}`);
        row[c] = w;
      };
      const putRow = (r: number, values: readonly CellValue[], format?: (c: number) => CellWrite['format']): void =>
        values.forEach((value, c) => {
          const f = typeof value === 'number' ? format?.(c) : undefined;
          put(r, c, f ? { value, format: f } : { value });
        });
      paramsBlockRows(result.params).forEach((row, r) => putRow(r, row));
      put(L.checkTitleRow, 0, {
        value: `Datasheet check of ${id}: calibrated from ${req.start.params.id}, quality ${result.quality} (${QUALITY_TEXT[result.quality]})`,
      });
      // given and reproduced are degC or MPa; the modulus display rule (whole numbers from 100, one decimal from 1) suits both.
      calibrationCheckRows(result).forEach((row, i) =>
        putRow(L.checkHeaderRow + i, row, (c) => (c === 1 || c === 2 ? 'modulus' : undefined)),
      );
      const { fittedRow, notesRow } = L;
      if (fittedRow !== null) {
        putRow(fittedRow, FITTED_HEADER);
        result.free.forEach((f, i) => putRow(fittedRow + 1 + i, [f.field, f.start, f.value, f.atBound ? 'yes' : 'no']));
      }
      if (notesRow !== null) {
        put(notesRow, 0, { value: 'Notes of the calibration' });
        result.notes.forEach((n, i) => put(notesRow + 1 + i, 0, { value: n }));
      }
      put(L.cautionRow, 0, { value: 'Cautions' });
      put(L.cautionRow + 1, 0, { value: CALIBRATION_NOTE });
      put(L.cautionRow + 2, 0, { value: CAUTION });
      return { cells, chart: null };
    },
  };
}
