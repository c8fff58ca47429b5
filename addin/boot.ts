/**
 * The first script of the pane page, run while the head is parsed. Excel opens the pane with _host_Info in
 * its address; only then is Office.js fetched (it cannot load anywhere else, and the preview must make no
 * request outside its own server). A parser-inserted script keeps Office.js ahead of the pane's own code,
 * as Office requires, without an inline script (the server's Content-Security-Policy forbids those).
 */
const OFFICE_JS = 'https://appsforoffice.microsoft.com/lib/1/hosted/office.js';

const inOffice = /[?&]_host_Info=/i.test(window.location.search);
window.__resinDerateHost = inOffice ? 'office' : 'browser';
if (inOffice) document.write(`<script src="${OFFICE_JS}"></script>`);
