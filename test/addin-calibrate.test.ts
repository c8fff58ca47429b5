/** The pane's "calibrate a grade" job: reading the datasheet fields, and what it writes. */
import { describe, expect, it } from 'vitest';
import {
  calibrationCheckRows,
  compileMaterial,
  creepModulusMPa,
  cToKelvin,
  FITTED_HEADER,
  getFamily,
  InputError,
  modulusMPa,
  NUMERIC_FIELDS,
  significant,
  simulateHdt,
  TEXT_FIELDS,
  type CalibrationResult,
} from '../src/index.js';
import { fittedText, readCalibration, type CalibrationFields, type CalibrationRequest } from '../addin/jobs/calibrate/request.js';
import { calibratedBlockBox, calibrationLayout, calibrationPlan, runCalibration } from '../addin/jobs/calibrate/plan.js';
import { paramsBlockRows } from '../addin/jobs/lookup/plan.js';
import { MemoryWorkbook } from '../addin/sheet/memory-sheet.js';
import { CALIBRATION_NOTE, CAUTION } from '../addin/jobs/notes.js';
import { paramsFromBlock } from '../addin/jobs/review/plan.js';
import { commit, OccupiedError, undo } from '../addin/shell/writer.js';
import { paramsBlock } from '../functions/core/block.js';
import { expectClose } from './expect.js';
import { BLANK_CALIBRATION_FIELDS as BLANK } from './support/calibration-form.js';

/** INVENTED datasheet numbers of a made-up PBT grade (not any real product), typed as a user would. */
const INVENTED_PBT: CalibrationFields = {
  ...BLANK,
  modulus23: '2.6 GPa',
  hdtA: '62',
  hdtB: '320 degF',
  tg: '55',
  tm: '224 degC',
  creepModulus: '1800',
  id: 'PBT-invented',
};

function errorOf(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError, nothing was thrown');
}

const FAHRENHEIT = 'NIST SP 811 (2008) B.8: t/degC = (t/degF - 32) / 1.8';

describe('reading the datasheet fields', () => {
  it('takes bare numbers as degC and MPa and text with units, and leaves out empty fields', () => {
    const req = readCalibration(INVENTED_PBT);
    expect(req.start.params.id).toBe('PBT');
    expect(req.id).toBe('PBT-invented');
    expectClose(req.inputs.modulus23MPa ?? NaN, 2600, { rel: 1e-12, source: 'SI prefix: 1 GPa = 1000 MPa' });
    expect(req.inputs.hdt?.map((h) => h.stressMPa)).toEqual([1.8, 0.45]);
    expectClose(req.inputs.hdt?.[0]?.temperatureK ?? NaN, 335.15, { rel: 1e-12, source: 'T/K = t/degC + 273.15 (ISO 80000-5)' });
    expectClose(req.inputs.hdt?.[1]?.temperatureK ?? NaN, (320 - 32) / 1.8 + 273.15, { rel: 1e-12, source: FAHRENHEIT });
    expectClose(req.inputs.TmK ?? NaN, 497.15, { rel: 1e-12, source: 'T/K = t/degC + 273.15 (ISO 80000-5)' });
    expect(req.inputs.moduli).toEqual([{ kind: 'creep', modulusMPa: 1800, timeS: 3.6e6, temperatureK: cToKelvin(23) }]);
    const few = readCalibration({ ...BLANK, hdtB: '150', creepTime: '' });
    expect(few.inputs).toEqual({ hdt: [{ stressMPa: 0.45, temperatureK: cToKelvin(150) }], moduli: [] });
    expect(few.id).toBeNull();
  });

  const bad: [string, Partial<CalibrationFields>, RegExp][] = [
    ['an unknown family', { start: 'PBX', hdtA: '60' }, /^starting family: .*PBX/],
    ['nothing typed', {}, /^datasheet numbers: type at least one/],
    ['a modulus in the wrong unit', { modulus23: '2.6 kg' }, /^modulus at 23 degC: /],
    ['a modulus of zero', { modulus23: '0' }, /^modulus at 23 degC: must be greater than zero/],
    ['an HDT below the test start', { hdtA: '20' }, /^HDT\/A \(1\.80 MPa\): must be above 23 degC/],
    ['HDT/A above HDT/B', { hdtA: '150', hdtB: '120' }, /^HDT\/A \(1\.80 MPa\): 150 is above HDT\/B \(120\)/],
    ['a temperature that is not one', { tg: 'warm' }, /^Tg: /],
    ['Tm for an amorphous family', { start: 'PC', tm: '230' }, /^Tm: is only used for semi-crystalline materials and PC is amorphous/],
    ['Tm below Tg', { tg: '80', tm: '70' }, /^Tm: must be above Tg \(80 degC\)/],
    ['a creep modulus without its time', { creepModulus: '1800', creepTime: ' ' }, /^creep time: give the loading time/],
    ['a creep time in the wrong unit', { creepModulus: '1800', creepTime: '1000 m^2' }, /^creep time: /],
    ['a creep modulus without its temperature', { creepModulus: '1800', creepTemperature: '' }, /^creep temperature: /],
  ];
  for (const [what, fields, message] of bad) {
    it(`names the field for ${what}`, () => {
      const e = errorOf(() => readCalibration({ ...BLANK, ...fields }));
      expect(`${e.argument}: ${e.problem}`).toMatch(message);
    });
  }
});

function calibrated(fields: CalibrationFields): { req: CalibrationRequest; result: CalibrationResult } {
  const req = readCalibration(fields);
  return { req, result: runCalibration(req) };
}

describe('the calibrated block written', () => {
  const { req, result } = calibrated(INVENTED_PBT);
  const at = { row: 2, col: 1 };
  const plan = calibrationPlan(req, result);
  const { cells, chart } = plan.build('Sheet1', at);
  const values = cells.map((r) => r.map((c) => c.value));

  it('reproduces the invented datasheet within the engine tolerances', () => {
    // Every input is met, but the creep input drives creepEa_kJmol from PBT's 40 to its 500 kJ/mol bound: far from
    // the family, so at best fair (src/fit/calibrate.ts farFromFamily), with a note naming it.
    expect(result.quality).toBe('fair');
    expect(result.notes.join(' ')).toMatch(/creepEa_kJmol far from the PBT value/);
    expect(result.params.id).toBe('PBT-invented');
    expect(result.residuals.map((r) => r.input)).toEqual([
      'Tg',
      'Tm',
      'modulus at 23 degC',
      'HDT 1.8 MPa',
      'HDT 0.45 MPa',
      'creep modulus 1000 h 23 degC',
    ]);
  });

  it('is a rectangle of values only, the size the plan announces, with no chart', () => {
    const L = calibrationLayout(result);
    expect([plan.rows, plan.cols]).toEqual([L.rows, L.cols]);
    expect(cells).toHaveLength(plan.rows);
    for (const row of cells) expect(row).toHaveLength(plan.cols);
    expect(cells.flat().every((c) => c.formula === undefined)).toBe(true);
    expect(chart).toBeNull();
  });

  it('starts with the parameter block in the DERATE.PARAMS layout, which reads back as the calibrated material', () => {
    const L = calibrationLayout(result);
    const block = values.slice(0, L.blockRows).map((r) => r.slice(0, 4));
    expect(block).toEqual(paramsBlockRows(result.params));
    expect(block).toEqual(paramsBlock(result.params).map((r) => r.map((c) => c ?? '')));
    // Beside the block, nothing.
    expect(values.slice(0, L.blockRows).flatMap((r) => r.slice(4))).toEqual(Array(L.blockRows * (plan.cols - 4)).fill(''));
    expect(calibratedBlockBox(result, at)).toEqual({ top: 2, left: 1, bottom: 2 + L.blockRows - 1, right: 4 });
    const back = paramsFromBlock({ values: block, formulas: block }, 'Sheet1!B3:E32');
    for (const key of TEXT_FIELDS) expect(back[key], key).toBe(result.params[key]);
    for (const spec of NUMERIC_FIELDS.filter((s) => s.kinds.includes('semicrystalline')))
      expect(back[spec.key], spec.key).toBe(result.params[spec.key]);
    // The read-back block gives the numbers of the check table (the engine's own evaluations).
    const m = compileMaterial(back);
    const rep = new Map(result.residuals.map((r) => [r.input, r.reproduced ?? NaN]));
    const same = 'the block read back against the calibration result (identity of the written values)';
    expectClose(simulateHdt(m, 1.8).temperatureC ?? NaN, rep.get('HDT 1.8 MPa') ?? NaN, { rel: 1e-12, source: same });
    expectClose(simulateHdt(m, 0.45).temperatureC ?? NaN, rep.get('HDT 0.45 MPa') ?? NaN, { rel: 1e-12, source: same });
    expectClose(creepModulusMPa(m, 3.6e6, cToKelvin(23)), rep.get('creep modulus 1000 h 23 degC') ?? NaN, { rel: 1e-12, source: same });
    // And those are the invented datasheet numbers within the engine's tolerances (2 K for an HDT, 5 % for a modulus).
    expectClose(simulateHdt(m, 1.8).temperatureC ?? NaN, 62, { abs: 2, source: 'invented datasheet HDT/A, HDT_TOLERANCE_K' });
    expectClose(simulateHdt(m, 0.45).temperatureC ?? NaN, 160, { abs: 2, source: `invented datasheet HDT/B 320 degF; ${FAHRENHEIT}` });
    expectClose(modulusMPa(m, 10, cToKelvin(23)), 2600, { rel: 0.05, source: 'invented datasheet modulus, ISO 527 about 10 s' });
  });

  it('puts the datasheet check, the fitted parameters and the cautions below the block', () => {
    const L = calibrationLayout(result);
    expect(values[L.checkTitleRow]?.[0]).toMatch(/^Datasheet check of PBT-invented: calibrated from PBT, quality fair/);
    const check = calibrationCheckRows(result);
    expect(values.slice(L.checkHeaderRow, L.checkHeaderRow + check.length)).toEqual(check);
    expect(cells[L.checkHeaderRow + 1]?.[2]?.format).toBe('modulus');
    expect(L.fittedRow).not.toBeNull();
    expect(values[L.fittedRow ?? 0]).toEqual([...FITTED_HEADER]);
    const fitted = values.slice((L.fittedRow ?? 0) + 1, (L.fittedRow ?? 0) + 1 + result.free.length);
    expect(fitted.map((r) => r.slice(0, 3))).toEqual(result.free.map((f) => [f.field, f.start, f.value]));
    // Beside each, the PBT family's default (src/material/families.ts, its entry and KIND_DEFAULTS.semicrystalline).
    const pbt = getFamily('PBT').params;
    expect(fitted.map((r) => r[3])).toEqual(result.free.map((f) => pbt[f.field]));
    expect(
      fitted.map((r) =>
        fittedText(
          result.free.find((f) => f.field === r[0])!,
          result.family,
        ),
      ),
    ).toEqual(result.free.map((f) => expect.stringContaining(`family default ${significant(pbt[f.field] ?? NaN, 4)} (PBT)`)));
    const text = values
      .slice(L.cautionRow)
      .map((r) => r[0])
      .join(' ');
    expect(text).toContain(CALIBRATION_NOTE);
    expect(text).toContain(CAUTION);
    expect(text).toMatch(/not the grade's behaviour.*screening.*ISO 899, ASTM D2990.*licensed engineering review/);
  });

  it('goes only into empty cells and undo takes it back whole', async () => {
    const wb = new MemoryWorkbook();
    wb.typeInto('Sheet1', { row: 40, col: 3 }, 'my note');
    await expect(commit(wb, plan, { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toBeInstanceOf(OccupiedError);
    expect(wb.filledCount('Sheet1')).toBe(1);
    const rec = await commit(wb, plan, { sheet: 'Sheet1', topLeft: { row: 0, col: 10 } });
    expect(wb.cell('Sheet1', 0, 10)).toMatchObject({ value: 'field' });
    expect(wb.cell('Sheet1', 1, 11)).toMatchObject({ value: 'PBT-invented' });
    expect(await undo(wb, rec)).toEqual({ status: 'done' });
    expect(wb.filledCount('Sheet1')).toBe(1);
    expect(wb.cell('Sheet1', 40, 3)).toMatchObject({ value: 'my note' });
  });

  it('writes the engine notes and a poor quality flag when the datasheet cannot be met', () => {
    // INVENTED numbers no PBT-like record can meet: HDT/A only 7 K above the start of the test, HDT/B in the melt range.
    const poor = calibrated({ ...BLANK, hdtA: '30', hdtB: '210' });
    expect(poor.result.quality).toBe('poor');
    expect(poor.result.notes.length).toBeGreaterThan(0);
    const L = calibrationLayout(poor.result);
    const v = calibrationPlan(poor.req, poor.result)
      .build('S', { row: 0, col: 0 })
      .cells.map((r) => r[0]?.value);
    expect(v[L.checkTitleRow]).toMatch(/quality poor \(some datasheet numbers are not reproduced/);
    expect(L.notesRow).not.toBeNull();
    expect(v.slice((L.notesRow ?? 0) + 1, (L.notesRow ?? 0) + 1 + poor.result.notes.length)).toEqual(poor.result.notes);
  });

  it('has no fitted or notes rows when every input is set directly', () => {
    // Only directly-set inputs: nothing is fitted and the engine has no notes.
    const direct = calibrated({ ...BLANK, start: 'PC', tg: '150', modulus23: '2400' });
    const L = calibrationLayout(direct.result);
    expect(direct.result.free).toEqual([]);
    expect([L.fittedRow, L.notesRow]).toEqual([null, null]);
    expect(calibrationPlan(direct.req, direct.result).build('S', { row: 0, col: 0 }).cells[L.cautionRow]?.[0]?.value).toBe('Cautions');
    expect(direct.result.params.Tg_C).toBe(150);
    expect(direct.result.params.E23_MPa).toBe(2400);
  });
});

describe('engine errors come back naming the pane field', () => {
  it('maps the engine argument to the field', () => {
    const start = getFamily('PC');
    expect(errorOf(() => runCalibration({ start, inputs: { TmK: 500 }, id: null })).argument).toBe('Tm');
    expect(errorOf(() => runCalibration({ start, inputs: { modulus23MPa: -1 }, id: null })).argument).toBe('modulus at 23 degC');
    expect(errorOf(() => runCalibration({ start, inputs: {}, id: null })).argument).toBe('datasheet numbers');
  });
});
