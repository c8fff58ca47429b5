/**
 * Numbers written for people: the CLI's text output and the pane's displayed text use these, so a
 * quantity reads the same wherever it is shown. Cells keep numbers (with number formats) and the CLI's
 * JSON keeps raw numbers; this file is for text only.
 *
 * Style, chosen once: no thousands separator ("1912 MPa", not "1,912 MPa"), because the comma is the
 * decimal mark in much of Europe and because every text here parses back through the input layer
 * (parseTimeS, parseStressMPa); a point as decimal mark; the same unit words as the input layer accepts.
 */
import { SECONDS_PER_HOUR, SECONDS_PER_YEAR } from './units.js';

/** Below this modulus or stress (MPa) a value has relaxed to nothing a design can use; it prints as words. */
export const DISPLAY_FLOOR_MPA = 0.001;

/** Drops a negative sign from a value that rounded to zero ("-0" reads as a mistake). */
function unsigned0(text: string): string {
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** A number to `digits` significant figures (default 3), trailing zeros dropped; e-notation ("2.82e-8") outside 0.001 to 1e6. */
export function significant(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const rounded = Number(x.toPrecision(digits));
  const a = Math.abs(rounded);
  if (a >= 1e-3 && a < 1e6) return unsigned0(String(rounded));
  const [mantissa = '', exponent = '0'] = rounded.toExponential(digits - 1).split('e');
  return `${mantissa.replace(/\.?0+$/, '')}e${Number(exponent)}`;
}

/** A modulus or stress in MPa without its unit: whole MPa from 100 up, three significant figures below, "below 0.001" in magnitude under 0.001 MPa. */
export function mpaValue(mpa: number): string {
  if (!Number.isFinite(mpa)) return String(mpa);
  const a = Math.abs(mpa);
  if (a < DISPLAY_FLOOR_MPA) return `below ${DISPLAY_FLOOR_MPA}`;
  // Whole MPa from 100 up, as the workbook's modulus number format shows them (1912, not 1910).
  if (a >= 100 && a < 1e15) return unsigned0(String(Math.round(mpa)));
  return significant(mpa, 3);
}

/** A modulus in MPa with its unit: "1912 MPa", "9.62 MPa", "below 0.001 MPa". */
export function modulusText(mpa: number): string {
  return `${mpaValue(mpa)} MPa`;
}

/** A stress in MPa with its unit (sign kept, compression negative): same rules as modulusText. */
export function stressText(mpa: number): string {
  return `${mpaValue(mpa)} MPa`;
}

/** A modulus band from low to high, MPa: "1800 to 2053 MPa", "below 0.001 to 0.32 MPa", or "below 0.001 MPa" when both are. */
export function modulusRangeText(lowMPa: number, highMPa: number): string {
  const lo = mpaValue(lowMPa);
  const hi = mpaValue(highMPa);
  return lo === hi ? `${lo} MPa` : `${lo} to ${hi} MPa`;
}

/** A temperature in degC without its unit, to 0.1 degC with a trailing ".0" dropped: "113.7", "70", "-15.6". */
export function temperatureValue(celsius: number): string {
  if (!Number.isFinite(celsius)) return String(celsius);
  return unsigned0(String(Math.round(celsius * 10) / 10));
}

/** A temperature in degC with its unit: "113.7 degC". */
export function temperatureText(celsius: number): string {
  return `${temperatureValue(celsius)} degC`;
}

/** Time units by size, smallest first: each is used while the value in it, rounded, stays below `below`; `s` is seconds per unit. */
const TIME_UNITS: readonly { readonly s: number; readonly one: string; readonly many: string; readonly below: number }[] = [
  { s: 1e-3, one: 'ms', many: 'ms', below: 1000 },
  { s: 1, one: 's', many: 's', below: 100 },
  { s: 60, one: 'min', many: 'min', below: 100 },
  { s: SECONDS_PER_HOUR, one: 'h', many: 'h', below: 100 },
  // Days while they round below 365, then years: the Julian year (365.25 d) the unit layer parses "year" as.
  { s: 86400, one: 'day', many: 'days', below: 365 },
  { s: SECONDS_PER_YEAR, one: 'year', many: 'years', below: Infinity },
];

/** A duration in seconds as text, three significant figures in the unit that fits its size: "6.3 s", "45 min", "2.41 h", "41.7 days", "36.7 years". */
export function durationText(seconds: number): string {
  if (!Number.isFinite(seconds)) return `${String(seconds)} s`;
  for (const u of TIME_UNITS) {
    const inUnit = seconds / u.s;
    // Compared after rounding, so 99.96 s moves on to 1.67 min instead of printing as "100 s".
    if (Math.abs(Number(inUnit.toPrecision(3))) < u.below) {
      const text = significant(inUnit, 3);
      return `${text} ${text === '1' ? u.one : u.many}`;
    }
  }
  return `${significant(seconds, 3)} s`;
}

/** A ratio (dimensionless) to two decimals: "0.88"; "below 0.01" for a positive ratio that would print as 0.00. */
export function ratioText(ratio: number): string {
  if (!Number.isFinite(ratio)) return String(ratio);
  // Zero included: a ratio of exactly 0 is a modulus that underflowed, not one that is truly nothing.
  if (ratio >= 0 && ratio < 0.005) return 'below 0.01';
  return unsigned0(ratio.toFixed(2));
}

/** A value in a named display unit without the unit: 'MPa' as mpaValue, 'degC' as temperatureValue, anything else to 4 significant figures. */
export function valueIn(x: number, unit: string): string {
  if (unit === 'MPa') return mpaValue(x);
  if (unit === 'degC') return temperatureValue(x);
  return significant(x, 4);
}
