/**
 * Grades as datasheets name them: a bundled family, optionally followed by an ISO 1043-2 filler code and
 * its mass percent (`PBT-GF30`, `PP-TD20`, `PA66-dry-GF30`, `PEEK-CF30`), and for a polyamide optionally a
 * closing humidity clause (`PA66-GF30 at 70 % RH`; a bare `PA66` base is taken at 50 % RH). The base, with the
 * humidity, is resolved by getFamily, then the filler is applied; the matrix parameters are the base's unchanged.
 */
import { ParameterError, UnknownFamilyError } from '../base/errors.js';
import { displayedParams, FAMILIES, getFamily, type Family } from './families.js';
import { FILLERS, fillerList, fillerOf } from './filler.js';
import { splitHumidity } from './humidity.js';
import { compileMaterial, DATASHEET_TIME_S, modulusMPa, T23_K } from './model.js';

/** `<base>-<two letters><mass percent>`, the filler clause at the end. */
const GRADE = /^(.+?)-([A-Za-z]{2})\s*(\d+(?:\.\d+)?)$/;

const cache = new Map<string, Family>();

/** A family or filled grade from its text (case and surrounding spaces do not matter); cached. */
export function getGrade(text: string): Family {
  const key = text.trim().toLowerCase();
  const hit = cache.get(key);
  if (hit) return hit;
  const grade = parseGrade(text.trim());
  if (cache.size > 500) cache.clear();
  cache.set(key, grade);
  return grade;
}

function parseGrade(text: string): Family {
  // A humidity clause closes the text ("PA66-GF30 at 50 % RH"): it applies to the matrix, so it goes with the base.
  const { symbol, rhPct } = splitHumidity(text);
  const m = GRADE.exec(symbol);
  if (!m) return getFamily(text);
  const [, baseText = '', codeText = '', massText = ''] = m;
  const filler = fillerOf(codeText);
  if (!filler) {
    throw new ParameterError(
      'filler',
      `"${codeText}" in "${text}" is not a supported ISO 1043-2 filler code; supported: ${fillerList()}`,
      codeText,
    );
  }
  let base: Family;
  try {
    base = getFamily(rhPct === null ? baseText : `${baseText} at ${rhPct} % RH`);
  } catch (e) {
    if (!(e instanceof UnknownFamilyError)) throw e;
    throw new UnknownFamilyError(
      text,
      e.suggestions.map((s) => `${s}-${filler.code}${massText}`),
    );
  }
  const mass = Number(massText);
  const [lo, hi] = filler.massPct;
  if (!(mass >= lo && mass <= hi)) {
    throw new ParameterError('fillerMass_pct', `${mass} % of ${filler.code} in "${text}" is outside ${lo} to ${hi} %`, mass);
  }
  if (base.params.filler !== 'none') throw new ParameterError('filler', `"${text}" names a filler twice`, text);
  if (base.params.density_kgm3 === null) {
    throw new ParameterError('density_kgm3', `the family ${base.params.id} has no density, so "${text}" cannot be built`);
  }
  // A humid base is named "PA66 at 70 % RH": the filler code goes after the symbol, the humidity stays last.
  const baseId = splitHumidity(base.params.id);
  const id = `${baseId.symbol}-${filler.code}${mass}${baseId.rhPct === null ? '' : ` at ${baseId.rhPct} % RH`}`;
  return {
    params: Object.freeze({
      ...base.params,
      id,
      name: `${base.params.name}, ${mass} % ${filler.name}`,
      filler: filler.code,
      fillerMass_pct: mass,
    }),
    sources: Object.freeze({ ...base.sources, fillerMass_pct: `grade text ${id}; filler: ${FILLERS[filler.code].source}` }),
    note: base.note,
  };
}

/**
 * Common filled grades, shown where families are listed. Polyamides dry as moulded (the `-dry` base); the
 * check values they are held to are in checks-filled.ts.
 */
export const FILLED_GRADE_IDS: readonly string[] = [
  'PA66-dry-GF30',
  'PA6-dry-GF30',
  'PBT-GF30',
  'PP-GF30',
  'PPS-GF40',
  'POM-GF25',
  'PC-GF10',
  'PA66-dry-MD40',
  'PEEK-CF30',
  'PP-TD20',
];

/** The bundled families, then the common filled grades. */
export function familiesAndGrades(): readonly Family[] {
  return [...FAMILIES, ...FILLED_GRADE_IDS.map(getGrade)];
}

/** Where a listing's 23 degC modulus of a filled grade comes from. */
export const GRADE_MODULUS_SOURCE =
  'estimated here: Halpin-Tsai on the matrix modulus, along flow (filler.ts); the matrix modulus is the family datasheet value';

/**
 * The 23 degC short-term modulus a listing shows, MPa: the family's datasheet value, or for a filled grade the
 * model's composite modulus at 23 degC and the datasheet time (E23_MPa of a filled record is its matrix's).
 */
export function listedModulusMPa(f: Family): number | null {
  // A humid polyamide lists its wet modulus (its parameter block keeps the dry one and the humidity).
  if (f.params.filler === 'none') return displayedParams(f.params).E23_MPa;
  return modulusMPa(compileMaterial(f.params), DATASHEET_TIME_S, T23_K);
}
