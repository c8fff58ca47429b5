/**
 * Kept whole at about 400 lines: most of it is the field table (one entry per field with its unit, bounds and
 * words), and the cross-field rules below read it; splitting would separate a field from its checks.
 *
 * The material parameter record: one flat list of fields, each with its unit, bounds and meaning. The
 * same table drives validation, the worksheet parameter block, the CLI's JSON and the docs.
 */
import { ParameterError } from '../base/errors.js';
import { SHIFT_LAWS, type ShiftLaw } from './shift.js';
import { FILLER_CODES, FILLERS, NO_FILLER, fillerList, type FillerField } from './filler.js';

export type Kind = 'amorphous' | 'semicrystalline' | 'crosslinked';
export const KINDS: readonly Kind[] = ['amorphous', 'semicrystalline', 'crosslinked'];

/** A complete, validated set of model parameters for one material (units in the field names). */
export interface MaterialParams {
  id: string;
  name: string;
  kind: Kind;
  shiftLaw: ShiftLaw;
  /** ISO 1043-2 filler code, or 'none'. */
  filler: FillerField;
  Tg_C: number;
  Tm_C: number | null;
  E23_MPa: number | null;
  Eg_MPa: number | null;
  plateau_MPa: number;
  crystallinity: number;
  crystalContinuity: number;
  meltSharpness: number;
  crystalModulusRatio: number;
  crystalMobility: number;
  crystalSlope_perK: number | null;
  C1: number;
  C2_K: number;
  Ea_kJmol: number;
  tauTg_s: number;
  beta: number;
  flowDecades: number;
  flowBeta: number;
  creepN: number;
  creepEa_kJmol: number;
  creepRise_perK: number;
  density_kgm3: number | null;
  Mc_kgmol: number;
  glassySlope_perK: number;
  fictiveExcess_K: number;
  tnmX: number;
  fillerMass_pct: number;
  fillerAspect: number | null;
  fillerAlign: number | null;
  Tg_low_C: number | null;
  Tg_high_C: number | null;
  Tm_low_C: number | null;
  Tm_high_C: number | null;
  E23_low_MPa: number | null;
  E23_high_MPa: number | null;
  /** Humidity (polyamides; humidity.ts). */
  humidity_pct: number;
  waterSat: number;
  sorptionN: number;
}

export type NumericField = {
  [K in keyof MaterialParams]: MaterialParams[K] extends number | null ? K : never;
}[keyof MaterialParams];

export interface FieldSpec {
  readonly key: NumericField;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  /** null: the field may be left empty. */
  readonly optional: boolean;
  readonly kinds: readonly Kind[];
  readonly description: string;
  /**
   * Value given to the field when a typed record leaves it empty: the value that reproduces the model
   * before the field existed, so that parameter blocks written earlier keep their answers.
   */
  readonly neutral?: number;
}

const ALL = KINDS;
const SC: readonly Kind[] = ['semicrystalline'];
const THERMOPLASTIC: readonly Kind[] = ['amorphous', 'semicrystalline'];
const XL: readonly Kind[] = ['crosslinked'];

/** Every numeric field, in the order a parameter block lists them. */
export const NUMERIC_FIELDS: readonly FieldSpec[] = [
  {
    key: 'Tg_C',
    unit: 'degC',
    min: -150,
    max: 400,
    optional: false,
    kinds: ALL,
    description: 'glass transition temperature (DSC, about 100 s time scale); the dry Tg when humidity_pct is above 0',
  },
  {
    key: 'Tm_C',
    unit: 'degC',
    min: -100,
    max: 450,
    optional: true,
    kinds: SC,
    description: 'melting peak temperature; semi-crystalline only',
  },
  {
    key: 'E23_MPa',
    unit: 'MPa',
    min: 0.1,
    max: 20000,
    optional: true,
    kinds: ALL,
    description:
      'short-term modulus at 23 degC (datasheet; dry when humidity_pct is above 0); sets the glassy modulus. Give this or Eg_MPa',
  },
  {
    key: 'Eg_MPa',
    unit: 'MPa',
    min: 50,
    max: 20000,
    optional: true,
    kinds: ALL,
    description: 'unrelaxed glassy modulus, the upper bound. Give this or E23_MPa',
  },
  {
    key: 'plateau_MPa',
    unit: 'MPa',
    min: 0.01,
    max: 50,
    optional: false,
    kinds: THERMOPLASTIC,
    description: 'entanglement (rubbery) plateau of the amorphous phase',
  },
  {
    key: 'crystallinity',
    unit: 'fraction',
    min: 0.02,
    max: 0.95,
    optional: false,
    kinds: SC,
    description: 'crystalline volume fraction below the melting onset',
  },
  {
    key: 'crystalContinuity',
    unit: 'fraction',
    min: 0.02,
    max: 1,
    optional: false,
    kinds: SC,
    description: 'Takayanagi series-branch fraction phi (1 = crystals in parallel); at least the crystallinity',
  },
  {
    key: 'meltSharpness',
    unit: '-',
    min: 1,
    max: 200,
    optional: false,
    kinds: SC,
    description:
      'exponent m of the melting law exp(-ln20 u^m), u = (T - Tm + 25 K) / 25 K from the melting onset to Tm: larger melts later and more sharply',
  },
  {
    key: 'crystalModulusRatio',
    unit: '-',
    min: 0.2,
    max: 5,
    optional: false,
    kinds: SC,
    neutral: 1,
    description: 'effective crystal-phase modulus over the glassy modulus (Takayanagi crystal element); 1 = the glassy modulus',
  },
  {
    key: 'crystalMobility',
    unit: 'fraction',
    min: 0,
    max: 1,
    optional: false,
    kinds: SC,
    neutral: 1,
    description:
      'share of the slow creep that relaxes the crystal phase: 1 crystal-mobile (alpha_c process), 0 crystal-fixed (the amorphous phase creeps; above Tg the crystal-bearing structure too, late and slowly)',
  },
  {
    key: 'crystalSlope_perK',
    unit: '1/K',
    min: 0,
    max: 0.03,
    optional: true,
    kinds: SC,
    description:
      'fall of the crystal-phase modulus per kelvin from Tg to Tm (the constrained amorphous layers soften); empty = the glassy slope',
  },
  { key: 'C1', unit: '-', min: 1, max: 50, optional: false, kinds: ALL, description: 'WLF C1 with Tg as reference' },
  { key: 'C2_K', unit: 'K', min: 10, max: 300, optional: false, kinds: ALL, description: 'WLF C2 with Tg as reference' },
  {
    key: 'Ea_kJmol',
    unit: 'kJ/mol',
    min: 20,
    max: 2000,
    optional: false,
    kinds: ALL,
    description: 'Arrhenius activation energy of the main shift below Tg',
  },
  { key: 'tauTg_s', unit: 's', min: 0.001, max: 1e6, optional: false, kinds: ALL, description: 'glass-transition relaxation time at Tg' },
  {
    key: 'beta',
    unit: '-',
    min: 0.05,
    max: 1,
    optional: false,
    kinds: ALL,
    description: 'KWW stretching exponent of the glass transition (smaller = broader)',
  },
  {
    key: 'flowDecades',
    unit: 'decades',
    min: 0.5,
    max: 20,
    optional: false,
    kinds: THERMOPLASTIC,
    description: 'decades of reduced time from the glass transition to terminal flow',
  },
  {
    key: 'flowBeta',
    unit: '-',
    min: 0.1,
    max: 1,
    optional: false,
    kinds: THERMOPLASTIC,
    description: 'stretching exponent of terminal flow',
  },
  {
    key: 'creepN',
    unit: '-',
    min: 0,
    max: 0.3,
    optional: false,
    kinds: ALL,
    description: 'power-law exponent of slow creep of the glass and crystals, and of a rubber network (per decade of time)',
  },
  {
    key: 'creepEa_kJmol',
    unit: 'kJ/mol',
    min: 10,
    max: 500,
    optional: false,
    kinds: ALL,
    description: 'activation energy of the slow-creep clock (1 s at 23 degC)',
  },
  {
    key: 'creepRise_perK',
    unit: '1/K',
    min: 0,
    max: 0.05,
    optional: false,
    kinds: SC,
    neutral: 0,
    description: 'rise of the slow-creep exponent per kelvin from 23 to 93 degC, held above (alpha_c strengthens as it warms)',
  },
  {
    key: 'density_kgm3',
    unit: 'kg/m3',
    min: 500,
    max: 3000,
    optional: true,
    kinds: ALL,
    description: 'density of the unfilled resin: for the network modulus 3 rho R T / Mc (crosslinked) and the filler volume fraction',
  },
  { key: 'Mc_kgmol', unit: 'kg/mol', min: 0.05, max: 100, optional: false, kinds: XL, description: 'molar mass between crosslinks' },
  {
    key: 'glassySlope_perK',
    unit: '1/K',
    min: 0,
    max: 0.01,
    optional: false,
    kinds: ALL,
    neutral: 0,
    description: 'fall of the glassy and crystal moduli per kelvin (DMA slope)',
  },
  {
    key: 'fictiveExcess_K',
    unit: 'K',
    min: -20,
    max: 60,
    optional: false,
    kinds: ALL,
    neutral: 0,
    description: 'fictive temperature of the HDT bar above Tg (below: aged); HDT only',
  },
  {
    key: 'tnmX',
    unit: '-',
    min: 0.1,
    max: 1,
    optional: false,
    kinds: ALL,
    neutral: 1,
    description: 'TNM nonlinearity x of the HDT bar (1 = no memory of its fictive temperature)',
  },
  {
    key: 'fillerMass_pct',
    unit: '%',
    min: 0,
    max: 70,
    optional: false,
    kinds: ALL,
    neutral: 0,
    description: 'filler content, mass percent of the grade (0 = unfilled)',
  },
  {
    key: 'fillerAspect',
    unit: '-',
    min: 1,
    max: 1000,
    optional: true,
    kinds: ALL,
    description: 'filler length / diameter (fibres) or width / thickness (platelets) after moulding; empty = the filler default',
  },
  {
    key: 'fillerAlign',
    unit: 'fraction',
    min: 0,
    max: 1,
    optional: true,
    kinds: ALL,
    description: `fibre orientation along the load, a11 in the plane: empty = 0.75, along flow in a moulded plaque (the datasheet direction); 0.25 across flow, 0.5 random in the plane`,
  },
  { key: 'Tg_low_C', unit: 'degC', min: -150, max: 400, optional: true, kinds: ALL, description: 'low end of the Tg range, for the band' },
  {
    key: 'Tg_high_C',
    unit: 'degC',
    min: -150,
    max: 400,
    optional: true,
    kinds: ALL,
    description: 'high end of the Tg range, for the band',
  },
  { key: 'Tm_low_C', unit: 'degC', min: -100, max: 450, optional: true, kinds: SC, description: 'low end of the Tm range, for the band' },
  { key: 'Tm_high_C', unit: 'degC', min: -100, max: 450, optional: true, kinds: SC, description: 'high end of the Tm range, for the band' },
  {
    key: 'E23_low_MPa',
    unit: 'MPa',
    min: 0.1,
    max: 20000,
    optional: true,
    kinds: ALL,
    description: 'low end of the 23 degC modulus range, for the band',
  },
  {
    key: 'E23_high_MPa',
    unit: 'MPa',
    min: 0.1,
    max: 20000,
    optional: true,
    kinds: ALL,
    description: 'high end of the 23 degC modulus range, for the band',
  },
  // Humidity (polyamides; humidity.ts): neutral values take up no water, so blocks written earlier keep their answers.
  {
    key: 'humidity_pct',
    unit: '%',
    min: 0,
    max: 100,
    optional: false,
    kinds: THERMOPLASTIC,
    neutral: 0,
    description: 'relative humidity at 23 degC the part is in equilibrium with; lowers Tg_C (dry) through the isotherm on compile',
  },
  {
    key: 'waterSat',
    unit: 'fraction',
    min: 0,
    max: 0.2,
    optional: false,
    kinds: THERMOPLASTIC,
    neutral: 0,
    description: 'water content at 100 % RH, mass fraction of the part (0 = takes up no water)',
  },
  {
    key: 'sorptionN',
    unit: '-',
    min: 0.5,
    max: 5,
    optional: false,
    kinds: THERMOPLASTIC,
    neutral: 1,
    description: 'exponent n of the sorption isotherm, water = waterSat (RH/100)^n',
  },
];

export const TEXT_FIELDS = ['id', 'name', 'kind', 'shiftLaw', 'filler'] as const;

/** The `filler` values a record accepts: 'none' or a supported ISO 1043-2 code. */
export const FILLER_VALUES: readonly FillerField[] = [NO_FILLER, ...FILLER_CODES];

const FIELD_BY_KEY = new Map(NUMERIC_FIELDS.map((f) => [f.key, f]));

/** The spec of one numeric field. */
export function fieldSpec(key: NumericField): FieldSpec {
  const spec = FIELD_BY_KEY.get(key);
  if (!spec) throw new Error(`no field ${key}`);
  return spec;
}

/** Every key a parameter record has, in block order: text fields first. */
export const ALL_KEYS: readonly (keyof MaterialParams)[] = [...TEXT_FIELDS, ...NUMERIC_FIELDS.map((f) => f.key)];

/** Checks every field's type and range and the cross-field rules; throws ParameterError naming the field. */
export function validateParams(p: MaterialParams): MaterialParams {
  if (typeof p.id !== 'string' || p.id.trim() === '') throw new ParameterError('id', 'needs a non-empty name for the material');
  if (typeof p.name !== 'string') throw new ParameterError('name', 'must be text');
  if (!KINDS.includes(p.kind)) throw new ParameterError('kind', `must be one of ${KINDS.join(', ')}, got '${String(p.kind)}'`, p.kind);
  if (!SHIFT_LAWS.includes(p.shiftLaw)) {
    throw new ParameterError('shiftLaw', `must be one of ${SHIFT_LAWS.join(', ')}, got '${String(p.shiftLaw)}'`, p.shiftLaw);
  }
  if (!FILLER_VALUES.includes(p.filler)) {
    throw new ParameterError(
      'filler',
      `must be ${NO_FILLER} or one of the ISO 1043-2 codes ${fillerList()}, got '${String(p.filler)}'`,
      p.filler,
    );
  }
  for (const f of NUMERIC_FIELDS) {
    const v = p[f.key];
    const used = f.kinds.includes(p.kind);
    if (v === null) {
      if (!f.optional && used) throw new ParameterError(f.key, `is required for a ${p.kind} material (${f.description})`);
      continue;
    }
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new ParameterError(f.key, `must be a finite number, got ${String(v)}`, v);
    if (v < f.min || v > f.max) {
      throw new ParameterError(f.key, `${v} ${f.unit} is outside ${f.min} to ${f.max} ${f.unit} (${f.description})`, v);
    }
  }
  if ((p.E23_MPa === null) === (p.Eg_MPa === null)) {
    throw new ParameterError('E23_MPa', 'give exactly one of E23_MPa (datasheet modulus at 23 degC) and Eg_MPa (glassy modulus)');
  }
  if (p.kind === 'semicrystalline') {
    if (p.Tm_C === null) throw new ParameterError('Tm_C', 'is required for a semicrystalline material');
    if (p.Tm_C < p.Tg_C + 10) {
      throw new ParameterError('Tm_C', `${p.Tm_C} degC must be at least 10 K above Tg_C (${p.Tg_C} degC); are Tg and Tm swapped?`, p.Tm_C);
    }
    if (p.crystalContinuity < p.crystallinity) {
      throw new ParameterError(
        'crystalContinuity',
        `${p.crystalContinuity} must be at least the crystallinity (${p.crystallinity})`,
        p.crystalContinuity,
      );
    }
  } else if (p.Tm_C !== null) {
    throw new ParameterError('Tm_C', `is only used for semicrystalline materials; leave it empty for a ${p.kind} one`, p.Tm_C);
  }
  if (p.kind !== 'crosslinked' && p.humidity_pct > 0 && p.waterSat === 0) {
    throw new ParameterError(
      'humidity_pct',
      `${p.humidity_pct} % has no effect: waterSat is 0, so the material takes up no water; a humidity applies to polyamides (give waterSat and sorptionN, or set humidity_pct to 0)`,
      p.humidity_pct,
    );
  }
  if (p.kind === 'crosslinked' && p.density_kgm3 === null) {
    throw new ParameterError('density_kgm3', `is required for a crosslinked material (${fieldSpec('density_kgm3').description})`);
  }
  checkFiller(p);
  checkRange(p, 'Tg_low_C', 'Tg_C', 'Tg_high_C');
  checkRange(p, 'Tm_low_C', 'Tm_C', 'Tm_high_C');
  checkRange(p, 'E23_low_MPa', 'E23_MPa', 'E23_high_MPa');
  return p;
}

function checkFiller(p: MaterialParams): void {
  if (p.filler === NO_FILLER) {
    if (p.fillerMass_pct !== 0) {
      throw new ParameterError(
        'fillerMass_pct',
        `${p.fillerMass_pct} % needs a filler code in the field filler (${fillerList()})`,
        p.fillerMass_pct,
      );
    }
    return;
  }
  const max = FILLERS[p.filler].massPct[1];
  if (p.fillerMass_pct > max) {
    throw new ParameterError('fillerMass_pct', `${p.fillerMass_pct} % is above the ${max} % supported for ${p.filler}`, p.fillerMass_pct);
  }
  if (p.density_kgm3 === null) {
    throw new ParameterError(
      'density_kgm3',
      'is required for a filled material (the matrix density turns the filler mass percent into a volume fraction)',
    );
  }
}

function checkRange(p: MaterialParams, low: NumericField, mid: NumericField, high: NumericField): void {
  const lo = p[low];
  const m = p[mid];
  const hi = p[high];
  if (lo !== null && m === null) throw new ParameterError(low, `needs ${mid} to be given too`);
  if (hi !== null && m === null) throw new ParameterError(high, `needs ${mid} to be given too`);
  if (lo !== null && m !== null && lo > m) throw new ParameterError(low, `${lo} must not exceed ${mid} (${m})`, lo);
  if (hi !== null && m !== null && hi < m) throw new ParameterError(high, `${hi} must not be below ${mid} (${m})`, hi);
}
