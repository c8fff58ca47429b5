/**
 * The spreadsheet comparison: what a practitioner would type by hand (a WLF shift and a stretched
 * exponential in one formula) over 10,000 cells, beside 10,000 DERATE.MODULUS cells, both recalculated
 * by HyperFormula (a dev dependency; the same engine the spreadsheet tests use).
 */
import '../functions/modulus.js';
import { derateWorkbook } from '../functions/host/hyperformula.js';
import { medianMs } from './timing.js';

const CELLS = 10_000;

/** Inputs: temperature (degC) in A, time (h) in B; PC-like, from 110 to 200 degC so the WLF denominator stays positive. */
function inputs(): (number | string)[][] {
  return Array.from({ length: CELLS }, (_, i) => [110 + (i % 91), 10 ** ((i % 41) / 10 - 1)]);
}

/**
 * The hand-built formula: E = Eg exp(-(t / (tau a_T))^beta), log10 a_T = -C1 (T - Tg) / (C2 + T - Tg), with
 * the universal WLF constants (Williams, Landel, Ferry 1955) and round PC-like numbers typed in.
 */
function handFormula(r: number): string {
  return `=2400*EXP(-((B${r}*3600/(100*10^(-17.44*(A${r}-147)/(51.6+A${r}-147))))^0.4))`;
}

/** Median milliseconds to recalculate 10,000 hand-built cells and 10,000 DERATE.MODULUS cells, and their ratio. */
export function spreadsheetBench(): { hand_formula_10k_ms: number; derate_modulus_10k_ms: number; derate_to_hand_formula_ratio: number } {
  const hand = derateWorkbook({ S: inputs().map((row, i) => [...row, handFormula(i + 1)]) });
  const ours = derateWorkbook({ S: inputs().map((row, i) => [...row, `=DERATE.MODULUS("PC",A${i + 1},B${i + 1})`]) });
  const probe = (hf: typeof hand): unknown => hf.getCellValue({ sheet: 0, row: CELLS - 1, col: 2 });
  for (const hf of [hand, ours]) if (typeof probe(hf) !== 'number') throw new Error(`spreadsheet bench: ${String(probe(hf))}`);
  const handMs = medianMs(() => (hand.rebuildAndRecalculate(), probe(hand)), 7);
  const oursMs = medianMs(() => (ours.rebuildAndRecalculate(), probe(ours)), 7);
  return { hand_formula_10k_ms: handMs, derate_modulus_10k_ms: oursMs, derate_to_hand_formula_ratio: oursMs / handMs };
}
