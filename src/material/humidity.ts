/**
 * Polyamide moisture as a value: the relative humidity of the air a part has come to equilibrium with,
 * through a sorption isotherm to the water content, and the Tg of the wet amorphous phase by Gordon-Taylor
 * with water in the amorphous phase only (the crystals take none: Broudin et al., Eur. Polym. J. 67 (2015)
 * 326, abstract). Applied when a record is compiled (model.ts), so the service path is unchanged.
 *
 * In a parameter record with humidity_pct above 0, Tg_C is the dry Tg and E23_MPa the dry 23 degC modulus:
 * the wet grade shares the dry grade's glassy and crystal moduli and differs only in Tg. A record without
 * the field (every block written before it existed) reads humidity_pct = 0 and keeps its meaning.
 */
import { InputError } from '../base/errors.js';
import { KELVIN_OFFSET } from '../base/units.js';
import type { MaterialParams } from './params.js';

/** Tg of amorphous water, K (Johari, Hallbrucker and Mayer, Nature 330 (1987) 552; from memory). */
export const WATER_TG_K = 136;
/**
 * Gordon-Taylor constant of water in an aliphatic polyamide (set here: with the isotherms below it puts
 * PA6 and PA66 at 50 % RH some 40 K below dry, inside the handbook conditioned ranges, and their 23 degC
 * moduli within 20 % of the conditioned datasheet values; water plasticizes far more strongly than its Tg
 * alone suggests, from memory). The conditioned modulus is steep in Tg near 20 degC (about 10 % per K for
 * PA66), so it pins k and the 50 % RH water contents together, not each on its own.
 */
export const GORDON_TAYLOR_K_WATER = 6.8;

/** The relative humidity a bare polyamide symbol stands for, % (23 degC / 50 % RH, ISO 291 standard atmosphere). */
export const DEFAULT_RH_PCT = 50;

/**
 * A power-law sorption isotherm, w = waterSat (RH / 100)^sorptionN (mass fraction of the part): the
 * upward-curving (type III) shape of water in polyamides, fixed by two points, the water content at
 * 50 % RH and at saturation (23 degC).
 */
export interface Isotherm {
  /** Water content at 100 % RH (mass fraction of the part). */
  readonly waterSat: number;
  /** Exponent of the power law (1 = Henry's law). */
  readonly sorptionN: number;
}

/** The isotherm through the water contents at 50 % RH and at saturation (mass fractions). */
export function isothermThrough(water50: number, waterSat: number): Isotherm {
  return { waterSat, sorptionN: Math.log(waterSat / water50) / Math.LN2 };
}

/**
 * Water contents of the bundled polyamides at 23 degC, from memory (typical datasheet values, ISO 62
 * conditioning at 23 degC / 50 % RH and saturation in water): PA6 2.6 % and 9.5 %, PA66 2.6 % and 8.5 %
 * (datasheets give 2.5 to 3.5 % and 2.5 to 2.8 % at 50 % RH; the values inside those ranges were set here so
 * that the conditioned 23 degC moduli come within 20 % of their datasheet values, checks.ts).
 * Cross-checks (test/humidity.test.ts): a PA6 sorption measurement, 8.3 % at 95 % RH (Mettler-Toledo
 * application page "TGA sorption", polyamide 6); a PA66 one, up to 5 % at 90 % RH at 25 degC (Broudin et
 * al. 2015, abstract), below this curve (7 %): the curve errs wet, the softer and so cautious side.
 */
export const POLYAMIDE_ISOTHERMS: Readonly<Record<string, Isotherm & { readonly dry: string; readonly name: string }>> = {
  PA6: { ...isothermThrough(0.026, 0.095), dry: 'PA6-dry', name: 'polyamide 6' },
  PA66: { ...isothermThrough(0.026, 0.085), dry: 'PA66-dry', name: 'polyamide 66' },
};

/** The polyamide symbols that take a humidity, in table order. */
export const POLYAMIDES: readonly string[] = Object.keys(POLYAMIDE_ISOTHERMS);

/** Equilibrium water content (mass fraction of the part) at a relative humidity (%, 0 to 100) on a power-law isotherm. */
export function waterContent(rhPct: number, waterSat: number, sorptionN: number): number {
  if (rhPct <= 0 || waterSat <= 0) return 0;
  return waterSat * Math.min(1, rhPct / 100) ** sorptionN;
}

/**
 * Tg (degC) of a polymer plasticized by water: Gordon-Taylor, Tg = (w1 Tg1 + k w2 Tg2) / (w1 + k w2)
 * (Gordon and Taylor, J. Appl. Chem. 2 (1952) 493), with w2 the water's mass fraction of the amorphous
 * phase: water w of the part, all of it in the amorphous polymer (1 - w)(1 - X). X is the crystalline
 * fraction of the polymer (the model's volume fraction stands in for the mass fraction).
 */
export function gordonTaylorTgC(dryTgC: number, waterFraction: number, crystallinity: number, k = GORDON_TAYLOR_K_WATER): number {
  if (waterFraction <= 0) return dryTgC;
  const w2 = waterFraction / (waterFraction + (1 - waterFraction) * (1 - crystallinity));
  const w1 = 1 - w2;
  return (w1 * (dryTgC + KELVIN_OFFSET) + k * w2 * WATER_TG_K) / (w1 + k * w2) - KELVIN_OFFSET;
}

/** True when the record takes up water at its humidity (a thermoplastic with humidity_pct and waterSat above 0). */
export function isHumid(p: MaterialParams): boolean {
  return p.kind !== 'crosslinked' && p.humidity_pct > 0 && p.waterSat > 0;
}

/** The record's equilibrium water content (mass fraction of the part) at its humidity_pct. */
export function waterOf(p: MaterialParams): number {
  return isHumid(p) ? waterContent(p.humidity_pct, p.waterSat, p.sorptionN) : 0;
}

/**
 * The Tg the model uses (degC): Tg_C itself, or for a humid record the wet Tg from Tg_C (dry) by
 * Gordon-Taylor. Never above Tg_C (a dry Tg below water's own would otherwise rise).
 */
export function wetTgC(p: MaterialParams, TgC = p.Tg_C): number {
  if (!isHumid(p)) return TgC;
  const X = p.kind === 'semicrystalline' ? p.crystallinity : 0;
  return Math.min(TgC, gordonTaylorTgC(TgC, waterOf(p), X));
}

/** The same record at 0 % RH (dry as moulded). */
export function dryRecord(p: MaterialParams): MaterialParams {
  return { ...p, humidity_pct: 0 };
}

/**
 * The record at another relative humidity (%, 0 to 100), nothing else changed; refuses a material that
 * takes up no water (waterSat 0), naming `argument`.
 */
export function withHumidity(p: MaterialParams, rhPct: number, argument = 'humidity'): MaterialParams {
  if (!(rhPct >= 0 && rhPct <= 100)) throw new InputError(argument, `relative humidity must be 0 to 100 %, got ${rhPct}`);
  if (!(p.waterSat > 0) || p.kind === 'crosslinked') {
    throw new InputError(
      argument,
      `a humidity applies to polyamides only (${POLYAMIDES.join(', ')}); ${p.id} takes up no water in this model (waterSat 0)`,
    );
  }
  return { ...p, humidity_pct: rhPct };
}

/** A symbol and its trailing humidity clause, as splitHumidity reads them. */
export interface SplitSymbol {
  /** The symbol without the clause, trimmed. */
  readonly symbol: string;
  /** The relative humidity in %, or null without a clause. */
  readonly rhPct: number | null;
}

const CLAUSE = /^(.*?)\s*(?:\bat\b|@)\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)\s*%\s*r\.?\s*h\.?\s*$/i;
const LOOSE_CLAUSE = /(?:\s\bat\s+\S|@)/i;

/**
 * Splits "PA66 at 70 % RH" (also "PA66 @ 70%RH", any case) into the symbol and the relative humidity (%);
 * text without a clause comes back whole with rhPct null. A clause that does not read, or a humidity
 * outside 0 to 100 %, throws InputError naming `argument`.
 */
export function splitHumidity(text: string, argument = 'family'): SplitSymbol {
  const t = text.trim();
  const m = CLAUSE.exec(t);
  if (!m) {
    if (LOOSE_CLAUSE.test(t)) {
      throw new InputError(
        argument,
        `cannot read the humidity in "${t}"; write it as "PA66 at 50 % RH" (a relative humidity from 0 to 100 %)`,
      );
    }
    return { symbol: t, rhPct: null };
  }
  const rh = Number(m[2]);
  if (!(rh >= 0 && rh <= 100)) throw new InputError(argument, `relative humidity must be 0 to 100 %, got ${m[2] ?? ''} % in "${t}"`);
  return { symbol: (m[1] ?? '').trim(), rhPct: rh === 0 ? 0 : rh };
}

/**
 * Fraction of the equilibrium uptake reached after time t by a plane wall of thickness l, both faces
 * exposed, constant diffusivity D (SI units): M_t / M_inf = 1 - sum 8 / ((2n+1)^2 pi^2) exp(-D (2n+1)^2 pi^2 t / l^2)
 * (Crank, The Mathematics of Diffusion, 2nd ed. 1975, eq. 4.18, from memory).
 */
export function uptakeFraction(tS: number, thicknessM: number, diffusivityM2s: number): number {
  if (tS <= 0) return 0;
  const tau = (diffusivityM2s * tS) / (thicknessM * thicknessM);
  let sum = 0;
  for (let n = 0; n < 200; n++) {
    const k = (2 * n + 1) * Math.PI;
    const term = (8 / (k * k)) * Math.exp(-k * k * tau);
    sum += term;
    if (term < 1e-16) break;
  }
  return Math.max(0, 1 - sum);
}

/**
 * Time (s) for a plane wall of thickness l (m), both faces exposed, to take up a fraction (0 to 1, exclusive)
 * of its equilibrium water at diffusivity D (m2/s): the root of uptakeFraction by bisection in log time.
 */
export function uptakeTimeS(fraction: number, thicknessM: number, diffusivityM2s: number): number {
  if (!(fraction > 0 && fraction < 1)) throw new InputError('fraction', `must lie between 0 and 1, got ${fraction}`);
  const scale = (thicknessM * thicknessM) / diffusivityM2s;
  let lo = Math.log(1e-9 * scale);
  let hi = Math.log(1e3 * scale);
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = (lo + hi) / 2;
    if (uptakeFraction(Math.exp(mid), thicknessM, diffusivityM2s) < fraction) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/**
 * Diffusivity of water in PA6 and PA66 at 23 degC, m2/s: order 1e-13 to 1e-12 (from memory; it rises
 * with the water content, the diffusion being Fickian with a D that depends on water activity: Broudin
 * et al. 2015, abstract). The lower value is used for the equilibrium-time note (set here: the slower,
 * so the note does not promise equilibrium sooner than it comes).
 */
export const WATER_DIFFUSIVITY_23C_M2S = 3e-13;

/** Days for a wall of thickness l (mm) to reach 90 % of its equilibrium water at 23 degC (the family-note figure). */
export function equilibriumDays(thicknessMm: number, diffusivityM2s = WATER_DIFFUSIVITY_23C_M2S): number {
  return uptakeTimeS(0.9, thicknessMm / 1000, diffusivityM2s) / 86400;
}
