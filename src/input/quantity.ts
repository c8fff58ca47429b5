/**
 * What every quantity of the input layer shares. A front-end hands over a raw value (a number in the
 * quantity's default unit, or text with a unit) and the name the user knows the input by (`temperature`
 * for a worksheet argument, `--temp` for a CLI option, the field label in the pane); the quantity parses
 * it to engine units, checks its range and, for anything wrong, throws InputError(name, problem). The
 * problem's words are the same for every front-end: only the name differs.
 */
import { InputError } from '../base/errors.js';

/** A value as a front-end hands it over: a number in the default unit, or text (a number with or without a unit). */
export type Raw = number | string;

/** One kind of input: how it is parsed, its unit, its range and what to type. */
export interface Quantity<T> {
  /** What to type, for messages and help texts, e.g. 'a temperature (a number in degC, or text such as "350 K")'. */
  readonly what: string;
  /** Unit of a bare number, or what the value is ('symbol', 'count', 'fraction'). */
  readonly unit: string;
  /** Range in `unit`, for help texts and metadata; `parse` is the check. */
  readonly min?: number;
  readonly max?: number;
  /** Parses one value to engine units; throws InputError(name, problem). */
  parse(raw: Raw, name: string): T;
}

/** True for what every front-end treats as "not given": null, undefined or blank text. */
export function isBlankInput(raw: unknown): boolean {
  return raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '');
}

/** The one message for a required input that was left empty. */
export function missingInput(q: Pick<Quantity<unknown>, 'what'>, name: string): InputError {
  return new InputError(name, `is missing; type ${q.what}`);
}

/** A required input: blank is an error naming it, anything else goes to the quantity. */
export function readRequired<T>(q: Quantity<T>, raw: Raw | null | undefined, name: string): T {
  if (raw === null || raw === undefined || isBlankInput(raw)) throw missingInput(q, name);
  return q.parse(raw, name);
}

/** An optional input: blank gives undefined, anything else goes to the quantity. */
export function readOptional<T>(q: Quantity<T>, raw: Raw | null | undefined, name: string): T | undefined {
  return raw === null || raw === undefined || isBlankInput(raw) ? undefined : q.parse(raw, name);
}

/**
 * Text without surrounding spaces (a number stays as it is): every quantity reads and quotes what was
 * typed this way, whether a front-end trimmed it first (the pane) or not (a worksheet cell, an option).
 */
export function trimmed(raw: Raw): Raw {
  return typeof raw === 'string' ? raw.trim() : raw;
}

/** A raw value as messages quote it: a number as it is, text (trimmed) in double quotes. */
export function showRaw(raw: Raw): string {
  return typeof raw === 'number' ? String(raw) : `"${raw.trim()}"`;
}

const DECIMAL = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/**
 * A number in plain decimal notation (what a person types: `12`, `-0.5`, `1e3`); undefined for anything
 * else, hexadecimal and friends included, so `0x10` is never 16. Infinity for a decimal that overflows.
 */
export function decimalNumber(text: string): number | undefined {
  const t = text.trim();
  return DECIMAL.test(t) ? Number(t) : undefined;
}

/**
 * Refuses text that is a decimal number too large for a double (`1e400`) before it reaches the unit
 * parser, which would otherwise read it as a number with a missing unit.
 */
export function refuseOverflow(raw: Raw, name: string, what: string): void {
  if (typeof raw !== 'string') return;
  const n = decimalNumber(raw);
  if (n !== undefined && !Number.isFinite(n)) throw new InputError(name, `${showRaw(raw)} is too large to be ${what}`);
}

/** Runs an engine call whose InputError names an engine word; the error names `name` instead. */
export function renamedInput<T>(name: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.argument !== name) throw new InputError(name, e.problem);
    throw e;
  }
}
