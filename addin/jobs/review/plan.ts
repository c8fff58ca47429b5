/**
 * The "build a review" job: a table of live DERATE formulas for candidate materials at service
 * temperatures, with a lowest-value and a verdict column, notes, and a chart of modulus vs temperature.
 * The values shown in the in-page sheet come from the engine directly, by the same calls the worksheet
 * functions make.
 */
import { InputError } from '../../../src/base/errors.js';
import { getGrade } from '../../../src/material/grade.js';
import { modulusAfterHistory } from '../../../src/answers/history.js';
import { VERDICT } from '../../../src/answers/verdict.js';
import { compileMaterial, modulusMPa, type Material } from '../../../src/material/model.js';
import { maxTemperatureK } from '../../../src/answers/inverse.js';
import type { MaterialParams } from '../../../src/material/params.js';
import { paramsFromBlockRows } from '../../../src/material/resolve.js';
import { cToKelvin, kelvinToC, parseTimeS, SECONDS_PER_HOUR } from '../../../src/base/units.js';
import { cyclesInput } from '../../../src/input/count.js';
import { checkHistory } from '../../../src/input/cycle.js';
import { listInput } from '../../../src/input/list.js';
import { modulusInput } from '../../../src/input/modulus.js';
import { readRequired } from '../../../src/input/quantity.js';
import { temperatureInput } from '../../../src/input/temperature.js';
import { timeInput } from '../../../src/input/time.js';
import { cellAddress, qualified, type Cell } from '../../sheet/a1.js';
import { CAUTION, FAMILY_NOTE, FILLED_NOTE, MODEL_NOTE } from '../notes.js';
import { type CellWrite, type RangeContent, type SheetRange } from '../../sheet/port.js';
import type { Plan } from '../../shell/writer.js';
import { chartSpanC, CURVE_SAMPLES, curveTemperaturesC, describeLoad, NA, reviewChart } from './chart.js';

export type Candidate =
  /** A family or grade as its text reads ("PC", "PBT-GF30", "PA66-GF30 at 50 % RH"): getGrade resolves it. */
  | { readonly kind: 'family'; readonly id: string }
  | { readonly kind: 'block'; readonly range: SheetRange; readonly params: MaterialParams };

export interface CycleStep {
  readonly temperatureC: number;
  readonly hours: number;
}

export type Load =
  | { readonly kind: 'time'; readonly time: string | number }
  | { readonly kind: 'cycle'; readonly steps: readonly CycleStep[]; readonly cycles: number };

export interface ReviewInput {
  readonly candidates: readonly Candidate[];
  readonly temperaturesC: readonly number[];
  readonly load: Load;
  readonly requiredMPa: number;
}

/** Most service temperatures and candidates one review holds (keeps the table and chart readable). */
export const MAX_TEMPERATURES = 12;
export const MAX_CANDIDATES = 10;
export const MAX_STEPS = 12;

// ---- reading what the user typed (values, ranges and words from the input layer, src/input/) ----

/** "23, 40, 60 degC, 176 degF" -> degC numbers, ascending, duplicates removed. */
export function parseTemperatureList(text: string, argument = 'service temperatures'): number[] {
  const list = readRequired(listInput(temperatureInput), text, argument).map((K) => round6(kelvinToC(K)));
  const unique = [...new Set(list)].sort((a, b) => a - b);
  if (unique.length > MAX_TEMPERATURES)
    throw new InputError(argument, `give at most ${MAX_TEMPERATURES} temperatures, got ${unique.length}`);
  return unique;
}

function round6(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

/** A service time as it will sit in its cell: a bare number stays a number (hours), text keeps its unit. */
export function parseServiceTime(text: string): string | number {
  const t = text.trim();
  readRequired(timeInput, t, 'service time');
  const n = Number(t);
  return Number.isFinite(n) ? n : t;
}

/** The required modulus, MPa. */
export function parseRequired(text: string): number {
  return readRequired(modulusInput, text.trim(), 'required modulus');
}

export function checkCycle(steps: readonly CycleStep[], cycles: number): void {
  if (steps.length === 0) throw new InputError('duty cycle', 'add at least one step (a temperature and its hours per cycle)');
  if (steps.length > MAX_STEPS) throw new InputError('duty cycle', `use at most ${MAX_STEPS} steps, got ${steps.length}`);
  const segments = steps.map((s, i) => ({
    TK: temperatureInput.parse(s.temperatureC, `duty cycle step ${i + 1} temperature`),
    dtS: timeInput.parse(s.hours, `duty cycle step ${i + 1} hours`),
  }));
  cyclesInput.parse(cycles, 'cycles');
  checkHistory(segments, cycles, { cycles: 'cycles', durations: 'duty cycle' });
}

/**
 * Turns a parameter block read from the sheet into parameters, reading it as the material arguments
 * do (the engine's paramsFromBlockRows: an optional 'field' header row, field names in any case in the
 * first column, values in the second, further columns ignored). Errors name the range.
 */
export function paramsFromBlock(content: RangeContent, where: string): MaterialParams {
  const first = content.values[0];
  if (!first || first.length < 2 || content.values.length < 2) {
    throw new InputError(where, 'a parameter block has at least two columns (field names, values) and several rows');
  }
  try {
    const p = paramsFromBlockRows(content.values, { argument: where });
    compileMaterial(p);
    return p;
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(where, e instanceof Error ? e.message : String(e));
  }
}

export function candidateLabel(c: Candidate): string {
  return c.kind === 'family' ? getGrade(c.id).params.id : `${c.params.id} (${qualified(c.range.sheet, c.range.box, false)})`;
}

function material(c: Candidate): Material {
  return c.kind === 'family' ? compileMaterial(getGrade(c.id).params) : compileMaterial(c.params);
}

/** Validates everything a review needs; throws InputError naming the input. */
export function checkReview(input: ReviewInput): void {
  if (input.candidates.length === 0) throw new InputError('candidates', 'add at least one family or parameter block');
  if (input.candidates.length > MAX_CANDIDATES) throw new InputError('candidates', `use at most ${MAX_CANDIDATES} candidates`);
  if (input.temperaturesC.length === 0) throw new InputError('service temperatures', 'give at least one temperature');
  for (const t of input.temperaturesC) temperatureInput.parse(t, 'service temperatures');
  if (input.load.kind === 'time') timeInput.parse(input.load.time, 'service time');
  else checkCycle(input.load.steps, input.load.cycles);
  modulusInput.parse(input.requiredMPa, 'required modulus');
  input.candidates.forEach((c) => {
    try {
      material(c);
    } catch (e) {
      throw new InputError(
        `candidate ${c.kind === 'family' ? c.id : qualified(c.range.sheet, c.range.box, false)}`,
        e instanceof Error ? e.message : String(e),
      );
    }
  });
}

// ---- the numbers ----

/** E_r (MPa) of a candidate at T (degC) under the load: what the review's formula in that cell returns. */
export function reviewModulus(m: Material, temperatureC: number, load: Load): number {
  const TK = cToKelvin(temperatureC);
  if (load.kind === 'time') return modulusMPa(m, parseTimeS(load.time, 'service time'), TK);
  // What DERATE.DUTY returns: both clocks of the model run through every step of every cycle, and the
  // modulus is read at the column's temperature.
  const segments = load.steps.map((s) => ({ TK: cToKelvin(s.temperatureC), dtS: s.hours * SECONDS_PER_HOUR }));
  return modulusAfterHistory(m, segments, load.cycles, TK).modulusMPa;
}

export interface ReviewRowResult {
  readonly label: string;
  readonly moduliMPa: readonly number[];
  readonly lowestMPa: number;
  readonly pass: boolean;
  /** What DERATE.MAXTEMP gives for the required modulus and the service time (degC); null when #N/A or under a duty cycle. */
  readonly maxTempC: number | null;
}

export function reviewResults(input: ReviewInput): ReviewRowResult[] {
  return input.candidates.map((c) => {
    const m = material(c);
    const moduliMPa = input.temperaturesC.map((T) => reviewModulus(m, T, input.load));
    const lowestMPa = Math.min(...moduliMPa);
    return { label: candidateLabel(c), moduliMPa, lowestMPa, pass: lowestMPa >= input.requiredMPa, maxTempC: maxTempC(m, input) };
  });
}

/** DERATE.MAXTEMP's answer (degC) by the same engine call, or null where it gives #N/A; none under a duty cycle. */
function maxTempC(m: Material, input: ReviewInput): number | null {
  if (input.load.kind !== 'time') return null;
  const a = maxTemperatureK(m, input.requiredMPa, parseTimeS(input.load.time, 'service time'));
  return a.status === 'found' && a.value !== null ? kelvinToC(a.value) : null;
}

// ---- the layout ----

export interface ReviewLayout {
  readonly rows: number;
  readonly cols: number;
  /** Row offsets inside the block. */
  readonly requiredRow: number;
  readonly loadRow: number;
  readonly headerRow: number;
  readonly firstCandidateRow: number;
  readonly referenceRow: number;
  readonly notesRow: number;
  /** The chart's data: a header row, then the curves (temperature, one column per candidate, required) with the service points beside. */
  readonly dataHeaderRow: number;
  readonly dataRows: number;
  /** The MAXTEMP table (time load only): a header row, then one row per candidate; -1 under a duty cycle. */
  readonly limitsHeaderRow: number;
}

function loadLines(load: Load): number {
  return load.kind === 'time' ? 1 : load.steps.length + 2;
}

function assumptions(input: ReviewInput): string[] {
  const lines = [MODEL_NOTE];
  if (input.load.kind === 'time') {
    lines.push('Load: each service temperature is held constant for the whole service time.');
  } else {
    lines.push(
      'Duty cycle: E_r after all the cycles (=DERATE.DUTY), read at each service temperature; the time-temperature shift adds up dt_i / a_T(T_i) step by step (thermorheologically simple superposition, as in =DERATE.EQTIME).',
    );
  }
  if (input.candidates.some((c) => c.kind === 'family')) lines.push(FAMILY_NOTE);
  if (input.candidates.some((c) => c.kind === 'family' && getGrade(c.id).params.filler !== 'none')) lines.push(FILLED_NOTE);
  if (input.candidates.some((c) => c.kind === 'block'))
    lines.push('Parameter blocks are read live from their ranges: edit a value there and the row follows.');
  lines.push('Verdict: pass when the lowest E_r over the listed temperatures is at least the required modulus.');
  return lines;
}

export function reviewLayout(input: ReviewInput): ReviewLayout {
  const n = input.temperaturesC.length;
  const requiredRow = 1;
  const loadRow = 2;
  const headerRow = loadRow + loadLines(input.load) + 2;
  const firstCandidateRow = headerRow + 1;
  const referenceRow = firstCandidateRow + input.candidates.length;
  const notesRow = referenceRow + 2;
  const k = input.candidates.length;
  const dataHeaderRow = notesRow + 1 + assumptions(input).length + 2 + 2;
  const dataRows = Math.max(CURVE_SAMPLES, k * n);
  const limitsHeaderRow = input.load.kind === 'time' ? dataHeaderRow + 1 + dataRows + 1 : -1;
  const rows = limitsHeaderRow >= 0 ? limitsHeaderRow + 1 + k : dataHeaderRow + 1 + dataRows;
  const cols = Math.max(n + 3, k + 5);
  return {
    rows,
    cols,
    requiredRow,
    loadRow,
    headerRow,
    firstCandidateRow,
    referenceRow,
    notesRow,
    dataHeaderRow,
    dataRows,
    limitsHeaderRow,
  };
}

const abs = (c: Cell): string => cellAddress(c, { row: true, col: true });

export function reviewPlan(input: ReviewInput): Plan {
  checkReview(input);
  const L = reviewLayout(input);
  const results = reviewResults(input);
  const n = input.temperaturesC.length;
  return {
    label: 'review',
    sheetBase: 'Review',
    rows: L.rows,
    cols: L.cols,
    build(sheet: string, o: Cell) {
      const at = (r: number, c: number): Cell => ({ row: o.row + r, col: o.col + c });
      const cells: CellWrite[][] = Array.from({ length: L.rows }, () => Array.from({ length: L.cols }, () => ({ value: '' })));
      const put = (r: number, c: number, w: CellWrite): void => {
        const row = cells[r];
        if (!row || c >= row.length) throw new Error(`layout error at row ${r}, column ${c}`);
        row[c] = w;
      };
      const required = abs(at(L.requiredRow, 1));
      put(0, 0, { value: 'Stiffness review (Resin Derate)' });
      put(L.requiredRow, 0, { value: 'Required modulus, MPa' });
      put(L.requiredRow, 1, { value: input.requiredMPa });

      // The load, and the formula each candidate/temperature cell gets.
      let formulaFor: (matRef: string, tempRef: string) => string;
      const load = input.load;
      if (load.kind === 'time') {
        put(L.loadRow, 0, { value: typeof load.time === 'number' ? 'Service time, h' : 'Service time' });
        put(L.loadRow, 1, { value: load.time });
        const t = abs(at(L.loadRow, 1));
        formulaFor = (matRef, tempRef) => `=DERATE.MODULUS(${matRef},${tempRef},${t})`;
      } else {
        put(L.loadRow, 0, { value: 'Duty cycle' });
        put(L.loadRow, 1, { value: 'degC' });
        put(L.loadRow, 2, { value: 'h per cycle' });
        load.steps.forEach((s, i) => {
          put(L.loadRow + 1 + i, 0, { value: `step ${i + 1}` });
          put(L.loadRow + 1 + i, 1, { value: s.temperatureC });
          put(L.loadRow + 1 + i, 2, { value: s.hours });
        });
        const last = L.loadRow + load.steps.length;
        put(last + 1, 0, { value: 'Cycles' });
        put(last + 1, 1, { value: load.cycles });
        const temps = `${abs(at(L.loadRow + 1, 1))}:${abs(at(last, 1))}`;
        const hours = `${abs(at(L.loadRow + 1, 2))}:${abs(at(last, 2))}`;
        const cyc = abs(at(last + 1, 1));
        formulaFor = (matRef, tempRef) => `=DERATE.DUTY(${matRef},${temps},${hours},${cyc},${tempRef})`;
      }

      put(L.headerRow - 1, 0, { value: `E_r in MPa after ${describeLoad(load)}, at each service temperature (degC)` });
      put(L.headerRow, 0, { value: 'Material' });
      input.temperaturesC.forEach((T, j) => put(L.headerRow, 1 + j, { value: T }));
      put(L.headerRow, n + 1, { value: 'Lowest, MPa' });
      put(L.headerRow, n + 2, { value: 'Verdict' });

      input.candidates.forEach((c, i) => {
        const r = L.firstCandidateRow + i;
        const res = results[i];
        if (!res) throw new Error('missing result row');
        const matRef = c.kind === 'family' ? cellAddress(at(r, 0), { col: true }) : qualified(c.range.sheet, c.range.box);
        put(r, 0, { value: c.kind === 'family' ? getGrade(c.id).params.id : res.label });
        input.temperaturesC.forEach((_T, j) => {
          const tempRef = cellAddress(at(L.headerRow, 1 + j), { row: true });
          const value = res.moduliMPa[j] ?? NaN;
          put(r, 1 + j, { formula: formulaFor(matRef, tempRef), value, format: 'modulus' });
        });
        const span = `${cellAddress(at(r, 1))}:${cellAddress(at(r, n))}`;
        put(r, n + 1, { formula: `=MIN(${span})`, value: res.lowestMPa, format: 'modulus' });
        put(r, n + 2, {
          formula: `=IF(${cellAddress(at(r, n + 1))}>=${required},"${VERDICT.pass}","${VERDICT.fail}")`,
          value: res.pass ? VERDICT.pass : VERDICT.fail,
        });
      });

      put(L.referenceRow, 0, { value: 'Required, MPa' });
      for (let j = 0; j < n; j++) put(L.referenceRow, 1 + j, { formula: `=${required}`, value: input.requiredMPa, format: 'modulus' });

      put(L.notesRow, 0, { value: 'Assumptions' });
      assumptions(input).forEach((line, i) => put(L.notesRow + 1 + i, 0, { value: line }));
      const cautionRow = L.notesRow + 1 + assumptions(input).length;
      put(cautionRow, 0, { value: 'Cautions' });
      put(cautionRow + 1, 0, { value: CAUTION });

      // The chart's data, which the chart's series reference so that it follows any edit. Families are
      // named by their row's label cell, parameter blocks by their range, as in the table above.
      const matRefs = input.candidates.map((c, i) =>
        c.kind === 'family' ? abs(at(L.firstCandidateRow + i, 0)) : qualified(c.range.sheet, c.range.box),
      );
      const span = chartSpanC(
        input.temperaturesC,
        results.map((r) => r.maxTempC),
      );
      const temps = curveTemperaturesC(span);
      const k = input.candidates.length;
      const D = L.dataHeaderRow;
      put(D - 1, 0, {
        value: `Chart data: E_r in MPa after ${describeLoad(load)}, ${temps.length} temperatures from ${span[0]} to ${span[1]} degC`,
      });
      put(D, 0, { value: 'Temperature, degC' });
      results.forEach((res, i) => put(D, 1 + i, { value: res.label }));
      put(D, k + 1, { value: 'Required, MPa' });
      put(D, k + 2, { value: 'Material' });
      put(D, k + 3, { value: 'Service T, degC' });
      put(D, k + 4, { value: 'E_r there, MPa' });
      // Each candidate's curve (MPa at each of temps), the numbers its column shows and the chart draws.
      const curves = input.candidates.map(material).map((m) => temps.map((T) => reviewModulus(m, T, load)));
      temps.forEach((T, r) => {
        put(D + 1 + r, 0, { value: T });
        const tempRef = cellAddress(at(D + 1 + r, 0), { col: true });
        curves.forEach((curve, i) =>
          put(D + 1 + r, 1 + i, { formula: formulaFor(matRefs[i] ?? '', tempRef), value: curve[r] ?? NaN, format: 'modulus' }),
        );
        put(D + 1 + r, k + 1, { formula: `=${required}`, value: input.requiredMPa, format: 'modulus' });
      });
      results.forEach((res, i) =>
        input.temperaturesC.forEach((T, j) => {
          const r = D + 1 + i * n + j;
          put(r, k + 2, { value: res.label });
          put(r, k + 3, { formula: `=${abs(at(L.headerRow, 1 + j))}`, value: T });
          put(r, k + 4, { formula: `=${abs(at(L.firstCandidateRow + i, 1 + j))}`, value: res.moduliMPa[j] ?? NaN, format: 'modulus' });
        }),
      );
      if (L.limitsHeaderRow >= 0 && load.kind === 'time') {
        const M = L.limitsHeaderRow;
        const t = abs(at(L.loadRow, 1));
        const first = abs(at(D + 1, 0));
        const last = abs(at(D + temps.length, 0));
        put(M, 0, { value: 'Material' });
        put(M, 1, { value: 'MAXTEMP, degC' });
        put(M, 2, { value: 'On the chart, degC' });
        put(M, 3, { value: 'Required, MPa' });
        results.forEach((res, i) => {
          const r = M + 1 + i;
          const mt = cellAddress(at(r, 1));
          const onChart = cellAddress(at(r, 2));
          const shown = res.maxTempC !== null && res.maxTempC >= span[0] && res.maxTempC <= span[1] ? res.maxTempC : NA;
          put(r, 0, { value: res.label });
          put(r, 1, { formula: `=DERATE.MAXTEMP(${matRefs[i] ?? ''},${required},${t})`, value: res.maxTempC ?? NA });
          // NA() outside the drawn span: Excel's scatter charts leave #N/A points out.
          put(r, 2, { formula: `=IF(ISNUMBER(${mt}),IF(AND(${mt}>=${first},${mt}<=${last}),${mt},NA()),NA())`, value: shown });
          put(r, 3, {
            formula: `=IF(ISNUMBER(${onChart}),${required},NA())`,
            value: shown === NA ? NA : input.requiredMPa,
            format: 'modulus',
          });
        });
      }

      return { cells, chart: reviewChart(input, results, L, sheet, o, temps, curves) };
    },
  };
}
