// The CLI and the benchmark, bundled for Node. HyperFormula (a dev dependency, for the benchmark's spreadsheet
// comparison) stays external: it is loaded from node_modules, never shipped, and its parser builds code at run time.
import { build } from 'esbuild';

export const nodeOptions = { bundle: true, platform: 'node', format: 'esm', target: 'node20', sourcemap: true, logLevel: 'warning' };

export default async function buildNode() {
  await build({ ...nodeOptions, entryPoints: ['cli/run.ts'], outfile: 'dist/cli.js' });
  await build({ ...nodeOptions, entryPoints: ['bench/bench.ts'], outfile: 'dist/bench.js', external: ['hyperformula'] });
}
