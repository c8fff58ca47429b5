import { describe, expect, it } from 'vitest';
import { compileMaterial, DATASHEET_TIME_S, FILLED_GRADE_IDS, getGrade, modulusMPa, simulateHdt, T23_K } from '../src/index.js';
import { CHECK_HDT_K, CHECK_MODULUS_REL, FILLED_CHECKS } from '../src/material/checks.js';

/**
 * The common filled grades against their typical values (src/material/checks.ts FILLED_CHECKS; each "common
 * practice, from memory" as stated there): the 23 degC modulus within 20 %, HDT/A within 8 K. KNOWN_GAPS lists the
 * checks the model does not meet yet, with the structural reason; the test fails if one of them starts to pass
 * (so the list stays true) or if any other check fails.
 */
const CRYSTAL_SLOPE =
  'the crystal phase softens above Tg at the slope tuned on the unfilled grade (crystalSlope_perK: its hot modulus and HDT), which takes the matrix below what the fibres need for the 1.80 MPa end point tens of K before the melting onset; the real fibre grade holds its crystal plateau closer to Tm';
const KNOWN_GAPS: Record<string, string> = {
  'PA66-dry-GF30 HDT/A': CRYSTAL_SLOPE,
  'PP-GF30 HDT/A': `${CRYSTAL_SLOPE}; PP's alpha_c creep during the ramp adds to it`,
  'PEEK-CF30 HDT/A': CRYSTAL_SLOPE,
  'PPS-GF40 HDT/A':
    'too high (the optimistic side, 13 K): the PPS crystal plateau, tuned on the unfilled grade, stays stiff enough with 40 % glass to carry the end point into the melting window; the real grade softens earlier',
};

type Row = { key: string; simulated: number; typical: number; ok: boolean; source: string };

function rows(): Row[] {
  const out: Row[] = [];
  for (const c of FILLED_CHECKS) {
    const m = compileMaterial(getGrade(c.id).params);
    const E = modulusMPa(m, DATASHEET_TIME_S, T23_K);
    out.push({
      key: `${c.id} E23`,
      simulated: E,
      typical: c.E23_MPa,
      ok: Math.abs(E / c.E23_MPa - 1) <= CHECK_MODULUS_REL,
      source: c.source,
    });
    if (c.hdtA_C !== null) {
      const sim = simulateHdt(m, 1.8).temperatureC ?? Infinity;
      out.push({ key: `${c.id} HDT/A`, simulated: sim, typical: c.hdtA_C, ok: Math.abs(sim - c.hdtA_C) <= CHECK_HDT_K, source: c.source });
    }
  }
  return out;
}

describe('filled grades against their check values', () => {
  const all = rows();
  it('carries check values for every listed filled grade, each with its source', () => {
    expect(FILLED_CHECKS.map((c) => c.id)).toEqual(FILLED_GRADE_IDS);
    for (const c of FILLED_CHECKS) expect(c.source).toMatch(/common practice, from memory/);
  });
  it.each(all.filter((r) => !(r.key in KNOWN_GAPS)).map((r) => [r.key, r] as const))('%s within tolerance', (_key, r) => {
    expect(r.ok, `${r.key}: simulated ${r.simulated.toFixed(1)}, typical ${r.typical} (${r.source})`).toBe(true);
  });
  it('still misses the known gaps (update KNOWN_GAPS when one is closed)', () => {
    for (const key of Object.keys(KNOWN_GAPS)) {
      const r = all.find((x) => x.key === key);
      expect(r, key).toBeDefined();
      expect(r?.ok, `${key} now passes: remove it from KNOWN_GAPS`).toBe(false);
    }
  });
  it('lifts HDT/A of a glass-filled semi-crystalline grade far more than of an amorphous one', () => {
    // Common practice, from memory: glass fibre moves a semi-crystalline resin's HDT/A toward Tm (PA66: about
    // 75 -> 250 degC) but an amorphous resin's by a few K (PC: about 128 -> 135 degC).
    const lift = (filled: string, base: string): number =>
      (simulateHdt(compileMaterial(getGrade(filled).params), 1.8).temperatureC ?? NaN) -
      (simulateHdt(compileMaterial(getGrade(base).params), 1.8).temperatureC ?? NaN);
    const pa = lift('PA66-dry-GF30', 'PA66-dry');
    const pc = lift('PC-GF10', 'PC');
    expect(pa).toBeGreaterThan(100);
    expect(pc).toBeGreaterThan(0);
    expect(pc).toBeLessThan(15);
  });
});
