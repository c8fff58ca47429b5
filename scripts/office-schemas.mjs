// Validation against Microsoft's published schemas, offline: the XML manifest against the manifest XSD set with
// xmllint (Debian libxml2-utils), the custom-functions metadata against the 2019 JSON schema with ajv (draft-04),
// plus the documented limits that 2019 file lacks, plus our allow-list of what the metadata may declare. The
// schemas are vendored in vendor/office-schemas/ (its README says where they come from and what was repaired).
// Used by the build steps (20-functions, 40-manifest) and by test/schemas.test.ts.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const require = createRequire(import.meta.url);
const Ajv = require('ajv-draft-04');

export const SCHEMA_DIR = fileURLToPath(new URL('../vendor/office-schemas/', import.meta.url));
export const MANIFEST_XSD = `${SCHEMA_DIR}manifest-xsd/OfficeAppManifestV1_1.xsd`;
export const METADATA_SCHEMA = `${SCHEMA_DIR}custom-functions.schema.json`;

/**
 * Limits Excel applies to the metadata that the 2019 schema does not state (characters). Minimum 3 and the first
 * character a letter, id characters A-Z 0-9 _ . : Microsoft Learn, "Custom functions naming and localization".
 * Maxima: current documentation as summarised in vendor/office-schemas/README.md. The file size: Excel on Windows
 * refuses a metadata file over 1 MB (reported in OfficeDev/office-js issue 4808, 2024; not in the documentation).
 */
export const METADATA_LIMITS = {
  idMin: 3,
  idMax: 64,
  nameMin: 3,
  nameMax: 64,
  description: 1024,
  parameterDescription: 512,
  fileBytes: 1_000_000,
};

/**
 * What our metadata may declare: every key here is one the add-in handles. Options (functions[].options) are
 * deliberately none: `stream`, `cancelable`, `volatile`, `requiresAddress` and the rest change how Excel calls a
 * function, and functions/host/office.ts handles none of them. `allowCustomDataForDataTypeAny` (written by
 * custom-functions-metadata 2.2.3) would make Excel pass data-type cells (entities, linked data types) as objects,
 * and `allowErrorForDataTypeAny` would make it pass error values, neither of which the argument parsers accept.
 */
export const METADATA_ALLOWED = {
  topLevel: ['functions'],
  function: ['id', 'name', 'description', 'parameters', 'result', 'options'],
  options: [],
  parameter: ['name', 'description', 'type', 'dimensionality', 'optional'],
  result: ['type', 'dimensionality'],
};

/** True when xmllint can be run. */
export function hasXmllint() {
  const run = spawnSync('xmllint', ['--version'], { encoding: 'utf8' });
  return !run.error && run.status === 0;
}

/**
 * Problems xmllint reports for a manifest against the vendored XSD set (empty when it validates). The text goes
 * through stdin, so a manifest never written to disk can be checked; `name` labels the messages. Throws when
 * xmllint is missing, naming the package to install.
 */
export function manifestXsdProblems(text, name = 'manifest.xml') {
  const run = spawnSync('xmllint', ['--noout', '--nonet', '--schema', MANIFEST_XSD, '-'], { input: text, encoding: 'utf8' });
  if (run.error)
    throw new Error(`xmllint is needed to validate the manifest against its XSD: install libxml2-utils (${run.error.message})`);
  if (run.status === 0) return [];
  const lines = run.stderr
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l && !/ fails to validate$/.test(l));
  // xmllint exits 3 or 4 for an invalid document, 5 when the schema itself does not compile.
  if (run.status === 5) return [`the XSD set in ${SCHEMA_DIR} does not compile: ${lines.join('; ')}`];
  return lines.length > 0 ? lines.map((l) => l.replace(/^-:/, `${name}:`)) : [`${name}: xmllint exit ${run.status}`];
}

let compiled;
/** The 2019 schema compiled once. Its own `"required": []` breaks the draft-04 meta-schema, hence validateSchema off. */
function metadataValidator() {
  if (!compiled) {
    const ajv = new Ajv({ allErrors: true, strict: false, validateSchema: false });
    compiled = ajv.compile(JSON.parse(readFileSync(METADATA_SCHEMA, 'utf8')));
  }
  return compiled;
}

function unknownKeys(obj, allowed, where) {
  if (obj === null || typeof obj !== 'object') return [`${where}: not an object`];
  return Object.keys(obj)
    .filter((k) => !allowed.includes(k))
    .map((k) => `${where}: declares "${k}", which the add-in does not handle`);
}

/** Problems of a metadata object against the 2019 JSON schema, the documented limits and our allow-list. */
export function metadataProblems(metadata) {
  const problems = [];
  const validate = metadataValidator();
  if (!validate(metadata)) {
    for (const e of validate.errors ?? []) {
      const extra = e.params && 'additionalProperty' in e.params ? ` ("${e.params.additionalProperty}")` : '';
      problems.push(`schema: ${e.instancePath || '/'} ${e.message}${extra}`);
    }
  }
  const L = METADATA_LIMITS;
  const A = METADATA_ALLOWED;
  problems.push(...unknownKeys(metadata, A.topLevel, 'metadata'));
  const bytes = Buffer.byteLength(JSON.stringify(metadata, null, 2));
  if (bytes > L.fileBytes) problems.push(`metadata: ${bytes} bytes, over the ${L.fileBytes} bytes Excel on Windows loads`);
  const functions = Array.isArray(metadata?.functions) ? metadata.functions : [];
  const ids = new Set();
  for (const [i, f] of functions.entries()) {
    const at = `functions[${i}]${typeof f?.id === 'string' ? ` ${f.id}` : ''}`;
    problems.push(...unknownKeys(f, A.function, at));
    if (f === null || typeof f !== 'object') continue;
    if (f.options !== undefined) problems.push(...unknownKeys(f.options, A.options, `${at} options`));
    if (f.result !== undefined) problems.push(...unknownKeys(f.result, A.result, `${at} result`));
    for (const [key, min, max] of [
      ['id', L.idMin, L.idMax],
      ['name', L.nameMin, L.nameMax],
    ]) {
      const v = f[key];
      if (typeof v !== 'string') continue;
      if (v.length < min || v.length > max) problems.push(`${at}: ${key} "${v}" has ${v.length} characters, not ${min} to ${max}`);
      if (!/^[A-Za-z]/.test(v)) problems.push(`${at}: ${key} "${v}" must start with a letter`);
    }
    if (typeof f.id === 'string') {
      if (!/^[A-Z0-9_.]+$/.test(f.id)) problems.push(`${at}: id "${f.id}" may hold only A-Z, 0-9, underscore and period`);
      if (ids.has(f.id)) problems.push(`${at}: id "${f.id}" is used twice`);
      ids.add(f.id);
    }
    if (typeof f.description === 'string' && f.description.length > L.description)
      problems.push(`${at}: description has ${f.description.length} characters, over ${L.description}`);
    const params = Array.isArray(f.parameters) ? f.parameters : [];
    for (const [j, p] of params.entries()) {
      const pat = `${at}(${typeof p?.name === 'string' ? p.name : `parameter ${j}`})`;
      problems.push(...unknownKeys(p, A.parameter, pat));
      if (typeof p?.description === 'string' && p.description.length > L.parameterDescription)
        problems.push(`${pat}: description has ${p.description.length} characters, over ${L.parameterDescription}`);
    }
  }
  return problems;
}

/**
 * The metadata as Excel should get it: what custom-functions-metadata 2.2.3 always adds and we must not declare
 * (`allowCustomDataForDataTypeAny: true`) taken out. Anything else not allowed stays, for metadataProblems to refuse.
 */
export function withoutGeneratorDefaults(metadata) {
  const { allowCustomDataForDataTypeAny, ...rest } = metadata;
  if (allowCustomDataForDataTypeAny !== undefined && allowCustomDataForDataTypeAny !== true) return metadata;
  return rest;
}
