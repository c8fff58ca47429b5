/**
 * The deploy command (scripts/deploy.mjs), run as a team would into a temporary folder for a chosen https base URL.
 * The folder is read back (manifest, pages, references between scripts, chunks kept across deploys) and then served
 * by a plain static server (node's http, content types only, no header of ours) to Debian's Chromium, with the Office.js
 * CDN answered from the registry's copy of Office.js (@microsoft/office-js 1.1.110) and every other outside request
 * refused.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { extname, join, normalize, sep } from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deploy, missingReferences, parseDeployArgs } from '../scripts/deploy.mjs';
import { CHROMIUM_ARGS, ensureChromium } from '../scripts/ensure-chromium.mjs';
import { checkManifest } from '../scripts/manifest-check.mjs';
import { CONTENT_SECURITY_POLICY, loadsOfficeJsFirst, OFFICE_JS_URL } from '../scripts/page-policy.mjs';

const BASE = 'https://addins.example.com/resin-derate/';
const work = mkdtempSync(join(tmpdir(), 'resin-deploy-'));
const site = join(work, 'site');
const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
const SOURCE_MANIFEST = readFileSync('manifest/manifest.xml', 'utf8');

function run(args: string[]) {
  return spawnSync(process.execPath, ['scripts/deploy.mjs', ...args], { encoding: 'utf8' });
}

function directives(csp: string): Map<string, string[]> {
  return new Map(
    csp.split(';').map((d): [string, string[]] => {
      const [name = '', ...values] = d.trim().split(/\s+/);
      return [name, values];
    }),
  );
}

const read = (name: string) => readFileSync(join(site, name), 'utf8');
const metaPolicy = (html: string) => /<meta http-equiv="Content-Security-Policy" content="([^"]*)"/.exec(html)?.[1];

beforeAll(() => {
  // npm test builds first; run on its own, this test builds what is missing.
  if (!['taskpane.html', 'functions.js', 'functions.json', 'support.html', 'manifest.xml'].every((f) => existsSync(`dist/${f}`))) {
    const build = spawnSync(process.execPath, ['scripts/build.mjs'], { encoding: 'utf8' });
    expect(build.status, build.stderr).toBe(0);
  }
  const r = run(['--origin', BASE, '--out', site, '--no-build']);
  expect(r.status, r.stderr).toBe(0);
  expect(r.stdout).toContain(`for ${BASE}`);
}, 120_000);

afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('node scripts/deploy.mjs --origin https://addins.example.com/resin-derate/', () => {
  it('writes a manifest whose every URL is under that address, names a file of the folder, and passes our checks', () => {
    const text = read('manifest.xml');
    const { problems, summary } = checkManifest(text, { iconDir: join(site, 'icons'), version: `${pkg.version}.0` });
    expect(problems).toEqual([]);
    const urls = summary?.urls ?? [];
    expect(urls.length).toBeGreaterThanOrEqual(8);
    expect(urls.filter((u) => !u.startsWith(BASE))).toEqual([]);
    expect(urls.filter((u) => !existsSync(join(site, ...u.slice(BASE.length).split('/'))))).toEqual([]);
    expect(urls).toEqual(expect.arrayContaining(['taskpane.html', 'functions.js', 'functions.json', 'support.html'].map((f) => BASE + f)));
    expect(text).not.toMatch(/localhost/);
    // Office keys installed copies on the Id; a deploy keeps the source's.
    expect(summary?.id).toBe(checkManifest(SOURCE_MANIFEST).summary?.id);
  });

  it('puts the policy in the pages as a meta that allows Office.js, with Office.js the first script of the head', () => {
    const pane = read('taskpane.html');
    // W3C CSP Level 3, "The <meta> element": a meta policy governs only what follows it, so it precedes every script.
    expect(metaPolicy(pane)).toBe(CONTENT_SECURITY_POLICY);
    expect(pane.indexOf('http-equiv="Content-Security-Policy"')).toBeLessThan(pane.indexOf('<script'));
    expect(directives(CONTENT_SECURITY_POLICY).get('script-src')).toContain(new URL(OFFICE_JS_URL).origin);
    // Microsoft Learn, "Referencing the Office JavaScript API library": a script tag in the head, before the page's own.
    expect(loadsOfficeJsFirst(pane)).toBe(true);
    const head = pane.slice(0, pane.indexOf('</head>'));
    expect(head.indexOf(OFFICE_JS_URL)).toBeLessThan(head.indexOf('src="functions.js"'));
    expect(head.indexOf('src="functions.js"')).toBeLessThan(head.indexOf('src="taskpane.js"'));
    expect(metaPolicy(read('support.html'))).toBe(CONTENT_SECURITY_POLICY);
  });

  it('holds what the add-in loads and nothing of the preview, the CLI or the source maps', () => {
    const top = readdirSync(site).sort();
    expect(top).toEqual(
      [
        'fn-chunks',
        'functions.js',
        'functions.json',
        'icons',
        'manifest.xml',
        'pane-chunks',
        'support.html',
        'taskpane.css',
        'taskpane.html',
        'taskpane.js',
      ].sort(),
    );
    const all = readdirSync(site, { recursive: true }).map(String);
    expect(all.filter((f) => f.endsWith('.map') || f.includes('preview'))).toEqual([]);
    expect(missingReferences(site)).toEqual([]);
    expect(read('functions.js')).toMatch(/"\.\/fn-chunks\/fits-[\w-]+\.js"/);
  });

  it('keeps the chunks of an earlier deploy, so a functions.js cached before the update still finds its own', () => {
    const cached = read('functions.js');
    const oldChunk = /\.\/(fn-chunks\/fits-[\w-]+\.js)/.exec(cached)?.[1] ?? '';
    expect(existsSync(join(site, oldChunk))).toBe(true);
    // A later build: the same files with a new chunk name, as a change to the fitting code would give.
    const dist = join(work, 'dist-later');
    cpSync('dist', dist, { recursive: true });
    const newChunk = oldChunk.replace(/fits-[\w-]+\.js$/, 'fits-LATER0001.js');
    renameSync(join(dist, oldChunk), join(dist, newChunk));
    writeFileSync(join(dist, 'functions.js'), cached.split(oldChunk).join(newChunk));
    const r = deploy({ base: BASE, out: site, dist });
    expect(r.kept).toEqual([oldChunk]);
    expect(read('functions.js')).toContain(newChunk);
    expect(existsSync(join(site, oldChunk)) && existsSync(join(site, newChunk))).toBe(true);
    expect(missingReferences(site)).toEqual([]);
  });

  it('refuses a non-https origin or none, naming --origin, and writes nothing', () => {
    const out = join(work, 'refused');
    const r = run(['--origin', 'http://addins.example.com/resin-derate/', '--out', out, '--no-build']);
    expect(r.status).not.toBe(0);
    expect(r.stderr).toMatch(/^deploy: --origin: .*must use https/);
    expect(existsSync(out)).toBe(false);
    // No http mode, not even for localhost: Office loads add-in pages over https only.
    expect(() => parseDeployArgs(['--origin', 'http://localhost:3000/'])).toThrow(/--origin: .*must use https/);
    expect(() => parseDeployArgs(['--out', out])).toThrow(/--origin is required/);
    expect(() => parseDeployArgs(['--origin', 'https://a.example.com/x?v=1'])).toThrow(/--origin: .*plain folder URL/);
    expect(() => parseDeployArgs(['--origin', BASE, '--colour', 'teal'])).toThrow(/unknown option "--colour"/);
    expect(parseDeployArgs([`--origin=${BASE.slice(0, -1)}`, '--no-build'])).toMatchObject({ base: BASE, out: 'deploy', build: false });
  });

  it('refuses to write into a folder holding other files, and leaves them as they were', () => {
    const other = join(work, 'other');
    mkdirSync(other);
    writeFileSync(join(other, 'notes.txt'), 'kept');
    expect(() => deploy({ base: BASE, out: other })).toThrow(/--out .* is not empty and is not an earlier Resin Derate deploy/);
    expect(readdirSync(other)).toEqual(['notes.txt']);
    expect(() => deploy({ base: BASE, out: 'dist/x' })).toThrow(/--out .* inside dist/);
    expect(existsSync('dist/x')).toBe(false);
  });
});

/** A static file server with nothing of ours: the folder below /resin-derate/, content types by extension only. */
function staticServer(root: string, prefix: string): Promise<http.Server> {
  const types: Record<string, string> = {
    '.html': 'text/html',
    '.js': 'text/javascript',
    '.css': 'text/css',
    '.json': 'application/json',
    '.xml': 'application/xml',
    '.png': 'image/png',
    '.txt': 'text/plain',
  };
  const server = http.createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    const file = normalize(join(root, path.slice(prefix.length)));
    if (!path.startsWith(prefix) || !file.startsWith(root + sep) || !existsSync(file)) {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(200, { 'Content-Type': types[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  return new Promise((ok) => server.listen(0, '127.0.0.1', () => ok(server)));
}

describe('the deploy folder on a plain static server, in Chromium', () => {
  let server: http.Server | undefined;
  let browser: Browser | undefined;
  afterAll(async () => {
    await browser?.close();
    server?.close();
  });

  it('serves the pane, whose Office.js and own scripts load under the meta policy alone', async () => {
    server = await staticServer(site, '/resin-derate/');
    const { port } = server.address() as AddressInfo;
    browser = await chromium.launch({ executablePath: ensureChromium(), args: CHROMIUM_ARGS });
    const page = await browser.newPage();
    const officeJs = new URL(OFFICE_JS_URL);
    const cdn: string[] = [];
    const refused: string[] = [];
    await page.route('**/*', async (route) => {
      const url = new URL(route.request().url());
      if (url.hostname === '127.0.0.1') return route.continue();
      // The CDN's folder answered from the registry's copy of the same library (offline; nothing leaves the machine).
      const file = join('node_modules/@microsoft/office-js/dist', url.pathname.slice(officeJs.pathname.lastIndexOf('/') + 1));
      if (url.origin === officeJs.origin && url.pathname.startsWith(officeJs.pathname.replace(/[^/]+$/, '')) && existsSync(file)) {
        cdn.push(url.pathname);
        return route.fulfill({ body: readFileSync(file), contentType: 'text/javascript' });
      }
      refused.push(url.href);
      return route.abort();
    });
    const statuses = new Map<string, number>();
    page.on('response', (r) => statuses.set(new URL(r.url()).pathname, r.status()));
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(e.message));
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(m.text());
    });
    const response = await page.goto(`http://127.0.0.1:${port}/resin-derate/taskpane.html`);
    expect(response?.headers()['content-security-policy']).toBeUndefined();
    await page.waitForSelector('body[data-ready=true]', { timeout: 20_000 });
    // Office.js loaded and, outside Office, its onReady resolved with no host ("Office.onReady" reference: host null).
    await expect(page.textContent('#host-note')).resolves.toBe('Not opened by Excel: using the in-page sheet');
    expect(cdn[0]).toBe(officeJs.pathname);
    expect(refused).toEqual([]);
    for (const f of ['taskpane.html', 'taskpane.css', 'functions.js', 'taskpane.js'])
      expect(statuses.get(`/resin-derate/${f}`), f).toBe(200);
    expect([...statuses].filter(([p]) => p.startsWith('/resin-derate/pane-chunks/')).every(([, s]) => s === 200)).toBe(true);
    // Outside Office, Office.js opens a hidden logging frame (ULSEndpointProxy in o15apptofilemappingtable.js); the
    // policy refuses it on purpose (scripts/page-policy.mjs), and that is the one complaint the page may log.
    expect(problems.filter((p) => !/^Framing 'https:\/\/telemetryservice\.firstpartyapps\.oaspapps\.com\/' violates/.test(p))).toEqual([]);
    // The meta alone enforces the policy: an inline script is refused (W3C CSP Level 3, script-src without 'unsafe-inline').
    const inline = await page.evaluate(
      () =>
        new Promise<{ ran: boolean; directive: string }>((done) => {
          document.addEventListener('securitypolicyviolation', (e) =>
            done({ ran: 'inlineRan' in window, directive: e.effectiveDirective }),
          );
          const s = document.createElement('script');
          s.textContent = 'window.inlineRan = true;';
          document.head.appendChild(s);
        }),
    );
    expect(inline).toEqual({ ran: false, directive: 'script-src-elem' });
  }, 120_000);
});
