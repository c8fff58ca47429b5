// Offline check of the add-in's XML manifest, our own, beside the XSD validation of scripts/office-schemas.mjs
// (xmllint against the XSD set vendored in vendor/office-schemas/). It gives messages in our words and holds the
// rules no schema states. It is:
//   1. a strict, namespace-aware well-formedness parse (saxes);
//   2. a content model for the subset of the schema this add-in uses: every element under its right parent, in the
//      schema's order, with its required children and attributes and no unknown ones. Element names, order and
//      bounds follow the Office Add-ins manifest schema v1.1 (OfficeAppManifestV1_1, TaskPaneAppVersionOverridesV1_0,
//      OfficeAppBasicTypesV1_0) and its reference pages, re-stated here as rules of our own;
//   3. our own rules: resource ids resolve and are all used, https URLs on one origin and under the pane page's folder,
//      the shared runtime wired to one page and one task pane, icon files present with the right pixel sizes,
//      namespace DERATE, permission ReadWriteDocument.
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { SaxesParser } from 'saxes';
import { pngSize } from './icons.mjs';

export const NS = {
  app: 'http://schemas.microsoft.com/office/appforoffice/1.1',
  ov: 'http://schemas.microsoft.com/office/taskpaneappversionoverrides',
  bt: 'http://schemas.microsoft.com/office/officeappbasictypes/1.0',
  xsi: 'http://www.w3.org/2001/XMLSchema-instance',
};

/** Limits from the schema's simple types (ShortString, LongString, ReferenceId, URL). */
export const LIMITS = { short: 125, long: 250, resid: 32, url: 2048 };
/** Icon sizes: the schema's ImageResourceReference says 16, 32 and 80 are mandatory, 20, 24, 40, 48, 64 optional. */
export const ICON_SIZES_REQUIRED = [16, 32, 80];
export const ICON_SIZES_ALLOWED = [16, 20, 24, 32, 40, 48, 64, 80];
/** IconUrl 32 x 32 and HighResolutionIconUrl 64 x 64 for task pane add-ins (manifest reference pages). */
export const APP_ICON_SIZES = { IconUrl: 32, HighResolutionIconUrl: 64 };
/** The schema's annotation on image resources: a file should not exceed 100 KB. */
export const MAX_IMAGE_BYTES = 100 * 1024;

const GUID = /^(?:[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12})$/;
const VERSION = /^[0-9]{1,5}(?:\.[0-9]{1,5}){0,3}$/;
const SHORT_VERSION = /^[0-9]{1,5}\.[0-9]{1,5}$/;
const CULTURE =
  /^(?:[a-zA-Z]{2,3}-[a-zA-Z0-9]{3,8}(?:-[a-zA-Z]{2,3})?|[a-zA-Z]{2,3}(?:-[a-zA-Z]{2,3}(?:_tradnl|\.pseudo|-[a-zA-Z]{4,8})?)?)$/;
const PERMISSIONS = ['Restricted', 'ReadDocument', 'ReadAllDocument', 'WriteDocument', 'ReadWriteDocument'];

// ---------------------------------------------------------------------------------------------------------------
// Parsing

/**
 * Parses XML into a small element tree. Throws an Error naming line and column when the text is not well-formed.
 * Attribute keys: plain name for unqualified attributes, "xsi:name" for XML Schema instance attributes, "{uri}name"
 * for any other namespace. Namespace declarations are not kept as attributes.
 */
export function parseXml(text) {
  const parser = new SaxesParser({ xmlns: true, position: true });
  const stack = [];
  let root;
  let doctype = false;
  parser.on('doctype', () => {
    doctype = true;
  });
  parser.on('opentag', (tag) => {
    const attrs = {};
    for (const a of Object.values(tag.attributes)) {
      if (a.uri === 'http://www.w3.org/2000/xmlns/' || a.name === 'xmlns') continue;
      const key = a.uri === '' ? a.local : a.uri === NS.xsi ? `xsi:${a.local}` : `{${a.uri}}${a.local}`;
      attrs[key] = a.value;
    }
    const node = { ns: tag.uri ?? '', name: tag.local ?? tag.name, attrs, children: [], text: '', line: parser.line };
    if (stack.length > 0) stack[stack.length - 1].children.push(node);
    else root = node;
    stack.push(node);
  });
  parser.on('text', (t) => {
    if (stack.length > 0) stack[stack.length - 1].text += t;
  });
  parser.on('cdata', (t) => {
    if (stack.length > 0) stack[stack.length - 1].text += t;
  });
  parser.on('closetag', () => {
    stack.pop();
  });
  parser.write(text).close();
  if (doctype) throw new Error('a DOCTYPE is not allowed in a manifest');
  if (!root) throw new Error('no root element');
  return root;
}

// ---------------------------------------------------------------------------------------------------------------
// Content model

/** Attribute value kinds. Resource references record what they point at so they can be resolved later. */
const A = {
  any: { check: () => null },
  short: { check: (v) => lengthProblem(v, LIMITS.short) },
  long: { check: (v) => lengthProblem(v, LIMITS.long) },
  url: { check: (v) => lengthProblem(v, LIMITS.url), url: true },
  resid: { check: (v) => lengthProblem(v, LIMITS.resid) },
  int: { check: (v) => (/^[0-9]+$/.test(v) ? null : 'must be a whole number') },
  shortVersion: { check: (v) => (SHORT_VERSION.test(v) ? null : 'must look like 1.1') },
  culture: { check: (v) => (CULTURE.test(v) ? null : 'must be a culture name such as en-US') },
  lifetime: { check: (v) => (v === 'short' || v === 'long' ? null : 'must be short or long') },
  ref: (collection) => ({ check: (v) => lengthProblem(v, LIMITS.resid), ref: collection }),
  fixed: (value) => ({ check: (v) => (v === value ? null : `must be ${value}`) }),
};

function lengthProblem(v, max) {
  if (v.length === 0) return 'must not be empty';
  if (v.length > max) return `is ${v.length} characters long; at most ${max} allowed`;
  return null;
}

/** Text content kinds. */
const T = {
  guid: (v) => (GUID.test(v) ? null : 'must be a GUID such as 3ffd4b7c-dbca-45f4-82c4-5055849fdf17'),
  version: (v) => (VERSION.test(v) ? null : 'must be a version of up to four numbers, such as 1.0.0.0'),
  short: (v) => lengthProblem(v, LIMITS.short),
  long: (v) => lengthProblem(v, LIMITS.long),
  culture: (v) => (CULTURE.test(v) ? null : 'must be a culture name such as en-US'),
  permission: (v) => (PERMISSIONS.includes(v) ? null : `must be one of ${PERMISSIONS.join(', ')}`),
};

/** Element spec: ns, name, attrs {name: [kind, required]}, children [[spec, min, max]], text kind, xsi:type. */
function el(ns, name, { attrs = {}, children = [], text, type } = {}) {
  return { ns, name, attrs, children, text, type };
}
const once = (spec) => [spec, 1, 1];
const optional = (spec) => [spec, 0, 1];
const many = (spec, min = 1) => [spec, min, Infinity];
const req = (kind) => [kind, true];
const opt = (kind) => [kind, false];

// Top level (OfficeApp, TaskPaneApp extension).
const localeOverride = (ns, kind) => el(ns, 'Override', { attrs: { Locale: req(A.culture), Value: req(kind) } });
const setting = (ns, name, kind) => el(ns, name, { attrs: { DefaultValue: req(kind) }, children: [many(localeOverride(ns, kind), 0)] });

const appSets = el(NS.app, 'Sets', {
  attrs: { DefaultMinVersion: opt(A.shortVersion) },
  children: [many(el(NS.app, 'Set', { attrs: { Name: req(A.short), MinVersion: opt(A.shortVersion) } }))],
});

// VersionOverrides V1.0 for task pane add-ins.
const urlRef = (name) => el(NS.ov, name, { attrs: { resid: req(A.ref('url')) } });
const shortRef = (name) => el(NS.ov, name, { attrs: { resid: req(A.ref('short')) } });
const longRef = (name) => el(NS.ov, name, { attrs: { resid: req(A.ref('long')) } });
const withSource = (name) => el(NS.ov, name, { children: [once(urlRef('SourceLocation'))] });
const iconList = el(NS.ov, 'Icon', {
  children: [many(el(NS.bt, 'Image', { attrs: { size: req(A.int), resid: req(A.ref('image')) } }))],
});
const supertip = el(NS.ov, 'Supertip', { children: [once(shortRef('Title')), once(longRef('Description'))] });
const showTaskpane = el(NS.ov, 'Action', {
  type: 'ShowTaskpane',
  attrs: { 'xsi:type': req(A.any) },
  children: [optional(el(NS.ov, 'TaskpaneId', { text: T.short })), once(urlRef('SourceLocation')), optional(shortRef('Title'))],
});
const button = el(NS.ov, 'Control', {
  type: 'Button',
  attrs: { 'xsi:type': req(A.any), id: req(A.short) },
  children: [once(shortRef('Label')), once(supertip), once(iconList), once(showTaskpane)],
});
const group = el(NS.ov, 'Group', {
  attrs: { id: req(A.short) },
  children: [once(shortRef('Label')), once(iconList), many(button)],
});
const officeTab = el(NS.ov, 'OfficeTab', { attrs: { id: req(A.short) }, children: [many(group)] });
const primaryCommandSurface = el(NS.ov, 'ExtensionPoint', {
  type: 'PrimaryCommandSurface',
  attrs: { 'xsi:type': req(A.any) },
  children: [many(officeTab)],
});
const customFunctions = el(NS.ov, 'ExtensionPoint', {
  type: 'CustomFunctions',
  attrs: { 'xsi:type': req(A.any) },
  children: [once(withSource('Script')), once(withSource('Page')), optional(withSource('Metadata')), optional(shortRef('Namespace'))],
});
const getStarted = el(NS.ov, 'GetStarted', {
  children: [once(shortRef('Title')), once(longRef('Description')), once(urlRef('LearnMoreUrl'))],
});
const desktopFormFactor = el(NS.ov, 'DesktopFormFactor', {
  children: [optional(getStarted), optional(urlRef('FunctionFile')), many(primaryCommandSurface)],
});
const runtimes = el(NS.ov, 'Runtimes', {
  // The Runtimes reference page: at present only one Runtime may be defined.
  children: [once(el(NS.ov, 'Runtime', { attrs: { resid: req(A.ref('url')), lifetime: opt(A.lifetime) } }))],
});
const workbookHost = el(NS.ov, 'Host', {
  type: 'Workbook',
  attrs: { 'xsi:type': req(A.any) },
  // The shared-runtime guide: Runtimes comes first inside Host, in this order.
  children: [
    optional(runtimes),
    optional(el(NS.ov, 'AllFormFactors', { children: [optional(customFunctions)] })),
    optional(desktopFormFactor),
  ],
});
const resource = (collection, name, kind) => ({
  ...el(NS.bt, name, { attrs: { id: req(A.resid), DefaultValue: req(kind) }, children: [many(localeOverride(NS.bt, kind), 0)] }),
  resource: collection,
});
const resources = el(NS.ov, 'Resources', {
  children: [
    optional(el(NS.bt, 'Images', { children: [many(resource('image', 'Image', A.url), 0)] })),
    optional(el(NS.bt, 'Urls', { children: [many(resource('url', 'Url', A.url), 0)] })),
    optional(el(NS.bt, 'ShortStrings', { children: [many(resource('short', 'String', A.short), 0)] })),
    optional(el(NS.bt, 'LongStrings', { children: [many(resource('long', 'String', A.long), 0)] })),
  ],
});
const versionOverrides = el(NS.ov, 'VersionOverrides', {
  type: 'VersionOverridesV1_0',
  attrs: { 'xsi:type': req(A.any) },
  children: [optional(longRef('Description')), optional(el(NS.ov, 'Hosts', { children: [many(workbookHost)] })), optional(resources)],
});

export const OFFICE_APP = el(NS.app, 'OfficeApp', {
  type: 'TaskPaneApp',
  attrs: { 'xsi:type': req(A.any) },
  children: [
    once(el(NS.app, 'Id', { text: T.guid })),
    once(el(NS.app, 'Version', { text: T.version })),
    once(el(NS.app, 'ProviderName', { text: T.short })),
    once(el(NS.app, 'DefaultLocale', { text: T.culture })),
    once(setting(NS.app, 'DisplayName', A.short)),
    once(setting(NS.app, 'Description', A.long)),
    optional(setting(NS.app, 'IconUrl', A.url)),
    optional(setting(NS.app, 'HighResolutionIconUrl', A.url)),
    optional(setting(NS.app, 'SupportUrl', A.url)),
    optional(el(NS.app, 'AppDomains', { children: [many(el(NS.app, 'AppDomain', { text: T.long }))] })),
    optional(el(NS.app, 'Hosts', { children: [many(el(NS.app, 'Host', { attrs: { Name: req(A.short) } }))] })),
    optional(el(NS.app, 'Requirements', { children: [optional(appSets)] })),
    once(el(NS.app, 'DefaultSettings', { children: [once(setting(NS.app, 'SourceLocation', A.url))] })),
    once(el(NS.app, 'Permissions', { text: T.permission })),
    optional(versionOverrides),
  ],
});

function describe(node) {
  const type = node.attrs['xsi:type'];
  return `<${node.name}${type ? ` xsi:type="${type}"` : ''}> (line ${node.line})`;
}

function matches(spec, node) {
  return spec.ns === node.ns && spec.name === node.name && (spec.type === undefined || node.attrs['xsi:type'] === spec.type);
}

/** Walks the tree against the content model; collects problems, resources, references and URLs. */
function checkStructure(node, spec, path, out) {
  const here = `${path}/${node.name}`;
  if (node.ns !== spec.ns) out.problems.push(`${here} (line ${node.line}) is in namespace "${node.ns}"; expected "${spec.ns}"`);
  if (spec.type !== undefined && node.attrs['xsi:type'] !== spec.type) {
    out.problems.push(`${here} (line ${node.line}) needs xsi:type="${spec.type}", found "${node.attrs['xsi:type'] ?? ''}"`);
  }
  for (const [name, value] of Object.entries(node.attrs)) {
    const rule = spec.attrs[name];
    if (!rule) {
      out.problems.push(`${here} (line ${node.line}) has an unknown attribute ${name}`);
      continue;
    }
    const problem = rule[0].check(value);
    if (problem) out.problems.push(`${here}/@${name} (line ${node.line}) ${problem}`);
    if (rule[0].ref) out.refs.push({ collection: rule[0].ref, id: value, path: here, line: node.line, node });
    if (rule[0].url) out.urls.push({ url: value, path: `${here}/@${name}`, line: node.line });
  }
  for (const [name, rule] of Object.entries(spec.attrs)) {
    if (rule[1] && !(name in node.attrs)) out.problems.push(`${here} (line ${node.line}) is missing the required attribute ${name}`);
  }
  if (spec.resource && node.attrs.id !== undefined)
    out.resources.push({ collection: spec.resource, id: node.attrs.id, value: node.attrs.DefaultValue ?? '', line: node.line });
  const text = node.text.trim();
  if (spec.text) {
    const problem = spec.text(text);
    if (problem) out.problems.push(`${here} (line ${node.line}) ${problem}`);
  } else if (text !== '') {
    out.problems.push(`${here} (line ${node.line}) must not contain text`);
  }
  // Sequence: children must follow the spec's order; skipped entries must be optional.
  const counts = spec.children.map(() => 0);
  let j = 0;
  for (const child of node.children) {
    let k = j;
    while (k < spec.children.length && !matches(spec.children[k][0], child)) k++;
    if (k === spec.children.length) {
      const known = spec.children.some(([s]) => matches(s, child));
      out.problems.push(
        known
          ? `${describe(child)} is out of order inside ${here}: expected ${spec.children.map(([s]) => s.name).join(', ')} in that order`
          : `${describe(child)} is not allowed inside ${here}`,
      );
      continue;
    }
    for (let s = j; s < k; s++) {
      if (counts[s] < spec.children[s][1])
        out.problems.push(`${here} (line ${node.line}) is missing <${spec.children[s][0].name}> before ${describe(child)}`);
    }
    j = k;
    counts[k]++;
    if (counts[k] > spec.children[k][2])
      out.problems.push(`${describe(child)} appears more than ${spec.children[k][2]} time(s) inside ${here}`);
    checkStructure(child, spec.children[k][0], here, out);
  }
  for (let s = j; s < spec.children.length; s++) {
    if (counts[s] < spec.children[s][1])
      out.problems.push(`${here} (line ${node.line}) is missing the required <${spec.children[s][0].name}>`);
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Our own rules

function find(node, ...names) {
  let current = [node];
  for (const name of names) current = current.flatMap((n) => n.children.filter((c) => c.name === name));
  return current;
}

function all(node, predicate, acc = []) {
  if (predicate(node)) acc.push(node);
  for (const c of node.children) all(c, predicate, acc);
  return acc;
}

/**
 * Checks a manifest text. Options:
 *   iconDir            folder holding the files the manifest's /icons/ URLs name (required for the icon checks)
 *   namespace          expected custom functions namespace (default DERATE)
 *   permission         expected permission (default ReadWriteDocument)
 *   version            expected Version text, if any
 *   contract           expected URL paths {page, script, metadata} below the pane page's folder (defaults /taskpane.html,
 *                      /functions.js, /functions.json: with the pane at https://host/addin/taskpane.html, the script must
 *                      be https://host/addin/functions.js)
 * Returns { problems: string[], summary } where summary lists what was found.
 */
export function checkManifest(text, options = {}) {
  const namespace = options.namespace ?? 'DERATE';
  const permission = options.permission ?? 'ReadWriteDocument';
  const contract = { page: '/taskpane.html', script: '/functions.js', metadata: '/functions.json', ...(options.contract ?? {}) };
  let root;
  try {
    root = parseXml(text);
  } catch (error) {
    return { problems: [`not well-formed XML: ${error instanceof Error ? error.message : String(error)}`], summary: undefined };
  }
  const out = { problems: [], refs: [], resources: [], urls: [] };
  if (root.ns !== NS.app || root.name !== 'OfficeApp') {
    return { problems: [`the root element must be <OfficeApp> in namespace ${NS.app}`], summary: undefined };
  }
  checkStructure(root, OFFICE_APP, '', out);
  const problems = out.problems;

  // Resources: unique ids, every reference resolves into the right collection, nothing unused.
  const byId = new Map();
  for (const r of out.resources) {
    if (byId.has(r.id)) problems.push(`resource id "${r.id}" (line ${r.line}) is defined twice`);
    byId.set(r.id, r);
  }
  const used = new Set();
  for (const ref of out.refs) {
    const r = byId.get(ref.id);
    if (!r) problems.push(`${ref.path} (line ${ref.line}) refers to resid "${ref.id}", which no resource defines`);
    else if (r.collection !== ref.collection)
      problems.push(`${ref.path} (line ${ref.line}) needs a ${ref.collection} resource; "${ref.id}" is a ${r.collection} resource`);
    used.add(ref.id);
  }
  for (const r of out.resources) if (!used.has(r.id)) problems.push(`resource "${r.id}" (line ${r.line}) is never used`);
  const value = (id) => byId.get(id)?.value;

  // URLs: https, absolute, one origin (the pane's) and under the pane page's folder (a deployment may serve the add-in
  // from a path such as https://host/resin-derate/), no path tricks.
  const pane = find(root, 'DefaultSettings', 'SourceLocation')[0]?.attrs.DefaultValue;
  let origin;
  let folder;
  try {
    const url = pane ? new URL(pane) : undefined;
    origin = url?.origin;
    folder = url ? new URL('./', url).href : undefined;
  } catch {
    origin = undefined;
  }
  for (const u of out.urls) {
    let parsed;
    try {
      parsed = new URL(u.url);
    } catch {
      problems.push(`${u.path} (line ${u.line}) is not an absolute URL: "${u.url}"`);
      continue;
    }
    if (parsed.protocol !== 'https:') problems.push(`${u.path} (line ${u.line}) must use https: "${u.url}"`);
    if (origin && parsed.origin !== origin)
      problems.push(`${u.path} (line ${u.line}) is on ${parsed.origin}; every URL must be on the pane's origin ${origin}`);
    else if (folder && !parsed.href.startsWith(folder))
      problems.push(`${u.path} (line ${u.line}) is outside the pane page's folder ${folder}: "${u.url}"`);
    if (u.url.includes('..') || parsed.search || parsed.hash || parsed.username)
      problems.push(`${u.path} (line ${u.line}) must be a plain file URL: "${u.url}"`);
  }
  /** The URL's path below the pane page's folder, as "/name" (the form of the contract), or undefined outside it. */
  const pathOf = (url) => {
    try {
      const href = new URL(url ?? '').href;
      return folder && href.startsWith(folder) ? `/${href.slice(folder.length)}` : undefined;
    } catch {
      return undefined;
    }
  };

  // Hosts and requirements.
  const hostNames = find(root, 'Hosts', 'Host').map((h) => h.attrs.Name);
  if (hostNames.length !== 1 || hostNames[0] !== 'Workbook')
    problems.push(`<Hosts> must list exactly Workbook (Excel); found ${hostNames.join(', ') || 'nothing'}`);
  const sets = find(root, 'Requirements', 'Sets', 'Set');
  const shared = sets.find((s) => s.attrs.Name === 'SharedRuntime');
  if (!shared || (shared.attrs.MinVersion ?? find(root, 'Requirements', 'Sets')[0]?.attrs.DefaultMinVersion) !== '1.1') {
    problems.push('<Requirements> must ask for the SharedRuntime 1.1 requirement set');
  }
  const perm = find(root, 'Permissions')[0]?.text.trim();
  if (perm !== permission) problems.push(`<Permissions> must be ${permission} (the least the pane needs); found ${perm ?? 'nothing'}`);
  if (options.version !== undefined) {
    const v = find(root, 'Version')[0]?.text.trim();
    if (v !== options.version) problems.push(`<Version> is ${v}; expected ${options.version} (package.json version)`);
  }

  // Shared runtime: one long-lived runtime on the pane page; the functions page, function file and button use it.
  const host = find(root, 'VersionOverrides', 'Hosts', 'Host')[0];
  const runtime = host ? find(host, 'Runtimes', 'Runtime')[0] : undefined;
  const cf = host ? find(host, 'AllFormFactors', 'ExtensionPoint')[0] : undefined;
  if (!runtime) problems.push('the Workbook host must declare <Runtimes><Runtime .../></Runtimes> (shared runtime)');
  if (!cf) problems.push('the Workbook host must declare the CustomFunctions extension point');
  if (runtime && cf) {
    if (runtime.attrs.lifetime !== 'long') problems.push('<Runtime> must have lifetime="long" for a shared runtime');
    const rid = runtime.attrs.resid;
    const wired = [
      ['custom functions <Page>', find(cf, 'Page', 'SourceLocation')[0]],
      ['<FunctionFile>', find(host, 'DesktopFormFactor', 'FunctionFile')[0]],
      ...all(host, (n) => n.name === 'Action').map((a) => ['the button action <SourceLocation>', find(a, 'SourceLocation')[0]]),
    ];
    for (const [what, n] of wired) {
      if (!n) problems.push(`${what} is missing; the shared runtime needs it to use resid "${rid}"`);
      else if (n.attrs.resid !== rid)
        problems.push(`${what} (line ${n.line}) uses resid "${n.attrs.resid}"; the shared runtime needs "${rid}" everywhere`);
    }
    if (value(rid) !== pane) problems.push(`the runtime page ${value(rid)} differs from <DefaultSettings> ${pane}`);
    const files = {
      page: pathOf(value(find(cf, 'Page', 'SourceLocation')[0]?.attrs.resid)),
      script: pathOf(value(find(cf, 'Script', 'SourceLocation')[0]?.attrs.resid)),
      metadata: pathOf(value(find(cf, 'Metadata', 'SourceLocation')[0]?.attrs.resid)),
    };
    for (const key of ['page', 'script', 'metadata']) {
      if (files[key] !== contract[key]) problems.push(`the custom functions ${key} is ${files[key]}; the build produces ${contract[key]}`);
    }
    const nsId = find(cf, 'Namespace')[0]?.attrs.resid;
    if (value(nsId) !== namespace) problems.push(`the custom functions namespace is ${value(nsId) ?? 'missing'}; expected ${namespace}`);
  }
  // "A shared runtime only supports the use of one task pane. Note that any task pane without a <TaskpaneID> is
  // considered a different task pane." (Microsoft Learn, "Configure your Office Add-in to use a shared runtime",
  // Multiple task panes.) So one ShowTaskpane action, on the runtime's page, with no TaskpaneId of its own: the pane it
  // opens is the one Office.addin.showAsTaskpane() shows, not a second container named by an id.
  const panes = all(root, (n) => n.name === 'Action' && n.attrs['xsi:type'] === 'ShowTaskpane');
  if (panes.length !== 1)
    problems.push(`the add-in must have exactly one ShowTaskpane action (a shared runtime supports one task pane); found ${panes.length}`);
  for (const n of all(root, (x) => x.name === 'TaskpaneId'))
    problems.push(`<TaskpaneId> (line ${n.line}) must go: the one task pane of the shared runtime is opened without an id`);
  const ids = all(root, (n) => n.ns === NS.ov && (n.name === 'Group' || n.name === 'Control')).map((n) => n.attrs.id);
  if (new Set(ids).size !== ids.length) problems.push(`group and control ids must be unique: ${ids.join(', ')}`);

  // Icons: the required sizes in every icon list, each resolving to a PNG of exactly that size.
  const iconFile = (url) => {
    const path = pathOf(url);
    const m = path ? /^\/icons\/([A-Za-z0-9_-]+\.png)$/.exec(path) : null;
    return m ? m[1] : undefined;
  };
  const checkIcon = (url, size, where) => {
    const name = iconFile(url);
    if (!name) {
      problems.push(`${where}: ${url} must be a PNG under /icons/`);
      return;
    }
    if (!options.iconDir) return;
    const file = join(options.iconDir, name);
    if (!existsSync(file)) {
      problems.push(`${where}: ${file} does not exist`);
      return;
    }
    const bytes = readFileSync(file);
    if (statSync(file).size > MAX_IMAGE_BYTES) problems.push(`${where}: ${file} is larger than 100 KB`);
    try {
      const dims = pngSize(bytes);
      if (dims.width !== size || dims.height !== size)
        problems.push(`${where}: ${file} is ${dims.width} x ${dims.height} px; expected ${size} x ${size}`);
    } catch (error) {
      problems.push(`${where}: ${file}: ${error instanceof Error ? error.message : String(error)}`);
    }
  };
  for (const list of all(root, (n) => n.ns === NS.ov && n.name === 'Icon')) {
    const sizes = list.children.map((i) => Number(i.attrs.size));
    for (const s of ICON_SIZES_REQUIRED) {
      if (sizes.filter((x) => x === s).length !== 1) problems.push(`<Icon> (line ${list.line}) needs exactly one image of size ${s}`);
    }
    for (const image of list.children) {
      const size = Number(image.attrs.size);
      if (!ICON_SIZES_ALLOWED.includes(size))
        problems.push(`<bt:Image> (line ${image.line}) has size ${image.attrs.size}; allowed ${ICON_SIZES_ALLOWED.join(', ')}`);
      const url = value(image.attrs.resid);
      if (url) checkIcon(url, size, `icon ${image.attrs.resid} (line ${image.line})`);
    }
  }
  for (const [name, size] of Object.entries(APP_ICON_SIZES)) {
    const n = find(root, name)[0];
    if (!n) problems.push(`<${name}> is missing`);
    else checkIcon(n.attrs.DefaultValue, size, `<${name}> (line ${n.line})`);
  }
  if (!find(root, 'SupportUrl')[0]) problems.push('<SupportUrl> is missing');

  const summary = {
    id: find(root, 'Id')[0]?.text.trim(),
    version: find(root, 'Version')[0]?.text.trim(),
    origin,
    namespace: runtime && cf ? value(find(cf, 'Namespace')[0]?.attrs.resid) : undefined,
    permission: perm,
    urls: [...new Set(out.urls.map((u) => u.url))].sort(),
  };
  return { problems, summary };
}

/**
 * The add-in's base URL (the folder its files are served from) from what a person typed: https only, no query,
 * fragment or credentials; a missing final slash is added. Throws an Error saying what was wrong.
 */
export function addinBase(text) {
  let url;
  try {
    url = new URL(text);
  } catch {
    throw new Error(`the add-in base URL must be an https URL such as https://addins.example.com/resin-derate/; got "${text}"`);
  }
  if (url.protocol !== 'https:')
    throw new Error(`the add-in base URL must use https (Office loads add-in pages over https only); got "${text}"`);
  if (url.search || url.hash || url.username || url.password || text.includes('?') || text.includes('#'))
    throw new Error(`the add-in base URL must be a plain folder URL, without query, fragment or user name; got "${text}"`);
  return url.href.endsWith('/') ? url.href : `${url.href}/`;
}

/** Replaces the development origin in every URL of the manifest text with the add-in's base URL (for a deployment). */
export function rebaseManifest(text, fromOrigin, toBase) {
  return text.split(`"${fromOrigin}/`).join(`"${addinBase(toBase)}`);
}
