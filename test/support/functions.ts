/** Loads every worksheet-function module from the one list the build uses, filling the registry. */
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { definitions, type FunctionDef } from '../../functions/core/define.js';
import { functionFiles } from '../../scripts/functions-files.mjs';

export interface LoadedModule {
  readonly file: string;
  readonly exports: Record<string, unknown>;
}

/** Imports every functions/*.ts module; returns the modules and the definitions they registered. */
export async function loadFunctions(): Promise<{ modules: LoadedModule[]; defs: readonly FunctionDef[] }> {
  const modules: LoadedModule[] = [];
  for (const file of functionFiles()) {
    modules.push({ file, exports: (await import(pathToFileURL(resolve(file)).href)) as Record<string, unknown> });
  }
  return { modules, defs: definitions() };
}
