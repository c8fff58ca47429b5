// `npm run preview`: serves dist/ on localhost so the task pane runs in any browser with its in-page
// sheet. Static files only, no network beyond the loopback interface.
import { createReadStream, statSync } from 'node:fs';
import { createServer } from 'node:http';
import { extname, join, normalize, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.png': 'image/png',
  '.svg': 'image/svg+xml',
  '.xml': 'application/xml; charset=utf-8',
  '.txt': 'text/plain; charset=utf-8',
};

/**
 * The same policy the add-in's https server sends (no inline script, no eval; Office.js from Microsoft's CDN
 * only), so that the preview and its browser tests catch a page that would break inside Excel.
 */
export const PREVIEW_CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self' https://appsforoffice.microsoft.com https://officeapis.public.onecdn.static.microsoft https://ajax.aspnetcdn.com",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self'",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
].join('; ');

/** Starts the server; resolves with its address and a close function. Port 0 picks a free port. */
export function startPreview({ root = 'dist', port = 4178, host = '127.0.0.1' } = {}) {
  const base = resolve(root);
  const server = createServer((req, res) => {
    let path;
    try {
      path = decodeURIComponent(new URL(req.url ?? '/', 'http://localhost').pathname);
    } catch {
      res.writeHead(400).end('bad request');
      return;
    }
    if (path === '/') path = '/taskpane.html';
    const file = normalize(join(base, path));
    if (file !== base && !file.startsWith(base + sep)) {
      res.writeHead(403).end('forbidden');
      return;
    }
    let size;
    try {
      const st = statSync(file);
      if (!st.isFile()) throw new Error('not a file');
      size = st.size;
    } catch {
      res
        .writeHead(404, { 'content-type': 'text/plain; charset=utf-8', 'content-security-policy': PREVIEW_CONTENT_SECURITY_POLICY })
        .end(`not found: ${path}`);
      return;
    }
    res.writeHead(200, {
      'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
      'content-length': size,
      'cache-control': 'no-store',
      'content-security-policy': PREVIEW_CONTENT_SECURITY_POLICY,
      'x-content-type-options': 'nosniff',
    });
    createReadStream(file).pipe(res);
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      const addr = server.address();
      const actual = typeof addr === 'object' && addr ? addr.port : port;
      resolvePromise({
        url: `http://${host === '127.0.0.1' ? 'localhost' : host}:${actual}/`,
        port: actual,
        close: () => new Promise((done) => server.close(() => done())),
      });
    });
  });
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const port = Number(process.env.PORT ?? 4178);
  const { url } = await startPreview({ port });
  console.log(`Resin Derate task pane preview (in-page sheet): ${url}taskpane.html`);
  console.log('Press Ctrl+C to stop.');
}
