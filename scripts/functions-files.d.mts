/** Every functions/*.ts module, as paths relative to the repo root, sorted. */
export function functionFiles(root?: string): string[];
/** The first line that marks a module as loaded on the first call of one of its functions. */
export const ON_FIRST_CALL: string;
/** True when the module's first line is ON_FIRST_CALL. */
export function loadsOnFirstCall(file: string, root?: string): boolean;
