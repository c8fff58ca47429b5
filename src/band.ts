/**
 * Low / central / high estimates from the ranges a family carries for Tg, Tm and the 23 degC modulus:
 * the model is evaluated at every corner of those ranges and the extremes are taken, so that the band
 * holds even where the modulus is not monotone in a parameter.
 */
import { compileMaterial, evaluateClocks, type Material, type Region } from './model.js';
import type { MaterialParams } from './params.js';

export interface BandEstimate {
  readonly lowMPa: number;
  readonly centralMPa: number;
  readonly highMPa: number;
  readonly region: Region;
}

const corners = new WeakMap<MaterialParams, readonly Material[]>();

function cornerMaterials(m: Material): readonly Material[] {
  const cached = corners.get(m.params);
  if (cached) return cached;
  // A Prony material carries no ranges: its band is the central value.
  if (m.prony) return [];
  const p = m.params;
  const pick = (lo: number | null, mid: number | null, hi: number | null): (number | null)[] =>
    mid === null ? [null] : [...new Set([lo ?? mid, hi ?? mid])];
  const list: Material[] = [];
  for (const Tg of pick(p.Tg_low_C, p.Tg_C, p.Tg_high_C)) {
    for (const Tm of pick(p.Tm_low_C, p.Tm_C, p.Tm_high_C)) {
      for (const E23 of pick(p.E23_low_MPa, p.E23_MPa, p.E23_high_MPa)) {
        const q: MaterialParams = { ...p, Tg_C: Tg ?? p.Tg_C, Tm_C: Tm, E23_MPa: E23 };
        q.Tg_low_C = q.Tg_high_C = q.Tm_low_C = q.Tm_high_C = q.E23_low_MPa = q.E23_high_MPa = null;
        if (q.Tm_C !== null && q.Tm_C < q.Tg_C + 10) continue;
        list.push(compileMaterial(q));
      }
    }
  }
  corners.set(p, list);
  return list;
}

/** Band (MPa) and region at time t (s) and temperature T (K). */
export function bandEstimate(m: Material, tS: number, TK: number): BandEstimate {
  const central = evaluateClocks(m, tS, TK);
  let low = central.modulusMPa;
  let high = central.modulusMPa;
  for (const c of cornerMaterials(m)) {
    const e = evaluateClocks(c, tS, TK).modulusMPa;
    if (e < low) low = e;
    if (e > high) high = e;
  }
  return { lowMPa: low, centralMPa: central.modulusMPa, highMPa: high, region: central.region };
}
