// Runs every build step in scripts/build/*.mjs (each exports `default async function`), in name order.
// A step that finds a problem (metadata errors, a bundle over budget) throws, and the build fails.
import { mkdirSync, readdirSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

mkdirSync('dist', { recursive: true });
const dir = new URL('./build/', import.meta.url);
for (const file of readdirSync(dir)
  .filter((f) => f.endsWith('.mjs'))
  .sort()) {
  const step = await import(pathToFileURL(new URL(file, dir).pathname).href);
  await step.default();
}
