/// <reference types="office-js" />
/**
 * Microsoft's own Excel JavaScript client, from the registry package @microsoft/office-js (the bundle
 * Excel on the web loads, excel-web-16.00.debug.js), evaluated in a Node vm context with the few browser
 * globals its start-up code touches. Nothing of it is replaced: Excel.run, the request context, object
 * paths, load/sync, result parsing and errors are Microsoft's code. Only the host side is ours: the
 * session handed to Excel.run supplies the request executor (test/support/excel-host.ts).
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import vm from 'node:vm';

export interface OfficeJs {
  readonly Excel: typeof Excel;
  readonly OfficeExtension: typeof OfficeExtension;
  /** The version of the registry package the client came from. */
  readonly version: string;
}

export const OFFICE_JS_BUNDLE = '@microsoft/office-js/dist/excel-web-16.00.debug.js';

let source: string | null = null;
let version = 'unknown';

/** Loads a fresh copy of the client (about 0.3 s). */
export function loadOfficeJs(): OfficeJs {
  if (source === null) {
    const require = createRequire(import.meta.url);
    source = readFileSync(require.resolve(OFFICE_JS_BUNDLE), 'utf8');
    version = (require('@microsoft/office-js/package.json') as { version: string }).version;
  }
  const inert = (): null => null;
  const element = (): object => ({ style: {}, setAttribute: inert, appendChild: inert });
  const sandbox: Record<string, unknown> = {
    console: { log: inert, warn: inert, error: inert, info: inert, debug: inert },
    setTimeout,
    clearTimeout,
    Promise,
    document: {
      getElementById: inert,
      getElementsByTagName: () => [],
      addEventListener: inert,
      readyState: 'complete',
      createElement: element,
    },
    navigator: { userAgent: 'node' },
    location: { href: 'https://localhost/taskpane.html', search: '', hash: '', protocol: 'https:', host: 'localhost' },
    addEventListener: inert,
  };
  sandbox.window = sandbox;
  sandbox.self = sandbox;
  vm.createContext(sandbox);
  vm.runInContext(source, sandbox, { filename: OFFICE_JS_BUNDLE });
  const excel = sandbox.Excel as typeof Excel | undefined;
  const ext = sandbox.OfficeExtension as typeof OfficeExtension | undefined;
  if (!excel?.run || !ext) throw new Error(`${OFFICE_JS_BUNDLE} did not define Excel.run and OfficeExtension`);
  return { Excel: excel, OfficeExtension: ext, version };
}
