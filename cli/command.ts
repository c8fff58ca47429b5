/**
 * What every CLI command shares: its shape, the common options, and reading option values into
 * quantities. Values go through the engine's input layer (src/input/), the same code that reads the
 * worksheet's arguments and the pane's fields, so an option refuses what they refuse, with the same
 * words and the option's name.
 */
import {
  familyInput,
  InputError,
  isPronyRecord,
  ParameterError,
  paramsFromRecord,
  pronyFromRecord,
  readOptional,
  readRequired,
  UnknownFamilyInput,
  type MaterialInput,
  type Quantity,
} from '../src/index.js';
import type { Options, Values } from './args.js';
import { readJsonFile, readTextFile } from './files.js';

export type { Options, Values } from './args.js';

export interface Out {
  write(text: string): unknown;
}

/** The option an engine argument name came from: fixed, or chosen from what was given (calibrate's inputs). */
export type OptionName = string | ((v: Values) => string);

export interface Command {
  readonly summary: string;
  readonly usage: string;
  readonly options: Options;
  /**
   * Engine argument names (InputError.argument) this command's errors may carry, and the option each
   * came from, beyond the defaults every command shares (main.ts ENGINE_NAMES).
   */
  readonly names?: Readonly<Record<string, OptionName>>;
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

/** A file's text for an option (--data); InputError naming the option when it cannot be read. */
export function readText(file: string, argument: string): string {
  return readTextFile(file, argument);
}

/** The message of an error met while reading or compiling the --params record, naming --params and the file. */
export function paramsFileError(file: string, e: InputError | ParameterError): InputError {
  return new InputError('--params', `in '${file}', ${e.message}`);
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
    const record = readJsonFile(file, '--params');
    if (typeof record !== 'object' || record === null || Array.isArray(record)) {
      throw new InputError('--params', `'${file}' must hold one JSON object of parameters`);
    }
    const r = record as Record<string, unknown>;
    // A calibration or fit output file carries the record under "params" / "material".
    const key = Object.hasOwn(r, 'params') ? 'params' : Object.hasOwn(r, 'material') ? 'material' : null;
    const inner = key === null ? r : r[key];
    if (typeof inner !== 'object' || inner === null || Array.isArray(inner)) {
      throw new InputError('--params', `in '${file}', "${key}" must be a JSON object of parameters`);
    }
    try {
      return isPronyRecord(inner as Record<string, unknown>)
        ? pronyFromRecord(inner as Record<string, unknown>)
        : paramsFromRecord(inner as Record<string, unknown>);
    } catch (e) {
      if (e instanceof InputError || e instanceof ParameterError) throw paramsFileError(file, e);
      throw e;
    }
  }
  if (family) return withPointer(() => familyInput.parse(family, '--family').params.id);
  throw new InputError('--family', 'is missing; type a family symbol such as PC, or give --params FILE.json');
}
