import { type ChildProcess, spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import devCerts from 'office-addin-dev-certs';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM_ARGS, CHROMIUM_PATH } from '../scripts/ensure-chromium.mjs';
import { OFFICE_JS_CDN } from '../scripts/page-policy.mjs';
import { CONTENT_SECURITY_POLICY, OFFICE_JS_HOSTS, parseArgs } from '../scripts/serve.mjs';

const work = mkdtempSync(join(tmpdir(), 'resin-serve-'));
const root = join(work, 'site');
const children: ChildProcess[] = [];

function fixture() {
  mkdirSync(join(root, 'sub'), { recursive: true });
  // app.js listens for CSP violations first, then tries eval; the inline script and the outside image must be refused.
  writeFileSync(
    join(root, 'app.js'),
    [
      'window.violations = [];',
      "document.addEventListener('securitypolicyviolation', (e) => window.violations.push(e.effectiveDirective));",
      'window.appRan = true;',
      "try { eval('1 + 1'); window.evalRan = true; } catch { window.evalRan = false; }",
    ].join('\n'),
  );
  writeFileSync(
    join(root, 'page.html'),
    '<!doctype html><html><head><script src="app.js"></script><script>window.inlineRan = true;</script></head>' +
      '<body><img id="far" src="https://images.example.invalid/x.png"><img id="near" src="dot.png"></body></html>',
  );
  writeFileSync(join(root, 'dot.png'), readFileSync('manifest/icons/icon-16.png'));
  writeFileSync(join(root, 'sub', 'inner.txt'), 'inner');
  writeFileSync(join(root, '.secret'), 'secret');
  writeFileSync(join(work, 'outside.txt'), 'outside');
  symlinkSync(join(work, 'outside.txt'), join(root, 'link.txt'));
}

/** Starts scripts/serve.mjs as the user would, on a free port, and waits for the address it prints. */
function serve(args: string[]): Promise<string> {
  const child = spawn(process.execPath, ['scripts/serve.mjs', '--host', '127.0.0.1', '--port', '0', '--root', root, ...args], {
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  return new Promise((ok, fail) => {
    let out = '';
    const timer = setTimeout(() => fail(new Error(`server did not start: ${out}`)), 20_000);
    const onData = (d: Buffer) => {
      out += d.toString();
      const m = /at (https?:\/\/\S+\/)/.exec(out);
      if (m?.[1]) {
        clearTimeout(timer);
        ok(m[1]);
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', onData);
    child.on('exit', (code) => fail(new Error(`server exited with ${code}: ${out}`)));
  });
}

interface Reply {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: string;
}

/** A raw request: the path goes out exactly as written (fetch would normalise "..", which is what we want to test). */
function request(base: string, path: string, options: https.RequestOptions = {}): Promise<Reply> {
  const url = new URL(base);
  const lib = url.protocol === 'https:' ? https : http;
  return new Promise((ok, fail) => {
    const req = lib.request({ host: url.hostname, port: url.port, path, method: 'GET', ...options }, (res) => {
      let body = '';
      res.on('data', (d: Buffer) => (body += d.toString()));
      res.on('end', () => ok({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('error', fail);
    req.end();
  });
}

function directives(csp: string): Map<string, string[]> {
  return new Map(
    csp
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .map(([name = '', ...values]) => [name, values]),
  );
}

beforeAll(fixture);
afterAll(() => {
  for (const c of children) c.kill();
  rmSync(work, { recursive: true, force: true });
});

describe('the policy itself', () => {
  const d = directives(CONTENT_SECURITY_POLICY);
  it("defaults to 'self' and allows scripts only from us and the Office.js CDN", () => {
    expect(d.get('default-src')).toEqual(["'self'"]);
    expect(d.get('script-src')).toEqual(["'self'", ...OFFICE_JS_HOSTS]);
    expect(OFFICE_JS_HOSTS).toContain('https://appsforoffice.microsoft.com');
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/unsafe-eval|\*|http:/);
    expect(d.get('script-src')).not.toContain("'unsafe-inline'");
  });
  it('keeps connections, images and plugins to the minimum', () => {
    expect(d.get('connect-src')).toEqual(["'self'"]);
    expect(d.get('img-src')).toEqual(["'self'"]);
    expect(d.get('object-src')).toEqual(["'none'"]);
    expect(d.has('frame-ancestors')).toBe(false); // Excel on the web frames the pane
  });
  it("frames only Office.js's own trust prompt, from the CDN Office.js came from", () => {
    // office.js of @microsoft/office-js 1.1.110 frames <its base path>AgaveErrorUX/index.html on an unknown web host.
    expect(d.get('frame-src')).toEqual([...OFFICE_JS_CDN]);
    expect(OFFICE_JS_HOSTS).toEqual(expect.arrayContaining([...OFFICE_JS_CDN]));
  });
  it('parses the command line and refuses unknown options', () => {
    expect(parseArgs([])).toMatchObject({ root: 'dist', host: 'localhost', port: 3000, http: false });
    expect(() => parseArgs(['--port', '99999'])).toThrow(/--port/);
    expect(() => parseArgs(['--cert', 'a.pem'])).toThrow(/go together/);
    expect(() => parseArgs(['--open'])).toThrow(/unknown option/);
  });
});

describe('scripts/serve.mjs over http (test mode)', () => {
  let base = '';
  beforeAll(async () => {
    base = await serve(['--http']);
  });

  it('serves a page with the policy and the protective headers', async () => {
    const r = await request(base, '/page.html');
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(r.headers['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
    expect(r.headers['x-content-type-options']).toBe('nosniff');
    expect(r.headers['referrer-policy']).toBe('no-referrer');
    expect(r.body).toContain('app.js');
  });
  it('gives scripts and images their types', async () => {
    expect((await request(base, '/app.js')).headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect((await request(base, '/dot.png')).headers['content-type']).toBe('image/png');
  });
  it('lists no folder and puts the policy on errors too', async () => {
    const r = await request(base, '/sub/');
    expect(r.status).toBe(404);
    expect(r.body).not.toContain('inner.txt');
    expect(r.headers['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
    expect((await request(base, '/sub/inner.txt')).body).toBe('inner');
  });
  it('serves nothing outside its root: no "..", no dotfiles, no links out', async () => {
    for (const path of [
      '/../outside.txt',
      '/%2e%2e/outside.txt',
      '/sub/..%2f..%2foutside.txt',
      '/.secret',
      '/link.txt',
      '/sub\\..\\..\\outside.txt',
    ]) {
      const r = await request(base, path);
      expect(r.status, path).toBe(404);
      expect(r.body, path).not.toMatch(/outside|secret/);
    }
  });
  it('answers only GET and HEAD, and sends the pane for /', async () => {
    expect((await request(base, '/page.html', { method: 'POST' })).status).toBe(405);
    const head = await request(base, '/page.html', { method: 'HEAD' });
    expect([head.status, head.body]).toEqual([200, '']);
    const slash = await request(base, '/');
    expect([slash.status, slash.headers.location]).toEqual([302, '/taskpane.html']);
  });
  it('makes Chromium refuse inline script, eval and outside images on its pages', async () => {
    let browser: Browser | undefined;
    try {
      browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS });
      const page = await browser.newPage();
      const outside: string[] = [];
      await page.route('**/*', (route) => {
        const u = new URL(route.request().url());
        if (u.hostname === '127.0.0.1') return route.continue();
        outside.push(u.href);
        return route.abort();
      });
      await page.goto(`${base}page.html`);
      await page.waitForFunction(() => (window as unknown as { violations?: string[] }).violations?.includes('img-src'), undefined, {
        timeout: 10_000,
      });
      const seen = await page.evaluate(() => {
        const w = window as unknown as { appRan?: boolean; inlineRan?: boolean; evalRan?: boolean; violations: string[] };
        const near = document.getElementById('near') as HTMLImageElement;
        return {
          appRan: w.appRan,
          inlineRan: w.inlineRan,
          evalRan: w.evalRan,
          violations: w.violations,
          nearLoaded: near.complete && near.naturalWidth === 16,
        };
      });
      expect(seen.appRan).toBe(true);
      expect(seen.nearLoaded).toBe(true);
      expect(seen.inlineRan).toBeUndefined();
      expect(seen.evalRan).toBe(false);
      expect(seen.violations).toEqual(expect.arrayContaining(['script-src-elem', 'script-src', 'img-src']));
      expect(outside).toEqual([]); // the policy stopped the outside image before any request left the page
    } finally {
      await browser?.close();
    }
  });
});

describe('scripts/serve.mjs over https', () => {
  const certs = join(work, 'certs');
  let base = '';
  beforeAll(async () => {
    // office-addin-dev-certs makes the CA and the localhost certificate, here into a private folder (nothing is installed).
    await devCerts.generateCertificates(join(certs, 'ca.crt'), join(certs, 'localhost.crt'), join(certs, 'localhost.key'), 1, [
      '127.0.0.1',
      'localhost',
    ]);
    base = await serve(['--cert', join(certs, 'localhost.crt'), '--key', join(certs, 'localhost.key')]);
  });
  it('serves with the certificate, trusted through its CA', async () => {
    expect(base.startsWith('https://127.0.0.1:')).toBe(true);
    const r = await request(base, '/page.html', { ca: readFileSync(join(certs, 'ca.crt')) });
    expect(r.status).toBe(200);
    expect(r.headers['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
  });
  it('is refused by a client that does not trust the development CA', async () => {
    await expect(request(base, '/page.html')).rejects.toThrow(/certificate/i);
  });
});

describe.skipIf(!existsSync('dist/taskpane.html'))('the built task pane (dist/taskpane.html, from the pane build)', () => {
  it('loads under the policy without a single violation (Office.js blocked, as outside Excel)', async () => {
    const dist = await serve(['--http', '--root', 'dist']);
    const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS });
    try {
      const page = await browser.newPage();
      await page.route('**/*', (route) => (new URL(route.request().url()).hostname === '127.0.0.1' ? route.continue() : route.abort()));
      const violations: string[] = [];
      page.on('console', (m) => {
        if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
      });
      await page.goto(`${dist}taskpane.html`, { waitUntil: 'load' });
      await page.waitForTimeout(500);
      expect(violations).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
