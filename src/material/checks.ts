/**
 * The values each bundled family is tuned to and held to (test/checks.test.ts, the README table): typical
 * unfilled-grade HDT/A and HDT/B (ISO 75-2, 1.80 / 0.45 MPa), the short-term modulus at an elevated
 * temperature, the 1000 h creep modulus at 23 degC (ISO 899-1, low stress), and for conditioned grades the
 * datasheet 23 degC modulus. Every value is "common practice, from memory": recalled from typical datasheets
 * and design guides, not checked against a document. Null where nothing reliable is recalled.
 * Kept apart from families.ts so that the worksheet functions' start-up bundle does not carry it.
 */

/** The check values of one family (degC, MPa). */
export interface FamilyCheck {
  readonly id: string;
  readonly hdtA_C: number | null;
  readonly hdtB_C: number | null;
  /** Short-term (ISO 527, about 10 s) modulus at an elevated temperature: [degC, MPa]. */
  readonly hot: readonly [number, number] | null;
  /** Creep modulus after 1000 h at 23 degC, MPa. */
  readonly creep1000h_MPa: number | null;
  /** Datasheet 23 degC modulus of a conditioned grade, MPa (the model derives it from the dry grade). */
  readonly conditionedE23_MPa?: number;
  readonly source: string;
}

/** Tolerances of the checks: HDT 8 K, moduli 20 % (issue 12; datasheet HDTs of one family spread by some 10 K between grades). */
export const CHECK_HDT_K = 8;
export const CHECK_MODULUS_REL = 0.2;

const DATASHEET =
  'common practice, from memory: typical unfilled-grade datasheet values (ISO 75-2 HDT, ISO 527 modulus versus temperature)';
const DESIGN = `${DATASHEET}; 1000 h creep modulus at 23 degC from typical design-guide creep curves at low stress (ISO 899-1)`;

/** Check values by family id, in table order. */
export const FAMILY_CHECKS: readonly FamilyCheck[] = [
  { id: 'PE-HD', hdtA_C: 45, hdtB_C: 75, hot: [80, 250], creep1000h_MPa: 350, source: DESIGN },
  { id: 'PE-LD', hdtA_C: 35, hdtB_C: 45, hot: [60, 80], creep1000h_MPa: 100, source: DESIGN },
  { id: 'PP', hdtA_C: 58, hdtB_C: 100, hot: [80, 550], creep1000h_MPa: 500, source: DESIGN },
  { id: 'PS', hdtA_C: 85, hdtB_C: 92, hot: [80, 2600], creep1000h_MPa: 2500, source: DESIGN },
  { id: 'PMMA', hdtA_C: 95, hdtB_C: 103, hot: [80, 2000], creep1000h_MPa: 2200, source: DESIGN },
  { id: 'PC', hdtA_C: 128, hdtB_C: 140, hot: [120, 1900], creep1000h_MPa: 2000, source: DESIGN },
  { id: 'PVC-U', hdtA_C: 68, hdtB_C: 75, hot: [60, 2200], creep1000h_MPa: 2400, source: DESIGN },
  { id: 'ABS', hdtA_C: 90, hdtB_C: 98, hot: [80, 1700], creep1000h_MPa: 1800, source: DESIGN },
  { id: 'PSU', hdtA_C: 174, hdtB_C: 181, hot: [150, 2000], creep1000h_MPa: 2300, source: DESIGN },
  { id: 'PESU', hdtA_C: 207, hdtB_C: 215, hot: [180, 2200], creep1000h_MPa: 2400, source: DESIGN },
  { id: 'PEI', hdtA_C: 200, hdtB_C: 210, hot: [180, 2500], creep1000h_MPa: 2800, source: DESIGN },
  { id: 'PA6-dry', hdtA_C: 65, hdtB_C: 175, hot: [80, 800], creep1000h_MPa: 1800, source: DESIGN },
  { id: 'PA6-cond', hdtA_C: null, hdtB_C: null, hot: null, creep1000h_MPa: null, conditionedE23_MPa: 1100, source: DATASHEET },
  { id: 'PA66-dry', hdtA_C: 75, hdtB_C: 220, hot: [100, 800], creep1000h_MPa: 2000, source: DESIGN },
  { id: 'PA66-cond', hdtA_C: null, hdtB_C: null, hot: null, creep1000h_MPa: null, conditionedE23_MPa: 1500, source: DATASHEET },
  { id: 'POM', hdtA_C: 100, hdtB_C: 158, hot: [80, 1400], creep1000h_MPa: 1300, source: DESIGN },
  { id: 'POM-H', hdtA_C: 110, hdtB_C: 165, hot: [80, 1500], creep1000h_MPa: 1400, source: DESIGN },
  { id: 'PET', hdtA_C: 80, hdtB_C: null, hot: [100, 600], creep1000h_MPa: 2100, source: DESIGN },
  { id: 'PBT', hdtA_C: 60, hdtB_C: 165, hot: [80, 800], creep1000h_MPa: 1700, source: DESIGN },
  { id: 'PPS', hdtA_C: 110, hdtB_C: null, hot: [120, 800], creep1000h_MPa: 2900, source: DESIGN },
  { id: 'PEEK', hdtA_C: 156, hdtB_C: null, hot: [120, 3100], creep1000h_MPa: 3000, source: DESIGN },
  { id: 'PTFE', hdtA_C: 50, hdtB_C: 120, hot: [100, 250], creep1000h_MPa: 200, source: DESIGN },
  { id: 'PVDF', hdtA_C: 110, hdtB_C: 148, hot: [100, 800], creep1000h_MPa: null, source: DATASHEET },
];

/** The check values of one filled grade (degC, MPa): its 23 degC short-term modulus and HDT/A. */
export interface FilledCheck {
  readonly id: string;
  /** ISO 527 tensile modulus at 23 degC, dry as moulded for polyamides, MPa. */
  readonly E23_MPa: number;
  /** ISO 75-2 HDT/A (1.80 MPa), degC; null where nothing reliable is recalled. */
  readonly hdtA_C: number | null;
  readonly source: string;
}

const FILLED_DATASHEET =
  'common practice, from memory: typical datasheet values of the filled grade (ISO 527 modulus at 23 degC, dry as moulded for polyamides; ISO 75-2 HDT/A); glass fibre lifts a semi-crystalline resin toward its Tm, an amorphous one by a few K';

/** Check values of the common filled grades (grade.ts FILLED_GRADE_IDS), in that order. */
export const FILLED_CHECKS: readonly FilledCheck[] = [
  { id: 'PA66-dry-GF30', E23_MPa: 10000, hdtA_C: 250, source: FILLED_DATASHEET },
  { id: 'PA6-dry-GF30', E23_MPa: 9500, hdtA_C: 205, source: FILLED_DATASHEET },
  { id: 'PBT-GF30', E23_MPa: 10000, hdtA_C: 205, source: FILLED_DATASHEET },
  { id: 'PP-GF30', E23_MPa: 6000, hdtA_C: 145, source: `${FILLED_DATASHEET}; chemically coupled grades` },
  { id: 'PPS-GF40', E23_MPa: 14000, hdtA_C: 265, source: FILLED_DATASHEET },
  { id: 'POM-GF25', E23_MPa: 8500, hdtA_C: 160, source: FILLED_DATASHEET },
  { id: 'PC-GF10', E23_MPa: 3800, hdtA_C: 135, source: FILLED_DATASHEET },
  { id: 'PA66-dry-MD40', E23_MPa: 6500, hdtA_C: null, source: FILLED_DATASHEET },
  { id: 'PEEK-CF30', E23_MPa: 23000, hdtA_C: 315, source: FILLED_DATASHEET },
  { id: 'PP-TD20', E23_MPa: 2600, hdtA_C: 67, source: FILLED_DATASHEET },
];
