// The one list of worksheet-function modules: every functions/*.ts file (helpers live in subfolders).
// The build feeds it to the metadata generator and to the bundle entry; the tests import the same list.
// A module whose first line is `// @load on-first-call` is left out of the start-up script in Excel and
// loaded by the first call of one of its functions (the marker lives in the module, nowhere else).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

export const ON_FIRST_CALL = '// @load on-first-call';

export function functionFiles(root = process.cwd()) {
  return readdirSync(join(root, 'functions'))
    .filter((f) => f.endsWith('.ts'))
    .sort()
    .map((f) => `functions/${f}`);
}

/** True when the module is loaded on the first call of one of its functions rather than at start-up. */
export function loadsOnFirstCall(file, root = process.cwd()) {
  return readFileSync(join(root, file), 'utf8').split(/\r?\n/, 1)[0]?.trim() === ON_FIRST_CALL;
}
