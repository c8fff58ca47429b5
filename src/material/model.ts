/**
 * Kept whole at about 470 lines: the evaluation, the anchor solve and the precomputed material share the private
 * build step and the hot path's scratch record; splitting them would expose both for one file's sake.
 *
 * The four-region relaxation modulus E_r(t, T) in MPa.
 *
 * Main clock: reduced time xi = t / a_T(T) at Tg (hybrid WLF/Arrhenius). Slow-creep clock: theta =
 * t / tau_c(T), tau_c = 1 s at 23 degC, Arrhenius with creepEa. With x = xi / tauTg:
 *   glass transition  G = exp(-x^beta)                         (KWW; Roland and Ngai 1991)
 *   terminal flow     F = exp(-(x / 10^flowDecades)^flowBeta)
 *   slow creep        g = (1 + theta)^-n(T)                    (bounded power law, Findley style), n = creepN
 *                     at and below 23 degC, rising by creepRise_perK per kelvin above it over CREEP_RISE_SPAN_K
 *                     (an alpha_c process grows stronger as it warms; 0 for every other family)
 *   amorphous         E = g [(Eg - Ep) G + Ep F]
 *   semicrystalline   Takayanagi: E = lambda / (phi/Ec + (1-phi)/Ea) + (1 - lambda) Ea, lambda phi = X r(T),
 *                     (Takayanagi, Uemura, Minami, J. Polym. Sci. C 5 (1964) 113), with
 *                     Ea = g [(Eg - Ep) G + Ep (F + (1 - F) r)]: no terminal flow while crystals remain (tie
 *                       chains anchor the amorphous phase; it flows as they melt),
 *                     Ec = gc k Eg, k = crystalModulusRatio (an effective crystal-phase modulus), and
 *                       gc = c g + (1 - c) h, c = crystalMobility: the slow process relaxes the crystals too
 *                       (alpha_c, chain motion through the crystals, c = 1) or only the amorphous phase
 *                       (crystal-fixed, c = 0: the slow creep is then a secondary process of the amorphous
 *                       phase, and h = 1 - (1 - G)(1 - (1 + theta / theta_s)^-n_s): the lamellar stacks
 *                       creep through the rubbery interlamellar layers, late on the slow-creep clock
 *                       taken with its own activation energy; FIXED_CREEP_N, FIXED_CREEP_ONSET, _EA),
 *                     r(T) = 1 up to the melting onset Tm - MELT_ONSET_K, exp(-ln20 u^m) with
 *                       u = (T - Tm + MELT_ONSET_K) / MELT_ONSET_K between onset and Tm (5 % left at Tm),
 *                       times exp(-(T - Tm) / 2 K) above Tm
 *   crosslinked       E = g [(Eg - Er) G + Er], Er = 3 rho R T / Mc (Flory 1953; Treloar 1975); the
 *                     network relaxes by the slow-creep factor too (physical relaxation of a rubber)
 * Every factor is non-increasing in t and T, so E is too, except the entropic rise of Er with T (for a
 * network E - Er is still non-increasing: (g - 1) Er falls as g falls and Er rises).
 * E never exceeds upperBoundMPa (the larger of the glassy and crystal moduli at the cold end).
 * With creepN = 0 an amorphous material is thermorheologically simple: E(t, T) = E(t / a_T, Tg).
 * A Prony-series material (pronymaterial.ts, fitted from test curves) is evaluated by the same entry
 * points: E = E_inf + sum E_i exp(-xi / tau_i), with its own shift law.
 */
import { InputError, ParameterError } from '../base/errors.js';
import type { Kind, MaterialParams } from './params.js';
import { validateParams } from './params.js';
import { dryRecord, isHumid, wetTgC } from './humidity.js';
import { pronyModulusMPa, pronyGlassyMPa, type PronySeries } from './prony.js';
import { brentRoot } from '../numeric/roots.js';
import { arrheniusLog10, GAS_CONSTANT, shiftLog10, WLF_SINGULARITY_MARGIN_K, type ShiftConstants } from './shift.js';
import { KELVIN_OFFSET } from '../base/units.js';
import { buildComposite, compositeModulusMPa, FILLERS, FLOW_ALIGN, type Composite } from './filler.js';

/** The reference temperature of the datasheet modulus and of the slow-creep clock, kelvin (ISO 291 standard atmosphere 23 degC). */
export const T23_K = 23 + KELVIN_OFFSET;
/**
 * Loading time that a datasheet short-term modulus stands for, seconds. Common practice: an ISO 527
 * tensile modulus (0.05 to 0.25 % strain at 1 mm/min) is measured over roughly ten seconds (from memory).
 */
export const DATASHEET_TIME_S = 10;
/** Crystalline fraction left at Tm, relative to the intact crystals, in the melting law (set here: 5 % survive to the DSC peak). */
export const MELT_REMAINING_AT_TM = 0.05;
const LN_MELT = Math.log(1 / MELT_REMAINING_AT_TM);
/** Above the melting peak the last crystals go within a few kelvin (set here: an e-fold every 2 K). */
export const MELT_TAIL_K = 2;
/**
 * Melting onset below the DSC peak, K: the crystals stay intact up to Tm - MELT_ONSET_K and melt between it
 * and Tm, and the region is "melting" only from there up; below it what relaxes is the amorphous phase or the
 * crystal alpha_c process ("crystalline"). Common practice, from memory: the melting endotherm of a moulded
 * grade begins some 20 to 30 K below its peak, and typical HDT/B values of POM and PTFE-like grades lie within
 * 10 to 20 K of the peak, which needs the crystals (nearly) intact there.
 */
export const MELT_ONSET_K = 25;

/**
 * Creep of the crystal-bearing structure of a crystal-fixed polymer (crystalMobility 0) once its amorphous
 * phase is rubbery: the lamellae cannot creep through themselves, but the stacks shear and rotate through the
 * rubbery interlamellar layers, so polyamides, PBT and PET keep creeping above Tg. Factor on the crystal-phase
 * modulus: 1 - (1 - G)(1 - (1 + theta / FIXED_CREEP_ONSET)^-FIXED_CREEP_N), on the slow-creep clock theta.
 * Common practice, from memory: design-guide creep curves of unfilled PA, PBT and PET at 60 to 120 degC keep
 * falling with log time, by roughly 5 to 15 % per decade. Set here: n = 0.04 (about 9 % per decade once
 * under way; 1000 h to 100 000 h at 80 degC: -17 %), well inside that range so as not to overstate it.
 * With creepN 0 the slow-creep clock stops, and this creep with it.
 */
export const FIXED_CREEP_N = 0.04;
/**
 * Onset of that creep on the slow-creep clock (tau_c = 1 s at 23 degC), dimensionless. Set here: 1e6, about
 * 20 h at 80 degC with creepEa 40 kJ/mol, so that the 10 s moduli and the one- to two-hour ISO 75 heating
 * ramp (the HDT checks) are nearly untouched while the 1000 h answers above Tg keep falling.
 */
export const FIXED_CREEP_ONSET = 1e6;
/**
 * Activation energy of that creep's own clock, kJ/mol: the slow-creep clock rescaled at the evaluation
 * temperature, so that a calibration moving creepEa (the amorphous secondary process) leaves it alone. Set here:
 * 40, the creepEa of the bundled polyamides and PBT, inside the secondary-process range 30 to 100 kJ/mol
 * (Starkweather, Macromolecules 14 (1981) 1277).
 */
export const FIXED_CREEP_EA_KJMOL = 40;
const FIXED_LOG10_PER_INV_K = (FIXED_CREEP_EA_KJMOL * 1000) / (GAS_CONSTANT * Math.LN10);

/**
 * Kelvin below 23 degC at which the glassy modulus stops rising on cooling (set here: the fall with
 * temperature is read from DMA slopes between about -50 degC and Tg; further down the secondary relaxations
 * freeze and the curve flattens, so the factor is held there and the modulus stays bounded).
 */
export const GLASS_SLOPE_SPAN_K = 100;

/**
 * Modulus below which a material has relaxed to nothing (a melt), MPa. Set here: 1 kPa, a hundredth of
 * the lowest plateau a parameter record accepts (0.01 MPa) and far below an entanglement plateau
 * (about 1 MPa; Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 13, from memory): below
 * it a modulus is no stiffness to design with, nor a reference to divide by.
 */
export const RELAXED_MPA = 1e-3;

export type Region = 'glassy' | 'transition' | 'rubbery' | 'flow' | 'crystalline' | 'melting';
export const REGIONS: readonly Region[] = ['glassy', 'transition', 'rubbery', 'flow', 'crystalline', 'melting'];

/** A validated material with its constants precomputed for fast evaluation. */
export interface Material {
  readonly params: MaterialParams;
  readonly kind: Kind;
  readonly shift: ShiftConstants;
  /** Glassy modulus at the cold end of the slope (the upper bound of E), MPa. */
  readonly EgMPa: number;
  /** Fractional fall of the glassy and crystal moduli per kelvin (vertical factor; absent on a Prony material). */
  readonly glassSlope?: number;
  /** Temperature below which the vertical factor is held, K. */
  readonly glassLowK?: number;
  readonly tauTg: number;
  readonly beta: number;
  readonly tauFlow: number;
  /** ln(tauTg / 1 s). */
  readonly lnTauTg: number;
  /** ln(tauFlow / tauTg). */
  readonly lnFlowRatio: number;
  readonly flowBeta: number;
  readonly plateau: number;
  readonly creepN: number;
  /** Rise of the slow-creep exponent per kelvin above 23 degC, 1/K (absent: 0). */
  readonly creepRise?: number;
  readonly creepLog10PerInvK: number;
  readonly crystallinity: number;
  readonly phi: number;
  readonly TmK: number;
  readonly meltSharpness: number;
  /** Melting onset Tm - MELT_ONSET_K, K (Infinity without crystals). */
  readonly meltOnsetK: number;
  /** Effective crystal-phase modulus / glassy modulus (absent: 1). */
  readonly crystalRatio?: number;
  /** Share of the slow-creep process that relaxes the crystal phase, 0 to 1 (absent: 1). */
  readonly crystalMobility?: number;
  /** Fall of the crystal-phase modulus per kelvin from Tg to Tm (absent: the glassy slope). */
  readonly crystalSlope?: number;
  /** 3 rho R / Mc in MPa per kelvin (crosslinked), else 0. */
  readonly networkMPaPerK: number;
  /**
   * A Prony-series material (pronymaterial.ts): E = Prony(xi), relaxation times at the shift reference
   * temperature; null for the four-region model.
   */
  readonly prony: PronySeries | null;
  /**
   * A filled grade (filler.ts): every entry point returns the composite modulus from the matrix modulus at
   * the same (t, T); the other fields describe the matrix. Null for an unfilled material.
   */
  readonly composite: Composite | null;
}

/** Contributions behind one evaluation, for the region and for tests. */
export interface Evaluation {
  readonly modulusMPa: number;
  readonly region: Region;
  readonly glassFraction: number;
  readonly flowFraction: number;
  readonly creepFactor: number;
  readonly crystalRemaining: number;
}

const compiled = new WeakMap<MaterialParams, Material>();

/** Validates a parameter record and precomputes its constants (cached per record object). */
export function compileMaterial(params: MaterialParams): Material {
  const cached = compiled.get(params);
  if (cached) return cached;
  validateParams(params);
  let matrix: Material;
  if (isHumid(params)) {
    // Water lowers only Tg: the glassy and crystal moduli are the dry record's (Tg_C and E23_MPa are dry values).
    const dry = compileMaterial(dryRecord(params));
    const Eg23 = dry.EgMPa / Math.exp(params.glassySlope_perK * GLASS_SLOPE_SPAN_K);
    matrix = checkGlassy(build(params, Eg23, wetTgC(params)));
  } else {
    const base = build(params, params.Eg_MPa ?? 1000);
    matrix = params.E23_MPa === null ? checkGlassy(base) : anchorGlassyModulus(base, params.E23_MPa);
  }
  const material = withFiller(matrix, params);
  compiled.set(params, material);
  return material;
}

/** The material with its filler's composite constants, the anchored matrix unchanged (E23_MPa is the matrix's). */
function withFiller(m: Material, p: MaterialParams): Material {
  if (p.filler === 'none' || p.fillerMass_pct === 0 || p.density_kgm3 === null) return m;
  const f = FILLERS[p.filler];
  const composite = buildComposite(p.filler, p.fillerMass_pct, p.density_kgm3, p.fillerAspect ?? f.aspect, p.fillerAlign ?? FLOW_ALIGN);
  return { ...m, composite };
}

/**
 * The material with its glassy modulus given at 23 degC (MPa; extrapolated along the slope where Tg is
 * lower); the stored EgMPa is the value at the cold end of the slope, GLASS_SLOPE_SPAN_K lower. Materials
 * that differ only in Tg (dry and conditioned polyamides) thus share the glassy and crystal moduli. TgC is
 * the Tg the clock uses (the wet Tg of a humid record).
 */
function build(p: MaterialParams, EgRefMPa: number, TgC = p.Tg_C): Material {
  const TgK = TgC + KELVIN_OFFSET;
  const glassLowK = T23_K - GLASS_SLOPE_SPAN_K;
  return {
    params: p,
    kind: p.kind,
    shift: { law: p.shiftLaw, TrefK: TgK, C1: p.C1, C2K: p.C2_K, EakJ: p.Ea_kJmol },
    EgMPa: EgRefMPa * Math.exp(p.glassySlope_perK * GLASS_SLOPE_SPAN_K),
    glassSlope: p.glassySlope_perK,
    glassLowK,
    tauTg: p.tauTg_s,
    beta: p.beta,
    tauFlow: p.tauTg_s * 10 ** p.flowDecades,
    lnTauTg: Math.log(p.tauTg_s),
    lnFlowRatio: p.flowDecades * Math.LN10,
    flowBeta: p.flowBeta,
    plateau: p.kind === 'crosslinked' ? 0 : p.plateau_MPa,
    creepN: p.creepN,
    creepRise: p.kind === 'semicrystalline' ? p.creepRise_perK : 0,
    creepLog10PerInvK: (p.creepEa_kJmol * 1000) / (GAS_CONSTANT * Math.LN10),
    crystallinity: p.kind === 'semicrystalline' ? p.crystallinity : 0,
    phi: p.kind === 'semicrystalline' ? p.crystalContinuity : 1,
    TmK: p.Tm_C === null ? Infinity : p.Tm_C + KELVIN_OFFSET,
    meltSharpness: p.meltSharpness,
    meltOnsetK: p.Tm_C === null ? Infinity : p.Tm_C + KELVIN_OFFSET - MELT_ONSET_K,
    crystalRatio: p.kind === 'semicrystalline' ? p.crystalModulusRatio : 1,
    crystalMobility: p.kind === 'semicrystalline' ? p.crystalMobility : 1,
    crystalSlope: p.kind === 'semicrystalline' && p.crystalSlope_perK !== null ? p.crystalSlope_perK : p.glassySlope_perK,
    networkMPaPerK: p.kind === 'crosslinked' ? (3 * (p.density_kgm3 ?? 0) * GAS_CONSTANT) / p.Mc_kgmol / 1e6 : 0,
    prony: null,
    composite: null,
  };
}

function checkGlassy(m: Material): Material {
  const rubber = Math.max(m.plateau, m.networkMPaPerK * T23_K);
  const EgAtTg = m.EgMPa * verticalFactor(m, m.shift.TrefK, m.shift.TrefK);
  if (EgAtTg < 10 * rubber) {
    throw new ParameterError(
      'Eg_MPa',
      `${Number(EgAtTg.toPrecision(4))} MPa (glassy modulus at Tg) must be at least ten times the rubbery modulus (${rubber.toPrecision(3)} MPa)`,
      m.params.Eg_MPa ?? m.params.E23_MPa ?? m.EgMPa,
    );
  }
  return m;
}

/** Upper bound of the modulus (MPa): the larger of the glassy and the crystal-phase modulus at the cold end. */
export function upperBoundMPa(m: Material): number {
  return m.EgMPa * Math.max(1, m.crystalRatio ?? 1);
}

/**
 * Vertical factor of the glassy (or crystal) modulus at T (K), 1 at the cold end and falling by the
 * slope per kelvin up to topK (Tg for the glass, Tm for crystals), constant above: a temperature-dependent
 * modulus scale in the sense of Ferry, Viscoelastic Properties of Polymers, 3rd ed. 1980, ch. 11.
 */
export function verticalFactor(m: Material, TK: number, topK: number): number {
  const s = m.glassSlope ?? 0;
  if (s === 0) return 1;
  const low = m.glassLowK ?? 0;
  // A Tg below the cold end holds the factor at 1 (never above it, so E stays bounded by EgMPa).
  const top = topK > low ? topK : low;
  const Tc = TK < low ? low : TK > top ? top : TK;
  return Math.exp(-s * (Tc - low));
}

/** Solves the glassy modulus so that E(23 degC, datasheet time) equals E23 (MPa). */
function anchorGlassyModulus(base: Material, E23: number): Material {
  const s = base.shift;
  if (s.law === 'wlf' && T23_K - s.TrefK <= -s.C2K + WLF_SINGULARITY_MARGIN_K) {
    throw new ParameterError(
      'E23_MPa',
      `cannot anchor the 23 degC modulus: the pure WLF law is undefined at 23 degC (at or below Tg - C2 + ${WLF_SINGULARITY_MARGIN_K} K); give Eg_MPa instead, or use the hybrid law`,
      E23,
    );
  }
  const at = (logEg: number): number => evaluateClocks(build(base.params, 10 ** logEg), DATASHEET_TIME_S, T23_K).modulusMPa;
  const lo = Math.log10(50);
  const hi = Math.log10(20000);
  const eLo = at(lo);
  const eHi = at(hi);
  if (E23 < eLo || E23 > eHi) {
    throw new ParameterError(
      'E23_MPa',
      `${E23} MPa cannot be reached with a glassy modulus from 50 to 20000 MPa (that range gives ${eLo.toPrecision(3)} to ${eHi.toPrecision(3)} MPa at 23 degC); check Tg_C and the kind, or give Eg_MPa instead`,
      E23,
    );
  }
  const r = brentRoot((x) => at(x) / E23 - 1, lo, hi, 1e-12);
  return checkGlassy(build(base.params, 10 ** r.root));
}

/**
 * Checks that the material's shift law is defined at T (K) (a pure WLF law is not at or below
 * Tg - C2 + 1 K) and returns T; the error names `argument`, the input the temperature came from.
 */
export function checkTemperatureInDomain(m: Material, TK: number, argument: string): number {
  try {
    shiftLog10(m.shift, TK);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(argument, e.problem);
    throw e;
  }
  return TK;
}

/** Relaxation modulus (MPa) at time t (s) and temperature T (K). */
export function modulusMPa(m: Material, tS: number, TK: number): number {
  const log10aT = shiftLog10(m.shift, TK);
  if (m.prony) return pronyModulusMPa(m.prony, tS / 10 ** log10aT);
  const E = modulusParts(m, lnReduced(m, tS, log10aT), creepClock(m, tS, TK), TK, SCRATCH);
  return m.composite ? compositeModulusMPa(m.composite, E) : E;
}

/** Full evaluation (modulus in MPa, region, contributions) at time t (s) and temperature T (K). */
export function evaluateClocks(m: Material, tS: number, TK: number): Evaluation {
  const log10aT = shiftLog10(m.shift, TK);
  if (m.prony) return evaluateProny(m.prony, tS / 10 ** log10aT);
  return evaluateLn(m, lnReduced(m, tS, log10aT), creepClock(m, tS, TK), TK);
}

/** ln(xi / tauTg) for time t (s) and log10 a_T; the logs are taken apart so that extreme shifts stay finite or infinite, never NaN. */
function lnReduced(m: Material, tS: number, log10aT: number): number {
  return Math.log(tS) - m.lnTauTg - Math.LN10 * log10aT;
}

/** The slow-creep clock theta = t / tau_c(T) (dimensionless). */
function creepClock(m: Material, tS: number, TK: number): number {
  return m.creepN === 0 ? 0 : tS / 10 ** (m.creepLog10PerInvK * (1 / TK - 1 / T23_K));
}

/** Slow-creep clock rate: 1 / tau_c(T) in 1/s (tau_c = 1 s at 23 degC). */
export function creepRate(m: Material, TK: number): number {
  return 1 / 10 ** arrheniusLog10(TK, T23_K, m.params.creepEa_kJmol);
}

/** The contributions behind one modulus, filled in place so the hot path allocates nothing. */
interface Parts {
  G: number;
  F: number;
  g: number;
  remaining: number;
  glassy: number;
  rubbery: number;
  lambda: number;
  /** At or above the melting onset (semi-crystalline). */
  melting: boolean;
}

const SCRATCH: Parts = { G: 1, F: 1, g: 1, remaining: 0, glassy: 0, rubbery: 0, lambda: 0, melting: false };

/**
 * Modulus (MPa) of a four-region material from its clocks, writing the contributions into p. lnX = ln(xi / tauTg)
 * with xi the reduced time at Tg (log space: exp is cheaper than pow on the hot path); theta the slow-creep clock.
 */
function modulusParts(m: Material, lnX: number, theta: number, TK: number, p: Parts): number {
  const G = Math.exp(-Math.exp(m.beta * lnX));
  const g = m.creepN === 0 ? 1 : Math.exp(-creepExponent(m, TK) * Math.log1p(theta));
  p.G = G;
  p.g = g;
  const Eg = m.EgMPa * verticalFactor(m, TK, m.shift.TrefK);
  if (m.kind === 'crosslinked') {
    const Er = m.networkMPaPerK * TK;
    p.glassy = g * Math.max(0, Eg - Er) * G;
    // A rubber is not an ideal network: filled rubbers lose a few per cent of stress per decade of time at room
    // temperature (physical relaxation of dangling chains and the filler network; Gent (ed.), Engineering with
    // Rubber, 3rd ed. 2012, stress relaxation chapter, from memory). The bounded power law g, on the slow-creep
    // clock, carries it: a loss of 1 - 10^-creepN per decade once t >> tau_c, never below zero, g = 1 at t = 0.
    p.rubbery = g * Er;
    p.F = 1;
    p.remaining = 0;
    p.lambda = 0;
    return p.glassy + p.rubbery;
  }
  const F = Math.exp(-Math.exp(m.flowBeta * (lnX - m.lnFlowRatio)));
  const glassy = g * Math.max(0, Eg - m.plateau) * G;
  p.glassy = glassy;
  if (m.kind === 'amorphous') {
    const rubbery = g * m.plateau * F;
    p.F = F;
    p.rubbery = rubbery;
    p.remaining = 0;
    p.lambda = 0;
    return glassy + rubbery;
  }
  const remaining = crystalsRemaining(m, TK);
  // Tie chains through the crystals hold the amorphous phase on its plateau: it flows only as they melt.
  const anchored = F + (1 - F) * remaining;
  const rubbery = g * m.plateau * anchored;
  const Ea = glassy + rubbery;
  const c = m.crystalMobility ?? 1;
  // The crystal-fixed share creeps only as its amorphous layers leave the glass (1 - G), late on the slow clock.
  const h =
    c === 1 || m.creepN === 0 ? 1 : 1 - (1 - G) * (1 - Math.exp(-FIXED_CREEP_N * Math.log1p(fixedClock(m, theta, TK) / FIXED_CREEP_ONSET)));
  const gc = c === 1 ? g : c * g + (1 - c) * h;
  // A crystal is taken as at least as stiff as the amorphous phase around it, so that losing crystals never stiffens.
  const Ec = Math.max(gc * (m.crystalRatio ?? 1) * m.EgMPa * crystalFactor(m, TK), Ea);
  const lambda = (m.crystallinity * remaining) / m.phi;
  const series = m.phi === 1 ? Ec : Ea <= 0 ? 0 : 1 / (m.phi / Ec + (1 - m.phi) / Ea);
  p.F = anchored;
  p.rubbery = rubbery;
  p.remaining = remaining;
  p.lambda = lambda;
  p.melting = TK >= m.meltOnsetK;
  return lambda * series + (1 - lambda) * Ea;
}

/**
 * Span above 23 degC over which the slow-creep exponent rises (creepRise_perK), K; it is held above. Set here: 70 K,
 * up to 93 degC, about where the alpha_c loss peaks of polyethylene and polypropylene lie at 1 Hz (50 to 100 degC,
 * from memory): past its peak a process is fully developed and its strength no longer grows. Without the hold the
 * exponent keeps rising up to the melting onset and takes a glass-fibre PP grade's HDT/A some 15 K lower still.
 */
export const CREEP_RISE_SPAN_K = 70;

/**
 * The slow-creep exponent at T (K): creepN at and below 23 degC, rising by creepRise_perK per kelvin above it and
 * held from 23 degC + CREEP_RISE_SPAN_K (or the melting onset, if lower) up. Non-decreasing in T, so the creep factor stays non-increasing in T. The strength
 * of an alpha_c process grows with temperature (Boyd, Polymer 26 (1985) 323, from memory: the alpha loss peak of
 * polyethylene grows as it moves up in temperature), which one exponent at every temperature cannot carry: the
 * 10 s modulus at 80 degC and the heating ramp of HDT/A pull a fixed exponent in opposite directions (PP, POM).
 */
export function creepExponent(m: Material, TK: number): number {
  const rise = m.creepRise ?? 0;
  if (rise === 0 || TK <= T23_K) return m.creepN;
  const Tc = Math.min(TK, m.meltOnsetK, T23_K + CREEP_RISE_SPAN_K);
  return Tc <= T23_K ? m.creepN : m.creepN * (1 + rise * (Tc - T23_K));
}

/** The crystal-fixed creep's clock (1): the slow-creep clock theta at T (K) with FIXED_CREEP_EA_KJMOL for creepEa. */
function fixedClock(m: Material, theta: number, TK: number): number {
  if (theta === 0) return 0;
  const v = theta * 10 ** ((m.creepLog10PerInvK - FIXED_LOG10_PER_INV_K) * (1 / TK - 1 / T23_K));
  // Infinity times an underflowed factor: the extreme ends of the property tests, never a service answer.
  return Number.isNaN(v) ? 0 : v;
}

/**
 * Vertical factor of the crystal-phase modulus at T (K): the glass's up to Tg, then falling by the crystal slope
 * up to Tm, constant above. Above Tg the constrained amorphous layers between the lamellae soften over a broad
 * range (their transition is far broader than the bulk glass's), so the effective crystal-phase modulus falls
 * faster than the glass did; with the glassy slope this is verticalFactor(m, T, Tm).
 */
export function crystalFactor(m: Material, TK: number): number {
  const below = verticalFactor(m, TK, m.shift.TrefK);
  const s = m.crystalSlope ?? m.glassSlope ?? 0;
  const from = Math.max(m.shift.TrefK, m.glassLowK ?? 0);
  const Tc = TK > m.TmK ? m.TmK : TK;
  return Tc <= from || s === 0 ? below : below * Math.exp(-s * (Tc - from));
}

/** Share of the crystals left at T (K), 0 to 1: intact up to the melting onset, 5 % at Tm, an e-fold per MELT_TAIL_K above. */
export function crystalsRemaining(m: Material, TK: number): number {
  if (TK <= m.meltOnsetK) return 1;
  const u = TK >= m.TmK ? 1 : (TK - m.meltOnsetK) / MELT_ONSET_K;
  return Math.exp(-LN_MELT * u ** m.meltSharpness - (TK > m.TmK ? (TK - m.TmK) / MELT_TAIL_K : 0));
}

/** The region of a four-region evaluation from its contributions. */
function regionOf(m: Material, E: number, p: Parts): Region {
  if (m.kind === 'crosslinked') return p.G >= 0.9 ? 'glassy' : p.glassy > p.rubbery ? 'transition' : 'rubbery';
  if (m.kind === 'amorphous') return p.G >= 0.9 ? 'glassy' : p.glassy > p.rubbery ? 'transition' : p.F >= 0.5 ? 'rubbery' : 'flow';
  // Semi-crystalline: from the melting onset up, melting while crystals remain, then the melt. Below it the
  // amorphous phase is glassy, or in transition while its glassy part carries at least a tenth of the
  // stiffness; otherwise the intact crystals carry the part (crystalline).
  if (p.melting) return p.remaining >= 0.01 ? 'melting' : p.F >= 0.5 ? 'rubbery' : 'flow';
  return p.G >= 0.9 ? 'glassy' : (1 - p.lambda) * p.glassy >= 0.1 * E ? 'transition' : 'crystalline';
}

/**
 * Modulus (MPa) from accumulated clocks: xi = reduced time at Tg (s), theta = slow-creep clock (1),
 * with the time-independent parts (melting, network) taken at T (K).
 */
export function evaluateReduced(m: Material, xi: number, theta: number, TK: number): Evaluation {
  if (m.prony) return evaluateProny(m.prony, xi);
  return evaluateLn(m, Math.log(xi) - m.lnTauTg, theta, TK);
}

/** Four-region evaluation from ln(xi / tauTg), the slow-creep clock and T (K). */
function evaluateLn(m: Material, lnX: number, theta: number, TK: number): Evaluation {
  const p: Parts = { ...SCRATCH };
  const E = modulusParts(m, lnX, theta, TK, p);
  return {
    // The region is the matrix's: the filler only scales the modulus.
    modulusMPa: m.composite ? compositeModulusMPa(m.composite, E) : E,
    region: regionOf(m, E, p),
    glassFraction: p.G,
    flowFraction: p.F,
    creepFactor: p.g,
    crystalRemaining: p.remaining,
  };
}

/**
 * A Prony material at reduced time xi. Region from the relaxed share of the series: glassy while at
 * most a tenth of E_g - E_inf has relaxed, rubbery once within a factor 2 of E_inf > 0, flow once
 * below a thousandth of E_g without E_inf, transition otherwise (set here).
 */
function evaluateProny(p: PronySeries, xi: number): Evaluation {
  const E = pronyModulusMPa(p, xi);
  const Eg = pronyGlassyMPa(p);
  const share = Eg > p.EinfMPa ? (E - p.EinfMPa) / (Eg - p.EinfMPa) : 1;
  const region: Region =
    share >= 0.9 ? 'glassy' : p.EinfMPa > 0 && E <= 2 * p.EinfMPa ? 'rubbery' : p.EinfMPa === 0 && E < 1e-3 * Eg ? 'flow' : 'transition';
  return { modulusMPa: E, region, glassFraction: share, flowFraction: 1, creepFactor: 1, crystalRemaining: 0 };
}
