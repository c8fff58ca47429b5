// `npm run preview`: serves dist/ on localhost over plain http so the task pane runs in any browser with its
// in-page sheet. It is the add-in server (scripts/serve.mjs) in http mode: same files, same headers and policy,
// so the preview and its browser tests catch a page that would break inside Excel. Its page is preview.html, the
// pane page without Office.js, which makes no request outside this server; taskpane.html, the add-in page, always
// fetches Office.js from Microsoft's CDN.
import { pathToFileURL } from 'node:url';
import { CONTENT_SECURITY_POLICY, startServer } from './serve.mjs';

export const PREVIEW_CONTENT_SECURITY_POLICY = CONTENT_SECURITY_POLICY;
/** The preview's page, beside the add-in's taskpane.html in dist/. */
export const PREVIEW_PAGE = 'preview.html';

/** Starts the server; resolves with its address and a close function. Port 0 picks a free port. */
export async function startPreview({ root = 'dist', port = 4178, host = '127.0.0.1' } = {}) {
  const { server, url } = await startServer({ root, port, host, http: true, index: PREVIEW_PAGE });
  const address = server.address();
  return {
    url,
    port: typeof address === 'object' && address ? address.port : port,
    close: () => new Promise((done) => server.close(() => done())),
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const port = Number(process.env.PORT ?? 4178);
  const { url } = await startPreview({ port });
  console.log(`Resin Derate task pane preview (in-page sheet, no Office.js): ${url}${PREVIEW_PAGE}`);
  console.log('Press Ctrl+C to stop.');
}
