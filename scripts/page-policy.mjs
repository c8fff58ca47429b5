// The add-in pages' Content-Security-Policy and the head edits the build makes with it. One policy for every place it
// is enforced: the development server's header (scripts/serve.mjs) and the <meta http-equiv> the build writes into each
// page, so that a static host that sends no headers of ours (scripts/deploy.mjs) still enforces it.

/** Office.js, loaded by a plain script in the pane page's head (Microsoft Learn, "Referencing the Office JavaScript API library"). */
export const OFFICE_JS_URL = 'https://appsforoffice.microsoft.com/lib/1/hosted/office.js';

/**
 * Where Office.js comes from. Office.js loads its host-specific scripts, locale strings and the page it frames to ask
 * the user to trust an unknown Excel-on-the-web host (AgaveErrorUX) from the folder it was itself loaded from
 * (getOfficeJsBasePath in office.js of @microsoft/office-js 1.1.110). The CDN moved to
 * officeapis.public.onecdn.static.microsoft; the older appsforoffice.microsoft.com URL still works, so both are allowed.
 */
export const OFFICE_JS_CDN = ['https://appsforoffice.microsoft.com', 'https://officeapis.public.onecdn.static.microsoft'];

/** Office.js loads MicrosoftAjax.js from here on some hosts (ajax.aspnetcdn.com/ajax/3.5/MicrosoftAjax.js in office.js). */
export const MICROSOFT_AJAX_HOST = 'https://ajax.aspnetcdn.com';

/** Every host a page may load script from besides itself. */
export const OFFICE_JS_HOSTS = [...OFFICE_JS_CDN, MICROSOFT_AJAX_HOST];

/**
 * The policy for every page. Scripts: our own files plus Office.js; no inline script, no eval (Office.js 1.1.110 uses
 * neither). Styles: our own files, plus inline styles because Office.js's Excel-on-the-web script sets them
 * (OfficeDev/office-js issue 1687); inline style cannot run code. Frames: only Office.js's own trust prompt from its
 * CDN; the logging frame Office.js opens from telemetryservice.firstpartyapps.oaspapps.com when the page is opened
 * outside Office (o15apptofilemappingtable.js, ULSEndpointProxy) or by a 16.00 Windows host (excel-win32-16.00.js) is
 * refused: it only carries Office.js's own logs, which then stay in the page. Connections, images and fonts: our own
 * origin only (the add-in makes no network request; its data are bundled; Office.js sends its telemetry straight to
 * Microsoft only on Windows and Mac builds older than 16.0.11601 (shouldSendDirectToAria in excel-win32-16.01.js),
 * which cannot run a shared runtime anyway). No plugins, no <base> or form targets elsewhere. frame-ancestors is left
 * out on purpose: Excel on the web shows the pane in a frame of one of several Microsoft domains, which a list would
 * miss (and a <meta> policy cannot carry it at all). Microsoft publishes no list of what Office.js needs
 * (OfficeDev/office-js issue 1005 asks for one); this list is read from Office.js itself.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  `script-src 'self' ${OFFICE_JS_HOSTS.join(' ')}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self'",
  "font-src 'self'",
  "connect-src 'self'",
  `frame-src ${OFFICE_JS_CDN.join(' ')}`,
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
].join('; ');

const CHARSET = /^([ \t]*)<meta charset="utf-8" \/>\n/m;
const OFFICE_JS_TAG = new RegExp(`^[ \\t]*<script src="${OFFICE_JS_URL.replace(/[./]/g, '\\$&')}"></script>\\n`, 'gm');

/** The page with the policy as a <meta http-equiv> right after its charset, before anything the policy governs. */
export function withPolicy(html, name = 'page') {
  const charset = CHARSET.exec(html);
  if (!charset) throw new Error(`${name}: no <meta charset="utf-8" /> line to put the Content-Security-Policy after`);
  if (/http-equiv="Content-Security-Policy"/i.test(html)) throw new Error(`${name}: already has a Content-Security-Policy meta`);
  const meta = `${charset[1]}<meta http-equiv="Content-Security-Policy" content="${CONTENT_SECURITY_POLICY}" />\n`;
  return html.replace(CHARSET, (line) => line + meta);
}

/** True when the first script of the page's head is Office.js from OFFICE_JS_URL and the page names it nowhere else. */
export function loadsOfficeJsFirst(html) {
  const head = /<head>([\s\S]*?)<\/head>/i.exec(html)?.[1] ?? '';
  const first = /<script\b[^>]*>/i.exec(head)?.[0];
  return first === `<script src="${OFFICE_JS_URL}">` && html.split(OFFICE_JS_URL).length === 2;
}

/**
 * The offline preview made from the pane page: the same page without Office.js (it must make no request outside its
 * own server) and marked data-page="preview", so the pane draws its in-page sheet at once.
 */
export function previewPage(html, name = 'page') {
  const tags = html.match(OFFICE_JS_TAG) ?? [];
  if (tags.length !== 1) throw new Error(`${name}: expected one <script src="${OFFICE_JS_URL}"></script> line, found ${tags.length}`);
  if (!html.includes('<html lang="en">')) throw new Error(`${name}: no <html lang="en"> to mark as the preview`);
  return html.replace(OFFICE_JS_TAG, '').replace('<html lang="en">', '<html lang="en" data-page="preview">');
}
