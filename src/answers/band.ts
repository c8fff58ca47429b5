/**
 * Low / central / high estimates from the ranges a family carries for Tg, Tm and the 23 degC modulus:
 * the model is evaluated at every corner of those ranges and the extremes are taken, so that the band
 * holds even where the modulus is not monotone in a parameter. A Prony material carries no ranges: its
 * band comes from the uncertainty of its shifts and widens where it is evaluated beyond its data.
 */
import { compileMaterial, evaluateClocks, modulusMPa, type Material, type Region } from '../material/model.js';
import { shiftLog10 } from '../material/shift.js';
import { InputError, ParameterError } from '../base/errors.js';
import type { MaterialParams } from '../material/params.js';

export interface BandEstimate {
  readonly lowMPa: number;
  readonly centralMPa: number;
  readonly highMPa: number;
  readonly region: Region;
  /**
   * Decades of reduced time by which a Prony material is evaluated beyond the span its series describes
   * (pronySpanS); 0 inside it and for every four-region material. Front-ends say so when it is above 0.
   */
  readonly outsideDataDecades: number;
}

/**
 * Decades beyond its shortest and longest relaxation time over which a Prony series still describes
 * its master curve. Set here: one decade below the shortest time the fastest term has relaxed by 10 %
 * (exp(-0.1)); one decade above the longest the slowest is at exp(-10). Beyond, the series is flat at
 * its end values, which the data did not show.
 */
export const PRONY_SPAN_MARGIN_DECADES = 1;
/**
 * Half-width of a Prony material's band in decades of reduced time inside its span. Set here: twice the
 * tolerance of a fitted shift (mastercurve.ts SHIFT_TOLERANCE, 0.05 decades).
 */
export const PRONY_BAND_DECADES = 0.1;
/**
 * Widening of the band per decade outside the span, as a factor on the modulus (10^0.05, 12 %). Set
 * here: above the few % per decade a glass still relaxes (the families' creepN, 0.012 to 0.03), since
 * beyond its data a series can say nothing about the next transition.
 */
export const PRONY_OUTSIDE_LOG10_PER_DECADE = 0.05;

/** The reduced-time span (s, at the shift law's reference) a Prony material's series describes; null for a four-region material. */
export function pronySpanS(m: Material): readonly [number, number] | null {
  if (!m.prony) return null;
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of m.prony.terms) {
    if (!(t.EMPa > 0)) continue;
    if (t.tauS < lo) lo = t.tauS;
    if (t.tauS > hi) hi = t.tauS;
  }
  if (!(hi >= lo)) return null;
  const f = 10 ** PRONY_SPAN_MARGIN_DECADES;
  return [lo / f, hi * f];
}

/** Decades of reduced time by which (t s, T K) lies outside a Prony material's span; 0 inside and for four-region materials. */
export function outsideSpanDecades(m: Material, tS: number, TK: number): number {
  const span = pronySpanS(m);
  if (span === null) return 0;
  const lx = Math.log10(tS) - shiftLog10(m.shift, TK);
  return Math.max(0, Math.log10(span[0]) - lx, lx - Math.log10(span[1]));
}

/** Band of a Prony material: its shift uncertainty inside the span, widening with the decades outside it. */
function pronyBand(m: Material, tS: number, TK: number, central: number, region: Region): BandEstimate {
  const d = outsideSpanDecades(m, tS, TK);
  const k = 10 ** (PRONY_BAND_DECADES + d);
  let low = Math.min(central, modulusMPa(m, tS * k, TK));
  let high = Math.max(central, modulusMPa(m, tS / k, TK));
  if (d > 0) {
    const widen = 10 ** (PRONY_OUTSIDE_LOG10_PER_DECADE * d);
    low = Math.min(low, central / widen);
    high = Math.max(high, central * widen);
  }
  return { lowMPa: low, centralMPa: central, highMPa: high, region, outsideDataDecades: d };
}

interface Corner {
  readonly material: Material;
  /** The range fields this corner takes, for error messages ('Tg_high_C = 110, E23_low_MPa = 2000'). */
  readonly label: string;
}

const corners = new WeakMap<MaterialParams, readonly Corner[]>();

type Pick = readonly [value: number | null, field: string | null];

/** A corner that cannot be compiled or evaluated is reported against the range fields that make it. */
function cornerError(e: unknown, label: string): never {
  if (!(e instanceof ParameterError || e instanceof InputError)) throw e;
  const keys = label.split(', ').map((part) => part.split(' = ')[0] ?? '');
  // An unreachable 23 degC modulus is charged to the E23 end of the range when this corner takes one.
  const e23 = e instanceof ParameterError && e.field === 'E23_MPa' ? keys.find((k) => k.startsWith('E23_')) : undefined;
  const field = e23 ?? (keys[0] || 'Tg_C');
  throw new ParameterError(field, `the band corner ${label} cannot be evaluated (${e.message}); narrow the range`);
}

function cornerMaterials(m: Material): readonly Corner[] {
  const cached = corners.get(m.params);
  if (cached) return cached;
  const p = m.params;
  const pick = (lo: number | null, mid: number | null, hi: number | null, loKey: string, hiKey: string): Pick[] => {
    if (mid === null) return [[null, null]];
    const a: Pick = lo === null ? [mid, null] : [lo, loKey];
    const b: Pick = hi === null ? [mid, null] : [hi, hiKey];
    return a[0] === b[0] ? [a] : [a, b];
  };
  const list: Corner[] = [];
  for (const [Tg, tgKey] of pick(p.Tg_low_C, p.Tg_C, p.Tg_high_C, 'Tg_low_C', 'Tg_high_C')) {
    for (const [Tm, tmKey] of pick(p.Tm_low_C, p.Tm_C, p.Tm_high_C, 'Tm_low_C', 'Tm_high_C')) {
      for (const [E23, eKey] of pick(p.E23_low_MPa, p.E23_MPa, p.E23_high_MPa, 'E23_low_MPa', 'E23_high_MPa')) {
        const q: MaterialParams = { ...p, Tg_C: Tg ?? p.Tg_C, Tm_C: Tm, E23_MPa: E23 };
        q.Tg_low_C = q.Tg_high_C = q.Tm_low_C = q.Tm_high_C = q.E23_low_MPa = q.E23_high_MPa = null;
        if (q.Tm_C !== null && q.Tm_C < q.Tg_C + 10) continue;
        const parts: [string | null, number | null][] = [
          [tgKey, Tg],
          [tmKey, Tm],
          [eKey, E23],
        ];
        const label = parts
          .filter((x): x is [string, number] => x[0] !== null)
          .map(([k, v]) => `${k} = ${v}`)
          .join(', ');
        try {
          list.push({ material: compileMaterial(q), label });
        } catch (e) {
          cornerError(e, label);
        }
      }
    }
  }
  corners.set(p, list);
  return list;
}

/** Band (MPa) and region at time t (s) and temperature T (K). */
export function bandEstimate(m: Material, tS: number, TK: number): BandEstimate {
  const central = evaluateClocks(m, tS, TK);
  if (m.prony) return pronyBand(m, tS, TK, central.modulusMPa, central.region);
  let low = central.modulusMPa;
  let high = central.modulusMPa;
  for (const c of cornerMaterials(m)) {
    let e: number;
    try {
      e = evaluateClocks(c.material, tS, TK).modulusMPa;
    } catch (err) {
      cornerError(err, c.label);
    }
    if (e < low) low = e;
    if (e > high) high = e;
  }
  return { lowMPa: low, centralMPa: central.modulusMPa, highMPa: high, region: central.region, outsideDataDecades: 0 };
}
