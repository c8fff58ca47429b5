/** A stand-in for Office's CustomFunctions runtime: records what is associated and builds errors Excel would show. */
import type { CustomFunctionsRuntime } from '../../functions/host/office.js';

/** The shape of CustomFunctions.Error: a code and an optional message. */
export class FakeError {
  constructor(
    readonly code: string,
    readonly message?: string,
  ) {}
}

/** A runtime whose associate() fills `table`, id -> function. */
export function fakeRuntime(): CustomFunctionsRuntime & { table: Map<string, (...a: unknown[]) => unknown> } {
  const table = new Map<string, (...a: unknown[]) => unknown>();
  return {
    table,
    associate: (id, fn) => table.set(id, fn),
    Error: FakeError,
    ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A', invalidNumber: '#NUM!' },
  };
}
