/**
 * Kept whole at about 900 lines: it is a data table, and splitting it would separate numbers from their sources.
 *
 * The bundled polymer families, keyed by ISO 1043-1 symbols (elastomers by ISO 1629). Every number
 * carries its source: a handbook, "common practice", "from memory", or "set here" (an estimate made
 * in this project, with how it was made). Values are for unfilled, general-purpose grades (the rubbers: filled
 * compounds of the Shore A hardness their notes give).
 */
import { UnknownFamilyError } from '../base/errors.js';
import type { Kind, MaterialParams, NumericField } from './params.js';
import { WLF_UNIVERSAL_C1, WLF_UNIVERSAL_C2_K } from './shift.js';
import { DEFAULT_RH_PCT, equilibriumDays, POLYAMIDE_ISOTHERMS, splitHumidity, waterContent, wetTgC, withHumidity } from './humidity.js';
import { InputError } from '../base/errors.js';
import { compileMaterial, DATASHEET_TIME_S, modulusMPa, T23_K } from './model.js';

export const SRC = {
  handbookTg:
    'Brandrup, Immergut, Grulke (eds.), Polymer Handbook, 4th ed. 1999, typical range (from memory; entries not checked one by one)',
  datasheetE: 'common practice: typical unfilled-grade datasheet tensile modulus at 23 degC (from memory)',
  wlfUniversal: 'Williams, Landel, Ferry, J. Am. Chem. Soc. 77 (1955) 3701: universal constants with Tg as reference',
  eaGlass:
    'set here: between the long-time creep of aged glasses (100 to 300 kJ/mol, from memory) and the WLF slope at Tg (about 900 kJ/mol, derived: Ea = 2.303 R C1 Tg^2 / C2), so that long-term limits fall some 20 to 30 K below Tg (common practice)',
  tauTg: 'common practice: the DSC Tg corresponds to a relaxation time of the order of 100 s (from memory)',
  beta: 'from memory: KWW stretching exponent of the segmental relaxation, about 0.3 to 0.5 (Roland and Ngai, Macromolecules 24 (1991) 5315)',
  plateau: 'from memory: entangled plateau E ~ 3 G_N0, 0.5 to 10 MPa (Tobolsky 1960; Ferry 1980)',
  flow: 'set here: plateau width of a commercial molar mass, order of magnitude (from memory)',
  creepN:
    'set here: gives a 1000 h / 10 s modulus ratio typical of the family at 23 degC (from memory: about 0.8 to 0.9 for glassy, 0.4 to 0.6 for soft semi-crystalline grades)',
  creepEa: 'from memory: secondary relaxations 30 to 100 kJ/mol (Starkweather, Macromolecules 14 (1981) 1277)',
  crystallinity: 'from memory: typical crystallinity of moulded parts',
  creepNCheck: 'set here: meets the 1000 h creep modulus at 23 degC the family carries (checks.ts)',
  continuity: 'set here: crystals carry load in parallel (Takayanagi phi = 1), so the crystal plateau survives flow of the amorphous phase',
  melt: 'set here: shape of the melting law between the onset (Tm - 25 K) and Tm (from memory: the endotherm of a moulded grade spans the last 20 to 30 K below its peak)',
  network: 'from memory: typical network density of the family; E = 3 rho R T / Mc (Flory 1953; Treloar 1975)',
  glassyModulus: 'common practice: glassy modulus of organic polymers, 1 to 4 GPa (Tobolsky 1960, from memory)',
  ferryPS: 'Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, Table 11-II: polystyrene (from memory)',
  ferryNR: 'Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, Table 11-II: natural rubber (from memory)',
  glassySlope: 'from memory: DMA storage-modulus slope below Tg, 0.1 to 0.4 % per K (vertical factor: Ferry 1980, ch. 11)',
  glassySlopePMMA: 'from memory: PMMA falls faster, about 0.6 % per K, from its beta relaxation near room temperature',
  glassySlopeHighTg: 'from memory: high-Tg aromatic polymers keep their modulus best, 0.1 to 0.15 % per K in DMA',
  fictive: 'set here: no as-moulded state for this kind (x = 1)',
  fictiveExcess:
    'set here: as-moulded bar above the DSC Tg, tuned to the typical HDT values the family carries (quenched glasses 5 to 20 K: Moynihan et al. 1976, from memory)',
  tnmX: 'from memory: TNM x of polymer glasses 0.2 to 0.5 (Hodge, J. Non-Cryst. Solids 169 (1994) 211)',
  tauMech: 'from memory: the 1 Hz loss peak (ISO 6721-11) lies 0 to 5 K above the DSC Tg (ISO 11357-2), a mechanical time near 1 s at Tg',
  eaGlassEq:
    'set here: between aged-glass creep (100 to 300 kJ/mol, from memory) and the WLF slope at Tg (about 1100 kJ/mol for PC), so that with the 1 s time the 1000 h apparent Tg stays 20 to 30 K below Tg (common practice)',
  humidity: 'set here: the state of the entry (0 % RH dry as moulded, 50 % RH conditioned at 23 degC, ISO 291 standard atmosphere)',
  noWater: 'set here: neutral, the model takes no water into this family',
  isotherm: 'from memory: power-law isotherm through typical datasheet water contents at 23 degC / 50 % RH and at saturation (humidity.ts)',
  unfilled: 'set here: the bundled families are unfilled grades (0 %); filled grades are built from them (grade.ts)',
  density: 'common practice, from memory: typical unfilled-grade datasheet density (ISO 1183), for the filler volume fraction',
  disputedTg: 'disputed in the literature (from memory); the value used is the one that governs stiffness of moulded parts',
  rubberRelaxation:
    'from memory: filled rubbers lose 2 to 5 % of stress per decade of time at room temperature (Gent (ed.), Engineering with Rubber, 3rd ed. 2012, stress relaxation chapter); 0.013 gives 3 % per decade',
  compoundMc:
    "set here: an effective Mc for the filled compound (filler reinforcement included), so that the 23 degC modulus is that of the Shore A hardness in the note by Gent's relation (Trans. Inst. Rubber Ind. 34 (1958) 46)",
  crystalMobile:
    'Boyd, Polymer 26 (1985) 323; Hu and Schmidt-Rohr, Acta Polym. 50 (1999) 271: a crystal-mobile polymer, whose alpha_c process (chain motion through the crystals) relaxes the crystal phase too',
  crystalFixed:
    'Boyd, Polymer 26 (1985) 323; Hu and Schmidt-Rohr, Acta Polym. 50 (1999) 271: a crystal-fixed polymer (no alpha_c process); its slow creep is a secondary process of the amorphous phase; above Tg the crystal-bearing structure creeps too, late and slowly (model.ts FIXED_CREEP_N, set here)',
  crystalFit:
    'set here: tuned to the check values the family carries (checks.ts), within 0.3 to 4 for the crystal-phase modulus ratio, 0 to 2 % per K for its slope and the typical crystallinity of moulded parts (from memory)',
  creepEaAlphaC:
    'from memory: apparent activation energies of alpha_c processes about 100 to 190 kJ/mol (Boyd, Polymer 26 (1985) 323); set here within that range with creepN to meet the check values',
  creepFixed:
    'set here: secondary process of the amorphous phase (30 to 100 kJ/mol: Starkweather, Macromolecules 14 (1981) 1277) with creepN to meet the check values',
  constrainedAmorphous:
    'set here: a broad transition of the amorphous phase constrained between the crystals (KWW beta 0.1 to 0.35, WLF C2 240 K at the top of the published range 25 to 240 K, Ferry 1980 Table 11-II; the loss peak of a dry polyamide spans some 50 K, from memory), with tauTg, to meet the HDT/A and hot-modulus checks',
  creepRise:
    'set here: 0.8 % per K from 23 to 93 degC, with the crystal slope, to meet the check values; an alpha_c process strengthens as it warms (Boyd, Polymer 26 (1985) 323, from memory)',
  creepRiseZero: 'set here: 0; a rising creep exponent brought this family no closer to its check values, or has none to set it by',
  crystalNeutral: 'set here: the neutral value, which keeps the model as it was before the field existed',
  meltOnset: 'set here: shape of the melting law between the onset (Tm - 25 K) and Tm, with the HDT/B check value',
} as const;

type SourceMap = Partial<Record<NumericField, string>>;

/** One bundled family: its parameters and the source of each number. */
export interface Family {
  readonly params: MaterialParams;
  readonly sources: Readonly<SourceMap>;
  readonly note: string;
}

interface Entry {
  id: string;
  name: string;
  kind: Kind;
  note?: string;
  /** [value, low, high] */
  Tg: [number, number, number];
  Tm?: [number, number, number];
  E23?: [number, number, number];
  Eg?: number;
  set?: Partial<MaterialParams>;
  src?: SourceMap;
  /**
   * A moisture-conditioned grade: the dry family's record at a relative humidity (%); the wet Tg follows on
   * compile (humidity.ts). Tg and E23 above are then the handbook range of the wet Tg and the datasheet
   * conditioned modulus, kept for the checks only (test/families.test.ts, checks.ts).
   */
  conditioned?: { from: string; rhPct: number };
}

const KIND_DEFAULTS: Record<Kind, { values: Partial<MaterialParams>; sources: SourceMap }> = {
  amorphous: {
    values: {
      beta: 0.4,
      plateau_MPa: 2,
      flowDecades: 4,
      flowBeta: 0.6,
      creepN: 0.012,
      creepEa_kJmol: 60,
      glassySlope_perK: 0.002,
      tauTg_s: 1,
      Ea_kJmol: 900,
      tnmX: 0.35,
      fictiveExcess_K: 5,
    },
    sources: { tauTg_s: SRC.tauMech, Ea_kJmol: SRC.eaGlassEq, tnmX: SRC.tnmX, fictiveExcess_K: SRC.fictiveExcess },
  },
  semicrystalline: {
    values: {
      Ea_kJmol: 600,
      beta: 0.35,
      plateau_MPa: 2,
      flowDecades: 4,
      flowBeta: 0.6,
      creepN: 0.03,
      creepEa_kJmol: 60,
      crystalContinuity: 1,
      meltSharpness: 8,
      glassySlope_perK: 0.002,
    },
    sources: {},
  },
  crosslinked: {
    values: {
      beta: 0.3,
      creepN: 0.008,
      creepEa_kJmol: 60,
      glassySlope_perK: 0.002,
      tauTg_s: 1,
      Ea_kJmol: 900,
      tnmX: 0.35,
      fictiveExcess_K: 5,
    },
    sources: { tauTg_s: SRC.tauMech, Ea_kJmol: SRC.eaGlassEq, tnmX: SRC.tnmX, fictiveExcess_K: SRC.fictiveExcess },
  },
};

const PA6_ISO = POLYAMIDE_ISOTHERMS['PA6'] ?? { waterSat: 0, sorptionN: 1 };
const PA66_ISO = POLYAMIDE_ISOTHERMS['PA66'] ?? { waterSat: 0, sorptionN: 1 };

/** Wall thickness of the equilibrium-time note, mm (set here: a typical moulded wall). */
const NOTE_WALL_MM = 3;
const EQUILIBRIUM_NOTE = `a ${NOTE_WALL_MM} mm wall takes some ${Math.round(equilibriumDays(NOTE_WALL_MM) / 30)} months to come within 10 % of equilibrium at 23 degC (Fickian diffusion, Crank 1975), so a part fresh from the mould is drier and stiffer for weeks`;
const CONDITIONED_NOTE = `50 % RH at 23 degC, the state in ordinary indoor air; ${EQUILIBRIUM_NOTE}`;

const ENTRIES: Entry[] = [
  {
    id: 'PE-HD',
    name: 'polyethylene, high density',
    kind: 'semicrystalline',
    Tg: [-100, -120, -80],
    Tm: [133, 130, 137],
    E23: [1000, 800, 1400],
    set: {
      crystallinity: 0.8,
      crystalMobility: 1,
      crystalModulusRatio: 0.6,
      crystalSlope_perK: 0.016,
      creepN: 0.085,
      creepEa_kJmol: 110,
      meltSharpness: 3,
    },
    src: {
      creepRise_perK: SRC.creepRiseZero,
      Tg_C: SRC.disputedTg,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'PE-LD',
    name: 'polyethylene, low density',
    kind: 'semicrystalline',
    Tg: [-100, -120, -80],
    Tm: [110, 105, 115],
    E23: [200, 150, 300],
    set: {
      crystallinity: 0.35,
      crystalMobility: 1,
      crystalModulusRatio: 1.8,
      crystalSlope_perK: 0.0137,
      creepN: 0.055,
      creepEa_kJmol: 170,
      meltSharpness: 3,
    },
    src: {
      creepRise_perK: SRC.creepRiseZero,
      Tg_C: SRC.disputedTg,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'PP',
    name: 'polypropylene (homopolymer)',
    kind: 'semicrystalline',
    Tg: [-10, -20, 0],
    Tm: [164, 160, 168],
    E23: [1500, 1300, 1800],
    set: {
      crystallinity: 0.5,
      crystalMobility: 1,
      crystalModulusRatio: 0.7,
      crystalSlope_perK: 0.0028,
      creepN: 0.094,
      creepEa_kJmol: 100,
      creepRise_perK: 0.008,
      meltSharpness: 3,
    },
    src: {
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      creepRise_perK: SRC.creepRise,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'PS',
    name: 'polystyrene (general purpose)',
    kind: 'amorphous',
    Tg: [100, 95, 105],
    E23: [3200, 3000, 3400],
    set: { C1: 13.7, C2_K: 50, glassySlope_perK: 0.003 },
    src: { C1: SRC.ferryPS, C2_K: SRC.ferryPS },
  },
  {
    id: 'PMMA',
    name: 'poly(methyl methacrylate)',
    kind: 'amorphous',
    Tg: [110, 100, 120],
    E23: [3100, 2700, 3300],
    set: { glassySlope_perK: 0.006, creepN: 0.026 },
    src: { glassySlope_perK: SRC.glassySlopePMMA, creepN: SRC.creepNCheck },
  },
  {
    id: 'PC',
    name: 'polycarbonate (bisphenol A)',
    kind: 'amorphous',
    Tg: [147, 145, 150],
    E23: [2350, 2200, 2500],
    set: { glassySlope_perK: 0.0015 },
  },
  {
    id: 'PVC-U',
    name: 'poly(vinyl chloride), unplasticized',
    kind: 'amorphous',
    Tg: [80, 75, 85],
    E23: [3000, 2700, 3300],
    set: { glassySlope_perK: 0.004 },
  },
  {
    id: 'ABS',
    name: 'acrylonitrile-butadiene-styrene',
    kind: 'amorphous',
    Tg: [105, 100, 110],
    E23: [2300, 2000, 2600],
    note: 'Tg of the SAN phase',
    set: { glassySlope_perK: 0.004 },
  },
  {
    id: 'PSU',
    name: 'polysulfone',
    kind: 'amorphous',
    Tg: [187, 185, 190],
    E23: [2500, 2400, 2700],
    set: { fictiveExcess_K: 0, glassySlope_perK: 0.0015 },
    src: { glassySlope_perK: SRC.glassySlopeHighTg },
  },
  {
    id: 'PESU',
    name: 'polyethersulfone',
    kind: 'amorphous',
    Tg: [222, 220, 225],
    E23: [2700, 2600, 2900],
    set: { fictiveExcess_K: 0, glassySlope_perK: 0.0012 },
    src: { glassySlope_perK: SRC.glassySlopeHighTg },
  },
  {
    id: 'PEI',
    name: 'polyetherimide',
    kind: 'amorphous',
    Tg: [216, 215, 217],
    E23: [3200, 3000, 3400],
    set: { fictiveExcess_K: 0, glassySlope_perK: 0.0012 },
    src: { glassySlope_perK: SRC.glassySlopeHighTg },
  },
  {
    id: 'PA6-dry',
    name: 'polyamide 6, dry as moulded',
    kind: 'semicrystalline',
    Tg: [55, 50, 60],
    Tm: [222, 220, 225],
    E23: [3000, 2600, 3300],
    set: {
      crystallinity: 0.25,
      crystalMobility: 0,
      crystalModulusRatio: 0.5,
      crystalSlope_perK: 0.0052,
      creepN: 0.027,
      creepEa_kJmol: 40,
      meltSharpness: 3,
      beta: 0.15,
      C2_K: 240,
      tauTg_s: 10,
      waterSat: PA6_ISO.waterSat,
      sorptionN: PA6_ISO.sorptionN,
    },
    src: {
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
      waterSat: SRC.isotherm,
      sorptionN: SRC.isotherm,
    },
  },
  {
    id: 'PA6-cond',
    name: 'polyamide 6, conditioned 23 degC / 50 % RH',
    kind: 'semicrystalline',
    Tg: [10, 0, 20],
    Tm: [222, 220, 225],
    E23: [1100, 900, 1400],
    note: CONDITIONED_NOTE,
    conditioned: { from: 'PA6-dry', rhPct: DEFAULT_RH_PCT },
  },
  {
    id: 'PA66-dry',
    name: 'polyamide 66, dry as moulded',
    kind: 'semicrystalline',
    Tg: [60, 50, 70],
    Tm: [260, 255, 265],
    E23: [3100, 2800, 3500],
    set: {
      crystallinity: 0.264,
      crystalMobility: 0,
      crystalModulusRatio: 0.73,
      crystalSlope_perK: 0.0067,
      creepN: 0.032,
      creepEa_kJmol: 40,
      meltSharpness: 1,
      beta: 0.15,
      C2_K: 240,
      tauTg_s: 15,
      waterSat: PA66_ISO.waterSat,
      sorptionN: PA66_ISO.sorptionN,
    },
    src: {
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
      waterSat: SRC.isotherm,
      sorptionN: SRC.isotherm,
    },
  },
  {
    id: 'PA66-cond',
    name: 'polyamide 66, conditioned 23 degC / 50 % RH',
    kind: 'semicrystalline',
    Tg: [20, 10, 30],
    Tm: [260, 255, 265],
    E23: [1500, 1200, 1800],
    note: CONDITIONED_NOTE,
    conditioned: { from: 'PA66-dry', rhPct: DEFAULT_RH_PCT },
  },
  {
    id: 'POM',
    name: 'polyoxymethylene, copolymer',
    kind: 'semicrystalline',
    Tg: [-70, -80, -60],
    Tm: [165, 162, 168],
    E23: [2800, 2600, 3000],
    set: {
      crystallinity: 0.634,
      crystalMobility: 1,
      crystalModulusRatio: 0.392,
      crystalSlope_perK: 0.0029,
      creepN: 0.0635,
      creepEa_kJmol: 100,
      creepRise_perK: 0.008,
      meltSharpness: 6.38,
    },
    src: {
      Tg_C: SRC.disputedTg,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      creepRise_perK: SRC.creepRise,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'POM-H',
    name: 'polyoxymethylene, homopolymer',
    kind: 'semicrystalline',
    Tg: [-70, -80, -60],
    Tm: [176, 175, 178],
    E23: [3000, 2800, 3200],
    set: {
      crystallinity: 0.8,
      crystalMobility: 1,
      crystalModulusRatio: 0.64,
      crystalSlope_perK: 0.0025,
      creepN: 0.062,
      creepEa_kJmol: 100,
      creepRise_perK: 0.008,
      meltSharpness: 2.8,
    },
    src: {
      Tg_C: SRC.disputedTg,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      creepRise_perK: SRC.creepRise,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'PET',
    name: 'poly(ethylene terephthalate), crystallized',
    kind: 'semicrystalline',
    Tg: [75, 70, 80],
    Tm: [255, 250, 260],
    E23: [2800, 2500, 3100],
    set: {
      crystallinity: 0.27,
      crystalMobility: 0,
      crystalModulusRatio: 0.5,
      crystalSlope_perK: 0.006,
      creepN: 0.021,
      creepEa_kJmol: 45,
      meltSharpness: 3,
      beta: 0.15,
      C2_K: 240,
      tauTg_s: 10,
    },
    src: {
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
    },
  },
  {
    id: 'PBT',
    name: 'poly(butylene terephthalate)',
    kind: 'semicrystalline',
    Tg: [50, 40, 60],
    Tm: [223, 220, 225],
    E23: [2500, 2300, 2700],
    set: {
      crystallinity: 0.254,
      crystalMobility: 0,
      crystalModulusRatio: 0.5,
      crystalSlope_perK: 0.0049,
      creepN: 0.005,
      creepEa_kJmol: 40,
      meltSharpness: 3,
      beta: 0.1,
      C2_K: 240,
      tauTg_s: 6.7,
    },
    src: {
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
    },
  },
  {
    id: 'PPS',
    name: 'poly(phenylene sulfide)',
    kind: 'semicrystalline',
    Tg: [90, 85, 95],
    Tm: [282, 280, 285],
    E23: [3600, 3300, 3900],
    set: {
      crystallinity: 0.35,
      crystalMobility: 0,
      crystalModulusRatio: 0.5,
      crystalSlope_perK: 0.0016,
      creepN: 0.0166,
      creepEa_kJmol: 78,
      meltSharpness: 3,
      beta: 0.15,
      C2_K: 240,
      tauTg_s: 10,
    },
    src: {
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
    },
  },
  {
    id: 'PEEK',
    name: 'polyetheretherketone',
    kind: 'semicrystalline',
    Tg: [143, 143, 145],
    Tm: [340, 335, 343],
    E23: [3700, 3500, 4000],
    set: {
      crystallinity: 0.25,
      crystalMobility: 0,
      crystalModulusRatio: 0.7,
      crystalSlope_perK: 0.014,
      creepN: 0.016,
      creepEa_kJmol: 40,
      meltSharpness: 3,
      beta: 0.35,
      C2_K: 240,
      tauTg_s: 100,
      glassySlope_perK: 0.0012,
    },
    src: {
      glassySlope_perK: SRC.glassySlopeHighTg,
      crystalMobility: SRC.crystalFixed,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepFixed,
      creepEa_kJmol: SRC.creepFixed,
      meltSharpness: SRC.meltOnset,
      beta: SRC.constrainedAmorphous,
      C2_K: SRC.constrainedAmorphous,
      tauTg_s: SRC.constrainedAmorphous,
    },
  },
  {
    id: 'PTFE',
    name: 'polytetrafluoroethylene',
    kind: 'semicrystalline',
    Tg: [-97, -110, -80],
    Tm: [327, 325, 330],
    E23: [500, 400, 750],
    set: {
      crystallinity: 0.6,
      crystalMobility: 1,
      crystalModulusRatio: 0.55,
      crystalSlope_perK: 0,
      creepN: 0.063,
      creepEa_kJmol: 165,
      meltSharpness: 3,
    },
    src: {
      creepRise_perK: SRC.creepRiseZero,
      Tg_C: SRC.disputedTg,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'PVDF',
    name: 'poly(vinylidene fluoride)',
    kind: 'semicrystalline',
    Tg: [-38, -40, -35],
    Tm: [172, 165, 178],
    E23: [2000, 1700, 2500],
    set: {
      crystallinity: 0.4,
      crystalMobility: 1,
      crystalModulusRatio: 0.94,
      crystalSlope_perK: 0.005,
      creepN: 0.06,
      creepEa_kJmol: 110,
      meltSharpness: 1,
    },
    src: {
      creepRise_perK: SRC.creepRiseZero,
      crystalMobility: SRC.crystalMobile,
      crystalModulusRatio: SRC.crystalFit,
      crystalSlope_perK: SRC.crystalFit,
      crystallinity: SRC.crystalFit,
      creepN: SRC.creepEaAlphaC,
      creepEa_kJmol: SRC.creepEaAlphaC,
      meltSharpness: SRC.meltOnset,
    },
  },
  {
    id: 'EP',
    name: 'epoxy, amine-cured bisphenol A diglycidyl ether',
    kind: 'crosslinked',
    Tg: [140, 100, 180],
    E23: [3000, 2700, 3300],
    set: { density_kgm3: 1200, Mc_kgmol: 0.4 },
    src: { density_kgm3: SRC.network, Mc_kgmol: SRC.network },
  },
  {
    id: 'EPDM',
    name: 'ethylene-propylene-diene rubber, sulfur-cured',
    kind: 'crosslinked',
    note: 'compound-typical: filled, Shore A 70 (about 5.5 MPa at 23 degC); grades range from Shore A 40 to 90',
    Tg: [-50, -55, -45],
    Eg: 2000,
    set: { density_kgm3: 860, Mc_kgmol: 1.1, creepN: 0.013 },
    src: { density_kgm3: SRC.network, Mc_kgmol: SRC.compoundMc, creepN: SRC.rubberRelaxation },
  },
  {
    id: 'NR',
    name: 'natural rubber, sulfur-cured',
    kind: 'crosslinked',
    note: 'compound-typical: filled, Shore A 60 (about 3.6 MPa at 23 degC); grades range from Shore A 30 to 90',
    Tg: [-70, -72, -65],
    Eg: 2000,
    set: { density_kgm3: 930, Mc_kgmol: 1.85, C1: 16.7, C2_K: 53.6, creepN: 0.013 },
    src: { density_kgm3: SRC.network, Mc_kgmol: SRC.compoundMc, C1: SRC.ferryNR, C2_K: SRC.ferryNR, creepN: SRC.rubberRelaxation },
  },
  {
    id: 'VMQ',
    name: 'silicone rubber (methyl vinyl)',
    kind: 'crosslinked',
    note: 'compound-typical: silica-filled, Shore A 60 (about 3.6 MPa at 23 degC); grades range from Shore A 20 to 80',
    Tg: [-125, -130, -120],
    Eg: 1500,
    set: { density_kgm3: 1150, Mc_kgmol: 2.3, creepN: 0.013 },
    src: { density_kgm3: SRC.network, Mc_kgmol: SRC.compoundMc, creepN: SRC.rubberRelaxation },
  },
];

/**
 * Density of the unfilled resin, kg/m3, for the filler volume fraction of filled grades (filler.ts). Common
 * practice, from memory: typical unfilled-grade datasheet densities (ISO 1183). Kept in one map, apart from
 * the entries, and merged in toFamily; crosslinked entries carry theirs in `set` (network modulus).
 */
const MATRIX_DENSITY: Readonly<Record<string, number>> = {
  'PE-HD': 955,
  'PE-LD': 920,
  PP: 905,
  PS: 1050,
  PMMA: 1190,
  PC: 1200,
  'PVC-U': 1400,
  ABS: 1050,
  PSU: 1240,
  PESU: 1370,
  PEI: 1270,
  'PA6-dry': 1130,
  'PA66-dry': 1140,
  POM: 1410,
  'POM-H': 1420,
  PET: 1380,
  PBT: 1310,
  PPS: 1350,
  PEEK: 1300,
  PTFE: 2170,
  PVDF: 1780,
};

const BASE_SOURCES: SourceMap = {
  Tg_C: SRC.handbookTg,
  Tg_low_C: SRC.handbookTg,
  Tg_high_C: SRC.handbookTg,
  Tm_C: SRC.handbookTg,
  Tm_low_C: SRC.handbookTg,
  Tm_high_C: SRC.handbookTg,
  E23_MPa: SRC.datasheetE,
  E23_low_MPa: SRC.datasheetE,
  E23_high_MPa: SRC.datasheetE,
  Eg_MPa: SRC.glassyModulus,
  C1: SRC.wlfUniversal,
  C2_K: SRC.wlfUniversal,
  Ea_kJmol: SRC.eaGlass,
  tauTg_s: SRC.tauTg,
  beta: SRC.beta,
  plateau_MPa: SRC.plateau,
  flowDecades: SRC.flow,
  flowBeta: SRC.flow,
  creepN: SRC.creepN,
  creepEa_kJmol: SRC.creepEa,
  creepRise_perK: SRC.crystalNeutral,
  crystallinity: SRC.crystallinity,
  crystalContinuity: SRC.continuity,
  meltSharpness: SRC.melt,
  crystalModulusRatio: SRC.crystalNeutral,
  crystalMobility: SRC.crystalNeutral,
  crystalSlope_perK: SRC.crystalNeutral,
  glassySlope_perK: SRC.glassySlope,
  fictiveExcess_K: SRC.fictive,
  tnmX: SRC.fictive,
  humidity_pct: SRC.humidity,
  waterSat: SRC.noWater,
  sorptionN: SRC.noWater,
  density_kgm3: SRC.density,
  fillerMass_pct: SRC.unfilled,
};

/** A record with every field empty (null) or at its neutral default; the base of every family. */
export function blankParams(id: string, kind: Kind): MaterialParams {
  return {
    id,
    name: id,
    kind,
    shiftLaw: 'hybrid',
    Tg_C: 0,
    Tm_C: null,
    E23_MPa: null,
    Eg_MPa: null,
    plateau_MPa: 2,
    crystallinity: 0.5,
    crystalContinuity: 1,
    meltSharpness: 14,
    crystalModulusRatio: 1,
    crystalMobility: 1,
    crystalSlope_perK: null,
    C1: WLF_UNIVERSAL_C1,
    C2_K: WLF_UNIVERSAL_C2_K,
    Ea_kJmol: 300,
    tauTg_s: 100,
    beta: 0.4,
    flowDecades: 4,
    flowBeta: 0.6,
    creepN: 0.01,
    creepEa_kJmol: 60,
    creepRise_perK: 0,
    density_kgm3: 1000,
    Mc_kgmol: 1,
    filler: 'none',
    fillerMass_pct: 0,
    fillerAspect: null,
    fillerAlign: null,
    glassySlope_perK: 0,
    fictiveExcess_K: 0,
    tnmX: 1,
    Tg_low_C: null,
    Tg_high_C: null,
    Tm_low_C: null,
    Tm_high_C: null,
    E23_low_MPa: null,
    E23_high_MPa: null,
    humidity_pct: 0,
    waterSat: 0,
    sorptionN: 1,
  };
}

function toFamily(e: Entry, built: ReadonlyMap<string, Family>): Family {
  const d = KIND_DEFAULTS[e.kind];
  const p: MaterialParams = { ...blankParams(e.id, e.kind), ...d.values, name: e.name };
  [p.Tg_C, p.Tg_low_C, p.Tg_high_C] = e.Tg;
  if (e.Tm) [p.Tm_C, p.Tm_low_C, p.Tm_high_C] = e.Tm;
  if (e.E23) [p.E23_MPa, p.E23_low_MPa, p.E23_high_MPa] = e.E23;
  if (e.Eg !== undefined) p.Eg_MPa = e.Eg;
  if (e.kind !== 'crosslinked') p.density_kgm3 = MATRIX_DENSITY[e.id] ?? null;
  Object.assign(p, e.set);
  if (e.conditioned) {
    // The dry grade's record at a humidity: Tg_C and E23_MPa stay the dry values, the wet Tg follows on compile.
    const dry = built.get(e.conditioned.from);
    if (!dry) throw new Error(`family ${e.id}: the dry grade ${e.conditioned.from} must come first`);
    Object.assign(p, dry.params, { id: e.id, name: e.name, humidity_pct: e.conditioned.rhPct });
  }
  // A conditioned grade's numbers are the dry grade's, and so are their sources (its own entry overrides Tg and E23).
  const dry = e.conditioned ? built.get(e.conditioned.from)?.sources : undefined;
  const sources: SourceMap = { ...BASE_SOURCES, ...d.sources, ...dry, ...e.src };
  for (const key of Object.keys(sources) as NumericField[]) {
    if (p[key] === null || !isUsed(key, e.kind)) delete sources[key];
  }
  return { params: Object.freeze(p) as MaterialParams, sources: Object.freeze(sources), note: e.note ?? '' };
}

const UNUSED_BY_KIND: Record<Kind, ReadonlySet<NumericField>> = {
  amorphous: new Set<NumericField>([
    'crystallinity',
    'crystalContinuity',
    'meltSharpness',
    'crystalModulusRatio',
    'crystalMobility',
    'crystalSlope_perK',
    'Mc_kgmol',
    'Tm_C',
  ]),
  semicrystalline: new Set<NumericField>(['Mc_kgmol']),
  crosslinked: new Set<NumericField>([
    'crystallinity',
    'crystalContinuity',
    'meltSharpness',
    'crystalModulusRatio',
    'crystalMobility',
    'crystalSlope_perK',
    'plateau_MPa',
    'flowDecades',
    'flowBeta',
    'Tm_C',
  ]),
};

function isUsed(key: NumericField, kind: Kind): boolean {
  return !UNUSED_BY_KIND[kind].has(key);
}

/** All bundled families, in table order. */
export const FAMILIES: readonly Family[] = ((): Family[] => {
  const built = new Map<string, Family>();
  return ENTRIES.map((e) => {
    const f = toFamily(e, built);
    built.set(e.id, f);
    return f;
  });
})();

const BY_ID = new Map(FAMILIES.map((f) => [f.params.id.toLowerCase(), f]));

/** Families at a humidity, derived on demand, by canonical id in lower case ("pa66 at 70 % rh"). */
const DERIVED = new Map<string, Family>();
/** Derived families kept at most (set here: a workbook names a few humidities; the cache is refilled when full). */
const DERIVED_CAP = 64;

/** The canonical id of a polyamide at a relative humidity (%): "PA66 at 70 % RH". */
export function humidityId(base: string, rhPct: number): string {
  return `${base} at ${rhPct} % RH`;
}

/**
 * A polyamide (bare symbol, as POLYAMIDE_ISOTHERMS lists them) at a relative humidity (%): the dry
 * entry's record with humidity_pct set; the wet Tg follows on compile. Cached by canonical id.
 */
function polyamideAt(base: string, rhPct: number): Family {
  const id = humidityId(base, rhPct);
  const key = id.toLowerCase();
  const cached = DERIVED.get(key);
  if (cached) return cached;
  const iso = POLYAMIDE_ISOTHERMS[base];
  const dry = iso ? BY_ID.get(iso.dry.toLowerCase()) : undefined;
  if (!iso || !dry) throw new UnknownFamilyError(base, suggestFamilies(base));
  const p = withHumidity(dry.params, rhPct);
  const water = waterContent(rhPct, p.waterSat, p.sorptionN);
  const params = Object.freeze({ ...p, id, name: `${iso.name} at ${rhPct} % RH, 23 degC` }) as MaterialParams;
  const tg = Math.round(wetTgC(params) * 10) / 10;
  const note =
    `${(water * 100).toFixed(1)} % water at equilibrium, Tg ${tg} degC; a bare ${base} is taken at ${DEFAULT_RH_PCT} % RH, ` +
    `ordinary indoor air, the cautious default (softer than dry as moulded); ${EQUILIBRIUM_NOTE}`;
  const family: Family = { params, sources: Object.freeze({ ...dry.sources, humidity_pct: 'given with the symbol' }), note };
  if (DERIVED.size >= DERIVED_CAP) DERIVED.clear();
  DERIVED.set(key, family);
  return family;
}

/**
 * Looks up a family by id (case-insensitive), a bare polyamide symbol (PA6, PA66: at 50 % RH) or a
 * polyamide with a humidity clause ("PA66 at 70 % RH"); throws UnknownFamilyError with the closest ids,
 * or InputError (argument 'family') for a humidity given twice or on a material that takes up no water.
 */
export function getFamily(id: string): Family {
  const key = id.trim().toLowerCase();
  const found = BY_ID.get(key) ?? DERIVED.get(key);
  if (found) return found;
  const { symbol, rhPct } = splitHumidity(id);
  const base = POLYAMIDES_BY_LOWER.get(symbol.toLowerCase());
  if (base !== undefined) return polyamideAt(base, rhPct ?? DEFAULT_RH_PCT);
  if (rhPct === null) throw new UnknownFamilyError(id, suggestFamilies(id));
  const named = BY_ID.get(symbol.toLowerCase());
  if (!named) throw new UnknownFamilyError(symbol, suggestFamilies(symbol));
  if (named.params.humidity_pct > 0 || (named.params.waterSat > 0 && /-(dry|cond)$/i.test(symbol))) {
    throw new InputError(
      'family',
      `"${id.trim()}" gives the moisture twice: give either ${named.params.id} or a humidity (such as "${symbol.replace(/-(dry|cond)$/i, '')} at ${rhPct} % RH"), not both`,
    );
  }
  withHumidity(named.params, rhPct, 'family');
  throw new UnknownFamilyError(symbol, suggestFamilies(symbol));
}

const POLYAMIDES_BY_LOWER = new Map(Object.keys(POLYAMIDE_ISOTHERMS).map((b) => [b.toLowerCase(), b]));

/**
 * The record as a family list shows it (degC, MPa): a humid record's Tg fields are its wet Tg and its 23 degC
 * modulus fields the model's at that humidity (the record itself keeps the dry values, humidity.ts); any other
 * record as it is.
 */
export function displayedParams(p: MaterialParams): MaterialParams {
  if (wetTgC(p) === p.Tg_C) return p;
  const E23 = modulusMPa(compileMaterial(p), DATASHEET_TIME_S, T23_K);
  const scale = p.E23_MPa === null ? 1 : E23 / p.E23_MPa;
  // Tg to 0.1 K and moduli to 10 MPa, the precision the table quotes them to.
  const round = (x: number | null, step: number): number | null =>
    x === null ? null : step < 1 ? Math.round(x * 10) / 10 : Math.round(x / 10) * 10;
  return {
    ...p,
    Tg_C: round(wetTgC(p), 0.1) ?? p.Tg_C,
    Tg_low_C: round(p.Tg_low_C === null ? null : wetTgC(p, p.Tg_low_C), 0.1),
    Tg_high_C: round(p.Tg_high_C === null ? null : wetTgC(p, p.Tg_high_C), 0.1),
    E23_MPa: p.E23_MPa === null ? null : round(E23, 10),
    E23_low_MPa: round(p.E23_low_MPa === null ? null : p.E23_low_MPa * scale, 10),
    E23_high_MPa: round(p.E23_high_MPa === null ? null : p.E23_high_MPa * scale, 10),
  };
}

/** Up to three family ids closest to the given text (prefix match first, then edit distance). */
export function suggestFamilies(text: string): string[] {
  const q = text.trim().toLowerCase();
  const scored = FAMILIES.map((f) => {
    const id = f.params.id.toLowerCase();
    const score = id.startsWith(q) || (q.length > 0 && id.split('-')[0] === q.split('-')[0]) ? 0 : editDistance(q, id);
    return { id: f.params.id, score };
  });
  scored.sort((a, b) => a.score - b.score || a.id.localeCompare(b.id));
  return scored
    .filter((s) => s.score <= Math.max(2, Math.floor(q.length / 2)))
    .slice(0, 3)
    .map((s) => s.id);
}

/** Levenshtein distance (insertions, deletions and substitutions each count 1). */
export function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur[j] = Math.min((prev[j] ?? 0) + 1, (cur[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + cost);
    }
    prev = cur;
  }
  return prev[b.length] ?? 0;
}
