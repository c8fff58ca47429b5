/** A valid value for every argument kind, so a call of any worksheet function can be built from its specs. */
import type { ArgKind } from '../../functions/core/args.js';
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
};

/** Where one kind's sample would not give an answer (a limit not reached, an empty range of a curve). */
export const VALID_BY_NAME: Record<string, unknown> = { from_temperature: 20, to_temperature: 200, required_modulus: 2000 };

export function validArgs(def: FunctionDef): unknown[] {
  return def.args.map((a) => (a.name in VALID_BY_NAME ? VALID_BY_NAME[a.name] : VALID[a.kind]));
}
