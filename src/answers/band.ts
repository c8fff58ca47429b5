/**
 * Low / central / high estimates from the ranges a family carries for Tg, Tm and the 23 degC modulus:
 * the model is evaluated at every corner of those ranges and the extremes are taken, so that the band
 * holds even where the modulus is not monotone in a parameter.
 */
import { compileMaterial, evaluateClocks, type Material, type Region } from '../material/model.js';
import { InputError, ParameterError } from '../base/errors.js';
import type { MaterialParams } from '../material/params.js';

export interface BandEstimate {
  readonly lowMPa: number;
  readonly centralMPa: number;
  readonly highMPa: number;
  readonly region: Region;
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
  // A Prony material carries no ranges: its band is the central value.
  if (m.prony) return [];
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
  return { lowMPa: low, centralMPa: central.modulusMPa, highMPa: high, region: central.region };
}
