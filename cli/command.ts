/** What every CLI command shares: its shape, the common options and reading a material from them. */
import { readFileSync } from 'node:fs';
import type { ParseArgsConfig } from 'node:util';
import { InputError, isPronyRecord, paramsFromRecord, pronyFromRecord, type MaterialInput } from '../src/index.js';

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

/** --family ID or --params FILE.json (a parameter record or a Prony record). */
export function materialInputFrom(v: Values): MaterialInput {
  const family = opt(v, 'family');
  const file = opt(v, 'params');
  if (family && file) throw new InputError('--family', 'give --family or --params, not both');
  if (file) {
    let record: unknown;
    try {
      record = JSON.parse(readText(file, '--params'));
    } catch (e) {
      if (e instanceof InputError) throw e;
      throw new InputError('--params', `cannot read JSON from '${file}': ${(e as Error).message}`);
    }
    if (typeof record !== 'object' || record === null || Array.isArray(record)) {
      throw new InputError('--params', `'${file}' must hold one JSON object of parameters`);
    }
    const r = record as Record<string, unknown>;
    // A calibration or fit output file carries the record under "params" / "material".
    const inner = (r['params'] ?? r['material'] ?? r) as Record<string, unknown>;
    return isPronyRecord(inner) ? pronyFromRecord(inner) : paramsFromRecord(inner);
  }
  if (family) return family;
  throw new InputError('--family', 'is required (a family id such as PC, or --params FILE.json)');
}
