// Builds every bundle with esbuild: the CLI and the benchmark (Node). Other entries join this list.
import { build } from 'esbuild';
import { mkdirSync } from 'node:fs';

mkdirSync('dist', { recursive: true });
const node = { bundle: true, platform: 'node', format: 'esm', target: 'node20', sourcemap: true, logLevel: 'warning' };
await build({ ...node, entryPoints: ['src/cli/main.ts'], outfile: 'dist/cli.js' });
await build({ ...node, entryPoints: ['bench/bench.ts'], outfile: 'dist/bench.js' });
