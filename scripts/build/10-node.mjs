// The CLI and the benchmark, bundled for Node.
import { build } from 'esbuild';

export const nodeOptions = { bundle: true, platform: 'node', format: 'esm', target: 'node20', sourcemap: true, logLevel: 'warning' };

export default async function buildNode() {
  await build({ ...nodeOptions, entryPoints: ['cli/run.ts'], outfile: 'dist/cli.js' });
  await build({ ...nodeOptions, entryPoints: ['bench/bench.ts'], outfile: 'dist/bench.js' });
}
