import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { checkManifest, parseXml, rebaseManifest } from '../scripts/manifest-check.mjs';

const MANIFEST = readFileSync('manifest/manifest.xml', 'utf8');
/** The ribbon button, to make a manifest with two. */
const CONTROL = /[ ]*<Control xsi:type="Button"[\s\S]*?<\/Control>\n/.exec(MANIFEST)?.[0] ?? '';
const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
const OPTIONS = { iconDir: 'manifest/icons', version: `${pkg.version}.0` };

function problemsOf(text: string): string[] {
  return checkManifest(text, OPTIONS).problems;
}

/** Applies one textual change, failing loudly if the anchor text is not in the manifest (so the case stays real). */
function mutate(from: string, to: string): string {
  expect(MANIFEST.includes(from), `anchor not found: ${from}`).toBe(true);
  return MANIFEST.replace(from, to);
}

describe('manifest/manifest.xml', () => {
  it('is well-formed and passes every structural rule and our own rules', () => {
    expect(problemsOf(MANIFEST)).toEqual([]);
  });

  it('declares what the add-in needs', () => {
    const { summary } = checkManifest(MANIFEST, OPTIONS);
    expect(summary?.namespace).toBe('DERATE');
    expect(summary?.permission).toBe('ReadWriteDocument');
    expect(summary?.origin).toBe('https://localhost:3000');
    expect(summary?.version).toBe(`${pkg.version}.0`);
    // The add-in's identity: Office keys installed copies and their settings on this id, so it never changes.
    expect(summary?.id).toBe('3ffd4b7c-dbca-45f4-82c4-5055849fdf17');
    expect(summary?.urls).toEqual(
      expect.arrayContaining([
        'https://localhost:3000/taskpane.html',
        'https://localhost:3000/functions.js',
        'https://localhost:3000/functions.json',
        'https://localhost:3000/icons/icon-16.png',
        'https://localhost:3000/icons/icon-32.png',
        'https://localhost:3000/icons/icon-80.png',
      ]),
    );
  });

  it('puts the provider and a ribbon button of our own in place', () => {
    const root = parseXml(MANIFEST);
    const texts: string[] = [];
    const walk = (n: ReturnType<typeof parseXml>) => {
      texts.push(`${n.name}=${n.text.trim()}|${n.attrs.DefaultValue ?? ''}|${n.attrs.id ?? ''}`);
      n.children.forEach(walk);
    };
    walk(root);
    expect(texts).toContain('ProviderName=Resin Derate||');
    expect(texts).toContain('OfficeTab=||TabHome');
    expect(texts.some((t) => t.startsWith('String=|Derating Pane|'))).toBe(true);
  });
});

describe('the manifest check catches', () => {
  const cases: Array<[string, string, string, RegExp]> = [
    ['a document that is not well-formed', '</Hosts>\n  <Requirements>', '<Requirements>', /not well-formed XML/],
    ['a DOCTYPE', '<?xml version="1.0" encoding="UTF-8"?>', '<?xml version="1.0" encoding="UTF-8"?><!DOCTYPE OfficeApp>', /DOCTYPE/],
    [
      'elements out of order',
      '  <ProviderName>Resin Derate</ProviderName>\n  <DefaultLocale>en-US</DefaultLocale>',
      '  <DefaultLocale>en-US</DefaultLocale>\n  <ProviderName>Resin Derate</ProviderName>',
      /out of order/,
    ],
    ['a missing required element', '  <Permissions>ReadWriteDocument</Permissions>\n', '', /missing (the required )?<Permissions>/],
    [
      'a broader permission than needed',
      '<Permissions>ReadWriteDocument</Permissions>',
      '<Permissions>ReadAllDocument</Permissions>',
      /must be ReadWriteDocument/,
    ],
    ['an unknown permission', '<Permissions>ReadWriteDocument</Permissions>', '<Permissions>Everything</Permissions>', /must be one of/],
    ['an Id that is not a GUID', '<Id>3ffd4b7c-dbca-45f4-82c4-5055849fdf17</Id>', '<Id>resin-derate</Id>', /must be a GUID/],
    ['a Version that drifted from package.json', '<Version>0.1.0.0</Version>', '<Version>0.9.0.0</Version>', /package.json version/],
    [
      'a plain-http URL',
      'DefaultValue="https://localhost:3000/support.html"/>\n  <Hosts>',
      'DefaultValue="http://localhost:3000/support.html"/>\n  <Hosts>',
      /must use https/,
    ],
    [
      'a URL on another origin',
      '<bt:Url id="Support.Url" DefaultValue="https://localhost:3000/support.html"/>',
      '<bt:Url id="Support.Url" DefaultValue="https://help.example.com/support.html"/>',
      /pane's origin/,
    ],
    ['a resid that resolves to nothing', '<Label resid="Group.Label"/>', '<Label resid="Group.Lable"/>', /no resource defines/],
    ['a resid of the wrong kind', '<Label resid="Group.Label"/>', '<Label resid="Pane.Url"/>', /needs a short resource/],
    ['a resid longer than 32 characters', 'id="Welcome.Title"', 'id="Welcome.Title.That.Is.Far.Too.Long.For.Office"', /at most 32/],
    ['a label longer than 125 characters', 'DefaultValue="Derating Pane"', `DefaultValue="${'x'.repeat(126)}"`, /at most 125/],
    [
      'a resource that is never used',
      '</bt:ShortStrings>',
      '  <bt:String id="Spare" DefaultValue="spare"/>\n      </bt:ShortStrings>',
      /never used/,
    ],
    [
      'a resource id defined twice',
      '</bt:ShortStrings>',
      '  <bt:String id="Group.Label" DefaultValue="again"/>\n      </bt:ShortStrings>',
      /defined twice/,
    ],
    [
      'the wrong functions namespace',
      '<bt:String id="Functions.Namespace" DefaultValue="DERATE"/>',
      '<bt:String id="Functions.Namespace" DefaultValue="RESIN"/>',
      /expected DERATE/,
    ],
    ['a short-lived runtime', 'lifetime="long"', 'lifetime="short"', /lifetime="long"/],
    [
      'a functions page outside the shared runtime',
      '<Page>\n              <SourceLocation resid="Pane.Url"/>',
      '<Page>\n              <SourceLocation resid="Support.Url"/>',
      /shared runtime needs "Pane.Url"/,
    ],
    [
      'a functions script the build does not produce',
      'DefaultValue="https://localhost:3000/functions.js"',
      'DefaultValue="https://localhost:3000/custom.js"',
      /the build produces \/functions.js/,
    ],
    [
      'a missing shared-runtime requirement',
      '<Set Name="SharedRuntime" MinVersion="1.1"/>',
      '<Set Name="ExcelApi" MinVersion="1.1"/>',
      /SharedRuntime 1.1/,
    ],
    [
      'an element the schema does not allow there',
      '<Label resid="Group.Label"/>',
      '<Label resid="Group.Label"/><Colour>teal</Colour>',
      /not allowed inside/,
    ],
    [
      'an element in the wrong namespace',
      '<bt:Image size="16" resid="Icon.16"/>\n                  <bt:Image size="32"',
      '<Image size="16" resid="Icon.16"/>\n                  <bt:Image size="32"',
      /not allowed inside/,
    ],
    [
      'an unknown attribute',
      '<Runtime resid="Pane.Url" lifetime="long"/>',
      '<Runtime resid="Pane.Url" lifetime="long" colour="teal"/>',
      /unknown attribute colour/,
    ],
    [
      'an icon list without the 80 px size',
      '<bt:Image size="80" resid="Icon.80"/>\n                </Icon>',
      '</Icon>',
      /exactly one image of size 80/,
    ],
    [
      'an icon size the schema does not know',
      '<bt:Image size="16" resid="Icon.16"/>',
      '<bt:Image size="16" resid="Icon.16"/><bt:Image size="17" resid="Icon.16"/>',
      /size 17; allowed/,
    ],
    [
      'an icon file of the wrong pixel size',
      'DefaultValue="https://localhost:3000/icons/icon-80.png"',
      'DefaultValue="https://localhost:3000/icons/icon-64.png"',
      /64 x 64 px; expected 80 x 80/,
    ],
    [
      'an icon file that does not exist',
      'DefaultValue="https://localhost:3000/icons/icon-16.png"',
      'DefaultValue="https://localhost:3000/icons/icon-15.png"',
      /does not exist/,
    ],
    // Microsoft Learn, "Configure your Office Add-in to use a shared runtime", Multiple task panes: one task pane only.
    [
      "a TaskpaneId naming a pane apart from the shared runtime's one",
      '<Action xsi:type="ShowTaskpane">\n',
      '<Action xsi:type="ShowTaskpane">\n                    <TaskpaneId>ResinDerate.Pane</TaskpaneId>\n',
      /<TaskpaneId> \(line \d+\) must go/,
    ],
    [
      'a second task pane button',
      '</Control>\n',
      '</Control>\n' + CONTROL.replace('id="ResinDerate.OpenPane"', 'id="ResinDerate.OpenPane2"'),
      /exactly one ShowTaskpane action.*found 2/,
    ],
  ];
  it("a URL on the pane's origin but outside the pane page's folder", () => {
    const moved = rebaseManifest(MANIFEST, 'https://localhost:3000', 'https://addins.example.com/resin-derate/').replace(
      'https://addins.example.com/resin-derate/support.html',
      'https://addins.example.com/support.html',
    );
    expect(problemsOf(moved).join('\n')).toMatch(/SupportUrl.*outside the pane page's folder https:\/\/addins.example.com\/resin-derate\//);
  });
  for (const [what, from, to, expected] of cases) {
    it(what, () => {
      const problems = problemsOf(mutate(from, to));
      expect(problems.join('\n')).toMatch(expected);
    });
  }
});

describe('deployment base URL', () => {
  it('moves every URL to the given https origin and still passes', () => {
    const moved = rebaseManifest(MANIFEST, 'https://localhost:3000', 'https://addins.example.com');
    const { problems, summary } = checkManifest(moved, OPTIONS);
    expect(problems).toEqual([]);
    expect(summary?.urls.every((u) => u.startsWith('https://addins.example.com/'))).toBe(true);
    expect(moved).not.toContain('"https://localhost');
  });
  it('moves every URL below a folder of the host, with or without the final slash', () => {
    for (const base of ['https://addins.example.com/resin-derate/', 'https://addins.example.com/resin-derate']) {
      const { problems, summary } = checkManifest(rebaseManifest(MANIFEST, 'https://localhost:3000', base), OPTIONS);
      expect(problems).toEqual([]);
      expect(summary?.urls.every((u) => u.startsWith('https://addins.example.com/resin-derate/'))).toBe(true);
      expect(summary?.urls).toContain('https://addins.example.com/resin-derate/functions.js');
    }
  });
  it('refuses http, a query, a fragment or a user name', () => {
    expect(() => rebaseManifest(MANIFEST, 'https://localhost:3000', 'http://addins.example.com')).toThrow(/must use https/);
    expect(() => rebaseManifest(MANIFEST, 'https://localhost:3000', 'addins.example.com')).toThrow(/must be an https URL/);
    for (const bad of ['https://example.com/addin/?v=2', 'https://example.com/addin/#x', 'https://me@example.com/addin/'])
      expect(() => rebaseManifest(MANIFEST, 'https://localhost:3000', bad)).toThrow(/plain folder URL/);
  });
});

describe('build step 40-manifest', () => {
  beforeAll(() => {
    const run = spawnSync(
      process.execPath,
      ['--input-type=module', '-e', "await (await import('./scripts/build/40-manifest.mjs')).default()"],
      {
        encoding: 'utf8',
      },
    );
    expect(run.status, run.stderr).toBe(0);
  });
  it('copies the checked manifest, the icons and the support page into dist/', () => {
    expect(readFileSync('dist/manifest.xml', 'utf8')).toBe(MANIFEST);
    for (const size of [16, 32, 64, 80, 128]) {
      expect(readFileSync(`dist/icons/icon-${size}.png`).equals(readFileSync(`manifest/icons/icon-${size}.png`))).toBe(true);
    }
    expect(existsSync('dist/support.html')).toBe(true);
  });
  it('leaves no manifest URL pointing at a file missing from dist/', () => {
    // taskpane.html, functions.js and functions.json come from the pane and functions builds; on a branch without
    // those builds they are absent, everything else must be there.
    const fromOtherBuilds = ['/taskpane.html', '/functions.js', '/functions.json'];
    const { summary } = checkManifest(readFileSync('dist/manifest.xml', 'utf8'), OPTIONS);
    const missing = (summary?.urls ?? []).map((u) => new URL(u).pathname).filter((p) => !existsSync(`dist${p}`));
    expect(missing.filter((p) => !fromOtherBuilds.includes(p))).toEqual([]);
    expect(summary?.urls.length).toBeGreaterThanOrEqual(8);
  });
  it('fails the build for a bad deployment origin', () => {
    const run = spawnSync(
      process.execPath,
      ['--input-type=module', '-e', "await (await import('./scripts/build/40-manifest.mjs')).default()"],
      {
        encoding: 'utf8',
        env: { ...process.env, RESIN_DERATE_ORIGIN: 'http://addins.example.com' },
      },
    );
    expect(run.status).not.toBe(0);
    expect(run.stderr).toMatch(/must use https/);
  });
});
