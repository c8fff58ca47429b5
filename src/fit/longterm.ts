/**
 * What a calibration did to the long-term answers its inputs say nothing about. A datasheet (23 degC modulus,
 * HDT, Tg, Tm) informs the short term and the transitions; the relaxation modulus over 1000 h near the service
 * limit and the apparent Tg over 1000 h should move only as far as those inputs move them: with the 23 degC
 * modulus (a common scale) and with Tg or Tm (a common shift of temperature). Whatever moves beyond that came
 * from freeing the relaxation spectrum, and the calibration says so.
 */
import { compileMaterial, DATASHEET_TIME_S, modulusMPa, T23_K, type Material } from '../material/model.js';
import type { MaterialParams } from '../material/params.js';
import { temperatureForShiftK } from '../material/shift.js';
import { KELVIN_OFFSET } from '../base/units.js';

/** Time of the long-term answers, s (1000 h, the usual design-guide horizon). */
export const LONG_TERM_S = 1000 * 3600;
/** Relative change of a long-term modulus, beyond the 23 degC scale, that the inputs do not justify (set here: 20 %). */
export const LONG_TERM_MODULUS_REL = 0.2;
/** Change of the 1000 h apparent Tg, beyond the change of Tg, that the inputs do not justify, K (set here). */
export const LONG_TERM_TG_K = 5;
/** Kelvin below Tg of the hot long-term answer of an amorphous or crosslinked material (set here: near its service limit). */
export const LONG_TERM_BELOW_TG_K = 30;

/** One long-term answer before and after, and whether it moved more than the inputs justify. */
export interface LongTermChange {
  readonly answer: string;
  readonly unit: 'MPa' | 'degC';
  readonly before: number;
  readonly after: number;
  /** Change beyond what the inputs justify: relative (moduli) or kelvin (apparent Tg). */
  readonly unjustified: number;
  readonly tooFar: boolean;
}

/** The hot service temperature of the long-term check (K), tied to the transition that limits the material. */
function hotK(p: MaterialParams): number {
  return Math.max(T23_K, p.Tg_C - LONG_TERM_BELOW_TG_K + KELVIN_OFFSET);
}

function apparentTgC(m: Material): number | null {
  const T = temperatureForShiftK(m.shift, Math.log10(LONG_TERM_S / m.tauTg));
  return T === null ? null : T - KELVIN_OFFSET;
}

/** Long-term answers of the start and calibrated records, each with the change the inputs do not explain. */
export function longTermChanges(start: MaterialParams, fitted: MaterialParams): LongTermChange[] {
  const a = compileMaterial(start);
  const b = compileMaterial(fitted);
  const scale = modulusMPa(b, DATASHEET_TIME_S, T23_K) / modulusMPa(a, DATASHEET_TIME_S, T23_K);
  const out: LongTermChange[] = [];
  const modulus = (TaK: number, TbK: number): void => {
    const before = modulusMPa(a, LONG_TERM_S, TaK);
    const after = modulusMPa(b, LONG_TERM_S, TbK);
    const unjustified = before > 0 ? after / (before * scale) - 1 : 0;
    out.push({
      answer: `relaxation modulus 1000 h ${Number((TaK - KELVIN_OFFSET).toFixed(1))} degC`,
      unit: 'MPa',
      before,
      after,
      unjustified,
      tooFar: Math.abs(Math.log1p(unjustified)) > Math.log1p(LONG_TERM_MODULUS_REL),
    });
  };
  modulus(T23_K, T23_K);
  const ha = hotK(start);
  // The hot answer moves with Tg where that was an input; the 23 degC one does not. A semi-crystalline
  // material's hot long-term modulus is its crystal plateau, which its HDT values do inform: not checked.
  if (ha > T23_K && start.kind !== 'semicrystalline') modulus(ha, Math.max(T23_K, hotK(fitted)));
  const ga = apparentTgC(a);
  const gb = apparentTgC(b);
  if (ga !== null && gb !== null) {
    const unjustified = gb - ga - (fitted.Tg_C - start.Tg_C);
    out.push({
      answer: 'apparent Tg over 1000 h',
      unit: 'degC',
      before: ga,
      after: gb,
      unjustified,
      tooFar: Math.abs(unjustified) > LONG_TERM_TG_K,
    });
  }
  return out;
}
