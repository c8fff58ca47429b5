/**
 * Supply-chain and code-injection checks that run offline. `npm audit` needs the registry's audit
 * endpoint, which answers 405 here, so instead: the production dependency tree must be exactly the
 * expected small set (a new runtime dependency is then a deliberate edit of this list), pinned, with
 * integrity hashes and no install scripts; and no built bundle may hold eval or the Function
 * constructor in our own code (each hit is traced through the source map to the file it came from).
 */
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { join, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

/** The runtime dependency tree: the two direct dependencies and what they pull in (npm ls --omit=dev --all). */
const EXPECTED_PRODUCTION_PACKAGES = [
  // mathjs 15 (units parsing) and its own dependencies
  'mathjs',
  '@babel/runtime',
  'complex.js',
  'decimal.js',
  'escape-latex',
  'fraction.js',
  'javascript-natural-sort',
  'seedrandom',
  'tiny-emitter',
  'typed-function',
  // ml-levenberg-marquardt 5 (calibration fits) and its own dependencies
  'ml-levenberg-marquardt',
  'is-any-array',
  'ml-matrix',
  'ml-array-rescale',
  'ml-array-max',
  'ml-array-min',
].sort();

interface LsNode {
  version?: string;
  dependencies?: Record<string, LsNode>;
  extraneous?: boolean;
  missing?: boolean;
  invalid?: boolean;
}

function walk(deps: Record<string, LsNode> | undefined, into: Map<string, Set<string>>, problems: string[]): void {
  for (const [name, node] of Object.entries(deps ?? {})) {
    if (node.extraneous || node.missing || node.invalid) problems.push(`${name}: extraneous, missing or invalid`);
    const versions = into.get(name) ?? new Set<string>();
    versions.add(node.version ?? '?');
    into.set(name, versions);
    walk(node.dependencies, into, problems);
  }
}

describe('production dependencies', () => {
  const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { dependencies: Record<string, string> };

  it('npm ls --omit=dev --all lists exactly the expected packages, each at one version', () => {
    const r = spawnSync('npm', ['ls', '--omit=dev', '--all', '--json'], { encoding: 'utf8', shell: process.platform === 'win32' });
    expect(r.status, r.stderr).toBe(0);
    const tree = JSON.parse(r.stdout) as LsNode;
    const found = new Map<string, Set<string>>();
    const problems: string[] = [];
    walk(tree.dependencies, found, problems);
    expect(problems).toEqual([]);
    expect([...found.keys()].sort()).toEqual(EXPECTED_PRODUCTION_PACKAGES);
    for (const [name, versions] of found) expect(versions.size, `${name} at ${[...versions].join(', ')}`).toBe(1);
  });

  it('the direct dependencies are mathjs and ml-levenberg-marquardt, pinned to exact versions', () => {
    expect(Object.keys(pkg.dependencies).sort()).toEqual(['mathjs', 'ml-levenberg-marquardt']);
    for (const [name, range] of Object.entries(pkg.dependencies)) expect(range, name).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('the lockfile pins every production package with a sha512 integrity hash and none runs an install script', () => {
    const lock = JSON.parse(readFileSync('package-lock.json', 'utf8')) as {
      packages: Record<string, { version?: string; dev?: boolean; devOptional?: boolean; integrity?: string; hasInstallScript?: boolean }>;
    };
    const prod = Object.entries(lock.packages).filter(([path, p]) => path !== '' && !p.dev && !p.devOptional);
    const names = prod.map(([path]) => path.replace(/^.*node_modules\//, '')).sort();
    expect([...new Set(names)]).toEqual(EXPECTED_PRODUCTION_PACKAGES);
    for (const [path, p] of prod) {
      expect(p.integrity, path).toMatch(/^sha512-/);
      expect(p.hasInstallScript ?? false, `${path} runs an install script`).toBe(false);
    }
  });
});

// ---------------------------------------------------------------------------------------------
// eval / Function constructor in the built bundles
// ---------------------------------------------------------------------------------------------

const B64 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';

/** Decodes one line of source-map "mappings" into [generatedColumn, sourceIndex] pairs (Source Map Revision 3, VLQ base64). */
function decodeLine(line: string, state: { source: number }): [number, number][] {
  const out: [number, number][] = [];
  let column = 0;
  for (const segment of line.split(',')) {
    if (segment === '') continue;
    const fields: number[] = [];
    let value = 0;
    let shift = 0;
    for (const ch of segment) {
      const digit = B64.indexOf(ch);
      value += (digit & 31) << shift;
      if (digit & 32) {
        shift += 5;
      } else {
        fields.push(value & 1 ? -(value >>> 1) : value >>> 1);
        value = 0;
        shift = 0;
      }
    }
    column += fields[0] ?? 0;
    if (fields.length >= 4) state.source += fields[1] ?? 0;
    out.push([column, state.source]);
  }
  return out;
}

/** The source file each (line, column) of a bundle came from, via its .map. */
function sourceLocator(mapText: string): (line: number, column: number) => string {
  const map = JSON.parse(mapText) as { sources: string[]; mappings: string };
  const state = { source: 0 };
  const lines = map.mappings.split(';').map((l) => decodeLine(l, state));
  return (line, column) => {
    const segs = lines[line] ?? [];
    let best: [number, number] | undefined;
    for (const s of segs) if (s[0] <= column) best = s;
    return best === undefined ? '(unmapped)' : (map.sources[best[1]] ?? '(unknown)');
  };
}

/** eval(...), new Function(...), Function('...'), and timers given code as a string. */
const DYNAMIC_CODE = /\beval\s*\(|\bnew\s+Function\s*\(|(?<![.\w])Function\s*\(\s*['"`]|\bset(?:Timeout|Interval)\s*\(\s*['"`]/g;

interface Hit {
  readonly bundle: string;
  readonly source: string;
  readonly text: string;
}

function scanBundles(): { bundles: string[]; hits: Hit[] } {
  // Every script under dist/, the chunks loaded later included (dist/fn-chunks/, dist/pane-chunks/).
  const bundles = (readdirSync('dist', { recursive: true, encoding: 'utf8' }) as string[])
    .map((f) => f.split(sep).join('/'))
    .filter((f) => f.endsWith('.js'))
    .sort();
  const hits: Hit[] = [];
  for (const bundle of bundles) {
    const code = readFileSync(join('dist', bundle), 'utf8');
    let locate: (line: number, column: number) => string = () => '(no source map)';
    try {
      locate = sourceLocator(readFileSync(join('dist', `${bundle}.map`), 'utf8'));
    } catch {
      // A bundle without a map is judged as our own code below.
    }
    code.split('\n').forEach((text, line) => {
      for (const m of text.matchAll(DYNAMIC_CODE)) {
        hits.push({ bundle, source: locate(line, m.index ?? 0), text: text.slice(Math.max(0, (m.index ?? 0) - 40), (m.index ?? 0) + 40) });
      }
    });
  }
  return { bundles, hits };
}

describe('no dynamic code in the built bundles', () => {
  it('the pattern catches what it should and not look-alikes', () => {
    const sample = [
      'eval("1")',
      'new Function("return 1")',
      "Function('x')",
      'setTimeout("alert(1)", 1)',
      'x.evaluate(1)',
      'isFunction(f)',
      'obj.Function(1)',
    ];
    expect(sample.map((s) => (s.match(DYNAMIC_CODE) ?? []).length)).toEqual([1, 1, 1, 1, 0, 0, 0]);
  });
  it('the source-map reader finds our sources in the CLI bundle', () => {
    const locate = sourceLocator(readFileSync('dist/cli.js.map', 'utf8'));
    const code = readFileSync('dist/cli.js', 'utf8').split('\n');
    const line = code.findIndex((l) => l.includes('function parseTemperatureK('));
    expect(line).toBeGreaterThanOrEqual(0);
    expect(locate(line, (code[line] ?? '').indexOf('function parseTemperatureK('))).toMatch(/src\/base\/units\.ts$/);
  });
  it('dist/**/*.js hold no eval, new Function, Function(string) or string timers from our own code (dependencies listed)', () => {
    const { bundles, hits } = scanBundles();
    for (const b of ['cli.js', 'functions.js', 'taskpane.js', 'boot.js']) expect(bundles).toContain(b);
    // The functions loaded on first call and the pane's later chunks are scanned too.
    expect(
      bundles.some((b) => /^fn-chunks\/fits-[\w-]+\.js$/.test(b)),
      bundles.join(', '),
    ).toBe(true);
    expect(
      bundles.some((b) => b.startsWith('pane-chunks/')),
      bundles.join(', '),
    ).toBe(true);
    const ours = hits.filter((h) => !h.source.includes('node_modules/'));
    expect(ours, JSON.stringify(ours, null, 2)).toEqual([]);
    // Finding when this test was written (mathjs 15.2 tree-shaken to its unit system): no hit at all,
    // from dependencies either. A dependency hit is allowed but must stay visible: pin the list here.
    const fromDependencies = [...new Set(hits.map((h) => `${h.bundle}: ${h.source.replace(/^.*node_modules\//, '')}`))];
    expect(fromDependencies).toEqual([]);
  });
});
