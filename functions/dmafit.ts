// @load on-first-call
/**
 * The DMA fit: the parameter block fitted to a storage-modulus temperature sweep. Loaded on the first
 * call in Excel, like calibrate.ts (the least-squares engine; see scripts/build/20-functions.mjs).
 */
import { fitDma } from '../src/index.js';
import { fields } from './core/args/fields.js';
import { frequency } from './core/args/frequency.js';
import { start } from './core/args/material.js';
import { sweep } from './core/args/tables.js';
import { BLOCK_COLUMNS, BLOCK_ROWS } from './core/block.js';
import { defineMatrix } from './core/define.js';
import { BLOCK_COMMENT_ROWS, fittedBlock, freeText, sig } from './core/fitout.js';

export const DMAFIT = defineMatrix({
  id: 'DMAFIT',
  args: [start('start'), sweep('sweep_range'), frequency('frequency_Hz'), fields('free')],
  spillSize: () => [BLOCK_ROWS + BLOCK_COMMENT_ROWS, BLOCK_COLUMNS],
  run: (p, sw, hz, free) => {
    const r = fitDma(p, sw, { frequencyHz: hz, ...(free ? { free } : {}) });
    const text = `storage modulus at ${hz} Hz: RMS ${sig(r.rmsLog10)} decades, largest ${sig(r.maxLog10)} decades over ${r.points} points (good up to 0.02, fair up to 0.05); fitted ${freeText(r.free)}; ${r.iterations} iterations, ${r.converged ? 'converged' : `not converged (${r.reason})`}`;
    return fittedBlock(r.params, r.free, r.quality, text, r.notes);
  },
});

/**
 * Spills the parameter block fitted to a DMA storage-modulus temperature sweep (PARAMS layout, usable as a material), with fit quality and notes below. Screening estimate.
 * @customfunction DMAFIT
 * @param start Starting point: family symbol such as "PC", or a parameter block range from DERATE.PARAMS.
 * @param sweep_range DMA table range: header temperature_C, storage_MPa (other units in the header, e.g. storage_GPa), temperatures increasing.
 * @param frequency_Hz Test frequency of the sweep, Hz (a number, or text such as "1 Hz").
 * @param [free] Parameter names to fit instead of the automatic choice, such as "Tg_C, beta" (or a range of names).
 * @returns {any[][]} Parameter block (field, value, unit, description), then rows starting with # for quality, fit, notes and caution.
 */
export function dmafit(start: unknown[][], sweep_range: unknown[][], frequency_Hz: unknown, free?: unknown[][]) {
  return DMAFIT.invoke(start, sweep_range, frequency_Hz, free);
}
