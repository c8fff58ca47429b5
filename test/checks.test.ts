import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileMaterial, creepModulusMPa, DATASHEET_TIME_S, FAMILIES, getFamily, modulusMPa, simulateHdt, T23_K } from '../src/index.js';
import { CHECK_HDT_K, CHECK_MODULUS_REL, FAMILY_CHECKS } from '../src/material/checks.js';

/**
 * Every bundled family against the typical values it carries (src/material/checks.ts; each "common practice,
 * from memory" as stated there): HDT within 8 K, moduli within 20 %. KNOWN_GAPS lists the checks the model does
 * not meet yet, with the structural reason; the test fails if one of them starts to pass (so the list stays true)
 * or if any other check fails.
 */
const KNOWN_GAPS: Record<string, string> = {};

type Row = { key: string; simulated: number; typical: number; ok: boolean; source: string };

function rows(): Row[] {
  const out: Row[] = [];
  for (const c of FAMILY_CHECKS) {
    const m = compileMaterial(getFamily(c.id).params);
    const hdt = (label: string, stress: number, typical: number | null): void => {
      if (typical === null) return;
      const sim = simulateHdt(m, stress).temperatureC ?? Infinity;
      out.push({ key: `${c.id} ${label}`, simulated: sim, typical, ok: Math.abs(sim - typical) <= CHECK_HDT_K, source: c.source });
    };
    const modulus = (label: string, sim: number, typical: number): void => {
      out.push({
        key: `${c.id} ${label}`,
        simulated: sim,
        typical,
        ok: Math.abs(sim / typical - 1) <= CHECK_MODULUS_REL,
        source: c.source,
      });
    };
    hdt('HDT/A', 1.8, c.hdtA_C);
    hdt('HDT/B', 0.45, c.hdtB_C);
    if (c.hot) modulus(`E${c.hot[0]}`, modulusMPa(m, DATASHEET_TIME_S, c.hot[0] + 273.15), c.hot[1]);
    if (c.creep1000h_MPa !== null) modulus('creep 1000 h', creepModulusMPa(m, 1000 * 3600, T23_K), c.creep1000h_MPa);
    if (c.conditionedE23_MPa !== undefined) modulus('E23', modulusMPa(m, DATASHEET_TIME_S, T23_K), c.conditionedE23_MPa);
  }
  return out;
}

describe('bundled families against their check values', () => {
  const all = rows();
  it('carries check values for every thermoplastic family, each with its source', () => {
    const ids = new Set(FAMILY_CHECKS.map((c) => c.id));
    for (const f of FAMILIES.filter((x) => x.params.kind !== 'crosslinked')) expect(ids.has(f.params.id), f.params.id).toBe(true);
    for (const c of FAMILY_CHECKS) expect(c.source).toMatch(/common practice, from memory/);
  });
  it.each(all.filter((r) => !(r.key in KNOWN_GAPS)).map((r) => [r.key, r] as const))('%s within tolerance', (_key, r) => {
    expect(r.ok, `${r.key}: simulated ${r.simulated.toFixed(1)}, typical ${r.typical} (${r.source})`).toBe(true);
  });
  it("matches the README's table of simulated versus typical values (to 1 K or 1 MPa), with * exactly on the known gaps", () => {
    // The README must stay true for what the model does (project rule); the table is written by hand from these rows.
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const cells = new Map<string, string>();
    for (const line of readme.split('\n')) {
      const m = /^\| ([A-Za-z0-9-]+) \| (.*) \|$/.exec(line);
      if (!m?.[1] || !m[2] || !FAMILY_CHECKS.some((c) => c.id === m[1])) continue;
      const [a, b, hot, creep] = m[2].split(' | ');
      cells.set(`${m[1]} HDT/A`, a ?? '');
      cells.set(`${m[1]} HDT/B`, b ?? '');
      const at = /^(\d+) degC: (.*)$/.exec(hot ?? '');
      if (at?.[1] !== undefined) cells.set(at[1] === '23' ? `${m[1]} E23` : `${m[1]} E${at[1]}`, at[2] ?? '');
      cells.set(`${m[1]} creep 1000 h`, creep ?? '');
    }
    for (const r of all) {
      const cell = cells.get(r.key);
      expect(cell, `README row for ${r.key}`).toBeDefined();
      const m = /^(\d+) \/ (\d+)( \*)?$/.exec(cell ?? '');
      expect(m, `${r.key}: README cell '${cell}'`).not.toBeNull();
      expect(Math.abs(Number(m?.[1]) - r.simulated), `${r.key}: README ${cell}, simulated ${r.simulated.toFixed(1)}`).toBeLessThanOrEqual(
        1,
      );
      expect(Number(m?.[2]), r.key).toBe(r.typical);
      expect(m?.[3] === ' *', `${r.key}: * in the README if and only if a known gap`).toBe(r.key in KNOWN_GAPS);
    }
  });
  it('still misses the known gaps (update KNOWN_GAPS when one is closed)', () => {
    for (const key of Object.keys(KNOWN_GAPS)) {
      const r = all.find((x) => x.key === key);
      expect(r, key).toBeDefined();
      expect(r?.ok, `${key} now passes: remove it from KNOWN_GAPS`).toBe(false);
    }
  });
});
