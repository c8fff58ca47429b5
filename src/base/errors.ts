/** Typed errors thrown by the engine; the worksheet and CLI layers turn them into their own messages. */

/** Bad value for a named input (a function argument or a CLI option). */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    readonly argument: string,
    readonly problem: string,
  ) {
    super(`${argument}: ${problem}`);
  }
}

/** A material parameter outside its allowed range or inconsistent with another. */
export class ParameterError extends Error {
  override readonly name = 'ParameterError';
  constructor(
    readonly field: string,
    readonly problem: string,
    readonly value?: unknown,
  ) {
    super(`parameter ${field}: ${problem}`);
  }
}

/** A family id that is not in the bundled table; carries the closest ids. */
export class UnknownFamilyError extends Error {
  override readonly name = 'UnknownFamilyError';
  constructor(
    readonly id: string,
    readonly suggestions: readonly string[],
  ) {
    super(`unknown family '${id}'` + (suggestions.length > 0 ? `; did you mean ${suggestions.map((s) => `'${s}'`).join(', ')}?` : ''));
  }
}

/** A root finder or fit that did not converge. */
export class SolverError extends Error {
  override readonly name = 'SolverError';
  constructor(
    readonly reason: string,
    readonly iterations: number,
    readonly residual: number,
  ) {
    super(`solver did not converge: ${reason} (after ${iterations} iterations, residual ${residual})`);
  }
}
