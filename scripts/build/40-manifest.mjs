// The add-in manifest, its icons and the support page, checked and copied into dist/. Two checks, both fatal:
// our own rules (scripts/manifest-check.mjs) and Microsoft's manifest XSD set through xmllint
// (scripts/office-schemas.mjs); without xmllint the XSD check is skipped here, loudly, and test/schemas.test.ts fails.
// RESIN_DERATE_ORIGIN=https://addins.example.com moves every manifest URL from the development server to that origin.
import { copyFileSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { checkManifest, rebaseManifest } from '../manifest-check.mjs';
import { hasXmllint, manifestXsdProblems } from '../office-schemas.mjs';

export const DEV_ORIGIN = 'https://localhost:3000';

/** Every problem of a manifest text: our rules, then the XSD's findings (prefixed `XSD:`); xsdChecked false without xmllint. */
export function manifestProblems(text, version) {
  const { problems, summary } = checkManifest(text, { iconDir: 'manifest/icons', version });
  const xsd = hasXmllint() ? manifestXsdProblems(text, 'manifest/manifest.xml') : null;
  return { problems: [...problems, ...(xsd ?? []).map((p) => `XSD: ${p}`)], summary, xsdChecked: xsd !== null };
}

export default async function buildManifest() {
  const pkg = JSON.parse(readFileSync('package.json', 'utf8'));
  let text = readFileSync('manifest/manifest.xml', 'utf8');
  const origin = process.env.RESIN_DERATE_ORIGIN;
  if (origin) text = rebaseManifest(text, DEV_ORIGIN, origin);
  const { problems, summary, xsdChecked } = manifestProblems(text, `${pkg.version}.0`);
  if (problems.length > 0) throw new Error(`manifest/manifest.xml has ${problems.length} problem(s):\n  ${problems.join('\n  ')}`);
  mkdirSync('dist/icons', { recursive: true });
  writeFileSync('dist/manifest.xml', text);
  const icons = readdirSync('manifest/icons').filter((f) => f.endsWith('.png'));
  for (const f of icons) copyFileSync(`manifest/icons/${f}`, `dist/icons/${f}`);
  copyFileSync('manifest/support.html', 'dist/support.html');
  const xsd = xsdChecked
    ? 'valid against the manifest XSD'
    : 'XSD NOT CHECKED: xmllint is missing (install libxml2-utils), npm test will fail';
  console.log(
    `manifest: dist/manifest.xml for ${summary?.origin} (namespace ${summary?.namespace}, ${summary?.permission}), ${icons.length} icons, support.html; ${xsd}`,
  );
}
