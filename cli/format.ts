/** Text output helpers of the CLI: markdown and CSV tables. Numbers are written by src/base/display.ts. */

/** A markdown table with a header row. */
export function markdownTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: readonly string[]): string => `| ${cells.map((c, i) => c.padEnd(widths[i] ?? 0)).join(' | ')} |`;
  return [line(header), `| ${widths.map((w) => '-'.repeat(w)).join(' | ')} |`, ...rows.map(line)].join('\n') + '\n';
}

/** CSV with RFC 4180 quoting. */
export function csvTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const q = (c: string): string => (/[",\n]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c);
  return [header, ...rows].map((r) => r.map(q).join(',')).join('\n') + '\n';
}
