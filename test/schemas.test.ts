/**
 * The built manifest and functions metadata against Microsoft's published schemas, offline (vendored in
 * vendor/office-schemas/, provenance in its README): dist/manifest.xml against the manifest XSD set with xmllint,
 * dist/functions.json against the 2019 custom-functions JSON schema with ajv, plus the documented limits that file
 * lacks and our allow-list of what the metadata may declare. Every check is shown to refuse a deliberately broken
 * input, so none can pass silently.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { generateCustomFunctionsMetadata } from 'custom-functions-metadata';
import { describe, expect, it } from 'vitest';
import { DEV_ORIGIN, manifestProblems } from '../scripts/build/40-manifest.mjs';
import { functionsMetadata } from '../scripts/build/20-functions.mjs';
import { functionFiles } from '../scripts/functions-files.mjs';
import { rebaseManifest } from '../scripts/manifest-check.mjs';
import {
  hasXmllint,
  manifestXsdProblems,
  METADATA_ALLOWED,
  METADATA_LIMITS,
  metadataProblems,
  SCHEMA_DIR,
  withoutGeneratorDefaults,
} from '../scripts/office-schemas.mjs';

const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
const SOURCE = readFileSync('manifest/manifest.xml', 'utf8');

/**
 * The vendored files as copied (vendor/office-schemas/README.md). A changed hash means someone edited a schema:
 * re-read the README's provenance and repairs, then update the hash on purpose.
 */
const VENDORED: Record<string, string> = {
  'custom-functions.schema.json': 'de27c34762abffab757883fecd66061bc97e6f0023eb6f1c6b9595bf148f2578',
  'manifest-xsd/ContentAppVersionOverridesV1_0.xsd': '029212aa3d71769f93fef8e46990998ecd6fba6de3133eb49f52c93b45c7fa2b',
  'manifest-xsd/MailAppVersionOverridesV1_0.xsd': 'c7bf751520389a29960cc0a608a6ccbee9b4db3a9f4ace8b5223616006efb19a',
  'manifest-xsd/MailAppVersionOverridesV1_1.xsd': '24cca25a65e2a81b7311d11f4174a04a66d20298bb0995108d71cf50f6659831',
  'manifest-xsd/OfficeAppBasicTypesV1_0.xsd': '17c4181cac1aac064ea4ea92f769ced6d564a055044c8ddddd18a6b06cf2d48b',
  'manifest-xsd/OfficeAppManifestV1_1.xsd': '1473bf27a46327c5a3a2df3715d321eaaaf649e6bc426234f3f1512f0206f6a7',
  'manifest-xsd/TaskPaneAppVersionOverridesV1_0.xsd': '2290eada97fbbd7d71028b8b0b3b878ee31305ef9b52e506ee6313b46df4eea0',
};

describe('vendored schemas', () => {
  it('are the files described in vendor/office-schemas/README.md, unedited since', () => {
    for (const [file, sha] of Object.entries(VENDORED)) {
      expect(
        createHash('sha256')
          .update(readFileSync(`${SCHEMA_DIR}${file}`))
          .digest('hex'),
        file,
      ).toBe(sha);
    }
    const readme = readFileSync(`${SCHEMA_DIR}README.md`, 'utf8');
    for (const word of ['Source:', 'Mechanical repairs', 'Runtimes', 'allowErrorForDataTypeAny', 'validateSchema'])
      expect(readme).toContain(word);
  });
});

/** One textual change of the manifest source, failing loudly if the anchor is gone (so the case stays real). */
function mutate(from: string, to: string): string {
  expect(SOURCE.includes(from), `anchor not found in manifest/manifest.xml: ${from}`).toBe(true);
  return SOURCE.replace(from, to);
}

describe('manifest against the XSD set (xmllint)', () => {
  it('has xmllint (Debian libxml2-utils; .ci/run installs it)', () => {
    expect(hasXmllint(), 'xmllint is missing: apt-get install libxml2-utils').toBe(true);
  });

  it('accepts dist/manifest.xml, the manifest the build wrote', () => {
    expect(manifestXsdProblems(readFileSync('dist/manifest.xml', 'utf8'), 'dist/manifest.xml')).toEqual([]);
  });

  it('accepts the manifest moved to a deployment origin', () => {
    expect(manifestXsdProblems(rebaseManifest(SOURCE, DEV_ORIGIN, 'https://addins.example.com'))).toEqual([]);
  });

  // Each broken manifest breaks one rule of the XSD set (element names and types as in OfficeAppManifestV1_1.xsd,
  // TaskPaneAppVersionOverridesV1_0.xsd, OfficeAppBasicTypesV1_0.xsd; the Runtime type as vendor/office-schemas/README.md).
  const cases: Array<[string, string, string, RegExp]> = [
    ['a lifetime other than short or long', 'lifetime="long"', 'lifetime="forever"', /Runtime', attribute 'lifetime'/],
    [
      'a CustomFunctions extension point without its Page',
      '            <Page>\n              <SourceLocation resid="Pane.Url"/>\n            </Page>\n',
      '',
      /Metadata': This element is not expected/,
    ],
    ['a 33-character resid', '<Runtime resid="Pane.Url"', `<Runtime resid="${'R'.repeat(33)}"`, /attribute 'resid': \[facet 'maxLength'\]/],
    [
      'elements out of their schema order',
      '  <ProviderName>Resin Derate</ProviderName>\n  <DefaultLocale>en-US</DefaultLocale>',
      '  <DefaultLocale>en-US</DefaultLocale>\n  <ProviderName>Resin Derate</ProviderName>',
      /DefaultLocale': This element is not expected/,
    ],
    [
      'an element the schema does not know',
      '<Host Name="Workbook"/>',
      '<Host Name="Workbook"/><Spreadsheet/>',
      /Spreadsheet': This element is not expected/,
    ],
    [
      'an attribute the schema does not know',
      '<AllFormFactors>',
      '<AllFormFactors hidden="true">',
      /attribute 'hidden': The attribute 'hidden' is not allowed/,
    ],
    ['a five-part Version', '<Version>0.1.0.0</Version>', '<Version>0.1.0.0.0</Version>', /Version': \[facet 'pattern'\]/],
    [
      'an unknown permission',
      '<Permissions>ReadWriteDocument</Permissions>',
      '<Permissions>Everything</Permissions>',
      /Permissions': \[facet 'enumeration'\]/,
    ],
    ['an Id that is not a GUID', '<Id>3ffd4b7c-dbca-45f4-82c4-5055849fdf17</Id>', '<Id>resin-derate</Id>', /Id': \[facet 'pattern'\]/],
    [
      'a ShortString over 125 characters',
      '<ProviderName>Resin Derate</ProviderName>',
      `<ProviderName>${'P'.repeat(126)}</ProviderName>`,
      /ProviderName': \[facet 'maxLength'\]/,
    ],
    ['an unknown extension point type', 'xsi:type="CustomFunctions"', 'xsi:type="CustomFunction"', /ExtensionPoint', attribute .*type/],
    [
      'a VersionOverrides in another namespace',
      '<VersionOverrides xmlns="http://schemas.microsoft.com/office/taskpaneappversionoverrides"',
      '<VersionOverrides xmlns="http://schemas.microsoft.com/office/taskpaneappversionoverrides/1.0"',
      /VersionOverrides': This element is not expected/,
    ],
  ];
  it.each(cases)('refuses %s', (_label, from, to, message) => {
    const problems = manifestXsdProblems(mutate(from, to));
    expect(problems.length).toBeGreaterThan(0);
    expect(problems.join('\n')).toMatch(message);
    expect(problems.join('\n')).toMatch(/^manifest\.xml:\d+: /);
  });

  it('is part of the build step: its findings come with our own rules, prefixed XSD', () => {
    const { problems, xsdChecked } = manifestProblems(mutate('lifetime="long"', 'lifetime="forever"'), `${pkg.version}.0`);
    expect(xsdChecked).toBe(true);
    expect(problems.filter((p) => p.startsWith('XSD: manifest/manifest.xml:'))).toHaveLength(1);
    expect(manifestProblems(SOURCE, `${pkg.version}.0`).problems).toEqual([]);
  });
});

interface Metadata {
  [key: string]: unknown;
  functions: Array<Record<string, unknown> & { parameters: Array<Record<string, unknown>> }>;
}

const DIST_METADATA = JSON.parse(readFileSync('dist/functions.json', 'utf8')) as Metadata;

/** A deep copy of dist/functions.json with one change. */
function broken(change: (m: Metadata) => void): Metadata {
  const m = structuredClone(DIST_METADATA);
  change(m);
  return m;
}

function first(m: Metadata): Metadata['functions'][number] {
  const f = m.functions[0];
  if (!f) throw new Error('dist/functions.json lists no function');
  return f;
}

describe('functions metadata against the JSON schema, the documented limits and our allow-list', () => {
  it('accepts dist/functions.json', () => {
    expect(DIST_METADATA.functions.length).toBeGreaterThan(10);
    expect(metadataProblems(DIST_METADATA)).toEqual([]);
  });

  it('declares nothing outside the allow-list: no top-level switch, no function option', () => {
    // Without allowErrorForDataTypeAny Excel passes no error value to a function (Microsoft Learn, "Handle and return
    // errors from your custom function", Errors as custom function inputs); without allowCustomDataForDataTypeAny no
    // data-type object (Microsoft Learn, "Custom functions and data types"). Options change how Excel calls a function.
    expect(Object.keys(DIST_METADATA)).toEqual(['functions']);
    expect(METADATA_ALLOWED.options).toEqual([]);
    for (const f of DIST_METADATA.functions) {
      expect(
        Object.keys(f).filter((k) => !METADATA_ALLOWED.function.includes(k)),
        String(f.id),
      ).toEqual([]);
      expect(f.options, `${String(f.id)} options`).toBeUndefined();
      for (const p of f.parameters)
        expect(
          Object.keys(p).filter((k) => !METADATA_ALLOWED.parameter.includes(k)),
          String(f.id),
        ).toEqual([]);
    }
  });

  it('has the generator switch taken out by the build, not absent by luck', async () => {
    // custom-functions-metadata 2.2.3 writes allowCustomDataForDataTypeAny: true at the top level of every file.
    const raw = await generateCustomFunctionsMetadata(functionFiles());
    expect(JSON.parse(raw.metadataJson).allowCustomDataForDataTypeAny).toBe(true);
    const built = await functionsMetadata();
    expect(Object.keys(built.metadata)).toEqual(['functions']);
    expect(withoutGeneratorDefaults({ allowCustomDataForDataTypeAny: false, functions: [] })).toHaveProperty(
      'allowCustomDataForDataTypeAny',
      false,
    );
  });

  const long = (n: number) => 'D'.repeat(n);
  const cases: Array<[string, (m: Metadata) => void, RegExp]> = [
    [
      'allowCustomDataForDataTypeAny',
      (m) => (m.allowCustomDataForDataTypeAny = true),
      /"allowCustomDataForDataTypeAny", which the add-in does not handle/,
    ],
    [
      'allowErrorForDataTypeAny',
      (m) => (m.allowErrorForDataTypeAny = true),
      /schema: \/ must NOT have additional properties \("allowErrorForDataTypeAny"\)/,
    ],
    [
      'an option the schema knows but we do not handle (volatile)',
      (m) => (first(m).options = { volatile: true }),
      /options: declares "volatile"/,
    ],
    [
      'an option newer than the 2019 schema (capturesCallingObject)',
      (m) => (first(m).options = { capturesCallingObject: true }),
      /schema: \/functions\/0\/options must NOT have additional properties/,
    ],
    ['a repeating parameter', (m) => (first(m).parameters[0] = { ...first(m).parameters[0], repeating: true }), /declares "repeating"/],
    [
      'a parameter dimensionality outside scalar / matrix',
      (m) => (first(m).parameters[0] = { ...first(m).parameters[0], dimensionality: 'vector' }),
      /dimensionality must be equal to one of the allowed values/,
    ],
    [
      'a parameter type outside the four',
      (m) => (first(m).parameters[0] = { ...first(m).parameters[0], type: 'date' }),
      /type must be equal to one of the allowed values/,
    ],
    ['a function without result', (m) => delete first(m).result, /must have required property 'result'/],
    ['a parameter without name', (m) => delete first(m).parameters[0]?.name, /must have required property 'name'/],
    ['an id of 2 characters', (m) => (first(m).id = 'AB'), /id "AB" has 2 characters, not 3 to 64/],
    ['an id of 65 characters', (m) => (first(m).id = long(65)), /has 65 characters, not 3 to 64/],
    ['an id with a lower-case letter', (m) => (first(m).id = 'Modulus'), /may hold only A-Z, 0-9, underscore and period/],
    ['an id starting with a digit', (m) => (first(m).id = '2MODULUS'), /must start with a letter/],
    ['an id used twice', (m) => (first(m).id = String(m.functions[1]?.id)), /is used twice/],
    ['a name of 65 characters', (m) => (first(m).name = long(65)), /name "D+" has 65 characters/],
    [
      `a description over ${METADATA_LIMITS.description} characters`,
      (m) => (first(m).description = long(1025)),
      /description has 1025 characters, over 1024/,
    ],
    [
      `a parameter description over ${METADATA_LIMITS.parameterDescription} characters`,
      (m) => (first(m).parameters[0] = { ...first(m).parameters[0], description: long(513) }),
      /description has 513 characters, over 512/,
    ],
    ['a file over 1 MB', (m) => (m.functions = Array.from({ length: 60 }, () => m.functions).flat()), /bytes, over the 1000000 bytes/],
  ];
  it.each(cases)('refuses %s', (_label, change, message) => {
    const problems = metadataProblems(broken(change));
    expect(problems.join('\n')).toMatch(message);
  });

  it('accepts the limits themselves (3 and 64 characters, 1024 and 512)', () => {
    const edge = broken((m) => {
      first(m).id = 'ABC';
      first(m).name = long(64);
      first(m).description = long(1024);
      first(m).parameters[0] = { ...first(m).parameters[0], description: long(512) };
    });
    expect(metadataProblems(edge)).toEqual([]);
  });

  it('fails the build step, with the problem named, for a function the checks refuse', async () => {
    mkdirSync('test-output', { recursive: true });
    const volatile = 'test-output/volatile-function.ts';
    writeFileSync(
      volatile,
      '/**\n * Recalculates on every change.\n * @customfunction TICK\n * @volatile\n * @returns {number}\n */\nexport function tick(): number {\n  return 1;\n}\n',
    );
    await expect(functionsMetadata([volatile])).rejects.toThrow(/TICK options: declares "volatile", which the add-in does not handle/);
    const wordy = 'test-output/wordy-function.ts';
    writeFileSync(
      wordy,
      `/**\n * ${long(1100)}\n * @customfunction WORDY\n * @param x ${long(600)}\n * @returns {number}\n */\nexport function wordy(x: number): number {\n  return x;\n}\n`,
    );
    await expect(functionsMetadata([wordy])).rejects.toThrow(
      /WORDY: description has 1100 characters, over 1024[^]*WORDY\(x\): description has 600 characters, over 512/,
    );
  });
});
