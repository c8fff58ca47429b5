/**
 * The review's chart: the temperature span and points of the drawn curves (spaced as DERATE.CURVE spaces
 * them), and the chart spec whose series read the chart-data cells the review plan writes.
 */
import { TEMP_SEARCH_K } from '../../../src/answers/inverse.js';
import { kelvinToC } from '../../../src/base/units.js';
import { columnName, type Cell } from '../../sheet/a1.js';
import type { ChartSeries, ChartSpec, SheetRange } from '../../sheet/port.js';
import type { Load, ReviewInput, ReviewLayout, ReviewRowResult } from './plan.js';

/** Temperatures (degC) of each drawn curve: evenly spaced, as DERATE.CURVE spaces its points. */
export const CURVE_SAMPLES = 51;

/**
 * The temperature span of the chart, degC: the service temperatures, widened to take in each MAXTEMP that
 * lies within one more span's width (so a crossing just past the hottest service temperature shows), at
 * least 20 degC wide, rounded out to 5 degC and kept inside the model's range.
 */
export function chartSpanC(temperaturesC: readonly number[], maxTempsC: readonly (number | null)[]): [number, number] {
  let lo = Math.min(...temperaturesC);
  let hi = Math.max(...temperaturesC);
  if (hi - lo < 20) {
    const mid = (lo + hi) / 2;
    lo = mid - 10;
    hi = mid + 10;
  }
  const width = hi - lo;
  for (const t of maxTempsC) {
    if (t === null) continue;
    if (t > hi && t <= hi + width) hi = t;
    if (t < lo && t >= lo - width) lo = t;
  }
  const [minK, maxK] = TEMP_SEARCH_K;
  lo = Math.max(kelvinToC(minK), Math.floor((lo - 1) / 5) * 5);
  hi = Math.min(kelvinToC(maxK), Math.ceil((hi + 1) / 5) * 5);
  return [lo, hi];
}

/** The drawn curve's temperatures (degC) over the span. */
export function curveTemperaturesC(span: readonly [number, number]): number[] {
  const [lo, hi] = span;
  return Array.from({ length: CURVE_SAMPLES }, (_, i) => round6(lo + ((hi - lo) * i) / (CURVE_SAMPLES - 1)));
}

/** What a cell showing #N/A holds in the plan (the in-page sheet shows it as text). */
export const NA = '#N/A';

export function reviewChart(
  input: ReviewInput,
  results: readonly ReviewRowResult[],
  L: ReviewLayout,
  sheet: string,
  o: Cell,
  temps: readonly number[],
  curves: readonly (readonly number[])[],
): ChartSpec {
  const k = results.length;
  const n = input.temperaturesC.length;
  const column = (c: number, top: number, count: number): SheetRange => ({
    sheet,
    box: { top: o.row + top, left: o.col + c, bottom: o.row + top + count - 1, right: o.col + c },
  });
  const D = L.dataHeaderRow + 1;
  const x = column(0, D, temps.length);
  const series: ChartSeries[] = results.map((res, i) => ({
    name: res.label,
    x,
    y: column(1 + i, D, temps.length),
    xValues: temps,
    yValues: curves[i] ?? [],
    draw: 'curve',
  }));
  series.push({
    name: 'At the service temperatures',
    x: column(k + 3, D, k * n),
    y: column(k + 4, D, k * n),
    xValues: results.flatMap(() => input.temperaturesC),
    yValues: results.flatMap((r) => r.moduliMPa),
    draw: 'points',
  });
  if (L.limitsHeaderRow >= 0) {
    const [lo, hi] = [temps[0] ?? NaN, temps[temps.length - 1] ?? NaN];
    const shown = results.map((r) => (r.maxTempC !== null && r.maxTempC >= lo && r.maxTempC <= hi ? r.maxTempC : null));
    series.push({
      name: 'MAXTEMP (required met up to)',
      x: column(2, L.limitsHeaderRow + 1, k),
      y: column(3, L.limitsHeaderRow + 1, k),
      xValues: shown.filter((t): t is number => t !== null),
      yValues: shown.filter((t) => t !== null).map(() => input.requiredMPa),
      draw: 'limits',
    });
  }
  series.push({
    name: `Required ${input.requiredMPa} MPa`,
    x,
    y: column(k + 1, D, temps.length),
    xValues: temps,
    yValues: temps.map(() => input.requiredMPa),
    draw: 'reference',
  });
  const left = o.col + L.cols + 1;
  return {
    name: `Resin Derate chart ${columnName(o.col)}${o.row + 1}`,
    sheet,
    title: `E_r after ${describeLoad(input.load)} vs temperature`,
    xTitle: 'Temperature, degC',
    yTitle: 'E_r, MPa (log scale)',
    logY: true,
    yMin: logAxisMinimum(
      series.filter((s) => s.draw === 'curve').flatMap((s) => s.yValues.filter((v): v is number => v !== null)),
      input.requiredMPa,
    ),
    series,
    place: { top: o.row, left, bottom: o.row + 17, right: left + 7 },
  };
}

/**
 * Lower end of the log axis: a power of ten at or below the smallest value, but no more than four decades
 * under the required modulus, so that a melted candidate does not squash the rest of the chart.
 */
export function logAxisMinimum(values: readonly number[], requiredMPa: number): number {
  const floor = requiredMPa / 1e4;
  const smallest = Math.min(requiredMPa, ...values.filter((v) => v > 0));
  return 10 ** Math.floor(Math.log10(Math.max(smallest, floor)));
}

function round6(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

/** The load in a few words for titles: "1000 h", or "3650 cycles of 24 h". */
export function describeLoad(load: Load): string {
  if (load.kind === 'time') return typeof load.time === 'number' ? `${load.time} h` : load.time;
  const hours = load.steps.reduce((s, x) => s + x.hours, 0);
  return `${load.cycles} cycles of ${hours} h`;
}
