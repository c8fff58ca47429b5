/**
 * What every CLI command shares: its shape, the common options, and reading option values into
 * quantities. Values go through the engine's input layer (src/input/), the same code that reads the
 * worksheet's arguments and the pane's fields, so an option refuses what they refuse, with the same
 * words and the option's name.
 */
import { readFileSync } from 'node:fs';
import type { ParseArgsConfig } from 'node:util';
import {
  familyInput,
  InputError,
  materialFromRecord,
  readOptional,
  readRequired,
  UnknownFamilyInput,
  type MaterialInput,
  type Quantity,
} from '../src/index.js';

export interface Out {
  write(text: string): unknown;
}

export type Options = NonNullable<ParseArgsConfig['options']>;
export type Values = Record<string, string | boolean | undefined>;

export interface Command {
  readonly summary: string;
  readonly usage: string;
  readonly options: Options;
  run(v: Values, out: Out): void | Promise<void>;
}

export const material: Options = { family: { type: 'string' }, params: { type: 'string' } };
export const json: Options = { json: { type: 'boolean' } };

/** Where the CLI's list of bundled families is, added to an unknown-family message. */
export const FAMILIES_POINTER = '(resin-derate families lists the symbols)';

/** Runs an input-layer call; an unknown family's message says where the symbols are listed. */
export function withPointer<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof UnknownFamilyInput) throw new InputError(e.argument, `${e.problem} ${FAMILIES_POINTER}`);
    throw e;
  }
}

/** A required option read as a quantity of the input layer; missing or wrong, the error names --key. */
export function need<T>(v: Values, key: string, q: Quantity<T>): T {
  const x = v[key];
  return withPointer(() => readRequired(q, typeof x === 'string' ? x : undefined, `--${key}`));
}

/** An optional option read as a quantity; undefined when absent or empty. */
export function maybe<T>(v: Values, key: string, q: Quantity<T>): T | undefined {
  const x = v[key];
  return withPointer(() => readOptional(q, typeof x === 'string' ? x : undefined, `--${key}`));
}

/** A required option's text; InputError naming --key when it is missing or empty. */
export function str(v: Values, key: string): string {
  const x = v[key];
  if (typeof x !== 'string' || x.trim() === '') throw new InputError(`--${key}`, 'is required');
  return x;
}

/** An optional option's text, or undefined when absent or empty. */
export function opt(v: Values, key: string): string | undefined {
  const x = v[key];
  return typeof x === 'string' && x.trim() !== '' ? x : undefined;
}

/** Writes JSON with --json, else the text. */
export function emit(out: Out, v: Values, data: object, text: string): void {
  out.write(v['json'] ? JSON.stringify(data, null, 2) + '\n' : text);
}

export function readText(file: string, argument: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new InputError(argument, `cannot read '${file}': ${(e as Error).message}`);
  }
}

/**
 * --family ID or --params FILE.json (a parameter record or a Prony record, checked by the input layer,
 * errors naming --params); a family comes back as its canonical id.
 */
export function materialInputFrom(v: Values): MaterialInput {
  const family = opt(v, 'family');
  const file = opt(v, 'params');
  if (family && file) throw new InputError('--family', 'give --family or --params, not both');
  if (file) {
    let record: unknown;
    try {
      // A byte-order mark (as some editors save) is not part of the JSON text.
      record = JSON.parse(readText(file, '--params').replace(/^\uFEFF/, ''));
    } catch (e) {
      if (e instanceof InputError) throw e;
      throw new InputError('--params', `cannot read JSON from '${file}': ${(e as Error).message}`);
    }
    return materialFromRecord(record, '--params');
  }
  if (family) return withPointer(() => familyInput.parse(family, '--family').params.id);
  throw new InputError('--family', 'is missing; type a family symbol such as PC, or give --params FILE.json');
}
