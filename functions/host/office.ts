/**
 * The Office host: converts Excel's values to the neutral cell values of functions/core and back, and
 * registers every definition with CustomFunctions.associate when that global exists. This is the only
 * file that knows CustomFunctions.Error. Office's documented channel for a scalar error is to throw a
 * CustomFunctions.Error, and for errors inside a spilled result to return them in place; the adapter
 * does exactly that, so the wrappers themselves only ever return values.
 */
import { foreignError, isMatrix, SheetError, type ErrorCode } from '../core/cells.js';
import { definitions, type FunctionDef } from '../core/define.js';

/** The part of the custom-functions runtime used here (CustomFunctionsRuntime 1.2). */
export interface CustomFunctionsRuntime {
  associate(id: string, fn: (...args: unknown[]) => unknown): void;
  Error: new (code: string, message?: string) => object;
  ErrorCode: { invalidValue: string; notAvailable: string; invalidNumber: string };
}

function officeCode(rt: CustomFunctionsRuntime, code: ErrorCode): string {
  return code === '#N/A' ? rt.ErrorCode.notAvailable : code === '#NUM!' ? rt.ErrorCode.invalidNumber : rt.ErrorCode.invalidValue;
}

/** An Office error object for one of ours; only #VALUE! and #N/A can carry a message in Excel. */
export function toOfficeError(rt: CustomFunctionsRuntime, e: SheetError): object {
  return e.code === '#NUM!' ? new rt.Error(officeCode(rt, e.code)) : new rt.Error(officeCode(rt, e.code), e.message);
}

/** An Excel argument as a neutral value: error objects become SheetError, nested arrays are walked. */
export function fromOffice(rt: CustomFunctionsRuntime | undefined, x: unknown): unknown {
  if (isMatrix(x)) return x.map((row) => row.map((c) => fromOffice(rt, c)));
  if (x !== null && typeof x === 'object') {
    const o = x as { code?: unknown; message?: unknown };
    if ((rt && x instanceof rt.Error) || (typeof o.code === 'string' && o.code.startsWith('#'))) {
      return foreignError(String(o.code), typeof o.message === 'string' ? o.message : undefined);
    }
  }
  return x;
}

/** The Excel-facing function for a definition. */
export function officeFunction(rt: CustomFunctionsRuntime, def: FunctionDef): (...args: unknown[]) => unknown {
  return (...args: unknown[]) => {
    const out = def.invoke(...args.map((a) => fromOffice(rt, a)));
    if (out instanceof SheetError) throw toOfficeError(rt, out);
    if (Array.isArray(out)) return out.map((row) => row.map((c) => (c instanceof SheetError ? toOfficeError(rt, c) : c === null ? '' : c)));
    return out;
  };
}

/** Associates every loaded definition with its worksheet id; does nothing outside Office. */
export function registerWithOffice(
  rt: CustomFunctionsRuntime | undefined = (globalThis as { CustomFunctions?: CustomFunctionsRuntime }).CustomFunctions,
): number {
  if (!rt) return 0;
  const defs = definitions();
  for (const def of defs) rt.associate(def.id, officeFunction(rt, def));
  return defs.length;
}
