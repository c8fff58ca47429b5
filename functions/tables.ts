/** Spilled tables for a review or a chart: a derating grid and a modulus-temperature curve. */
import { CURVE_POINTS, curvePointsInput, decimalNumber, deratingTable, kelvinToC, modulusCurve } from '../src/index.js';
import { count } from './core/args/count.js';
import { material, materials } from './core/args/material.js';
import { temperatures } from './core/args/ranges.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import type { OutCell } from './core/cells.js';
import { defineMatrix, listLength } from './core/define.js';

/** degC for a header, with the round-off of the kelvin round trip removed (1e-9 K). */
function headerC(K: number): number {
  return Math.round(kelvinToC(K) * 1e9) / 1e9;
}

export const GRID = defineMatrix({
  id: 'GRID',
  args: [materials('materials'), temperatures('temperatures'), time('time')],
  spillSize: ([mats, temps]) => {
    const rows = listLength(mats);
    const cols = listLength(temps);
    return rows === undefined || cols === undefined ? undefined : [rows + 1, cols + 1];
  },
  run: (ids, TK, tS) => {
    const temps = TK.map(headerC);
    const rows = deratingTable(ids, temps, tS);
    const out: OutCell[][] = [['E_r MPa', ...temps]];
    for (const r of rows) out.push([r.id, ...r.cells.map((c) => c.modulusMPa)]);
    return out;
  },
});

/**
 * Spills a derating table of relaxation moduli in MPa after the time: materials down, temperatures across (degC), with a header row and column. Screening estimates.
 * @customfunction GRID
 * @param materials Family symbols such as "PC" and "PBT", in one row or column (DERATE.FAMILIES lists them).
 * @param temperatures Service temperatures, degC (numbers, or text with units), in one row or column.
 * @param time Time under load: a number in hours (h), or text with a unit such as "1000 h".
 * @returns {any[][]} Table: header row of temperatures (degC), then one row per material of moduli (MPa).
 */
export function grid(materials: unknown[][], temperatures: unknown[][], time: unknown) {
  return GRID.invoke(materials, temperatures, time);
}

export const CURVE = defineMatrix({
  id: 'CURVE',
  args: [
    material('material'),
    temperature('from_temperature'),
    temperature('to_temperature'),
    count('points', curvePointsInput),
    time('time'),
  ],
  spillSize: (shapes) => {
    const points = shapes[3]?.literal;
    const n = typeof points === 'number' ? points : typeof points === 'string' ? (decimalNumber(points) ?? NaN) : NaN;
    return Number.isInteger(n) && n >= CURVE_POINTS[0] && n <= CURVE_POINTS[1] ? [n + 1, 2] : undefined;
  },
  run: (m, fromK, toK, n, tS) => {
    const out: OutCell[][] = [['temperature degC', 'E_r MPa']];
    for (const [TK, E] of modulusCurve(m, fromK, toK, n, tS)) out.push([headerC(TK), E]);
    return out;
  },
});

/**
 * Spills a curve for a chart: evenly spaced temperatures (degC) and the relaxation modulus (MPa) at each after the time, with a header row. Screening estimates.
 * @customfunction CURVE
 * @param material Family symbol such as "PP", or a parameter block range from DERATE.PARAMS.
 * @param from_temperature First temperature of the curve, degC (or text with a unit).
 * @param to_temperature Last temperature of the curve, degC (or text with a unit); above from_temperature.
 * @param points Number of temperatures (count), 2 to 1000.
 * @param time Time under load: a number in hours (h), or text with a unit such as "1000 h".
 * @returns {any[][]} Table: header row, then temperature (degC) and modulus (MPa) pairs.
 */
export function curve(material: unknown[][], from_temperature: unknown, to_temperature: unknown, points: unknown, time: unknown) {
  return CURVE.invoke(material, from_temperature, to_temperature, points, time);
}
