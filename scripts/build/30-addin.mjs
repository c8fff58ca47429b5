// The task pane: addin/taskpane.ts bundled for the browser (ES modules; chart.js split into its own chunk, fetched only by
// the in-page preview sheet, and the calibration job with the engine's least-squares code into another, fetched on the
// first calibration: both are dynamic import() calls, so splitting is all this step needs), plus the pages and the style
// sheet. dist/taskpane.html is the add-in page: Office.js in its head, the Content-Security-Policy as a <meta>.
// dist/preview.html is the same page without Office.js, for the offline preview (scripts/page-policy.mjs).
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { build } from 'esbuild';
import { loadsOfficeJsFirst, previewPage, withPolicy } from '../page-policy.mjs';

export default async function buildAddin() {
  rmSync('dist/pane-chunks', { recursive: true, force: true });
  // Left by builds before Office.js was loaded by the page itself.
  rmSync('dist/boot.js', { force: true });
  mkdirSync('dist', { recursive: true });
  const pane = await build({
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
    metafile: true,
  });
  // Sizes of the page script and of each chunk (the engine and mathjs units land in the shared chunk-*.js).
  const kB = (n) => (n / 1000).toFixed(1);
  const sizes = Object.keys(pane.metafile.outputs)
    .filter((f) => f.endsWith('.js'))
    .map((f) => {
      const b = readFileSync(f);
      return `${f.slice('dist/'.length)} ${kB(b.length)} / ${kB(gzipSync(b, { level: 9 }).length)} kB`;
    });
  console.log(`task pane: minified / gzip: ${sizes.join(', ')}`);
  const page = readFileSync('addin/taskpane.html', 'utf8');
  if (!loadsOfficeJsFirst(page)) throw new Error('addin/taskpane.html: the first script in its head must be Office.js, named once');
  writeFileSync('dist/taskpane.html', withPolicy(page, 'addin/taskpane.html'));
  writeFileSync('dist/preview.html', withPolicy(previewPage(page, 'addin/taskpane.html'), 'preview.html'));
  // The style sheet @imports one part beside each job's code; esbuild inlines them in order.
  await build({ entryPoints: ['addin/taskpane.css'], outfile: 'dist/taskpane.css', bundle: true, logLevel: 'warning' });
}
