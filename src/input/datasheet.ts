/**
 * Datasheet numbers of a calibration (Tg, Tm; the HDTs are in hdt.ts): their ranges are those of the
 * parameter fields they set (material/params.ts), and the checks that need the starting material.
 */
import { InputError } from '../base/errors.js';
import { cToKelvin, kelvinToC } from '../base/units.js';
import { NUMERIC_FIELDS, type MaterialParams, type NumericField } from '../material/params.js';
import type { Quantity, Raw } from './quantity.js';
import { temperatureInRange } from './temperature.js';

/** A temperature in the range of a parameter field (degC). */
function fieldTemperature(key: NumericField): Quantity<number> {
  const f = NUMERIC_FIELDS.find((x) => x.key === key);
  if (!f) throw new Error(`no parameter field ${key}`);
  return temperatureInRange(f.min, f.max);
}

// Marked pure so that a bundle without calibration drops them.
/** A datasheet glass transition temperature, in the range of the Tg_C field; parsed to kelvin. */
export const glassTransitionInput: Quantity<number> = /* @__PURE__ */ fieldTemperature('Tg_C');

/** A datasheet melting temperature, in the range of the Tm_C field; parsed to kelvin. */
export const meltingInput: Quantity<number> = /* @__PURE__ */ fieldTemperature('Tm_C');

/**
 * Checks a datasheet Tm against the starting material: only a semi-crystalline material has one, and it
 * lies above Tg (the datasheet Tg if given, else the start's). `raw` is what was typed.
 */
export function checkMelting(TmK: number, raw: Raw, TgK: number | undefined, start: MaterialParams, name: string): void {
  if (start.kind !== 'semicrystalline') {
    throw new InputError(name, `is only used for semi-crystalline materials and ${start.id} is ${start.kind}; leave it empty`);
  }
  const TgRef = TgK ?? cToKelvin(start.Tg_C);
  if (!(TmK > TgRef)) {
    const TgC = Math.round(kelvinToC(TgRef) * 100) / 100;
    throw new InputError(
      name,
      `must be above Tg (${TgK === undefined ? `${start.id}'s ` : ''}${TgC} degC), got ${typeof raw === 'string' ? raw.trim() : raw}`,
    );
  }
}
