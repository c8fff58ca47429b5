/** Text output helpers of the CLI: number formatting and markdown / CSV tables. */

/** A number with 3 significant figures, plain notation where readable. */
export function sig(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return Number(x.toPrecision(digits)).toString();
  return x.toExponential(digits - 1);
}

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
