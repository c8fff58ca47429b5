/**
 * The HyperFormula host, for tests and development only (HyperFormula is a dev dependency under its
 * GPL-v3 licence key and is never bundled): registers every definition as DERATE.<id> in one function
 * plugin, converting HyperFormula's values to the neutral cell values of functions/core and back.
 */
import {
  ArraySize,
  CellError,
  EmptyValue,
  ErrorType,
  FunctionArgumentType,
  FunctionPlugin,
  HyperFormula,
  SimpleRangeValue,
  type ConfigParams,
  type ImplementedFunctions,
} from 'hyperformula';
import { foreignError, isMatrix, SheetError, type OutCell } from '../core/cells.js';
import { definitions, type ArgShape, type FunctionDef } from '../core/define.js';

const FROM_HF: Partial<Record<ErrorType, string>> = {
  [ErrorType.NA]: '#N/A',
  [ErrorType.NUM]: '#NUM!',
  [ErrorType.VALUE]: '#VALUE!',
  [ErrorType.DIV_BY_ZERO]: '#DIV/0!',
  [ErrorType.REF]: '#REF!',
  [ErrorType.NAME]: '#NAME?',
  [ErrorType.CYCLE]: '#CYCLE!',
  [ErrorType.SPILL]: '#SPILL!',
};

const TO_HF: Record<SheetError['code'], ErrorType> = { '#N/A': ErrorType.NA, '#NUM!': ErrorType.NUM, '#VALUE!': ErrorType.VALUE };

function fromScalar(x: unknown): unknown {
  if (x === EmptyValue) return null;
  if (x instanceof CellError) return foreignError(FROM_HF[x.type] ?? '#VALUE!', x.message);
  // Dates, currencies and percentages arrive as number objects with a `val`.
  if (x !== null && typeof x === 'object' && 'val' in x && typeof (x as { val: unknown }).val === 'number')
    return (x as { val: number }).val;
  return x;
}

/** A HyperFormula argument as a neutral value. */
export function fromHyperFormula(x: unknown): unknown {
  if (x instanceof SimpleRangeValue) return x.rawData().map((row) => row.map(fromScalar));
  if (isMatrix(x)) return x.map((row) => row.map(fromScalar));
  return fromScalar(x);
}

function toCellError(e: SheetError): CellError {
  return new CellError(TO_HF[e.code], e.message);
}

function toHyperFormula(out: unknown, expected: readonly [number, number] | undefined, fits: 'exact' | 'at-most' = 'exact'): unknown {
  if (out instanceof SheetError) return toCellError(out);
  if (!Array.isArray(out)) return out;
  let rows = out as OutCell[][];
  // A spill that failed as a whole comes back as its one error: the engine shows it in the anchor cell.
  if (rows.length === 1 && rows[0]?.length === 1 && rows[0][0] instanceof SheetError && (!expected || expected[0] * expected[1] > 1)) {
    return toCellError(rows[0][0]);
  }
  // A result smaller than its bound is padded with empty cells (HyperFormula fixes a spill's size before evaluating).
  if (fits === 'at-most' && expected && rows.length <= expected[0] && (rows[0]?.length ?? 0) <= expected[1]) {
    rows = Array.from({ length: expected[0] }, (_, r) => Array.from({ length: expected[1] }, (_, c) => rows[r]?.[c] ?? null));
  }
  if (expected && (expected[0] !== rows.length || expected[1] !== (rows[0]?.length ?? 0))) {
    return new CellError(
      ErrorType.VALUE,
      `internal error: predicted ${expected[0]} x ${expected[1]}, got ${rows.length} x ${rows[0]?.length ?? 0}`,
    );
  }
  return SimpleRangeValue.onlyValues(
    rows.map((r) => r.map((c) => (c === null ? EmptyValue : c instanceof SheetError ? toCellError(c) : c))),
  );
}

interface AstLike {
  type: string;
  value?: unknown;
}
interface ProcedureLike {
  args: AstLike[];
}

const METHOD_PREFIX = 'derate_';

/** Builds the plugin class for a set of definitions (default: every loaded one). */
export function derateHyperFormulaPlugin(defs: readonly FunctionDef[] = definitions()): typeof FunctionPlugin {
  class DeratePlugin extends FunctionPlugin {
    static override implementedFunctions: ImplementedFunctions = {};

    shapes(ast: ProcedureLike, state: unknown): ArgShape[] {
      return ast.args.map((arg) => {
        const size = this.arraySizeForAst(arg as never, state as never);
        const literal = arg.type === 'NUMBER' || arg.type === 'STRING' ? arg.value : undefined;
        return { rows: size.height, cols: size.width, literal };
      });
    }

    evaluate(def: FunctionDef, ast: ProcedureLike, state: unknown): unknown {
      const expected = def.result === 'matrix' ? def.spillSize(this.shapes(ast, state)) : undefined;
      return this.runFunction(
        ast.args as never,
        state as never,
        this.metadata(`DERATE.${def.id}`),
        (...args: unknown[]) =>
          toHyperFormula(def.invoke(...args.map(fromHyperFormula)), expected, def.result === 'matrix' ? def.spillFits : 'exact') as never,
      );
    }

    predict(def: FunctionDef, ast: ProcedureLike, state: unknown): ArraySize {
      if (def.result !== 'matrix') return ArraySize.scalar();
      const size = def.spillSize(this.shapes(ast, state));
      return size ? new ArraySize(size[1], size[0]) : ArraySize.error();
    }
  }

  const proto = DeratePlugin.prototype as unknown as Record<string, unknown>;
  for (const def of defs) {
    const method = `${METHOD_PREFIX}${def.id}`;
    DeratePlugin.implementedFunctions[`DERATE.${def.id}`] = {
      method,
      parameters: def.args.map((a) => ({
        argumentType: a.shape === 'matrix' ? FunctionArgumentType.ANY : FunctionArgumentType.NOERROR,
        ...(a.optional ? { optionalArg: true } : {}),
      })),
      ...(def.result === 'matrix' ? { sizeOfResultArrayMethod: `${method}_size`, vectorizationForbidden: true } : {}),
    };
    proto[method] = function (this: DeratePlugin, ast: ProcedureLike, state: unknown) {
      return this.evaluate(def, ast, state);
    };
    proto[`${method}_size`] = function (this: DeratePlugin, ast: ProcedureLike, state: unknown) {
      return this.predict(def, ast, state);
    };
  }
  return DeratePlugin;
}

/** Function names in every language HyperFormula loads by default (enGB): DERATE.<id> as is. */
function translations(defs: readonly FunctionDef[]): Record<string, Record<string, string>> {
  const names: Record<string, string> = {};
  for (const d of defs) names[`DERATE.${d.id}`] = `DERATE.${d.id}`;
  return { enGB: names };
}

let registered = false;

/** Registers the plugin once per process. */
export function registerDeratePlugin(): void {
  if (registered) return;
  const defs = definitions();
  HyperFormula.registerFunctionPlugin(derateHyperFormulaPlugin(defs) as never, translations(defs));
  registered = true;
}

/** A HyperFormula instance with DERATE.* registered, from sheets of raw cell contents; numbers come back unrounded. */
export function derateWorkbook(sheets: Record<string, unknown[][]>, config: Partial<ConfigParams> = {}): HyperFormula {
  registerDeratePlugin();
  return HyperFormula.buildFromSheets(sheets as never, { licenseKey: 'gpl-v3', smartRounding: false, ...config });
}
