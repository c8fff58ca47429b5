/**
 * The ExcelApi requirement set of each member of the Excel JavaScript API, read from Microsoft's type
 * declarations (@types/office-js, whose doc comments carry "[Api set: ExcelApi 1.x]" per member, as on
 * Microsoft Learn). The client bundle does not refuse members by requirement set itself (in 1.1.110 its
 * check is off: Utility._doApiNotSupportedCheck is set on the subclass, CommonUtility's flag is read), so
 * a host of an older level is what refuses them; the test host does so from this table.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

let table: Map<string, string> | null = null;

/** "Class.member" (camelCase, as in the JavaScript API) -> ExcelApi version, e.g. "ChartAxis.logBase" -> "1.7". */
export function excelApiSets(): Map<string, string> {
  if (table) return table;
  const text = readFileSync(createRequire(import.meta.url).resolve('@types/office-js/index.d.ts'), 'utf8');
  const out = new Map<string, string>();
  let inExcel = false;
  let cls: string | null = null;
  let version: string | null = null;
  for (const line of text.split('\n')) {
    const ns = /^declare namespace (\w+)/.exec(line);
    if (ns) {
      inExcel = ns[1] === 'Excel';
      cls = null;
      continue;
    }
    if (!inExcel) continue;
    const c = /^ {4}class (\w+)/.exec(line);
    if (c) {
      cls = c[1] ?? null;
      version = null;
      continue;
    }
    if (/^ {4}\S/.test(line)) cls = null;
    if (cls === null) continue;
    const v = /\[Api set: ExcelApi (\d+\.\d+)/.exec(line);
    if (v) {
      version = v[1] ?? null;
      continue;
    }
    const m = /^ {8}(?:readonly )?(\w+)(\(|\??:)/.exec(line);
    if (m && version !== null) {
      // Overloads repeat a member; the first (oldest documented) entry stands.
      if (!out.has(`${cls}.${m[1]}`)) out.set(`${cls}.${m[1]}`, version);
      version = null;
    }
  }
  table = out;
  return out;
}

/** True when version a is newer than b, both "major.minor". */
export function newerThan(a: string, b: string): boolean {
  const [am = 0, an = 0] = a.split('.').map(Number);
  const [bm = 0, bn = 0] = b.split('.').map(Number);
  return am > bm || (am === bm && an > bn);
}
