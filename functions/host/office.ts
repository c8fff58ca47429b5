/**
 * The Office host: converts Excel's values to the neutral cell values of functions/core and back, and
 * registers every definition with CustomFunctions.associate when that global exists. This is the only
 * file that knows CustomFunctions.Error. Office's documented channel for a scalar error is to throw a
 * CustomFunctions.Error, and for errors inside a spilled result to return them in place; the adapter
 * does exactly that, so the wrappers themselves only ever return values.
 */
import { foreignError, isMatrix, SheetError, type ErrorCode } from '../core/cells.js';
import { definition, definitions, type FunctionDef } from '../core/define.js';

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

/** The part of the runtime's Invocation object read here (CustomFunctions.Invocation). */
export interface OfficeInvocation {
  readonly functionName?: string;
  /** The calling cell, e.g. `Sheet1!B7`; set only for functions whose metadata asks for it. */
  readonly address?: string;
}

/** True for the Invocation object the runtime appends; never for a cell value (a number, text, boolean, range or error). */
export function isInvocation(x: unknown): x is OfficeInvocation {
  if (x === null || typeof x !== 'object' || Array.isArray(x)) return false;
  if (typeof (x as { code?: unknown }).code === 'string') return false;
  return 'functionName' in x || 'address' in x || 'parameterAddresses' in x || 'setResult' in x || 'onCanceled' in x;
}

/**
 * The worksheet arguments of one call, without the Invocation object. Excel's runtime passes one value per
 * declared parameter (null for an omitted optional one) and then always an Invocation ("Every custom
 * function is automatically passed an invocation argument as the last input parameter", Microsoft Learn,
 * "Custom functions parameter options", Invocation parameter). Anything after the declared parameters that
 * is not that object stays in the list, so the definition refuses it as an extra argument.
 */
export function withoutInvocation(args: readonly unknown[], declared: number): unknown[] {
  const last = args.length - 1;
  if (last >= declared && isInvocation(args[last])) return args.slice(0, last);
  return [...args];
}

/** The Excel-facing function for a definition. */
export function officeFunction(rt: CustomFunctionsRuntime, def: FunctionDef): (...args: unknown[]) => unknown {
  return (...args: unknown[]) => {
    const out = def.invoke(...withoutInvocation(args, def.args.length).map((a) => fromOffice(rt, a)));
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

/**
 * Runs one loaded definition for Excel: the export of the part of the add-in loaded on first call
 * (that part is its own bundle with its own registry; see scripts/build/20-functions.mjs).
 */
export function officeCall(rt: CustomFunctionsRuntime, id: string, args: readonly unknown[]): unknown {
  const def = definition(id);
  if (!def)
    throw toOfficeError(
      rt,
      new SheetError('#VALUE!', `internal error in Resin Derate (please report): DERATE.${id} is not in the part loaded for it`),
    );
  return officeFunction(rt, def)(...args);
}

/** What the part loaded on first call exports. */
export interface LoadedPart {
  officeCall(rt: CustomFunctionsRuntime, id: string, args: readonly unknown[]): unknown;
}

/**
 * Associates the ids whose functions live in the part of the add-in loaded on first call (the fitting
 * functions, too big for the start-up script): each answers with a Promise, which the custom-functions
 * runtime accepts. The first call loads the part (once; again after a failed load); later calls run at
 * once. Does nothing outside Office.
 */
export function registerLazyWithOffice(
  ids: readonly string[],
  load: () => Promise<LoadedPart>,
  rt: CustomFunctionsRuntime | undefined = (globalThis as { CustomFunctions?: CustomFunctionsRuntime }).CustomFunctions,
): number {
  if (!rt) return 0;
  let loading: Promise<LoadedPart> | undefined;
  const ready = (): Promise<LoadedPart> =>
    (loading ??= load().catch((e: unknown) => {
      loading = undefined;
      throw e;
    }));
  for (const id of ids) {
    rt.associate(id, async (...args: unknown[]) => {
      let part: LoadedPart;
      try {
        part = await ready();
      } catch (e) {
        const why = e instanceof Error ? e.message : String(e);
        throw toOfficeError(
          rt,
          new SheetError('#VALUE!', `DERATE.${id} could not load its part of the add-in (${why}); reload the add-in`),
        );
      }
      return part.officeCall(rt, id, args);
    });
  }
  return ids.length;
}
