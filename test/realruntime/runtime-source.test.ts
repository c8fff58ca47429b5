/**
 * Which runtime the real-runtime suite stands for. It loads custom-functions-runtime.debug.js, the
 * runtime of add-ins whose functions run on their own; ours share the pane's runtime, where Office.js
 * loads a host file per platform instead (excel-win32-16.01, excel-mac-16.00, excel-web-16.00). These
 * checks read the files of the installed package (Microsoft, @microsoft/office-js 1.1.110, dist/*.debug.js)
 * and fail when the code on the invocation path differs between them, or when the package moves on and
 * the README's statements about 1.1.110 need reading again.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RUNTIME_FILE } from './harness.js';

const DIST = 'node_modules/@microsoft/office-js/dist/';
const SHARED_RUNTIME_FILES = ['excel-win32-16.01.debug.js', 'excel-mac-16.00.debug.js', 'excel-web-16.00.debug.js'];

/** What the suite relies on: how entries become calls, how results and errors go back, and the error and Invocation classes. */
const PROXY_METHODS = [
  '_handleMessage',
  '_batchInvocationEntries',
  '_transferCustomFunctionError',
  '_transferCustomFunctionRichData',
  '_invokeFunctionAndSetResult',
  '_setResultWithOutboundData',
  '_setErrorWithOutboundData',
  '_getCustomFunctionResultErrorCodeFromErrorCode',
  '_convertCustomFunctionInvocationResultToArray',
  '_executeSetResultsTask',
];

function between(source: string, start: string, end: string, what: string): string {
  const i = source.indexOf(start);
  if (i < 0) throw new Error(`${what}: "${start}" not found`);
  const j = source.indexOf(end, i + start.length);
  if (j < 0) throw new Error(`${what}: no end "${end}" after "${start}"`);
  return source.slice(i, j);
}

function pieces(file: string): Record<string, string> {
  const source = readFileSync(file, 'utf8');
  const out: Record<string, string> = {};
  for (const m of PROXY_METHODS)
    out[m] = between(source, `CustomFunctionProxy.prototype.${m} = function`, '}, CustomFunctionProxy', `${file} ${m}`);
  out['CustomFunctionError'] = between(
    source,
    'var CustomFunctionError = function(_super) {',
    'exports.CustomFunctionError = CustomFunctionError;',
    file,
  );
  out['InvocationContext'] = between(source, 'InvocationContext = function() {', 'exports.InvocationContext = InvocationContext', file);
  return out;
}

describe("Office's custom-functions runtime as installed", () => {
  it('is @microsoft/office-js 1.1.110, the version the README describes', () => {
    const pkg = JSON.parse(readFileSync('node_modules/@microsoft/office-js/package.json', 'utf8')) as { version: string };
    expect(pkg.version).toBe('1.1.110');
  });

  it.each(SHARED_RUNTIME_FILES)('runs invocations with the same code as the shared-runtime host file %s', (file) => {
    const alone = pieces(RUNTIME_FILE);
    const shared = pieces(`${DIST}${file}`);
    for (const name of Object.keys(alone)) expect(shared[name], `${name} in ${file}`).toBe(alone[name]);
  });
});
