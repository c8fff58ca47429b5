/**
 * The Office host with a stand-in for the custom-functions runtime (Office.js cannot load outside
 * Office): every definition is associated under its id, errors become CustomFunctions.Error objects
 * (thrown for a scalar result, in place inside a spill), and error objects given as input are read, not trusted.
 * Excel itself does not pass error inputs with our metadata (no allowErrorForDataTypeAny: Microsoft Learn, "Handle
 * and return errors from your custom function", Errors as custom function inputs; test/schemas.test.ts pins the
 * metadata), so that input path is a guard, exercised here with the runtime's error shape.
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { FunctionDef } from '../functions/core/define.js';
import { registerWithOffice } from '../functions/host/office.js';
import { loadFunctions } from './support/functions.js';
import { FakeError, fakeRuntime } from './support/office-runtime.js';

let defs: readonly FunctionDef[] = [];
beforeAll(async () => {
  defs = (await loadFunctions()).defs;
});

describe('Office host', () => {
  it('associates nothing when the runtime is absent', () => {
    expect(registerWithOffice(undefined)).toBe(0);
  });

  it('associates every definition under its worksheet id', () => {
    const rt = fakeRuntime();
    expect(registerWithOffice(rt)).toBe(defs.length);
    expect([...rt.table.keys()].sort()).toEqual(defs.map((d) => d.id).sort());
  });

  it('returns numbers, throws a scalar error with its message, and puts spill errors in place', () => {
    // Called as Excel's runtime calls them: the declared arguments, then an Invocation object.
    const rt = fakeRuntime();
    registerWithOffice(rt);
    expect(typeof rt.call('MODULUS', [[['PC']], 80, '1000 h'])).toBe('number');
    let thrown: unknown;
    try {
      rt.call('MODULUS', [[['PX']], 80, 1000]);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(FakeError);
    expect(thrown).toMatchObject({ code: '#N/A' });
    expect((thrown as FakeError).message).toContain('unknown family "PX"');
    expect(() => rt.call('MODULUS', [[['PC']], true, 1000])).toThrow(FakeError);
    const table = rt.call('GRID', [[['PC'], ['PBT']], [[23, 80]], 1000]) as unknown[][];
    expect(table[0]).toEqual(['E_r MPa', 23, 80]);
    expect(table.flat().some((c) => c instanceof FakeError)).toBe(false);
    const row = rt.call('BAND', [[['PC']], 80, 1000]) as unknown[][];
    expect(row[0]?.length).toBe(4);
    // An empty slot of a spill goes out as empty text (PARAMS leaves unused fields empty).
    const block = rt.call('PARAMS', ['PC']) as unknown[][];
    expect(block.some((r) => r[1] === '')).toBe(true);
    expect(block.flat().some((c) => c === null)).toBe(false);
  });

  it('takes the trailing Invocation object the way Excel passes it, and still refuses a real extra argument', () => {
    // Microsoft Learn, "Custom functions parameter options" (Invocation parameter): one value per declared
    // parameter, null for an omitted optional one, then always an Invocation object.
    const rt = fakeRuntime();
    registerWithOffice(rt);
    const modulus = rt.table.get('MODULUS');
    const ratio = rt.table.get('RATIO');
    if (!modulus || !ratio) throw new Error('not associated');
    const invocation = { functionName: 'DERATE.MODULUS', address: 'Sheet1!B2', parameterAddresses: undefined };
    const plain = modulus([['PC']], 80, '1000 h');
    expect(modulus([['PC']], 80, '1000 h', invocation)).toBe(plain);
    expect(typeof ratio([['PC']], 80, '1000 h', null, null, { functionName: 'DERATE.RATIO' })).toBe('number');
    expect(ratio([['PC']], 80, '1000 h', null, null, { functionName: 'DERATE.RATIO' })).toBe(ratio([['PC']], 80, '1000 h'));
    let thrown: unknown;
    try {
      modulus([['PC']], 80, '1000 h', 5, invocation);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(FakeError);
    expect((thrown as FakeError).message).toContain('takes at most 3 arguments');
  });

  it('reads error objects in ranges, should a host pass them, and keeps #N/A', () => {
    // Not what Excel does with dist/functions.json (it does not call the function: see the header); the adapter
    // must still never turn an error object into a number.
    const rt = fakeRuntime();
    registerWithOffice(rt);
    let thrown: unknown;
    try {
      rt.call('EQTIME', [[['PBT']], [[70], [new FakeError('#N/A', 'lookup failed')]], [[8], [16]]], 5);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toMatchObject({ code: '#N/A' });
    expect((thrown as FakeError).message).toContain('temperatures: cell 2: received the error #N/A (lookup failed)');
    try {
      rt.call('EQTIME', [[['PBT']], [[70], [{ code: '#DIV/0!' }]], [[8], [16]]], 5);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toMatchObject({ code: '#VALUE!' });
    expect((thrown as FakeError).message).toContain('#DIV/0!');
  });

  it('sends #NUM! without a message (Excel shows messages only on #VALUE! and #N/A)', async () => {
    const { toOfficeError } = await import('../functions/host/office.js');
    const { SheetError } = await import('../functions/core/cells.js');
    const e = toOfficeError(fakeRuntime(), new SheetError('#NUM!', 'overflow')) as FakeError;
    expect(e.code).toBe('#NUM!');
    expect(e.message).toBeUndefined();
  });
});

describe('the built bundle dist/functions.js', () => {
  it('associates every function id of dist/functions.json when CustomFunctions exists, and nothing otherwise', async () => {
    const { existsSync } = await import('node:fs');
    const vm = await import('node:vm');
    if (!existsSync('dist/functions.js')) throw new Error('dist/functions.js is missing: run npm run build first (npm test does)');
    const code = readFileSync('dist/functions.js', 'utf8');
    const metadata = JSON.parse(readFileSync('dist/functions.json', 'utf8')) as { functions: { id: string }[] };
    const rt = fakeRuntime();
    vm.runInNewContext(code, { CustomFunctions: rt });
    expect([...rt.table.keys()].sort()).toEqual(metadata.functions.map((f) => f.id).sort());
    expect(typeof rt.table.get('MODULUS')?.([['PC']], 80, 1000)).toBe('number');
    expect(() => vm.runInNewContext(code, {})).not.toThrow();
  });

  it('loads the part with the fitting functions on their first call, from beside functions.js', async () => {
    // A real module load (not the VM): the start-up script's import() must find dist/fn-chunks/ relative to itself.
    const { spawnSync } = await import('node:child_process');
    const { pathToFileURL } = await import('node:url');
    const { resolve } = await import('node:path');
    const script = [
      'class E { constructor(code, message) { this.code = code; this.message = message; } }',
      'const table = new Map();',
      "globalThis.CustomFunctions = { associate: (id, fn) => table.set(id, fn), Error: E, ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A', invalidNumber: '#NUM!' } };",
      `await import(${JSON.stringify(pathToFileURL(resolve('dist/functions.js')).href)});`,
      "const creep = table.get('CREEPMOD')([['PC']], 80, 1000);",
      'const isPromise = creep instanceof Promise;',
      "const block = await table.get('CALIBRATE')([['PC']], 2300);",
      "let bad; try { await table.get('FITCURVES')('nothing'); } catch (e) { bad = e; }",
      "console.log(JSON.stringify({ ids: [...table.keys()].length, isPromise, creep: await creep, first: block[0], quality: block.find((r) => r[0] === '# quality')?.[1], bad: bad && bad.code }));",
    ].join('\n');
    const run = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' });
    expect(run.stderr).toBe('');
    const out = JSON.parse(run.stdout) as {
      ids: number;
      isPromise: boolean;
      creep: number;
      first: unknown[];
      quality: string;
      bad: string;
    };
    const metadata = JSON.parse(readFileSync('dist/functions.json', 'utf8')) as { functions: unknown[] };
    expect(out.ids).toBe(metadata.functions.length);
    expect(out.isPromise).toBe(true);
    expect(out.creep).toBe(defs.find((d) => d.id === 'CREEPMOD')?.invoke([['PC']], 80, 1000));
    expect(out.first).toEqual(['field', 'value', 'unit', 'description']);
    expect(out.quality).toBe('good');
    expect(out.bad).toBe('#VALUE!');
  });
});
