/**
 * Drives the built worksheet functions through Microsoft's own custom-functions runtime in Chromium.
 *
 * The page is served from the add-in's real server (scripts/serve.mjs over dist/, with its headers and
 * Content-Security-Policy) and loads, in the order Excel's pane page does, Office's runtime and then
 * dist/functions.js; the fitting functions fetch dist/fn-chunks/fits-<hash>.js from that server by
 * import(). Only the channel below the runtime is a stand-in (native-bridge.ts): invocations go in where
 * the host would put them and results are read where the runtime hands them to the host.
 *
 * What the runtime is told per invocation, and why: Excel builds each entry from the functions metadata,
 * so the harness does the same from dist/functions.json. One value per declared parameter (null for an
 * omitted optional one: Microsoft Learn, "Custom functions parameter options"; 2-D arrays for a `matrix`
 * parameter), the calling cell's address only when the metadata asks for it (`requiresAddress`), and the
 * flag bits `_batchInvocationEntries` reads: 1 cancelable, 2 stream (the metadata's `options`), 4 errors as
 * input (`allowErrorForDataTypeAny`), 8 rich data (`allowCustomDataForDataTypeAny`). Which bit Excel sets
 * for which property is our reading of the runtime's names (isCancelable, isStreaming, isAllowError, and
 * `_transferCustomFunctionRichData`), not something the runtime states.
 */
import { readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import { chromium, type Browser, type Page } from 'playwright-core';
import { CHROMIUM_ARGS } from '../../scripts/ensure-chromium.mjs';
import { securityHeaders, startServer } from '../../scripts/serve.mjs';
import { installNativeBridge, type BridgeHandle, type SentResult } from './native-bridge.js';

/** Microsoft's runtime as the registry ships it (the file the README names). */
export const RUNTIME_FILE = 'node_modules/@microsoft/office-js/dist/custom-functions-runtime.debug.js';
/** Where the page finds it; the runtime locates itself by that file name, so the name must stay. */
const PREFIX = '/__realruntime/';
const RUNTIME_URL = `${PREFIX}custom-functions-runtime.debug.js`;

/** One parameter of dist/functions.json. */
export interface MetaParam {
  readonly name: string;
  readonly type?: string;
  readonly dimensionality?: string;
  readonly optional?: boolean;
}

/** One function of dist/functions.json. */
export interface MetaFunction {
  readonly id: string;
  readonly parameters: readonly MetaParam[];
  readonly result: { readonly dimensionality?: string };
  readonly options?: { readonly cancelable?: boolean; readonly stream?: boolean; readonly requiresAddress?: boolean };
}

/** dist/functions.json. */
export interface Metadata {
  readonly allowErrorForDataTypeAny?: boolean;
  readonly allowCustomDataForDataTypeAny?: boolean;
  readonly functions: readonly MetaFunction[];
}

export function readMetadata(): Metadata {
  return JSON.parse(readFileSync('dist/functions.json', 'utf8')) as Metadata;
}

/** The flag bits of an invocation of `fn`, as the metadata implies them (see the header). */
export function metadataFlags(metadata: Metadata, fn: MetaFunction): number {
  return (
    (fn.options?.cancelable ? 1 : 0) |
    (fn.options?.stream ? 2 : 0) |
    (metadata.allowErrorForDataTypeAny ? 4 : 0) |
    (metadata.allowCustomDataForDataTypeAny ? 8 : 0)
  );
}

/** The values of one call as Excel passes them: one per parameter, null when left out, a range as rows. */
export function wireArgs(fn: MetaFunction, args: readonly unknown[]): unknown[] {
  if (args.length > fn.parameters.length) return [...args];
  return fn.parameters.map((p, i) => {
    const v = args[i];
    if (v === undefined || v === null) return null;
    if (p.dimensionality === 'matrix' && !Array.isArray(v)) return [[v]];
    return v;
  });
}

/** An error value in an input cell, in the form `_transferCustomFunctionError` recognises (type and code). */
export function wireError(code: string): { type: string; code: string } {
  return { type: 'CustomFunctionError', code };
}

/** One invocation for the runtime. */
export interface Call {
  readonly id: string;
  /** Exactly what goes into parameterValues (use wireArgs to build it from the metadata). */
  readonly values: readonly unknown[];
  readonly flags: number;
  readonly address?: string | null;
  /** The runtime accepts an entry as an array or as an object (`_batchInvocationEntries`); Excel's choice is not visible here. */
  readonly form?: 'array' | 'object';
}

/** A cell of a spilled result, decoded. */
export type Cell = number | string | boolean | null | { readonly error: string; readonly message?: string };

/** What came back for one invocation. */
export type Answer =
  | { readonly kind: 'value'; readonly value: number | string | boolean | Cell[][] }
  /** A CustomFunctions.Error the function threw (or rejected with): its code and the message the runtime sent. */
  | { readonly kind: 'error'; readonly code: string; readonly message: string }
  /** Anything else the runtime reports: a plain exception, NaN, a function it could not find. Never expected. */
  | { readonly kind: 'failure'; readonly internalCode: number; readonly text: string };

/** The runtime's result error codes for CustomFunctions.Error (_getCustomFunctionResultErrorCodeFromErrorCode). */
const EXCEL_CODES: Record<number, string> = { 1: '#N/A', 5: '#DIV/0!', 6: '#NUM!', 7: '#VALUE!', 8: '#NULL!' };

function decodeCell(c: unknown): Cell {
  if (c !== null && typeof c === 'object' && !Array.isArray(c)) {
    // CustomFunctionError.prototype.toJSON: valueType, code, message (only for #VALUE! and #N/A), ...
    const o = c as { valueType?: unknown; code?: unknown; message?: unknown };
    if (o.valueType === 'CustomFunctionError' && typeof o.code === 'string') {
      return typeof o.message === 'string' ? { error: o.code, message: o.message } : { error: o.code };
    }
    return { error: `unexpected object ${JSON.stringify(c)}` };
  }
  if (typeof c === 'number' || typeof c === 'string' || typeof c === 'boolean' || c === null) return c;
  return { error: `unexpected ${typeof c}` };
}

/** One entry of SetInvocationArrayResults: [id, succeeded, value, errorCode if failed, outboundData] (CustomFunctions 1.7+). */
function decode(sent: SentResult): { id: number; answer: Answer } {
  if (sent.action !== 'SetInvocationArrayResults' || !Array.isArray(sent.entry)) {
    return { id: -1, answer: { kind: 'failure', internalCode: -1, text: `result through ${sent.action}: ${JSON.stringify(sent.entry)}` } };
  }
  const [id, ok, value, errorCode] = sent.entry as [number, boolean, unknown, number | undefined];
  if (ok) {
    if (Array.isArray(value)) return { id, answer: { kind: 'value', value: (value as unknown[][]).map((row) => row.map(decodeCell)) } };
    if (typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean')
      return { id, answer: { kind: 'value', value } };
    return { id, answer: { kind: 'failure', internalCode: -2, text: `succeeded with ${JSON.stringify(value)}` } };
  }
  const code = EXCEL_CODES[errorCode ?? -1];
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return { id, answer: code ? { kind: 'error', code, message: text } : { kind: 'failure', internalCode: errorCode ?? -1, text } };
}

/** The page, the server and the browser; `run` sends invocations and waits for their answers. */
export class RealRuntime {
  /** Every path the page fetched from the add-in's server, in order. */
  readonly fetched: string[] = [];
  /** Requests that tried to leave localhost (blocked). */
  readonly outside: string[] = [];
  /** Files the runtime asked for beside itself, which this suite does not have (answered 404). */
  readonly runtimeExtras: string[] = [];
  readonly pageErrors: string[] = [];
  private nextId = 1;

  private constructor(
    private readonly browser: Browser,
    private readonly server: Server,
    readonly page: Page,
  ) {}

  static async start(executablePath: string): Promise<RealRuntime> {
    const { server, url } = await startServer({ root: 'dist', host: '127.0.0.1', port: 0, http: true, cert: undefined, key: undefined });
    const browser = await chromium.launch({ executablePath, args: CHROMIUM_ARGS });
    try {
      const context = await browser.newContext();
      const page = await context.newPage();
      const rt = new RealRuntime(browser, server, page);
      const base = new URL(url);
      const headers = securityHeaders();
      const runtimeSource = readFileSync(RUNTIME_FILE, 'utf8');
      await context.route('**/*', async (route) => {
        const u = new URL(route.request().url());
        if (u.host !== base.host) {
          rt.outside.push(u.href);
          return route.abort('blockedbyclient');
        }
        if (u.pathname === `${PREFIX}page.html`) {
          return route.fulfill({ status: 200, headers: { ...headers, 'Content-Type': 'text/html; charset=utf-8' }, body: PAGE });
        }
        if (u.pathname === RUNTIME_URL) {
          return route.fulfill({
            status: 200,
            headers: { ...headers, 'Content-Type': 'text/javascript; charset=utf-8' },
            body: runtimeSource,
          });
        }
        if (u.pathname.startsWith(PREFIX)) {
          rt.runtimeExtras.push(u.pathname.slice(PREFIX.length));
          return route.fulfill({ status: 404, headers: { ...headers, 'Content-Type': 'text/plain; charset=utf-8' }, body: 'not here' });
        }
        rt.fetched.push(u.pathname);
        return route.continue();
      });
      page.on('pageerror', (e) => rt.pageErrors.push(e.message));
      page.setDefaultTimeout(20_000);
      await page.addInitScript(installNativeBridge);
      await page.goto(`${url}${PREFIX.slice(1)}page.html`);
      return rt;
    } catch (e) {
      await browser.close();
      server.close();
      throw e;
    }
  }

  /** The ids the runtime's association table holds (what CustomFunctions.associate registered). */
  associatedIds(): Promise<string[]> {
    return this.page.evaluate(() => {
      const cf = (window as unknown as { CustomFunctions?: { _association?: { mappings?: object } } }).CustomFunctions;
      return Object.keys(cf?._association?.mappings ?? {});
    });
  }

  /** Sends the calls as one message (Excel batches invocations too) and waits until each has its answer. */
  async run(calls: readonly Call[]): Promise<Answer[]> {
    const ids = calls.map(() => this.nextId++);
    const entries = calls.map((c, i) => {
      const id = ids[i] as number;
      const address = c.address ?? null;
      const message =
        c.form === 'object'
          ? { invocationId: id, functionName: c.id, parameterValues: c.values, address, flags: c.flags }
          : [id, c.id, c.values, address, c.flags];
      // [messageCategory 1 (custom functions), messageType 1000 (invocation), targetId, message, id]: the
      // compact entry form Core.HostBridge unpacks.
      return [1, 1000, '', message, id];
    });
    await this.page.evaluate((e) => (window as unknown as { __realRuntimeBridge: BridgeHandle }).__realRuntimeBridge.deliver(e), entries);
    await this.page.waitForFunction(
      (want) => {
        const got = new Set(
          (window as unknown as { __realRuntimeBridge: BridgeHandle }).__realRuntimeBridge.results.map((r) =>
            Array.isArray(r.entry) ? r.entry[0] : -1,
          ),
        );
        return want.every((id) => got.has(id));
      },
      ids,
      { polling: 20 },
    );
    const sent = await this.page.evaluate(() => (window as unknown as { __realRuntimeBridge: BridgeHandle }).__realRuntimeBridge.results);
    const byId = new Map(sent.map(decode).map((d) => [d.id, d.answer]));
    return ids.map((id) => byId.get(id) ?? { kind: 'failure', internalCode: -3, text: 'no answer' });
  }

  /** Requests the runtime sent that were not results (there should be none). */
  otherActions(): Promise<string[]> {
    return this.page.evaluate(() => (window as unknown as { __realRuntimeBridge: BridgeHandle }).__realRuntimeBridge.otherActions);
  }

  async close(): Promise<void> {
    await this.browser.close();
    await new Promise<void>((ok) => this.server.close(() => ok()));
  }
}

/** The page: Office's runtime first, then the functions, both classic scripts, as in dist/taskpane.html inside Excel. */
const PAGE = [
  '<!doctype html>',
  '<html lang="en"><head><meta charset="utf-8"><title>Resin Derate functions on the real runtime</title>',
  `<script src="${RUNTIME_URL}"></script>`,
  '<script src="/functions.js" defer></script>',
  '</head><body></body></html>',
].join('\n');
