/**
 * Fillers and the modulus of a filled grade from its matrix's modulus.
 *
 * Filler codes are those of ISO 1043-2 (material letter, then form letter): GF glass fibre, CF carbon fibre,
 * GB glass beads, MD mineral powder, TD talc powder. Others are refused with the supported list.
 *
 * Micromechanics (Halpin-Tsai; Halpin and Kardos, Polym. Eng. Sci. 16 (1976) 344):
 *   P / Pm = (1 + zeta eta phi) / (1 - eta phi),  eta = (Pf - Pm) / (Pf + zeta Pm)
 * with phi the filler volume fraction. Short fibres: E11 with zeta = 2 l/d, E22 with zeta = 2, G12 with
 * zeta = 1, nu12 by the rule of mixtures; the unidirectional ply is then averaged over a planar fibre
 * orientation (laminate analogy: the plane-stress stiffness averaged with the fourth moments of the
 * orientation distribution, as in Advani and Tucker, J. Rheol. 31 (1987) 751) and the modulus along the
 * load is 1 / S11 of the averaged stiffness. Spheres (GB): zeta = 2. Platelets (TD, MD) lie flat in a
 * moulded wall and are in-plane isotropic: zeta = 2 a / 3 with a = width / thickness (set here: the value
 * commonly used for disc-shaped fillers, from memory).
 *
 * Viscoelastic matrix: quasi-elastic (correspondence) approximation, Schapery, Proc. 5th U.S. Nat. Congr.
 * Appl. Mech. (1966) 511, from memory: at each (t, T) the matrix's E_r(t, T) is put into the elastic formula
 * with the filler elastic and the matrix Poisson ratio held constant.
 */

/** The ISO 1043-2 filler codes supported, in the order messages list them. */
export const FILLER_CODES = ['GF', 'CF', 'GB', 'MD', 'TD'] as const;
export type FillerCode = (typeof FILLER_CODES)[number];
/** The `filler` field of an unfilled material. */
export const NO_FILLER = 'none';
export type FillerField = FillerCode | typeof NO_FILLER;

export type FillerShape = 'fibre' | 'sphere' | 'platelet';

/** One filler: its elastic constants, density, default shape and the mass percent range a grade may give. */
export interface Filler {
  readonly code: FillerCode;
  readonly name: string;
  readonly shape: FillerShape;
  /** kg/m3 */
  readonly density_kgm3: number;
  /** Axial (fibre) or in-plane (platelet) modulus, MPa. */
  readonly E1_MPa: number;
  /** Transverse modulus, MPa (equal to E1 for an isotropic filler). */
  readonly E2_MPa: number;
  /** Shear modulus, MPa. */
  readonly G_MPa: number;
  readonly poisson: number;
  /** Length / diameter (fibre) or width / thickness (platelet) after moulding; 1 for spheres. */
  readonly aspect: number;
  /** Mass percent range a grade text may give, %. */
  readonly massPct: readonly [number, number];
  readonly source: string;
}

const GLASS =
  'from memory: E-glass 72 to 76 GPa, 2.54 to 2.6 g/cm3, Poisson 0.22 (Hull and Clyne, An Introduction to Composite Materials, 2nd ed. 1996, Table 2.1)';

/** The supported fillers by code; every number cited. */
export const FILLERS: Readonly<Record<FillerCode, Filler>> = {
  GF: {
    code: 'GF',
    name: 'glass fibre',
    shape: 'fibre',
    density_kgm3: 2550,
    E1_MPa: 72000,
    E2_MPa: 72000,
    G_MPa: 29500,
    poisson: 0.22,
    // Common practice, from memory: fibres of 10 to 13 um broken to 0.2 to 0.4 mm by compounding and moulding.
    aspect: 25,
    massPct: [5, 60],
    source: `${GLASS}; aspect ratio 25 after moulding (set here within the 15 to 40 of moulded short-glass grades: 0.2 to 0.4 mm long, 10 to 13 um across, common practice, from memory)`,
  },
  CF: {
    code: 'CF',
    name: 'carbon fibre',
    shape: 'fibre',
    density_kgm3: 1780,
    E1_MPa: 230000,
    E2_MPa: 15000,
    G_MPa: 15000,
    poisson: 0.2,
    aspect: 20,
    massPct: [5, 50],
    source:
      'from memory: standard-modulus PAN carbon fibre, axial 230 GPa, transverse and shear about 15 GPa, 1.76 to 1.8 g/cm3 (Hull and Clyne 1996, Table 2.1); aspect ratio 20 after moulding (common practice, from memory: 0.1 to 0.2 mm long, 7 um across)',
  },
  GB: {
    code: 'GB',
    name: 'glass beads',
    shape: 'sphere',
    density_kgm3: 2500,
    E1_MPa: 70000,
    E2_MPa: 70000,
    G_MPa: 28700,
    poisson: 0.22,
    aspect: 1,
    massPct: [5, 50],
    source: `${GLASS}; solid soda-lime beads about 2.5 g/cm3 and 70 GPa (from memory)`,
  },
  MD: {
    code: 'MD',
    name: 'mineral powder',
    shape: 'platelet',
    density_kgm3: 2700,
    E1_MPa: 60000,
    E2_MPa: 60000,
    G_MPa: 24000,
    poisson: 0.25,
    aspect: 4,
    massPct: [5, 60],
    source:
      'set here for a generic mineral powder (calcined kaolin, wollastonite or chalk: 2.6 to 2.9 g/cm3, 35 to 150 GPa, from memory): 2.7 g/cm3, 60 GPa, low aspect ratio 4',
  },
  TD: {
    code: 'TD',
    name: 'talc powder',
    shape: 'platelet',
    density_kgm3: 2780,
    E1_MPa: 100000,
    E2_MPa: 100000,
    G_MPa: 40000,
    poisson: 0.25,
    aspect: 10,
    massPct: [5, 50],
    source:
      'from memory: talc 2.7 to 2.8 g/cm3, in-plane modulus 100 to 170 GPa (lower value taken), compounding grades 5 to 20 wide per unit thickness (aspect 10 set here)',
  },
};

/**
 * Poisson ratio of the matrix, held constant (set here: 0.38, within the 0.35 to 0.42 of glassy and
 * semi-crystalline thermoplastics, from memory; it rises toward 0.5 in the rubbery state, which the
 * quasi-elastic approximation here ignores).
 */
export const MATRIX_POISSON = 0.38;

/**
 * Default orientation: a11 of the planar fibre orientation tensor along the load for an injection-moulded
 * plaque tested along flow, the direction datasheets quote (set here: 0.75, inside the 0.6 to 0.8
 * through-thickness average of moulded plaques, from memory; shell layers near 0.8 to 0.9, core lower; with
 * the glass-fibre aspect ratio 25 it puts PA66-GF30 within about 10 % of its typical dry modulus).
 */
export const FLOW_ALIGN = 0.75;

/** The supported codes, for messages: "GF (glass fibre), CF (carbon fibre), ...". */
export function fillerList(): string {
  return FILLER_CODES.map((c) => `${c} (${FILLERS[c].name})`).join(', ');
}

/** The filler of a code (any case), or undefined. */
export function fillerOf(code: string): Filler | undefined {
  const k = code.trim().toUpperCase();
  return (FILLER_CODES as readonly string[]).includes(k) ? FILLERS[k as FillerCode] : undefined;
}

/** Filler volume fraction (0 to 1) from its mass percent and the two densities (kg/m3). */
export function volumeFraction(massPct: number, fillerDensity: number, matrixDensity: number): number {
  const w = massPct / 100;
  const vf = w / fillerDensity;
  const vm = (1 - w) / matrixDensity;
  return vf + vm === 0 ? 0 : vf / (vf + vm);
}

/** The constants of a filled grade, precomputed so that evaluation allocates nothing. */
export interface Composite {
  readonly code: FillerCode;
  readonly shape: FillerShape;
  /** Filler volume fraction. */
  readonly phi: number;
  readonly E1: number;
  readonly E2: number;
  readonly G: number;
  /** Halpin-Tsai zeta of the axial (fibre) or in-plane (platelet, sphere) modulus. */
  readonly zeta: number;
  /** nu12 of the ply (rule of mixtures). */
  readonly nu12: number;
  /** Fourth moments of the planar orientation: <cos^4>, <sin^2 cos^2>, <sin^4>. */
  readonly c4: number;
  readonly s2c2: number;
  readonly s4: number;
}

/**
 * Fourth moments of a planar orientation with a11 (0 to 1) along the load: a mixture of fibres aligned along
 * the load (a11 > 1/2) or across it (a11 < 1/2) with fibres random in the plane (set here: the simplest
 * distribution that spans aligned, random and transverse with one number).
 */
export function orientationMoments(a11: number): { c4: number; s2c2: number; s4: number } {
  const s = Math.abs(2 * a11 - 1);
  const random = 1 - s;
  const along = a11 >= 0.5 ? s : 0;
  const across = a11 >= 0.5 ? 0 : s;
  return { c4: along + (3 / 8) * random, s2c2: random / 8, s4: across + (3 / 8) * random };
}

/** The composite constants of a filler at a mass percent in a matrix of a density (kg/m3), with its shape and orientation. */
export function buildComposite(code: FillerCode, massPct: number, matrixDensity: number, aspect: number, a11: number): Composite {
  const f = FILLERS[code];
  const phi = volumeFraction(massPct, f.density_kgm3, matrixDensity);
  const zeta = f.shape === 'fibre' ? 2 * aspect : f.shape === 'sphere' ? 2 : (2 * aspect) / 3;
  const m = f.shape === 'fibre' ? orientationMoments(a11) : { c4: 1, s2c2: 0, s4: 0 };
  return {
    code,
    shape: f.shape,
    phi,
    E1: f.E1_MPa,
    E2: f.E2_MPa,
    G: f.G_MPa,
    zeta,
    nu12: phi * f.poisson + (1 - phi) * MATRIX_POISSON,
    ...m,
  };
}

/** Halpin-Tsai: a composite property (MPa) from the filler's Pf and the matrix's Pm (MPa), zeta and the volume fraction phi. */
export function halpinTsai(Pf: number, Pm: number, zeta: number, phi: number): number {
  return Pm * halpinTsaiRatio(Pf / Pm, zeta, phi);
}

/**
 * Halpin-Tsai as P / Pm from r = Pf / Pm (dimensionless). Worked in ratios so that a nearly relaxed matrix
 * (1e-150 MPa) keeps full precision; eta = (r - 1) / (r + zeta) written so that r = infinity gives 1.
 */
function halpinTsaiRatio(r: number, zeta: number, phi: number): number {
  const eta = 1 - (1 + zeta) / (r + zeta);
  return (1 + zeta * eta * phi) / (1 - eta * phi);
}

/** Modulus of the filled grade along the load (MPa) from the matrix modulus Em (MPa) at the same (t, T). */
export function compositeModulusMPa(c: Composite, Em: number): number {
  if (c.phi === 0 || !(Em > 0)) return Em;
  if (c.shape !== 'fibre') return Em * halpinTsaiRatio(c.E1 / Em, c.zeta, c.phi);
  // Moduli as ratios to Em, the answer scaled back at the end.
  const E11 = halpinTsaiRatio(c.E1 / Em, c.zeta, c.phi);
  const E22 = halpinTsaiRatio(c.E2 / Em, 2, c.phi);
  const G12 = halpinTsaiRatio((c.G * 2 * (1 + MATRIX_POISSON)) / Em, 1, c.phi) / (2 * (1 + MATRIX_POISSON));
  const nu21 = (c.nu12 * E22) / E11;
  const d = 1 - c.nu12 * nu21;
  const Q11 = E11 / d;
  const Q22 = E22 / d;
  const Q12 = (c.nu12 * E22) / d;
  const mixed = 2 * c.s2c2 * (Q12 + 2 * G12);
  const Qx = c.c4 * Q11 + mixed + c.s4 * Q22;
  const Qy = c.s4 * Q11 + mixed + c.c4 * Q22;
  const Qxy = c.s2c2 * (Q11 + Q22 - 4 * G12) + (c.c4 + c.s4) * Q12;
  return Em * (Qx - (Qxy * Qxy) / Qy);
}

/** Voigt and Reuss bounds (MPa) of the composite at matrix modulus Em (MPa): Hill, Proc. Phys. Soc. A 65 (1952) 349. */
export function hillBounds(c: Composite, Em: number): { reuss: number; voigt: number } {
  const lo = Math.min(c.E1, c.E2);
  const hi = Math.max(c.E1, c.E2);
  return { reuss: 1 / (c.phi / lo + (1 - c.phi) / Em), voigt: c.phi * hi + (1 - c.phi) * Em };
}
