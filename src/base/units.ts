/**
 * Unit parsing at the boundary. Bare numbers are degC, hours and MPa; text with a unit goes through
 * mathjs units (only the unit system is created, with number arithmetic: ./unit-system.ts). Engine units:
 * kelvin, seconds, MPa.
 */
import type { Unit } from 'mathjs';
import { InputError } from './errors.js';
import { math } from './unit-system.js';

/** 1 psi = 6894.757293168 Pa (NIST SP 811, 2008, appendix B.8); ksi is not built into mathjs. */
export const PA_PER_PSI = 6894.757293168;
math.createUnit('ksi', { definition: `${PA_PER_PSI * 1000} Pa` });
// Short spellings engineers type that mathjs lacks; `year` in mathjs is the Julian year (365.25 d).
math.createUnit('y', { definition: '1 year' });
math.createUnit('yr', { definition: '1 year' });
math.createUnit('d', { definition: '1 day' });

/** Absolute zero on the Celsius scale (definition of the kelvin, SI Brochure 9th ed. 2019). */
export const KELVIN_OFFSET = 273.15;
/**
 * Highest temperature accepted, degC. Set here: far above where any organic polymer survives (common
 * practice: they decompose below about 600 degC), so a unit slip or a runaway number is refused with a
 * clear error instead of reaching the model (3 rho R T / Mc overflows near 1e308 K).
 */
export const MAX_TEMPERATURE_C = 2000;
/**
 * Lowest temperature accepted, kelvin. Set here: below any service temperature (liquid helium, 4.2 K,
 * stays accepted) and far above where the Arrhenius term 1/T overflows (about 1e-300 K).
 */
export const MIN_TEMPERATURE_K = 1;
export const SECONDS_PER_HOUR = 3600;
/** The Julian year, 365.25 d (IAU), as mathjs uses it. */
export const SECONDS_PER_YEAR = 31557600;

/**
 * The model's temperature range, kelvin: -150 to 500 degC. Set here: from the lowest Tg a parameter
 * record accepts to above the melting range of every bundled family (PEEK, Tm about 343 degC); every
 * answer (inverse searches, test data, histories) stays inside it.
 */
export const MODEL_TEMPERATURE_K: readonly [number, number] = [-150 + KELVIN_OFFSET, 500 + KELVIN_OFFSET];
/**
 * The model's time range, seconds: 1 ms to 100 Julian years. Set here: from the shortest loading a
 * part sees (impact aside) to beyond any design life; answers outside it are refused or flagged.
 */
export const MODEL_TIME_S: readonly [number, number] = [1e-3, 100 * SECONDS_PER_YEAR];

/** What a unit text measures. */
export type UnitQuantity = 'temperature' | 'time' | 'stress';

/**
 * Unit words and symbols read in any case (a Map, so that typed text such as '__proto__' finds nothing): none of them changes meaning with case in the quantity it
 * is used for ('H' is not a time unit, 'k' alone not a temperature unit, 'GPA' has no other reading),
 * so folding is safe. Keys are lower case.
 */
const FOLDED = new Map<string, string>(
  Object.entries({
    '°c': 'degC',
    '℃': 'degC',
    degc: 'degC',
    'deg c': 'degC',
    c: 'degC',
    celsius: 'degC',
    'degree celsius': 'degC',
    'degrees celsius': 'degC',
    '°f': 'degF',
    '℉': 'degF',
    degf: 'degF',
    'deg f': 'degF',
    f: 'degF',
    fahrenheit: 'degF',
    'degree fahrenheit': 'degF',
    'degrees fahrenheit': 'degF',
    k: 'K',
    kelvin: 'K',
    kelvins: 'K',
    h: 'h',
    hr: 'h',
    hrs: 'h',
    hour: 'h',
    hours: 'h',
    s: 's',
    sec: 's',
    secs: 's',
    second: 's',
    seconds: 's',
    min: 'min',
    mins: 'min',
    minute: 'min',
    minutes: 'min',
    d: 'd',
    day: 'day',
    days: 'day',
    wk: 'week',
    week: 'week',
    weeks: 'week',
    y: 'y',
    yr: 'y',
    yrs: 'y',
    year: 'year',
    years: 'year',
    pa: 'Pa',
    kpa: 'kPa',
    gpa: 'GPa',
    psi: 'psi',
    ksi: 'ksi',
    'n/mm2': 'MPa',
    'n/mm^2': 'MPa',
    'n/mm²': 'MPa',
  }),
);

/**
 * Spellings whose meaning hangs on the case of an SI prefix (SI Brochure 9th ed. 2019, 3.1: prefix
 * symbols are case-sensitive; M mega, m milli). Only the exact SI symbols are read; any other case of
 * them is refused rather than guessed ('1 Ms' is a megasecond, '800 mPa' is 0.0008 MPa).
 */
const PREFIX_CASE = new Map<string, { exact: readonly string[]; say: string }>(
  Object.entries({
    mpa: { exact: ['MPa', 'mPa'], say: "'MPa' (megapascal) or 'mPa' (millipascal)" },
    ms: { exact: ['ms', 'Ms'], say: "'ms' (millisecond) or 'Ms' (megasecond)" },
  }),
);

/** Every unit spelling read besides mathjs's own names: the case-folded words (lower case) and the case-exact SI symbols. */
export const UNIT_SPELLINGS: readonly string[] = [...FOLDED.keys(), ...[...PREFIX_CASE.values()].flatMap((p) => p.exact)];

const BASE: Record<UnitQuantity, { unit: string; word: string; name: string; examples: string }> = {
  temperature: { unit: 'K', word: 'a temperature unit', name: 'a temperature', examples: "'80 degC', '176 degF' or '350 K'" },
  time: { unit: 's', word: 'a time unit', name: 'a time', examples: "'1000 h', '10 s', '2 weeks' or '5 years'" },
  stress: { unit: 'Pa', word: 'a stress unit', name: 'a stress or modulus', examples: "'2400 MPa', '2.4 GPa' or '300 ksi'" },
};

/** A decimal number: digits, an optional point and fraction, an optional exponent (no hex, binary, octal or separators). */
const DECIMAL = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const NUMBER_THEN_UNIT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*)$/;
/** Number text that JavaScript would read in another base, or with a decimal comma: refused with its own message. */
const OTHER_BASE = /^[-+]?0[xXbBoO][0-9a-fA-F_]*/;
const DECIMAL_COMMA = /^[-+]?\d+,\d/;

/** The engine unit a typed unit text stands for: exact SI symbols first, then the case-safe words. */
function canonicalUnit(unitText: string, text: string, argument: string): string {
  const lower = unitText.toLowerCase();
  const prefixed = PREFIX_CASE.get(lower);
  if (prefixed) {
    if (prefixed.exact.includes(unitText)) return unitText;
    throw new InputError(argument, `'${unitText}' in '${text}' is ambiguous: unit prefixes are case-sensitive; write ${prefixed.say}`);
  }
  return FOLDED.get(lower) ?? unitText;
}

/**
 * Reads text that is only a number. Returns null for text that is not a bare number (it may carry a
 * unit); throws for a number in another base, a decimal comma or a number beyond the double range.
 */
function bareNumber(text: string, argument: string): number | null {
  const t = text.trim();
  if (OTHER_BASE.test(t)) {
    throw new InputError(argument, `'${text}' is not a decimal number; only decimal numbers such as 80 or 1.5e3 are read`);
  }
  if (DECIMAL_COMMA.test(t)) {
    throw new InputError(
      argument,
      `'${text}': a comma in a number is ambiguous (decimal comma or thousands separator); write it with a decimal point and no separators, such as 1.5 or 1000`,
    );
  }
  const match = NUMBER_THEN_UNIT.exec(t);
  if (match?.[1] !== undefined) {
    const x = Number(match[1]);
    if (!Number.isFinite(x)) {
      const what = match[2] ? `${match[1]} in '${text}'` : `'${text}'`;
      throw new InputError(argument, `${what} is out of range for a number (beyond 1.8e308)`);
    }
  }
  return DECIMAL.test(t) ? Number(t) : null;
}

/** The quantity a unit measures, for a message when it is the wrong one. */
function quantityOf(unit: Unit): UnitQuantity | null {
  for (const q of Object.keys(BASE) as UnitQuantity[]) if (unit.equalBase(math.unit(`1 ${BASE[q].unit}`))) return q;
  return null;
}

function parseUnitText(text: string, argument: string, quantity: UnitQuantity): Unit {
  const spec = BASE[quantity];
  const trimmed = text.trim();
  const match = NUMBER_THEN_UNIT.exec(trimmed);
  if (!match || match[1] === undefined) {
    throw new InputError(argument, `expected a number or a number with ${spec.word} such as ${spec.examples}, got '${text}'`);
  }
  const numberText = match[1];
  const unitText = (match[2] ?? '').trim().replace(/\s+/g, ' ');
  const canonical = canonicalUnit(unitText, text, argument);
  let unit: Unit;
  try {
    unit = math.unit(`${numberText} ${canonical}`);
  } catch {
    throw new InputError(argument, `unknown unit '${unitText}' in '${text}'; use ${spec.examples}`);
  }
  if (!unit.equalBase(math.unit(`1 ${spec.unit}`))) {
    const is = quantityOf(unit);
    if (is !== null) throw new InputError(argument, `'${text}' is ${BASE[is].name}, but ${spec.name} is needed here; use ${spec.examples}`);
    throw new InputError(argument, `${quantity} needs ${spec.word}, got '${text}'`);
  }
  return unit;
}

/**
 * The unit (as the parsers read it) that a unit text such as a column header's stands for, checked to
 * measure `quantity`; throws InputError naming `argument` for an unknown, ambiguous or wrong unit.
 */
export function unitFor(unitText: string, quantity: UnitQuantity, argument: string): string {
  const unitOnly = unitText.trim().replace(/\s+/g, ' ');
  parseUnitText(`1 ${unitOnly}`, argument, quantity);
  return canonicalUnit(unitOnly, unitText, argument);
}

/** Reads number text (decimal only) to a number, or null when it is not a bare number; throws for hex, a comma or overflow. */
export function bareDecimal(text: string, argument: string): number | null {
  return bareNumber(text, argument);
}

function finiteOrThrow(value: number, argument: string, what: string): number {
  if (!Number.isFinite(value)) throw new InputError(argument, `${what} must be a finite number, got ${String(value)}`);
  return value;
}

/** Parses a temperature (bare number: degC) to kelvin; rejects values below MIN_TEMPERATURE_K and above MAX_TEMPERATURE_C. */
export function parseTemperatureK(input: number | string, argument = 'temperature'): number {
  let kelvin: number;
  if (typeof input === 'number') {
    kelvin = finiteOrThrow(input, argument, 'a temperature') + KELVIN_OFFSET;
  } else {
    if (input.trim() === '') throw new InputError(argument, 'a temperature is required, got empty text');
    const bare = bareNumber(input, argument);
    kelvin = bare !== null ? bare + KELVIN_OFFSET : parseUnitText(input, argument, 'temperature').toNumber('K');
  }
  finiteOrThrow(kelvin, argument, 'a temperature');
  if (kelvin <= 0) {
    throw new InputError(argument, `${formatInput(input)} is at or below absolute zero (-273.15 degC)`);
  }
  if (kelvin < MIN_TEMPERATURE_K) {
    throw new InputError(argument, `${formatInput(input)} is below ${MIN_TEMPERATURE_K} K, too close to absolute zero for the model`);
  }
  if (kelvin > MAX_TEMPERATURE_C + KELVIN_OFFSET) {
    throw new InputError(
      argument,
      `${formatInput(input)} is outside the accepted range (above ${MAX_TEMPERATURE_C} degC, where no polymer survives); check the unit`,
    );
  }
  return kelvin;
}

/** Parses a duration (bare number: hours) to seconds; it must be positive and finite. */
export function parseTimeS(input: number | string, argument = 'time'): number {
  let seconds: number;
  if (typeof input === 'number') {
    seconds = finiteOrThrow(input, argument, 'a time') * SECONDS_PER_HOUR;
  } else {
    if (input.trim() === '') throw new InputError(argument, 'a time is required, got empty text');
    const bare = bareNumber(input, argument);
    seconds = bare !== null ? bare * SECONDS_PER_HOUR : parseUnitText(input, argument, 'time').toNumber('s');
  }
  finiteOrThrow(seconds, argument, 'a time');
  if (seconds <= 0) throw new InputError(argument, `a time must be greater than zero, got ${formatInput(input)}`);
  return seconds;
}

/** Parses a modulus or stress (bare number: MPa) to MPa; it must be positive and finite. */
export function parseStressMPa(input: number | string, argument = 'modulus'): number {
  let mpa: number;
  if (typeof input === 'number') {
    mpa = finiteOrThrow(input, argument, 'a stress or modulus');
  } else {
    if (input.trim() === '') throw new InputError(argument, 'a value is required, got empty text');
    const bare = bareNumber(input, argument);
    mpa = bare !== null ? bare : parseUnitText(input, argument, 'stress').toNumber('MPa');
  }
  finiteOrThrow(mpa, argument, 'a stress or modulus');
  if (mpa <= 0) throw new InputError(argument, `must be greater than zero, got ${formatInput(input)}`);
  return mpa;
}

/** Parses a strain: a bare number is a fraction (0.005), text may be a percentage ('0.5 %'). */
export function parseStrain(input: number | string, argument = 'strain'): number {
  if (typeof input === 'number') return finiteOrThrow(input, argument, 'a strain');
  const text = input.trim();
  if (text === '') throw new InputError(argument, 'a strain is required, got empty text');
  const percent = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*%$/.exec(text);
  const value = percent?.[1] !== undefined ? Number(percent[1]) / 100 : (bareNumber(text, argument) ?? NaN);
  if (!Number.isFinite(value))
    throw new InputError(argument, `expected a fraction such as 0.005 or a percentage such as '0.5 %', got '${input}'`);
  return value;
}

/** Converts MPa to a named stress unit (Pa, kPa, MPa, GPa, psi, ksi). */
export function convertStressFromMPa(mpa: number, unitName: string, argument = 'unit'): number {
  const canonical = canonicalUnit(unitName.trim(), unitName, argument);
  let target: Unit;
  try {
    target = math.unit(`1 ${canonical}`);
  } catch {
    throw new InputError(argument, `unknown unit '${unitName}'; use MPa, GPa, kPa, Pa, psi or ksi`);
  }
  if (!target.equalBase(math.unit('1 Pa'))) {
    throw new InputError(argument, `needs a stress unit (MPa, GPa, kPa, Pa, psi, ksi), got '${unitName}'`);
  }
  return math.unit(mpa, 'MPa').toNumber(canonical);
}

/** Kelvin to degC. */
export function kelvinToC(kelvin: number): number {
  return kelvin - KELVIN_OFFSET;
}

/** degC to kelvin. */
export function cToKelvin(celsius: number): number {
  return celsius + KELVIN_OFFSET;
}

function formatInput(input: number | string): string {
  return typeof input === 'number' ? String(input) : `'${input}'`;
}
