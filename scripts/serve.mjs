// Development server for the add-in: serves the files of dist/ (and nothing else) so Excel can load the manifest's
// pages, with a Content-Security-Policy and other protective headers on every response.
//
//   node scripts/serve.mjs [--root dist] [--host localhost] [--port 3000] [--http] [--cert FILE --key FILE]
//
// Without --http it speaks https with the development certificates of office-addin-dev-certs (created and trusted on
// first use; the operating system asks to trust its CA once). --cert/--key use other certificate files. --http is for
// tests and local previews only: Office refuses add-in pages that are not https.
import { createReadStream, existsSync, readFileSync, realpathSync, statSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { homedir } from 'node:os';
import { extname, join, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { CONTENT_SECURITY_POLICY } from './page-policy.mjs';

// The policy and the Office.js hosts live in page-policy.mjs, which the build also writes into every page as a <meta>.
export { CONTENT_SECURITY_POLICY, OFFICE_JS_HOSTS } from './page-policy.mjs';

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.xml': 'application/xml; charset=utf-8',
  '.png': 'image/png',
  '.svg': 'image/svg+xml',
  '.ico': 'image/x-icon',
  '.txt': 'text/plain; charset=utf-8',
  '.woff2': 'font/woff2',
};

/** Headers on every response, files and errors alike. */
export function securityHeaders() {
  return {
    'Content-Security-Policy': CONTENT_SECURITY_POLICY,
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'no-referrer',
    // Office caches add-in files hard; a development server should always hand out the current build.
    'Cache-Control': 'no-store',
    // Excel on the web fetches the functions metadata and script from its own origin; the files are public.
    'Access-Control-Allow-Origin': '*',
  };
}

function send(res, status, text, extra = {}) {
  res.writeHead(status, { ...securityHeaders(), 'Content-Type': 'text/plain; charset=utf-8', ...extra });
  res.end(res.req.method === 'HEAD' ? undefined : `${text}\n`);
}

/** Request handler serving files below root only: no listing, no dotfiles, no way out through .. or links. / sends index. */
export function createHandler(root, index = 'taskpane.html') {
  const realRoot = realpathSync(root);
  return (req, res) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return send(res, 405, 'Method not allowed', { Allow: 'GET, HEAD' });
    let pathname;
    try {
      pathname = decodeURIComponent(new URL(req.url ?? '/', 'http://localhost').pathname);
    } catch {
      return send(res, 400, 'Bad request');
    }
    if (pathname === '/') return send(res, 302, `See /${index}`, { Location: `/${index}` });
    const segments = pathname.split('/').filter((s) => s !== '');
    if (pathname.includes('\0') || pathname.includes('\\') || segments.some((s) => s.startsWith('.'))) return send(res, 404, 'Not found');
    const candidate = resolve(realRoot, ...segments);
    let real;
    try {
      real = realpathSync(candidate);
    } catch {
      return send(res, 404, 'Not found');
    }
    if (!real.startsWith(realRoot + sep)) return send(res, 404, 'Not found');
    const stats = statSync(real);
    if (!stats.isFile()) return send(res, 404, 'Not found');
    res.writeHead(200, {
      ...securityHeaders(),
      'Content-Type': TYPES[extname(real).toLowerCase()] ?? 'application/octet-stream',
      'Content-Length': stats.size,
    });
    if (req.method === 'HEAD') return res.end();
    createReadStream(real)
      .on('error', () => res.destroy())
      .pipe(res);
  };
}

export function parseArgs(argv) {
  const options = { root: 'dist', host: 'localhost', port: 3000, http: false, cert: undefined, key: undefined };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const next = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${arg} needs a value`);
      return v;
    };
    if (arg === '--root') options.root = next();
    else if (arg === '--host') options.host = next();
    else if (arg === '--port') {
      const v = next();
      options.port = Number(v);
      if (!Number.isInteger(options.port) || options.port < 0 || options.port > 65535)
        throw new Error(`--port must be 0-65535, got "${v}"`);
    } else if (arg === '--http') options.http = true;
    else if (arg === '--cert') options.cert = next();
    else if (arg === '--key') options.key = next();
    else throw new Error(`unknown option "${arg}" (options: --root DIR --host NAME --port N --http --cert FILE --key FILE)`);
  }
  if ((options.cert === undefined) !== (options.key === undefined)) throw new Error('--cert and --key go together');
  return options;
}

async function tlsOptions(options) {
  if (options.cert && options.key) return { cert: readFileSync(options.cert), key: readFileSync(options.key) };
  const devCerts = (await import('office-addin-dev-certs')).default;
  try {
    return await devCerts.getHttpsServerOptions();
  } catch (error) {
    // The certificates were made but the CA could not be added to the system's trust store (on Linux it needs sudo).
    // Serve with them anyway and say how to trust the CA by hand. The folder is office-addin-dev-certs' default.
    const dir = join(homedir(), '.office-addin-dev-certs');
    if (!existsSync(join(dir, 'localhost.key'))) throw error;
    console.warn(`serve: ${error instanceof Error ? error.message.trim() : String(error)}`);
    console.warn(
      `serve: serving with ${join(dir, 'localhost.crt')}; until ${join(dir, 'ca.crt')} is trusted, Office and browsers will refuse the pages.`,
    );
    return { cert: readFileSync(join(dir, 'localhost.crt')), key: readFileSync(join(dir, 'localhost.key')) };
  }
}

/** Starts the server; resolves with it and its base URL once it listens. */
export async function startServer(options) {
  const handler = createHandler(options.root, options.index);
  const server = options.http ? http.createServer(handler) : https.createServer(await tlsOptions(options), handler);
  await new Promise((ok, fail) => {
    server.once('error', fail);
    server.listen(options.port, options.host, ok);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : options.port;
  const host = options.host.includes(':') ? `[${options.host}]` : options.host;
  return { server, url: `${options.http ? 'http' : 'https'}://${host}:${port}/` };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  try {
    const options = parseArgs(process.argv.slice(2));
    if (!statSync(options.root, { throwIfNoEntry: false })?.isDirectory())
      throw new Error(`${options.root} is not a folder; run npm run build first`);
    const { server, url } = await startServer(options);
    console.log(`Resin Derate: serving ${resolve(options.root)} at ${url}`);
    console.log(`  manifest: ${url}manifest.xml (sideload it; see "Running in Excel" in README.md). Ctrl+C stops.`);
    const stop = () => server.close(() => process.exit(0));
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  } catch (error) {
    console.error(`serve: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  }
}
