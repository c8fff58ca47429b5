/** The derating table of a design review: modulus at service temperatures and its ratio to a reference. */
import { InputError } from '../base/errors.js';
import { checkTemperatureInDomain, modulusMPa, RELAXED_MPA, type Material, type Region } from '../material/model.js';
import { evaluateClocks } from '../material/model.js';
import { resolveMaterial, type MaterialInput } from '../material/resolve.js';
import { cToKelvin, kelvinToC, MODEL_TIME_S, SECONDS_PER_HOUR } from '../base/units.js';

/** Reference state of a derating ratio: 23 degC, 1 h (common practice for a short-term room-temperature value). */
export const RATIO_REF_C = 23;
export const RATIO_REF_S = SECONDS_PER_HOUR;

export interface TableCell {
  readonly temperatureC: number;
  readonly modulusMPa: number;
  /** modulus / reference; null where the material has relaxed to nothing at 23 degC, 1 h (a melt): no ratio then. */
  readonly ratio: number | null;
  readonly region: Region;
}

export interface TableRow {
  readonly id: string;
  readonly name: string;
  /** Modulus at 23 degC after 1 h, MPa (the moduli stand without it). */
  readonly referenceMPa: number;
  readonly cells: readonly TableCell[];
}

/**
 * The modulus (MPa) at a reference state, refused where the material has relaxed to nothing there
 * (below RELAXED_MPA), since no ratio to it means anything. Errors name the inputs the reference came
 * from: its temperature, or its time when the material is still solid at that temperature after 1 ms.
 */
function referenceMPa(m: Material, refTS: number, refTK: number, names: { T: string; t: string }): number {
  const E = modulusMPa(m, refTS, checkTemperatureInDomain(m, refTK, names.T));
  if (E >= RELAXED_MPA) return E;
  const cause = modulusMPa(m, MODEL_TIME_S[0], refTK) < RELAXED_MPA ? names.T : names.t;
  throw new InputError(
    cause,
    `${m.params.id} has relaxed to nothing at the reference (${Number(kelvinToC(refTK).toPrecision(4))} degC after ${Number((refTS / SECONDS_PER_HOUR).toPrecision(4))} h: ${E === 0 ? '0' : `below ${RELAXED_MPA}`} MPa, a melt), so a ratio to it has no meaning; choose a reference where it is still solid`,
  );
}

/** Derating ratio E(t, T) / E(tRef, Tref) (dimensionless); times in s, temperatures in K. */
export function deratingRatio(m: Material, tS: number, TK: number, refTK = cToKelvin(RATIO_REF_C), refTS = RATIO_REF_S): number {
  const ref = referenceMPa(m, refTS, refTK, { T: 'ref_temperature', t: 'ref_time' });
  return modulusMPa(m, tS, TK) / ref;
}

/** The temperature (K) of a table column, its shift law checked; errors name `temperatures`. */
function columnK(m: Material, TC: number): number {
  return checkTemperatureInDomain(m, cToKelvin(TC), 'temperatures');
}

/** Rows of moduli (MPa) and ratios for each material at each temperature (degC) after time t (s). */
export function deratingTable(materials: readonly MaterialInput[], temperaturesC: readonly number[], tS: number): TableRow[] {
  return materials.map((input) => {
    const m = resolveMaterial(input);
    const ref = modulusMPa(m, RATIO_REF_S, checkTemperatureInDomain(m, cToKelvin(RATIO_REF_C), 'materials'));
    const cells = temperaturesC.map((T) => {
      const e = evaluateClocks(m, tS, columnK(m, T));
      return { temperatureC: T, modulusMPa: e.modulusMPa, ratio: ref >= RELAXED_MPA ? e.modulusMPa / ref : null, region: e.region };
    });
    return { id: m.params.id, name: m.params.name, referenceMPa: ref, cells };
  });
}

/**
 * Evenly spaced temperatures (K) from fromK to toK and the modulus (MPa) at each after time t (s), for
 * a chart. The shift law must be defined over the whole span; the error names from_temperature, the
 * cold end, where a pure WLF law fails first.
 */
export function modulusCurve(m: Material, fromK: number, toK: number, points: number, tS: number): [number, number][] {
  if (!(toK > fromK)) {
    const C = (K: number): number => Math.round(kelvinToC(K) * 1e9) / 1e9;
    throw new InputError('to_temperature', `must be above from_temperature (${C(fromK)} degC), got ${C(toK)} degC`);
  }
  if (!Number.isInteger(points) || points < 2) throw new InputError('points', `must be a whole number of 2 or more, got ${points}`);
  checkTemperatureInDomain(m, fromK, 'from_temperature');
  const out: [number, number][] = [];
  for (let i = 0; i < points; i++) {
    const TK = fromK + ((toK - fromK) * i) / (points - 1);
    out.push([TK, modulusMPa(m, tS, TK)]);
  }
  return out;
}
