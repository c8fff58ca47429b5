/**
 * The one error mapper and the one result guard of the worksheet layer. Engine failures are typed
 * (src/base/errors.ts); here they become worksheet errors: #VALUE! (bad input, with a message naming the
 * argument), #N/A (not found / not reached, with a message), #NUM! (no convergence, overflow).
 */
import { InputError, ParameterError, SolverError, UnknownFamilyError } from '../../src/index.js';
import { SheetError, type ErrorCode, type MatrixResult, type OutCell, type ScalarResult } from './cells.js';

/** A problem with one argument, raised while parsing it; carries the worksheet error code to use. */
export class ArgumentProblem extends Error {
  override readonly name = 'ArgumentProblem';
  constructor(
    readonly code: ErrorCode,
    readonly argument: string,
    readonly problem: string,
  ) {
    super(`${argument}: ${problem}`);
  }
}

/** Turns anything thrown below a wrapper into a worksheet error with a message. */
export function toSheetError(e: unknown): SheetError {
  if (e instanceof SheetError) return e;
  if (e instanceof ArgumentProblem) return new SheetError(e.code, e.message);
  if (e instanceof InputError) return new SheetError('#VALUE!', `${e.argument}: ${e.problem}`);
  if (e instanceof ParameterError) return new SheetError('#VALUE!', e.message);
  if (e instanceof UnknownFamilyError) return new SheetError('#N/A', `${e.message} (DERATE.FAMILIES() lists the symbols)`);
  if (e instanceof SolverError) return new SheetError('#NUM!', `the solver did not converge (${e.reason}, ${e.iterations} iterations)`);
  if (e instanceof RangeError) return new SheetError('#NUM!', `numeric overflow: ${e.message}`);
  // Anything else is a bug in this add-in; say so rather than guess a cause.
  const text = e instanceof Error ? e.message : String(e);
  return new SheetError('#VALUE!', `internal error in Resin Derate (please report): ${text}`);
}

const NOT_FINITE = 'the result is not a finite number (numeric overflow)';

/** The central guard: no NaN or Infinity reaches a cell; undefined becomes an empty cell. */
export function guardScalar(x: unknown): ScalarResult {
  if (x instanceof SheetError) return x;
  if (typeof x === 'number') return Number.isFinite(x) ? x : new SheetError('#NUM!', NOT_FINITE);
  return new SheetError('#VALUE!', `internal error in Resin Derate (please report): unexpected result ${String(x)}`);
}

/** The central guard for spilled results; every row must have the same length. */
export function guardMatrix(x: unknown): MatrixResult {
  if (x instanceof SheetError) return x;
  if (!Array.isArray(x) || x.length === 0 || !x.every((r) => Array.isArray(r))) {
    return new SheetError('#VALUE!', 'internal error in Resin Derate (please report): a spilled result is not a table');
  }
  const width = (x[0] as unknown[]).length;
  if (width === 0 || x.some((r: unknown[]) => r.length !== width)) {
    return new SheetError('#VALUE!', 'internal error in Resin Derate (please report): a spilled result has ragged rows');
  }
  return x.map((row: unknown[]) => row.map(guardCell));
}

function guardCell(x: unknown): OutCell {
  if (x === null || x === undefined) return null;
  if (typeof x === 'string') return x;
  return guardScalar(x);
}

/** Runs a wrapper body; whatever it throws or returns comes back as a safe scalar cell value. */
export function safeScalar(body: () => unknown): ScalarResult {
  try {
    return guardScalar(body());
  } catch (e) {
    return toSheetError(e);
  }
}

/** Runs a spilling wrapper body; whatever it throws or returns comes back as a safe table or one error. */
export function safeMatrix(body: () => unknown): MatrixResult {
  try {
    return guardMatrix(body());
  } catch (e) {
    return toSheetError(e);
  }
}
