/**
 * Host-neutral cell values. The worksheet wrappers take and return only these; each host (Office,
 * HyperFormula, plain Node tests) converts its own values at its boundary (see functions/host/).
 */

/** The worksheet errors the wrappers return. #VALUE! and #N/A carry a message in every host that shows one. */
export type ErrorCode = '#VALUE!' | '#N/A' | '#NUM!';

/** A worksheet error as a value: wrappers return it, they never throw. */
export class SheetError {
  constructor(
    readonly code: ErrorCode,
    readonly message: string,
  ) {}

  toString(): string {
    return `${this.code} ${this.message}`;
  }
}

/** An empty cell, an omitted argument, or an empty slot in a spilled result. */
export type Empty = null;

/** One cell of a spilled result. */
export type OutCell = number | string | SheetError | Empty;

/** What a scalar worksheet function returns: every scalar DERATE function answers with a number. */
export type ScalarResult = number | SheetError;

/** What a spilling worksheet function returns: rows of cells, or one error for the whole call. */
export type MatrixResult = OutCell[][] | SheetError;

export function isSheetError(x: unknown): x is SheetError {
  return x instanceof SheetError;
}

/** True for the values a host uses for an empty cell or a left-out argument. */
export function isEmpty(x: unknown): boolean {
  return x === null || x === undefined || (typeof x === 'string' && x.trim() === '');
}

/** A 2-D array of rows (each row an array); a host passes ranges this way. */
export function isMatrix(x: unknown): x is unknown[][] {
  return Array.isArray(x) && x.every((row) => Array.isArray(row));
}

/**
 * An error value from a host (any code it has) as one of ours: #N/A and #NUM! stay what they are;
 * every other code (#DIV/0!, #REF!, #NAME?, ...) travels as #VALUE! with the original code in the message.
 */
export function foreignError(code: string, message?: string): SheetError {
  const text = message && message.trim() !== '' ? message : '';
  if (code === '#N/A' || code === '#NUM!' || code === '#VALUE!') return new SheetError(code, text);
  return new SheetError('#VALUE!', text === '' ? code : `${code} ${text}`);
}
