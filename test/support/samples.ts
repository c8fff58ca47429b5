/** A valid value for every argument kind, so a call of any worksheet function can be built from its specs. */
import { readFileSync } from 'node:fs';
import { parseCsv } from '../../src/index.js';
import type { ArgKind } from '../../functions/core/args/spec.js';
import type { FunctionDef } from '../../functions/core/define.js';

export const VALID: Record<ArgKind, unknown> = {
  material: [['PC']],
  materials: [['PC'], ['PBT']],
  family: 'PC',
  temperature: 80,
  temperatures: [[70], [30]],
  time: 1000,
  durations: [[8], [16]],
  modulus: 800,
  stress: 1.8,
  strain: 0.01,
  count: 5,
  cycles: 10,
  // Invented demo data (see the files' first line), as the cells of a worksheet range.
  curves: parseCsv(readFileSync('demo/latch-pc-relaxation-invented.csv', 'utf8')),
  sweep: parseCsv(readFileSync('demo/latch-pc-dma-invented.csv', 'utf8')),
  frequency: 1,
  // Left empty: the automatic choice of parameters (a name that suits every fit does not exist).
  fields: null,
};

/** Where one kind's sample would not give an answer (a limit not reached, an empty range of a curve). */
export const VALID_BY_NAME: Record<string, unknown> = {
  from_temperature: 20,
  to_temperature: 200,
  required_modulus: 2000,
  // A datasheet calibration of PC: modulus at 23 degC, HDT/A and Tg of an unfilled grade (common practice, from memory);
  // Tm does not apply to an amorphous family, and one creep modulus is enough elsewhere (test/functions.calibration.test.ts).
  modulus23: 2300,
  hdt_a: 128,
  hdt_b: null,
  tg: 147,
  tm: null,
  creep_time: null,
  creep_temp: null,
  creep_modulus: null,
  reference: null,
  terms_per_decade: null,
  // EQTIME's default, the hottest segment: a drawn reference far colder than the cycle is refused (history.ts), so the
  // drawn calls would seldom reach an answer; RATIO's ref_temperature takes its 23 degC default when empty.
  ref_temperature: null,
};

export function validArgs(def: FunctionDef): unknown[] {
  return def.args.map((a) => (a.name in VALID_BY_NAME ? VALID_BY_NAME[a.name] : VALID[a.kind]));
}
