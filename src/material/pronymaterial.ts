/**
 * A material given as a Prony series plus a shift law, as fitted from the user's own test curves
 * (mastercurve.ts) or typed in: every engine function accepts it in place of a family or parameter
 * record (resolveMaterial). E(t, T) = E_inf + sum E_i exp(-t / (tau_i a_T(T))), with tau_i at the
 * reference temperature of the master curve and a_T = 1 there. Thermorheologically simple by
 * construction: no slow-creep clock, no melting, no entropic rise.
 *
 * Plain-table form (worksheet range or CSV), one key and value per row, then the series:
 *   prony        | <id>
 *   name         | <text>             (optional)
 *   reference_C  | 150
 *   shiftLaw     | wlf | arrhenius | hybrid
 *   Tg_C         | 147                (hybrid: Arrhenius below Tg, WLF above; optional otherwise)
 *   C1           | 8.9                (WLF, with reference_C as reference)
 *   C2_K         | 110                (WLF, with reference_C as reference)
 *   Ea_kJmol     | 600                (Arrhenius)
 *   E_inf_MPa    | 1.8
 *   tau_s        | E_MPa              (header of the series)
 *   0.001        | 120
 *   ...
 */
import { InputError, ParameterError } from '../base/errors.js';
import type { Material } from './model.js';
import { DATASHEET_TIME_S, evaluateClocks, T23_K } from './model.js';
import { fieldSpec, type MaterialParams } from './params.js';
import { pronyGlassyMPa, pronyModulusMPa, type PronySeries } from './prony.js';
import { brentRoot } from '../numeric/roots.js';
import { maxOf, minOf } from '../numeric/arrays.js';
import { rereferenceWlf, SHIFT_LAWS, WLF_REF_C1_RANGE, WLF_REF_C2_RANGE_K, wlfLog10, type ShiftConstants, type ShiftLaw } from './shift.js';
import { blankParams } from './families.js';
import { KELVIN_OFFSET, MODEL_TEMPERATURE_K } from '../base/units.js';

/** A Prony-series material (times in s at the reference temperature, moduli MPa, WLF constants at the reference). */
export interface PronyMaterialSpec {
  readonly id: string;
  readonly name: string;
  readonly referenceC: number;
  readonly prony: PronySeries;
  readonly shiftLaw: ShiftLaw;
  readonly TgC: number | null;
  readonly C1: number | null;
  readonly C2K: number | null;
  readonly EakJmol: number | null;
}

/** True when the value is a Prony material spec (as opposed to a family id or a parameter record). */
export function isPronySpec(x: unknown): x is PronyMaterialSpec {
  return typeof x === 'object' && x !== null && 'prony' in x && 'referenceC' in x;
}

const compiled = new WeakMap<PronyMaterialSpec, Material>();

function need(v: number | null, field: string, law: string): number {
  if (v === null || !Number.isFinite(v)) throw new ParameterError(field, `is required for the ${law} shift law`);
  return v;
}

/**
 * Most terms a Prony series may have. Set here: FITCURVES writes one to four per decade over the
 * decades of the data (some 100 at most); the exact creep conversion costs the square of the count.
 */
export const MAX_PRONY_TERMS = 1000;

/** A shift constant inside its bounds (those of the parameter record, or of the master-curve fit). */
function within(v: number | null, field: string, [lo, hi]: readonly [number, number], unit: string, what: string): void {
  if (v === null) return;
  if (!Number.isFinite(v) || v < lo || v > hi) {
    throw new ParameterError(
      field,
      `${v}${unit} is outside ${lo} to ${hi}${unit} (${what}); stiffness would not fall with temperature as it must`,
      v,
    );
  }
}

/** Checks every shift constant of a spec against the same bounds a parameter block has, so that a_T falls with T. */
function checkShiftConstants(spec: PronyMaterialSpec): void {
  const [loK, hiK] = MODEL_TEMPERATURE_K;
  within(spec.referenceC, 'reference_C', [loK - KELVIN_OFFSET, hiK - KELVIN_OFFSET], ' degC', "the model's temperature range");
  const tg = fieldSpec('Tg_C');
  within(spec.TgC, 'Tg_C', [tg.min, tg.max], ' degC', tg.description);
  const ea = fieldSpec('Ea_kJmol');
  within(spec.EakJmol, 'Ea_kJmol', [ea.min, ea.max], ' kJ/mol', ea.description);
  within(spec.C1, 'C1', WLF_REF_C1_RANGE, '', 'WLF C1 with reference_C as reference');
  within(spec.C2K, 'C2_K', WLF_REF_C2_RANGE_K, ' K', 'WLF C2 with reference_C as reference');
}

/** Checks a spec and compiles it into a material the engine evaluates (cached per spec object). */
export function compilePronyMaterial(spec: PronyMaterialSpec): Material {
  const cached = compiled.get(spec);
  if (cached) return cached;
  const p = spec.prony;
  if (typeof spec.id !== 'string' || spec.id.trim() === '') throw new ParameterError('prony', 'needs a non-empty name for the material');
  if (!Number.isFinite(spec.referenceC) || spec.referenceC <= -KELVIN_OFFSET) {
    throw new ParameterError('reference_C', `must be a temperature above absolute zero, got ${spec.referenceC}`);
  }
  if (!(p.EinfMPa >= 0) || !Number.isFinite(p.EinfMPa)) throw new ParameterError('E_inf_MPa', `must be zero or positive, got ${p.EinfMPa}`);
  if (p.terms.length === 0) throw new ParameterError('tau_s', 'the series needs at least one term');
  if (p.terms.length > MAX_PRONY_TERMS) {
    throw new ParameterError(
      'tau_s',
      `the series has ${p.terms.length} terms; at most ${MAX_PRONY_TERMS} are accepted (a fit needs one to four per decade of time)`,
    );
  }
  p.terms.forEach((t, i) => {
    if (!(t.tauS > 0) || !Number.isFinite(t.tauS))
      throw new ParameterError('tau_s', `term ${i + 1}: must be a positive time in s, got ${t.tauS}`);
    if (!(t.EMPa >= 0) || !Number.isFinite(t.EMPa))
      throw new ParameterError('E_MPa', `term ${i + 1}: must be zero or positive, got ${t.EMPa}`);
  });
  const Eg = pronyGlassyMPa(p);
  if (!(Eg > 0)) throw new ParameterError('E_MPa', 'the series has no stiffness (every weight is zero)');
  if (!SHIFT_LAWS.includes(spec.shiftLaw)) {
    throw new ParameterError('shiftLaw', `must be one of ${SHIFT_LAWS.join(', ')}, got '${String(spec.shiftLaw)}'`);
  }
  checkShiftConstants(spec);
  const TrefK = spec.referenceC + KELVIN_OFFSET;
  let shift: ShiftConstants;
  let timeFactor = 1;
  if (spec.shiftLaw === 'arrhenius') {
    shift = { law: 'arrhenius', TrefK, C1: 17.44, C2K: 51.6, EakJ: need(spec.EakJmol, 'Ea_kJmol', 'arrhenius') };
  } else {
    const C1 = need(spec.C1, 'C1', spec.shiftLaw);
    const C2 = need(spec.C2K, 'C2_K', spec.shiftLaw);
    if (spec.shiftLaw === 'wlf') {
      shift = { law: 'wlf', TrefK, C1, C2K: C2, EakJ: spec.EakJmol ?? 300 };
    } else {
      const TgK = need(spec.TgC, 'Tg_C', 'hybrid') + KELVIN_OFFSET;
      const Ea = need(spec.EakJmol, 'Ea_kJmol', 'hybrid');
      if (C2 + TgK - TrefK <= 0) {
        throw new ParameterError(
          'Tg_C',
          `${spec.TgC} degC lies below the WLF singularity of these constants (reference - C2 = ${(spec.referenceC - C2).toFixed(1)} degC)`,
        );
      }
      const g = rereferenceWlf(C1, C2, TrefK, TgK);
      shift = { law: 'hybrid', TrefK: TgK, C1: g.C1, C2K: g.C2K, EakJ: Ea };
      // Relaxation times move from the master-curve reference to Tg: tau_g = tau_ref / a(Tref relative to Tg).
      timeFactor = 10 ** -wlfLog10(TrefK, TgK, g.C1, g.C2K);
    }
  }
  const series: PronySeries = { EinfMPa: p.EinfMPa, terms: p.terms.map((t) => ({ EMPa: t.EMPa, tauS: t.tauS * timeFactor })) };
  const params: MaterialParams = {
    ...blankParams(spec.id, 'amorphous'),
    name: spec.name || spec.id,
    shiftLaw: shift.law,
    Tg_C: shift.TrefK - KELVIN_OFFSET,
    Eg_MPa: Math.min(20000, Math.max(50, Eg)),
    C1: shift.C1,
    C2_K: shift.C2K,
    Ea_kJmol: shift.EakJ,
    creepN: 0,
  };
  const tauTg = halfwayTime(series);
  const material: Material = {
    params,
    kind: 'amorphous',
    shift,
    EgMPa: Eg,
    tauTg,
    beta: 1,
    tauFlow: Infinity,
    lnTauTg: Math.log(tauTg),
    lnFlowRatio: Infinity,
    flowBeta: 1,
    plateau: series.EinfMPa,
    creepN: 0,
    creepLog10PerInvK: 0,
    crystallinity: 0,
    phi: 1,
    TmK: Infinity,
    meltSharpness: 1,
    meltOnsetK: Infinity,
    networkMPaPerK: 0,
    prony: series,
    composite: null,
  };
  compiled.set(spec, material);
  return material;
}

/**
 * The reduced time (s) at which the series has fallen half-way in log modulus from E_g to E_inf
 * (or to E_g / 1000 without E_inf): the Prony material's counterpart of tauTg, used by the apparent Tg.
 */
function halfwayTime(p: PronySeries): number {
  const Eg = pronyGlassyMPa(p);
  const target = Math.sqrt(Eg * Math.max(p.EinfMPa, Eg / 1000));
  const taus = p.terms.map((t) => t.tauS);
  const lo = Math.log10(minOf(taus)) - 6;
  const hi = Math.log10(maxOf(taus)) + 6;
  const r = brentRoot((u) => Math.log(pronyModulusMPa(p, 10 ** u) / target), lo, hi);
  return r.converged ? 10 ** r.root : 10 ** ((lo + hi) / 2);
}

/** The datasheet-style short-term modulus (23 degC, 10 s) of a Prony material, MPa. */
export function pronyMaterialE23(m: Material): number {
  return evaluateClocks(m, DATASHEET_TIME_S, T23_K).modulusMPa;
}

/** Key/value rows of the plain-table form (see the file comment). */
export function pronyToTable(spec: PronyMaterialSpec): (string | number)[][] {
  const rows: (string | number)[][] = [
    ['prony', spec.id],
    ['name', spec.name],
    ['reference_C', spec.referenceC],
    ['shiftLaw', spec.shiftLaw],
  ];
  if (spec.TgC !== null) rows.push(['Tg_C', spec.TgC]);
  if (spec.C1 !== null) rows.push(['C1', spec.C1]);
  if (spec.C2K !== null) rows.push(['C2_K', spec.C2K]);
  if (spec.EakJmol !== null) rows.push(['Ea_kJmol', spec.EakJmol]);
  rows.push(['E_inf_MPa', spec.prony.EinfMPa], ['tau_s', 'E_MPa']);
  for (const t of spec.prony.terms) rows.push([t.tauS, t.EMPa]);
  return rows;
}

/** True when a range's first cell is the word 'prony' (case-insensitive): the range is a Prony table. */
export function isPronyTable(rows: readonly (readonly unknown[])[]): boolean {
  const first = rows[0]?.[0];
  return typeof first === 'string' && first.trim().toLowerCase() === 'prony';
}

const KEYS = ['prony', 'name', 'reference_C', 'shiftLaw', 'Tg_C', 'C1', 'C2_K', 'Ea_kJmol', 'E_inf_MPa'] as const;

function cellNumber(v: unknown, what: string, row: number): number {
  const n = typeof v === 'number' ? v : typeof v === 'string' && v.trim() !== '' ? Number(v.trim()) : NaN;
  if (!Number.isFinite(n)) throw new InputError('prony', `row ${row}: ${what} must be a number, got '${String(v)}'`);
  return n;
}

/**
 * Reads the plain-table form (a worksheet range: rows of cells). Empty rows are skipped; any other
 * unreadable cell is an error naming its row, so nothing the user typed is silently dropped.
 */
export function pronyFromTable(rows: readonly (readonly unknown[])[]): PronyMaterialSpec {
  if (!isPronyTable(rows)) throw new InputError('prony', "a Prony table starts with a row 'prony | <name>'");
  const kv = new Map<string, { v: unknown; row: number }>();
  const terms: { EMPa: number; tauS: number }[] = [];
  let inSeries = false;
  rows.forEach((r, i) => {
    const row = i + 1;
    const cells = r.filter((c) => !(c === null || c === undefined || (typeof c === 'string' && c.trim() === '')));
    if (cells.length === 0) return;
    const [a, b, ...extra] = r;
    if (extra.some((c) => !(c === null || c === undefined || c === ''))) {
      throw new InputError('prony', `row ${row}: expected two cells (key and value, or tau_s and E_MPa), got ${r.length}`);
    }
    if (!inSeries) {
      const key = typeof a === 'string' ? a.trim() : String(a);
      if (key.toLowerCase() === 'tau_s') {
        inSeries = true;
        return;
      }
      const known = KEYS.find((k) => k.toLowerCase() === key.toLowerCase());
      if (!known)
        throw new InputError('prony', `row ${row}: unknown key '${key}'; keys are ${KEYS.join(', ')}, then a 'tau_s | E_MPa' header`);
      if (kv.has(known)) throw new InputError('prony', `row ${row}: '${known}' is given twice`);
      kv.set(known, { v: b, row });
      return;
    }
    terms.push({ tauS: cellNumber(a, 'tau_s', row), EMPa: cellNumber(b, 'E_MPa', row) });
  });
  if (!inSeries) throw new InputError('prony', "the table needs a 'tau_s | E_MPa' header row before the series");
  const num = (k: (typeof KEYS)[number]): number | null => {
    const e = kv.get(k);
    if (e === undefined || e.v === null || e.v === undefined || e.v === '') return null;
    return cellNumber(e.v, k, e.row);
  };
  const law = String(kv.get('shiftLaw')?.v ?? '')
    .trim()
    .toLowerCase() as ShiftLaw;
  const ref = num('reference_C');
  if (ref === null) throw new InputError('prony', 'reference_C (temperature of the master curve, degC) is required');
  const einf = num('E_inf_MPa');
  const spec: PronyMaterialSpec = {
    id: String(kv.get('prony')?.v ?? 'prony').trim() || 'prony',
    name: String(kv.get('name')?.v ?? '').trim(),
    referenceC: ref,
    shiftLaw: law,
    TgC: num('Tg_C'),
    C1: num('C1'),
    C2K: num('C2_K'),
    EakJmol: num('Ea_kJmol'),
    prony: { EinfMPa: einf ?? 0, terms },
  };
  compilePronyMaterial(spec);
  return spec;
}

/** JSON record form (CLI --params files and --json output). */
export interface PronyRecord {
  prony: string;
  name?: string;
  reference_C: number;
  shiftLaw: string;
  Tg_C?: number | null;
  C1?: number | null;
  C2_K?: number | null;
  Ea_kJmol?: number | null;
  E_inf_MPa: number;
  terms: { tau_s: number; E_MPa: number }[];
}

export function pronyToRecord(spec: PronyMaterialSpec): PronyRecord {
  return {
    prony: spec.id,
    name: spec.name,
    reference_C: spec.referenceC,
    shiftLaw: spec.shiftLaw,
    Tg_C: spec.TgC,
    C1: spec.C1,
    C2_K: spec.C2K,
    Ea_kJmol: spec.EakJmol,
    E_inf_MPa: spec.prony.EinfMPa,
    terms: spec.prony.terms.map((t) => ({ tau_s: t.tauS, E_MPa: t.EMPa })),
  };
}

/** True when a parsed JSON object is a Prony record (it has the 'prony' and 'terms' keys). */
export function isPronyRecord(x: unknown): boolean {
  return typeof x === 'object' && x !== null && 'prony' in x && 'terms' in x;
}

/** Reads the JSON record form; every field is checked. */
export function pronyFromRecord(r: Readonly<Record<string, unknown>>): PronyMaterialSpec {
  const terms = r['terms'];
  if (!Array.isArray(terms)) throw new InputError('terms', 'must be a list of { "tau_s": ..., "E_MPa": ... }');
  const rows: unknown[][] = [['prony', r['prony']]];
  for (const k of KEYS.slice(1)) if (r[k] !== undefined && r[k] !== null) rows.push([k, r[k]]);
  rows.push(['tau_s', 'E_MPa']);
  terms.forEach((t: unknown, i) => {
    if (typeof t !== 'object' || t === null) throw new InputError('terms', `term ${i + 1} must be an object with tau_s and E_MPa`);
    const o = t as Record<string, unknown>;
    rows.push([o['tau_s'], o['E_MPa']]);
  });
  const known = new Set<string>([...KEYS, 'terms']);
  for (const k of Object.keys(r))
    if (!known.has(k)) throw new InputError(k, `is not a key of a Prony record; keys are ${[...known].join(', ')}`);
  return pronyFromTable(rows);
}
