/**
 * Completeness: the generated metadata and the registry describe the same functions, every function
 * and argument is described with its unit, each exported JSDoc function delegates to its definition,
 * and each function has an example in the README and a test.
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { beforeAll, describe, expect, it } from 'vitest';
import type { FunctionDef } from '../functions/core/define.js';
import { functionsMetadata, type Associate, type MetadataFunction } from '../scripts/build/20-functions.mjs';
import { loadFunctions, type LoadedModule } from './support/functions.js';
import { validArgs } from './support/samples.js';

/** How a description names the unit of each kind of argument. */
const UNIT_WORDS: Record<string, RegExp> = {
  degC: /degC/,
  h: /hours \(h\)|\(h\)/,
  MPa: /MPa/,
  fraction: /fraction/,
  count: /count/,
  symbol: /symbol/,
  Hz: /Hz/,
  table: /table range/,
  names: /[Pp]arameter names/,
};

let metadata: MetadataFunction[] = [];
let associate: Associate[] = [];
let defs: readonly FunctionDef[] = [];
let modules: LoadedModule[] = [];

beforeAll(async () => {
  ({ modules, defs } = await loadFunctions());
  const generated = await functionsMetadata();
  metadata = generated.metadata.functions;
  associate = generated.associate;
});

describe('functions metadata', () => {
  it('lists exactly the defined functions, no metadata without a function', () => {
    expect(metadata.map((f) => f.id).sort()).toEqual(defs.map((d) => d.id).sort());
    expect(new Set(metadata.map((f) => f.id)).size).toBe(metadata.length);
  });

  it('describes every function and every argument, with the unit of each argument', () => {
    for (const f of metadata) {
      expect(f.description?.length ?? 0, f.id).toBeGreaterThan(40);
      // Our rule: short enough for the function tooltip; every answer carries the screening caution.
      expect(f.description?.length ?? 0, f.id).toBeLessThanOrEqual(255);
      if (f.id !== 'FAMILIES' && f.id !== 'PARAMS') expect(f.description, `${f.id} caution`).toMatch(/[Ss]creening estimate/);
      const def = defs.find((d) => d.id === f.id);
      if (!def) throw new Error(`no definition for ${f.id}`);
      expect(
        f.parameters.map((p) => p.name),
        f.id,
      ).toEqual(def.args.map((a) => a.name));
      f.parameters.forEach((p, i) => {
        const spec = def.args[i];
        if (!spec) throw new Error(`${f.id}: no spec for ${p.name}`);
        expect(p.description ?? '', `${f.id}(${p.name})`).toMatch(UNIT_WORDS[spec.unit] ?? /^$/);
        expect(p.optional ?? false, `${f.id}(${p.name}) optional`).toBe(spec.optional);
        expect(p.dimensionality === 'matrix', `${f.id}(${p.name}) takes a range`).toBe(spec.shape === 'matrix');
        if (spec.default !== undefined) {
          const text = typeof spec.default === 'string' ? `default "${spec.default}"` : `default ${spec.default}`;
          expect(p.description ?? '', `${f.id}(${p.name}) states its default`).toContain(text);
        }
      });
    }
  });

  it('declares spills as matrices and scalar results as numbers', () => {
    for (const f of metadata) {
      const def = defs.find((d) => d.id === f.id);
      expect(f.result?.dimensionality === 'matrix', f.id).toBe(def?.result === 'matrix');
      if (def?.result === 'scalar') expect(f.result?.type, f.id).toBe('number');
    }
  });

  it('has each JSDoc function exported and delegating to its definition', () => {
    expect(associate.length).toBe(metadata.length);
    for (const a of associate) {
      const mod = modules.find((m) => m.file === a.sourceFileName);
      const fn = mod?.exports[a.functionName];
      expect(typeof fn, `${a.sourceFileName} ${a.functionName}`).toBe('function');
      const def = defs.find((d) => d.id === a.id);
      if (!def || typeof fn !== 'function') continue;
      const args = validArgs(def);
      expect((fn as (...x: unknown[]) => unknown)(...args), a.id).toEqual(def.invoke(...args));
      expect((fn as (...x: unknown[]) => unknown)(...args.map(() => 'nonsense')), `${a.id} with bad input`).toEqual(
        def.invoke(...args.map(() => 'nonsense')),
      );
    }
  });
});

describe('metadata generator', () => {
  it('runs on the pinned TypeScript 5.9.3', () => {
    const fromTool = createRequire(createRequire(import.meta.url).resolve('custom-functions-metadata'));
    const ts = fromTool('typescript/package.json') as { version: string };
    expect(ts.version).toBe('5.9.3');
  });

  it('fails the build step on a reported error instead of writing partial metadata', async () => {
    mkdirSync('test-output', { recursive: true });
    const bad = 'test-output/bad-function.ts';
    writeFileSync(
      bad,
      '/**\n * Has a type the metadata cannot express.\n * @customfunction BAD\n * @param x A map.\n */\nexport function bad(x: Map<string, number>): number {\n  return x.size;\n}\n',
    );
    await expect(functionsMetadata([bad])).rejects.toThrow(/does not support type "Map"/);
    const undocumented = 'test-output/undocumented-function.ts';
    writeFileSync(undocumented, '/**\n * @customfunction NODOC\n */\nexport function nodoc(x: number): number {\n  return x;\n}\n');
    await expect(functionsMetadata([undocumented])).rejects.toThrow(/NODOC: no description/);
  });
});

describe('documentation and tests for every function', () => {
  const readme = readFileSync('README.md', 'utf8');
  const section = readme.slice(readme.indexOf('## Worksheet functions'));
  const tests = readdirSync('test')
    .filter((f) => f.endsWith('.ts'))
    .map((f) => readFileSync(`test/${f}`, 'utf8'))
    .concat(readFileSync('test/fixtures/formulas.ts', 'utf8'))
    .join('\n');

  it('has a README section with one example per function and the cautions', () => {
    expect(readme).toContain('## Worksheet functions');
    for (const d of defs) expect(section, `README example of DERATE.${d.id}`).toContain(`=DERATE.${d.id}(`);
    expect(section).toMatch(/screening/i);
    expect(section).toMatch(/licensed engineering review/);
  });

  it('keeps every function in the file the table of functions/README.md names', () => {
    const text = readFileSync('functions/README.md', 'utf8');
    const table = new Map<string, string>();
    for (const m of text.matchAll(/^\| `([a-z]+\.ts)` \| ((?:`[A-Z]+`(?:, )?)+)/gm)) {
      for (const id of (m[2] ?? '').matchAll(/`([A-Z]+)`/g)) table.set(id[1] ?? '', `functions/${m[1]}`);
    }
    const actual = new Map(associate.map((a) => [a.id, a.sourceFileName]));
    expect(Object.fromEntries(table)).toEqual(Object.fromEntries(actual));
  });

  it('has a test that calls every function', () => {
    for (const d of defs) expect(tests, `a test of DERATE.${d.id}`).toContain(`DERATE.${d.id}(`);
  });
});
