// The worksheet functions for Excel: metadata generated from the JSDoc tags (dist/functions.json) and
// the browser bundle that associates every function (dist/functions.js). Fails on any metadata error,
// on a function or argument without a description, and over the size budget.
import { build } from 'esbuild';
import { generateCustomFunctionsMetadata } from 'custom-functions-metadata';
import { writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { functionFiles } from '../functions-files.mjs';

/** Size budget of the functions script (decimal kilobytes). */
export const BUDGET = { minifiedKB: 300, gzipKB: 90 };

export async function functionsMetadata(files = functionFiles()) {
  const result = await generateCustomFunctionsMetadata(files);
  const problems = [...result.errors];
  if (!result.metadataJson) problems.push('no custom functions found in ' + files.join(', '));
  const metadata = result.metadataJson ? JSON.parse(result.metadataJson) : { functions: [] };
  for (const f of metadata.functions) {
    if (!f.description) problems.push(`${f.id}: no description`);
    for (const p of f.parameters) if (!p.description) problems.push(`${f.id}(${p.name}): no description`);
  }
  if (problems.length > 0) throw new Error(`functions metadata:\n  ${problems.join('\n  ')}`);
  return { metadata, associate: result.associate };
}

function entrySource(files) {
  return [
    ...files.map((f) => `import './${f}';`),
    "import { registerWithOffice } from './functions/host/office.ts';",
    'registerWithOffice();',
  ].join('\n');
}

const kB = (n) => (n / 1000).toFixed(1);

export default async function buildFunctions() {
  const files = functionFiles();
  const { metadata } = await functionsMetadata(files);
  writeFileSync('dist/functions.json', JSON.stringify(metadata, null, 2) + '\n');

  const common = {
    stdin: { contents: entrySource(files), resolveDir: process.cwd(), sourcefile: 'functions-entry.ts', loader: 'ts' },
    bundle: true,
    platform: 'browser',
    format: 'iife',
    target: 'es2020',
    logLevel: 'warning',
    legalComments: 'none',
  };
  const raw = await build({ ...common, write: false, outfile: 'dist/functions.js' });
  const min = await build({ ...common, minify: true, sourcemap: true, outfile: 'dist/functions.js', metafile: true });
  const rawBytes = raw.outputFiles[0].contents.length;
  const minFile = min.metafile.outputs['dist/functions.js'];
  const { readFileSync } = await import('node:fs');
  const minBytes = readFileSync('dist/functions.js');
  const gzBytes = gzipSync(minBytes, { level: 9 }).length;
  console.log(
    `functions: ${metadata.functions.length} worksheet functions; dist/functions.js raw ${kB(rawBytes)} kB, minified ${kB(minBytes.length)} kB, gzip ${kB(gzBytes)} kB (budget ${BUDGET.minifiedKB} / ${BUDGET.gzipKB} kB)`,
  );
  if (minFile === undefined) throw new Error('functions bundle: esbuild wrote no dist/functions.js');
  if (minBytes.length > BUDGET.minifiedKB * 1000)
    throw new Error(`functions bundle: ${kB(minBytes.length)} kB minified is over the ${BUDGET.minifiedKB} kB budget`);
  if (gzBytes > BUDGET.gzipKB * 1000) throw new Error(`functions bundle: ${kB(gzBytes)} kB gzip is over the ${BUDGET.gzipKB} kB budget`);
}
