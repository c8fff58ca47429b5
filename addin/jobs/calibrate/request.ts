/**
 * The "calibrate a grade" job, its form: the datasheet numbers the user typed, read and checked into a
 * calibration request (engine units), and the words for the quality of a result. Light on purpose: the
 * calibration itself (plan.ts beside it) is loaded on first use.
 */
import type { CalibrationResult, DatasheetInputs, FreeResult, ModulusDatum } from '../../../src/fit/calibrate.js';
import { significant } from '../../../src/base/display.js';
import { InputError } from '../../../src/base/errors.js';
import type { Family } from '../../../src/material/families.js';
import { HDT_METHODS } from '../../../src/answers/hdt.js';
import { checkMelting, glassTransitionInput, meltingInput } from '../../../src/input/datasheet.js';
import { checkHdtOrder, hdtTemperatureInput, type HdtPoint } from '../../../src/input/hdt.js';
import { familyInput } from '../../../src/input/material.js';
import { modulusInput } from '../../../src/input/modulus.js';
import { temperatureInput } from '../../../src/input/temperature.js';
import { timeInput } from '../../../src/input/time.js';

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

/**
 * Reads the form; throws InputError naming the field (by CALIBRATION_FIELD_NAMES) for anything wrong.
 * Every value and check is the input layer's (src/input/), as in the worksheet's CALIBRATE and the CLI.
 */
export function readCalibration(fields: CalibrationFields): CalibrationRequest {
  const start: Family = familyInput.parse(fields.start, N.start);
  const e23 = given(fields.modulus23);
  const a = given(fields.hdtA);
  const b = given(fields.hdtB);
  const tg = given(fields.tg);
  const tm = given(fields.tm);
  const creep = given(fields.creepModulus);
  const hdt: HdtPoint[] = [];
  if (a !== null) hdt.push({ stressMPa: HDT_METHODS.A, temperatureK: hdtTemperatureInput.parse(a, N.hdtA), raw: a, name: N.hdtA });
  if (b !== null) hdt.push({ stressMPa: HDT_METHODS.B, temperatureK: hdtTemperatureInput.parse(b, N.hdtB), raw: b, name: N.hdtB });
  checkHdtOrder(hdt);
  const TgK = tg === null ? undefined : glassTransitionInput.parse(tg, N.tg);
  let TmK: number | undefined;
  if (tm !== null) {
    TmK = meltingInput.parse(tm, N.tm);
    checkMelting(TmK, tm, TgK, start.params, N.tm);
  }
  const moduli: ModulusDatum[] = [];
  if (creep !== null) {
    const modulusMPa = modulusInput.parse(creep, N.creepModulus);
    const t = given(fields.creepTime);
    const T = given(fields.creepTemperature);
    if (t === null) throw new InputError(N.creepTime, 'give the loading time of the creep modulus, for example 1000 h');
    if (T === null) throw new InputError(N.creepTemperature, 'give the temperature of the creep modulus, for example 23');
    moduli.push({
      kind: 'creep',
      modulusMPa,
      timeS: timeInput.parse(t, N.creepTime),
      temperatureK: temperatureInput.parse(T, N.creepTemperature),
    });
  }
  const inputs: DatasheetInputs = {
    ...(e23 === null ? {} : { modulus23MPa: modulusInput.parse(e23, N.modulus23) }),
    ...(TgK === undefined ? {} : { TgK }),
    ...(TmK === undefined ? {} : { TmK }),
    hdt: hdt.map((h) => ({ stressMPa: h.stressMPa, temperatureK: h.temperatureK })),
    moduli,
  };
  if (inputs.modulus23MPa === undefined && TgK === undefined && TmK === undefined && hdt.length === 0 && moduli.length === 0) {
    throw new InputError('datasheet numbers', 'type at least one: the modulus at 23 degC, an HDT, Tg, Tm or a creep modulus');
  }
  const id = given(fields.id);
  if (id !== null && id.length > 40) throw new InputError(N.id, `use at most 40 characters, got ${id.length}`);
  return { start, inputs, id };
}

export const QUALITY_TEXT: Record<CalibrationResult['quality'], string> = {
  good: 'every datasheet number is reproduced within its tolerance',
  fair: 'every datasheet number is reproduced within three tolerances, not all within one',
  poor: 'some datasheet numbers are not reproduced (or the fit did not converge); read the notes before using the block',
};

/**
 * One fitted parameter in words, with the columns of the written table (FITTED_HEADER): start, calibrated,
 * family default, family low to family high.
 */
export function fittedText(f: FreeResult, family: string | null): string {
  const n = (x: number): string => significant(x, 4);
  const range = f.familyLow !== null && f.familyHigh !== null ? `, family low ${n(f.familyLow)}, family high ${n(f.familyHigh)}` : '';
  const beside = family !== null && f.familyDefault !== null ? `; family default ${n(f.familyDefault)}${range} (${family})` : '';
  return `${f.field}: start ${n(f.start)}, calibrated ${n(f.value)}${f.atBound ? ' (on search bound)' : ''}${beside}`;
}
