// The task pane: addin/boot.ts (the head script that loads Office.js inside Excel only) and addin/taskpane.ts bundled for the browser (ES modules; chart.js split into its own
// chunk, fetched only by the in-page preview sheet, and the calibration job with the engine's least-squares code into another, fetched on the first
// calibration: both are dynamic import() calls, so splitting is all this step needs), the page copied to dist/, and the style sheet
// addin/taskpane.css with the parts it @imports (one beside each job's code) inlined in order into dist/taskpane.css.
import { copyFileSync, mkdirSync, rmSync } from 'node:fs';
import { build } from 'esbuild';

export default async function buildAddin() {
  rmSync('dist/pane-chunks', { recursive: true, force: true });
  mkdirSync('dist', { recursive: true });
  await build({
    entryPoints: { taskpane: 'addin/taskpane.ts' },
    outdir: 'dist',
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'browser',
    target: ['es2020', 'chrome100', 'edge100', 'firefox100', 'safari15'],
    minify: true,
    sourcemap: 'linked',
    chunkNames: 'pane-chunks/[name]-[hash]',
    logLevel: 'warning',
    legalComments: 'linked',
  });
  await build({
    entryPoints: ['addin/boot.ts'],
    outfile: 'dist/boot.js',
    bundle: true,
    format: 'iife',
    platform: 'browser',
    target: ['es2020'],
    minify: true,
    logLevel: 'warning',
  });
  copyFileSync('addin/taskpane.html', 'dist/taskpane.html');
  await build({
    entryPoints: ['addin/taskpane.css'],
    outfile: 'dist/taskpane.css',
    bundle: true,
    logLevel: 'warning',
  });
}
