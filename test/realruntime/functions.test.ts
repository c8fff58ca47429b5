/**
 * "Works in Excel": every worksheet function of the built add-in (dist/functions.js, dist/functions.json,
 * dist/fn-chunks/) run by Microsoft's own custom-functions runtime (@microsoft/office-js 1.1.110,
 * custom-functions-runtime.debug.js) in Chromium, served by the add-in's own server. Only the host's
 * message channel below the runtime is a stand-in (native-bridge.ts; harness.ts says what it is told).
 *
 * Expected answers come from the same definitions run in Node (vitest): these checks are about the
 * boundary (arguments in, results and errors out), not about the numbers, which the engine tests check
 * against their references. Numbers may differ in the last bits between Node's and Chromium's V8
 * (Math.exp and friends), more after an iterative fit, so they are compared to a relative 1e-9.
 */
import { existsSync, readdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignError, SheetError } from '../../functions/core/cells.js';
import type { FunctionDef } from '../../functions/core/define.js';
import { ensureChromium } from '../../scripts/ensure-chromium.mjs';
import { loadsOnFirstCall } from '../../scripts/functions-files.mjs';
import { loadFunctions } from '../support/functions.js';
import { validArgs } from '../support/samples.js';
import {
  metadataFlags,
  readMetadata,
  RealRuntime,
  wireArgs,
  wireError,
  type Answer,
  type Call,
  type Cell,
  type Metadata,
  type MetaFunction,
} from './harness.js';

const SAME_CODE = 'the same definition run in Node (consistency of the boundary; numbers are checked against references elsewhere)';
/** Microsoft Learn, "Custom functions parameter options" (Invocation parameter; optional parameters arrive as null). */
const LEARN_PARAMS = 'Microsoft Learn, "Custom functions parameter options"';
/** Microsoft Learn, "Handle and return errors from your custom function". */
const LEARN_ERRORS = 'Microsoft Learn, "Handle and return errors from your custom function"';

let rt: RealRuntime;
let metadata: Metadata;
let defs: readonly FunctionDef[] = [];
let lazyIds: string[] = [];
let chunkFetchesAtLoad = -1;
let samples: Promise<Answer[]> | undefined;

/** The sample call of every function of the metadata, run once for the tests that read it (the fits take a while). */
function sampleAnswers(): Promise<Answer[]> {
  return (samples ??= rt.run(metadata.functions.map((f) => call(f.id, validArgs(def(f.id))))));
}

const CHUNK = /^\/fn-chunks\/fits-[A-Za-z0-9]+\.js$/;

function def(id: string): FunctionDef {
  const d = defs.find((x) => x.id === id);
  if (!d) throw new Error(`no definition ${id}`);
  return d;
}

function meta(id: string): MetaFunction {
  const f = metadata.functions.find((x) => x.id === id);
  if (!f) throw new Error(`${id} is not in dist/functions.json`);
  return f;
}

/** A call with the flags the metadata implies, and a calling cell only if the metadata asks for one. */
function call(id: string, args: readonly unknown[], flags?: number): Call {
  const fn = meta(id);
  return {
    id,
    values: wireArgs(fn, args),
    flags: flags ?? metadataFlags(metadata, fn),
    address: fn.options?.requiresAddress ? 'Sheet1!B2' : null,
  };
}

const expectedMemo = new Map<string, Answer>();

/** What the runtime should hand back for a Node answer: #NUM! without a message, an empty slot as ''. */
function expected(d: FunctionDef, args: readonly unknown[]): Answer {
  const key = `${d.id} ${JSON.stringify(args)}`;
  const known = expectedMemo.get(key);
  if (known) return known;
  const answer = nodeAnswer(d, args);
  expectedMemo.set(key, answer);
  return answer;
}

function nodeAnswer(d: FunctionDef, args: readonly unknown[]): Answer {
  const out = d.invoke(...args);
  if (out instanceof SheetError) return { kind: 'error', code: out.code, message: out.code === '#NUM!' ? '' : out.message };
  if (Array.isArray(out)) {
    const rows = out.map((row) =>
      row.map((c): Cell =>
        c instanceof SheetError ? (c.code === '#NUM!' ? { error: c.code } : { error: c.code, message: c.message }) : (c ?? ''),
      ),
    );
    return { kind: 'value', value: rows };
  }
  return { kind: 'value', value: out };
}

function close(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => close(x, b[i]));
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') return JSON.stringify(a) === JSON.stringify(b);
  return a === b;
}

function expectAnswer(actual: Answer | undefined, want: Answer, what: string): void {
  expect(actual?.kind, `${what}: ${JSON.stringify(actual)}`).toBe(want.kind);
  if (!actual) return;
  if (actual.kind === 'value' && want.kind === 'value') {
    expect(
      close(actual.value, want.value),
      `${what}: got ${JSON.stringify(actual.value)}, expected ${JSON.stringify(want.value)} (${SAME_CODE})`,
    ).toBe(true);
  } else expect(actual, what).toEqual(want);
}

/** Text of an answer, to search for a message wherever it travels (a thrown error or a cell of a spill). */
function text(a: Answer | undefined): string {
  return JSON.stringify(a ?? null);
}

beforeAll(async () => {
  if (!existsSync('dist/functions.js') || !existsSync('dist/functions.json'))
    throw new Error('dist/ is missing: run node scripts/build.mjs first (npm test does)');
  const executablePath = ensureChromium();
  const loaded = await loadFunctions();
  defs = loaded.defs;
  lazyIds = loaded.modules
    .filter((m) => loadsOnFirstCall(m.file))
    .flatMap((m) => Object.values(m.exports).filter((x): x is FunctionDef => defs.includes(x as FunctionDef)))
    .map((d) => d.id);
  metadata = readMetadata();
  rt = await RealRuntime.start(executablePath);
  chunkFetchesAtLoad = rt.fetched.filter((p) => CHUNK.test(p)).length;
}, 120_000);

afterAll(async () => {
  const errors = rt?.pageErrors ?? [];
  const outside = rt?.outside ?? [];
  await rt?.close();
  // Checked after closing, so a failure here still frees the browser.
  expect(errors, 'uncaught errors in the page').toEqual([]);
  expect(outside, 'requests that left localhost').toEqual([]);
});

describe('the built functions on Office custom-functions runtime 1.1.110 (Chromium, served dist/)', () => {
  it('loads: functions.js associates exactly the ids of dist/functions.json; the fitting chunk is not fetched yet', async () => {
    expect((await rt.associatedIds()).sort()).toEqual(metadata.functions.map((f) => f.id.toUpperCase()).sort());
    expect(rt.fetched).toContain('/functions.js');
    expect(chunkFetchesAtLoad).toBe(0);
    // The runtime's own start-up asks for one file beside itself (OSF's O15 mapping table, looked for when no
    // Office host is detected); nothing of it is needed on the invocation path, and it is all it asks for.
    expect(rt.runtimeExtras).toEqual(['o15apptofilemappingtable.debug.js']);
    expect(lazyIds.length).toBeGreaterThan(0);
  });

  it('every function of dist/functions.json answers its sample call as the definition does in Node', async () => {
    const fns = metadata.functions;
    for (const f of fns) {
      const d = def(f.id);
      expect(
        f.parameters.map((p) => p.name),
        `${f.id}: metadata parameters against the definition's arguments`,
      ).toEqual(d.args.map((a) => a.name));
    }
    const answers = await sampleAnswers();
    fns.forEach((f, i) => {
      const d = def(f.id);
      const want = expected(d, validArgs(d));
      // Not vacuous: every sample call gives an answer, not an error.
      expect(want.kind, `${f.id}: the sample call should answer`).toBe('value');
      expectAnswer(answers[i], want, `DERATE.${f.id} sample call`);
      const value = answers[i]?.kind === 'value' ? answers[i].value : undefined;
      if (f.result.dimensionality === 'matrix') {
        expect(Array.isArray(value), `${f.id} spills rows`).toBe(true);
        const rows = value as Cell[][];
        expect(rows.every((r) => r.length === rows[0]?.length)).toBe(true);
      } else expect(typeof value, `${f.id} answers one number`).toBe('number');
    });
    expect(answers).toHaveLength(fns.length);
  });

  it('takes the trailing Invocation object: no answer says "takes at most", while a real extra argument still does', async () => {
    // Excel's runtime appends an Invocation after the declared parameters of every call
    // (_batchInvocationEntries: parameterValues.push(invocationContext); LEARN_PARAMS, Invocation parameter).
    // Before commit 76696df every function answered "#VALUE! DERATE.X takes at most N arguments, got N+1".
    // Every function with its sample arguments, and once more with all its optional ones left out (null).
    const minimal = metadata.functions
      .filter((f) => f.parameters.some((p) => p.optional))
      .map((f) =>
        call(
          f.id,
          def(f.id).args.map((a, i) => (a.optional ? null : validArgs(def(f.id))[i])),
        ),
      );
    const objectForm: Call = { ...call('MODULUS', [[['PC']], 80, '1000 h']), form: 'object' };
    const extra: Call = { id: 'MODULUS', values: [[['PC']], 80, '1000 h', 5], flags: 0 };
    const more = await rt.run([...minimal, objectForm, extra]);
    const answers = [...(await sampleAnswers()), ...more.slice(0, -1)];
    expect(answers.length).toBe(metadata.functions.length + minimal.length + 1);
    const refused = answers.filter((a) => /takes at most/.test(text(a)));
    expect(refused.map(text), LEARN_PARAMS).toEqual([]);
    expect(answers.filter((a) => a.kind === 'failure')).toEqual([]);
    expect(more[minimal.length]).toMatchObject({ kind: 'value' });
    // The same check does catch a refusal: four worksheet values before the Invocation are one too many.
    expect(more[minimal.length + 1]).toMatchObject({ kind: 'error', code: '#VALUE!' });
    expect(text(more[minimal.length + 1])).toContain('DERATE.MODULUS takes at most 3 arguments, got 4');
  });

  it('omitted optional arguments arrive as null and take their defaults', async () => {
    const cases: { id: string; args: unknown[]; label: string }[] = [];
    for (const f of metadata.functions) {
      const d = def(f.id);
      const sample = validArgs(d);
      const optional = d.args.flatMap((a, i) => (a.optional ? [i] : []));
      if (optional.length === 0) continue;
      cases.push({ id: f.id, args: sample.map((v, i) => (optional.includes(i) ? null : v)), label: 'every optional left out' });
      for (const i of optional) {
        if (sample[i] === null || sample[i] === undefined) continue;
        cases.push({ id: f.id, args: sample.map((v, j) => (j === i ? null : v)), label: `${d.args[i]?.name} left out` });
      }
    }
    expect(cases.length).toBeGreaterThan(10);
    // The README's defaults for RATIO: ref_temperature 23 degC, ref_time "1 h".
    const ratio = [[['PA66-cond']], 60, '1000 h'];
    const answers = await rt.run([
      ...cases.map((c) => call(c.id, c.args)),
      call('RATIO', [...ratio, null, null]),
      call('RATIO', [...ratio, 23, '1 h']),
    ]);
    cases.forEach((c, i) => {
      expect(answers[i]?.kind, `${c.id}, ${c.label}: ${text(answers[i])}`).not.toBe('failure');
      expectAnswer(answers[i], expected(def(c.id), c.args), `DERATE.${c.id}, ${c.label} (${LEARN_PARAMS})`);
    });
    const [omitted, explicit] = answers.slice(cases.length);
    expect(omitted).toMatchObject({ kind: 'value' });
    expect(omitted, 'RATIO with its optionals left out = with the defaults the README documents').toEqual(explicit);
  });

  it('ranges go in as 2-D arrays and spills come back as 2-D arrays', async () => {
    const grid = [[['PC'], ['PBT'], ['POM']], [[23, 60, 80, 100]], '1000 h'];
    const column = [[['PBT']], [[70], [30]], [[8], [16]], null, 3650];
    const curve = [[['PP']], 20, 160, 29, '1000 h'];
    const answers = await rt.run([call('GRID', grid), call('EQTIME', column), call('CURVE', curve), call('PARAMS', ['PA66-cond'])]);
    expectAnswer(answers[0], expected(def('GRID'), grid), 'GRID over a 3 x 1 and a 1 x 4 range');
    const table = answers[0]?.kind === 'value' ? (answers[0].value as Cell[][]) : [];
    expect(table.length).toBe(4);
    expect(table[0]).toEqual(['E_r MPa', 23, 60, 80, 100]);
    expect(table.map((r) => r[0])).toEqual(['E_r MPa', 'PC', 'PBT', 'POM']);
    expectAnswer(answers[1], expected(def('EQTIME'), column), 'EQTIME over two 2 x 1 ranges');
    expectAnswer(answers[2], expected(def('CURVE'), curve), 'CURVE of 29 points');
    expect((answers[2]?.kind === 'value' ? (answers[2].value as Cell[][]) : []).length).toBe(30);
    // An empty slot of a spill goes out as '' (PARAMS leaves the fields a kind does not use empty).
    const block = answers[3]?.kind === 'value' ? (answers[3].value as Cell[][]) : [];
    expect(block.some((r) => r[1] === '')).toBe(true);
    expect(block.flat().includes(null)).toBe(false);
  });

  it('errors: #VALUE! and #N/A carry their message, #NUM! none, in a spill and as the whole answer', async () => {
    // A hand-typed Prony table (a documented material input) with absurd weights: the modulus overflows,
    // which the result guard turns into #NUM!, in place inside BAND's spill and as MODULUS's answer.
    const overflow = [
      ['prony', 'overflow'],
      ['reference_C', 100],
      ['shiftLaw', 'wlf'],
      ['Tg_C', 100],
      ['C1', 17.44],
      ['C2_K', 51.6],
      ['E_inf_MPa', 1],
      ['tau_s', 'E_MPa'],
      [1, 1e308],
      [10, 1e308],
    ];
    const cases: [string, unknown[]][] = [
      ['MODULUS', [[['PX']], 80, 1000]],
      ['MODULUS', [[['PC']], true, 1000]],
      ['MODULUS', [[['PC']], null, 1000]],
      ['CURVE', [[['PC']], 20, 600, 3, 1000]],
      ['MAXTIME', [[['PC']], 10, 23]],
      ['MODULUS', [overflow, 80, 1000]],
      ['BAND', [overflow, 80, 1000]],
    ];
    const answers = await rt.run(cases.map(([id, args]) => call(id, args)));
    cases.forEach(([id, args], i) =>
      expectAnswer(answers[i], expected(def(id), args), `DERATE.${id}(${JSON.stringify(args).slice(0, 60)})`),
    );
    const [unknown, bool, empty, range, beyond, num, band] = answers;
    expect(unknown).toMatchObject({ kind: 'error', code: '#N/A' });
    expect(text(unknown), LEARN_ERRORS).toContain('unknown family \\"PX\\"');
    expect(bool).toMatchObject({ kind: 'error', code: '#VALUE!' });
    expect(bool?.kind === 'error' && bool.message.startsWith('temperature:'), `names the argument: ${text(bool)}`).toBe(true);
    expect(empty?.kind === 'error' && empty.code === '#VALUE!' && empty.message.startsWith('temperature:'), text(empty)).toBe(true);
    expect(range?.kind === 'error' && range.code === '#VALUE!' && range.message.startsWith('to_temperature:'), text(range)).toBe(true);
    expect(beyond?.kind === 'error' && beyond.code === '#N/A' && /beyond 100 years/.test(beyond.message), text(beyond)).toBe(true);
    // #NUM! cannot carry a message in Excel (LEARN_ERRORS); the runtime sends an empty one for a thrown #NUM!.
    expect(num).toEqual({ kind: 'error', code: '#NUM!', message: '' });
    // In a spill, CustomFunctionError.toJSON leaves the message out for #NUM!.
    const row = band?.kind === 'value' ? (band.value as Cell[][])[0] : undefined;
    expect(row?.slice(0, 3)).toEqual([{ error: '#NUM!' }, { error: '#NUM!' }, { error: '#NUM!' }]);
    expect(typeof row?.[3]).toBe('string');
  });

  it('an error value in an input cell, with flag bit 4 (metadata allowErrorForDataTypeAny): #N/A and #NUM! kept, others as #VALUE!', async () => {
    // _transferCustomFunctionError rebuilds an input error as new CustomFunctionError(code): the code
    // travels, any message does not. So the expected Node call gets the bare code too.
    const na = [[['PBT']], [[70], [wireError('#N/A')]], [[8], [16]]];
    const div = [[['PC']], wireError('#DIV/0!'), 1000];
    const num = [[['PC']], wireError('#NUM!'), 1000];
    const grid = [[['PC'], ['PBT']], [[23, wireError('#REF!')]], 1000];
    const node = (args: unknown[]): unknown[] =>
      args.map((a) =>
        Array.isArray(a)
          ? a.map((r: unknown[]) =>
              r.map((c) => (c && typeof c === 'object' && 'code' in c ? foreignError((c as { code: string }).code) : c)),
            )
          : a && typeof a === 'object' && 'code' in a
            ? foreignError((a as { code: string }).code)
            : a,
      );
    const answers = await rt.run([call('EQTIME', na, 4), call('MODULUS', div, 4), call('MODULUS', num, 4), call('GRID', grid, 4)]);
    expectAnswer(answers[0], expected(def('EQTIME'), node(na)), 'EQTIME with #N/A in a range');
    expectAnswer(answers[1], expected(def('MODULUS'), node(div)), 'MODULUS with #DIV/0! as temperature');
    expectAnswer(answers[2], expected(def('MODULUS'), node(num)), 'MODULUS with #NUM! as temperature');
    expectAnswer(answers[3], expected(def('GRID'), node(grid)), 'GRID with #REF! in the temperatures');
    expect(answers[0]).toMatchObject({ kind: 'error', code: '#N/A' });
    expect(text(answers[0])).toContain('temperatures: cell 2: received the error #N/A');
    expect(answers[1]).toMatchObject({ kind: 'error', code: '#VALUE!' });
    expect(text(answers[1])).toContain('#DIV/0!');
    expect(answers[2]).toEqual({ kind: 'error', code: '#NUM!', message: '' });
    expect(answers[3]).toMatchObject({ kind: 'error', code: '#VALUE!' });
    expect(text(answers[3])).toContain('#REF!');
  });

  it('without flag bit 4 the runtime converts nothing: an error object reaches the add-in as sent, which still answers an error', async () => {
    // The metadata does not set allowErrorForDataTypeAny, so Excel does not pass error inputs on (LEARN_ERRORS,
    // "Errors as custom function inputs"); what the cell then shows is Excel's doing, before any message
    // reaches the runtime. Should an error object arrive anyway, the runtime hands it on untouched (only
    // bit 4 triggers _transferCustomFunctionError) and the add-in reads its code.
    expect(metadata.allowErrorForDataTypeAny ?? false, 'the metadata opts out of error inputs').toBe(false);
    expect(metadataFlags(metadata, meta('MODULUS')) & 4).toBe(0);
    const answers = await rt.run([{ id: 'MODULUS', values: [[['PC']], wireError('#N/A'), 1000], flags: 0 }]);
    expect(answers[0]).toMatchObject({ kind: 'error', code: '#N/A' });
    expect(text(answers[0])).toContain('temperature: received the error #N/A');
  });

  it('the fitting functions fetch their chunk by import() from the served dist/ on first call, once, and answer through the runtime', async () => {
    const chunks = readdirSync('dist/fn-chunks').filter((f) => /^fits-.*\.js$/.test(f));
    expect(chunks).toHaveLength(1);
    const lazy = metadata.functions.filter((f) => lazyIds.includes(f.id));
    expect(lazy.map((f) => f.id).sort()).toEqual([...lazyIds].sort());
    const all = await sampleAnswers();
    lazy.forEach((f) =>
      expectAnswer(all[metadata.functions.indexOf(f)], expected(def(f.id), validArgs(def(f.id))), `DERATE.${f.id} (loaded on first call)`),
    );
    // A rejected Promise with a CustomFunctions.Error reaches Excel as that error, message included.
    const [bad] = await rt.run([call('FITCURVES', [[['nothing']]])]);
    expectAnswer(bad, expected(def('FITCURVES'), [[['nothing']]]), 'FITCURVES on a range that is no curve table');
    expect(bad).toMatchObject({ kind: 'error', code: '#VALUE!' });
    expect(rt.fetched.filter((p) => CHUNK.test(p))).toEqual([`/fn-chunks/${chunks[0]}`]);
  });

  it('hands every result back through SetInvocationArrayResults and nothing else', async () => {
    expect(await rt.otherActions()).toEqual([]);
  });
});
