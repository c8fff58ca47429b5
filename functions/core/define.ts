/**
 * Defines a worksheet function from its argument specs and one engine call. Every definition lands in
 * one registry, which the hosts (Office, HyperFormula, tests) read; the worksheet id is pinned here and
 * in the JSDoc tag of the exported function, and a test checks that the two agree.
 */
import type { ArgSpec } from './args/spec.js';
import { SheetError, type MatrixResult, type ScalarResult } from './cells.js';
import { safeMatrix, safeScalar } from './errors.js';

type Values<S extends readonly ArgSpec<unknown>[]> = { [K in keyof S]: S[K] extends ArgSpec<infer T> ? T : never };

/** What a host knows about an argument before evaluating it: its size, and its value if it is a literal. */
export interface ArgShape {
  readonly rows: number;
  readonly cols: number;
  readonly literal?: unknown;
}

interface Base {
  /** Worksheet id: `=DERATE.<id>`. */
  readonly id: string;
  readonly args: readonly ArgSpec<unknown>[];
}

export interface ScalarDef extends Base {
  readonly result: 'scalar';
  invoke(...raw: unknown[]): ScalarResult;
}

export interface MatrixDef extends Base {
  readonly result: 'matrix';
  /** Rows and columns of the spilled result from the argument shapes, or undefined when they cannot be known in advance. */
  readonly spillSize: (shapes: readonly ArgShape[]) => readonly [number, number] | undefined;
  /**
   * 'exact' (default): spillSize is the size of every result. 'at-most': it is an upper bound (the
   * size depends on the data, which a host like HyperFormula cannot see before evaluating); such a
   * host pads the result with empty cells. Excel takes the result as it is.
   */
  readonly spillFits: 'exact' | 'at-most';
  invoke(...raw: unknown[]): MatrixResult;
}

export type FunctionDef = ScalarDef | MatrixDef;

const REGISTRY = new Map<string, FunctionDef>();

function register<D extends FunctionDef>(def: D): D {
  if (REGISTRY.has(def.id)) throw new Error(`worksheet function ${def.id} is defined twice`);
  REGISTRY.set(def.id, def);
  return def;
}

/** Every defined worksheet function, in definition order. */
export function definitions(): readonly FunctionDef[] {
  return [...REGISTRY.values()];
}

/** The definition of one id, if it is loaded. */
export function definition(id: string): FunctionDef | undefined {
  return REGISTRY.get(id);
}

function parseAll<S extends readonly ArgSpec<unknown>[]>(id: string, specs: S, raw: readonly unknown[]): Values<S> {
  // Trailing left-out arguments arrive as undefined; anything beyond the list is a call error.
  if (raw.length > specs.length && raw.slice(specs.length).some((x) => x !== undefined && x !== null)) {
    throw new SheetError('#VALUE!', `DERATE.${id} takes at most ${specs.length} arguments, got ${raw.length}`);
  }
  return specs.map((s, i) => s.parse(raw[i])) as Values<S>;
}

/** A worksheet function returning one value. */
export function defineScalar<const S extends readonly ArgSpec<unknown>[]>(d: {
  id: string;
  args: S;
  run: (...values: Values<S>) => number | SheetError;
}): ScalarDef {
  return register({
    id: d.id,
    args: d.args,
    result: 'scalar',
    invoke: (...raw: unknown[]) => safeScalar(() => d.run(...parseAll(d.id, d.args, raw))),
  });
}

/** A worksheet function spilling a table. */
export function defineMatrix<const S extends readonly ArgSpec<unknown>[]>(d: {
  id: string;
  args: S;
  spillSize: (shapes: readonly ArgShape[]) => readonly [number, number] | undefined;
  spillFits?: 'exact' | 'at-most';
  run: (...values: Values<S>) => (number | string | SheetError | null)[][] | SheetError;
}): MatrixDef {
  return register({
    id: d.id,
    args: d.args,
    result: 'matrix',
    spillSize: d.spillSize,
    spillFits: d.spillFits ?? 'exact',
    invoke: (...raw: unknown[]) => safeMatrix(() => d.run(...parseAll(d.id, d.args, raw))),
  });
}

/** Number of cells in a one-row or one-column argument, from its shape. */
export function listLength(shape: ArgShape | undefined): number | undefined {
  if (!shape) return undefined;
  if (shape.rows > 1 && shape.cols > 1) return undefined;
  return shape.rows * shape.cols;
}
