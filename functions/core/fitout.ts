/**
 * What the fitting functions spill besides numbers: the fit quality, the notes and the cautions, as
 * comment rows (first cell starting with '#') below a parameter block or a Prony table, so that the
 * whole spill stays readable as a material (the material argument skips comment rows).
 */
import type { FitQuality, MaterialParams, NumericField } from '../../src/index.js';
import { BLOCK_COLUMNS, paramsBlock } from './block.js';
import type { OutCell } from './cells.js';

/** The caution every fitted or calibrated result carries where the user sees it. */
export const FIT_CAUTION =
  'Screening estimate: the fitted record reproduces the numbers it was given, not the grade elsewhere (other temperatures, times, stresses or moisture). Confirm with supplier data and creep or relaxation tests; apply the safety factors of the applicable code and defer to licensed engineering review.';

export const QUALITY_MEANING: Record<FitQuality, string> = {
  good: 'good',
  fair: 'fair: use with care',
  poor: 'poor: do not rely on it',
};

/** Four significant digits, as a number. */
export function sig(x: number): number {
  return Number(x.toPrecision(4));
}

/** Comment rows of a given width: label in the first cell, text in the second, the rest empty. */
export function commentRows(width: number, rows: readonly (readonly [string, string])[]): OutCell[][] {
  return rows.map(([label, text]) => [`# ${label}`, text, ...Array.from({ length: width - 2 }, () => null)]);
}

export function notesText(notes: readonly string[]): string {
  return notes.length === 0 ? 'none' : notes.join('; ');
}

/** Fitted parameters as text: "beta 0.4 -> 0.35 (at its search bound)". */
export function freeText(free: readonly { field: NumericField; start: number; value: number; atBound: boolean }[]): string {
  if (free.length === 0) return 'none';
  return free.map((f) => `${f.field} ${sig(f.start)} -> ${sig(f.value)}${f.atBound ? ' (at its search bound)' : ''}`).join('; ');
}

/** Comment rows below a fitted block. */
export const BLOCK_COMMENT_ROWS = 4;

/**
 * A fitted parameter block: the PARAMS layout with each fitted field's description saying so, then
 * comment rows with the quality, what was fitted and how well, the notes and the caution.
 */
export function fittedBlock(
  params: MaterialParams,
  free: readonly { field: NumericField; start: number; value: number; atBound: boolean }[],
  quality: FitQuality,
  how: string,
  notes: readonly string[],
): OutCell[][] {
  const rows = paramsBlock(params);
  for (const row of rows) {
    const f = free.find((x) => x.field === row[0]);
    if (f) row[3] = `${String(row[3])} (fitted: ${sig(f.start)} -> ${sig(f.value)}${f.atBound ? ', at its search bound' : ''})`;
  }
  return [
    ...rows,
    ...commentRows(BLOCK_COLUMNS, [
      ['quality', QUALITY_MEANING[quality]],
      ['fit', how],
      ['notes', notesText(notes)],
      ['caution', FIT_CAUTION],
    ]),
  ];
}
