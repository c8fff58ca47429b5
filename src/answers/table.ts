/** The derating table of a design review: modulus at service temperatures and its ratio to a reference. */
import { InputError } from '../base/errors.js';
import { checkTemperatureInDomain, modulusMPa, type Material, type Region } from '../material/model.js';
import { evaluateClocks } from '../material/model.js';
import { resolveMaterial, type MaterialInput } from '../material/resolve.js';
import { cToKelvin, SECONDS_PER_HOUR } from '../base/units.js';

/** Reference state of a derating ratio: 23 degC, 1 h (common practice for a short-term room-temperature value). */
export const RATIO_REF_C = 23;
export const RATIO_REF_S = SECONDS_PER_HOUR;

export interface TableCell {
  readonly temperatureC: number;
  readonly modulusMPa: number;
  readonly ratio: number;
  readonly region: Region;
}

export interface TableRow {
  readonly id: string;
  readonly name: string;
  readonly referenceMPa: number;
  readonly cells: readonly TableCell[];
}

/** E / reference, refused when the material is (numerically) fully relaxed at the reference, where no ratio exists. */
function ratioTo(E: number, refMPa: number, id: string): number {
  const r = E / refMPa;
  if (!Number.isFinite(r)) {
    throw new InputError(
      'reference',
      `${id}: the modulus at the reference state is ${refMPa} MPa (fully relaxed there), so a ratio to it is undefined`,
    );
  }
  return r;
}

/** Modulus at the reference state; a shift law undefined there is reported against the reference. */
function referenceMPa(m: Material, refTS: number, refTK: number): number {
  return modulusMPa(m, refTS, checkTemperatureInDomain(m, refTK, 'reference'));
}

/** Derating ratio E(t, T) / E(tRef, Tref) (dimensionless); times in s, temperatures in K. */
export function deratingRatio(m: Material, tS: number, TK: number, refTK = cToKelvin(RATIO_REF_C), refTS = RATIO_REF_S): number {
  return ratioTo(modulusMPa(m, tS, TK), referenceMPa(m, refTS, refTK), m.params.id);
}

/** Rows of moduli (MPa) and ratios for each material at each temperature (degC) after time t (s). */
export function deratingTable(materials: readonly MaterialInput[], temperaturesC: readonly number[], tS: number): TableRow[] {
  return materials.map((input) => {
    const m = resolveMaterial(input);
    const ref = referenceMPa(m, RATIO_REF_S, cToKelvin(RATIO_REF_C));
    const cells = temperaturesC.map((T) => {
      const e = evaluateClocks(m, tS, cToKelvin(T));
      return { temperatureC: T, modulusMPa: e.modulusMPa, ratio: ratioTo(e.modulusMPa, ref, m.params.id), region: e.region };
    });
    return { id: m.params.id, name: m.params.name, referenceMPa: ref, cells };
  });
}
