/**
 * The worksheet's argument specs: each argument is a small declarative record (kind, unit of a bare
 * number, bounds, default, optional) whose `parse` takes a cell (or a range) to an engine value. The
 * quantities themselves (parsing, unit, range, words) live in the engine's input layer (src/input/); a
 * spec only unwraps the cell, supplies the argument's name, and turns the layer's InputError into an
 * ArgumentProblem carrying the worksheet error code. One file per quantity beside this one.
 */
import { InputError, UnknownFamilyInput, type Quantity } from '../../../src/index.js';
import { isEmpty, isMatrix, SheetError } from '../cells.js';
import { ArgumentProblem } from '../errors.js';

export type ArgKind =
  | 'material'
  | 'materials'
  | 'family'
  | 'temperature'
  | 'temperatures'
  | 'time'
  | 'durations'
  | 'modulus'
  | 'stress'
  | 'strain'
  | 'count'
  | 'cycles'
  | 'curves'
  | 'sweep'
  | 'frequency'
  | 'fields';

/** One worksheet argument. `unit` is the unit of a bare number (or what the argument holds). */
export interface ArgSpec<T> {
  readonly name: string;
  readonly kind: ArgKind;
  readonly unit: string;
  /** 'matrix' arguments accept a range (and a single value); 'scalar' ones one value (or a 1 x 1 range). */
  readonly shape: 'scalar' | 'matrix';
  readonly optional: boolean;
  /** Used for an empty or left-out optional argument; written as the user would type it. */
  readonly default?: number | string;
  /** Bounds in `unit`, inclusive, for the help text and the check. */
  readonly min?: number;
  readonly max?: number;
  parse(raw: unknown): T;
}

/** Options every scalar spec takes. */
export interface Common {
  optional?: boolean;
  default?: number | string;
}

/** Where the worksheet's list of bundled families is, added to an unknown-family message. */
export const FAMILIES_POINTER = '(DERATE.FAMILIES() lists the symbols)';

export function problem(argument: string, text: string): ArgumentProblem {
  return new ArgumentProblem('#VALUE!', argument, text);
}

/** An error value arriving as input keeps its code and says which argument it came through. */
export function carried(argument: string, e: SheetError, where = ''): ArgumentProblem {
  return new ArgumentProblem(e.code, argument, `${where}received the error ${e.code}${e.message ? ` (${e.message})` : ''}`);
}

/** Runs an input-layer call; its InputError becomes the worksheet's ArgumentProblem (#N/A for an unknown family). */
export function fromInput<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof UnknownFamilyInput) throw new ArgumentProblem('#N/A', e.argument, `${e.problem} ${FAMILIES_POINTER}`);
    if (e instanceof InputError) throw problem(e.argument, e.problem);
    throw e;
  }
}

function shapeText(m: unknown[][]): string {
  return `${m.length} x ${(m[0] ?? []).length}`;
}

/** One value from a scalar argument: unwraps a 1 x 1 range, rejects booleans, errors and bigger ranges. */
export function scalarOf(raw: unknown, name: string, what: string): number | string | null {
  let v = raw;
  if (isMatrix(v)) {
    if (v.length === 1 && v[0]?.length === 1) v = v[0][0];
    else throw problem(name, `expects one ${what}, got a range of ${shapeText(v)} cells`);
  }
  if (v instanceof SheetError) throw carried(name, v);
  if (isEmpty(v)) return null;
  if (typeof v === 'boolean') throw problem(name, `expects ${what}, got ${v ? 'TRUE' : 'FALSE'}`);
  if (typeof v === 'number' || typeof v === 'string') return v;
  throw problem(name, `expects ${what}, got an unsupported value`);
}

/** A scalar spec from a parser of one value; empty gives the default, or undefined, or "is missing". */
export function spec<T>(s: Omit<ArgSpec<T>, 'parse' | 'optional'> & Common, parseOne: (v: number | string) => T, what: string): ArgSpec<T> {
  const optional = s.optional ?? false;
  const parse = (raw: unknown): T => {
    const v = scalarOf(raw, s.name, what);
    if (v === null) {
      if (!optional) throw problem(s.name, `is missing; type ${what}`);
      if (s.default === undefined) return undefined as T;
      return parseOne(s.default);
    }
    return parseOne(v);
  };
  return { ...s, optional, parse };
}

/** A scalar argument of one of the input layer's quantities. */
export function quantityArg<T>(q: Quantity<T>, name: string, kind: ArgKind, o: Common = {}): ArgSpec<T> {
  return spec(
    { name, kind, unit: q.unit, shape: 'scalar', min: q.min, max: q.max, ...o },
    (v) => fromInput(() => q.parse(v, name)),
    q.what,
  );
}
