/** Every functions/*.ts module, as paths relative to the repo root, sorted. */
export function functionFiles(root?: string): string[];
