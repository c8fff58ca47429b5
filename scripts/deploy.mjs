// A folder a team can put on any static https host: the add-in's pages, scripts, chunks, icons, functions metadata
// and a manifest whose every URL points at that host.
//
//   node scripts/deploy.mjs --origin https://addins.example.com/resin-derate/ [--out deploy] [--no-build]
//
// It builds dist/ first (node scripts/build.mjs; --no-build takes dist/ as it is) and copies what the add-in loads.
// The Content-Security-Policy travels inside the pages as a <meta http-equiv> (a static host sends none of our headers).
// Chunks keep their content-hashed names and a deploy never deletes a file: chunks of earlier deploys stay beside the
// new ones, so a functions.js or taskpane.js that Office cached before an update still finds the chunk it was built with.
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { addinBase, checkManifest, rebaseManifest } from './manifest-check.mjs';
import { manifestXsdProblems } from './office-schemas.mjs';
import { CONTENT_SECURITY_POLICY, loadsOfficeJsFirst, withPolicy } from './page-policy.mjs';

const ROOT = fileURLToPath(new URL('..', import.meta.url));

export const USAGE = `usage: node scripts/deploy.mjs --origin https://HOST/PATH/ [--out DIR] [--no-build]

  --origin URL   the https address the folder will be served from (a host, or a folder of it); every manifest URL points there
  --out DIR      the folder to write (default deploy); empty, new, or an earlier deploy of Resin Derate
  --no-build     take dist/ as it is instead of running the build first`;

/** The folders whose files keep their content-hashed names and are never removed by a later deploy. */
export const CHUNK_DIRS = ['fn-chunks', 'pane-chunks'];
/** The files the add-in loads by name, besides the chunks and icons. */
const NAMED = ['taskpane.html', 'taskpane.js', 'taskpane.css', 'functions.js', 'functions.json', 'support.html'];

/** Reads the command line; throws an Error naming the option that is wrong. */
export function parseDeployArgs(argv) {
  const options = { base: undefined, out: 'deploy', build: true, help: false };
  for (let i = 0; i < argv.length; i++) {
    const [arg = '', inline] = argv[i].startsWith('--') && argv[i].includes('=') ? argv[i].split(/=(.*)/s) : [argv[i]];
    const value = () => {
      const v = inline ?? argv[++i];
      if (v === undefined || v === '') throw new Error(`${arg} needs a value\n${USAGE}`);
      return v;
    };
    if (arg === '--origin') {
      const text = value();
      try {
        options.base = addinBase(text);
      } catch (error) {
        throw new Error(`--origin: ${error instanceof Error ? error.message : String(error)}`);
      }
    } else if (arg === '--out') options.out = value();
    else if (arg === '--no-build') options.build = false;
    else if (arg === '--help' || arg === '-h') options.help = true;
    else throw new Error(`unknown option "${arg}"\n${USAGE}`);
  }
  if (!options.help && options.base === undefined)
    throw new Error(`--origin is required: the https address the folder will be served from\n${USAGE}`);
  return options;
}

const files = (dir) => (existsSync(dir) ? readdirSync(dir).filter((f) => statSync(join(dir, f)).isFile()) : []);

/** Relative module specifiers ("./x.js", "../y.js") in a built script: its static and dynamic imports. */
export function scriptReferences(js) {
  return [...js.matchAll(/["'](\.{1,2}\/[A-Za-z0-9_./-]+\.js)["']/g)].map((m) => m[1]);
}

/** Every reference of the folder's pages and scripts that names no file in it (empty when the folder is whole). */
export function missingReferences(out) {
  const missing = [];
  const walk = (dir) =>
    readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)]));
  for (const file of walk(out)) {
    const text = file.endsWith('.js') || file.endsWith('.html') ? readFileSync(file, 'utf8') : '';
    const refs = file.endsWith('.js')
      ? scriptReferences(text)
      : [...text.matchAll(/\b(?:src|href)="([^"#?:]+)"/g)].map((m) => m[1]).filter((r) => !r.startsWith('//'));
    for (const ref of refs) {
      const target = resolve(dirname(file), ref);
      if (!existsSync(target)) missing.push(`${relative(out, file)} -> ${ref}`);
    }
  }
  return missing;
}

/** The manifest with its opening comment (which speaks of the development server) replaced by one about this deploy. */
function deployedHeader(manifest, base, version) {
  const head = /<!--\s*Resin Derate add-in manifest[\s\S]*?-->/.exec(manifest);
  if (!head)
    throw new Error('manifest/manifest.xml: its opening comment ("Resin Derate add-in manifest ...") is gone; the deploy rewrites it');
  const text = [
    '<!--',
    `  Resin Derate add-in manifest ${version}, written by scripts/deploy.mjs for ${base}: every URL points there.`,
    "  Made from manifest/manifest.xml; the Id is this add-in's own and stays the same across versions.",
    '-->',
  ].join('\n');
  return manifest.replace(head[0], text);
}

/** Refuses an output folder that is not empty and not an earlier deploy of this add-in, or that lies in dist/. */
function checkOut(out, id) {
  const dist = resolve(ROOT, 'dist');
  if (out === dist || out.startsWith(dist + sep))
    throw new Error(`--out ${out} is inside dist/, which every build rewrites; choose another folder`);
  if (!existsSync(out)) return;
  if (!statSync(out).isDirectory()) throw new Error(`--out ${out} is a file, not a folder`);
  if (readdirSync(out).length === 0) return;
  const manifest = join(out, 'manifest.xml');
  const earlier = existsSync(manifest) ? checkManifest(readFileSync(manifest, 'utf8')).summary?.id : undefined;
  if (earlier !== id)
    throw new Error(
      `--out ${out} is not empty and is not an earlier Resin Derate deploy (no manifest.xml with Id ${id}); choose an empty or new folder`,
    );
}

/**
 * Writes the deploy folder for the add-in base URL `base` (https, ending in /) from the built dist/. Returns what it
 * wrote; throws an Error when dist/ lacks a file, the manifest fails its checks or a reference would dangle.
 */
export function deploy({ base, out, dist = join(ROOT, 'dist') }) {
  const target = resolve(out);
  const source = readFileSync(join(ROOT, 'manifest/manifest.xml'), 'utf8');
  const dev = checkManifest(source).summary;
  if (!dev?.id || !dev.origin) throw new Error('manifest/manifest.xml: no Id or pane URL to deploy from');
  checkOut(target, dev.id);
  for (const f of NAMED) if (!existsSync(join(dist, f))) throw new Error(`${join(dist, f)} is missing: run node scripts/build.mjs first`);
  const pane = readFileSync(join(dist, 'taskpane.html'), 'utf8');
  if (!pane.includes(`content="${CONTENT_SECURITY_POLICY}"`) || !loadsOfficeJsFirst(pane))
    throw new Error(`${join(dist, 'taskpane.html')} lacks the policy meta or Office.js in its head: rebuild with node scripts/build.mjs`);

  const before = new Map(CHUNK_DIRS.map((d) => [d, new Set(files(join(target, d)))]));
  const written = [];
  const put = (name, contents) => {
    mkdirSync(dirname(join(target, name)), { recursive: true });
    if (contents === undefined) copyFileSync(join(dist, name), join(target, name));
    else writeFileSync(join(target, name), contents);
    written.push(name);
  };
  for (const f of NAMED.filter((n) => n !== 'support.html')) put(f);
  put('support.html', withPolicy(readFileSync(join(dist, 'support.html'), 'utf8'), 'support.html'));
  for (const f of files(join(dist, 'icons')).filter((n) => n.endsWith('.png'))) put(`icons/${f}`);
  // Source maps stay behind: nothing loads them but a debugger.
  for (const d of CHUNK_DIRS) for (const f of files(join(dist, d)).filter((n) => !n.endsWith('.map'))) put(`${d}/${f}`);

  const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
  const manifest = deployedHeader(rebaseManifest(source, dev.origin, base), base, pkg.version);
  const checked = checkManifest(manifest, { iconDir: join(target, 'icons'), version: `${pkg.version}.0` });
  const { summary } = checked;
  // Our own rules and Microsoft's published XSD (vendor/office-schemas/), as for the development manifest.
  const problems = [...checked.problems, ...manifestXsdProblems(manifest, 'deployed manifest.xml').map((p) => `XSD: ${p}`)];
  if (problems.length > 0) throw new Error(`the deployed manifest has ${problems.length} problem(s):\n  ${problems.join('\n  ')}`);
  put('manifest.xml', manifest);
  const absent = (summary?.urls ?? []).filter((u) => !existsSync(join(target, ...u.slice(base.length).split('/'))));
  if (absent.length > 0) throw new Error(`manifest URLs with no file in ${target}: ${absent.join(', ')}`);
  const missing = missingReferences(target);
  if (missing.length > 0) throw new Error(`references with no file in ${target}:\n  ${missing.join('\n  ')}`);

  const kept = CHUNK_DIRS.flatMap((d) => [...(before.get(d) ?? [])].filter((f) => !written.includes(`${d}/${f}`)).map((f) => `${d}/${f}`));
  return { out: target, base, version: pkg.version, written, kept, urls: summary?.urls ?? [] };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  try {
    const options = parseDeployArgs(process.argv.slice(2));
    if (options.help) {
      console.log(USAGE);
      process.exit(0);
    }
    if (options.build) {
      const run = spawnSync(process.execPath, ['scripts/build.mjs'], { cwd: ROOT, stdio: 'inherit' });
      if (run.status !== 0) throw new Error('the build failed (above); nothing was deployed');
    }
    const r = deploy({ base: options.base, out: options.out });
    console.log(`Resin Derate ${r.version} for ${r.base}, in ${r.out}:`);
    console.log(
      `  ${r.written.length} files written${r.kept.length > 0 ? `; ${r.kept.length} chunk file(s) of earlier deploys kept` : ''}`,
    );
    console.log(`  serve the folder's contents at ${r.base} (any static https host), then deploy ${join(r.out, 'manifest.xml')}`);
    console.log('  to users: README.md, "Running in Excel".');
  } catch (error) {
    console.error(`deploy: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  }
}
