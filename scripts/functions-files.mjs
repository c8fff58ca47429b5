// The one list of worksheet-function modules: every functions/*.ts file (helpers live in subfolders).
// The build feeds it to the metadata generator and to the bundle entry; the tests import the same list.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';

export function functionFiles(root = process.cwd()) {
  return readdirSync(join(root, 'functions'))
    .filter((f) => f.endsWith('.ts'))
    .sort()
    .map((f) => `functions/${f}`);
}
