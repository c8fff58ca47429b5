// @load on-first-call
/**
 * Relaxation to creep: the apparent creep modulus under a constant load. Loaded on first call in Excel:
 * the Prony fit and exact interconversion behind it (prony.ts, nnls.ts, creep.ts) would put the
 * start-up script over its gzip budget (see scripts/build/20-functions.mjs).
 */
import { creepModulusMPa } from '../src/index.js';
import { material } from './core/args/material.js';
import { temperature } from './core/args/temperature.js';
import { time } from './core/args/time.js';
import { defineScalar } from './core/define.js';

export const CREEPMOD = defineScalar({
  id: 'CREEPMOD',
  args: [material('material'), temperature('temperature'), time('time')],
  run: (m, TK, tS) => creepModulusMPa(m, tS, TK),
});

/**
 * Apparent creep modulus 1/D(t) in MPa: stress over creep strain after the time under a constant load at the temperature (from the relaxation model, Schapery-Park interconversion). Screening estimate.
 * @customfunction CREEPMOD
 * @param material Family symbol such as "PC", a parameter block range from DERATE.PARAMS, or a Prony table from DERATE.FITCURVES.
 * @param temperature Service temperature: a number in degC, or text with a unit such as "176 degF" or "350 K".
 * @param time Time under constant load: a number in hours (h), or text with a unit such as "1000 h" or "10 years".
 * @returns {number} Apparent creep modulus (stress / creep strain), MPa.
 */
export function creepmod(material: unknown[][], temperature: unknown, time: unknown) {
  return CREEPMOD.invoke(material, temperature, time);
}
