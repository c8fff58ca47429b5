/**
 * The "calibrate a grade" job, its form: the datasheet numbers the user typed, read and checked into a
 * calibration request (engine units), and the words for the quality of a result. Light on purpose: the
 * calibration itself (plan.ts beside it) is loaded on first use.
 */
import type { CalibrationResult, DatasheetInputs, HdtDatum, ModulusDatum } from '../../../src/fit/calibrate.js';
import { InputError } from '../../../src/base/errors.js';
import { getFamily, type Family } from '../../../src/material/families.js';
import { HDT_MAX_C, HDT_METHODS, HDT_START_C } from '../../../src/answers/hdt.js';
import { cToKelvin, kelvinToC, parseStressMPa, parseTemperatureK, parseTimeS } from '../../../src/base/units.js';

/** What the user typed, as text; empty text means "not on my datasheet". */
export interface CalibrationFields {
  readonly start: string;
  readonly modulus23: string;
  readonly hdtA: string;
  readonly hdtB: string;
  readonly tg: string;
  readonly tm: string;
  readonly creepModulus: string;
  readonly creepTime: string;
  readonly creepTemperature: string;
  readonly id: string;
}

/** The name each field goes by in messages (and the argument of the InputError it raises). */
export const CALIBRATION_FIELD_NAMES: Record<keyof CalibrationFields, string> = {
  start: 'starting family',
  modulus23: 'modulus at 23 degC',
  hdtA: 'HDT/A (1.80 MPa)',
  hdtB: 'HDT/B (0.45 MPa)',
  tg: 'Tg',
  tm: 'Tm',
  creepModulus: 'creep modulus',
  creepTime: 'creep time',
  creepTemperature: 'creep temperature',
  id: 'grade name',
};

/** A checked request: the starting family and the datasheet numbers in engine units. */
export interface CalibrationRequest {
  readonly start: Family;
  readonly inputs: DatasheetInputs;
  /** Short name of the calibrated record; null for the engine's default (start id + '-cal'). */
  readonly id: string | null;
}

const N = CALIBRATION_FIELD_NAMES;

function given(text: string): string | null {
  const t = text.trim();
  return t === '' ? null : t;
}

function hdtK(text: string, argument: string): number {
  const K = parseTemperatureK(text, argument);
  const C = kelvinToC(K);
  // The simulated test starts at 23 degC and gives up at 500 degC (hdt.ts); an HDT outside cannot be met.
  if (!(C > HDT_START_C))
    throw new InputError(argument, `must be above ${HDT_START_C} degC, where the ISO 75 test starts; got ${text.trim()}`);
  if (C > HDT_MAX_C) throw new InputError(argument, `must be at most ${HDT_MAX_C} degC, got ${text.trim()}`);
  return K;
}

/** Reads the form; throws InputError naming the field (by CALIBRATION_FIELD_NAMES) for anything wrong. */
export function readCalibration(fields: CalibrationFields): CalibrationRequest {
  let start: Family;
  try {
    start = getFamily(fields.start.trim());
  } catch (e) {
    throw new InputError(N.start, e instanceof Error ? e.message : String(e));
  }
  const kind = start.params.kind;
  const e23 = given(fields.modulus23);
  const a = given(fields.hdtA);
  const b = given(fields.hdtB);
  const tg = given(fields.tg);
  const tm = given(fields.tm);
  const creep = given(fields.creepModulus);
  const hdt: HdtDatum[] = [];
  if (a !== null) hdt.push({ stressMPa: HDT_METHODS.A, temperatureK: hdtK(a, N.hdtA) });
  if (b !== null) hdt.push({ stressMPa: HDT_METHODS.B, temperatureK: hdtK(b, N.hdtB) });
  const [hA, hB] = hdt;
  if (a !== null && b !== null && hA && hB && hA.temperatureK > hB.temperatureK) {
    throw new InputError(
      N.hdtA,
      `${a} is above HDT/B (${b}); the higher stress of method A always deflects at a lower temperature, so check the two values`,
    );
  }
  const TgK = tg === null ? undefined : parseTemperatureK(tg, N.tg);
  let TmK: number | undefined;
  if (tm !== null) {
    if (kind !== 'semicrystalline') {
      throw new InputError(N.tm, `is only used for semi-crystalline materials and ${start.params.id} is ${kind}; leave it empty`);
    }
    TmK = parseTemperatureK(tm, N.tm);
    const TgRef = TgK ?? cToKelvin(start.params.Tg_C);
    if (!(TmK > TgRef)) {
      throw new InputError(
        N.tm,
        `must be above Tg (${TgK === undefined ? `${start.params.id}'s ` : ''}${round(kelvinToC(TgRef))} degC), got ${tm}`,
      );
    }
  }
  const moduli: ModulusDatum[] = [];
  if (creep !== null) {
    const modulusMPa = parseStressMPa(creep, N.creepModulus);
    const t = given(fields.creepTime);
    const T = given(fields.creepTemperature);
    if (t === null) throw new InputError(N.creepTime, 'give the loading time of the creep modulus, for example 1000 h');
    if (T === null) throw new InputError(N.creepTemperature, 'give the temperature of the creep modulus, for example 23');
    moduli.push({ kind: 'creep', modulusMPa, timeS: parseTimeS(t, N.creepTime), temperatureK: parseTemperatureK(T, N.creepTemperature) });
  }
  const inputs: DatasheetInputs = {
    ...(e23 === null ? {} : { modulus23MPa: parseStressMPa(e23, N.modulus23) }),
    ...(TgK === undefined ? {} : { TgK }),
    ...(TmK === undefined ? {} : { TmK }),
    hdt,
    moduli,
  };
  if (inputs.modulus23MPa === undefined && TgK === undefined && TmK === undefined && hdt.length === 0 && moduli.length === 0) {
    throw new InputError('datasheet numbers', 'type at least one: the modulus at 23 degC, an HDT, Tg, Tm or a creep modulus');
  }
  const id = given(fields.id);
  if (id !== null && id.length > 40) throw new InputError(N.id, `use at most 40 characters, got ${id.length}`);
  return { start, inputs, id };
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}

export const QUALITY_TEXT: Record<CalibrationResult['quality'], string> = {
  good: 'every datasheet number is reproduced within its tolerance',
  fair: 'every datasheet number is reproduced within three tolerances, not all within one',
  poor: 'some datasheet numbers are not reproduced (or the fit did not converge); read the notes before using the block',
};
