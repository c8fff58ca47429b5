/**
 * A stand-in for Office's CustomFunctions runtime, for unit tests: records what is associated, builds the
 * errors Excel would show, and calls a function the way Excel's runtime does (one value per declared
 * parameter, null for an omitted optional one, then an Invocation object; Microsoft Learn, "Custom
 * functions parameter options").
 *
 * What it cannot show, and where that is shown instead (test/realruntime/, Office's own runtime):
 * how the runtime turns an invocation entry into a call (it always appends the Invocation, even when a
 * test here forgets to), the flag bits (error and rich-data inputs are converted by the runtime only when
 * Excel sets them), how a returned value, a thrown or rejected CustomFunctions.Error, NaN or a plain
 * exception is sent back to Excel (codes, which messages survive), Promise results, and the fitting chunk
 * fetched by import(). The Error class here is a plain class, so `instanceof` checks pass for it alone.
 */
import type { CustomFunctionsRuntime } from '../../functions/host/office.js';

/** The shape of CustomFunctions.Error: a code and an optional message. */
export class FakeError {
  constructor(
    readonly code: string,
    readonly message?: string,
  ) {}
}

/**
 * Shaped like the runtime's InvocationContext: the name and the calling cell as getters on the prototype,
 * setResult and setError as own properties (undefined unless the function streams).
 */
export class FakeInvocation {
  readonly setResult = undefined;
  readonly setError = undefined;
  constructor(
    private readonly name: string,
    private readonly cell?: string,
  ) {}
  get functionName(): string {
    return this.name;
  }
  get address(): string | undefined {
    return this.cell;
  }
  get parameterAddresses(): undefined {
    return undefined;
  }
}

/**
 * The arguments of one call as Excel's runtime passes them: padded with null to `declared`, then the
 * Invocation. A left-out value is null, never undefined (the values arrive as JSON).
 */
export function excelArgs(id: string, args: readonly unknown[], declared = args.length): unknown[] {
  const values = args.map((a) => (a === undefined ? null : a));
  while (values.length < declared) values.push(null);
  return [...values, new FakeInvocation(id)];
}

/** A runtime whose associate() fills `table`, id -> function; `call` invokes one as Excel's runtime would. */
export function fakeRuntime(): CustomFunctionsRuntime & {
  table: Map<string, (...a: unknown[]) => unknown>;
  call(id: string, args: readonly unknown[], declared?: number): unknown;
} {
  const table = new Map<string, (...a: unknown[]) => unknown>();
  return {
    table,
    associate: (id, fn) => table.set(id, fn),
    call: (id, args, declared) => {
      const fn = table.get(id);
      if (!fn) throw new Error(`${id} is not associated`);
      return fn(...excelArgs(id, args, declared));
    },
    Error: FakeError,
    ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A', invalidNumber: '#NUM!' },
  };
}
