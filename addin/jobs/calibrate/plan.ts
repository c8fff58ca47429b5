/**
 * The "calibrate a grade" job: running the engine's datasheet calibration in the page, and the block
 * written from it: the calibrated parameter block (the DERATE.PARAMS layout, so any material argument
 * takes it back), its datasheet check below, the fitted parameters, the engine's notes and the cautions.
 * The pane loads this module (and with it the engine's least-squares code) on the first calibration;
 * reading the form is request.ts.
 */
import {
  calibrateDatasheet,
  calibrationCheckRows,
  calibrationFittedRows,
  FITTED_HEADER,
  type CalibrationResult,
} from '../../../src/fit/calibrate.js';
import { InputError } from '../../../src/base/errors.js';
import type { Box, Cell } from '../../sheet/a1.js';
import { CALIBRATION_FIELD_NAMES as N, QUALITY_TEXT, type CalibrationRequest } from './request.js';
import { paramsBlockRows } from '../lookup/plan.js';
import { CALIBRATION_NOTE, CAUTION } from '../notes.js';
import type { CellValue, CellWrite } from '../../sheet/port.js';
import type { Plan } from '../../shell/writer.js';

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

export function calibrationLayout(result: CalibrationResult): CalibrationLayout {
  const block = paramsBlockRows(result.params).length;
  const check = calibrationCheckRows(result);
  const cols = Math.max(check[0]?.length ?? 0, FITTED_HEADER.length, 4);
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
        calibrationFittedRows(result).forEach((row, i) =>
          putRow(
            fittedRow + 1 + i,
            row.map((c) => c ?? ''),
          ),
        );
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
